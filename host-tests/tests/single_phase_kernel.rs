//! The single-phase calls' behaviour at the edges: a point on the wrong side
//! of saturation is reported with its margin, out-of-range inputs give the
//! typed errors, and (p, h) and (p, s) round trips land back on the state
//! across the phases (liquid, wet steam, vapour, supercritical).

use vapora_kernel::saturation::{saturated_state_at_pressure, saturation_temperature};
use vapora_kernel::single_phase::{
    compressed_liquid, state_at_pressure_enthalpy, state_at_pressure_entropy,
    state_at_pressure_temperature, superheated_vapour, FluidState, SinglePhaseError,
};
use vapora_kernel::units::{AbsolutePressure, Temperature};

fn p(pa: f32) -> AbsolutePressure {
    AbsolutePressure::from_pa(pa).unwrap()
}

fn t(k: f32) -> Temperature {
    Temperature::from_kelvin(k).unwrap()
}

#[test]
fn wrong_side_of_saturation_gives_the_margin() {
    let pressure = p(1.0e6);
    let ts = saturation_temperature(pressure).unwrap().as_kelvin();
    match superheated_vapour(pressure, t(ts - 5.0)) {
        Err(SinglePhaseError::NotSuperheated { margin_k }) => {
            assert!((margin_k + 5.0).abs() < 1e-3, "{margin_k}")
        }
        other => panic!("{other:?}"),
    }
    match compressed_liquid(pressure, t(ts + 12.0)) {
        Err(SinglePhaseError::NotSubcooled { margin_k }) => {
            assert!((margin_k - 12.0).abs() < 1e-3, "{margin_k}")
        }
        other => panic!("{other:?}"),
    }
    // Right side: the margin is reported in the state.
    let v = superheated_vapour(pressure, t(ts + 3.0)).unwrap();
    assert!((v.saturation_margin_k.unwrap() - 3.0).abs() < 1e-3);
    let l = compressed_liquid(pressure, t(ts - 3.0)).unwrap();
    assert!((l.saturation_margin_k.unwrap() + 3.0).abs() < 1e-3);
    // Exactly on saturation: an error with margin 0.
    assert_eq!(
        state_at_pressure_temperature(pressure, t(ts)),
        Err(SinglePhaseError::NotSuperheated { margin_k: 0.0 })
    );
    // Above the critical pressure: no saturation margin, split by T_split.
    let s = superheated_vapour(p(24.0e6), t(700.0)).unwrap();
    assert_eq!(s.saturation_margin_k, None);
    assert!(matches!(
        superheated_vapour(p(24.0e6), t(600.0)),
        Err(SinglePhaseError::NotSuperheated { .. })
    ));
    assert!(compressed_liquid(p(24.0e6), t(600.0)).is_ok());
}

#[test]
fn out_of_range_inputs_give_typed_errors() {
    assert!(matches!(
        superheated_vapour(p(500.0), t(400.0)),
        Err(SinglePhaseError::PressureBelowRange { .. })
    ));
    assert!(matches!(
        superheated_vapour(p(26.0e6), t(900.0)),
        Err(SinglePhaseError::PressureAboveRange { .. })
    ));
    assert!(matches!(
        superheated_vapour(p(1.0e5), t(1100.0)),
        Err(SinglePhaseError::TemperatureAboveRange { .. })
    ));
    assert!(matches!(
        compressed_liquid(p(1.0e5), t(270.0)),
        Err(SinglePhaseError::TemperatureBelowRange { .. })
    ));
    assert!(matches!(
        state_at_pressure_enthalpy(p(1.0e5), f32::NAN),
        Err(SinglePhaseError::EnthalpyNotFinite { .. })
    ));
    assert!(matches!(
        state_at_pressure_entropy(p(1.0e5), f32::INFINITY),
        Err(SinglePhaseError::EntropyNotFinite { .. })
    ));
    match state_at_pressure_enthalpy(p(1.0e5), 5.0e6) {
        Err(SinglePhaseError::EnthalpyOutOfRange {
            minimum_j_kg,
            maximum_j_kg,
            ..
        }) => assert!(minimum_j_kg < 1.0e3 && (maximum_j_kg - 4.16e6).abs() < 2e4),
        other => panic!("{other:?}"),
    }
    assert!(matches!(
        state_at_pressure_entropy(p(1.0e5), 2.0e4),
        Err(SinglePhaseError::EntropyOutOfRange { .. })
    ));
}

fn temperature_of(s: FluidState) -> f32 {
    match s {
        FluidState::CompressedLiquid(s) | FluidState::SuperheatedVapour(s) => {
            s.temperature.as_kelvin()
        }
        FluidState::WetSteam(w) => w.temperature.as_kelvin(),
        other => panic!("{other:?}"),
    }
}

#[test]
fn pressure_enthalpy_and_entropy_round_trips_across_the_phases() {
    let mut worst = 0.0f32;
    for &pa in &[
        1.0e3, 1.0e5, 1.0e6, 5.0e6, 15.0e6, 17.0e6, 20.0e6, 23.0e6, 25.0e6,
    ] {
        for &tk in &[
            280.0, 330.0, 420.0, 500.0, 600.0, 640.0, 660.0, 700.0, 850.0, 1050.0,
        ] {
            let Ok(state) = state_at_pressure_temperature(p(pa), t(tk)) else {
                continue;
            };
            let (h, s, liquid) = match state {
                FluidState::CompressedLiquid(s) => (s.enthalpy_j_kg, s.entropy_j_kgk, true),
                FluidState::SuperheatedVapour(s) => (s.enthalpy_j_kg, s.entropy_j_kgk, false),
                other => panic!("{other:?}"),
            };
            for back in [
                state_at_pressure_enthalpy(p(pa), h).unwrap(),
                state_at_pressure_entropy(p(pa), s).unwrap(),
            ] {
                assert_eq!(
                    matches!(back, FluidState::CompressedLiquid(_)),
                    liquid,
                    "{pa} Pa {tk} K: {back:?}"
                );
                let dt = (temperature_of(back) - tk).abs();
                worst = worst.max(dt);
                // Within the T(p, h) bound of the zone plus the spline's
                // own h error over cp.
                assert!(dt < 0.05, "{pa} Pa {tk} K: T back {dt} K off");
            }
        }
    }
    println!("largest round-trip temperature difference: {worst:.2e} K");
}

#[test]
fn wet_steam_from_enthalpy_and_entropy() {
    let pressure = p(2.0e6);
    let sat = saturated_state_at_pressure(pressure).unwrap();
    for x in [0.0f32, 0.1, 0.5, 0.9, 1.0] {
        let h = sat.liquid.enthalpy_j_kg + x * sat.latent_heat_j_kg;
        match state_at_pressure_enthalpy(pressure, h).unwrap() {
            FluidState::WetSteam(w) => {
                assert!((w.dryness_fraction - x).abs() < 1e-5, "{x}: {w:?}");
                assert!((w.enthalpy_j_kg - h).abs() < 1.0);
            }
            other => panic!("{x}: {other:?}"),
        }
        let s = sat.liquid.entropy_j_kgk + x * sat.entropy_of_vaporisation_j_kgk;
        match state_at_pressure_entropy(pressure, s).unwrap() {
            FluidState::WetSteam(w) => assert!((w.dryness_fraction - x).abs() < 1e-5),
            other => panic!("{x}: {other:?}"),
        }
    }
    // Just outside the dome: single phase.
    assert!(matches!(
        state_at_pressure_enthalpy(pressure, sat.vapour.enthalpy_j_kg + 100.0).unwrap(),
        FluidState::SuperheatedVapour(_)
    ));
    assert!(matches!(
        state_at_pressure_enthalpy(pressure, sat.liquid.enthalpy_j_kg - 100.0).unwrap(),
        FluidState::CompressedLiquid(_)
    ));
}
