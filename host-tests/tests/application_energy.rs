//! Energy flow (kernel/src/energy.rs): the worked example recomputed with
//! the f64 formulation within the tolerance that follows from the enthalpy
//! bounds, and hand-derivable checks of Φ = q_m·(h_steam − h_water).

use vapora_host_tests::tolerance::{F32_ROUNDING_REL, SINGLE_PHASE_ENTHALPY_J_KG};
use vapora_kernel::accuracy::ACCURACY_BELOW_NEAR_CRITICAL as ACC;
use vapora_kernel::energy::{energy_flow, energy_flow_from_enthalpies_w, SteamSupply};
use vapora_kernel::error::{ApplicationError, MixtureError};
use vapora_kernel::units::{AbsolutePressure, GaugePressure, Temperature};
use vapora_tables::if97::{pt, region4, saturation};

fn close(what: &str, got: f64, expected: f64, tolerance: f64) {
    let deviation = (got - expected).abs();
    assert!(
        deviation <= tolerance,
        "{what}: kernel {got}, expected {expected}, deviation {deviation:e} > {tolerance:e}"
    );
}

#[test]
fn worked_example_brannock_vale_header_matches_the_formulation() {
    // Brannock Vale creamery (invented): header 2 at 9.2 bar(g), 190 °C,
    // 1.390 625 kg/s; condensate back at 3 bar(a), 85 °C.
    let p = AbsolutePressure::from_gauge(
        GaugePressure::from_bar(9.2).unwrap(),
        AbsolutePressure::STANDARD_ATMOSPHERE,
    )
    .unwrap();
    let t = Temperature::from_celsius(190.0).unwrap();
    let (pw, tw) = (
        AbsolutePressure::from_bar(3.0).unwrap(),
        Temperature::from_celsius(85.0).unwrap(),
    );
    let m = 1.390_625f32;
    let e = energy_flow(
        m,
        SteamSupply::Superheated {
            pressure: p,
            temperature: t,
        },
        pw,
        tw,
    )
    .unwrap();
    let hs = pt::properties_pt(p.as_pa() as f64, t.as_kelvin() as f64)
        .unwrap()
        .enthalpy_j_kg;
    let hw = pt::properties_pt(pw.as_pa() as f64, tw.as_kelvin() as f64)
        .unwrap()
        .enthalpy_j_kg;
    let phi = m as f64 * (hs - hw);
    // |ΔΦ| ≤ q_m·(|Δh_s| + |Δh_w|) + rounding of the product.
    let tolerance = m as f64 * 2.0 * SINGLE_PHASE_ENTHALPY_J_KG + phi.abs() * F32_ROUNDING_REL;
    close("Φ (W)", e.energy_flow_w as f64, phi, tolerance);
    close(
        "h_steam",
        e.steam_enthalpy_j_kg as f64,
        hs,
        SINGLE_PHASE_ENTHALPY_J_KG + hs * F32_ROUNDING_REL,
    );
    close(
        "h_water",
        e.water_enthalpy_j_kg as f64,
        hw,
        SINGLE_PHASE_ENTHALPY_J_KG + hw * F32_ROUNDING_REL,
    );
    // The figures printed in the doc example.
    close("printed Φ", phi, 3.401_391e6, 1.0);
    close("printed h_water", hw, 356.136e3, 0.5);
    assert!(
        tolerance < 100.0,
        "doc example's 100 W bound too tight: {tolerance}"
    );
}

#[test]
fn wet_supply_matches_the_formulation() {
    // Harrowmere Works (invented): main header 10.5 bar(g), x = 0.958 68;
    // feedwater from the deaerator at 2.013 25 bar(a), 105 °C.
    let p = AbsolutePressure::from_pa(1_151_325.0).unwrap();
    let x = 0.958_68f32;
    let (pw, tw) = (
        AbsolutePressure::from_pa(201_325.0).unwrap(),
        Temperature::from_celsius(105.0).unwrap(),
    );
    let e = energy_flow(
        2.0,
        SteamSupply::Wet {
            pressure: p,
            dryness_fraction: x,
        },
        pw,
        tw,
    )
    .unwrap();
    let s = saturation::at_pressure(1_151_325.0).unwrap();
    let hs = s.liquid.enthalpy_j_kg + x as f64 * (s.vapour.enthalpy_j_kg - s.liquid.enthalpy_j_kg);
    let hw = pt::properties_pt(201_325.0, tw.as_kelvin() as f64)
        .unwrap()
        .enthalpy_j_kg;
    let dhs = (1.0 - x as f64) * ACC.liquid_enthalpy_j_kg as f64
        + x as f64 * ACC.vapour_enthalpy_j_kg as f64;
    let phi = 2.0 * (hs - hw);
    close(
        "Φ (W)",
        e.energy_flow_w as f64,
        phi,
        2.0 * (dhs + SINGLE_PHASE_ENTHALPY_J_KG) + phi * F32_ROUNDING_REL,
    );
}

#[test]
fn hand_checks_of_the_product() {
    // Equal enthalpies: no energy flow.
    assert_eq!(
        energy_flow_from_enthalpies_w(1.39, 2.8e6, 2.8e6).unwrap(),
        0.0
    );
    // No flow: no energy.
    assert_eq!(
        energy_flow_from_enthalpies_w(0.0, 2.8e6, 0.4e6).unwrap(),
        0.0
    );
    // 2 kg/s × 1 MJ/kg = 2 MW; 0.5 kg/s × 2 MJ/kg = 1 MW (exact in f32).
    assert_eq!(
        energy_flow_from_enthalpies_w(2.0, 2.8e6, 1.8e6).unwrap(),
        2.0e6
    );
    assert_eq!(
        energy_flow_from_enthalpies_w(0.5, 2.5e6, 0.5e6).unwrap(),
        1.0e6
    );
    // Water hotter than the "steam": negative, as the formula says.
    assert_eq!(
        energy_flow_from_enthalpies_w(1.0, 1.0e5, 2.0e5).unwrap(),
        -1.0e5
    );
}

#[test]
fn dry_saturated_steam_against_saturated_condensate_gives_the_latent_heat() {
    // Steam x = 1 and condensate 0.01 K below T_sat at the same pressure:
    // Φ = q_m·h_fg less q_m·cp'·0.01 K (about 44 J/kg at 10 bar).
    let p = AbsolutePressure::from_bar(10.0).unwrap();
    let sat = saturation::at_pressure(p.as_pa() as f64).unwrap();
    let t_sat = region4::saturation_temperature_k_unchecked(p.as_pa() as f64);
    let condensate = Temperature::from_kelvin((t_sat - 0.01) as f32).unwrap();
    let dt = t_sat - condensate.as_kelvin() as f64; // 0.01 K up to f32 rounding
    let m = 3.0f32;
    let e = energy_flow(
        m,
        SteamSupply::Wet {
            pressure: p,
            dryness_fraction: 1.0,
        },
        p,
        condensate,
    )
    .unwrap();
    let h_fg = sat.vapour.enthalpy_j_kg - sat.liquid.enthalpy_j_kg;
    let cp = sat.liquid.cp_j_kgk;
    let expected = m as f64 * (h_fg + cp * dt);
    // Kernel h'' and h of the condensate within their bounds; the
    // first-order term cp'·ΔT within 5 % (the curvature over 0.01 K is far
    // smaller).
    let tolerance = m as f64
        * (ACC.vapour_enthalpy_j_kg as f64 + SINGLE_PHASE_ENTHALPY_J_KG + cp * dt * 0.05)
        + expected * F32_ROUNDING_REL;
    close("Φ (W)", e.energy_flow_w as f64, expected, tolerance);
}

#[test]
fn bad_inputs_are_typed_errors() {
    for m in [f32::NAN, f32::INFINITY, -1.0, -f32::MIN_POSITIVE] {
        assert!(matches!(
            energy_flow_from_enthalpies_w(m, 2.8e6, 0.4e6),
            Err(ApplicationError::InvalidMassFlow { .. })
        ));
    }
    // Overflow of the product.
    assert!(matches!(
        energy_flow_from_enthalpies_w(f32::MAX, 2.8e6, 0.4e6),
        Err(ApplicationError::InvalidMassFlow { .. })
    ));
    assert!(matches!(
        energy_flow_from_enthalpies_w(1.0, f32::NAN, 0.4e6),
        Err(ApplicationError::EnthalpyNotFinite { .. })
    ));
    let p = AbsolutePressure::from_bar(10.0).unwrap();
    let cold = Temperature::from_celsius(60.0).unwrap();
    // Superheated supply below saturation.
    assert!(matches!(
        energy_flow(
            1.0,
            SteamSupply::Superheated {
                pressure: p,
                temperature: Temperature::from_celsius(170.0).unwrap()
            },
            p,
            cold
        ),
        Err(ApplicationError::SteamNotSuperheated { superheat_margin_k }) if superheat_margin_k < 0.0
    ));
    // Dryness fraction outside [0, 1].
    assert!(matches!(
        energy_flow(
            1.0,
            SteamSupply::Wet {
                pressure: p,
                dryness_fraction: 1.2
            },
            p,
            cold
        ),
        Err(ApplicationError::Mixture(
            MixtureError::DrynessFractionOutOfRange { .. }
        ))
    ));
    // Condensate above T_sat of its pressure: it would flash.
    assert!(matches!(
        energy_flow(
            1.0,
            SteamSupply::Wet {
                pressure: p,
                dryness_fraction: 0.98
            },
            AbsolutePressure::STANDARD_ATMOSPHERE,
            Temperature::from_celsius(105.0).unwrap()
        ),
        Err(ApplicationError::WaterNotSubcooled { subcooling_margin_k }) if subcooling_margin_k < 0.0
    ));
}
