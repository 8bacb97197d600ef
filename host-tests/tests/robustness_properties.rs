//! Every public kernel function on arbitrary f32 bit patterns and on the
//! edge values of every range: each result is a typed error or an `Ok`
//! holding finite values inside the physical range of its property. The
//! property and the ranges are in `vapora_host_tests::robustness` (shared
//! with the fuzz target in kernel/fuzz).

use proptest::prelude::*;
use vapora_host_tests::robustness::{check, check_state, input_shape, CHECKED_FUNCTIONS};
use vapora_kernel::quality::SATURATION_TOLERANCE;
use vapora_kernel::saturation::{
    saturated_state_at_pressure, saturated_state_at_temperature, PRESSURE_MAX_PA, PRESSURE_MIN_PA,
    TEMPERATURE_MAX_K, TEMPERATURE_MIN_K,
};
use vapora_kernel::tables::saturation as table;
use vapora_kernel::units::{AbsolutePressure, Temperature};

/// The next f32 towards +∞ (f32::next_up needs Rust 1.86; MSRV is 1.85).
fn up(x: f32) -> f32 {
    if x.is_nan() || x == f32::INFINITY {
        x
    } else if x == 0.0 {
        f32::from_bits(1)
    } else if x > 0.0 {
        f32::from_bits(x.to_bits() + 1)
    } else {
        f32::from_bits(x.to_bits() - 1)
    }
}

/// The next f32 towards −∞.
fn down(x: f32) -> f32 {
    -up(-x)
}

/// The value and its neighbours one ulp either side.
fn around(x: f32) -> [f32; 3] {
    [down(x), x, up(x)]
}

/// Edge values for any input: NaNs, infinities, zeros, subnormals, the
/// largest finite values, and one ulp inside and outside every limit the
/// kernel has (triple and critical points, the 623.15 K table boundary,
/// dryness fraction 0 and 1, the saturation tolerance band, 0 °C, the
/// overflow limits of the unit conversions).
fn edge_values() -> Vec<f32> {
    let mut v = vec![
        f32::from_bits(0x7fc0_0000), // quiet NaN
        f32::from_bits(0xffc0_0000), // negative quiet NaN
        f32::from_bits(0x7f80_0001), // signalling NaN
        f32::from_bits(0x7fa0_0000), // signalling NaN, other payload
        f32::from_bits(0xff80_0001), // negative signalling NaN
        f32::INFINITY,
        f32::NEG_INFINITY,
        0.0,
        -0.0,
        f32::from_bits(1),           // smallest subnormal
        f32::from_bits(0x007f_ffff), // largest subnormal
        -f32::from_bits(1),
        -f32::from_bits(0x007f_ffff),
        f32::MIN_POSITIVE,
        -f32::MIN_POSITIVE,
        f32::MAX,
        f32::MIN,
        f32::EPSILON,
        1.0,
        -1.0,
    ];
    for x in [
        TEMPERATURE_MIN_K,
        TEMPERATURE_MAX_K,
        PRESSURE_MIN_PA,
        PRESSURE_MAX_PA,
        table::BOUNDARY_TEMPERATURE_K,
        table::BOUNDARY_PRESSURE_PA,
        table::CRITICAL_TEMPERATURE_K,
        table::CRITICAL_PRESSURE_PA,
        0.0,
        1.0,
        SATURATION_TOLERANCE,
        1.0 - SATURATION_TOLERANCE,
        -SATURATION_TOLERANCE,
        1.0 + SATURATION_TOLERANCE,
        -273.15,
        TEMPERATURE_MIN_K - 273.15,
        TEMPERATURE_MAX_K - 273.15,
        PRESSURE_MIN_PA / 1e3,
        PRESSURE_MAX_PA / 1e6,
        f32::MAX / 1e3,
        f32::MAX / 1e5,
        f32::MAX / 1e6,
        // Spline variables at the ends of the tables.
        table::STATE_HIGH.start,
    ] {
        v.extend(around(x));
    }
    // The octave tables look up the bit pattern of p (or of q = pc − p):
    // their first knots and every power of two (an octave's edge) in range.
    for tab in [&table::TEMPERATURE_LOW, &table::TEMPERATURE_HIGH] {
        let first = f32::from_bits(tab.first << tab.shift);
        let end = f32::from_bits((tab.first + tab.intervals.len() as u32) << tab.shift);
        v.extend(around(first));
        v.extend(around(end));
        v.extend(around(table::CRITICAL_PRESSURE_PA - first));
    }
    for k in 1..=25 {
        let power = (1u32 << k) as f32;
        v.extend(around(power));
        v.extend(around(table::CRITICAL_PRESSURE_PA - power));
    }
    // The saturated values of the second property at both ends and at the
    // table boundary, one ulp either side: the phase classification's edges.
    for s in [
        saturated_state_at_temperature(Temperature::from_kelvin(TEMPERATURE_MIN_K).unwrap()),
        saturated_state_at_temperature(Temperature::from_kelvin(TEMPERATURE_MAX_K).unwrap()),
        saturated_state_at_pressure(
            AbsolutePressure::from_pa(table::BOUNDARY_PRESSURE_PA).unwrap(),
        ),
        saturated_state_at_pressure(AbsolutePressure::from_pa(1e6).unwrap()),
    ] {
        let s = s.unwrap();
        for x in [
            s.liquid.enthalpy_j_kg,
            s.vapour.enthalpy_j_kg,
            s.liquid.entropy_j_kgk,
            s.vapour.entropy_j_kgk,
            s.liquid.specific_volume_m3_kg,
            s.vapour.specific_volume_m3_kg,
        ] {
            v.extend(around(x));
        }
    }
    v
}

/// Every function that reads an input, on (a, b, selector).
fn check_all(a: f32, b: f32, selector: u32) -> Result<(), String> {
    for name in CHECKED_FUNCTIONS {
        if input_shape(name).a {
            check(name, a, b, selector).map_err(|e| describe(name, a, b, selector, &e))?;
        }
    }
    Ok(())
}

fn describe(name: &str, a: f32, b: f32, selector: u32, e: &str) -> String {
    format!(
        "{name}(a = {a:e} [{:#010x}], b = {b:e} [{:#010x}], selector {selector}): {e}",
        a.to_bits(),
        b.to_bits()
    )
}

#[test]
fn every_edge_value_gives_a_typed_error_or_a_physical_result() {
    let edges = edge_values();
    let mut failures = Vec::new();
    let mut calls = 0usize;
    for name in CHECKED_FUNCTIONS {
        let shape = input_shape(name);
        let a_values: &[f32] = if shape.a { &edges } else { &[0.0] };
        let b_values: &[f32] = if shape.b { &edges } else { &[0.0] };
        for &a in a_values {
            for &b in b_values {
                for selector in 0..shape.selectors {
                    calls += 1;
                    if let Err(e) = check(name, a, b, selector) {
                        failures.push(describe(name, a, b, selector, &e));
                    }
                }
            }
        }
    }
    println!("{} edge values, {calls} calls", edges.len());
    assert!(
        failures.is_empty(),
        "{} failures, the first ones:\n{}",
        failures.len(),
        failures[..failures.len().min(20)].join("\n")
    );
}

/// Inputs: arbitrary bits, edge values, or values inside the line's range
/// (uniform bits rarely land there).
fn input() -> impl Strategy<Value = f32> {
    let edges = edge_values();
    prop_oneof![
        any::<u32>().prop_map(f32::from_bits),
        proptest::sample::select(edges),
        (TEMPERATURE_MIN_K..=TEMPERATURE_MAX_K),
        (PRESSURE_MIN_PA.ln()..=PRESSURE_MAX_PA.ln()).prop_map(f32::exp),
        (-1e4f32..3e6),
        (-0.5f32..1.5),
    ]
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(20_000))]

    #[test]
    fn arbitrary_bit_patterns_give_a_typed_error_or_a_physical_result(
        a in any::<u32>(), b in any::<u32>(), selector in any::<u32>(),
    ) {
        let r = check_all(f32::from_bits(a), f32::from_bits(b), selector);
        prop_assert!(r.is_ok(), "{}", r.unwrap_err());
    }

    #[test]
    fn mixed_inputs_give_a_typed_error_or_a_physical_result(
        a in input(), b in input(), selector in any::<u32>(),
    ) {
        let r = check_all(a, b, selector);
        prop_assert!(r.is_ok(), "{}", r.unwrap_err());
    }
}

/// The property can fail: results outside the ranges are caught.
#[test]
fn the_checker_rejects_results_outside_the_physical_ranges() {
    let good = saturated_state_at_pressure(AbsolutePressure::from_pa(1e6).unwrap()).unwrap();
    assert_eq!(check_state(&good), Ok(()));
    for bad in [f32::NAN, f32::INFINITY, -1.0, 0.0, 2000.0] {
        let mut s = good;
        s.vapour.density_kg_m3 = bad;
        assert!(check_state(&s).is_err(), "vapour density {bad} accepted");
        let mut s = good;
        s.liquid.enthalpy_j_kg = if bad == 2000.0 { 3e6 } else { bad * 1e3 };
        assert!(
            check_state(&s).is_err() || bad == 0.0,
            "liquid enthalpy {} accepted",
            s.liquid.enthalpy_j_kg
        );
    }
    let mut s = good;
    s.latent_heat_j_kg = -1.0;
    assert!(check_state(&s).is_err(), "negative latent heat accepted");
    let mut s = good;
    s.temperature = Temperature::from_kelvin(TEMPERATURE_MAX_K + 1.0).unwrap();
    assert!(
        check_state(&s).is_err(),
        "temperature above the line accepted"
    );
    assert!(check("no_such_function", 1.0, 1.0, 0).is_err());
}
