//! The bit-identity vector file: inputs across the range of every public
//! kernel function (edge cases and error inputs included) with the exact
//! f32 bits (or error code and payload) the kernel returns on the host.
//!
//! The firmware test `firmware-example/src/bin/bit_identity.rs` embeds the
//! file and recomputes every vector on each emulated Cortex-M core. The
//! uniform calls are the firmware's own `src/kernel_calls.rs`, compiled here
//! too, so both sides encode results identically.
//!
//! File layout (all integers little-endian):
//!
//! ```text
//! b"VKBV"                      magic
//! u32 header_len, header       UTF-8 text: description lines starting "# ",
//!                              then one line per function (its index order)
//! u32 record_count
//! records: u8 function, u8 words, f32 bits input0, f32 bits input1,
//!          `words` × u32 (status word, then output bits)
//! ```
//!
//! Written by `cargo run -p vapora-host-tests --bin write-kernel-vectors`;
//! `host-tests/tests/kernel_vectors_current.rs` fails if the committed file
//! differs from what the current kernel gives.

#[path = "../../firmware-example/src/kernel_calls.rs"]
pub mod kernel_calls;

use kernel_calls::{KernelCall, CALLS, PROPERTIES};
use vapora_kernel::saturation::{
    saturated_property_at_pressure, saturated_property_at_temperature, SaturatedProperty,
    PRESSURE_MAX_PA, PRESSURE_MIN_PA, TEMPERATURE_MAX_K, TEMPERATURE_MIN_K,
};
use vapora_kernel::units::{AbsolutePressure, Temperature};

/// Path of the committed vector file, relative to the repository root.
pub const VECTOR_FILE: &str = "firmware-example/vectors/kernel-bits.bin";

fn next_up(x: f32) -> f32 {
    if x >= 0.0 {
        f32::from_bits(x.to_bits() + 1)
    } else {
        f32::from_bits(x.to_bits() - 1)
    }
}

fn next_down(x: f32) -> f32 {
    -next_up(-x)
}

/// A value and its two neighbours in f32.
fn around(x: f32) -> [f32; 3] {
    [next_down(x), x, next_up(x)]
}

/// Inputs every constructor must reject or accept without panicking.
const NON_FINITE_AND_SIGNS: [f32; 8] = [
    f32::NAN,
    f32::INFINITY,
    f32::NEG_INFINITY,
    -1.0,
    -0.0,
    0.0,
    f32::MIN_POSITIVE,
    f32::MAX,
];

/// `n` pressures spaced evenly in ln p over the kernel's range.
fn pressure_sweep(n: usize) -> Vec<f32> {
    let (lo, hi) = (
        f64::from(PRESSURE_MIN_PA).ln(),
        f64::from(PRESSURE_MAX_PA).ln(),
    );
    (0..n)
        .map(|i| {
            let p = (lo + (hi - lo) * i as f64 / (n - 1) as f64).exp() as f32;
            p.clamp(PRESSURE_MIN_PA, PRESSURE_MAX_PA)
        })
        .collect()
}

/// `n` temperatures spaced evenly over the kernel's range, K.
fn temperature_sweep(n: usize) -> Vec<f32> {
    let (lo, hi) = (f64::from(TEMPERATURE_MIN_K), f64::from(TEMPERATURE_MAX_K));
    (0..n)
        .map(|i| (lo + (hi - lo) * i as f64 / (n - 1) as f64) as f32)
        .collect()
}

/// Pressure edge cases: errors, range ends and their neighbours, the
/// 623.15 K hand-over of IF97 (psat there), the critical pressure.
fn pressure_edges() -> Vec<f32> {
    let mut v = NON_FINITE_AND_SIGNS.to_vec();
    v.extend([1.0, 611.0, 1.0e3, 101_325.0, 1.0e6, 3.0e7]);
    v.extend(around(PRESSURE_MIN_PA));
    v.extend(around(PRESSURE_MAX_PA));
    v.extend(around(
        vapora_kernel::tables::saturation::BOUNDARY_PRESSURE_PA,
    ));
    v
}

/// Temperature edge cases, K.
fn temperature_edges() -> Vec<f32> {
    let mut v = NON_FINITE_AND_SIGNS.to_vec();
    v.extend([1.0, 273.15, 300.0, 373.124, 700.0, 2000.0]);
    v.extend(around(TEMPERATURE_MIN_K));
    v.extend(around(TEMPERATURE_MAX_K));
    v.extend(around(
        vapora_kernel::tables::saturation::BOUNDARY_TEMPERATURE_K,
    ));
    v.extend(around(vapora_kernel::accuracy::NEAR_CRITICAL_START_K));
    v.extend(around(vapora_kernel::accuracy::STATED_ACCURACY_END_K));
    v
}

/// Dryness fractions the lever rule and the phase bands see, in terms of
/// the two saturated values `y_l`, `y_v` of a property: inside the dome,
/// at both ends, on both sides of the 1e-5 tolerance bands, and outside.
fn lever_points(y_l: f32, y_v: f32) -> Vec<f32> {
    let mut v: Vec<f32> = [
        -0.2f32, -2e-5, -0.5e-5, 0.0, 0.5e-5, 2e-5, 0.5, 0.99998, 0.999995, 1.0, 1.000005, 1.00002,
        1.5,
    ]
    .iter()
    .map(|&x| y_l + x * (y_v - y_l))
    .collect();
    v.extend([y_l, y_v, f32::NAN, f32::INFINITY]);
    v
}

fn property_at_p(p: f32, property: SaturatedProperty) -> Option<f32> {
    let p = AbsolutePressure::from_pa(p).ok()?;
    saturated_property_at_pressure(p, property).ok()
}

fn property_at_t(t: f32, property: SaturatedProperty) -> Option<f32> {
    let t = Temperature::from_kelvin(t).ok()?;
    saturated_property_at_temperature(t, property).ok()
}

/// First inputs of two-input calls: a shorter sweep, an error input and
/// the range ends with their neighbours (the file must fit the 256 KiB of
/// flash of the Cortex-M0 board with the firmware).
fn pressures_2d() -> Vec<f32> {
    let mut v = pressure_sweep(12);
    v.extend([f32::NAN, -1.0]);
    v.extend(around(PRESSURE_MIN_PA));
    v.extend(around(PRESSURE_MAX_PA));
    v.extend(around(
        vapora_kernel::tables::saturation::BOUNDARY_PRESSURE_PA,
    ));
    v
}

fn temperatures_2d() -> Vec<f32> {
    let mut v = temperature_sweep(12);
    v.extend([f32::NAN, -1.0]);
    v.extend(around(TEMPERATURE_MIN_K));
    v.extend(around(TEMPERATURE_MAX_K));
    v.extend(around(
        vapora_kernel::tables::saturation::BOUNDARY_TEMPERATURE_K,
    ));
    v.push(vapora_kernel::accuracy::NEAR_CRITICAL_START_K);
    v
}

/// Second inputs of a phase call at `first`: lever points between the two
/// saturated values of the property (or fixed values where there are none).
fn phase_inputs(
    first: f32,
    liquid: SaturatedProperty,
    vapour: SaturatedProperty,
    at: fn(f32, SaturatedProperty) -> Option<f32>,
    fallback: [f32; 2],
) -> Vec<f32> {
    match (at(first, liquid), at(first, vapour)) {
        (Some(l), Some(v)) => lever_points(l, v),
        _ => lever_points(fallback[0], fallback[1]),
    }
}

/// The inputs of every call, in [`CALLS`] order (matched by name).
fn inputs_of(call: &KernelCall) -> Vec<[f32; 2]> {
    use SaturatedProperty as P;
    let single = |xs: Vec<f32>| xs.into_iter().map(|x| [x, 0.0]).collect::<Vec<_>>();
    let mut pressures = pressure_sweep(64);
    pressures.extend(pressure_edges());
    let mut temperatures = temperature_sweep(64);
    temperatures.extend(temperature_edges());
    let props = |firsts: Vec<f32>| {
        firsts
            .iter()
            .flat_map(|&f| (0..PROPERTIES.len()).map(move |i| [f, i as f32]))
            .collect::<Vec<_>>()
    };
    let phase =
        |firsts: Vec<f32>, l: P, v: P, at: fn(f32, P) -> Option<f32>, fallback: [f32; 2]| {
            firsts
                .iter()
                .flat_map(|&f| {
                    phase_inputs(f, l, v, at, fallback)
                        .into_iter()
                        .map(move |y| [f, y])
                })
                .collect::<Vec<_>>()
        };
    let dryness = [
        f32::NAN,
        -0.01,
        -0.0,
        0.0,
        1e-6,
        0.25,
        0.5,
        0.9,
        0.999_999,
        1.0,
        next_up(1.0),
    ];
    let mixture = |firsts: Vec<f32>| {
        firsts
            .iter()
            .flat_map(|&f| dryness.iter().map(move |&x| [f, x]))
            .collect::<Vec<_>>()
    };
    // Unit conversions: signs, non-finite values, and a decade sweep.
    let mut unit_values = NON_FINITE_AND_SIGNS.to_vec();
    unit_values.extend([
        1e-30, 1e-3, 0.101_325, 1.0, 22.064, 101.325, 273.15, 1e5, 1e38,
    ]);
    unit_values.extend((0..20).map(|i| 10f32.powf(i as f32 * 0.5 - 2.0) * 1.234_567));
    unit_values.extend([-273.15, -273.16, -300.0, -1e5]);
    let pairs = |a: &[f32], b: &[f32]| {
        a.iter()
            .flat_map(|&x| b.iter().map(move |&y| [x, y]))
            .collect::<Vec<_>>()
    };
    let gauge = [-2e5, -101_325.0, -1.0, 0.0, 1e5, 9.31e5, 2.2e7, f32::NAN];
    let ambient = [-1.0, 0.0, 95e3, 101_325.0, f32::INFINITY];
    let name = call.name;
    match name.split('(').next().unwrap_or(name) {
        "saturation_temperature" | "saturated_state_at_pressure" => single(pressures),
        "saturation_pressure"
        | "saturated_state_at_temperature"
        | "accuracy_at_saturation_temperature_k" => single(temperatures),
        "saturated_property_at_pressure" => props(pressures_2d()),
        "saturated_property_at_temperature" => props(temperatures_2d()),
        "phase_from_pressure_enthalpy" => phase(
            pressures_2d(),
            P::LiquidEnthalpy,
            P::VapourEnthalpy,
            property_at_p,
            [1e5, 2.6e6],
        ),
        "phase_from_pressure_entropy" => phase(
            pressures_2d(),
            P::LiquidEntropy,
            P::VapourEntropy,
            property_at_p,
            [1e3, 6e3],
        ),
        "phase_from_pressure_specific_volume" => phase(
            pressures_2d(),
            P::LiquidSpecificVolume,
            P::VapourSpecificVolume,
            property_at_p,
            [1e-3, 0.2],
        ),
        "phase_from_temperature_enthalpy" => phase(
            temperatures_2d(),
            P::LiquidEnthalpy,
            P::VapourEnthalpy,
            property_at_t,
            [1e5, 2.6e6],
        ),
        "phase_from_temperature_entropy" => phase(
            temperatures_2d(),
            P::LiquidEntropy,
            P::VapourEntropy,
            property_at_t,
            [1e3, 6e3],
        ),
        "wet_steam_at_pressure" => mixture(pressures_2d()),
        "wet_steam_at_temperature" => mixture(temperatures_2d()),
        "UniformCubicTable::locate,cubic" => single(temperatures),
        // Inside the table only: outside it the position is documented as
        // meaningless (the callers' range checks keep inputs inside).
        "OctaveCubicTable::locate,cubic" => single(
            pressure_sweep(64)
                .into_iter()
                .filter(|&p| p < vapora_kernel::tables::saturation::BOUNDARY_PRESSURE_PA)
                .collect(),
        ),
        "AbsolutePressure::from_gauge" => pairs(&gauge, &ambient),
        "AbsolutePressure::to_gauge" => pairs(&[0.0, 611.0, 1e5, 1.03e6, 2.2e7, -1.0], &ambient),
        _ => single(unit_values),
    }
}

/// Every vector: (function index, inputs).
pub fn vector_inputs() -> Vec<(usize, [f32; 2])> {
    CALLS
        .iter()
        .enumerate()
        .flat_map(|(i, call)| inputs_of(call).into_iter().map(move |x| (i, x)))
        .collect()
}

/// The header text: description, then one function name per line.
pub fn header() -> String {
    let mut h = String::new();
    h.push_str(
        "# vapora kernel bit-identity vectors, format 1 (see host-tests/src/bit_vectors.rs)\n",
    );
    h.push_str(
        "# generated by: cargo run -p vapora-host-tests --bin write-kernel-vectors; do not edit\n",
    );
    h.push_str(&format!(
        "# kernel vapora-kernel {}; {} functions follow, in index order\n",
        env!("CARGO_PKG_VERSION"),
        CALLS.len()
    ));
    for call in CALLS {
        h.push_str(call.name);
        h.push('\n');
    }
    h
}

/// The whole vector file, computed with the kernel on this machine.
pub fn generate() -> Vec<u8> {
    let header = header();
    let inputs = vector_inputs();
    let mut out = Vec::new();
    out.extend_from_slice(b"VKBV");
    out.extend_from_slice(&(header.len() as u32).to_le_bytes());
    out.extend_from_slice(header.as_bytes());
    out.extend_from_slice(&(inputs.len() as u32).to_le_bytes());
    for (i, x) in inputs {
        let result = (CALLS[i].eval)(x);
        let words = result.as_slice();
        out.push(i as u8);
        out.push(words.len() as u8);
        out.extend_from_slice(&x[0].to_bits().to_le_bytes());
        out.extend_from_slice(&x[1].to_bits().to_le_bytes());
        for w in words {
            out.extend_from_slice(&w.to_le_bytes());
        }
    }
    out
}
