//! Region 3 of IAPWS-IF97: the basic equation against the release's
//! verification table, the (p, T) density solver, and the shape of the
//! isotherms the solver relies on.

use vapora_host_tests::tolerance::{printed_digits_match, relative_deviation};
use vapora_tables::if97::{region3, region4, FormulationError, CRITICAL_TEMPERATURE_K};

/// B23 boundary pressure, Pa (IAPWS R7-97(2012), Eq. 5 with Table 1
/// coefficients), written out here so the test does not lean on the code
/// under test for the edge of Region 3.
fn b23_pressure_pa(t: f64) -> f64 {
    (0.348_051_856_289_69e3 - 0.116_718_598_799_75e1 * t + 0.101_929_700_393_26e-2 * t * t) * 1e6
}

/// IAPWS R7-97(2012) Table 33 (typed in from the release):
/// (T K, ρ kg/m³, p MPa, h kJ/kg, u kJ/kg, s kJ/(kg K), cp kJ/(kg K), w m/s).
const TABLE_33: [(f64, f64, [f64; 6]); 3] = [
    (
        650.0,
        500.0,
        [
            0.255837018e2,
            0.186343019e4,
            0.181226279e4,
            0.405427273e1,
            0.138935717e2,
            0.502005554e3,
        ],
    ),
    (
        650.0,
        200.0,
        [
            0.222930643e2,
            0.237512401e4,
            0.226365868e4,
            0.485438792e1,
            0.446579342e2,
            0.383444594e3,
        ],
    ),
    (
        750.0,
        500.0,
        [
            0.783095639e2,
            0.225868845e4,
            0.210206932e4,
            0.446971906e1,
            0.634165359e1,
            0.760696041e3,
        ],
    ),
];

#[test]
fn table_33_every_printed_digit() {
    let names = ["p", "h", "u", "s", "cp", "w"];
    let mut worst: f64 = 0.0;
    for (t, rho, expected) in TABLE_33 {
        let props = region3::properties_rho_t(rho, t).unwrap();
        let got = [
            props.pressure_pa / 1e6,
            props.enthalpy_j_kg / 1e3,
            props.internal_energy_j_kg / 1e3,
            props.entropy_j_kgk / 1e3,
            props.cp_j_kgk / 1e3,
            props.speed_of_sound_m_s,
        ];
        for ((name, value), printed) in names.iter().zip(got).zip(expected) {
            let dev = relative_deviation(value, printed);
            worst = worst.max(dev);
            assert!(
                printed_digits_match(value, printed, 9),
                "Table 33 T={t} K rho={rho} kg/m3 {name}: got {value:.12e}, printed {printed:.9e}, rel dev {dev:.3e}"
            );
        }
        // Consistency of the derived quantities with their definitions.
        assert!(relative_deviation(props.specific_volume_m3_kg * rho, 1.0) < 1e-15);
        let kappa = rho * props.speed_of_sound_m_s * props.speed_of_sound_m_s / props.pressure_pa;
        assert!(relative_deviation(props.isentropic_exponent, kappa) < 1e-12);
        assert!(props.cv_j_kgk > 0.0 && props.cv_j_kgk < props.cp_j_kgk);
    }
    println!("Table 33: max relative deviation from printed values {worst:.3e}");
}

/// (∂p/∂ρ)_T of Eq. 28 against a central finite difference of p (the
/// analytic derivative is what the Newton steps and the spinodals use).
#[test]
fn slope_matches_finite_difference() {
    for t in [623.15, 640.0, 647.0, 650.0, 700.0, 863.15] {
        for rho in [60.0, 150.0, 322.0, 450.0, 700.0] {
            let (_, slope) = region3::pressure_and_slope_unchecked(rho, t);
            let h = 1e-3;
            let fd = (region3::pressure_pa_unchecked(rho + h, t)
                - region3::pressure_pa_unchecked(rho - h, t))
                / (2.0 * h);
            let dev = (slope - fd).abs() / slope.abs().max(1e3);
            assert!(
                dev < 1e-6,
                "T={t} rho={rho}: analytic {slope:e}, finite difference {fd:e}, dev {dev:e}"
            );
        }
    }
}

/// Below Tc the isotherms have exactly one loop: (∂p/∂ρ)_T changes sign
/// exactly twice on 50 … 800 kg/m³, and the spinodals found by the solver are
/// those sign changes (dense grid of 4000 densities on 120 isotherms).
#[test]
fn subcritical_isotherms_have_one_loop() {
    let n_rho = 4000;
    for k in 0..120 {
        let t = 623.15 + (CRITICAL_TEMPERATURE_K - 1e-4 - 623.15) * f64::from(k) / 119.0;
        let mut changes = Vec::new();
        let mut prev = true;
        for i in 0..=n_rho {
            let rho = 50.0 + 750.0 * f64::from(i) / f64::from(n_rho);
            let positive = region3::pressure_and_slope_unchecked(rho, t).1 > 0.0;
            if i > 0 && positive != prev {
                changes.push(rho);
            }
            prev = positive;
        }
        assert_eq!(
            changes.len(),
            2,
            "T={t}: sign changes of dp/drho at {changes:?}"
        );
        let (vapour, liquid) = region3::spinodal_densities_kg_m3(t).expect("loop below Tc");
        let step = 750.0 / f64::from(n_rho);
        assert!(
            (vapour - changes[0]).abs() <= step && (liquid - changes[1]).abs() <= step,
            "T={t}: spinodals {vapour}, {liquid}; grid sign changes {changes:?}"
        );
        let (_, s_v) = region3::pressure_and_slope_unchecked(vapour, t);
        let (_, s_l) = region3::pressure_and_slope_unchecked(liquid, t);
        let scale = region3::pressure_and_slope_unchecked(700.0, t).1;
        assert!(
            s_v.abs() < 1e-9 * scale && s_l.abs() < 1e-9 * scale,
            "T={t}: slopes at spinodals {s_v:e}, {s_l:e}"
        );
    }
}

/// From 647.1 K to 863.15 K every isotherm of Eq. 28 is monotone on
/// 50 … 800 kg/m³ (so Region 3 above Tc has one root per (p, T)). Between Tc
/// and about Tc + 2e-6 K a loop of below 1e-4 Pa height remains; the solver
/// brackets the whole range there (see `density_near_critical`).
#[test]
fn supercritical_isotherms_are_monotone() {
    assert!(region3::spinodal_densities_kg_m3(647.1).is_none());
    for k in 0..200 {
        let t = 647.1 + (863.15 - 647.1) * f64::from(k) / 199.0;
        for i in 0..=2000 {
            let rho = 50.0 + 750.0 * f64::from(i) / 2000.0;
            let (_, slope) = region3::pressure_and_slope_unchecked(rho, t);
            assert!(
                slope > 0.0,
                "T={t} K rho={rho} kg/m3: dp/drho = {slope:e} not positive"
            );
        }
    }
}

/// The far ends of the brackets bound Region 3: at 50 kg/m³ the pressure is
/// below the B23 pressure and at 800 kg/m³ above 100 MPa on every isotherm.
#[test]
fn bracket_ends_enclose_region_3() {
    for k in 0..=100 {
        let t = 623.15 + (863.15 - 623.15) * f64::from(k) / 100.0;
        let low = region3::pressure_pa_unchecked(region3::MIN_DENSITY_KG_M3, t);
        let high = region3::pressure_pa_unchecked(region3::MAX_DENSITY_KG_M3, t);
        assert!(
            low < b23_pressure_pa(t).min(region4::saturation_pressure_pa_unchecked(
                t.min(CRITICAL_TEMPERATURE_K)
            )),
            "T={t}: p(50)={low}"
        );
        assert!(high > 100e6, "T={t}: p(800)={high}");
    }
}

/// density_pt(p₃(ρ, T), T) == ρ over a dense grid of Region 3, both sides of
/// the saturation line below Tc.
#[test]
fn density_round_trip() {
    let mut worst_rho: f64 = 0.0;
    let mut worst_p: f64 = 0.0;
    let mut count = 0;
    for k in 0..=60 {
        let t = 623.15 + (863.15 - 623.15) * f64::from(k) / 60.0;
        let spinodals = region3::spinodal_densities_kg_m3(t);
        for i in 0..=150 {
            let rho = 60.0 + 700.0 * f64::from(i) / 150.0;
            let (p, slope) = region3::pressure_and_slope_unchecked(rho, t);
            if p < b23_pressure_pa(t) || p > 100e6 || slope <= 0.0 {
                continue;
            }
            // Below Tc the stable root on the wrong side of psat is
            // metastable; the solver returns the stable phase by design.
            if t < CRITICAL_TEMPERATURE_K {
                let psat = region4::saturation_pressure_pa_unchecked(t);
                let (vs, ls) = spinodals.unwrap();
                if (rho <= vs && p > psat) || (rho >= ls && p <= psat) {
                    continue;
                }
            }
            let got = region3::density_pt(p, t).unwrap_or_else(|e| panic!("T={t} p={p}: {e}"));
            let dev = relative_deviation(got, rho);
            let p_back = region3::pressure_pa_unchecked(got, t);
            let dev_p = relative_deviation(p_back, p);
            worst_rho = worst_rho.max(dev);
            worst_p = worst_p.max(dev_p);
            count += 1;
            // The solver stops at a 1e-13 residual or when its bracket is a
            // few ulp wide; in the latter case the residual is the rounding
            // noise of p₃ itself. In compressed liquid near 623 K the terms
            // of δφ_δ reach ~100 and cancel to ~0.15, so that noise reaches
            // ~5e-13 relative; hence 1e-12.
            assert!(
                dev_p <= 1e-12,
                "T={t} p={p}: rho {got}, p back {p_back}, rel dev {dev_p:e}"
            );
            // The grid p itself carries the rounding noise of Eq. 28 (up to
            // 5e-13 relative in the liquid, where p is a small difference of
            // large terms), and the solver stops at a 1e-13 residual; the
            // density error is that over the dimensionless stiffness
            // (ρ/p)(∂p/∂ρ), which falls to 1e-4 near the spinodals. Hence
            // 1e-12/stiffness with a floor of 1e-12 and a cap of 1e-9.
            let stiffness = rho / p * slope;
            assert!(
                dev <= (1e-12 / stiffness).clamp(1e-12, 1e-9),
                "T={t} p={p}: rho {got}, expected {rho}, rel dev {dev:e}"
            );
        }
    }
    assert!(count > 3000, "only {count} points checked");
    println!(
        "density_pt round trip: {count} points, max rel dev rho {worst_rho:.3e}, p {worst_p:.3e}"
    );
}

/// The (p, T) solver in the last hundredths of a kelvin below and above Tc:
/// it never fails and picks the branch by the Region 4 saturation pressure.
#[test]
fn density_near_critical() {
    for dt in [0.01, 0.001, 1e-4, 0.0] {
        let t = CRITICAL_TEMPERATURE_K - dt;
        let psat = region4::saturation_pressure_pa_unchecked(t);
        for dp in [-1000.0, -10.0, 10.0, 1000.0] {
            let p = psat + dp;
            let rho = region3::density_pt(p, t).unwrap_or_else(|e| panic!("T={t} p={p}: {e}"));
            let back = region3::pressure_pa_unchecked(rho, t);
            assert!(
                relative_deviation(back, p) <= 1e-13,
                "T={t} p={p}: rho={rho} p back={back}"
            );
            if dt > 0.0 {
                assert_eq!(
                    rho > 322.0,
                    dp > 0.0,
                    "T={t} p={p}: rho={rho} on the wrong side of rho_c"
                );
            }
        }
    }
    for t in [
        CRITICAL_TEMPERATURE_K + 1e-7,
        CRITICAL_TEMPERATURE_K + 1e-3,
        647.2,
    ] {
        for p in [21.0e6, 22.064e6, 23.0e6] {
            let rho = region3::density_pt(p, t).unwrap_or_else(|e| panic!("T={t} p={p}: {e}"));
            let back = region3::pressure_pa_unchecked(rho, t);
            assert!(
                relative_deviation(back, p) <= 1e-13,
                "T={t} p={p}: rho={rho} p back={back}"
            );
        }
    }
}

#[test]
fn properties_pt_matches_table_33() {
    // The Table 33 pressures as (p, T) inputs must give back the table row
    // (the printed p has 9 digits, so ρ matches to about 1e-8).
    for (t, rho, expected) in TABLE_33 {
        let props = region3::properties_pt(expected[0] * 1e6, t).unwrap();
        let dev = relative_deviation(props.density_kg_m3, rho);
        assert!(
            dev < 1e-7,
            "T={t} p={} MPa: rho {}, expected {rho}, dev {dev:e}",
            expected[0],
            props.density_kg_m3
        );
        assert!(relative_deviation(props.enthalpy_j_kg / 1e3, expected[1]) < 1e-7);
    }
}

#[test]
fn bad_input_gives_typed_errors() {
    use FormulationError::*;
    for (rho, t) in [
        (f64::NAN, 650.0),
        (500.0, f64::NAN),
        (f64::INFINITY, 650.0),
        (500.0, f64::NEG_INFINITY),
    ] {
        assert_eq!(
            region3::properties_rho_t(rho, t),
            Err(NotFinite),
            "rho={rho} T={t}"
        );
    }
    assert!(matches!(
        region3::properties_rho_t(500.0, 600.0),
        Err(TemperatureOutOfRange { .. })
    ));
    assert!(matches!(
        region3::properties_rho_t(500.0, 900.0),
        Err(TemperatureOutOfRange { .. })
    ));
    assert!(matches!(
        region3::properties_rho_t(10.0, 650.0),
        Err(DensityOutOfRange { .. })
    ));
    assert!(matches!(
        region3::properties_rho_t(-1.0, 650.0),
        Err(DensityOutOfRange { .. })
    ));
    // Inside the spinodal at 640 K: mechanically unstable.
    assert!(matches!(
        region3::properties_rho_t(322.0, 640.0),
        Err(OutsideFormulation { .. })
    ));
    for (p, t) in [(f64::NAN, 650.0), (25e6, f64::NAN), (f64::INFINITY, 650.0)] {
        assert_eq!(region3::density_pt(p, t), Err(NotFinite), "p={p} T={t}");
    }
    assert!(matches!(
        region3::density_pt(101e6, 650.0),
        Err(PressureOutOfRange { .. })
    ));
    assert!(matches!(
        region3::density_pt(10e6, 650.0),
        Err(PressureOutOfRange { .. })
    ));
    assert!(matches!(
        region3::density_pt(-1.0, 650.0),
        Err(PressureOutOfRange { .. })
    ));
    assert!(matches!(
        region3::density_pt(50e6, 620.0),
        Err(TemperatureOutOfRange { .. })
    ));
    assert!(matches!(
        region3::properties_pt(50e6, 900.0),
        Err(TemperatureOutOfRange { .. })
    ));
}
