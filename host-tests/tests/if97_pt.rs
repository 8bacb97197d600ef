//! The (p, T) dispatcher over Regions 1, 2, 3 and 5, and the viscosity at
//! (p, T) built on it.

use vapora_host_tests::tolerance::{printed_digits_match, relative_deviation};
use vapora_tables::if97::{pt, region3, viscosity, FormulationError, Region};

/// (p MPa, T K, v m³/kg printed, region): IAPWS R7-97(2012) Tables 5, 15 and
/// 42 (typed in from the release).
const POINTS: [(f64, f64, f64, Region); 9] = [
    (3.0, 300.0, 0.100215168e-2, Region::Region1), // Table 5
    (80.0, 300.0, 0.971180894e-3, Region::Region1), // Table 5
    (3.0, 500.0, 0.120241800e-2, Region::Region1), // Table 5
    (0.0035, 300.0, 0.394913866e2, Region::Region2), // Table 15
    (0.0035, 700.0, 0.923015898e2, Region::Region2), // Table 15
    (30.0, 700.0, 0.542946619e-2, Region::Region2), // Table 15
    (0.5, 1500.0, 0.138455090e1, Region::Region5), // Table 42
    (30.0, 1500.0, 0.230761299e-1, Region::Region5), // Table 42
    (30.0, 2000.0, 0.311385219e-1, Region::Region5), // Table 42
];

#[test]
fn dispatch_reproduces_region_tables() {
    for (p, t, v, region) in POINTS {
        let (props, got_region) = pt::properties_pt_with_region(p * 1e6, t).unwrap();
        assert_eq!(got_region, region, "p={p} MPa T={t} K");
        assert!(
            printed_digits_match(props.specific_volume_m3_kg, v, 9),
            "p={p} MPa T={t} K: v {:.12e}, printed {v:.9e}",
            props.specific_volume_m3_kg
        );
    }
    // Region 3: the Table 33 states as (p, T) inputs (IAPWS R7-97(2012)
    // Table 33: T = 650 K, ρ = 500 kg/m³, p = 25.5837018 MPa; T = 750 K,
    // ρ = 500 kg/m³, p = 78.3095639 MPa).
    for (p, t, rho) in [(25.5837018, 650.0, 500.0), (78.3095639, 750.0, 500.0)] {
        let (props, region) = pt::properties_pt_with_region(p * 1e6, t).unwrap();
        assert_eq!(region, Region::Region3);
        let dev = relative_deviation(props.density_kg_m3, rho);
        assert!(
            dev < 1e-7,
            "p={p} MPa T={t} K: rho {} expected {rho}, dev {dev:e}",
            props.density_kg_m3
        );
    }
}

#[test]
fn dispatch_errors() {
    use FormulationError::*;
    assert_eq!(pt::properties_pt(f64::NAN, 300.0), Err(NotFinite));
    assert_eq!(pt::properties_pt(1e5, f64::INFINITY), Err(NotFinite));
    assert!(matches!(
        pt::properties_pt(1e5, 200.0),
        Err(TemperatureOutOfRange { .. })
    ));
    assert!(matches!(
        pt::properties_pt(1e5, 2300.0),
        Err(TemperatureOutOfRange { .. })
    ));
    assert!(matches!(
        pt::properties_pt(0.0, 300.0),
        Err(PressureOutOfRange { .. })
    ));
    assert!(matches!(
        pt::properties_pt(101e6, 300.0),
        Err(PressureOutOfRange { .. })
    ));
    assert!(matches!(
        pt::properties_pt(60e6, 1500.0),
        Err(OutsideFormulation { .. })
    ));
}

#[test]
fn viscosity_at_pressure_and_temperature() {
    // Water at 20 °C and 1 atm: 1.0016 mPa·s (common practice, no source).
    let mu = viscosity::viscosity_pt(0.101_325e6, 293.15).unwrap();
    assert!(
        (mu - 1.0016e-3).abs() < 1e-6,
        "mu(1 atm, 20 C) = {mu} Pa s, expected 1.0016e-3"
    );
    // Region 3: viscosity_pt at p₃(ρ, T) equals the correlation at that ρ
    // (R12-08 Table 4 has no Region 3 point; this checks the wiring).
    let p = region3::pressure_pa_unchecked(500.0, 650.0);
    let a = viscosity::viscosity_pt(p, 650.0).unwrap();
    let b = viscosity::viscosity_pa_s(500.0, 650.0).unwrap();
    assert!(relative_deviation(a, b) < 1e-9, "Region 3: {a} vs {b}");
    // Region 5 up to 1173.15 K, then out of range.
    assert!(viscosity::viscosity_pt(1e6, 1173.15).is_ok());
    assert!(matches!(
        viscosity::viscosity_pt(1e6, 1200.0),
        Err(FormulationError::TemperatureOutOfRange { .. })
    ));
    assert_eq!(
        viscosity::viscosity_pt(f64::NAN, 300.0),
        Err(FormulationError::NotFinite)
    );
}

/// Over a wide sweep of inputs, including out-of-range and edge values,
/// every function either returns a typed error or a result with every field
/// finite (cp = +inf only at the critical point, by documented design);
/// none panics.
#[test]
fn never_nan_inside_ok() {
    use vapora_tables::if97::{inverse, saturation, Properties};
    fn finite(p: &Properties) -> bool {
        [
            p.pressure_pa,
            p.temperature_k,
            p.density_kg_m3,
            p.specific_volume_m3_kg,
            p.enthalpy_j_kg,
            p.internal_energy_j_kg,
            p.entropy_j_kgk,
            p.cp_j_kgk,
            p.cv_j_kgk,
            p.speed_of_sound_m_s,
            p.isentropic_exponent,
        ]
        .iter()
        .all(|x| x.is_finite())
    }
    let specials = [
        f64::NAN,
        f64::INFINITY,
        f64::NEG_INFINITY,
        0.0,
        -0.0,
        f64::MIN_POSITIVE,
        f64::MAX,
        -1.0,
    ];
    let mut temps: Vec<f64> = (0..=400)
        .map(|k| 250.0 + 2100.0 * f64::from(k) / 400.0)
        .collect();
    temps.extend([
        273.15,
        273.16,
        623.15,
        647.096 - 1e-9,
        647.096,
        863.15,
        1073.15,
        1173.15,
        2273.15,
    ]);
    temps.extend(specials);
    let mut pressures: Vec<f64> = (0..=200)
        .map(|k| 10f64.powf(-1.0 + 9.5 * f64::from(k) / 200.0))
        .collect();
    pressures.extend([611.213, 16.529_164_252_6e6, 22.064e6, 50e6, 100e6]);
    pressures.extend(specials);
    for &t in &temps {
        if let Ok(s) = saturation::at_temperature(t) {
            if t < 647.096 {
                assert!(
                    finite(&s.liquid) && finite(&s.vapour),
                    "saturation T={t}: {s:?}"
                );
            }
        }
        for rho in [-1.0, 0.0, 1.0, 60.0, 322.0, 500.0, 799.0, 1000.0, f64::NAN] {
            if let Ok(p) = region3::properties_rho_t(rho, t) {
                assert!(finite(&p), "region3 rho={rho} T={t}: {p:?}");
            }
            if let Ok(mu) = viscosity::viscosity_pa_s(rho, t) {
                assert!(
                    mu.is_finite() && mu > 0.0,
                    "viscosity rho={rho} T={t}: {mu}"
                );
            }
        }
        for &p in &pressures {
            if let Ok(props) = pt::properties_pt(p, t) {
                assert!(finite(&props), "pt p={p} T={t}: {props:?}");
                for (x, entropy) in [(props.enthalpy_j_kg, false), (props.entropy_j_kgk, true)] {
                    let r = if entropy {
                        inverse::temperature_ps(p, x)
                    } else {
                        inverse::temperature_ph(p, x)
                    };
                    if let Ok((tb, _)) = r {
                        assert!(tb.is_finite() && tb > 0.0, "inverse p={p} x={x}: {tb}");
                    }
                }
            }
            if let Ok(mu) = viscosity::viscosity_pt(p, t) {
                assert!(mu.is_finite() && mu > 0.0, "viscosity_pt p={p} T={t}: {mu}");
            }
        }
    }
    for &p in &pressures {
        if let Ok(s) = saturation::at_pressure(p) {
            if p < 22.064e6 {
                assert!(
                    finite(&s.liquid) && finite(&s.vapour),
                    "saturation p={p}: {s:?}"
                );
            }
        }
        for x in [-1e7, -1.0, 0.0, 1e3, 1e5, 1e6, 3e6, 1e7, 1e9, f64::NAN] {
            for (t, _) in [inverse::temperature_ph(p, x), inverse::temperature_ps(p, x)]
                .into_iter()
                .flatten()
            {
                assert!(t.is_finite() && t > 0.0, "inverse p={p} x={x}: {t}");
            }
        }
    }
}
