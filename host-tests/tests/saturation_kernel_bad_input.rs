//! Bad and edge inputs: typed errors, never a panic, never a NaN or an
//! infinity inside an `Ok`.

use vapora_kernel::error::{MixtureError, PhaseError, SaturationError, UnitError};
use vapora_kernel::mixture::{wet_steam_at_pressure, wet_steam_at_temperature};
use vapora_kernel::quality::{
    phase_from_pressure_enthalpy, phase_from_pressure_entropy, phase_from_pressure_specific_volume,
    phase_from_temperature_enthalpy, phase_from_temperature_entropy, Phase,
};
use vapora_kernel::saturation::{
    saturated_property_at_pressure, saturated_property_at_temperature, saturated_state_at_pressure,
    saturated_state_at_temperature, saturation_pressure, saturation_temperature, SaturatedProperty,
    SaturatedState, PRESSURE_MAX_PA, PRESSURE_MIN_PA, TEMPERATURE_MAX_K, TEMPERATURE_MIN_K,
};
use vapora_kernel::units::{AbsolutePressure, GaugePressure, Temperature};

const PROPERTIES: [SaturatedProperty; 12] = [
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

fn all_finite(s: &SaturatedState) -> bool {
    [
        s.pressure.as_pa(),
        s.temperature.as_kelvin(),
        s.liquid.density_kg_m3,
        s.liquid.specific_volume_m3_kg,
        s.liquid.enthalpy_j_kg,
        s.liquid.entropy_j_kgk,
        s.liquid.cp_j_kgk,
        s.vapour.density_kg_m3,
        s.vapour.specific_volume_m3_kg,
        s.vapour.enthalpy_j_kg,
        s.vapour.entropy_j_kgk,
        s.vapour.cp_j_kgk,
        s.latent_heat_j_kg,
        s.entropy_of_vaporisation_j_kgk,
    ]
    .iter()
    .all(|v| v.is_finite())
}

#[test]
fn unit_constructors_reject_nan_infinity_and_negative_values() {
    for v in [f32::NAN, f32::INFINITY, f32::NEG_INFINITY] {
        assert!(matches!(
            AbsolutePressure::from_pa(v),
            Err(UnitError::NotFinite { .. })
        ));
        assert!(matches!(
            AbsolutePressure::from_bar(v),
            Err(UnitError::NotFinite { .. })
        ));
        assert!(matches!(
            GaugePressure::from_kpa(v),
            Err(UnitError::NotFinite { .. })
        ));
        assert!(matches!(
            Temperature::from_kelvin(v),
            Err(UnitError::NotFinite { .. })
        ));
        assert!(matches!(
            Temperature::from_celsius(v),
            Err(UnitError::NotFinite { .. })
        ));
    }
    assert_eq!(
        AbsolutePressure::from_pa(-1.0),
        Err(UnitError::NegativeAbsolutePressure { pressure_pa: -1.0 })
    );
    assert_eq!(
        Temperature::from_kelvin(0.0),
        Err(UnitError::NonPositiveTemperature { temperature_k: 0.0 })
    );
    assert!(matches!(
        Temperature::from_celsius(-300.0),
        Err(UnitError::NonPositiveTemperature { .. })
    ));
    // Overflow in a conversion is an error, not an infinity.
    assert!(matches!(
        AbsolutePressure::from_mpa(f32::MAX),
        Err(UnitError::NotFinite { .. })
    ));
    // A vacuum deeper than the ambient pressure is impossible.
    let deep = GaugePressure::from_kpa(-150.0).unwrap();
    assert!(matches!(
        AbsolutePressure::from_gauge(deep, AbsolutePressure::STANDARD_ATMOSPHERE),
        Err(UnitError::NegativeAbsolutePressure { .. })
    ));
}

#[test]
fn points_off_the_saturation_line_give_typed_errors() {
    let below_p = AbsolutePressure::from_pa(600.0).unwrap();
    let above_p = AbsolutePressure::from_mpa(22.1).unwrap();
    assert!(matches!(
        saturation_temperature(below_p),
        Err(SaturationError::PressureBelowRange { .. })
    ));
    assert!(saturation_temperature(AbsolutePressure::from_pa(0.0).unwrap()).is_err());
    assert!(matches!(
        saturation_temperature(above_p),
        Err(SaturationError::PressureAboveRange { .. })
    ));
    assert!(matches!(
        saturated_state_at_pressure(below_p),
        Err(SaturationError::PressureBelowRange { .. })
    ));
    let below_t = Temperature::from_kelvin(273.15).unwrap();
    let above_t = Temperature::from_kelvin(647.1).unwrap();
    assert!(matches!(
        saturation_pressure(below_t),
        Err(SaturationError::TemperatureBelowRange { .. })
    ));
    assert!(matches!(
        saturation_pressure(above_t),
        Err(SaturationError::TemperatureAboveRange { .. })
    ));
    assert!(matches!(
        saturated_state_at_temperature(above_t),
        Err(SaturationError::TemperatureAboveRange { .. })
    ));
    assert!(matches!(
        phase_from_pressure_enthalpy(below_p, 1e5),
        Err(PhaseError::Saturation(
            SaturationError::PressureBelowRange { .. }
        ))
    ));
    assert!(matches!(
        phase_from_temperature_entropy(below_t, 1e3),
        Err(PhaseError::Saturation(_))
    ));
    assert!(matches!(
        wet_steam_at_pressure(above_p, 0.5),
        Err(MixtureError::Saturation(_))
    ));
    // The error carries the value and the limit.
    match saturation_temperature(below_p) {
        Err(SaturationError::PressureBelowRange {
            pressure_pa,
            minimum_pa,
        }) => {
            assert_eq!(pressure_pa, 600.0);
            assert_eq!(minimum_pa, PRESSURE_MIN_PA);
        }
        other => panic!("{other:?}"),
    }
}

#[test]
fn second_properties_and_dryness_are_checked() {
    let p = AbsolutePressure::from_bar(10.0).unwrap();
    let t = Temperature::from_celsius(150.0).unwrap();
    for v in [f32::NAN, f32::INFINITY] {
        assert!(matches!(
            phase_from_pressure_enthalpy(p, v),
            Err(PhaseError::EnthalpyNotFinite { .. })
        ));
        assert!(matches!(
            phase_from_temperature_enthalpy(t, v),
            Err(PhaseError::EnthalpyNotFinite { .. })
        ));
        assert!(matches!(
            phase_from_pressure_entropy(p, v),
            Err(PhaseError::EntropyNotFinite { .. })
        ));
        assert!(matches!(
            phase_from_temperature_entropy(t, v),
            Err(PhaseError::EntropyNotFinite { .. })
        ));
    }
    for v in [f32::NAN, f32::INFINITY, 0.0, -1.0] {
        assert!(matches!(
            phase_from_pressure_specific_volume(p, v),
            Err(PhaseError::SpecificVolumeNotPositive { .. })
        ));
    }
    for x in [f32::NAN, -0.01, 1.01, f32::INFINITY] {
        assert!(matches!(
            wet_steam_at_pressure(p, x),
            Err(MixtureError::DrynessFractionOutOfRange { .. })
        ));
        assert!(matches!(
            wet_steam_at_temperature(t, x),
            Err(MixtureError::DrynessFractionOutOfRange { .. })
        ));
    }
    assert!(wet_steam_at_pressure(p, 0.0).is_ok());
    assert!(wet_steam_at_pressure(p, 1.0).is_ok());
}

#[test]
fn both_ends_of_the_line_are_accepted_and_finite() {
    for p_pa in [PRESSURE_MIN_PA, PRESSURE_MAX_PA] {
        let p = AbsolutePressure::from_pa(p_pa).unwrap();
        let s = saturated_state_at_pressure(p).unwrap();
        assert!(all_finite(&s), "{s:?}");
        for q in PROPERTIES {
            assert!(
                saturated_property_at_pressure(p, q).unwrap().is_finite(),
                "{q:?} at {p_pa} Pa"
            );
        }
    }
    for t_k in [TEMPERATURE_MIN_K, TEMPERATURE_MAX_K] {
        let t = Temperature::from_kelvin(t_k).unwrap();
        let s = saturated_state_at_temperature(t).unwrap();
        assert!(all_finite(&s), "{s:?}");
        for q in PROPERTIES {
            assert!(
                saturated_property_at_temperature(t, q).unwrap().is_finite(),
                "{q:?} at {t_k} K"
            );
        }
    }
    // Just outside: rejected.
    let next_up = |v: f32| f32::from_bits(v.to_bits() + 1);
    let next_down = |v: f32| f32::from_bits(v.to_bits() - 1);
    assert!(
        saturation_temperature(AbsolutePressure::from_pa(next_down(PRESSURE_MIN_PA)).unwrap())
            .is_err()
    );
    assert!(
        saturation_temperature(AbsolutePressure::from_pa(next_up(PRESSURE_MAX_PA)).unwrap())
            .is_err()
    );
    assert!(
        saturation_pressure(Temperature::from_kelvin(next_down(TEMPERATURE_MIN_K)).unwrap())
            .is_err()
    );
    assert!(
        saturation_pressure(Temperature::from_kelvin(next_up(TEMPERATURE_MAX_K)).unwrap()).is_err()
    );
}

#[test]
fn at_and_above_the_critical_point_the_phase_is_supercritical() {
    for p_pa in [22.064e6f32, 25e6, 1e9] {
        let p = AbsolutePressure::from_pa(p_pa).unwrap();
        assert_eq!(
            phase_from_pressure_enthalpy(p, 2.0e6).unwrap(),
            Phase::Supercritical
        );
        assert_eq!(
            phase_from_pressure_entropy(p, 4.4e3).unwrap(),
            Phase::Supercritical
        );
        assert_eq!(
            phase_from_pressure_specific_volume(p, 3.1e-3).unwrap(),
            Phase::Supercritical
        );
    }
    for t_k in [647.096f32, 700.0, 2000.0] {
        let t = Temperature::from_kelvin(t_k).unwrap();
        assert_eq!(
            phase_from_temperature_enthalpy(t, 2.0e6).unwrap(),
            Phase::Supercritical
        );
        assert_eq!(
            phase_from_temperature_entropy(t, 4.4e3).unwrap(),
            Phase::Supercritical
        );
    }
}

#[test]
fn a_sweep_over_many_decades_never_gives_nan_inside_ok() {
    // Pressures from 1 Pa to 1 GPa and temperatures from 1 K to 3000 K on a
    // fine logarithmic grid, with enthalpies, entropies and volumes spanning
    // and exceeding the physical range.
    let mut count_ok = 0usize;
    for i in 0..=4000 {
        let p = AbsolutePressure::from_pa(10f32.powf(i as f32 * 9.0 / 4000.0)).unwrap();
        let t = Temperature::from_kelvin(10f32.powf(i as f32 * 3.5 / 4000.0)).unwrap();
        if let Ok(s) = saturated_state_at_pressure(p) {
            assert!(all_finite(&s), "{s:?}");
            count_ok += 1;
        }
        if let Ok(s) = saturated_state_at_temperature(t) {
            assert!(all_finite(&s), "{s:?}");
        }
        if let Ok(v) = saturation_temperature(p) {
            assert!(v.as_kelvin().is_finite());
        }
        if let Ok(v) = saturation_pressure(t) {
            assert!(v.as_pa().is_finite());
        }
        for h in [-1e7f32, 0.0, 1e6, 2.5e6, 1e8] {
            for ph in [
                phase_from_pressure_enthalpy(p, h),
                phase_from_temperature_enthalpy(t, h),
            ]
            .into_iter()
            .flatten()
            {
                if let Some(x) = ph.dryness_fraction() {
                    assert!((0.0..=1.0).contains(&x), "{ph:?}");
                }
            }
        }
        for x in [0.0f32, 0.3, 1.0] {
            if let Ok(w) = wet_steam_at_pressure(p, x) {
                assert!(
                    w.enthalpy_j_kg.is_finite()
                        && w.density_kg_m3.is_finite()
                        && w.entropy_j_kgk.is_finite()
                );
            }
        }
    }
    assert!(count_ok > 1000, "the sweep reached the line: {count_ok}");
}
