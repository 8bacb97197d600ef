//! Flowing conditions for DP meters (kernel/src/flowing.rs): the worked
//! examples recomputed with the f64 formulation (IF97 and R12-08 in
//! vapora-tables) within tolerances derived from the kernel's accuracy
//! bounds, and hand-derivable checks of the margin and alarm logic.

use vapora_host_tests::tolerance::{
    F32_ROUNDING_REL, SATURATION_MARGIN_K, SINGLE_PHASE_DENSITY_REL, SINGLE_PHASE_ENTHALPY_J_KG,
    SINGLE_PHASE_KAPPA_REL, SINGLE_PHASE_VISCOSITY_REL,
};
use vapora_kernel::accuracy::ACCURACY_BELOW_NEAR_CRITICAL as ACC;
use vapora_kernel::error::ApplicationError;
use vapora_kernel::flowing::{
    steam_flowing_conditions, water_flowing_conditions, FlowingConditions,
};
use vapora_kernel::mixture::wet_steam_at_pressure;
use vapora_kernel::units::{AbsolutePressure, GaugePressure, Temperature};
use vapora_tables::if97::{pt, region4, saturation, viscosity};

fn close(what: &str, got: f64, expected: f64, tolerance: f64) {
    let deviation = (got - expected).abs();
    assert!(
        deviation <= tolerance,
        "{what}: kernel {got}, f64 formulation {expected}, deviation {deviation:e} > {tolerance:e}"
    );
}

/// Every field of `c` against the f64 formulation at the same (f32) inputs.
fn against_formulation(c: &FlowingConditions, steam: bool) {
    let (p, t) = (c.pressure.as_pa() as f64, c.temperature.as_kelvin() as f64);
    let f = pt::properties_pt(p, t).unwrap();
    let mu = viscosity::viscosity_pt(p, t).unwrap();
    let t_sat = region4::saturation_temperature_k_unchecked(p);
    let margin = if steam { t - t_sat } else { t_sat - t };
    let rounding = F32_ROUNDING_REL;
    close(
        "density (kg/m³)",
        c.density_kg_m3 as f64,
        f.density_kg_m3,
        f.density_kg_m3 * (SINGLE_PHASE_DENSITY_REL + rounding),
    );
    close(
        "enthalpy (J/kg)",
        c.enthalpy_j_kg as f64,
        f.enthalpy_j_kg,
        SINGLE_PHASE_ENTHALPY_J_KG + f.enthalpy_j_kg * rounding,
    );
    close(
        "isentropic exponent",
        c.isentropic_exponent as f64,
        f.isentropic_exponent,
        f.isentropic_exponent * (SINGLE_PHASE_KAPPA_REL + rounding),
    );
    close(
        "viscosity (Pa·s)",
        c.viscosity_pa_s as f64,
        mu,
        mu * (SINGLE_PHASE_VISCOSITY_REL + rounding),
    );
    close(
        "saturation margin (K)",
        c.saturation_margin_k.unwrap() as f64,
        margin,
        SATURATION_MARGIN_K,
    );
}

fn header_pressure() -> AbsolutePressure {
    // Brannock Vale creamery, steam header 2 (invented): 9.2 bar(g).
    AbsolutePressure::from_gauge(
        GaugePressure::from_bar(9.2).unwrap(),
        AbsolutePressure::STANDARD_ATMOSPHERE,
    )
    .unwrap()
}

#[test]
fn worked_example_steam_header_matches_the_formulation() {
    let c = steam_flowing_conditions(
        header_pressure(),
        Temperature::from_celsius(190.0).unwrap(),
        5.0,
    )
    .unwrap();
    against_formulation(&c, true);
    assert!(!c.margin_alarm);
    // The figures printed in the doc example (f64 formulation, rounded).
    let (p, t) = (c.pressure.as_pa() as f64, c.temperature.as_kelvin() as f64);
    let f = pt::properties_pt(p, t).unwrap();
    close("ρ printed", f.density_kg_m3, 5.10683, 5e-6);
    close("κ printed", f.isentropic_exponent, 1.29627, 5e-6);
    close(
        "μ printed",
        viscosity::viscosity_pt(p, t).unwrap(),
        15.4240e-6,
        5e-11,
    );
    close("h printed", f.enthalpy_j_kg, 2_802.08e3, 5.0);
}

#[test]
fn worked_example_feedwater_matches_the_formulation() {
    // Harrowmere Works (invented): feed pump discharge 16 bar(a), 118 °C.
    let c = water_flowing_conditions(
        AbsolutePressure::from_bar(16.0).unwrap(),
        Temperature::from_celsius(118.0).unwrap(),
        20.0,
    )
    .unwrap();
    against_formulation(&c, false);
    assert!(!c.margin_alarm);
    let (p, t) = (c.pressure.as_pa() as f64, c.temperature.as_kelvin() as f64);
    let f = pt::properties_pt(p, t).unwrap();
    close("ρ printed", f.density_kg_m3, 945.410, 5e-4);
    close(
        "μ printed",
        viscosity::viscosity_pt(p, t).unwrap(),
        236.620e-6,
        5e-10,
    );
    close("h printed", f.enthalpy_j_kg, 496.288e3, 0.5);
}

#[test]
fn worked_example_wet_steam_matches_the_formulation() {
    // Harrowmere Works (invented): main header 10.5 bar(g), x = 0.958 68.
    let x = 0.958_68f32;
    let w = wet_steam_at_pressure(AbsolutePressure::from_pa(1_151_325.0).unwrap(), x).unwrap();
    let s = saturation::at_pressure(1_151_325.0).unwrap();
    let xf = x as f64;
    let h = s.liquid.enthalpy_j_kg + xf * (s.vapour.enthalpy_j_kg - s.liquid.enthalpy_j_kg);
    let v = s.liquid.specific_volume_m3_kg
        + xf * (s.vapour.specific_volume_m3_kg - s.liquid.specific_volume_m3_kg);
    // Lever rule: |Δh| ≤ (1 − x)|Δh'| + x|Δh''|, |Δv| ≤ (1 − x)v'δ' + x v''δ''.
    let dh = (1.0 - xf) * ACC.liquid_enthalpy_j_kg as f64 + xf * ACC.vapour_enthalpy_j_kg as f64;
    let dv = (1.0 - xf) * s.liquid.specific_volume_m3_kg * ACC.liquid_density_relative as f64
        + xf * s.vapour.specific_volume_m3_kg * ACC.vapour_density_relative as f64;
    close(
        "h (J/kg)",
        w.enthalpy_j_kg as f64,
        h,
        dh + h * F32_ROUNDING_REL,
    );
    close(
        "ρ (kg/m³)",
        w.density_kg_m3 as f64,
        1.0 / v,
        (dv / v + F32_ROUNDING_REL) / v,
    );
    close("printed h", h, 2_700.0e3, 5.0);
    close("printed ρ", 1.0 / v, 6.1392, 5e-5);
}

#[test]
fn the_alarm_is_raised_exactly_below_the_threshold() {
    let p = header_pressure();
    let t = Temperature::from_celsius(190.0).unwrap();
    let margin = steam_flowing_conditions(p, t, 0.0)
        .unwrap()
        .saturation_margin_k
        .unwrap();
    // Threshold equal to the margin: not below it, no alarm.
    assert!(!steam_flowing_conditions(p, t, margin).unwrap().margin_alarm);
    // One ulp above the margin: the margin is below the threshold.
    let above = f32::from_bits(margin.to_bits() + 1);
    assert!(steam_flowing_conditions(p, t, above).unwrap().margin_alarm);
    // The doc example: 183.8 °C is 3 K above T_sat = 180.805 °C.
    let low = steam_flowing_conditions(p, Temperature::from_celsius(183.8).unwrap(), 5.0).unwrap();
    close(
        "3 K superheat",
        low.saturation_margin_k.unwrap() as f64,
        183.8 + 273.15 - region4::saturation_temperature_k_unchecked(p.as_pa() as f64),
        SATURATION_MARGIN_K,
    );
    assert!(low.margin_alarm);
    // Water: subcooling 83.4 K against a 90 K setting raises the alarm.
    let feed = water_flowing_conditions(
        AbsolutePressure::from_bar(16.0).unwrap(),
        Temperature::from_celsius(118.0).unwrap(),
        90.0,
    )
    .unwrap();
    assert!(feed.margin_alarm);
}

#[test]
fn the_wrong_side_of_saturation_is_an_error_with_its_margin() {
    let p = header_pressure();
    let t_sat = region4::saturation_temperature_k_unchecked(p.as_pa() as f64);
    // Steam 1 K below saturation: wet side.
    let t = Temperature::from_kelvin((t_sat - 1.0) as f32).unwrap();
    match steam_flowing_conditions(p, t, 5.0) {
        Err(ApplicationError::SteamNotSuperheated { superheat_margin_k }) => close(
            "superheat margin",
            superheat_margin_k as f64,
            -1.0,
            SATURATION_MARGIN_K,
        ),
        other => panic!("steam below saturation gave {other:?}"),
    }
    // Water 2 K above saturation: it would flash.
    let t = Temperature::from_kelvin((t_sat + 2.0) as f32).unwrap();
    match water_flowing_conditions(p, t, 5.0) {
        Err(ApplicationError::WaterNotSubcooled {
            subcooling_margin_k,
        }) => close(
            "subcooling margin",
            subcooling_margin_k as f64,
            -2.0,
            SATURATION_MARGIN_K,
        ),
        other => panic!("water above saturation gave {other:?}"),
    }
}

#[test]
fn invalid_thresholds_are_rejected() {
    let p = header_pressure();
    let t = Temperature::from_celsius(190.0).unwrap();
    for bad in [f32::NAN, f32::INFINITY, -1.0, -f32::MIN_POSITIVE] {
        assert!(matches!(
            steam_flowing_conditions(p, t, bad),
            Err(ApplicationError::InvalidAlarmThreshold { .. })
        ));
        assert!(matches!(
            water_flowing_conditions(p, Temperature::from_celsius(20.0).unwrap(), bad),
            Err(ApplicationError::InvalidAlarmThreshold { .. })
        ));
    }
}

#[test]
fn above_the_critical_pressure_there_is_no_margin_and_no_alarm() {
    let c = steam_flowing_conditions(
        AbsolutePressure::from_mpa(23.0).unwrap(),
        Temperature::from_kelvin(750.0).unwrap(),
        1e30,
    )
    .unwrap();
    assert_eq!(c.saturation_margin_k, None);
    assert!(!c.margin_alarm);
}

#[test]
fn every_application_error_prints_its_value() {
    let p = header_pressure();
    let wet = steam_flowing_conditions(p, Temperature::from_celsius(150.0).unwrap(), 5.0)
        .unwrap_err()
        .to_string();
    assert!(wet.contains("not superheated"), "{wet}");
    let bad = steam_flowing_conditions(p, Temperature::from_celsius(190.0).unwrap(), -3.5)
        .unwrap_err()
        .to_string();
    assert!(bad.contains("-3.5"), "{bad}");
}
