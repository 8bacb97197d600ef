//! Published Region 4 values and the trade's sanity values through the
//! kernel, within the kernel's own published bounds.

use vapora_kernel::accuracy::ACCURACY_BELOW_NEAR_CRITICAL as ACC;
use vapora_kernel::saturation::{
    saturated_property_at_temperature, saturated_state_at_temperature, saturation_pressure,
    saturation_temperature, SaturatedProperty,
};
use vapora_kernel::units::{AbsolutePressure, Temperature};

/// Half a unit of the ninth printed digit, relative, at most: the rounding
/// of the published value itself (nine significant digits).
const PRINTED_ROUNDING_REL: f64 = 5e-9;

#[test]
fn iapws_table_35_saturation_pressures() {
    // IAPWS R7-97(2012) Table 35: psat at T (MPa).
    for (t_k, p_mpa) in [
        (300.0f32, 0.353658941e-2),
        (500.0, 0.263889776e1),
        (600.0, 0.123443146e2),
    ] {
        let p = saturation_pressure(Temperature::from_kelvin(t_k).unwrap()).unwrap();
        let rel = (f64::from(p.as_pa()) / (p_mpa * 1e6) - 1.0).abs();
        let bound = f64::from(ACC.pressure_relative) + PRINTED_ROUNDING_REL;
        assert!(
            rel <= bound,
            "T = {t_k} K: {} Pa vs {p_mpa} MPa, deviation {rel:.2e} > {bound:.2e}",
            p.as_pa()
        );
    }
}

#[test]
fn iapws_table_36_saturation_temperatures() {
    // IAPWS R7-97(2012) Table 36: Tsat at p (K).
    for (p_mpa, t_ref) in [
        (0.1f32, 0.372755919e3),
        (1.0, 0.453035632e3),
        (10.0, 0.584149488e3),
    ] {
        let t = saturation_temperature(AbsolutePressure::from_mpa(p_mpa).unwrap()).unwrap();
        let dev = (f64::from(t.as_kelvin()) - t_ref).abs();
        let bound = f64::from(ACC.temperature_k) + 5e-7; // + rounding of the printed value
        assert!(
            dev <= bound,
            "p = {p_mpa} MPa: {} K vs {t_ref} K, deviation {dev:.2e} K > {bound:.2e}",
            t.as_kelvin()
        );
    }
}

// The trade's sanity values, common practice, no source (DEVELOPERS.md);
// tolerances match the word "about" in each.

#[test]
fn water_boils_at_100_c_at_one_atmosphere() {
    let t = saturation_temperature(AbsolutePressure::from_kpa(101.325).unwrap()).unwrap();
    assert!((t.as_kelvin() - 373.15).abs() < 0.03, "{} K", t.as_kelvin());
}

#[test]
fn boiling_pressures_at_20_50_and_200_c() {
    for (c, expected_pa, about_pa) in [
        (20.0f32, 2.34e3, 0.01e3),
        (50.0, 12.35e3, 0.01e3),
        (200.0, 1.55e6, 0.01e6),
    ] {
        let p = saturation_pressure(Temperature::from_celsius(c).unwrap()).unwrap();
        assert!(
            (p.as_pa() - expected_pa).abs() <= about_pa,
            "{c} °C: {} Pa, about {expected_pa} Pa",
            p.as_pa()
        );
    }
}

#[test]
fn latent_heat_at_100_c_is_about_2256_kj_kg() {
    let t = Temperature::from_celsius(100.0).unwrap();
    let h_fg = saturated_property_at_temperature(t, SaturatedProperty::LatentHeat).unwrap();
    assert!((h_fg - 2256e3).abs() < 1e3, "{h_fg} J/kg");
    let s = saturated_state_at_temperature(t).unwrap();
    assert_eq!(
        s.latent_heat_j_kg, h_fg,
        "the single-property call and the full state agree"
    );
}
