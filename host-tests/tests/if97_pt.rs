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
