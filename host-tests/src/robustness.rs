//! The robustness property shared by the property tests
//! (`tests/robustness_*.rs`) and the fuzz target (`kernel/fuzz`): for any
//! input bits, every public kernel function returns either a typed error or
//! an `Ok` holding finite values inside the physical range of each
//! property. [`check`] calls one function, named as in the kernel, on raw
//! f32 inputs and says what, if anything, broke the property.
//!
//! # The ranges asserted
//! Saturation line (from the compiled tables' limits, widened by the
//! kernel's own stated accuracy at that end, because the spline's value at
//! a limit is within that bound of the formulation's, not equal to it):
//! - saturation temperature: [`TEMPERATURE_MIN_K`] − δT to
//!   [`TEMPERATURE_MAX_K`] + δT (273.16 K to 647.096 K by default), δT the
//!   larger temperature bound of the two accuracy zones;
//! - saturation pressure: [`PRESSURE_MIN_PA`]·(1 − δp) to
//!   [`PRESSURE_MAX_PA`]·(1 + δp), δp the larger relative bound.
//!
//! Properties of either phase on the line (bounds of the physical values
//! on the saturation line, rounded outward; the values are from memory of
//! the IF97 saturation tables: ρ' at most 999.97 kg/m³ near 277 K, v'' at
//! the triple point 206.0 m³/kg, h'' at most 2803 kJ/kg near 3 MPa, s'' at
//! the triple point 9155.5 J/(kg·K), h_fg at the triple point 2500.9 kJ/kg):
//! - density ρ', ρ'' and of wet steam: 0 < ρ ≤ [`DENSITY_MAX_KG_M3`];
//! - specific volume: 1/[`DENSITY_MAX_KG_M3`] ≤ v ≤ [`SPECIFIC_VOLUME_MAX_M3_KG`];
//! - enthalpy: [`ENTHALPY_MIN_J_KG`] ≤ h ≤ [`ENTHALPY_MAX_J_KG`];
//! - entropy: [`ENTROPY_MIN_J_KGK`] ≤ s ≤ [`ENTROPY_MAX_J_KGK`];
//! - isobaric heat capacity: [`CP_MIN_J_KGK`] ≤ cp ≤ [`CP_MAX_J_KGK`] (the
//!   kernel caps cp at 1e10 J/(kg·K) next to the critical point);
//! - latent heat: 0 ≤ h_fg ≤ [`LATENT_HEAT_MAX_J_KG`]; s_fg: 0 ≤ s_fg ≤
//!   [`ENTROPY_MAX_J_KGK`];
//! - dryness fraction: 0 ≤ x ≤ 1, and for [`Phase::WetSteam`] strictly
//!   inside the saturation tolerance band;
//! - wet steam: h, s and v between the saturated liquid's and vapour's
//!   (within f32 rounding of the lever rule), ρ = 1/v.
//!
//! Units: constructors that succeed hold exactly the value given (Pa, K) or
//! its finite conversion; absolute pressures are ≥ 0 and temperatures > 0.
//! Octave look-up: any x gives an interval and 0 ≤ t < 1, and the cubics
//! are finite for x inside the table.
//! Uniform spline look-up (a low-level function that does not check its range):
//! any x, NaN included, gives an interval and a t that is not NaN and
//! ≥ 0; for x inside the table's range t ≤ 1 + 1e-3 and the cubics of the
//! compiled tables are finite there. Outside the range t extrapolates
//! (+∞ for x so large that (x − start)·inverse_step overflows).

use std::format;
use std::string::String;

use vapora_kernel::accuracy::{
    accuracy_at_saturation_temperature_k, SaturationAccuracy, ACCURACY_BELOW_NEAR_CRITICAL,
    ACCURACY_NEAR_CRITICAL,
};
use vapora_kernel::integrity::{
    self, check_single_phase_checksums, SheetData, SinglePhaseTables, TableData, TableSet,
};
use vapora_kernel::mixture::{wet_steam_at_pressure, wet_steam_at_temperature, WetSteam};
use vapora_kernel::quality::{
    phase_from_pressure_enthalpy, phase_from_pressure_entropy, phase_from_pressure_specific_volume,
    phase_from_temperature_enthalpy, phase_from_temperature_entropy, Phase, SATURATION_TOLERANCE,
};
use vapora_kernel::saturation::{
    saturated_property_at_pressure, saturated_property_at_temperature, saturated_state_at_pressure,
    saturated_state_at_temperature, saturation_pressure, saturation_temperature, PhaseProperties,
    SaturatedProperty, SaturatedState, PRESSURE_MAX_PA, PRESSURE_MIN_PA, TEMPERATURE_MAX_K,
    TEMPERATURE_MIN_K,
};
use vapora_kernel::single_phase::{
    compressed_liquid, state_at_pressure_enthalpy, state_at_pressure_entropy,
    state_at_pressure_temperature, superheated_vapour, FluidState, SinglePhaseState,
};
use vapora_kernel::spline::{
    cubic, BicubicSheet, OctaveCubicTable, SinglePhaseSheet, UniformCubicTable,
};
use vapora_kernel::tables::saturation as table;
use vapora_kernel::tables::single_phase as sp_table;
use vapora_kernel::units::{AbsolutePressure, GaugePressure, Temperature};

/// Highest density accepted on the line, kg/m³ (ρ' peaks at 999.97 kg/m³
/// near 277 K; IF97 saturation values from memory, rounded up).
pub const DENSITY_MAX_KG_M3: f32 = 1100.0;
/// Highest specific volume accepted, m³/kg (v'' = 206.0 m³/kg at the triple
/// point, from memory, rounded up).
pub const SPECIFIC_VOLUME_MAX_M3_KG: f32 = 210.0;
/// Lowest enthalpy accepted, J/kg: h' = 0.61 J/kg at the triple point (IF97
/// reference state u' = s' = 0), less ten times the kernel's 10 J/kg bound.
pub const ENTHALPY_MIN_J_KG: f32 = -100.0;
/// Highest enthalpy accepted, J/kg (h'' peaks at 2803 kJ/kg near 3 MPa,
/// from memory, rounded up).
pub const ENTHALPY_MAX_J_KG: f32 = 2.81e6;
/// Lowest entropy accepted, J/(kg·K): s' = 0 at the triple point, less fifty
/// times the kernel's 0.02 J/(kg·K) bound.
pub const ENTROPY_MIN_J_KGK: f32 = -1.0;
/// Highest entropy accepted, J/(kg·K) (s'' = 9155.5 J/(kg·K) at the triple
/// point, from memory, rounded up).
pub const ENTROPY_MAX_J_KGK: f32 = 9.16e3;
/// Lowest heat capacity accepted, J/(kg·K) (cp'' is about 1.85 kJ/(kg·K) at
/// the triple point, the lowest on the line; common practice, no source).
pub const CP_MIN_J_KGK: f32 = 1.0e3;
/// Highest heat capacity accepted, J/(kg·K): the kernel's cap of 1e10 next
/// to the critical point, with f32 rounding of 1/1e-10.
pub const CP_MAX_J_KGK: f32 = 1.001e10;
/// Highest latent heat accepted, J/kg (h_fg = 2500.9 kJ/kg at the triple
/// point, from memory, rounded up).
pub const LATENT_HEAT_MAX_J_KG: f32 = 2.51e6;

/// Single-phase ranges (the envelope 611.657 Pa to 25 MPa, 273.16 K to
/// 1073.15 K; extreme values computed with vapora-tables' IF97 at the
/// corners of the envelope, rounded outward):
/// lowest density, kg/m³ (vapour at 611.657 Pa, 1073.15 K: 1.23e-3).
pub const SINGLE_PHASE_DENSITY_MIN_KG_M3: f32 = 1.2e-3;
/// Highest single-phase specific volume, m³/kg (1/1.23e-3 = 813).
pub const SINGLE_PHASE_SPECIFIC_VOLUME_MAX_M3_KG: f32 = 840.0;
/// Highest single-phase enthalpy, J/kg (vapour at 611.657 Pa, 1073.15 K:
/// 4160 kJ/kg).
pub const SINGLE_PHASE_ENTHALPY_MAX_J_KG: f32 = 4.2e6;
/// Highest single-phase entropy, J/(kg·K) (vapour at 611.657 Pa,
/// 1073.15 K: 11.92 kJ/(kg·K)).
pub const SINGLE_PHASE_ENTROPY_MAX_J_KGK: f32 = 1.2e4;
/// Lowest single-phase entropy, J/(kg·K): compressed water at 273.16 K and
/// 25 MPa has s slightly below 0 (−0.4 J/(kg·K)).
pub const SINGLE_PHASE_ENTROPY_MIN_J_KGK: f32 = -5.0;
/// Lowest single-phase enthalpy, J/kg (h(273.16 K) ≥ 0.6 J/kg; h grows with
/// p there), less slack for the spline.
pub const SINGLE_PHASE_ENTHALPY_MIN_J_KG: f32 = -100.0;
/// Speed of sound range, m/s (vapour near the triple point about 420 m/s,
/// near-critical minimum about 250 m/s, liquid at most about 1700 m/s).
pub const SPEED_OF_SOUND_RANGE_M_S: (f32, f32) = (100.0, 2600.0);
/// Isentropic exponent range: 1.23 at least (vapour at 1073.15 K), up to
/// ρw²/p of water at the triple-point pressure (3.05e6).
pub const ISENTROPIC_EXPONENT_RANGE: (f32, f32) = (0.5, 1.0e7);
/// Viscosity range, Pa·s (vapour at 273.16 K about 9e-6, water at 273.16 K
/// 1.79e-3, from the IAPWS R12-08 formula in vapora-tables).
pub const VISCOSITY_RANGE_PA_S: (f32, f32) = (1.0e-6, 2.0e-3);
/// Slack on the temperature of a (p, h) or (p, s) result beyond the
/// envelope, K (the spline's end values are within its bound, not exact).
pub const SINGLE_PHASE_TEMPERATURE_SLACK_K: f32 = 0.5;

/// Every public function of the kernel that [`check`] exercises, by its path
/// inside its module (methods as `Type::method`). The coverage test
/// (`tests/robustness_coverage.rs`) parses `kernel/src` and fails if a
/// public function is missing here, or listed here but not called in this
/// file, the no-panic image or the fuzz target.
pub const CHECKED_FUNCTIONS: &[&str] = &[
    "AbsolutePressure::from_pa",
    "AbsolutePressure::from_kpa",
    "AbsolutePressure::from_bar",
    "AbsolutePressure::from_mpa",
    "AbsolutePressure::from_gauge",
    "AbsolutePressure::as_pa",
    "AbsolutePressure::as_kpa",
    "AbsolutePressure::as_bar",
    "AbsolutePressure::as_mpa",
    "AbsolutePressure::to_gauge",
    "GaugePressure::from_pa",
    "GaugePressure::from_kpa",
    "GaugePressure::from_bar",
    "GaugePressure::from_mpa",
    "GaugePressure::as_pa",
    "GaugePressure::as_kpa",
    "GaugePressure::as_bar",
    "GaugePressure::as_mpa",
    "Temperature::from_kelvin",
    "Temperature::from_celsius",
    "Temperature::as_kelvin",
    "Temperature::as_celsius",
    "saturation_temperature",
    "saturation_pressure",
    "saturated_state_at_pressure",
    "saturated_state_at_temperature",
    "saturated_property_at_pressure",
    "saturated_property_at_temperature",
    "Phase::dryness_fraction",
    "phase_from_pressure_enthalpy",
    "phase_from_pressure_entropy",
    "phase_from_pressure_specific_volume",
    "phase_from_temperature_enthalpy",
    "phase_from_temperature_entropy",
    "wet_steam_at_pressure",
    "wet_steam_at_temperature",
    "accuracy_at_saturation_temperature_k",
    "UniformCubicTable::locate",
    "OctaveCubicTable::locate",
    "cubic",
    "self_test",
    "check_checksums",
    "check_spot_points",
    "TableSet::compiled",
    "TableData::of_uniform",
    "TableData::of_octave",
    "TableData::checksum",
    "SheetData::of_sheet",
    "SheetData::checksum",
    "SinglePhaseTables::compiled",
    "check_single_phase_checksums",
    "superheated_vapour",
    "compressed_liquid",
    "state_at_pressure_temperature",
    "state_at_pressure_enthalpy",
    "state_at_pressure_entropy",
    "BicubicSheet::evaluate",
    "BicubicSheet::evaluate_one",
    // ---- application routines block (issue 5, branch apps)
    "steam_flowing_conditions",
    "water_flowing_conditions",
    "energy_flow_from_enthalpies_w",
    "energy_flow",
    "drum_level_from_densities",
    "drum_level",
    "throttling_calorimeter_dryness",
    "separating_throttling_dryness",
    // ---- end of the application routines block
];

/// Which inputs of [`check`] a function reads, so that sweeps need not
/// repeat a call with inputs it ignores.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct InputShape {
    /// Reads `a`.
    pub a: bool,
    /// Reads `b`.
    pub b: bool,
    /// Number of distinct selectors that matter (1: ignores it).
    pub selectors: u32,
}

/// The inputs the named function reads in [`check`].
pub fn input_shape(function: &str) -> InputShape {
    let (a, b, selectors) = match function {
        "AbsolutePressure::from_gauge"
        | "AbsolutePressure::to_gauge"
        | "Phase::dryness_fraction"
        | "phase_from_pressure_enthalpy"
        | "phase_from_pressure_entropy"
        | "phase_from_pressure_specific_volume"
        | "phase_from_temperature_enthalpy"
        | "phase_from_temperature_entropy"
        | "wet_steam_at_pressure"
        | "wet_steam_at_temperature"
        | "superheated_vapour"
        | "compressed_liquid"
        | "state_at_pressure_temperature"
        | "state_at_pressure_enthalpy"
        | "state_at_pressure_entropy" => (true, true, 1),
        "BicubicSheet::evaluate" | "BicubicSheet::evaluate_one" => (true, true, 18),
        "SheetData::of_sheet" | "SheetData::checksum" => (false, false, 18),
        "SinglePhaseTables::compiled" | "check_single_phase_checksums" => (false, false, 1),
        // ---- application routines block (issue 5, branch apps): `a` and `b`
        // are the two inputs named in `check_application`, the selector picks
        // the remaining settings from a small list.
        f if APPLICATION_FUNCTIONS.contains(&f) => (true, true, APPLICATION_SELECTORS),
        // ---- end of the application routines block
        "saturated_property_at_pressure" | "saturated_property_at_temperature" => {
            (true, false, PROPERTIES.len() as u32)
        }
        "UniformCubicTable::locate" | "OctaveCubicTable::locate" | "cubic" => (true, false, 4),
        // The integrity functions read no input at all.
        "self_test" | "check_checksums" | "check_spot_points" | "TableSet::compiled" => {
            (false, false, 1)
        }
        "TableData::of_uniform" | "TableData::of_octave" | "TableData::checksum" => {
            (false, false, 4)
        }
        _ => (true, false, 1),
    };
    InputShape { a, b, selectors }
}

/// The functions the fuzz target chooses among: [`CHECKED_FUNCTIONS`] that
/// read an input (the integrity functions read none; the tests call them
/// once), in that order. Byte 0 of a fuzz input indexes this list modulo
/// its length.
pub fn fuzzed_functions() -> Vec<&'static str> {
    CHECKED_FUNCTIONS
        .iter()
        .copied()
        .filter(|f| input_shape(f).a)
        .collect()
}

/// One fuzz input decoded: the function it names and the inputs of
/// [`check`].
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FuzzInput {
    /// Index of the function in [`fuzzed_functions`].
    pub index: usize,
    /// The function's name, as in [`CHECKED_FUNCTIONS`].
    pub function: &'static str,
    /// First input (f32 bits of bytes 1..5).
    pub a: f32,
    /// Second input (f32 bits of bytes 5..9).
    pub b: f32,
    /// Selector (bytes 9..13).
    pub selector: u32,
}

/// Little-endian u32 word `i` after byte 0 (missing bytes are zero).
fn fuzz_word(data: &[u8], i: usize) -> u32 {
    let mut bytes = [0u8; 4];
    for (k, b) in bytes.iter_mut().enumerate() {
        *b = data.get(1 + 4 * i + k).copied().unwrap_or(0);
    }
    u32::from_le_bytes(bytes)
}

/// Decodes a fuzz input the way the fuzz target (`kernel/fuzz`) does: byte
/// 0 picks the function among `functions` (normally [`fuzzed_functions`])
/// modulo their number, then a, b and the selector as little-endian u32
/// (missing bytes are zero). `None` for empty data (the target ignores it).
pub fn decode_fuzz_input(functions: &[&'static str], data: &[u8]) -> Option<FuzzInput> {
    let &choice = data.first()?;
    let index = usize::from(choice).checked_rem(functions.len())?;
    Some(FuzzInput {
        index,
        function: functions.get(index).copied()?,
        a: f32::from_bits(fuzz_word(data, 0)),
        b: f32::from_bits(fuzz_word(data, 1)),
        selector: fuzz_word(data, 2),
    })
}

/// Every saturated property, in declaration order.
pub const PROPERTIES: [SaturatedProperty; 12] = [
    SaturatedProperty::LiquidDensity,
    SaturatedProperty::VapourDensity,
    SaturatedProperty::LiquidSpecificVolume,
    SaturatedProperty::VapourSpecificVolume,
    SaturatedProperty::LiquidEnthalpy,
    SaturatedProperty::VapourEnthalpy,
    SaturatedProperty::LatentHeat,
    SaturatedProperty::LiquidEntropy,
    SaturatedProperty::VapourEntropy,
    SaturatedProperty::EntropyOfVaporisation,
    SaturatedProperty::LiquidCp,
    SaturatedProperty::VapourCp,
];

/// Why a result broke the property.
type Violation = String;

fn larger(a: f32, b: f32) -> f32 {
    if a > b {
        a
    } else {
        b
    }
}

fn temperature_slack_k() -> f32 {
    larger(
        ACCURACY_BELOW_NEAR_CRITICAL.temperature_k,
        ACCURACY_NEAR_CRITICAL.temperature_k,
    )
}

fn pressure_slack_relative() -> f32 {
    larger(
        ACCURACY_BELOW_NEAR_CRITICAL.pressure_relative,
        ACCURACY_NEAR_CRITICAL.pressure_relative,
    )
}

fn in_range(what: &str, v: f32, low: f32, high: f32) -> Result<(), Violation> {
    if v.is_finite() && v >= low && v <= high {
        Ok(())
    } else {
        Err(format!("{what} = {v:e} outside [{low:e}, {high:e}]"))
    }
}

fn finite(what: &str, v: f32) -> Result<(), Violation> {
    if v.is_finite() {
        Ok(())
    } else {
        Err(format!("{what} = {v} is not finite"))
    }
}

/// Saturation temperature on the line, K.
pub fn check_saturation_temperature(t: Temperature) -> Result<(), Violation> {
    let slack = temperature_slack_k();
    in_range(
        "saturation temperature (K)",
        t.as_kelvin(),
        TEMPERATURE_MIN_K - slack,
        TEMPERATURE_MAX_K + slack,
    )
}

/// Saturation pressure on the line, Pa.
pub fn check_saturation_pressure(p: AbsolutePressure) -> Result<(), Violation> {
    let slack = pressure_slack_relative();
    in_range(
        "saturation pressure (Pa)",
        p.as_pa(),
        PRESSURE_MIN_PA * (1.0 - slack),
        PRESSURE_MAX_PA * (1.0 + slack),
    )
}

fn check_density(what: &str, rho: f32) -> Result<(), Violation> {
    if rho > 0.0 {
        in_range(what, rho, 0.0, DENSITY_MAX_KG_M3)
    } else {
        Err(format!("{what} = {rho:e} is not positive"))
    }
}

fn check_volume(what: &str, v: f32) -> Result<(), Violation> {
    in_range(what, v, 1.0 / DENSITY_MAX_KG_M3, SPECIFIC_VOLUME_MAX_M3_KG)
}

fn check_enthalpy(what: &str, h: f32) -> Result<(), Violation> {
    in_range(what, h, ENTHALPY_MIN_J_KG, ENTHALPY_MAX_J_KG)
}

fn check_entropy(what: &str, s: f32) -> Result<(), Violation> {
    in_range(what, s, ENTROPY_MIN_J_KGK, ENTROPY_MAX_J_KGK)
}

fn check_phase_properties(what: &str, p: &PhaseProperties) -> Result<(), Violation> {
    check_density(&format!("{what} density"), p.density_kg_m3)?;
    check_volume(&format!("{what} specific volume"), p.specific_volume_m3_kg)?;
    check_enthalpy(&format!("{what} enthalpy"), p.enthalpy_j_kg)?;
    check_entropy(&format!("{what} entropy"), p.entropy_j_kgk)?;
    in_range(
        &format!("{what} cp"),
        p.cp_j_kgk,
        CP_MIN_J_KGK,
        CP_MAX_J_KGK,
    )
}

/// Every field of a saturated state.
pub fn check_state(s: &SaturatedState) -> Result<(), Violation> {
    check_saturation_pressure(s.pressure)?;
    check_saturation_temperature(s.temperature)?;
    check_phase_properties("liquid", &s.liquid)?;
    check_phase_properties("vapour", &s.vapour)?;
    in_range("latent heat", s.latent_heat_j_kg, 0.0, LATENT_HEAT_MAX_J_KG)?;
    in_range(
        "entropy of vaporisation",
        s.entropy_of_vaporisation_j_kgk,
        0.0,
        ENTROPY_MAX_J_KGK,
    )
}

/// One saturated property, in the range of its kind.
pub fn check_property(property: SaturatedProperty, v: f32) -> Result<(), Violation> {
    let what = format!("{property:?}");
    match property {
        SaturatedProperty::LiquidDensity | SaturatedProperty::VapourDensity => {
            check_density(&what, v)
        }
        SaturatedProperty::LiquidSpecificVolume | SaturatedProperty::VapourSpecificVolume => {
            check_volume(&what, v)
        }
        SaturatedProperty::LiquidEnthalpy | SaturatedProperty::VapourEnthalpy => {
            check_enthalpy(&what, v)
        }
        SaturatedProperty::LatentHeat => in_range(&what, v, 0.0, LATENT_HEAT_MAX_J_KG),
        SaturatedProperty::LiquidEntropy | SaturatedProperty::VapourEntropy => {
            check_entropy(&what, v)
        }
        SaturatedProperty::EntropyOfVaporisation => in_range(&what, v, 0.0, ENTROPY_MAX_J_KGK),
        SaturatedProperty::LiquidCp | SaturatedProperty::VapourCp => {
            in_range(&what, v, CP_MIN_J_KGK, CP_MAX_J_KGK)
        }
        other => Err(format!("no range known for {other:?}")),
    }
}

/// Every field of a single-phase state in its physical range; `vapour`
/// says which side it must be on (margin > 0 for vapour, < 0 for liquid,
/// where there is a saturation temperature).
pub fn check_single_phase(s: &SinglePhaseState, vapour: bool) -> Result<(), Violation> {
    in_range(
        "pressure (Pa)",
        s.pressure.as_pa(),
        vapora_kernel::single_phase::PRESSURE_MIN_PA,
        vapora_kernel::single_phase::PRESSURE_MAX_PA,
    )?;
    in_range(
        "temperature (K)",
        s.temperature.as_kelvin(),
        vapora_kernel::single_phase::TEMPERATURE_MIN_K - SINGLE_PHASE_TEMPERATURE_SLACK_K,
        vapora_kernel::single_phase::TEMPERATURE_MAX_K + SINGLE_PHASE_TEMPERATURE_SLACK_K,
    )?;
    in_range(
        "density",
        s.density_kg_m3,
        SINGLE_PHASE_DENSITY_MIN_KG_M3,
        DENSITY_MAX_KG_M3,
    )?;
    in_range(
        "specific volume",
        s.specific_volume_m3_kg,
        1.0 / DENSITY_MAX_KG_M3,
        SINGLE_PHASE_SPECIFIC_VOLUME_MAX_M3_KG,
    )?;
    in_range(
        "enthalpy",
        s.enthalpy_j_kg,
        SINGLE_PHASE_ENTHALPY_MIN_J_KG,
        SINGLE_PHASE_ENTHALPY_MAX_J_KG,
    )?;
    in_range(
        "entropy",
        s.entropy_j_kgk,
        SINGLE_PHASE_ENTROPY_MIN_J_KGK,
        SINGLE_PHASE_ENTROPY_MAX_J_KGK,
    )?;
    in_range("cp", s.cp_j_kgk, CP_MIN_J_KGK, CP_MAX_J_KGK)?;
    in_range(
        "speed of sound",
        s.speed_of_sound_m_s,
        SPEED_OF_SOUND_RANGE_M_S.0,
        SPEED_OF_SOUND_RANGE_M_S.1,
    )?;
    in_range(
        "isentropic exponent",
        s.isentropic_exponent,
        ISENTROPIC_EXPONENT_RANGE.0,
        ISENTROPIC_EXPONENT_RANGE.1,
    )?;
    in_range(
        "viscosity",
        s.viscosity_pa_s,
        VISCOSITY_RANGE_PA_S.0,
        VISCOSITY_RANGE_PA_S.1,
    )?;
    match s.saturation_margin_k {
        Some(m) if vapour && (m < 0.0 || m.is_nan()) => Err(format!("vapour with margin {m} K")),
        Some(m) if !vapour && (m > 0.0 || m.is_nan()) => Err(format!("liquid with margin {m} K")),
        Some(m) => in_range("saturation margin", m, -900.0, 900.0),
        None if s.pressure.as_pa() < 22.0e6 => {
            Err(format!("no margin at {} Pa", s.pressure.as_pa()))
        }
        None => Ok(()),
    }
}

/// A (p, T), (p, h) or (p, s) result: the single-phase state in range, or
/// wet steam checked against the saturated state at its pressure.
pub fn check_fluid_state(state: FluidState) -> Result<(), Violation> {
    match state {
        FluidState::CompressedLiquid(s) => check_single_phase(&s, false),
        FluidState::SuperheatedVapour(s) => check_single_phase(&s, true),
        FluidState::WetSteam(w) => {
            let s = saturated_state_at_pressure(w.pressure)
                .map_err(|e| format!("wet steam where the saturated state is {e}"))?;
            check_wet_steam(&w, &s)
        }
        other => Err(format!("unknown fluid state {other:?}")),
    }
}

/// The single-phase sheet and part a selector names (0 … 17).
fn sheet_part(selector: u32) -> (&'static str, &'static SinglePhaseSheet, u32) {
    let sheets: [(&str, &SinglePhaseSheet); 6] = [
        ("VAPOUR_LOW", &sp_table::VAPOUR_LOW),
        ("LIQUID_LOW", &sp_table::LIQUID_LOW),
        ("LIQUID_HIGH", &sp_table::LIQUID_HIGH),
        ("LIQUID_NEAR_CRITICAL", &sp_table::LIQUID_NEAR_CRITICAL),
        ("VAPOUR_NEAR_CRITICAL", &sp_table::VAPOUR_NEAR_CRITICAL),
        ("VAPOUR_HIGH", &sp_table::VAPOUR_HIGH),
    ];
    let (name, sheet) = sheets[(selector / 3 % 6) as usize];
    (name, sheet, selector % 3)
}

fn check_sheet_evaluate<const Q: usize>(
    name: &str,
    sheet: &BicubicSheet<Q>,
    x: f32,
    y: f32,
    one: bool,
) -> Result<(), Violation> {
    // Any input is clamped to the sheet: the values must be finite.
    if one {
        for q in 0..Q {
            match sheet.evaluate_one(x, y, q) {
                Some(v) => finite(&format!("{name}.evaluate_one({x:e}, {y:e}, {q})"), v)?,
                None => return Err(format!("{name}.evaluate_one({x:e}, {y:e}, {q}) gave None")),
            }
        }
        if sheet.evaluate_one(x, y, Q).is_some() {
            return Err(format!(
                "{name}.evaluate_one(.., {Q}) past the last quantity"
            ));
        }
        Ok(())
    } else {
        match sheet.evaluate(x, y) {
            Some(v) => v
                .iter()
                .try_for_each(|&q| finite(&format!("{name}.evaluate({x:e}, {y:e})"), q)),
            None => Err(format!("{name}.evaluate({x:e}, {y:e}) gave None")),
        }
    }
}

/// A phase: its dryness fraction, where defined, in [0, 1].
pub fn check_phase(phase: Phase) -> Result<(), Violation> {
    if let Phase::WetSteam { dryness_fraction } = phase {
        in_range(
            "wet-steam dryness fraction",
            dryness_fraction,
            SATURATION_TOLERANCE,
            1.0 - SATURATION_TOLERANCE,
        )?;
    }
    match phase.dryness_fraction() {
        Some(x) => in_range("dryness fraction", x, 0.0, 1.0),
        None => Ok(()),
    }
}

/// `v` between `a` and `b` (either order) within f32 rounding of a lever
/// rule on values of magnitude up to `scale`.
fn between(what: &str, v: f32, a: f32, b: f32, scale: f32) -> Result<(), Violation> {
    let (low, high) = if a <= b { (a, b) } else { (b, a) };
    let slack = 4.0 * f32::EPSILON * scale;
    if v.is_finite() && v >= low - slack && v <= high + slack {
        Ok(())
    } else {
        Err(format!("{what} = {v:e} not between {a:e} and {b:e}"))
    }
}

/// A wet-steam mixture against the saturated state at its own point.
pub fn check_wet_steam(w: &WetSteam, saturated: &SaturatedState) -> Result<(), Violation> {
    check_saturation_pressure(w.pressure)?;
    check_saturation_temperature(w.temperature)?;
    in_range("dryness fraction", w.dryness_fraction, 0.0, 1.0)?;
    check_enthalpy("wet-steam enthalpy", w.enthalpy_j_kg)?;
    check_entropy("wet-steam entropy", w.entropy_j_kgk)?;
    check_volume("wet-steam specific volume", w.specific_volume_m3_kg)?;
    check_density("wet-steam density", w.density_kg_m3)?;
    let (l, v) = (&saturated.liquid, &saturated.vapour);
    between(
        "wet-steam enthalpy",
        w.enthalpy_j_kg,
        l.enthalpy_j_kg,
        v.enthalpy_j_kg,
        ENTHALPY_MAX_J_KG,
    )?;
    between(
        "wet-steam entropy",
        w.entropy_j_kgk,
        l.entropy_j_kgk,
        v.entropy_j_kgk,
        ENTROPY_MAX_J_KGK,
    )?;
    between(
        "wet-steam specific volume",
        w.specific_volume_m3_kg,
        l.specific_volume_m3_kg,
        v.specific_volume_m3_kg,
        larger(l.specific_volume_m3_kg, v.specific_volume_m3_kg),
    )
}

fn check_accuracy(a: &SaturationAccuracy) -> Result<(), Violation> {
    for (what, v) in [
        ("temperature_k", a.temperature_k),
        ("pressure_relative", a.pressure_relative),
        ("liquid_density_relative", a.liquid_density_relative),
        ("vapour_density_relative", a.vapour_density_relative),
        ("liquid_enthalpy_j_kg", a.liquid_enthalpy_j_kg),
        ("vapour_enthalpy_j_kg", a.vapour_enthalpy_j_kg),
        ("liquid_entropy_j_kgk", a.liquid_entropy_j_kgk),
        ("vapour_entropy_j_kgk", a.vapour_entropy_j_kgk),
        ("liquid_cp_relative", a.liquid_cp_relative),
        ("vapour_cp_relative", a.vapour_cp_relative),
        ("dryness_fraction", a.dryness_fraction),
    ] {
        if !(v.is_finite() && v > 0.0) {
            return Err(format!(
                "accuracy bound {what} = {v} is not finite and positive"
            ));
        }
    }
    Ok(())
}

/// Error values must say something when printed (firmware logs them).
fn check_error<E: core::error::Error>(e: &E) -> Result<(), Violation> {
    if format!("{e}").is_empty() {
        Err(format!("error {e:?} prints as an empty string"))
    } else {
        Ok(())
    }
}

fn result<T, E: core::error::Error>(
    r: Result<T, E>,
    ok: impl FnOnce(T) -> Result<(), Violation>,
) -> Result<(), Violation> {
    match r {
        Ok(v) => ok(v),
        Err(e) => check_error(&e),
    }
}

fn check_locate<const P: usize>(
    name: &str,
    t: &UniformCubicTable<P>,
    x: f32,
) -> Result<(), Violation> {
    let Some((block, u)) = t.locate(x) else {
        return Err(format!("{name}.locate({x:e}) found no interval"));
    };
    // Outside its range a table extrapolates: t grows with the distance
    // (and is +∞ for x far enough that (x − start)·inverse_step overflows).
    // The kernel's functions check the range before they look up.
    if u.is_nan() || u < 0.0 {
        return Err(format!("{name}.locate({x:e}) gave t = {u:e}"));
    }
    let end = t.start + t.intervals.len() as f32 / t.inverse_step;
    if x >= t.start && x <= end {
        if u > 1.0 + 1e-3 {
            return Err(format!(
                "{name}.locate({x:e}) inside the table gave t = {u:e}"
            ));
        }
        for (q, c) in block.iter().enumerate() {
            finite(&format!("{name} quantity {q} at x = {x:e}"), cubic(c, u))?;
        }
    }
    Ok(())
}

/// Octave tables: any x gives an interval and 0 ≤ t < 1 (t is built from
/// the low bits of x's pattern, so this holds for NaN and ∞ too); for x
/// inside the table the cubics are finite.
fn check_locate_octave<const P: usize>(
    name: &str,
    t: &OctaveCubicTable<P>,
    x: f32,
) -> Result<(), Violation> {
    let Some((block, u)) = t.locate(x) else {
        return Err(format!("{name}.locate({x:e}) found no interval"));
    };
    if !(0.0..1.0).contains(&u) {
        return Err(format!("{name}.locate({x:e}) gave t = {u:e}"));
    }
    let first = f32::from_bits(t.first << t.shift);
    let end = f32::from_bits((t.first + t.intervals.len() as u32) << t.shift);
    if x >= first && x < end {
        for (q, c) in block.iter().enumerate() {
            finite(&format!("{name} quantity {q} at x = {x:e}"), cubic(c, u))?;
        }
    }
    Ok(())
}

/// The named function on raw inputs `a`, `b` (f32 bit patterns already
/// decoded) and a selector for enumerations (which saturated property,
/// which table). `Err` says which result broke the property; an unknown
/// name is an `Err` too, so a typo in [`CHECKED_FUNCTIONS`] cannot pass.
pub fn check(function: &str, a: f32, b: f32, selector: u32) -> Result<(), Violation> {
    let property = PROPERTIES[selector as usize % PROPERTIES.len()];
    match function {
        "AbsolutePressure::from_pa" => result(AbsolutePressure::from_pa(a), |p| {
            if p.as_pa().to_bits() == a.to_bits() && a >= 0.0 {
                Ok(())
            } else {
                Err(format!("from_pa({a:e}) holds {:e}", p.as_pa()))
            }
        }),
        "AbsolutePressure::from_kpa" => result(AbsolutePressure::from_kpa(a), |p| {
            in_range("absolute pressure (kPa)", p.as_kpa(), 0.0, f32::MAX)
        }),
        "AbsolutePressure::from_bar" => result(AbsolutePressure::from_bar(a), |p| {
            in_range("absolute pressure (bar)", p.as_bar(), 0.0, f32::MAX)
        }),
        "AbsolutePressure::from_mpa" => result(AbsolutePressure::from_mpa(a), |p| {
            in_range("absolute pressure (MPa)", p.as_mpa(), 0.0, f32::MAX)
        }),
        "AbsolutePressure::from_gauge" => {
            let (Ok(gauge), Ok(ambient)) =
                (GaugePressure::from_pa(a), AbsolutePressure::from_pa(b))
            else {
                return Ok(());
            };
            result(AbsolutePressure::from_gauge(gauge, ambient), |p| {
                in_range("absolute pressure (Pa)", p.as_pa(), 0.0, f32::MAX)
            })
        }
        "AbsolutePressure::as_pa"
        | "AbsolutePressure::as_kpa"
        | "AbsolutePressure::as_bar"
        | "AbsolutePressure::as_mpa" => result(AbsolutePressure::from_pa(a), |p| {
            in_range("Pa", p.as_pa(), 0.0, f32::MAX)?;
            in_range("kPa", p.as_kpa(), 0.0, f32::MAX)?;
            in_range("bar", p.as_bar(), 0.0, f32::MAX)?;
            in_range("MPa", p.as_mpa(), 0.0, f32::MAX)
        }),
        "AbsolutePressure::to_gauge" => {
            let (Ok(p), Ok(ambient)) = (AbsolutePressure::from_pa(a), AbsolutePressure::from_pa(b))
            else {
                return Ok(());
            };
            finite("gauge pressure (Pa)", p.to_gauge(ambient).as_pa())
        }
        "GaugePressure::from_pa"
        | "GaugePressure::from_kpa"
        | "GaugePressure::from_bar"
        | "GaugePressure::from_mpa"
        | "GaugePressure::as_pa"
        | "GaugePressure::as_kpa"
        | "GaugePressure::as_bar"
        | "GaugePressure::as_mpa" => {
            for g in [
                GaugePressure::from_pa(a),
                GaugePressure::from_kpa(a),
                GaugePressure::from_bar(a),
                GaugePressure::from_mpa(a),
            ] {
                result(g, |g| {
                    finite("gauge Pa", g.as_pa())?;
                    finite("gauge kPa", g.as_kpa())?;
                    finite("gauge bar", g.as_bar())?;
                    finite("gauge MPa", g.as_mpa())
                })?;
            }
            Ok(())
        }
        "Temperature::from_kelvin" | "Temperature::as_kelvin" => {
            result(Temperature::from_kelvin(a), |t| {
                in_range(
                    "temperature (K)",
                    t.as_kelvin(),
                    f32::MIN_POSITIVE * 0.0,
                    f32::MAX,
                )?;
                if t.as_kelvin() > 0.0 && t.as_kelvin().to_bits() == a.to_bits() {
                    Ok(())
                } else {
                    Err(format!("from_kelvin({a:e}) holds {:e}", t.as_kelvin()))
                }
            })
        }
        "Temperature::from_celsius" | "Temperature::as_celsius" => {
            result(Temperature::from_celsius(a), |t| {
                if t.as_kelvin() > 0.0 && t.as_kelvin().is_finite() {
                    finite("temperature (°C)", t.as_celsius())
                } else {
                    Err(format!("from_celsius({a:e}) holds {:e} K", t.as_kelvin()))
                }
            })
        }
        "saturation_temperature" => match AbsolutePressure::from_pa(a) {
            Ok(p) => result(saturation_temperature(p), check_saturation_temperature),
            Err(_) => Ok(()),
        },
        "saturation_pressure" => match Temperature::from_kelvin(a) {
            Ok(t) => result(saturation_pressure(t), check_saturation_pressure),
            Err(_) => Ok(()),
        },
        "saturated_state_at_pressure" => match AbsolutePressure::from_pa(a) {
            Ok(p) => result(saturated_state_at_pressure(p), |s| check_state(&s)),
            Err(_) => Ok(()),
        },
        "saturated_state_at_temperature" => match Temperature::from_kelvin(a) {
            Ok(t) => result(saturated_state_at_temperature(t), |s| check_state(&s)),
            Err(_) => Ok(()),
        },
        "saturated_property_at_pressure" => match AbsolutePressure::from_pa(a) {
            Ok(p) => result(saturated_property_at_pressure(p, property), |v| {
                check_property(property, v)
            }),
            Err(_) => Ok(()),
        },
        "saturated_property_at_temperature" => match Temperature::from_kelvin(a) {
            Ok(t) => result(saturated_property_at_temperature(t, property), |v| {
                check_property(property, v)
            }),
            Err(_) => Ok(()),
        },
        "Phase::dryness_fraction" | "phase_from_pressure_enthalpy" => {
            match AbsolutePressure::from_pa(a) {
                Ok(p) => result(phase_from_pressure_enthalpy(p, b), check_phase),
                Err(_) => Ok(()),
            }
        }
        "phase_from_pressure_entropy" => match AbsolutePressure::from_pa(a) {
            Ok(p) => result(phase_from_pressure_entropy(p, b), check_phase),
            Err(_) => Ok(()),
        },
        "phase_from_pressure_specific_volume" => match AbsolutePressure::from_pa(a) {
            Ok(p) => result(phase_from_pressure_specific_volume(p, b), check_phase),
            Err(_) => Ok(()),
        },
        "phase_from_temperature_enthalpy" => match Temperature::from_kelvin(a) {
            Ok(t) => result(phase_from_temperature_enthalpy(t, b), check_phase),
            Err(_) => Ok(()),
        },
        "phase_from_temperature_entropy" => match Temperature::from_kelvin(a) {
            Ok(t) => result(phase_from_temperature_entropy(t, b), check_phase),
            Err(_) => Ok(()),
        },
        "wet_steam_at_pressure" => match AbsolutePressure::from_pa(a) {
            Ok(p) => result(wet_steam_at_pressure(p, b), |w| {
                let s = saturated_state_at_pressure(p)
                    .map_err(|e| format!("wet steam computed where the state is {e}"))?;
                check_wet_steam(&w, &s)
            }),
            Err(_) => Ok(()),
        },
        "wet_steam_at_temperature" => match Temperature::from_kelvin(a) {
            Ok(t) => result(wet_steam_at_temperature(t, b), |w| {
                let s = saturated_state_at_temperature(t)
                    .map_err(|e| format!("wet steam computed where the state is {e}"))?;
                check_wet_steam(&w, &s)
            }),
            Err(_) => Ok(()),
        },
        "accuracy_at_saturation_temperature_k" => {
            check_accuracy(accuracy_at_saturation_temperature_k(a))
        }
        "UniformCubicTable::locate" | "cubic" => match selector % 2 {
            0 => check_locate("STATE_LOW", &table::STATE_LOW, a),
            _ => check_locate("STATE_HIGH", &table::STATE_HIGH, a),
        },
        "OctaveCubicTable::locate" => match selector % 2 {
            0 => check_locate_octave("TEMPERATURE_LOW", &table::TEMPERATURE_LOW, a),
            _ => check_locate_octave("TEMPERATURE_HIGH", &table::TEMPERATURE_HIGH, a),
        },
        // The integrity functions take no untrusted input; they must pass
        // on the compiled tables whatever the other inputs are.
        "self_test" => integrity::self_test().map_err(|e| format!("self-test failed: {e}")),
        "check_checksums" | "TableSet::compiled" => {
            integrity::check_checksums(&TableSet::compiled())
                .map_err(|e| format!("check_checksums failed: {e}"))
        }
        "check_spot_points" => {
            integrity::check_spot_points().map_err(|e| format!("spot check failed: {e}"))
        }
        "TableData::of_uniform" | "TableData::of_octave" | "TableData::checksum" => {
            let (computed, expected) = match selector % 4 {
                0 => (
                    TableData::of_uniform(&table::STATE_LOW).checksum(),
                    table::STATE_LOW_CRC32,
                ),
                1 => (
                    TableData::of_uniform(&table::STATE_HIGH).checksum(),
                    table::STATE_HIGH_CRC32,
                ),
                2 => (
                    TableData::of_octave(&table::TEMPERATURE_LOW).checksum(),
                    table::TEMPERATURE_LOW_CRC32,
                ),
                _ => (
                    TableData::of_octave(&table::TEMPERATURE_HIGH).checksum(),
                    table::TEMPERATURE_HIGH_CRC32,
                ),
            };
            if computed == expected {
                Ok(())
            } else {
                Err(format!(
                    "table {} CRC {computed:#x}, generated {expected:#x}",
                    selector % 4
                ))
            }
        }
        "superheated_vapour" | "compressed_liquid" | "state_at_pressure_temperature" => {
            let (Ok(p), Ok(t)) = (AbsolutePressure::from_pa(a), Temperature::from_kelvin(b)) else {
                return Ok(());
            };
            match function {
                "superheated_vapour" => {
                    result(superheated_vapour(p, t), |s| check_single_phase(&s, true))
                }
                "compressed_liquid" => {
                    result(compressed_liquid(p, t), |s| check_single_phase(&s, false))
                }
                _ => result(state_at_pressure_temperature(p, t), check_fluid_state),
            }
        }
        "state_at_pressure_enthalpy" => match AbsolutePressure::from_pa(a) {
            Ok(p) => result(state_at_pressure_enthalpy(p, b), check_fluid_state),
            Err(_) => Ok(()),
        },
        "state_at_pressure_entropy" => match AbsolutePressure::from_pa(a) {
            Ok(p) => result(state_at_pressure_entropy(p, b), check_fluid_state),
            Err(_) => Ok(()),
        },
        "BicubicSheet::evaluate" | "BicubicSheet::evaluate_one" => {
            let one = function.ends_with("one");
            let (name, sheet, part) = sheet_part(selector);
            match part {
                0 => check_sheet_evaluate(name, &sheet.properties, a, b, one),
                1 => check_sheet_evaluate(name, &sheet.y_of_enthalpy, a, b, one),
                _ => check_sheet_evaluate(name, &sheet.y_of_entropy, a, b, one),
            }
        }
        "SheetData::of_sheet" | "SheetData::checksum" => {
            let (name, sheet, part) = sheet_part(selector);
            let crcs = SinglePhaseTables::compiled();
            let expected = crcs
                .sheets
                .iter()
                .find(|s| s.table.to_string() == name)
                .map(|s| s.expected[part as usize])
                .ok_or_else(|| format!("no CRC for {name}"))?;
            let computed = match part {
                0 => SheetData::of_sheet(&sheet.properties).checksum(),
                1 => SheetData::of_sheet(&sheet.y_of_enthalpy).checksum(),
                _ => SheetData::of_sheet(&sheet.y_of_entropy).checksum(),
            };
            if computed == expected {
                Ok(())
            } else {
                Err(format!(
                    "sheet {name} part {part} CRC {computed:#x}, generated {expected:#x}"
                ))
            }
        }
        "SinglePhaseTables::compiled" | "check_single_phase_checksums" => {
            check_single_phase_checksums(&SinglePhaseTables::compiled())
                .map_err(|e| format!("single-phase checksums failed: {e}"))
        }
        f if APPLICATION_FUNCTIONS.contains(&f) => check_application(function, a, b, selector),
        other => Err(format!("unknown kernel function {other}")),
    }
}

// ---- application routines block (issue 5, branch apps): the physical-range
// checks of crate::flowing, energy, drum_level and calorimeter.
use vapora_kernel::calorimeter::{
    separating_throttling_dryness, throttling_calorimeter_dryness, ThrottlingCalorimeterReading,
};
use vapora_kernel::drum_level::{
    drum_level, drum_level_from_densities, DrumLevel, DrumLevelTransmitter, LevelSpan,
    STANDARD_GRAVITY_M_S2,
};
use vapora_kernel::energy::{energy_flow, energy_flow_from_enthalpies_w, EnergyFlow, SteamSupply};
use vapora_kernel::flowing::{
    steam_flowing_conditions, water_flowing_conditions, FlowingConditions,
};

/// The application routines, as [`CHECKED_FUNCTIONS`] names them: they
/// share one input shape and one checker ([`check_application`]).
const APPLICATION_FUNCTIONS: [&str; 8] = [
    "steam_flowing_conditions",
    "water_flowing_conditions",
    "energy_flow_from_enthalpies_w",
    "energy_flow",
    "drum_level_from_densities",
    "drum_level",
    "throttling_calorimeter_dryness",
    "separating_throttling_dryness",
];

/// Selectors of the application routines: which of the fixed settings
/// (alarm threshold, transmitter, calorimeter, water state) go with `a`, `b`.
pub const APPLICATION_SELECTORS: u32 = 4;

/// Highest single-phase enthalpy accepted, J/kg: h of steam at 1073.15 K
/// and low pressure is about 4.16 MJ/kg (IF97 Region 2, from memory),
/// rounded up.
pub const APPLICATION_ENTHALPY_MAX_J_KG: f32 = 4.2e6;
/// Lowest viscosity accepted, Pa·s: vapour at the triple point is about
/// 9 µPa·s (R12-08, from memory), rounded down.
pub const APPLICATION_VISCOSITY_MIN_PA_S: f32 = 1.0e-6;
/// Highest viscosity accepted, Pa·s: liquid at 273.16 K is about
/// 1.79 mPa·s (R12-08, from memory), rounded up.
pub const APPLICATION_VISCOSITY_MAX_PA_S: f32 = 2.0e-3;

/// Alarm thresholds tried, K (the last ones invalid).
const ALARM_THRESHOLDS_K: [f32; 4] = [5.0, 0.0, f32::NAN, -1.0];

/// Transmitters tried: a plausible one, a zero mark at the lower tap, a
/// tiny tap separation, and an invalid one (zero mark above the upper tap).
fn transmitter(selector: u32) -> DrumLevelTransmitter {
    let (h, z, g, p_min) = match selector % 4 {
        0 => (0.6, 0.3, STANDARD_GRAVITY_M_S2, 2.0e5),
        1 => (1.2, 0.0, 9.78, 0.0),
        2 => (1e-3, 5e-4, 9.83, PRESSURE_MIN_PA),
        _ => (0.6, 0.7, STANDARD_GRAVITY_M_S2, 1.0e5),
    };
    DrumLevelTransmitter {
        tap_separation_m: h,
        zero_level_above_lower_tap_m: z,
        gravity_m_s2: g,
        minimum_drum_pressure: AbsolutePressure::from_pa(p_min)
            .unwrap_or(AbsolutePressure::STANDARD_ATMOSPHERE),
    }
}

fn check_flowing(c: &FlowingConditions, threshold_k: f32) -> Result<(), Violation> {
    check_density("flowing density", c.density_kg_m3)?;
    in_range(
        "flowing enthalpy",
        c.enthalpy_j_kg,
        ENTHALPY_MIN_J_KG,
        APPLICATION_ENTHALPY_MAX_J_KG,
    )?;
    in_range(
        "isentropic exponent",
        c.isentropic_exponent,
        f32::MIN_POSITIVE,
        f32::MAX,
    )?;
    in_range(
        "viscosity",
        c.viscosity_pa_s,
        APPLICATION_VISCOSITY_MIN_PA_S,
        APPLICATION_VISCOSITY_MAX_PA_S,
    )?;
    match c.saturation_margin_k {
        Some(m) => {
            in_range("saturation margin", m, f32::MIN_POSITIVE, f32::MAX)?;
            if c.margin_alarm != (m < threshold_k) {
                return Err(format!(
                    "margin {m} K against threshold {threshold_k} K gave alarm {}",
                    c.margin_alarm
                ));
            }
        }
        None if c.margin_alarm => return Err("alarm raised without a margin".into()),
        None => {}
    }
    Ok(())
}

fn check_energy(e: &EnergyFlow) -> Result<(), Violation> {
    in_range(
        "steam enthalpy",
        e.steam_enthalpy_j_kg,
        ENTHALPY_MIN_J_KG,
        APPLICATION_ENTHALPY_MAX_J_KG,
    )?;
    in_range(
        "water enthalpy",
        e.water_enthalpy_j_kg,
        ENTHALPY_MIN_J_KG,
        APPLICATION_ENTHALPY_MAX_J_KG,
    )?;
    check_energy_product(
        e.energy_flow_w,
        e.mass_flow_kg_s,
        e.steam_enthalpy_j_kg,
        e.water_enthalpy_j_kg,
    )
}

/// Φ finite and equal to q_m·(h_s − h_w) to f32 rounding.
fn check_energy_product(phi: f32, m: f32, hs: f32, hw: f32) -> Result<(), Violation> {
    finite("energy flow (W)", phi)?;
    let expected = f64::from(m) * (f64::from(hs) - f64::from(hw));
    let slack =
        4.0 * f64::from(f32::EPSILON) * f64::from(m) * (f64::from(hs).abs() + f64::from(hw).abs())
            + f64::from(f32::from_bits(1));
    if (f64::from(phi) - expected).abs() <= slack {
        Ok(())
    } else {
        Err(format!("energy flow {phi:e} W, q_m·Δh = {expected:e} W"))
    }
}

fn check_level(l: &DrumLevel, t: &DrumLevelTransmitter) -> Result<(), Violation> {
    finite("level (m)", l.level_m)?;
    finite("water height (m)", l.water_height_above_lower_tap_m)?;
    let hw = l.water_height_above_lower_tap_m;
    let span = if hw < 0.0 {
        LevelSpan::BelowLowerTap
    } else if hw > t.tap_separation_m {
        LevelSpan::AboveUpperTap
    } else {
        LevelSpan::WithinTaps
    };
    if span != l.span {
        return Err(format!("water height {hw} m reported as {:?}", l.span));
    }
    let difference = hw - t.zero_level_above_lower_tap_m;
    if (l.level_m - difference).abs() > 4.0 * f32::EPSILON * (hw.abs() + t.tap_separation_m) {
        return Err(format!(
            "level {} m is not h_w − Z = {difference} m",
            l.level_m
        ));
    }
    if l.liquid_density_kg_m3 > l.vapour_density_kg_m3 {
        Ok(())
    } else {
        Err(format!(
            "liquid {} kg/m³ not denser than vapour {} kg/m³",
            l.liquid_density_kg_m3, l.vapour_density_kg_m3
        ))
    }
}

fn check_calorimeter(r: &ThrottlingCalorimeterReading) -> Result<(), Violation> {
    in_range("calorimeter dryness fraction", r.dryness_fraction, 0.0, 1.0)?;
    in_range(
        "calorimeter superheat (K)",
        r.calorimeter_superheat_k,
        f32::MIN_POSITIVE,
        f32::MAX,
    )?;
    in_range(
        "line enthalpy",
        r.line_enthalpy_j_kg,
        ENTHALPY_MIN_J_KG,
        APPLICATION_ENTHALPY_MAX_J_KG,
    )?;
    if r.line_steam_dry && r.dryness_fraction != 1.0 {
        return Err(format!("dry line steam with x = {}", r.dryness_fraction));
    }
    Ok(())
}

/// The application routines on raw inputs: what `a` and `b` are is
/// written beside each function; the selector picks the other settings.
fn check_application(function: &str, a: f32, b: f32, selector: u32) -> Result<(), Violation> {
    let threshold = ALARM_THRESHOLDS_K[selector as usize % ALARM_THRESHOLDS_K.len()];
    match function {
        // a = line pressure (Pa), b = line temperature (K).
        "steam_flowing_conditions" | "water_flowing_conditions" => {
            let (Ok(p), Ok(t)) = (AbsolutePressure::from_pa(a), Temperature::from_kelvin(b)) else {
                return Ok(());
            };
            let r = if function == "steam_flowing_conditions" {
                steam_flowing_conditions(p, t, threshold)
            } else {
                water_flowing_conditions(p, t, threshold)
            };
            result(r, |c| check_flowing(&c, threshold))
        }
        // a = mass flow (kg/s), b = steam enthalpy (J/kg); the water
        // enthalpy from the selector.
        "energy_flow_from_enthalpies_w" => {
            let hw = [419.1e3, 0.0, -1.0e30, f32::NAN][selector as usize % 4];
            result(energy_flow_from_enthalpies_w(a, b, hw), |phi| {
                check_energy_product(phi, a, b, hw)
            })
        }
        // a = steam pressure (Pa), b = steam temperature (K) for even
        // selectors or dryness fraction for odd ones; 1.39 kg/s, water at
        // 3 bar(a) and 85 °C, or at the steam's pressure and 45 °C.
        "energy_flow" => {
            let Ok(p) = AbsolutePressure::from_pa(a) else {
                return Ok(());
            };
            let steam = if selector % 2 == 0 {
                let Ok(t) = Temperature::from_kelvin(b) else {
                    return Ok(());
                };
                SteamSupply::Superheated {
                    pressure: p,
                    temperature: t,
                }
            } else {
                SteamSupply::Wet {
                    pressure: p,
                    dryness_fraction: b,
                }
            };
            let (water_p, water_t) = if selector % 4 < 2 {
                (
                    AbsolutePressure::from_pa(3.0e5),
                    Temperature::from_celsius(85.0),
                )
            } else {
                (Ok(p), Temperature::from_celsius(45.0))
            };
            let (Ok(water_p), Ok(water_t)) = (water_p, water_t) else {
                return Err("fixed water state rejected".into());
            };
            result(energy_flow(1.39, steam, water_p, water_t), |e| {
                check_energy(&e)
            })
        }
        // a = DP (Pa), b = reference-leg density (kg/m³); ρ' and ρ'' of a
        // drum at 1.15 MPa, or of cold water with a trace of vapour.
        "drum_level_from_densities" => {
            let t = transmitter(selector);
            let (rho_l, rho_v) = if selector % 2 == 0 {
                (880.4, 5.887)
            } else {
                (1000.0, 1e-3)
            };
            result(drum_level_from_densities(a, &t, rho_l, rho_v, b), |l| {
                check_level(&l, &t)
            })
        }
        // a = drum pressure (Pa), b = DP (Pa); leg at 45 °C, 5 °C, 300 °C
        // or 0.01 °C by selector.
        "drum_level" => {
            let Ok(p) = AbsolutePressure::from_pa(a) else {
                return Ok(());
            };
            let t = transmitter(selector);
            let leg_c = [45.0, 5.0, 300.0, 0.01][selector as usize % 4];
            let Ok(leg) = Temperature::from_celsius(leg_c) else {
                return Err("fixed leg temperature rejected".into());
            };
            result(drum_level(p, b, leg, &t), |l| {
                check_density("drum liquid density", l.liquid_density_kg_m3)?;
                check_density("drum vapour density", l.vapour_density_kg_m3)?;
                check_density("reference leg density", l.reference_leg_density_kg_m3)?;
                check_level(&l, &t)
            })
        }
        // a = calorimeter pressure (Pa), b = calorimeter temperature (K);
        // line at 1.151 325 MPa, 20 MPa, 0.2 MPa or 700 Pa by selector.
        "throttling_calorimeter_dryness" => {
            let line_pa = [1_151_325.0, 20.0e6, 2.0e5, 700.0][selector as usize % 4];
            let (Ok(p_cal), Ok(t_cal), Ok(line)) = (
                AbsolutePressure::from_pa(a),
                Temperature::from_kelvin(b),
                AbsolutePressure::from_pa(line_pa),
            ) else {
                return Ok(());
            };
            result(throttling_calorimeter_dryness(line, p_cal, t_cal), |r| {
                check_calorimeter(&r)
            })
        }
        // a = separated water (kg), b = condensed steam (kg); the
        // throttling stage from the selector.
        "separating_throttling_dryness" => {
            let (line_pa, cal_pa, cal_c) = [
                (1_151_325.0, 101_325.0, 112.0),
                (1_151_325.0, 101_325.0, 99.0),
                (20.0e6, 101_325.0, 400.0),
                (2.0e5, 1.5e5, 150.0),
            ][selector as usize % 4];
            let (Ok(line), Ok(p_cal), Ok(t_cal)) = (
                AbsolutePressure::from_pa(line_pa),
                AbsolutePressure::from_pa(cal_pa),
                Temperature::from_celsius(cal_c),
            ) else {
                return Err("fixed calorimeter state rejected".into());
            };
            result(
                separating_throttling_dryness(line, p_cal, t_cal, a, b),
                |r| {
                    check_calorimeter(&r.throttling)?;
                    in_range(
                        "separator dryness fraction",
                        r.separator_dryness_fraction,
                        f32::MIN_POSITIVE * 0.0,
                        1.0,
                    )?;
                    in_range("combined dryness fraction", r.dryness_fraction, 0.0, 1.0)?;
                    let product = r.separator_dryness_fraction * r.throttling.dryness_fraction;
                    if r.dryness_fraction == product {
                        Ok(())
                    } else {
                        Err(format!(
                            "x = {} is not x_s·x_t = {product}",
                            r.dryness_fraction
                        ))
                    }
                },
            )
        }
        other => Err(format!("unknown kernel function {other}")),
    }
}
// ---- end of the application routines block
