//! Viscosity (IAPWS R12-08, industrial use, μ̄₂ = 1) against the release's
//! verification table.

use vapora_host_tests::tolerance::{printed_digits_match, relative_deviation};
use vapora_tables::if97::viscosity::viscosity_pa_s;
use vapora_tables::if97::FormulationError;

/// IAPWS R12-08 Table 4 (typed in from the release):
/// (T K, ρ kg/m³, μ µPa·s, printed to 6 decimals).
const TABLE_4: [(f64, f64, f64); 11] = [
    (298.15, 998.0, 889.735100),
    (298.15, 1200.0, 1437.649467),
    (373.15, 1000.0, 307.883622),
    (433.15, 1.0, 14.538324),
    (433.15, 1000.0, 217.685358),
    (873.15, 1.0, 32.619287),
    (873.15, 100.0, 35.802262),
    (873.15, 600.0, 77.430195),
    (1173.15, 1.0, 44.217245),
    (1173.15, 100.0, 47.640433),
    (1173.15, 400.0, 64.154608),
];

#[test]
fn table_4_every_printed_digit() {
    let mut worst: f64 = 0.0;
    for (t, rho, printed) in TABLE_4 {
        let mu = viscosity_pa_s(rho, t).unwrap() * 1e6;
        let dev = relative_deviation(mu, printed);
        worst = worst.max(dev);
        // Six decimals printed: the number of significant digits is the
        // number of integer digits plus six.
        let digits = printed.log10().floor() as i32 + 1 + 6;
        assert!(
            printed_digits_match(mu, printed, digits),
            "R12-08 Table 4 T={t} K rho={rho} kg/m3: got {mu:.9} uPa s, printed {printed:.6}, rel dev {dev:.3e}"
        );
    }
    println!("R12-08 Table 4: max relative deviation {worst:.3e}");
}

#[test]
fn bad_input_gives_typed_errors() {
    use FormulationError::*;
    for (rho, t) in [
        (f64::NAN, 300.0),
        (998.0, f64::NAN),
        (f64::INFINITY, 300.0),
        (998.0, f64::NEG_INFINITY),
    ] {
        assert_eq!(viscosity_pa_s(rho, t), Err(NotFinite), "rho={rho} T={t}");
    }
    assert!(matches!(
        viscosity_pa_s(998.0, 200.0),
        Err(TemperatureOutOfRange { .. })
    ));
    assert!(matches!(
        viscosity_pa_s(1.0, 1200.0),
        Err(TemperatureOutOfRange { .. })
    ));
    assert!(matches!(
        viscosity_pa_s(0.0, 300.0),
        Err(DensityOutOfRange { .. })
    ));
    assert!(matches!(
        viscosity_pa_s(-5.0, 300.0),
        Err(DensityOutOfRange { .. })
    ));
    assert!(matches!(
        viscosity_pa_s(2000.0, 300.0),
        Err(DensityOutOfRange { .. })
    ));
}
