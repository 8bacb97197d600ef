//! The IAPWS-IF97 formulation in `vapora-tables` against the computer-program
//! verification values of IAPWS R7-97(2012), plus range, boundary and
//! consistency checks of our own.
//!
//! Every published value is typed in here with its table named beside it, in
//! the release's units (MPa, kJ/kg, kJ/(kg·K), m³/kg, m/s) and converted
//! explicitly to the SI base units of the API.

use vapora_host_tests::tolerance::{
    printed_digits_match, relative_deviation, ABOUT_REL, ABOUT_TEMPERATURE_K, BOILING_POINT_K,
    FINITE_DIFFERENCE_REL, LATENT_HEAT_J_KG, SATURATION_CONTINUITY_REL, SATURATION_ROUND_TRIP_REL,
};
use vapora_tables::if97::{b23, region1, region2, region4, region5, regions};
use vapora_tables::if97::{FormulationError, Properties, Region};

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

/// IAPWS R7-97(2012) Table 15: Region 2 at T = 300 K, p = 0.0035 MPa;
/// T = 700 K, p = 0.0035 MPa; T = 700 K, p = 30 MPa.
const TABLE_15: [Row; 3] = [
    Row {
        t_k: 300.0,
        p_mpa: 0.0035,
        v_m3_kg: 0.394913866e2,
        h_kj_kg: 0.254991145e4,
        u_kj_kg: 0.241169160e4,
        s_kj_kgk: 0.852238967e1,
        cp_kj_kgk: 0.191300162e1,
        w_m_s: 0.427920172e3,
    },
    Row {
        t_k: 700.0,
        p_mpa: 0.0035,
        v_m3_kg: 0.923015898e2,
        h_kj_kg: 0.333568375e4,
        u_kj_kg: 0.301262819e4,
        s_kj_kgk: 0.101749996e2,
        cp_kj_kgk: 0.208141274e1,
        w_m_s: 0.644289068e3,
    },
    Row {
        t_k: 700.0,
        p_mpa: 30.0,
        v_m3_kg: 0.542946619e-2,
        h_kj_kg: 0.263149474e4,
        u_kj_kg: 0.246861076e4,
        s_kj_kgk: 0.517540298e1,
        cp_kj_kgk: 0.103505092e2,
        w_m_s: 0.480386523e3,
    },
];

fn table_15_max_deviation() -> f64 {
    TABLE_15
        .iter()
        .map(|row| {
            let props = region2::properties(row.p_mpa * PA_PER_MPA, row.t_k).unwrap_or_else(|e| {
                panic!("Table 15: T = {} K, p = {} MPa: {e}", row.t_k, row.p_mpa)
            });
            check_row("IAPWS R7-97(2012) Table 15", row, &props)
        })
        .fold(0.0, f64::max)
}

#[test]
fn region2_table_15() {
    table_15_max_deviation();
}

/// IAPWS R7-97(2012) Table 18: metastable-vapour region (Eq. 18) at
/// T = 450 K, p = 1 MPa; T = 440 K, p = 1 MPa; T = 450 K, p = 1.5 MPa.
/// From memory of the release: Table 18 is not among the reference values
/// the project was given, so these rows were typed from recollection; their
/// agreement to nine digits with an independent transcription of Table 16 is
/// what vouches for both.
const TABLE_18: [Row; 3] = [
    Row {
        t_k: 450.0,
        p_mpa: 1.0,
        v_m3_kg: 0.192516540,
        h_kj_kg: 0.276881115e4,
        u_kj_kg: 0.257629461e4,
        s_kj_kgk: 0.656660377e1,
        cp_kj_kgk: 0.276349265e1,
        w_m_s: 0.498408101e3,
    },
    Row {
        t_k: 440.0,
        p_mpa: 1.0,
        v_m3_kg: 0.186212297,
        h_kj_kg: 0.274015123e4,
        u_kj_kg: 0.255393894e4,
        s_kj_kgk: 0.650218759e1,
        cp_kj_kgk: 0.298166443e1,
        w_m_s: 0.489363295e3,
    },
    Row {
        t_k: 450.0,
        p_mpa: 1.5,
        v_m3_kg: 0.121685206,
        h_kj_kg: 0.272134539e4,
        u_kj_kg: 0.253881758e4,
        s_kj_kgk: 0.629170440e1,
        cp_kj_kgk: 0.362795578e1,
        w_m_s: 0.481941819e3,
    },
];

fn table_18_max_deviation() -> f64 {
    TABLE_18
        .iter()
        .map(|row| {
            let props = region2::metastable_properties(row.p_mpa * PA_PER_MPA, row.t_k)
                .unwrap_or_else(|e| {
                    panic!("Table 18: T = {} K, p = {} MPa: {e}", row.t_k, row.p_mpa)
                });
            check_row("IAPWS R7-97(2012) Table 18 (from memory)", row, &props)
        })
        .fold(0.0, f64::max)
}

#[test]
fn region2_metastable_table_18() {
    table_18_max_deviation();
}

/// IAPWS R7-97(2012), B23 check value below Eqs. 5 and 6: T = 623.15 K
/// corresponds to p = 0.165291643e2 MPa.
const B23_CHECK_T_K: f64 = 623.15;
/// IAPWS R7-97(2012), B23 check value (MPa).
const B23_CHECK_P_MPA: f64 = 0.165291643e2;

/// Both directions of the B23 check; returns the larger relative deviation.
fn b23_max_deviation() -> f64 {
    let p_mpa = b23::pressure_pa(B23_CHECK_T_K).expect("623.15 K is on the B23 line") / PA_PER_MPA;
    let dev_p = relative_deviation(p_mpa, B23_CHECK_P_MPA);
    assert!(
        printed_digits_match(p_mpa, B23_CHECK_P_MPA, PRINTED_DIGITS),
        "B23 (Eq. 5): T = {B23_CHECK_T_K} K: p = {p_mpa:.12e} MPa, expected {B23_CHECK_P_MPA:.9e} \
         (rel. deviation {dev_p:.3e})"
    );
    let t_k = b23::temperature_k(B23_CHECK_P_MPA * PA_PER_MPA)
        .expect("16.5291643 MPa is on the B23 line");
    let dev_t = relative_deviation(t_k, B23_CHECK_T_K);
    // The printed pressure has nine digits, so the inverse reproduces
    // 623.15 K only to the digits that pressure carries; nine digits of T.
    assert!(
        printed_digits_match(t_k, 0.623150000e3, PRINTED_DIGITS),
        "B23 (Eq. 6): p = {B23_CHECK_P_MPA} MPa: T = {t_k:.12e} K, expected {B23_CHECK_T_K} \
         (rel. deviation {dev_t:.3e})"
    );
    dev_p.max(dev_t)
}

#[test]
fn b23_check_value_both_directions() {
    b23_max_deviation();
}

/// IAPWS R7-97(2012) Table 42: Region 5 at T = 1500 K, p = 0.5 MPa;
/// T = 1500 K, p = 30 MPa; T = 2000 K, p = 30 MPa.
const TABLE_42: [Row; 3] = [
    Row {
        t_k: 1500.0,
        p_mpa: 0.5,
        v_m3_kg: 0.138455090e1,
        h_kj_kg: 0.521976855e4,
        u_kj_kg: 0.452749310e4,
        s_kj_kgk: 0.965408875e1,
        cp_kj_kgk: 0.261609445e1,
        w_m_s: 0.917068690e3,
    },
    Row {
        t_k: 1500.0,
        p_mpa: 30.0,
        v_m3_kg: 0.230761299e-1,
        h_kj_kg: 0.516723514e4,
        u_kj_kg: 0.447495124e4,
        s_kj_kgk: 0.772970133e1,
        cp_kj_kgk: 0.272724317e1,
        w_m_s: 0.928548002e3,
    },
    Row {
        t_k: 2000.0,
        p_mpa: 30.0,
        v_m3_kg: 0.311385219e-1,
        h_kj_kg: 0.657122604e4,
        u_kj_kg: 0.563707038e4,
        s_kj_kgk: 0.853640523e1,
        cp_kj_kgk: 0.288569882e1,
        w_m_s: 0.106736948e4,
    },
];

fn table_42_max_deviation() -> f64 {
    TABLE_42
        .iter()
        .map(|row| {
            let props = region5::properties(row.p_mpa * PA_PER_MPA, row.t_k).unwrap_or_else(|e| {
                panic!("Table 42: T = {} K, p = {} MPa: {e}", row.t_k, row.p_mpa)
            });
            check_row("IAPWS R7-97(2012) Table 42", row, &props)
        })
        .fold(0.0, f64::max)
}

#[test]
fn region5_table_42() {
    table_42_max_deviation();
}

/// IAPWS R7-97(2012) Table 35: saturation pressure (MPa) at T (K).
const TABLE_35: [(f64, f64); 3] = [
    (300.0, 0.353658941e-2),
    (500.0, 0.263889776e1),
    (600.0, 0.123443146e2),
];

/// IAPWS R7-97(2012) Table 36: saturation temperature (K) at p (MPa).
const TABLE_36: [(f64, f64); 3] = [
    (0.1, 0.372755919e3),
    (1.0, 0.453035632e3),
    (10.0, 0.584149488e3),
];

fn table_35_max_deviation() -> f64 {
    let mut worst = 0.0_f64;
    for (t_k, printed_mpa) in TABLE_35 {
        let p_mpa = region4::saturation_pressure_pa(t_k)
            .unwrap_or_else(|e| panic!("Table 35: T = {t_k} K: {e}"))
            / PA_PER_MPA;
        let dev = relative_deviation(p_mpa, printed_mpa);
        assert!(
            printed_digits_match(p_mpa, printed_mpa, PRINTED_DIGITS),
            "IAPWS R7-97(2012) Table 35: T = {t_k} K: psat = {p_mpa:.12e} MPa, expected \
             {printed_mpa:.9e} (rel. deviation {dev:.3e})"
        );
        worst = worst.max(dev);
    }
    worst
}

fn table_36_max_deviation() -> f64 {
    let mut worst = 0.0_f64;
    for (p_mpa, printed_k) in TABLE_36 {
        let t_k = region4::saturation_temperature_k(p_mpa * PA_PER_MPA)
            .unwrap_or_else(|e| panic!("Table 36: p = {p_mpa} MPa: {e}"));
        let dev = relative_deviation(t_k, printed_k);
        assert!(
            printed_digits_match(t_k, printed_k, PRINTED_DIGITS),
            "IAPWS R7-97(2012) Table 36: p = {p_mpa} MPa: Tsat = {t_k:.12e} K, expected \
             {printed_k:.9e} (rel. deviation {dev:.3e})"
        );
        worst = worst.max(dev);
    }
    worst
}

#[test]
fn region4_tables_35_and_36() {
    table_35_max_deviation();
    table_36_max_deviation();
}

/// Prints the largest relative deviation from the printed value seen in each
/// verification table (run with `--nocapture` to see it). The per-table
/// functions assert every printed digit, so this test fails exactly when
/// they do.
#[test]
fn summary_of_deviations_per_table() {
    let rows = [
        ("Table 5 (Region 1)", table_5_max_deviation()),
        ("Table 15 (Region 2)", table_15_max_deviation()),
        (
            "Table 18 (Region 2 metastable, from memory)",
            table_18_max_deviation(),
        ),
        ("Table 42 (Region 5)", table_42_max_deviation()),
        ("B23 check value (both directions)", b23_max_deviation()),
        ("Table 35 (Region 4, psat)", table_35_max_deviation()),
        ("Table 36 (Region 4, Tsat)", table_36_max_deviation()),
    ];
    println!("IAPWS R7-97(2012) verification values, largest relative deviation per table:");
    for (table, dev) in rows {
        println!("  {table}: max rel dev = {dev:.2e}");
        // Nine printed digits allow at most 5e-9 relative (leading digit 1).
        assert!(
            dev <= 5e-9 * (1.0 + 1e-9),
            "{table}: max rel dev = {dev:.3e}"
        );
    }
}

// ---------------------------------------------------------------------------
// Region selection.

/// Shorthand for the expected region of a (p in MPa, T in K) point.
fn assert_region(p_pa: f64, t_k: f64, expected: Region, why: &str) {
    let got = regions::region_pt(p_pa, t_k);
    assert_eq!(
        got,
        Ok(expected),
        "region_pt(p = {p_pa} Pa, T = {t_k} K) = {got:?}, expected {expected:?} ({why})"
    );
}

#[test]
fn region_of_the_verification_points() {
    for row in &TABLE_5 {
        assert_region(
            row.p_mpa * PA_PER_MPA,
            row.t_k,
            Region::Region1,
            "IAPWS R7-97(2012) Table 5",
        );
    }
    for row in &TABLE_15 {
        assert_region(
            row.p_mpa * PA_PER_MPA,
            row.t_k,
            Region::Region2,
            "IAPWS R7-97(2012) Table 15",
        );
    }
    for row in &TABLE_42 {
        assert_region(
            row.p_mpa * PA_PER_MPA,
            row.t_k,
            Region::Region5,
            "IAPWS R7-97(2012) Table 42",
        );
    }
    // IAPWS R7-97(2012) Table 33: the Region 3 verification points, given
    // there as (T, ρ) with the resulting p (MPa).
    for (p_mpa, t_k) in [
        (0.255837018e2, 650.0),
        (0.222930643e2, 650.0),
        (0.783095639e2, 750.0),
    ] {
        assert_region(
            p_mpa * PA_PER_MPA,
            t_k,
            Region::Region3,
            "IAPWS R7-97(2012) Table 33",
        );
    }
}

#[test]
fn region_selection_at_the_boundaries() {
    // Saturation line below 623.15 K: on it → Region 1 (documented choice),
    // one ulp-scale step below → Region 2.
    for t_k in [273.15, 300.0, 373.15, 500.0, 600.0, 623.15] {
        let p_sat = region4::saturation_pressure_pa(t_k).expect("in range");
        assert_region(
            p_sat,
            t_k,
            Region::Region1,
            "exactly at psat(T): saturated liquid",
        );
        assert_region(
            p_sat * (1.0 + 1e-12),
            t_k,
            Region::Region1,
            "just above psat(T)",
        );
        assert_region(
            p_sat * (1.0 - 1e-12),
            t_k,
            Region::Region2,
            "just below psat(T)",
        );
    }
    // B23 between 623.15 K and 863.15 K: on it → Region 2, above → Region 3.
    for t_k in [623.150_001, 650.0, 700.0, 800.0, 863.15] {
        let p_b23 = b23::pressure_pa(t_k).expect("in range");
        if p_b23 > 100.0e6 {
            // p_B23(863.15 K) is 100 MPa + 3e-13 relative: above the
            // formulation, so only the side below can be checked there.
            assert_region(100.0e6, t_k, Region::Region2, "100 MPa just under B23");
            continue;
        }
        assert_region(p_b23, t_k, Region::Region2, "exactly on B23");
        assert_region(
            p_b23 * (1.0 - 1e-12),
            t_k,
            Region::Region2,
            "just below B23",
        );
        if p_b23 * (1.0 + 1e-12) <= 100.0e6 {
            assert_region(
                p_b23 * (1.0 + 1e-12),
                t_k,
                Region::Region3,
                "just above B23",
            );
        }
    }
    // Above 623.15 K the liquid side belongs to Region 3.
    assert_region(50.0e6, 623.16, Region::Region3, "above 623.15 K, above B23");
    assert_region(
        50.0e6,
        623.15,
        Region::Region1,
        "623.15 K belongs to Region 1",
    );
    // Between 863.15 K and 1073.15 K everything up to 100 MPa is Region 2.
    assert_region(100.0e6, 863.16, Region::Region2, "above 863.15 K");
    assert_region(
        100.0e6,
        1073.15,
        Region::Region2,
        "1073.15 K belongs to Region 2",
    );
    assert_region(1.0, 1073.15, Region::Region2, "1 Pa, 1073.15 K");
    // Region 5 from just above 1073.15 K to 2273.15 K at p ≤ 50 MPa.
    assert_region(50.0e6, 1073.16, Region::Region5, "just above 1073.15 K");
    assert_region(50.0e6, 2273.15, Region::Region5, "top corner of Region 5");
    assert_region(1.0, 2273.15, Region::Region5, "1 Pa, 2273.15 K");
    // Region 1 up to 100 MPa.
    assert_region(100.0e6, 273.15, Region::Region1, "100 MPa, 273.15 K");
    assert_region(100.0e6, 623.15, Region::Region1, "100 MPa, 623.15 K");
    // Low pressures at low temperature are vapour.
    assert_region(1.0, 273.15, Region::Region2, "1 Pa, 273.15 K");
    // No region covers 50–100 MPa above 1073.15 K.
    let got = regions::region_pt(50.1e6, 1500.0);
    assert!(
        matches!(got, Err(FormulationError::OutsideFormulation { .. })),
        "region_pt(50.1 MPa, 1500 K) = {got:?}, expected OutsideFormulation"
    );
}

/// Over a grid covering the whole (p, T) plane of IF97, the region chosen by
/// `region_pt` is one whose checked equation accepts the point, and the
/// checked equations of the other Gibbs regions reject it except within
/// their documented slack at the saturation line.
#[test]
fn region_selection_agrees_with_region_ranges() {
    let mut counts = [0usize; 5];
    for i in 0..=120 {
        // log-spaced pressure from 1 Pa to 100 MPa
        let p_pa = 10f64.powf(f64::from(i) * 8.0 / 120.0);
        for j in 0..=200 {
            let t_k = 273.15 + f64::from(j) * (2273.15 - 273.15) / 200.0;
            let result = regions::region_pt(p_pa, t_k);
            let r1 = region1::properties(p_pa, t_k).is_ok();
            let r2 = region2::properties(p_pa, t_k).is_ok();
            let r5 = region5::properties(p_pa, t_k).is_ok();
            let ctx = format!("p = {p_pa} Pa, T = {t_k} K: region_pt = {result:?}, checked R1/R2/R5 ok = {r1}/{r2}/{r5}");
            match result {
                Ok(Region::Region1) => {
                    counts[0] += 1;
                    assert!(r1 && !r5, "{ctx}");
                }
                Ok(Region::Region2) => {
                    counts[1] += 1;
                    // 1073.15 K lies in the ranges of both Eq. 15 and Eq. 32.
                    assert!(r2 && (!r5 || t_k == region2::MAX_TEMPERATURE_K), "{ctx}");
                }
                Ok(Region::Region3) => {
                    counts[2] += 1;
                    assert!(!r1 && !r2 && !r5, "{ctx}");
                }
                Ok(Region::Region5) => {
                    counts[4] += 1;
                    assert!(r5 && !r1 && !r2, "{ctx}");
                }
                Ok(Region::Region4) => panic!("{ctx}: Region 4 is never returned for (p, T)"),
                Err(FormulationError::OutsideFormulation { .. }) => {
                    counts[3] += 1;
                    assert!(!r1 && !r2 && !r5, "{ctx}");
                }
                Err(e) => panic!("{ctx}: unexpected error {e}"),
            }
            // Regions 1 and 2 overlap only within the slack at psat.
            if r1 && r2 {
                let p_sat = region4::saturation_pressure_pa_unchecked(t_k);
                assert!(
                    relative_deviation(p_pa, p_sat) <= 2e-9,
                    "{ctx}: R1 and R2 overlap"
                );
            }
        }
    }
    // The grid must actually reach every region (and the gap above 50 MPa).
    assert!(
        counts.iter().all(|&n| n > 0),
        "points per R1, R2, R3, gap, R5: {counts:?}"
    );
}

// ---------------------------------------------------------------------------
// Bad input.

const NON_FINITE: [f64; 3] = [f64::NAN, f64::INFINITY, f64::NEG_INFINITY];

/// Every checked (p, T) function of the formulation under one name.
type CheckedPt = fn(f64, f64) -> Result<Properties, FormulationError>;
const CHECKED_PT: [(&str, CheckedPt); 4] = [
    ("region1::properties", region1::properties),
    ("region2::properties", region2::properties),
    (
        "region2::metastable_properties",
        region2::metastable_properties,
    ),
    ("region5::properties", region5::properties),
];

/// A valid (p, T) point of each function in `CHECKED_PT`, so that each bad
/// input below is tested with the other argument fine.
const VALID_PT: [(f64, f64); 4] = [
    (3.0e6, 300.0),
    (3500.0, 300.0),
    (1.0e6, 450.0),
    (0.5e6, 1500.0),
];

#[test]
fn non_finite_input_is_a_typed_error() {
    for ((name, f), (p_ok, t_ok)) in CHECKED_PT.iter().zip(VALID_PT) {
        assert!(
            f(p_ok, t_ok).is_ok(),
            "{name}({p_ok}, {t_ok}) should be valid"
        );
        for bad in NON_FINITE {
            for (p, t) in [(bad, t_ok), (p_ok, bad), (bad, bad)] {
                let got = f(p, t);
                assert_eq!(
                    got,
                    Err(FormulationError::NotFinite),
                    "{name}(p = {p}, T = {t}) = {got:?}"
                );
            }
        }
    }
    for bad in NON_FINITE {
        for (p, t) in [(bad, 300.0), (3.0e6, bad), (bad, bad)] {
            let got = regions::region_pt(p, t);
            assert_eq!(
                got,
                Err(FormulationError::NotFinite),
                "region_pt(p = {p}, T = {t}) = {got:?}"
            );
        }
        assert_eq!(
            b23::pressure_pa(bad),
            Err(FormulationError::NotFinite),
            "b23::pressure_pa({bad})"
        );
        assert_eq!(
            b23::temperature_k(bad),
            Err(FormulationError::NotFinite),
            "b23::temperature_k({bad})"
        );
        assert_eq!(
            region4::saturation_pressure_pa(bad),
            Err(FormulationError::NotFinite),
            "saturation_pressure_pa({bad})"
        );
        assert_eq!(
            region4::saturation_temperature_k(bad),
            Err(FormulationError::NotFinite),
            "saturation_temperature_k({bad})"
        );
    }
}

#[test]
fn out_of_range_input_is_a_typed_error() {
    let pressure_err = |r: &Result<Properties, FormulationError>| {
        matches!(r, Err(FormulationError::PressureOutOfRange { .. }))
    };
    let temperature_err = |r: &Result<Properties, FormulationError>| {
        matches!(r, Err(FormulationError::TemperatureOutOfRange { .. }))
    };
    for ((name, f), (p_ok, t_ok)) in CHECKED_PT.iter().zip(VALID_PT) {
        for p in [0.0, -0.0, -1.0, -3.0e6, 100.1e6, 1.0e9, f64::MAX] {
            let got = f(p, t_ok);
            assert!(pressure_err(&got), "{name}(p = {p}, T = {t_ok}) = {got:?}");
        }
        for t in [273.149, 200.0, 0.0, -10.0, 2273.16, 5000.0, f64::MAX] {
            let got = f(p_ok, t);
            assert!(
                temperature_err(&got),
                "{name}(p = {p_ok}, T = {t}) = {got:?}"
            );
        }
    }
    // Outside one region's own limits though inside IF97.
    let cases: [(&str, Result<Properties, FormulationError>, bool); 8] = [
        (
            "region1 at 700 K",
            region1::properties(50.0e6, 700.0),
            false,
        ),
        (
            "region1 below psat",
            region1::properties(1.0e3, 300.0),
            true,
        ),
        (
            "region2 above psat",
            region2::properties(1.0e6, 300.0),
            true,
        ),
        (
            "region2 above B23",
            region2::properties(50.0e6, 700.0),
            true,
        ),
        (
            "region2 at 1500 K",
            region2::properties(1.0e6, 1500.0),
            false,
        ),
        (
            "region5 at 1000 K",
            region5::properties(1.0e6, 1000.0),
            false,
        ),
        (
            "region5 at 60 MPa",
            region5::properties(60.0e6, 1500.0),
            true,
        ),
        (
            "metastable above 10 MPa",
            region2::metastable_properties(11.0e6, 550.0),
            true,
        ),
    ];
    for (what, got, is_pressure) in cases {
        let ok = if is_pressure {
            pressure_err(&got)
        } else {
            temperature_err(&got)
        };
        assert!(ok, "{what}: {got:?}");
    }
    // Metastable vapour: above Tsat, and far below the 5 % moisture line.
    let got = region2::metastable_properties(1.0e6, 460.0);
    assert!(
        temperature_err(&got),
        "metastable at 1 MPa, 460 K (> Tsat): {got:?}"
    );
    let got = region2::metastable_properties(1.0e6, 300.0);
    assert!(
        temperature_err(&got),
        "metastable at 1 MPa, 300 K (wetter than 5 %): {got:?}"
    );

    // Region selection over the whole formulation.
    for p in [0.0, -0.0, -1.0, 100.1e6, f64::MAX] {
        let got = regions::region_pt(p, 300.0);
        assert!(
            matches!(got, Err(FormulationError::PressureOutOfRange { .. })),
            "region_pt(p = {p}, 300 K) = {got:?}"
        );
    }
    for t in [273.149, 0.0, -1.0, 2273.16, f64::MAX] {
        let got = regions::region_pt(1.0e6, t);
        assert!(
            matches!(got, Err(FormulationError::TemperatureOutOfRange { .. })),
            "region_pt(1 MPa, T = {t}) = {got:?}"
        );
    }
    // B23 outside its own range.
    for t in [623.14, 863.16, 0.0] {
        let got = b23::pressure_pa(t);
        assert!(
            matches!(got, Err(FormulationError::TemperatureOutOfRange { .. })),
            "b23::pressure_pa({t}) = {got:?}"
        );
    }
    for p in [16.529e6, 100.1e6, 0.0, -1.0] {
        let got = b23::temperature_k(p);
        assert!(
            matches!(got, Err(FormulationError::PressureOutOfRange { .. })),
            "b23::temperature_k({p}) = {got:?}"
        );
    }
}

/// Whatever the input, a checked function returns either an error or
/// properties that are all finite (never an `Ok` holding NaN or infinity).
#[test]
fn checked_functions_never_return_non_finite_values() {
    let pressures = [
        -1.0,
        0.0,
        f64::MIN_POSITIVE,
        1e-300,
        1e-9,
        1.0,
        611.0,
        611.213,
        1.0e3,
        1.0e5,
        3.5e3,
        1.0e6,
        9.99e6,
        10.0e6,
        16.5e6,
        22.064e6,
        50.0e6,
        99.999e6,
        100.0e6,
        1e12,
        f64::MAX,
        f64::NAN,
    ];
    let temperatures = [
        -1.0,
        0.0,
        273.149,
        273.15,
        273.16,
        300.0,
        373.15,
        450.0,
        600.0,
        623.15,
        623.16,
        647.096,
        700.0,
        863.15,
        1000.0,
        1073.15,
        1073.16,
        2000.0,
        2273.15,
        2273.16,
        1e6,
        f64::MAX,
        f64::INFINITY,
    ];
    for (name, f) in CHECKED_PT {
        for p in pressures {
            for t in temperatures {
                if let Ok(props) = f(p, t) {
                    let values = [
                        props.density_kg_m3,
                        props.specific_volume_m3_kg,
                        props.enthalpy_j_kg,
                        props.internal_energy_j_kg,
                        props.entropy_j_kgk,
                        props.cp_j_kgk,
                        props.cv_j_kgk,
                        props.speed_of_sound_m_s,
                        props.isentropic_exponent,
                    ];
                    assert!(
                        values.iter().all(|v| v.is_finite()),
                        "{name}(p = {p}, T = {t}) = {props:?}"
                    );
                    assert!(
                        props.density_kg_m3 > 0.0 && props.cp_j_kgk > 0.0,
                        "{name}(p = {p}, T = {t})"
                    );
                }
            }
        }
    }
    for t in temperatures {
        if let Ok(p) = b23::pressure_pa(t) {
            assert!(p.is_finite(), "b23::pressure_pa({t}) = {p}");
        }
    }
    for p in pressures {
        if let Ok(t) = b23::temperature_k(p) {
            assert!(t.is_finite(), "b23::temperature_k({p}) = {t}");
        }
    }
}

// ---------------------------------------------------------------------------
// Consistency.

/// psat(Tsat(p)) returns p over a dense log-spaced grid of the whole
/// saturation line (611.213 Pa to 22.064 MPa).
#[test]
fn saturation_round_trip() {
    let p_min = region4::MIN_PRESSURE_PA;
    let p_max = region4::MAX_PRESSURE_PA;
    let steps = 20_000;
    let mut worst = 0.0_f64;
    for i in 0..=steps {
        let p = if i == steps {
            p_max // hit the end exactly, not a rounded exp(ln)
        } else {
            p_min * (p_max / p_min).powf(f64::from(i) / f64::from(steps))
        };
        let t =
            region4::saturation_temperature_k(p).unwrap_or_else(|e| panic!("Tsat({p} Pa): {e}"));
        let back = region4::saturation_pressure_pa(t)
            .unwrap_or_else(|e| panic!("psat({t} K) from p = {p} Pa: {e}"));
        let dev = relative_deviation(back, p);
        assert!(
            dev <= SATURATION_ROUND_TRIP_REL,
            "p = {p} Pa: Tsat = {t} K, psat(Tsat) = {back} Pa (rel. deviation {dev:.3e})"
        );
        worst = worst.max(dev);
    }
    println!(
        "psat(Tsat(p)) round trip: max rel dev = {worst:.2e} over {} points",
        steps + 1
    );
}

/// The properties compared across the saturation line.
fn property_list(p: &Properties) -> [(&'static str, f64); 9] {
    [
        ("v", p.specific_volume_m3_kg),
        ("rho", p.density_kg_m3),
        ("h", p.enthalpy_j_kg),
        ("u", p.internal_energy_j_kg),
        ("s", p.entropy_j_kgk),
        ("cp", p.cp_j_kgk),
        ("cv", p.cv_j_kgk),
        ("w", p.speed_of_sound_m_s),
        ("kappa", p.isentropic_exponent),
    ]
}

/// Largest relative difference between two states over all properties.
fn max_property_difference(a: &Properties, b: &Properties) -> (f64, &'static str) {
    property_list(a)
        .iter()
        .zip(property_list(b))
        .map(|(&(name, x), (_, y))| (relative_deviation(x, y), name))
        .fold((0.0, ""), |acc, d| if d.0 > acc.0 { d } else { acc })
}

/// Temperatures along the saturation line inside Regions 1 and 2.
fn saturation_temperatures() -> impl Iterator<Item = f64> {
    (0..=70).map(|i| 273.15 + f64::from(i) * 5.0)
}

/// 1/4 boundary: Region 1 on either side of psat(T) converges to one limit,
/// and the checked function accepts exactly the documented slack.
#[test]
fn region1_is_continuous_at_the_saturation_line() {
    for t_k in saturation_temperatures() {
        let p_sat = region4::saturation_pressure_pa(t_k).expect("in range");
        let at_sat = region1::properties_unchecked(p_sat, t_k);
        let mut previous = f64::INFINITY;
        for delta in [1e-3, 1e-5, 1e-7, 1e-9] {
            let above = region1::properties_unchecked(p_sat * (1.0 + delta), t_k);
            let below = region1::properties_unchecked(p_sat * (1.0 - delta), t_k);
            let (dev_above, name_a) = max_property_difference(&above, &at_sat);
            let (dev_below, name_b) = max_property_difference(&below, &at_sat);
            let dev = dev_above.max(dev_below);
            assert!(
                dev <= previous.max(1e-15),
                "Region 1, T = {t_k} K, psat·(1±{delta}): deviation from the limit grew to {dev:.3e} \
                 ({name_a}/{name_b}; previous {previous:.3e})"
            );
            previous = dev;
        }
        assert!(
            previous <= SATURATION_CONTINUITY_REL,
            "Region 1, T = {t_k} K: at psat·(1±1e-9) the states differ from psat by {previous:.3e}"
        );
        // The checked function accepts psat·(1 − 1e-9) and agrees with the
        // unchecked one; it rejects a clear step below psat.
        let edge = region1::properties(p_sat * (1.0 - 1e-9), t_k)
            .unwrap_or_else(|e| panic!("Region 1 at psat·(1 − 1e-9), T = {t_k} K: {e}"));
        let (dev, name) = max_property_difference(&edge, &at_sat);
        assert!(
            dev <= SATURATION_CONTINUITY_REL,
            "T = {t_k} K: {name} differs by {dev:.3e}"
        );
        assert!(
            region1::properties(p_sat * (1.0 - 1e-7), t_k).is_err(),
            "T = {t_k} K: psat·(1 − 1e-7) accepted"
        );
    }
}

/// 2/4 boundary: the same for Region 2 on the vapour side.
#[test]
fn region2_is_continuous_at_the_saturation_line() {
    for t_k in saturation_temperatures() {
        let p_sat = region4::saturation_pressure_pa(t_k).expect("in range");
        let at_sat = region2::properties_unchecked(p_sat, t_k);
        let mut previous = f64::INFINITY;
        for delta in [1e-3, 1e-5, 1e-7, 1e-9] {
            let above = region2::properties_unchecked(p_sat * (1.0 + delta), t_k);
            let below = region2::properties_unchecked(p_sat * (1.0 - delta), t_k);
            let (dev_above, name_a) = max_property_difference(&above, &at_sat);
            let (dev_below, name_b) = max_property_difference(&below, &at_sat);
            let dev = dev_above.max(dev_below);
            assert!(
                dev <= previous.max(1e-15),
                "Region 2, T = {t_k} K, psat·(1±{delta}): deviation from the limit grew to {dev:.3e} \
                 ({name_a}/{name_b}; previous {previous:.3e})"
            );
            previous = dev;
        }
        assert!(
            previous <= SATURATION_CONTINUITY_REL,
            "Region 2, T = {t_k} K: at psat·(1±1e-9) the states differ from psat by {previous:.3e}"
        );
        let edge = region2::properties(p_sat * (1.0 + 1e-9), t_k)
            .unwrap_or_else(|e| panic!("Region 2 at psat·(1 + 1e-9), T = {t_k} K: {e}"));
        let (dev, name) = max_property_difference(&edge, &at_sat);
        assert!(
            dev <= SATURATION_CONTINUITY_REL,
            "T = {t_k} K: {name} differs by {dev:.3e}"
        );
        assert!(
            region2::properties(p_sat * (1.0 + 1e-7), t_k).is_err(),
            "T = {t_k} K: psat·(1 + 1e-7) accepted"
        );
    }
}

/// The metastable-vapour equation joins Eq. 15 on the saturated-vapour line;
/// IAPWS R7-97(2012), section 6.2, states that at psat the two agree within
/// the consistency of Eq. 15 with IAPWS-95 (0.01 % in v is used here, looser
/// than any Region 2 tolerance and tight enough to catch a wrong n°1, n°2).
#[test]
fn metastable_vapour_meets_region2_at_saturation() {
    for p_pa in [1.0e3, 1.0e4, 1.0e5, 1.0e6, 5.0e6, 10.0e6] {
        let t_sat = region4::saturation_temperature_k(p_pa).expect("in range");
        let meta = region2::metastable_properties(p_pa, t_sat)
            .unwrap_or_else(|e| panic!("metastable at p = {p_pa} Pa, Tsat = {t_sat} K: {e}"));
        let stable = region2::properties(p_pa, t_sat)
            .unwrap_or_else(|e| panic!("Region 2 at p = {p_pa} Pa, Tsat = {t_sat} K: {e}"));
        for (name, a, b) in [
            (
                "v",
                meta.specific_volume_m3_kg,
                stable.specific_volume_m3_kg,
            ),
            ("h", meta.enthalpy_j_kg, stable.enthalpy_j_kg),
            ("s", meta.entropy_j_kgk, stable.entropy_j_kgk),
        ] {
            let dev = relative_deviation(a, b);
            assert!(dev <= 1e-4, "p = {p_pa} Pa, Tsat = {t_sat} K: {name} metastable {a} vs Region 2 {b} ({dev:.3e})");
        }
    }
}

/// Thermodynamic identities checked with central finite differences: cp =
/// (∂h/∂T)_p, s = −(∂g/∂T)_p, v = (∂g/∂p)_T, and, with the isothermal
/// compressibility κ_T = −(1/v)(∂v/∂p)_T, cv = cp/(ρ w² κ_T) and
/// κ = (cp/cv)/(p κ_T). The last two check cv and the isentropic exponent,
/// which the verification tables do not print.
#[test]
fn properties_obey_thermodynamic_identities() {
    type Eval = fn(f64, f64) -> Properties;
    let cases: [(&str, Eval, f64, f64); 12] = [
        ("Region 1", region1::properties_unchecked, 3.0e6, 300.0),
        ("Region 1", region1::properties_unchecked, 80.0e6, 300.0),
        ("Region 1", region1::properties_unchecked, 3.0e6, 500.0),
        ("Region 1", region1::properties_unchecked, 20.0e6, 620.0),
        ("Region 2", region2::properties_unchecked, 3.5e3, 300.0),
        ("Region 2", region2::properties_unchecked, 3.5e3, 700.0),
        ("Region 2", region2::properties_unchecked, 30.0e6, 700.0),
        ("Region 2", region2::properties_unchecked, 1.0e6, 1000.0),
        (
            "Region 2 metastable",
            region2::metastable_properties_unchecked,
            1.0e6,
            450.0,
        ),
        ("Region 5", region5::properties_unchecked, 0.5e6, 1500.0),
        ("Region 5", region5::properties_unchecked, 30.0e6, 1500.0),
        ("Region 5", region5::properties_unchecked, 30.0e6, 2000.0),
    ];
    let gibbs = |x: &Properties| x.enthalpy_j_kg - x.temperature_k * x.entropy_j_kgk;
    for (name, f, p, t) in cases {
        let x = f(p, t);
        let dt = 1e-5 * t;
        let dp = 1e-5 * p;
        let (t_plus, t_minus) = (f(p, t + dt), f(p, t - dt));
        let (p_plus, p_minus) = (f(p + dp, t), f(p - dp, t));
        let cp_fd = (t_plus.enthalpy_j_kg - t_minus.enthalpy_j_kg) / (2.0 * dt);
        let s_fd = -(gibbs(&t_plus) - gibbs(&t_minus)) / (2.0 * dt);
        let v_fd = (gibbs(&p_plus) - gibbs(&p_minus)) / (2.0 * dp);
        let kappa_t = -(p_plus.specific_volume_m3_kg - p_minus.specific_volume_m3_kg)
            / (2.0 * dp)
            / x.specific_volume_m3_kg;
        let cv_fd =
            x.cp_j_kgk / (x.density_kg_m3 * x.speed_of_sound_m_s * x.speed_of_sound_m_s * kappa_t);
        let kappa_fd = x.cp_j_kgk / x.cv_j_kgk / (p * kappa_t);
        // Entropy is compared against the scale of T·s, since s itself
        // passes near zero in cold liquid while g and h do not.
        for (what, value, fd, scale) in [
            ("cp", x.cp_j_kgk, cp_fd, x.cp_j_kgk),
            (
                "s",
                x.entropy_j_kgk,
                s_fd,
                x.entropy_j_kgk.abs().max(x.cp_j_kgk),
            ),
            ("v", x.specific_volume_m3_kg, v_fd, x.specific_volume_m3_kg),
            ("cv", x.cv_j_kgk, cv_fd, x.cv_j_kgk),
            (
                "kappa",
                x.isentropic_exponent,
                kappa_fd,
                x.isentropic_exponent,
            ),
        ] {
            let dev = (value - fd).abs() / scale;
            assert!(
                dev <= FINITE_DIFFERENCE_REL,
                "{name}, p = {p} Pa, T = {t} K: {what} = {value:.9e}, from finite differences \
                 {fd:.9e} (rel. deviation {dev:.3e})"
            );
        }
    }
}

// ---------------------------------------------------------------------------
// Figures of the trade (common practice, no source).

#[test]
fn water_boils_at_100_c_at_atmospheric_pressure() {
    // common practice, no source: 101.325 kPa ↔ 100 °C
    let t = region4::saturation_temperature_k(101_325.0).expect("in range");
    println!("Tsat(101.325 kPa) = {t:.4} K");
    assert!(
        (t - 373.15).abs() <= BOILING_POINT_K,
        "Tsat(101.325 kPa) = {t} K, expected about 373.15 K (deviation {:.4} K)",
        t - 373.15
    );
}

#[test]
fn saturation_figures_of_the_trade() {
    // common practice, no source: (about p in Pa, T in K)
    for (p_pa, t_k, what) in [
        (12.35e3, 323.15, "about 12.35 kPa at 50 °C"),
        (2.34e3, 293.15, "about 2.34 kPa at 20 °C"),
        (1.55e6, 473.15, "about 1.55 MPa at 200 °C"),
    ] {
        let p_sat = region4::saturation_pressure_pa(t_k).expect("in range");
        let dev = relative_deviation(p_sat, p_pa);
        assert!(
            dev <= ABOUT_REL,
            "{what}: psat({t_k} K) = {p_sat} Pa (rel. deviation {dev:.3e})"
        );
        let t_sat = region4::saturation_temperature_k(p_pa).expect("in range");
        assert!(
            (t_sat - t_k).abs() <= ABOUT_TEMPERATURE_K,
            "{what}: Tsat({p_pa} Pa) = {t_sat} K (deviation {:.4} K)",
            t_sat - t_k
        );
    }
}

#[test]
fn latent_heat_at_100_c() {
    // common practice, no source: about 2256 kJ/kg at 100 °C
    let t_k = 373.15;
    let p_sat = region4::saturation_pressure_pa(t_k).expect("in range");
    let liquid = region1::properties(p_sat, t_k).expect("saturated liquid is in Region 1");
    let vapour = region2::properties(p_sat, t_k).expect("saturated vapour is in Region 2");
    let latent = vapour.enthalpy_j_kg - liquid.enthalpy_j_kg;
    println!("latent heat at 373.15 K: {latent:.1} J/kg (psat = {p_sat:.3} Pa)");
    assert!(
        (latent - 2256.0e3).abs() <= LATENT_HEAT_J_KG,
        "h'' − h' at 373.15 K, psat = {p_sat} Pa: {latent} J/kg, expected about 2256e3 J/kg \
         (deviation {:.1} J/kg)",
        latent - 2256.0e3
    );
}
