//! Link-time proof that no public kernel function can panic (see README.md).
//!
//! Every input comes from a volatile read, so the optimiser must keep every
//! branch the kernel has for every possible bit pattern; every result goes
//! to a volatile write, so no call can be removed as dead. The panic
//! handler calls a function that exists nowhere: the image links only if
//! the optimiser has proved that no panic can be reached from `_start`.
//!
//! This crate is the only place in the project with `unsafe`: volatile
//! reads and writes of two statics. The kernel keeps `#![forbid(unsafe_code)]`.

#![no_std]
#![no_main]

use core::ptr::{addr_of, addr_of_mut, read_volatile, write_volatile};

use vapora_kernel::accuracy::{accuracy_at_saturation_temperature_k, SaturationAccuracy};
use vapora_kernel::integrity::{
    check_checksums, check_single_phase_checksums, check_spot_points, self_test, SheetData,
    SinglePhaseTables, TableData, TableSet,
};
use vapora_kernel::single_phase::{
    compressed_liquid, state_at_pressure_enthalpy, state_at_pressure_entropy,
    state_at_pressure_temperature, superheated_vapour, FluidState, SinglePhaseState,
};
use vapora_kernel::tables::single_phase as sp_table;
use vapora_kernel::mixture::{wet_steam_at_pressure, wet_steam_at_temperature, WetSteam};
use vapora_kernel::quality::{
    phase_from_pressure_enthalpy, phase_from_pressure_entropy, phase_from_pressure_specific_volume,
    phase_from_temperature_enthalpy, phase_from_temperature_entropy, Phase,
};
use vapora_kernel::saturation::{
    saturated_property_at_pressure, saturated_property_at_temperature, saturated_state_at_pressure,
    saturated_state_at_temperature, saturation_pressure, saturation_temperature, PhaseProperties,
    SaturatedProperty, SaturatedState,
};
use vapora_kernel::spline::{cubic, BicubicSheet, OctaveCubicTable, UniformCubicTable};
use vapora_kernel::tables::saturation as table;
use vapora_kernel::units::{AbsolutePressure, GaugePressure, Temperature};

/// Where the inputs come from: a volatile read of this returns a value the
/// optimiser knows nothing about, every time.
static mut INPUT_BITS: u32 = 0;
/// Where every result goes.
static mut SINK: u32 = 0;

fn input_bits() -> u32 {
    // SAFETY: a plain aligned read of a static nothing else touches
    // concurrently (the image is never run; it is linked to prove a point).
    unsafe { read_volatile(addr_of!(INPUT_BITS)) }
}

fn input() -> f32 {
    f32::from_bits(input_bits())
}

fn sink_bits(bits: u32) {
    // SAFETY: as above, a plain aligned write of a static.
    unsafe { write_volatile(addr_of_mut!(SINK), bits) }
}

fn sink(x: f32) {
    sink_bits(x.to_bits());
}

/// Errors are consumed through `core::error::Error`, not through their
/// `Display`: every kernel error prints an f32, and core's float formatting
/// keeps panic paths of its own (formatting a bare f32 here makes the link
/// fail without any kernel code). Firmware logs errors with the `defmt`
/// feature or by matching on the variant.
fn sink_error<E: core::error::Error>(e: &E) {
    sink_bits(u32::from(e.source().is_some()));
}

fn sink_result<T, E: core::error::Error>(r: Result<T, E>, ok: impl FnOnce(T)) {
    match r {
        Ok(v) => ok(v),
        Err(e) => sink_error(&e),
    }
}

fn sink_phase_properties(p: &PhaseProperties) {
    sink(p.density_kg_m3);
    sink(p.specific_volume_m3_kg);
    sink(p.enthalpy_j_kg);
    sink(p.entropy_j_kgk);
    sink(p.cp_j_kgk);
}

fn sink_state(s: SaturatedState) {
    sink(s.pressure.as_pa());
    sink(s.temperature.as_kelvin());
    sink_phase_properties(&s.liquid);
    sink_phase_properties(&s.vapour);
    sink(s.latent_heat_j_kg);
    sink(s.entropy_of_vaporisation_j_kgk);
}

fn sink_wet_steam(w: WetSteam) {
    sink(w.pressure.as_pa());
    sink(w.temperature.as_kelvin());
    sink(w.dryness_fraction);
    sink(w.enthalpy_j_kg);
    sink(w.entropy_j_kgk);
    sink(w.specific_volume_m3_kg);
    sink(w.density_kg_m3);
}

fn sink_phase(p: Phase) {
    match p.dryness_fraction() {
        Some(x) => sink(x),
        None => sink_bits(u32::MAX),
    }
}

fn sink_accuracy(a: &SaturationAccuracy) {
    for v in [
        a.temperature_k,
        a.pressure_relative,
        a.liquid_density_relative,
        a.vapour_density_relative,
        a.liquid_enthalpy_j_kg,
        a.vapour_enthalpy_j_kg,
        a.liquid_entropy_j_kgk,
        a.vapour_entropy_j_kgk,
        a.liquid_cp_relative,
        a.vapour_cp_relative,
        a.dryness_fraction,
    ] {
        sink(v);
    }
}

/// Any of the properties, chosen by a volatile read.
fn property() -> SaturatedProperty {
    match input_bits() % 12 {
        0 => SaturatedProperty::LiquidDensity,
        1 => SaturatedProperty::VapourDensity,
        2 => SaturatedProperty::LiquidSpecificVolume,
        3 => SaturatedProperty::VapourSpecificVolume,
        4 => SaturatedProperty::LiquidEnthalpy,
        5 => SaturatedProperty::VapourEnthalpy,
        6 => SaturatedProperty::LatentHeat,
        7 => SaturatedProperty::LiquidEntropy,
        8 => SaturatedProperty::VapourEntropy,
        9 => SaturatedProperty::EntropyOfVaporisation,
        10 => SaturatedProperty::LiquidCp,
        _ => SaturatedProperty::VapourCp,
    }
}

fn locate_and_evaluate<const P: usize>(table: &UniformCubicTable<P>) {
    if let Some((block, t)) = table.locate(input()) {
        for c in block {
            sink(cubic(c, t));
        }
    } else {
        sink_bits(0);
    }
}

fn locate_octave_and_evaluate<const P: usize>(table: &OctaveCubicTable<P>) {
    if let Some((block, t)) = table.locate(input()) {
        for c in block {
            sink(cubic(c, t));
        }
    } else {
        sink_bits(0);
    }
}

fn units() {
    sink_result(AbsolutePressure::from_pa(input()), |p| sink(p.as_pa()));
    sink_result(AbsolutePressure::from_kpa(input()), |p| sink(p.as_kpa()));
    sink_result(AbsolutePressure::from_bar(input()), |p| sink(p.as_bar()));
    sink_result(AbsolutePressure::from_mpa(input()), |p| sink(p.as_mpa()));
    sink_result(GaugePressure::from_pa(input()), |p| sink(p.as_pa()));
    sink_result(GaugePressure::from_kpa(input()), |p| sink(p.as_kpa()));
    sink_result(GaugePressure::from_bar(input()), |p| sink(p.as_bar()));
    sink_result(GaugePressure::from_mpa(input()), |p| sink(p.as_mpa()));
    if let (Ok(gauge), Ok(ambient)) = (
        GaugePressure::from_pa(input()),
        AbsolutePressure::from_pa(input()),
    ) {
        sink_result(AbsolutePressure::from_gauge(gauge, ambient), |p| {
            sink(p.as_pa());
            sink(p.to_gauge(ambient).as_pa());
        });
    }
    sink_result(Temperature::from_kelvin(input()), |t| sink(t.as_kelvin()));
    sink_result(Temperature::from_celsius(input()), |t| sink(t.as_celsius()));
}

fn saturation() {
    if let Ok(p) = AbsolutePressure::from_pa(input()) {
        sink_result(saturation_temperature(p), |t| sink(t.as_kelvin()));
        sink_result(saturated_state_at_pressure(p), sink_state);
        sink_result(saturated_property_at_pressure(p, property()), sink);
        sink_result(phase_from_pressure_enthalpy(p, input()), sink_phase);
        sink_result(phase_from_pressure_entropy(p, input()), sink_phase);
        sink_result(phase_from_pressure_specific_volume(p, input()), sink_phase);
        sink_result(wet_steam_at_pressure(p, input()), sink_wet_steam);
    }
    if let Ok(t) = Temperature::from_kelvin(input()) {
        sink_result(saturation_pressure(t), |p| sink(p.as_pa()));
        sink_result(saturated_state_at_temperature(t), sink_state);
        sink_result(saturated_property_at_temperature(t, property()), sink);
        sink_result(phase_from_temperature_enthalpy(t, input()), sink_phase);
        sink_result(phase_from_temperature_entropy(t, input()), sink_phase);
        sink_result(wet_steam_at_temperature(t, input()), sink_wet_steam);
    }
    sink_accuracy(accuracy_at_saturation_temperature_k(input()));
}

fn sink_single_phase(s: SinglePhaseState) {
    sink(s.pressure.as_pa());
    sink(s.temperature.as_kelvin());
    sink(s.density_kg_m3);
    sink(s.specific_volume_m3_kg);
    sink(s.enthalpy_j_kg);
    sink(s.entropy_j_kgk);
    sink(s.cp_j_kgk);
    sink(s.speed_of_sound_m_s);
    sink(s.isentropic_exponent);
    sink(s.viscosity_pa_s);
    match s.saturation_margin_k {
        Some(m) => sink(m),
        None => sink_bits(u32::MAX),
    }
}

fn sink_fluid_state(s: FluidState) {
    match s {
        FluidState::CompressedLiquid(s) | FluidState::SuperheatedVapour(s) => {
            sink_single_phase(s)
        }
        FluidState::WetSteam(w) => sink_wet_steam(w),
        _ => sink_bits(0),
    }
}

fn single_phase() {
    if let (Ok(p), Ok(t)) = (
        AbsolutePressure::from_pa(input()),
        Temperature::from_kelvin(input()),
    ) {
        sink_result(superheated_vapour(p, t), sink_single_phase);
        sink_result(compressed_liquid(p, t), sink_single_phase);
        sink_result(state_at_pressure_temperature(p, t), sink_fluid_state);
    }
    if let Ok(p) = AbsolutePressure::from_pa(input()) {
        sink_result(state_at_pressure_enthalpy(p, input()), sink_fluid_state);
        sink_result(state_at_pressure_entropy(p, input()), sink_fluid_state);
    }
}

fn evaluate_sheet<const Q: usize>(sheet: &BicubicSheet<Q>) {
    match sheet.evaluate(input(), input()) {
        Some(v) => v.iter().for_each(|&q| sink(q)),
        None => sink_bits(0),
    }
    match sheet.evaluate_one(input(), input(), input_bits() as usize) {
        Some(v) => sink(v),
        None => sink_bits(0),
    }
}

fn spline() {
    evaluate_sheet(&sp_table::VAPOUR_LOW.properties);
    evaluate_sheet(&sp_table::VAPOUR_NEAR_CRITICAL.y_of_enthalpy);
    locate_and_evaluate(&table::STATE_LOW);
    locate_and_evaluate(&table::STATE_HIGH);
    locate_octave_and_evaluate(&table::TEMPERATURE_LOW);
    locate_octave_and_evaluate(&table::TEMPERATURE_HIGH);
}

fn integrity() {
    sink_result(self_test(), |()| sink_bits(1));
    sink_result(check_spot_points(), |()| sink_bits(2));
    // The CRCs to compare with come from volatile reads, so the comparison
    // cannot be decided at compile time.
    let mut tables = TableSet::compiled();
    tables.state_low.1 = input_bits();
    tables.state_high.1 = input_bits();
    tables.temperature_low.1 = input_bits();
    tables.temperature_high.1 = input_bits();
    sink_result(check_checksums(&tables), |()| sink_bits(3));
    sink_bits(TableData::of_uniform(&table::STATE_LOW).checksum());
    sink_bits(TableData::of_octave(&table::TEMPERATURE_HIGH).checksum());
    let mut sheets = SinglePhaseTables::compiled();
    for sheet in sheets.sheets.iter_mut() {
        sheet.expected[0] = input_bits();
    }
    sink_result(check_single_phase_checksums(&sheets), |()| sink_bits(4));
    sink_bits(SheetData::of_sheet(&sp_table::LIQUID_HIGH.y_of_entropy).checksum());
}


// ---- application routines block (issue 5, branch apps).
fn applications() {
    use vapora_kernel::calorimeter::{
        separating_throttling_dryness, throttling_calorimeter_dryness,
    };
    use vapora_kernel::drum_level::{drum_level, drum_level_from_densities, DrumLevelTransmitter};
    use vapora_kernel::energy::{energy_flow, energy_flow_from_enthalpies_w, SteamSupply};
    use vapora_kernel::flowing::{steam_flowing_conditions, water_flowing_conditions};

    fn sink_flowing(c: vapora_kernel::flowing::FlowingConditions) {
        sink(c.density_kg_m3);
        sink(c.enthalpy_j_kg);
        sink(c.isentropic_exponent);
        sink(c.viscosity_pa_s);
        sink(c.saturation_margin_k.unwrap_or(-1.0));
        sink_bits(u32::from(c.margin_alarm));
    }
    fn sink_level(l: vapora_kernel::drum_level::DrumLevel) {
        sink(l.level_m);
        sink(l.water_height_above_lower_tap_m);
        sink_bits(match l.span {
            vapora_kernel::drum_level::LevelSpan::WithinTaps => 0,
            vapora_kernel::drum_level::LevelSpan::AboveUpperTap => 1,
            _ => 2,
        });
        sink(l.reference_leg_density_kg_m3);
    }
    fn sink_calorimeter(r: vapora_kernel::calorimeter::ThrottlingCalorimeterReading) {
        sink(r.dryness_fraction);
        sink(r.line_enthalpy_j_kg);
        sink(r.calorimeter_superheat_k);
        sink_bits(u32::from(r.line_steam_dry));
    }
    if let (Ok(p), Ok(t)) = (
        AbsolutePressure::from_pa(input()),
        Temperature::from_kelvin(input()),
    ) {
        sink_result(steam_flowing_conditions(p, t, input()), sink_flowing);
        sink_result(water_flowing_conditions(p, t, input()), sink_flowing);
    }
    sink_result(
        energy_flow_from_enthalpies_w(input(), input(), input()),
        sink,
    );
    if let (Ok(p), Ok(t), Ok(water_p), Ok(water_t)) = (
        AbsolutePressure::from_pa(input()),
        Temperature::from_kelvin(input()),
        AbsolutePressure::from_pa(input()),
        Temperature::from_kelvin(input()),
    ) {
        let steam = if input_bits() % 2 == 0 {
            SteamSupply::Superheated {
                pressure: p,
                temperature: t,
            }
        } else {
            SteamSupply::Wet {
                pressure: p,
                dryness_fraction: input(),
            }
        };
        sink_result(energy_flow(input(), steam, water_p, water_t), |e| {
            sink(e.energy_flow_w);
            sink(e.steam_enthalpy_j_kg);
            sink(e.water_enthalpy_j_kg);
        });
    }
    if let (Ok(minimum), Ok(p), Ok(leg)) = (
        AbsolutePressure::from_pa(input()),
        AbsolutePressure::from_pa(input()),
        Temperature::from_kelvin(input()),
    ) {
        let transmitter = DrumLevelTransmitter {
            tap_separation_m: input(),
            zero_level_above_lower_tap_m: input(),
            gravity_m_s2: input(),
            minimum_drum_pressure: minimum,
        };
        sink_result(drum_level(p, input(), leg, &transmitter), sink_level);
        sink_result(
            drum_level_from_densities(input(), &transmitter, input(), input(), input()),
            sink_level,
        );
    }
    if let (Ok(line), Ok(p_cal), Ok(t_cal)) = (
        AbsolutePressure::from_pa(input()),
        AbsolutePressure::from_pa(input()),
        Temperature::from_kelvin(input()),
    ) {
        sink_result(
            throttling_calorimeter_dryness(line, p_cal, t_cal),
            sink_calorimeter,
        );
        sink_result(
            separating_throttling_dryness(line, p_cal, t_cal, input(), input()),
            |r| {
                sink(r.dryness_fraction);
                sink(r.separator_dryness_fraction);
                sink_calorimeter(r.throttling);
            },
        );
    }
}
// ---- end of the application routines block

/// The self-check: one indexing the optimiser cannot prove in bounds. With
/// this feature the link must fail, which shows the proof can fail.
#[cfg(feature = "deliberate-panic")]
fn deliberate_panic() {
    let values = [input(), input(), input(), input()];
    sink(values[input_bits() as usize]);
}

#[cfg(not(feature = "deliberate-panic"))]
fn deliberate_panic() {}

/// The entry point the linker keeps (the image is linked, never run).
#[no_mangle]
pub extern "C" fn _start() -> ! {
    loop {
        units();
        saturation();
        single_phase();
        spline();
        integrity();
        applications(); // application routines (branch apps)
        deliberate_panic();
    }
}

#[panic_handler]
fn panic(_: &core::panic::PanicInfo) -> ! {
    extern "C" {
        // Defined nowhere: referencing it makes any surviving panic path a
        // link error that names this function.
        fn vapora_kernel_panic_path_survived() -> !;
    }
    // SAFETY: never executed in a linked image; if it were reachable the
    // link would have failed.
    unsafe { vapora_kernel_panic_path_survived() }
}
