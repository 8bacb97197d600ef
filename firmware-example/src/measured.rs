//! The one place that lists the functions whose cost `src/bin/cost.rs`
//! measures and `scripts/measure-cost.sh` tabulates: [`KERNEL`] for the
//! kernel's public functions, [`STAND_INS`] for reference points. Adding a
//! function is one entry plus its two small adapters (`*_input`, `call_*`).
//!
//! Until the kernel's functions land, [`KERNEL`] is empty and the stand-ins,
//! which exist today, prove the pipeline end to end: `libm::logf` and
//! `libm::expf` (the kind of call the kernel's spline evaluation makes) and
//! a 20-term Horner polynomial in f32 and in f64 (the f64 one is what a
//! direct double-precision formulation costs on a core without a double
//! FPU).

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

/// The kernel's functions, measured first. Empty until the kernel's
/// saturation functions land; `scripts/measure-cost.sh` also builds the
/// bench without them (feature `without-kernel`) and takes the kernel's
/// flash and static RAM as the difference between the two images.
pub const KERNEL: &[Measured] = &[
    Measured {
        name: "saturation_temperature",
        calls: SWEEP,
        input: pressure_input,
        call: call_saturation_temperature,
    },
    Measured {
        name: "saturated_state_at_pressure",
        calls: SWEEP,
        input: pressure_input,
        call: call_saturated_state_at_pressure,
    },
    Measured {
        name: "wet_steam_at_pressure",
        calls: SWEEP,
        input: pressure_dryness_input,
        call: call_wet_steam_at_pressure,
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

/// Absolute pressures over the kernel's whole saturation range, Pa.
fn pressure_input(i: u32) -> [f32; 2] {
    use vapora_kernel::saturation::{PRESSURE_MAX_PA, PRESSURE_MIN_PA};
    // Clamped: exp(log(x)) in f32 can land just outside the range.
    let p = sweep_log(i, PRESSURE_MIN_PA, PRESSURE_MAX_PA).clamp(PRESSURE_MIN_PA, PRESSURE_MAX_PA);
    [p, 0.0]
}

fn pressure_dryness_input(i: u32) -> [f32; 2] {
    [pressure_input(i)[0], sweep(i, 0.0, 1.0)]
}

/// What an error result contributes to the checksum.
const ERROR_BITS: u32 = u32::MAX;

#[inline(never)]
fn call_saturation_temperature(x: [f32; 2]) -> u32 {
    vapora_kernel::units::AbsolutePressure::from_pa(x[0])
        .ok()
        .and_then(|p| vapora_kernel::saturation::saturation_temperature(p).ok())
        .map_or(ERROR_BITS, |t| t.as_kelvin().to_bits())
}

#[inline(never)]
fn call_saturated_state_at_pressure(x: [f32; 2]) -> u32 {
    vapora_kernel::units::AbsolutePressure::from_pa(x[0])
        .ok()
        .and_then(|p| vapora_kernel::saturation::saturated_state_at_pressure(p).ok())
        .map_or(ERROR_BITS, |s| {
            s.vapour.enthalpy_j_kg.to_bits()
                ^ s.liquid.density_kg_m3.to_bits()
                ^ s.vapour.density_kg_m3.to_bits()
        })
}

#[inline(never)]
fn call_wet_steam_at_pressure(x: [f32; 2]) -> u32 {
    vapora_kernel::units::AbsolutePressure::from_pa(x[0])
        .ok()
        .and_then(|p| vapora_kernel::mixture::wet_steam_at_pressure(p, x[1]).ok())
        .map_or(ERROR_BITS, |w| {
            w.enthalpy_j_kg.to_bits() ^ w.density_kg_m3.to_bits()
        })
}
