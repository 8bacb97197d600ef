//! Drum level (kernel/src/drum_level.rs): hand-derivable checks of
//! h_w = [g·(ρ_ref − ρ'')·H − DP] / [g·(ρ' − ρ'')], the worked example
//! recomputed with the f64 formulation within the tolerance that follows
//! from the density bounds, and the start-up cases.

use vapora_host_tests::tolerance::{
    worst_corner_deviation, F32_ROUNDING_REL, SINGLE_PHASE_DENSITY_REL,
};
use vapora_kernel::accuracy::ACCURACY_BELOW_NEAR_CRITICAL as ACC;
use vapora_kernel::drum_level::{
    drum_level, drum_level_from_densities, DrumLevelTransmitter, LevelSpan, STANDARD_GRAVITY_M_S2,
};
use vapora_kernel::error::{ApplicationError, SaturationError};
use vapora_kernel::units::{AbsolutePressure, Temperature};
use vapora_tables::if97::{pt, region4, saturation};

fn close(what: &str, got: f64, expected: f64, tolerance: f64) {
    let deviation = (got - expected).abs();
    assert!(
        deviation <= tolerance,
        "{what}: kernel {got}, expected {expected}, deviation {deviation:e} > {tolerance:e}"
    );
}

/// Harrowmere Works (invented): taps 600 mm apart, zero mark 300 mm above
/// the lower tap, compensated from 2 bar(a).
fn harrowmere() -> DrumLevelTransmitter {
    DrumLevelTransmitter {
        tap_separation_m: 0.6,
        zero_level_above_lower_tap_m: 0.3,
        gravity_m_s2: STANDARD_GRAVITY_M_S2,
        minimum_drum_pressure: AbsolutePressure::from_bar(2.0).unwrap(),
    }
}

/// A round test rig: H = 1 m, Z = 0.25 m, g = 10 m/s².
fn rig() -> DrumLevelTransmitter {
    DrumLevelTransmitter {
        tap_separation_m: 1.0,
        zero_level_above_lower_tap_m: 0.25,
        gravity_m_s2: 10.0,
        minimum_drum_pressure: AbsolutePressure::from_pa(0.0).unwrap(),
    }
}

/// Rounding slack of the level, m: a few f32 ulps of the terms of size H.
fn rounding_m(t: &DrumLevelTransmitter) -> f64 {
    t.tap_separation_m as f64 * F32_ROUNDING_REL * 10.0
}

#[test]
fn zero_dp_with_a_hot_leg_means_full_to_the_upper_tap() {
    // ρ_ref = ρ' (reference leg as hot as the drum water): DP = 0 at h_w = H.
    let t = rig();
    let l = drum_level_from_densities(0.0, &t, 880.0, 5.9, 880.0).unwrap();
    close(
        "h_w",
        l.water_height_above_lower_tap_m as f64,
        1.0,
        rounding_m(&t),
    );
    close("L", l.level_m as f64, 0.75, rounding_m(&t));
    assert_eq!(l.span, LevelSpan::WithinTaps);
}

#[test]
fn zero_dp_with_a_cold_leg() {
    // h_w = (ρ_ref − ρ'')·H/(ρ' − ρ'') = (990 − 6)/(880 − 6) = 984/874.
    let t = rig();
    let l = drum_level_from_densities(0.0, &t, 880.0, 6.0, 990.0).unwrap();
    close(
        "h_w",
        l.water_height_above_lower_tap_m as f64,
        984.0 / 874.0,
        rounding_m(&t),
    );
    assert_eq!(l.span, LevelSpan::AboveUpperTap);
}

#[test]
fn empty_full_and_half_scale_dp() {
    let t = rig();
    let (rl, rv, rr, g, h) = (880.0f64, 6.0f64, 990.0f64, 10.0f64, 1.0f64);
    // Empty drum: DP = g·(ρ_ref − ρ'')·H = 9840 Pa → h_w = 0, L = −Z.
    let empty =
        drum_level_from_densities((g * (rr - rv) * h) as f32, &t, 880.0, 6.0, 990.0).unwrap();
    close(
        "empty h_w",
        empty.water_height_above_lower_tap_m as f64,
        0.0,
        rounding_m(&t),
    );
    close("empty L", empty.level_m as f64, -0.25, rounding_m(&t));
    // Full to the upper tap: DP = g·(ρ_ref − ρ')·H = 1100 Pa → h_w = H.
    let full =
        drum_level_from_densities((g * (rr - rl) * h) as f32, &t, 880.0, 6.0, 990.0).unwrap();
    close(
        "full h_w",
        full.water_height_above_lower_tap_m as f64,
        1.0,
        rounding_m(&t),
    );
    // Half: DP = g·H·[ρ_ref − (ρ' + ρ'')/2] = 5470 Pa → h_w = H/2.
    let half = drum_level_from_densities(
        (g * h * (rr - (rl + rv) / 2.0)) as f32,
        &t,
        880.0,
        6.0,
        990.0,
    )
    .unwrap();
    close(
        "half h_w",
        half.water_height_above_lower_tap_m as f64,
        0.5,
        rounding_m(&t),
    );
    assert_eq!(half.span, LevelSpan::WithinTaps);
}

#[test]
fn cold_hydrostatic_case() {
    // Cold rig, water 1000 kg/m³ on both sides, vapour negligible:
    // h_w = H − DP/(g·ρ): 2500 Pa → 0.75 m.
    let t = rig();
    let l = drum_level_from_densities(2500.0, &t, 1000.0, 1e-6, 1000.0).unwrap();
    close(
        "h_w",
        l.water_height_above_lower_tap_m as f64,
        0.75,
        rounding_m(&t) + 1e-8,
    );
    close("L", l.level_m as f64, 0.5, rounding_m(&t) + 1e-8);
}

#[test]
fn outside_the_taps_is_flagged() {
    let t = rig();
    // DP below the full-drum reading: above the upper tap (leg not full).
    let high = drum_level_from_densities(1000.0, &t, 880.0, 6.0, 990.0).unwrap();
    assert_eq!(high.span, LevelSpan::AboveUpperTap);
    // DP above the empty-drum reading: below the lower tap.
    let low = drum_level_from_densities(9900.0, &t, 880.0, 6.0, 990.0).unwrap();
    assert_eq!(low.span, LevelSpan::BelowLowerTap);
    assert!(low.level_m < -0.25);
}

#[test]
fn worked_example_harrowmere_drum_matches_the_formulation() {
    let t = harrowmere();
    let drum = AbsolutePressure::from_pa(1_151_325.0).unwrap();
    let leg = Temperature::from_celsius(45.0).unwrap();
    let dp = 3_100.0f32;
    let l = drum_level(drum, dp, leg, &t).unwrap();
    let s = saturation::at_pressure(drum.as_pa() as f64).unwrap();
    let leg_rho = pt::properties_pt(drum.as_pa() as f64, leg.as_kelvin() as f64)
        .unwrap()
        .density_kg_m3;
    let (h, z, g) = (
        t.tap_separation_m as f64,
        t.zero_level_above_lower_tap_m as f64,
        t.gravity_m_s2 as f64,
    );
    let level = |d: &[f64]| (g * (d[2] - d[1]) * h - dp as f64) / (g * (d[0] - d[1])) - z;
    let densities = [s.liquid.density_kg_m3, s.vapour.density_kg_m3, leg_rho];
    let bounds = [
        densities[0] * ACC.liquid_density_relative as f64,
        densities[1] * ACC.vapour_density_relative as f64,
        densities[2] * SINGLE_PHASE_DENSITY_REL,
    ];
    let tolerance = worst_corner_deviation(level, &densities, &bounds) + rounding_m(&t);
    let expected = level(&densities);
    close("L (m)", l.level_m as f64, expected, tolerance);
    close(
        "ρ_ref",
        l.reference_leg_density_kg_m3 as f64,
        leg_rho,
        leg_rho * (SINGLE_PHASE_DENSITY_REL + F32_ROUNDING_REL),
    );
    assert_eq!(l.span, LevelSpan::WithinTaps);
    // The doc example's figures and claims.
    close("printed L", expected, 0.014_19, 5e-6);
    close("printed ρ_ref", leg_rho, 990.680, 5e-4);
    assert!(
        tolerance < 1e-4,
        "doc example's 0.1 mm bound too tight: {tolerance}"
    );
    assert!(tolerance < 3e-5, "doc says about 0.02 mm: {tolerance}");
    // "about 0.3 mm per kelvin" of leg temperature.
    let warmer = drum_level(drum, dp, Temperature::from_celsius(46.0).unwrap(), &t).unwrap();
    let per_kelvin = (warmer.level_m - l.level_m).abs();
    assert!(
        (0.2e-3..0.4e-3).contains(&per_kelvin),
        "leg sensitivity {per_kelvin} m/K"
    );
}

#[test]
fn start_up_and_leg_cases_are_typed_results() {
    let t = harrowmere();
    let leg = Temperature::from_celsius(45.0).unwrap();
    // Below the configured start-up pressure.
    match drum_level(AbsolutePressure::from_pa(1.2e5).unwrap(), 3_100.0, leg, &t) {
        Err(ApplicationError::DrumPressureBelowStartUp {
            pressure_pa,
            minimum_pa,
        }) => {
            assert_eq!(pressure_pa, 1.2e5);
            assert_eq!(minimum_pa, 2.0e5);
        }
        other => panic!("start-up gave {other:?}"),
    }
    // Below the saturation tables with no start-up minimum.
    let mut open = t;
    open.minimum_drum_pressure = AbsolutePressure::from_pa(0.0).unwrap();
    assert!(matches!(
        drum_level(AbsolutePressure::from_pa(500.0).unwrap(), 0.0, leg, &open),
        Err(ApplicationError::Saturation(
            SaturationError::PressureBelowRange { .. }
        ))
    ));
    // Above the critical pressure: no drum level.
    assert!(matches!(
        drum_level(AbsolutePressure::from_mpa(22.5).unwrap(), 0.0, leg, &open),
        Err(ApplicationError::Saturation(
            SaturationError::PressureAboveRange { .. }
        ))
    ));
    // A leg at or above T_sat at drum pressure would not hold liquid.
    let drum = AbsolutePressure::from_pa(1_151_325.0).unwrap();
    let t_sat = region4::saturation_temperature_k_unchecked(drum.as_pa() as f64);
    let hot = Temperature::from_kelvin((t_sat + 3.0) as f32).unwrap();
    match drum_level(drum, 3_100.0, hot, &t) {
        Err(ApplicationError::ReferenceLegNotSubcooled {
            subcooling_margin_k,
        }) => close("leg margin", subcooling_margin_k as f64, -3.0, 2e-3),
        other => panic!("hot leg gave {other:?}"),
    }
    // A leg that has not filled: low DP, above the upper tap.
    let unfilled = drum_level(drum, 500.0, leg, &t).unwrap();
    assert_eq!(unfilled.span, LevelSpan::AboveUpperTap);
}

#[test]
fn invalid_settings_are_rejected() {
    let good = rig();
    for (h, z, g) in [
        (0.0, 0.0, 10.0),
        (-1.0, 0.0, 10.0),
        (f32::NAN, 0.0, 10.0),
        (1.0, -0.1, 10.0),
        (1.0, 1.1, 10.0),
        (1.0, f32::INFINITY, 10.0),
        (1.0, 0.5, 0.0),
        (1.0, 0.5, f32::NAN),
    ] {
        let t = DrumLevelTransmitter {
            tap_separation_m: h,
            zero_level_above_lower_tap_m: z,
            gravity_m_s2: g,
            ..good
        };
        assert!(
            matches!(
                drum_level_from_densities(0.0, &t, 880.0, 6.0, 990.0),
                Err(ApplicationError::InvalidTransmitterGeometry { .. })
            ),
            "H {h}, Z {z}, g {g} accepted"
        );
    }
    assert!(matches!(
        drum_level_from_densities(f32::NAN, &good, 880.0, 6.0, 990.0),
        Err(ApplicationError::DifferentialPressureNotFinite { .. })
    ));
    for (rl, rv, rr) in [
        (6.0, 6.0, 990.0),
        (5.0, 6.0, 990.0),
        (880.0, 0.0, 990.0),
        (880.0, 6.0, -1.0),
        (f32::INFINITY, 6.0, 990.0),
    ] {
        assert!(
            matches!(
                drum_level_from_densities(0.0, &good, rl, rv, rr),
                Err(ApplicationError::NoDensityDifference { .. })
            ),
            "densities {rl}, {rv}, {rr} accepted"
        );
    }
    // A level that overflows f32.
    assert!(matches!(
        drum_level_from_densities(-f32::MAX, &good, 1.0 + 1e-6, 1.0, 990.0),
        Err(ApplicationError::NoDensityDifference { .. })
    ));
}

#[test]
fn over_the_drum_range_the_level_follows_the_formulation() {
    // Drum pressures 2 bar(a) to 20 MPa (T_sat below Tc − 1 K), legs from
    // 5 °C to 20 K below saturation, DP across the span and beyond it.
    let t = harrowmere();
    let mut worst_ratio: f64 = 0.0;
    for k in 0..=40 {
        let p_pa =
            (2.0e5f64.ln() + (20.0e6f64.ln() - 2.0e5f64.ln()) * k as f64 / 40.0).exp() as f32;
        let drum = AbsolutePressure::from_pa(p_pa).unwrap();
        let p = drum.as_pa() as f64;
        let s = saturation::at_pressure(p).unwrap();
        let t_sat = region4::saturation_temperature_k_unchecked(p);
        let mut legs_k: Vec<f32> = [278.15f32, 318.15, 423.15]
            .into_iter()
            .filter(|&k| f64::from(k) < t_sat - 20.0)
            .collect();
        legs_k.push((t_sat - 20.0) as f32);
        for leg_k in legs_k {
            let leg = Temperature::from_kelvin(leg_k).unwrap();
            let leg_rho = pt::properties_pt(p, leg.as_kelvin() as f64)
                .unwrap()
                .density_kg_m3;
            for dp in [-500.0f32, 0.0, 1_000.0, 2_500.0, 4_000.0, 7_000.0] {
                let l = drum_level(drum, dp, leg, &t).unwrap();
                let (h, z, g) = (
                    t.tap_separation_m as f64,
                    t.zero_level_above_lower_tap_m as f64,
                    t.gravity_m_s2 as f64,
                );
                let level =
                    |d: &[f64]| (g * (d[2] - d[1]) * h - dp as f64) / (g * (d[0] - d[1])) - z;
                let densities = [s.liquid.density_kg_m3, s.vapour.density_kg_m3, leg_rho];
                let bounds = [
                    densities[0] * ACC.liquid_density_relative as f64,
                    densities[1] * ACC.vapour_density_relative as f64,
                    densities[2] * SINGLE_PHASE_DENSITY_REL,
                ];
                // Rounding grows with |h_w|·(ρ'/(ρ' − ρ'')) at high pressure.
                let expected = level(&densities);
                let amplification = densities[0] / (densities[0] - densities[1]);
                let tolerance = worst_corner_deviation(level, &densities, &bounds)
                    + rounding_m(&t) * amplification * (1.0 + expected.abs() / h);
                let deviation = (l.level_m as f64 - expected).abs();
                worst_ratio = worst_ratio.max(deviation / tolerance);
                assert!(
                    deviation <= tolerance,
                    "p {p} Pa, leg {leg_k} K, DP {dp} Pa: level {} m, f64 {expected} m, \
                     deviation {deviation:e} > {tolerance:e}",
                    l.level_m
                );
            }
        }
    }
    println!("worst deviation / tolerance: {worst_ratio:.3}");
}
