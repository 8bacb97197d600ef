//! The IAPWS-IF97 formulation in `vapora-tables` against the computer-program
//! verification values of IAPWS R7-97(2012), plus range, boundary and
//! consistency checks of our own.
//!
//! Every published value is typed in here with its table named beside it, in
//! the release's units (MPa, kJ/kg, kJ/(kg·K), m³/kg, m/s) and converted
//! explicitly to the SI base units of the API.

use vapora_host_tests::tolerance::{printed_digits_match, relative_deviation};
use vapora_tables::if97::region1;
use vapora_tables::if97::Properties;

/// Digits printed in the verification tables of IAPWS R7-97(2012).
const PRINTED_DIGITS: i32 = 9;

/// Pa per MPa.
const PA_PER_MPA: f64 = 1.0e6;
/// J/kg per kJ/kg (and J/(kg·K) per kJ/(kg·K)).
const J_PER_KJ: f64 = 1.0e3;

/// One row (one state point) of a verification table, in the release's units.
struct Row {
    /// Temperature, K.
    t_k: f64,
    /// Pressure, MPa.
    p_mpa: f64,
    /// Specific volume, m³/kg.
    v_m3_kg: f64,
    /// Specific enthalpy, kJ/kg.
    h_kj_kg: f64,
    /// Specific internal energy, kJ/kg.
    u_kj_kg: f64,
    /// Specific entropy, kJ/(kg·K).
    s_kj_kgk: f64,
    /// Specific isobaric heat capacity, kJ/(kg·K).
    cp_kj_kgk: f64,
    /// Speed of sound, m/s.
    w_m_s: f64,
}

/// Compares one computed state with one published row, every printed digit.
/// Returns the largest relative deviation; panics with a full message on the
/// first property that does not match.
fn check_row(table: &str, row: &Row, computed: &Properties) -> f64 {
    // Convert the computed SI values into the release's units for comparison.
    let pairs = [
        ("v [m3/kg]", computed.specific_volume_m3_kg, row.v_m3_kg),
        ("h [kJ/kg]", computed.enthalpy_j_kg / J_PER_KJ, row.h_kj_kg),
        (
            "u [kJ/kg]",
            computed.internal_energy_j_kg / J_PER_KJ,
            row.u_kj_kg,
        ),
        (
            "s [kJ/(kg K)]",
            computed.entropy_j_kgk / J_PER_KJ,
            row.s_kj_kgk,
        ),
        (
            "cp [kJ/(kg K)]",
            computed.cp_j_kgk / J_PER_KJ,
            row.cp_kj_kgk,
        ),
        ("w [m/s]", computed.speed_of_sound_m_s, row.w_m_s),
    ];
    let mut worst = 0.0_f64;
    for (name, value, printed) in pairs {
        let dev = relative_deviation(value, printed);
        assert!(
            printed_digits_match(value, printed, PRINTED_DIGITS),
            "{table}: T = {} K, p = {} MPa: {name} = {value:.12e}, expected {printed:.9e} \
             (rel. deviation {dev:.3e})",
            row.t_k,
            row.p_mpa
        );
        worst = worst.max(dev);
    }
    worst
}

/// IAPWS R7-97(2012) Table 5: Region 1 at T = 300 K, p = 3 MPa;
/// T = 300 K, p = 80 MPa; T = 500 K, p = 3 MPa.
const TABLE_5: [Row; 3] = [
    Row {
        t_k: 300.0,
        p_mpa: 3.0,
        v_m3_kg: 0.100215168e-2,
        h_kj_kg: 0.115331273e3,
        u_kj_kg: 0.112324818e3,
        s_kj_kgk: 0.392294792,
        cp_kj_kgk: 0.417301218e1,
        w_m_s: 0.150773921e4,
    },
    Row {
        t_k: 300.0,
        p_mpa: 80.0,
        v_m3_kg: 0.971180894e-3,
        h_kj_kg: 0.184142828e3,
        u_kj_kg: 0.106448356e3,
        s_kj_kgk: 0.368563852,
        cp_kj_kgk: 0.401008987e1,
        w_m_s: 0.163469054e4,
    },
    Row {
        t_k: 500.0,
        p_mpa: 3.0,
        v_m3_kg: 0.120241800e-2,
        h_kj_kg: 0.975542239e3,
        u_kj_kg: 0.971934985e3,
        s_kj_kgk: 0.258041912e1,
        cp_kj_kgk: 0.465580682e1,
        w_m_s: 0.124071337e4,
    },
];

fn table_5_max_deviation() -> f64 {
    TABLE_5
        .iter()
        .map(|row| {
            let props = region1::properties(row.p_mpa * PA_PER_MPA, row.t_k).unwrap_or_else(|e| {
                panic!("Table 5: T = {} K, p = {} MPa: {e}", row.t_k, row.p_mpa)
            });
            check_row("IAPWS R7-97(2012) Table 5", row, &props)
        })
        .fold(0.0, f64::max)
}

#[test]
fn region1_table_5() {
    table_5_max_deviation();
}
