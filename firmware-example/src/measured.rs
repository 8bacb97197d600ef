//! The one place that lists the functions whose cost `src/bin/cost.rs`
//! measures and `scripts/measure-cost.sh` tabulates: [`KERNEL`] for every
//! public kernel function, [`BASELINE`] for the f64 IAPWS-IF97 formulation
//! (`vapora-tables`, compiled `no_std` for the core) evaluated directly for
//! the same outputs, and [`STAND_INS`] for reference points. Adding a
//! function is one entry plus its two small adapters (`*_input`, `call_*`).
//!
//! Each `call_*` wrapper takes the raw f32 inputs, builds the kernel's unit
//! types (as a caller must), makes the call and hands the whole result to
//! `core::hint::black_box`, so no output can be optimised away (with fat
//! LTO the kernel is inlined into the wrapper). The sweeps cover the range
//! and end with edge cases: the IF97 hand-over at 623.15 K, both range
//! ends, and one input below and one above the range (error results).
//!
//! The stand-ins: `libm::logf` and `libm::expf` (the kind of call the
//! kernel's spline evaluation makes) and a 20-term Horner polynomial in f32
//! and in f64 (the f64 one is what a direct double-precision formulation
//! costs on a core without a double FPU).
//!
//! [`CORPUS_CALLS`] maps every function the fuzz target names to its
//! wrapper, for the fuzz-corpus cost bench (`src/bin/fuzz_cost.rs`).

use core::hint::black_box;

use vapora_kernel::saturation::{
    SaturatedProperty, PRESSURE_MAX_PA, PRESSURE_MIN_PA, TEMPERATURE_MAX_K, TEMPERATURE_MIN_K,
};
use vapora_kernel::single_phase;
use vapora_kernel::tables::saturation::{BOUNDARY_PRESSURE_PA, BOUNDARY_TEMPERATURE_K};
use vapora_kernel::units::{AbsolutePressure, GaugePressure, Temperature};
use vapora_tables::if97::{region4, saturation as if97_saturation};

use crate::kernel_calls::PROPERTIES;
/// One measured function.
pub struct Measured {
    /// Name in the cost table (`function` column).
    pub name: &'static str,
    /// Number of calls in the sweep.
    pub calls: u32,
    /// The `i`-th input of the sweep (`i` in `0..calls`); computed outside
    /// the markers, so it is not counted.
    pub input: fn(u32) -> [f32; 2],
    /// The call measured: takes the input, returns the result's bits (or an
    /// error code) so the optimiser cannot drop the work.
    pub call: fn([f32; 2]) -> u32,
}

/// Calls per function in the sweep.
const SWEEP: u32 = 128;

/// Linear sweep from `lo` to `hi` over `SWEEP` points.
fn sweep(i: u32, lo: f32, hi: f32) -> f32 {
    lo + (hi - lo) * (i as f32) / ((SWEEP - 1) as f32)
}

/// Geometric sweep from `lo` to `hi` (both > 0), for pressures and other
/// inputs spanning decades.
fn sweep_log(i: u32, lo: f32, hi: f32) -> f32 {
    libm::expf(sweep(i, libm::logf(lo), libm::logf(hi)))
}

/// Every public kernel function, measured first; `scripts/measure-cost.sh`
/// also builds the bench without them (feature `without-kernel`) and takes
/// the kernel's flash and static RAM as the difference between the two
/// images. The single-property calls sweep all twelve properties (the
/// `i`-th call asks for property `i mod 12`); the `Phase` of the phase
/// calls carries the dryness fraction.
pub const KERNEL: &[Measured] = &[
    Measured {
        name: "saturation_temperature",
        calls: SWEEP,
        input: pressure_input,
        call: call_saturation_temperature,
    },
    Measured {
        name: "saturation_pressure",
        calls: SWEEP,
        input: temperature_input,
        call: call_saturation_pressure,
    },
    Measured {
        name: "saturated_state_at_pressure",
        calls: SWEEP,
        input: pressure_input,
        call: call_saturated_state_at_pressure,
    },
    Measured {
        name: "saturated_state_at_temperature",
        calls: SWEEP,
        input: temperature_input,
        call: call_saturated_state_at_temperature,
    },
    Measured {
        name: "saturated_property_at_pressure",
        calls: SWEEP,
        input: pressure_property_input,
        call: call_saturated_property_at_pressure,
    },
    Measured {
        name: "saturated_property_at_temperature",
        calls: SWEEP,
        input: temperature_property_input,
        call: call_saturated_property_at_temperature,
    },
    Measured {
        name: "phase_from_pressure_enthalpy",
        calls: SWEEP,
        input: pressure_enthalpy_input,
        call: call_phase_from_pressure_enthalpy,
    },
    Measured {
        name: "phase_from_pressure_entropy",
        calls: SWEEP,
        input: pressure_entropy_input,
        call: call_phase_from_pressure_entropy,
    },
    Measured {
        name: "phase_from_pressure_specific_volume",
        calls: SWEEP,
        input: pressure_volume_input,
        call: call_phase_from_pressure_specific_volume,
    },
    Measured {
        name: "phase_from_temperature_enthalpy",
        calls: SWEEP,
        input: temperature_enthalpy_input,
        call: call_phase_from_temperature_enthalpy,
    },
    Measured {
        name: "phase_from_temperature_entropy",
        calls: SWEEP,
        input: temperature_entropy_input,
        call: call_phase_from_temperature_entropy,
    },
    Measured {
        name: "wet_steam_at_pressure",
        calls: SWEEP,
        input: pressure_dryness_input,
        call: call_wet_steam_at_pressure,
    },
    Measured {
        name: "wet_steam_at_temperature",
        calls: SWEEP,
        input: temperature_dryness_input,
        call: call_wet_steam_at_temperature,
    },
    Measured {
        name: "accuracy_at_saturation_temperature_k",
        calls: SWEEP,
        input: temperature_input,
        call: call_accuracy_at_saturation_temperature_k,
    },
    Measured {
        name: "absolute_pressure_from_gauge",
        calls: SWEEP,
        input: gauge_ambient_input,
        call: call_absolute_pressure_from_gauge,
    },
    Measured {
        name: "absolute_pressure_from_bar",
        calls: SWEEP,
        input: bar_input,
        call: call_absolute_pressure_from_bar,
    },
    Measured {
        name: "temperature_from_celsius",
        calls: SWEEP,
        input: celsius_input,
        call: call_temperature_from_celsius,
    },
    Measured {
        name: "single_phase_state_at_pressure_temperature",
        calls: SWEEP,
        input: single_phase_pt_input,
        call: call_state_at_pressure_temperature,
    },
    Measured {
        name: "single_phase_state_at_pressure_enthalpy",
        calls: SWEEP,
        input: single_phase_ph_input,
        call: call_state_at_pressure_enthalpy,
    },
    Measured {
        name: "single_phase_state_at_pressure_entropy",
        calls: SWEEP,
        input: single_phase_ps_input,
        call: call_state_at_pressure_entropy,
    },
    // ---- trial merge: the application routines (branch apps).
    Measured {
        name: "steam_flowing_conditions",
        calls: SWEEP,
        input: superheated_pt_input,
        call: call_steam_flowing_conditions,
    },
    Measured {
        name: "water_flowing_conditions",
        calls: SWEEP,
        input: subcooled_pt_input,
        call: call_water_flowing_conditions,
    },
    Measured {
        name: "energy_flow",
        calls: SWEEP,
        input: superheated_pt_input,
        call: call_energy_flow,
    },
    Measured {
        name: "drum_level",
        calls: SWEEP,
        input: drum_input,
        call: call_drum_level,
    },
    Measured {
        name: "throttling_calorimeter_dryness",
        calls: SWEEP,
        input: calorimeter_input,
        call: call_throttling_calorimeter_dryness,
    },
];

/// The table look-ups inside the single-phase calls, measured on their own
/// for the README's cost breakdown: one 4 × 4 block of the low-pressure
/// vapour sheet's six quantities, and one quantity of its inverse
/// (enthalpy) sheet. Left out on the 256 KiB micro:bit (cfg
/// `vapora_small_flash`, set by `build.rs`), where their wrappers do not fit
/// beside the rest of the bench; the README shows "–" there.
pub const LOOKUPS: &[Measured] = if cfg!(vapora_small_flash) {
    &[]
} else {
    &[
        Measured {
            name: "bicubic_sheet_evaluate",
            calls: SWEEP,
            input: sheet_input,
            call: call_sheet_evaluate,
        },
        Measured {
            name: "bicubic_sheet_evaluate_one",
            calls: SWEEP,
            input: sheet_input,
            call: call_sheet_evaluate_one,
        },
    ]
};

/// Saturation temperature for a sweep input (f64 formulation, outside the
/// markers); 650 K from the critical pressure up.
fn t_sat_for_input(p: f32) -> f32 {
    if p < 22.064e6 {
        region4::saturation_temperature_k_unchecked(f64::from(p)) as f32
    } else {
        650.0
    }
}

/// Superheated steam: pressures 611.657 Pa to 25 MPa (log), T from 0.05 K
/// above saturation to 1073.15 K.
fn superheated_pt_input(i: u32) -> [f32; 2] {
    let p = sweep_log(i, 611.657, 25.0e6);
    [p, scrambled(i, t_sat_for_input(p) + 0.05, 1073.15)]
}

/// Compressed water: the same pressures, T from 273.16 K to 0.05 K below
/// saturation.
fn subcooled_pt_input(i: u32) -> [f32; 2] {
    let p = sweep_log(i, 611.657, 25.0e6);
    [p, scrambled(i, 273.16, t_sat_for_input(p) - 0.05)]
}

/// Drum pressures 1.5 bar(a) to 20 MPa (log), DP readings 0 to 6 kPa.
fn drum_input(i: u32) -> [f32; 2] {
    [sweep_log(i, 1.5e5, 20.0e6), scrambled(i, 0.0, 6.0e3)]
}

/// Calorimeter chambers 5 kPa to 1 MPa (log), 0.05 to 150 K superheated.
fn calorimeter_input(i: u32) -> [f32; 2] {
    let p = sweep_log(i, 5.0e3, 1.0e6);
    [p, t_sat_for_input(p) + scrambled(i, 0.05, 150.0)]
}

/// The baseline: the f64 formulation evaluated on the core for the same
/// outputs and the same inputs as the kernel row of the same name without
/// the `f64_` prefix (`scripts/cost-table.py ratio` pairs them). Feature
/// `without-baseline` leaves it out, for its flash size.
pub const BASELINE: &[Measured] = &[
    Measured {
        name: "f64_saturation_temperature",
        calls: SWEEP,
        input: pressure_input,
        call: call_f64_saturation_temperature,
    },
    Measured {
        name: "f64_saturation_pressure",
        calls: SWEEP,
        input: temperature_input,
        call: call_f64_saturation_pressure,
    },
    Measured {
        name: "f64_saturated_state_at_pressure",
        calls: SWEEP,
        input: pressure_input,
        call: call_f64_saturated_state_at_pressure,
    },
    Measured {
        name: "f64_phase_from_pressure_enthalpy",
        calls: SWEEP,
        input: pressure_enthalpy_input,
        call: call_f64_phase_from_pressure_enthalpy,
    },
];

/// Stand-ins and reference points, measured after the kernel's functions.
pub const STAND_INS: &[Measured] = &[
    Measured {
        name: "libm_logf",
        calls: SWEEP,
        input: logf_input,
        call: call_logf,
    },
    Measured {
        name: "libm_expf",
        calls: SWEEP,
        input: expf_input,
        call: call_expf,
    },
    Measured {
        name: "horner20_f32",
        calls: SWEEP,
        input: horner_input,
        call: call_horner20_f32,
    },
    Measured {
        name: "horner20_f64",
        calls: SWEEP,
        input: horner_input,
        call: call_horner20_f64,
    },
];

/// The calibration entry: same call path, empty body. Its count is
/// subtracted from every measured call.
pub const CALIBRATION: Measured = Measured {
    name: "calibration",
    calls: 16,
    input: horner_input,
    call: call_nothing,
};

fn logf_input(i: u32) -> [f32; 2] {
    // Pressures in Pa across the kernel's intended span (611 Pa to 22 MPa).
    [sweep_log(i, 611.0, 22.0e6), 0.0]
}

fn expf_input(i: u32) -> [f32; 2] {
    [sweep(i, -10.0, 10.0), 0.0]
}

fn horner_input(i: u32) -> [f32; 2] {
    [sweep(i, 0.0, 1.0), 0.0]
}

/// Does nothing: its count is the cost of the call path alone (loading the
/// input, the indirect call, the return), which every wrapper also pays.
#[inline(never)]
fn call_nothing(_x: [f32; 2]) -> u32 {
    0
}

#[inline(never)]
fn call_logf(x: [f32; 2]) -> u32 {
    libm::logf(x[0]).to_bits()
}

#[inline(never)]
fn call_expf(x: [f32; 2]) -> u32 {
    libm::expf(x[0]).to_bits()
}

/// 20 coefficients of no physical meaning (alternating, decreasing), only
/// to give the polynomial a realistic amount of work.
static HORNER_COEFFICIENTS: [f32; 20] = [
    1.0, -0.5, 0.333_333, -0.25, 0.2, -0.166_667, 0.142_857, -0.125, 0.111_111, -0.1, 0.090_909,
    -0.083_333, 0.076_923, -0.071_429, 0.066_667, -0.0625, 0.058_824, -0.055_556, 0.052_632, -0.05,
];

#[inline(never)]
fn call_horner20_f32(x: [f32; 2]) -> u32 {
    let t = x[0];
    let value = HORNER_COEFFICIENTS
        .iter()
        .rev()
        .fold(0.0f32, |acc, &c| acc * t + c);
    value.to_bits()
}

#[inline(never)]
fn call_horner20_f64(x: [f32; 2]) -> u32 {
    let t = f64::from(x[0]);
    let value = HORNER_COEFFICIENTS
        .iter()
        .rev()
        .fold(0.0f64, |acc, &c| acc * t + f64::from(c));
    // Fold the double's bits so none of the work can be dropped.
    let bits = value.to_bits();
    (bits >> 32) as u32 ^ bits as u32
}

/// The last four inputs of every sweep: the IF97 hand-over (623.15 K or
/// psat there) and its upper neighbour, then one below and one above the
/// range (error results).
const EDGE_CASES: u32 = 4;

fn next_up(x: f32) -> f32 {
    f32::from_bits(x.to_bits() + 1)
}

/// Input `i` of a sweep of `SWEEP` over `lo..=hi` (evenly in ln x if
/// `log`): `SWEEP - EDGE_CASES` points over the range, then the edge cases
/// `boundary`, its upper neighbour, 1 % below `lo` and 1 % above `hi`.
fn range_point(i: u32, lo: f32, hi: f32, boundary: f32, log: bool) -> f32 {
    let n = SWEEP - EDGE_CASES;
    match i.checked_sub(n) {
        None => {
            let f = (i as f32) / ((n - 1) as f32);
            let x = if log {
                libm::expf(libm::logf(lo) + (libm::logf(hi) - libm::logf(lo)) * f)
            } else {
                lo + (hi - lo) * f
            };
            // exp(log(x)) in f32 can land just outside the range.
            x.clamp(lo, hi)
        }
        Some(0) => boundary,
        Some(1) => next_up(boundary),
        Some(2) => lo * 0.99,
        _ => hi * 1.01,
    }
}

/// Absolute pressures over the kernel's saturation range, Pa.
fn pressure_input(i: u32) -> [f32; 2] {
    let p = range_point(
        i,
        PRESSURE_MIN_PA,
        PRESSURE_MAX_PA,
        BOUNDARY_PRESSURE_PA,
        true,
    );
    [p, 0.0]
}

/// Temperatures over the kernel's saturation range, K.
fn temperature_input(i: u32) -> [f32; 2] {
    let t = range_point(
        i,
        TEMPERATURE_MIN_K,
        TEMPERATURE_MAX_K,
        BOUNDARY_TEMPERATURE_K,
        false,
    );
    [t, 0.0]
}

/// A second input stepping through its own sweep in a different order from
/// the first (37 is prime to 128), so the pairs cover the plane.
fn scrambled(i: u32, lo: f32, hi: f32) -> f32 {
    sweep((i * 37) % SWEEP, lo, hi)
}

fn pressure_property_input(i: u32) -> [f32; 2] {
    [pressure_input(i)[0], (i % 12) as f32]
}

fn temperature_property_input(i: u32) -> [f32; 2] {
    [temperature_input(i)[0], (i % 12) as f32]
}

/// Enthalpies from subcooled liquid to superheated vapour, J/kg.
fn pressure_enthalpy_input(i: u32) -> [f32; 2] {
    [pressure_input(i)[0], scrambled(i, 0.0, 3.5e6)]
}

/// Entropies from subcooled liquid to superheated vapour, J/(kg K).
fn pressure_entropy_input(i: u32) -> [f32; 2] {
    [pressure_input(i)[0], scrambled(i, 0.0, 9.5e3)]
}

/// Specific volumes from liquid to low-pressure vapour, m3/kg.
fn pressure_volume_input(i: u32) -> [f32; 2] {
    [
        pressure_input(i)[0],
        sweep_log((i * 37) % SWEEP, 9e-4, 250.0),
    ]
}

fn temperature_enthalpy_input(i: u32) -> [f32; 2] {
    [temperature_input(i)[0], scrambled(i, 0.0, 3.5e6)]
}

fn temperature_entropy_input(i: u32) -> [f32; 2] {
    [temperature_input(i)[0], scrambled(i, 0.0, 9.5e3)]
}

fn pressure_dryness_input(i: u32) -> [f32; 2] {
    [pressure_input(i)[0], scrambled(i, 0.0, 1.0)]
}

fn temperature_dryness_input(i: u32) -> [f32; 2] {
    [temperature_input(i)[0], scrambled(i, 0.0, 1.0)]
}

/// Gauge readings from vacuum to 220 bar(g), Pa, and a barometer, Pa.
fn gauge_ambient_input(i: u32) -> [f32; 2] {
    [sweep(i, -0.9e5, 2.2e7), scrambled(i, 0.95e5, 1.05e5)]
}

fn bar_input(i: u32) -> [f32; 2] {
    [sweep(i, -1.0, 221.0), 0.0]
}

fn celsius_input(i: u32) -> [f32; 2] {
    [sweep(i, -280.0, 380.0), 0.0]
}

/// Pressures over the single-phase envelope (611.657 Pa to 25 MPa, log
/// spaced, then p_b, its neighbour and one below and one above the range)
/// with temperatures over 273.16 to 1073.15 K in a scrambled order: liquid,
/// vapour, near-critical and supercritical points.
fn single_phase_pt_input(i: u32) -> [f32; 2] {
    [
        range_point(
            i,
            single_phase::PRESSURE_MIN_PA,
            single_phase::PRESSURE_MAX_PA,
            BOUNDARY_PRESSURE_PA,
            true,
        ),
        scrambled(
            i,
            single_phase::TEMPERATURE_MIN_K,
            single_phase::TEMPERATURE_MAX_K,
        ),
    ]
}

/// Positions over the low-pressure vapour sheet (x over its knots and a
/// little beyond both ends, y over 0 to 1 in a scrambled order).
fn sheet_input(i: u32) -> [f32; 2] {
    let sheet = &vapora_kernel::tables::single_phase::VAPOUR_LOW.properties;
    let span = sheet.x_intervals as f32 / sheet.x_inverse_step;
    [
        sweep(i, sheet.x_start - 0.01 * span, sheet.x_start + 1.01 * span),
        scrambled(i, 0.0, 1.0),
    ]
}

/// The same pressures with enthalpies from cold water to hot steam
/// (single phase and wet steam), J/kg.
fn single_phase_ph_input(i: u32) -> [f32; 2] {
    [single_phase_pt_input(i)[0], scrambled(i, 1.0e4, 4.1e6)]
}

/// The same pressures with entropies from cold water to hot steam, J/(kg K).
fn single_phase_ps_input(i: u32) -> [f32; 2] {
    [single_phase_pt_input(i)[0], scrambled(i, 10.0, 1.15e4)]
}

#[inline(never)]
fn call_state_at_pressure_temperature(x: [f32; 2]) -> u32 {
    match (pressure(x[0]), temperature(x[1])) {
        (Ok(p), Ok(t)) => consume(single_phase::state_at_pressure_temperature(p, t)),
        _ => ERROR_BITS,
    }
}

#[inline(never)]
fn call_state_at_pressure_enthalpy(x: [f32; 2]) -> u32 {
    match pressure(x[0]) {
        Ok(p) => consume(single_phase::state_at_pressure_enthalpy(p, x[1])),
        Err(e) => e,
    }
}

#[inline(never)]
fn call_state_at_pressure_entropy(x: [f32; 2]) -> u32 {
    match pressure(x[0]) {
        Ok(p) => consume(single_phase::state_at_pressure_entropy(p, x[1])),
        Err(e) => e,
    }
}

/// What an error result contributes to the checksum.
const ERROR_BITS: u32 = u32::MAX;

/// Passes the whole result through `black_box` (so every output is
/// computed and stored) and returns its status for the checksum.
fn consume<T, E>(r: Result<T, E>) -> u32 {
    let ok = r.is_ok();
    let _ = black_box(r);
    if ok {
        0
    } else {
        ERROR_BITS
    }
}

fn pressure(pa: f32) -> Result<AbsolutePressure, u32> {
    AbsolutePressure::from_pa(pa).map_err(|_| ERROR_BITS)
}

fn temperature(k: f32) -> Result<Temperature, u32> {
    Temperature::from_kelvin(k).map_err(|_| ERROR_BITS)
}

fn property(index: f32) -> SaturatedProperty {
    PROPERTIES
        .get(index as usize)
        .copied()
        .unwrap_or(SaturatedProperty::VapourCp)
}

#[inline(never)]
fn call_saturation_temperature(x: [f32; 2]) -> u32 {
    pressure(x[0]).map_or(ERROR_BITS, |p| {
        consume(vapora_kernel::saturation::saturation_temperature(p))
    })
}

#[inline(never)]
fn call_saturation_pressure(x: [f32; 2]) -> u32 {
    temperature(x[0]).map_or(ERROR_BITS, |t| {
        consume(vapora_kernel::saturation::saturation_pressure(t))
    })
}

#[inline(never)]
fn call_saturated_state_at_pressure(x: [f32; 2]) -> u32 {
    pressure(x[0]).map_or(ERROR_BITS, |p| {
        consume(vapora_kernel::saturation::saturated_state_at_pressure(p))
    })
}

#[inline(never)]
fn call_saturated_state_at_temperature(x: [f32; 2]) -> u32 {
    temperature(x[0]).map_or(ERROR_BITS, |t| {
        consume(vapora_kernel::saturation::saturated_state_at_temperature(t))
    })
}

#[inline(never)]
fn call_saturated_property_at_pressure(x: [f32; 2]) -> u32 {
    pressure(x[0]).map_or(ERROR_BITS, |p| {
        consume(vapora_kernel::saturation::saturated_property_at_pressure(
            p,
            property(x[1]),
        ))
    })
}

#[inline(never)]
fn call_saturated_property_at_temperature(x: [f32; 2]) -> u32 {
    temperature(x[0]).map_or(ERROR_BITS, |t| {
        consume(vapora_kernel::saturation::saturated_property_at_temperature(t, property(x[1])))
    })
}

#[inline(never)]
fn call_phase_from_pressure_enthalpy(x: [f32; 2]) -> u32 {
    pressure(x[0]).map_or(ERROR_BITS, |p| {
        consume(vapora_kernel::quality::phase_from_pressure_enthalpy(
            p, x[1],
        ))
    })
}

#[inline(never)]
fn call_phase_from_pressure_entropy(x: [f32; 2]) -> u32 {
    pressure(x[0]).map_or(ERROR_BITS, |p| {
        consume(vapora_kernel::quality::phase_from_pressure_entropy(p, x[1]))
    })
}

#[inline(never)]
fn call_phase_from_pressure_specific_volume(x: [f32; 2]) -> u32 {
    pressure(x[0]).map_or(ERROR_BITS, |p| {
        consume(vapora_kernel::quality::phase_from_pressure_specific_volume(
            p, x[1],
        ))
    })
}

#[inline(never)]
fn call_phase_from_temperature_enthalpy(x: [f32; 2]) -> u32 {
    temperature(x[0]).map_or(ERROR_BITS, |t| {
        consume(vapora_kernel::quality::phase_from_temperature_enthalpy(
            t, x[1],
        ))
    })
}

#[inline(never)]
fn call_phase_from_temperature_entropy(x: [f32; 2]) -> u32 {
    temperature(x[0]).map_or(ERROR_BITS, |t| {
        consume(vapora_kernel::quality::phase_from_temperature_entropy(
            t, x[1],
        ))
    })
}

#[inline(never)]
fn call_wet_steam_at_pressure(x: [f32; 2]) -> u32 {
    pressure(x[0]).map_or(ERROR_BITS, |p| {
        consume(vapora_kernel::mixture::wet_steam_at_pressure(p, x[1]))
    })
}

#[inline(never)]
fn call_wet_steam_at_temperature(x: [f32; 2]) -> u32 {
    temperature(x[0]).map_or(ERROR_BITS, |t| {
        consume(vapora_kernel::mixture::wet_steam_at_temperature(t, x[1]))
    })
}

#[inline(never)]
fn call_accuracy_at_saturation_temperature_k(x: [f32; 2]) -> u32 {
    let a = vapora_kernel::accuracy::accuracy_at_saturation_temperature_k(x[0]);
    black_box(a);
    0
}

#[inline(never)]
fn call_absolute_pressure_from_gauge(x: [f32; 2]) -> u32 {
    let gauge = GaugePressure::from_pa(x[0]);
    let ambient = AbsolutePressure::from_pa(x[1]);
    match (gauge, ambient) {
        (Ok(g), Ok(a)) => consume(AbsolutePressure::from_gauge(g, a)),
        _ => ERROR_BITS,
    }
}

#[inline(never)]
fn call_absolute_pressure_from_bar(x: [f32; 2]) -> u32 {
    consume(AbsolutePressure::from_bar(x[0]))
}

#[inline(never)]
fn call_temperature_from_celsius(x: [f32; 2]) -> u32 {
    consume(Temperature::from_celsius(x[0]))
}

#[inline(never)]
fn call_f64_saturation_temperature(x: [f32; 2]) -> u32 {
    consume(region4::saturation_temperature_k(f64::from(x[0])))
}

#[inline(never)]
fn call_f64_saturation_pressure(x: [f32; 2]) -> u32 {
    consume(region4::saturation_pressure_pa(f64::from(x[0])))
}

#[inline(never)]
fn call_f64_saturated_state_at_pressure(x: [f32; 2]) -> u32 {
    consume(if97_saturation::at_pressure(f64::from(x[0])))
}

/// Dryness fraction from (p, h) the direct way: both saturated states from
/// the formulation, then the lever rule x = (h − h′)/(h″ − h′).
#[inline(never)]
fn call_f64_phase_from_pressure_enthalpy(x: [f32; 2]) -> u32 {
    let h = f64::from(x[1]);
    consume(
        if97_saturation::at_pressure(f64::from(x[0])).map(|s| {
            (h - s.liquid.enthalpy_j_kg) / (s.vapour.enthalpy_j_kg - s.liquid.enthalpy_j_kg)
        }),
    )
}

/// One fuzzed kernel function as the corpus cost bench
/// (`src/bin/fuzz_cost.rs`) calls it: every input of the fuzz corpus
/// (`vectors/fuzz-corpus.bin`) goes through the entry of the function it
/// names. Where a [`KERNEL`] row measures the same call, the entry uses the
/// same wrapper, so the corpus worst case compares with the sweep's.
pub struct CorpusCall {
    /// Name as the fuzz target names it (`CHECKED_FUNCTIONS` in
    /// `host-tests/src/robustness.rs`).
    pub name: &'static str,
    /// The [`KERNEL`] row with the same wrapper, if any.
    pub sweep: Option<&'static str>,
    /// The wrapper's input from a corpus input (a, b, selector): the
    /// selector becomes the property index (mod 12) or the table (mod 2),
    /// as the fuzz target's checker uses it. Computed outside the markers.
    pub input: fn(f32, f32, u32) -> [f32; 2],
    /// The call measured (builds the unit types a caller must build).
    pub call: fn([f32; 2]) -> u32,
}

fn corpus_a_b(a: f32, b: f32, _selector: u32) -> [f32; 2] {
    [a, b]
}

fn corpus_a_property(a: f32, _b: f32, selector: u32) -> [f32; 2] {
    [a, (selector % 12) as f32]
}

fn corpus_a_table(a: f32, _b: f32, selector: u32) -> [f32; 2] {
    [a, (selector % 2) as f32]
}

const fn corpus(
    name: &'static str,
    sweep: Option<&'static str>,
    input: fn(f32, f32, u32) -> [f32; 2],
    call: fn([f32; 2]) -> u32,
) -> CorpusCall {
    CorpusCall {
        name,
        sweep,
        input,
        call,
    }
}

/// Every function the fuzz target chooses among, by its fuzz name.
pub const CORPUS_CALLS: &[CorpusCall] = &[
    corpus(
        "AbsolutePressure::from_pa",
        None,
        corpus_a_b,
        call_absolute_pressure_from_pa,
    ),
    corpus(
        "AbsolutePressure::from_kpa",
        None,
        corpus_a_b,
        call_absolute_pressure_from_kpa,
    ),
    corpus(
        "AbsolutePressure::from_bar",
        Some("absolute_pressure_from_bar"),
        corpus_a_b,
        call_absolute_pressure_from_bar,
    ),
    corpus(
        "AbsolutePressure::from_mpa",
        None,
        corpus_a_b,
        call_absolute_pressure_from_mpa,
    ),
    corpus(
        "AbsolutePressure::from_gauge",
        Some("absolute_pressure_from_gauge"),
        corpus_a_b,
        call_absolute_pressure_from_gauge,
    ),
    corpus(
        "AbsolutePressure::as_pa",
        None,
        corpus_a_b,
        call_absolute_pressure_as_pa,
    ),
    corpus(
        "AbsolutePressure::as_kpa",
        None,
        corpus_a_b,
        call_absolute_pressure_as_kpa,
    ),
    corpus(
        "AbsolutePressure::as_bar",
        None,
        corpus_a_b,
        call_absolute_pressure_as_bar,
    ),
    corpus(
        "AbsolutePressure::as_mpa",
        None,
        corpus_a_b,
        call_absolute_pressure_as_mpa,
    ),
    corpus(
        "AbsolutePressure::to_gauge",
        None,
        corpus_a_b,
        call_absolute_pressure_to_gauge,
    ),
    corpus(
        "GaugePressure::from_pa",
        None,
        corpus_a_b,
        call_gauge_pressure_from_pa,
    ),
    corpus(
        "GaugePressure::from_kpa",
        None,
        corpus_a_b,
        call_gauge_pressure_from_kpa,
    ),
    corpus(
        "GaugePressure::from_bar",
        None,
        corpus_a_b,
        call_gauge_pressure_from_bar,
    ),
    corpus(
        "GaugePressure::from_mpa",
        None,
        corpus_a_b,
        call_gauge_pressure_from_mpa,
    ),
    corpus(
        "GaugePressure::as_pa",
        None,
        corpus_a_b,
        call_gauge_pressure_as_pa,
    ),
    corpus(
        "GaugePressure::as_kpa",
        None,
        corpus_a_b,
        call_gauge_pressure_as_kpa,
    ),
    corpus(
        "GaugePressure::as_bar",
        None,
        corpus_a_b,
        call_gauge_pressure_as_bar,
    ),
    corpus(
        "GaugePressure::as_mpa",
        None,
        corpus_a_b,
        call_gauge_pressure_as_mpa,
    ),
    corpus(
        "Temperature::from_kelvin",
        None,
        corpus_a_b,
        call_temperature_from_kelvin,
    ),
    corpus(
        "Temperature::from_celsius",
        Some("temperature_from_celsius"),
        corpus_a_b,
        call_temperature_from_celsius,
    ),
    corpus(
        "Temperature::as_kelvin",
        None,
        corpus_a_b,
        call_temperature_as_kelvin,
    ),
    corpus(
        "Temperature::as_celsius",
        None,
        corpus_a_b,
        call_temperature_as_celsius,
    ),
    corpus(
        "saturation_temperature",
        Some("saturation_temperature"),
        corpus_a_b,
        call_saturation_temperature,
    ),
    corpus(
        "saturation_pressure",
        Some("saturation_pressure"),
        corpus_a_b,
        call_saturation_pressure,
    ),
    corpus(
        "saturated_state_at_pressure",
        Some("saturated_state_at_pressure"),
        corpus_a_b,
        call_saturated_state_at_pressure,
    ),
    corpus(
        "saturated_state_at_temperature",
        Some("saturated_state_at_temperature"),
        corpus_a_b,
        call_saturated_state_at_temperature,
    ),
    corpus(
        "saturated_property_at_pressure",
        Some("saturated_property_at_pressure"),
        corpus_a_property,
        call_saturated_property_at_pressure,
    ),
    corpus(
        "saturated_property_at_temperature",
        Some("saturated_property_at_temperature"),
        corpus_a_property,
        call_saturated_property_at_temperature,
    ),
    corpus(
        "Phase::dryness_fraction",
        None,
        corpus_a_b,
        call_phase_dryness_fraction,
    ),
    corpus(
        "phase_from_pressure_enthalpy",
        Some("phase_from_pressure_enthalpy"),
        corpus_a_b,
        call_phase_from_pressure_enthalpy,
    ),
    corpus(
        "phase_from_pressure_entropy",
        Some("phase_from_pressure_entropy"),
        corpus_a_b,
        call_phase_from_pressure_entropy,
    ),
    corpus(
        "phase_from_pressure_specific_volume",
        Some("phase_from_pressure_specific_volume"),
        corpus_a_b,
        call_phase_from_pressure_specific_volume,
    ),
    corpus(
        "phase_from_temperature_enthalpy",
        Some("phase_from_temperature_enthalpy"),
        corpus_a_b,
        call_phase_from_temperature_enthalpy,
    ),
    corpus(
        "phase_from_temperature_entropy",
        Some("phase_from_temperature_entropy"),
        corpus_a_b,
        call_phase_from_temperature_entropy,
    ),
    corpus(
        "wet_steam_at_pressure",
        Some("wet_steam_at_pressure"),
        corpus_a_b,
        call_wet_steam_at_pressure,
    ),
    corpus(
        "wet_steam_at_temperature",
        Some("wet_steam_at_temperature"),
        corpus_a_b,
        call_wet_steam_at_temperature,
    ),
    corpus(
        "accuracy_at_saturation_temperature_k",
        Some("accuracy_at_saturation_temperature_k"),
        corpus_a_b,
        call_accuracy_at_saturation_temperature_k,
    ),
    corpus(
        "UniformCubicTable::locate",
        None,
        corpus_a_table,
        call_uniform_locate_cubic,
    ),
    corpus(
        "OctaveCubicTable::locate",
        None,
        corpus_a_table,
        call_octave_locate_cubic,
    ),
    corpus("cubic", None, corpus_a_table, call_uniform_locate_cubic),
    // ---- trial merge (apps + sp + main): the single-phase functions (branch sp)
    corpus(
        "superheated_vapour",
        None,
        corpus_a_b,
        call_superheated_vapour,
    ),
    corpus(
        "compressed_liquid",
        None,
        corpus_a_b,
        call_compressed_liquid,
    ),
    corpus(
        "state_at_pressure_temperature",
        Some("single_phase_state_at_pressure_temperature"),
        corpus_a_b,
        call_state_at_pressure_temperature,
    ),
    corpus(
        "state_at_pressure_enthalpy",
        Some("single_phase_state_at_pressure_enthalpy"),
        corpus_a_b,
        call_state_at_pressure_enthalpy,
    ),
    corpus(
        "state_at_pressure_entropy",
        Some("single_phase_state_at_pressure_entropy"),
        corpus_a_b,
        call_state_at_pressure_entropy,
    ),
    corpus(
        "BicubicSheet::evaluate",
        Some("bicubic_sheet_evaluate"),
        corpus_a_b,
        call_sheet_evaluate,
    ),
    corpus(
        "BicubicSheet::evaluate_one",
        Some("bicubic_sheet_evaluate_one"),
        corpus_a_b,
        call_sheet_evaluate_one,
    ),
    // ---- application routines (branch apps): fixed settings, the
    // selector-chosen ones of the robustness checker's first variant.
    corpus(
        "steam_flowing_conditions",
        Some("steam_flowing_conditions"),
        corpus_a_b,
        call_steam_flowing_conditions,
    ),
    corpus(
        "water_flowing_conditions",
        Some("water_flowing_conditions"),
        corpus_a_b,
        call_water_flowing_conditions,
    ),
    corpus(
        "energy_flow_from_enthalpies_w",
        None,
        corpus_a_b,
        call_energy_flow_from_enthalpies_w,
    ),
    corpus(
        "energy_flow",
        Some("energy_flow"),
        corpus_a_b,
        call_energy_flow,
    ),
    corpus(
        "drum_level_from_densities",
        None,
        corpus_a_b,
        call_drum_level_from_densities,
    ),
    corpus(
        "drum_level",
        Some("drum_level"),
        corpus_a_b,
        call_drum_level,
    ),
    corpus(
        "throttling_calorimeter_dryness",
        Some("throttling_calorimeter_dryness"),
        corpus_a_b,
        call_throttling_calorimeter_dryness,
    ),
    corpus(
        "separating_throttling_dryness",
        None,
        corpus_a_b,
        call_separating_throttling_dryness,
    ),
];

// ---- trial merge: wrappers for the corpus entries above.
#[inline(never)]
fn call_superheated_vapour(x: [f32; 2]) -> u32 {
    match (pressure(x[0]), temperature(x[1])) {
        (Ok(p), Ok(t)) => consume(single_phase::superheated_vapour(p, t)),
        _ => ERROR_BITS,
    }
}

#[inline(never)]
fn call_compressed_liquid(x: [f32; 2]) -> u32 {
    match (pressure(x[0]), temperature(x[1])) {
        (Ok(p), Ok(t)) => consume(single_phase::compressed_liquid(p, t)),
        _ => ERROR_BITS,
    }
}

#[inline(never)]
fn call_sheet_evaluate(x: [f32; 2]) -> u32 {
    match vapora_kernel::tables::single_phase::VAPOUR_LOW
        .properties
        .evaluate(x[0], x[1])
    {
        // Every quantity through black_box, so none of the six is dropped.
        Some(v) => black_box(v)[0].to_bits(),
        None => ERROR_BITS,
    }
}

#[inline(never)]
fn call_sheet_evaluate_one(x: [f32; 2]) -> u32 {
    match vapora_kernel::tables::single_phase::VAPOUR_LOW
        .y_of_enthalpy
        .evaluate_one(x[0], x[1], 0)
    {
        Some(v) => value_bits(v),
        None => ERROR_BITS,
    }
}

fn drum_transmitter() -> vapora_kernel::drum_level::DrumLevelTransmitter {
    vapora_kernel::drum_level::DrumLevelTransmitter {
        tap_separation_m: 0.6,
        zero_level_above_lower_tap_m: 0.3,
        gravity_m_s2: vapora_kernel::drum_level::STANDARD_GRAVITY_M_S2,
        minimum_drum_pressure: AbsolutePressure::STANDARD_ATMOSPHERE,
    }
}

#[inline(never)]
fn call_steam_flowing_conditions(x: [f32; 2]) -> u32 {
    match (pressure(x[0]), temperature(x[1])) {
        (Ok(p), Ok(t)) => consume(vapora_kernel::flowing::steam_flowing_conditions(p, t, 5.0)),
        _ => ERROR_BITS,
    }
}

#[inline(never)]
fn call_water_flowing_conditions(x: [f32; 2]) -> u32 {
    match (pressure(x[0]), temperature(x[1])) {
        (Ok(p), Ok(t)) => consume(vapora_kernel::flowing::water_flowing_conditions(p, t, 5.0)),
        _ => ERROR_BITS,
    }
}

#[inline(never)]
fn call_energy_flow_from_enthalpies_w(x: [f32; 2]) -> u32 {
    consume(vapora_kernel::energy::energy_flow_from_enthalpies_w(
        x[0], x[1], 419.1e3,
    ))
}

#[inline(never)]
fn call_energy_flow(x: [f32; 2]) -> u32 {
    use vapora_kernel::energy::{energy_flow, SteamSupply};
    match (
        pressure(x[0]),
        temperature(x[1]),
        pressure(3.0e5),
        temperature(358.15),
    ) {
        (Ok(p), Ok(t), Ok(pw), Ok(tw)) => consume(energy_flow(
            1.39,
            SteamSupply::Superheated {
                pressure: p,
                temperature: t,
            },
            pw,
            tw,
        )),
        _ => ERROR_BITS,
    }
}

#[inline(never)]
fn call_drum_level_from_densities(x: [f32; 2]) -> u32 {
    consume(vapora_kernel::drum_level::drum_level_from_densities(
        x[0],
        &drum_transmitter(),
        880.4,
        5.887,
        x[1],
    ))
}

#[inline(never)]
fn call_drum_level(x: [f32; 2]) -> u32 {
    match (pressure(x[0]), temperature(318.15)) {
        (Ok(p), Ok(leg)) => consume(vapora_kernel::drum_level::drum_level(
            p,
            x[1],
            leg,
            &drum_transmitter(),
        )),
        _ => ERROR_BITS,
    }
}

#[inline(never)]
fn call_throttling_calorimeter_dryness(x: [f32; 2]) -> u32 {
    match (pressure(1_151_325.0), pressure(x[0]), temperature(x[1])) {
        (Ok(line), Ok(p), Ok(t)) => consume(
            vapora_kernel::calorimeter::throttling_calorimeter_dryness(line, p, t),
        ),
        _ => ERROR_BITS,
    }
}

#[inline(never)]
fn call_separating_throttling_dryness(x: [f32; 2]) -> u32 {
    match (
        pressure(1_151_325.0),
        pressure(101_325.0),
        temperature(385.15),
    ) {
        (Ok(line), Ok(p), Ok(t)) => consume(
            vapora_kernel::calorimeter::separating_throttling_dryness(line, p, t, x[0], x[1]),
        ),
        _ => ERROR_BITS,
    }
}

/// The bits of a value, through `black_box` so it is computed.
fn value_bits(v: f32) -> u32 {
    black_box(v).to_bits()
}

#[inline(never)]
fn call_absolute_pressure_from_pa(x: [f32; 2]) -> u32 {
    consume(AbsolutePressure::from_pa(x[0]))
}

#[inline(never)]
fn call_absolute_pressure_from_kpa(x: [f32; 2]) -> u32 {
    consume(AbsolutePressure::from_kpa(x[0]))
}

#[inline(never)]
fn call_absolute_pressure_from_mpa(x: [f32; 2]) -> u32 {
    consume(AbsolutePressure::from_mpa(x[0]))
}

#[inline(never)]
fn call_absolute_pressure_as_pa(x: [f32; 2]) -> u32 {
    pressure(x[0]).map_or(ERROR_BITS, |p| value_bits(p.as_pa()))
}

#[inline(never)]
fn call_absolute_pressure_as_kpa(x: [f32; 2]) -> u32 {
    pressure(x[0]).map_or(ERROR_BITS, |p| value_bits(p.as_kpa()))
}

#[inline(never)]
fn call_absolute_pressure_as_bar(x: [f32; 2]) -> u32 {
    pressure(x[0]).map_or(ERROR_BITS, |p| value_bits(p.as_bar()))
}

#[inline(never)]
fn call_absolute_pressure_as_mpa(x: [f32; 2]) -> u32 {
    pressure(x[0]).map_or(ERROR_BITS, |p| value_bits(p.as_mpa()))
}

#[inline(never)]
fn call_absolute_pressure_to_gauge(x: [f32; 2]) -> u32 {
    match (pressure(x[0]), pressure(x[1])) {
        (Ok(p), Ok(ambient)) => value_bits(p.to_gauge(ambient).as_pa()),
        _ => ERROR_BITS,
    }
}

#[inline(never)]
fn call_gauge_pressure_from_pa(x: [f32; 2]) -> u32 {
    consume(GaugePressure::from_pa(x[0]))
}

#[inline(never)]
fn call_gauge_pressure_from_kpa(x: [f32; 2]) -> u32 {
    consume(GaugePressure::from_kpa(x[0]))
}

#[inline(never)]
fn call_gauge_pressure_from_bar(x: [f32; 2]) -> u32 {
    consume(GaugePressure::from_bar(x[0]))
}

#[inline(never)]
fn call_gauge_pressure_from_mpa(x: [f32; 2]) -> u32 {
    consume(GaugePressure::from_mpa(x[0]))
}

#[inline(never)]
fn call_gauge_pressure_as_pa(x: [f32; 2]) -> u32 {
    GaugePressure::from_pa(x[0]).map_or(ERROR_BITS, |g| value_bits(g.as_pa()))
}

#[inline(never)]
fn call_gauge_pressure_as_kpa(x: [f32; 2]) -> u32 {
    GaugePressure::from_pa(x[0]).map_or(ERROR_BITS, |g| value_bits(g.as_kpa()))
}

#[inline(never)]
fn call_gauge_pressure_as_bar(x: [f32; 2]) -> u32 {
    GaugePressure::from_pa(x[0]).map_or(ERROR_BITS, |g| value_bits(g.as_bar()))
}

#[inline(never)]
fn call_gauge_pressure_as_mpa(x: [f32; 2]) -> u32 {
    GaugePressure::from_pa(x[0]).map_or(ERROR_BITS, |g| value_bits(g.as_mpa()))
}

#[inline(never)]
fn call_temperature_from_kelvin(x: [f32; 2]) -> u32 {
    consume(Temperature::from_kelvin(x[0]))
}

#[inline(never)]
fn call_temperature_as_kelvin(x: [f32; 2]) -> u32 {
    temperature(x[0]).map_or(ERROR_BITS, |t| value_bits(t.as_kelvin()))
}

#[inline(never)]
fn call_temperature_as_celsius(x: [f32; 2]) -> u32 {
    temperature(x[0]).map_or(ERROR_BITS, |t| value_bits(t.as_celsius()))
}

/// The dryness fraction of the phase from (p, h), as a caller reads it.
#[inline(never)]
fn call_phase_dryness_fraction(x: [f32; 2]) -> u32 {
    pressure(x[0]).map_or(
        ERROR_BITS,
        |p| match vapora_kernel::quality::phase_from_pressure_enthalpy(p, x[1]) {
            Ok(phase) => black_box(phase.dryness_fraction()).map_or(0, f32::to_bits),
            Err(_) => ERROR_BITS,
        },
    )
}

/// Every quantity of the located interval, evaluated.
fn evaluate_located<const P: usize>(located: Option<(&[[f32; 4]; P], f32)>) -> u32 {
    match located {
        None => ERROR_BITS,
        Some((block, t)) => block.iter().fold(0u32, |acc, c| {
            acc.rotate_left(3) ^ value_bits(vapora_kernel::spline::cubic(c, t))
        }),
    }
}

/// `x[1]` = 0: STATE_LOW, else STATE_HIGH (the uniform tables).
#[inline(never)]
fn call_uniform_locate_cubic(x: [f32; 2]) -> u32 {
    use vapora_kernel::tables::saturation::{STATE_HIGH, STATE_LOW};
    if x[1] == 0.0 {
        evaluate_located(STATE_LOW.locate(x[0]))
    } else {
        evaluate_located(STATE_HIGH.locate(x[0]))
    }
}

/// `x[1]` = 0: TEMPERATURE_LOW, else TEMPERATURE_HIGH (the octave tables).
#[inline(never)]
fn call_octave_locate_cubic(x: [f32; 2]) -> u32 {
    use vapora_kernel::tables::saturation::{TEMPERATURE_HIGH, TEMPERATURE_LOW};
    if x[1] == 0.0 {
        evaluate_located(TEMPERATURE_LOW.locate(x[0]))
    } else {
        evaluate_located(TEMPERATURE_HIGH.locate(x[0]))
    }
}
