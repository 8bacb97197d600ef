//! Backward equations T(p, h) and T(p, s) of Regions 1 and 2 against the
//! release's verification tables, and the exact inversions built on them.
//!
//! The verification values below are NOT in /work/shared/reference: they are
//! typed from memory of IAPWS R7-97(2012) Tables 7, 9, 24 and 29 and of the
//! B2bc check value after Eq. 21.

use vapora_host_tests::tolerance::{printed_digits_match, relative_deviation};
use vapora_tables::if97::backward;

/// Asserts every printed digit (9 significant) and returns the relative deviation.
fn check(table: &str, p_mpa: f64, x: f64, got: f64, printed: f64) -> f64 {
    let dev = relative_deviation(got, printed);
    assert!(
        printed_digits_match(got, printed, 9),
        "{table}: p={p_mpa} MPa, second input {x}: T = {got:.12e} K, printed {printed:.9e}, rel dev {dev:.3e}"
    );
    dev
}

/// IAPWS R7-97(2012) Table 7 (from memory): T1(p, h), (p MPa, h kJ/kg, T K).
const TABLE_7: [(f64, f64, f64); 3] = [
    (3.0, 500.0, 0.391798509e3),
    (80.0, 500.0, 0.378108626e3),
    (80.0, 1500.0, 0.611041229e3),
];

/// IAPWS R7-97(2012) Table 9 (from memory): T1(p, s), (p MPa, s kJ/(kg K), T K).
const TABLE_9: [(f64, f64, f64); 3] = [
    (3.0, 0.5, 0.307842258e3),
    (80.0, 0.5, 0.309979785e3),
    (80.0, 3.0, 0.565899909e3),
];

/// IAPWS R7-97(2012) Table 24 (from memory): T2(p, h), three points each in
/// 2a, 2b, 2c, (p MPa, h kJ/kg, T K, subregion).
const TABLE_24: [(f64, f64, f64, backward::Subregion2); 9] = [
    (0.001, 3000.0, 0.534433241e3, backward::Subregion2::A),
    (3.0, 3000.0, 0.575373370e3, backward::Subregion2::A),
    (3.0, 4000.0, 0.101077577e4, backward::Subregion2::A),
    (5.0, 3500.0, 0.801299102e3, backward::Subregion2::B),
    (5.0, 4000.0, 0.101531583e4, backward::Subregion2::B),
    (25.0, 3500.0, 0.875279054e3, backward::Subregion2::B),
    (40.0, 2700.0, 0.743056411e3, backward::Subregion2::C),
    (60.0, 2700.0, 0.791137067e3, backward::Subregion2::C),
    (60.0, 3200.0, 0.882756860e3, backward::Subregion2::C),
];

/// IAPWS R7-97(2012) Table 29 (from memory): T2(p, s), (p MPa, s kJ/(kg K), T K, subregion).
const TABLE_29: [(f64, f64, f64, backward::Subregion2); 9] = [
    (0.1, 7.5, 0.399517097e3, backward::Subregion2::A),
    (0.1, 8.0, 0.514127081e3, backward::Subregion2::A),
    (2.5, 8.0, 0.103984917e4, backward::Subregion2::A),
    (8.0, 6.0, 0.600484040e3, backward::Subregion2::B),
    (8.0, 7.5, 0.106495556e4, backward::Subregion2::B),
    (90.0, 6.0, 0.103801126e4, backward::Subregion2::B),
    (20.0, 5.75, 0.697992849e3, backward::Subregion2::C),
    (80.0, 5.25, 0.854011484e3, backward::Subregion2::C),
    (80.0, 5.75, 0.949017998e3, backward::Subregion2::C),
];

#[test]
fn table_7_region1_t_ph() {
    let mut worst: f64 = 0.0;
    for (p, h, t) in TABLE_7 {
        let got = backward::region1_temperature_ph_unchecked(p * 1e6, h * 1e3);
        worst = worst.max(check("Table 7", p, h, got, t));
    }
    println!("Table 7: max rel dev {worst:.3e}");
}

#[test]
fn table_9_region1_t_ps() {
    let mut worst: f64 = 0.0;
    for (p, s, t) in TABLE_9 {
        let got = backward::region1_temperature_ps_unchecked(p * 1e6, s * 1e3);
        worst = worst.max(check("Table 9", p, s, got, t));
    }
    println!("Table 9: max rel dev {worst:.3e}");
}

#[test]
fn table_24_region2_t_ph() {
    let mut worst: f64 = 0.0;
    for (p, h, t, sub) in TABLE_24 {
        assert_eq!(
            backward::subregion2_ph(p * 1e6, h * 1e3),
            sub,
            "p={p} MPa h={h} kJ/kg"
        );
        let got = backward::region2_temperature_ph_unchecked(p * 1e6, h * 1e3);
        worst = worst.max(check("Table 24", p, h, got, t));
    }
    println!("Table 24: max rel dev {worst:.3e}");
}

#[test]
fn table_29_region2_t_ps() {
    let mut worst: f64 = 0.0;
    for (p, s, t, sub) in TABLE_29 {
        assert_eq!(
            backward::subregion2_ps(p * 1e6, s * 1e3),
            sub,
            "p={p} MPa s={s} kJ/(kg K)"
        );
        let got = backward::region2_temperature_ps_unchecked(p * 1e6, s * 1e3);
        worst = worst.max(check("Table 29", p, s, got, t));
    }
    println!("Table 29: max rel dev {worst:.3e}");
}

/// B2bc: h = 0.3516004323e4 kJ/kg ↔ p = 0.1e3 MPa (IAPWS R7-97(2012), check
/// values given after Eq. 21, from memory).
#[test]
fn b2bc_check_value() {
    let p = backward::b2bc_pressure_pa(0.3516004323e4 * 1e3);
    assert!(
        printed_digits_match(p / 1e6, 100.0, 9),
        "B2bc p(h=3516.004323 kJ/kg) = {p} Pa, expected 100 MPa"
    );
    let h = backward::b2bc_enthalpy_j_kg(100e6);
    assert!(
        printed_digits_match(h / 1e3, 0.3516004323e4, 10),
        "B2bc h(100 MPa) = {h} J/kg, expected 3516.004323 kJ/kg"
    );
}
