//! Backward equations T(p, h) and T(p, s) of Regions 1 and 2 against the
//! release's verification tables, and the exact inversions built on them.
//!
//! The verification values below are typed FROM MEMORY of IAPWS R7-97(2012)
//! Tables 7, 9, 24 and 29 and of the B2bc check value after Eq. 21 (no copy
//! of those tables was at hand). The coefficients were also written from
//! memory; the two agree at every printed digit on all 24 points.

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

// ---------------------------------------------------------------------------
// Exact inversions T(p, h), T(p, s).

use vapora_tables::if97::{inverse, pt, region4, saturation, Region};

/// Small deterministic generator (xorshift64*) so the "random" points are
/// the same on every run.
struct Rng(u64);
impl Rng {
    fn next(&mut self) -> f64 {
        self.0 ^= self.0 >> 12;
        self.0 ^= self.0 << 25;
        self.0 ^= self.0 >> 27;
        (self.0.wrapping_mul(0x2545_F491_4F6C_DD1D) >> 11) as f64 / (1u64 << 53) as f64
    }
}

/// Random (p, T) over the whole formulation, p log-uniform.
fn random_points(n: usize) -> Vec<(f64, f64)> {
    let mut rng = Rng(0x9E37_79B9_7F4A_7C15);
    let mut out = Vec::new();
    while out.len() < n {
        let p = 10f64.powf(1.0 + 7.0 * rng.next()); // 10 Pa … 100 MPa
        let t = 273.15 + (2273.15 - 273.15) * rng.next();
        if pt::properties_pt(p, t).is_ok() {
            out.push((p, t));
        }
    }
    out
}

/// Tolerance on the forward value: 1e-9 relative, or 1e-6 J/kg
/// (1e-9 J/(kg K)) absolute where the value is within 1 kJ/kg (1 J/(kg K))
/// of 0, near the triple point where IF97 sets u and s of the liquid to 0.
fn value_ok(got: f64, want: f64, abs_floor: f64) -> bool {
    (got - want).abs() <= (1e-9 * want.abs()).max(abs_floor)
}

fn inversion_case(name: &str, entropy: bool) {
    let mut worst_rel: f64 = 0.0;
    let mut worst_dt: f64 = 0.0;
    let mut count = 0;
    for (p, t) in random_points(4000) {
        let (props, region) = pt::properties_pt_with_region(p, t).unwrap();
        let x = if entropy {
            props.entropy_j_kgk
        } else {
            props.enthalpy_j_kg
        };
        let (t_back, region_back) = if entropy {
            inverse::temperature_ps(p, x)
        } else {
            inverse::temperature_ph(p, x)
        }
        .unwrap_or_else(|e| panic!("{name}: p={p} Pa T={t} K x={x}: {e}"));
        // A point exactly at psat(T) comes back as Region 1; otherwise the
        // region must match (random points are never on a boundary).
        assert_eq!(
            region_back, region,
            "{name}: p={p} Pa T={t} K x={x}: T back {t_back}"
        );
        let back = pt::properties_pt(p, t_back).unwrap();
        let x_back = if entropy {
            back.entropy_j_kgk
        } else {
            back.enthalpy_j_kg
        };
        let floor = if entropy { 1e-9 } else { 1e-6 };
        let rel = (x_back - x).abs() / x.abs().max(1.0);
        worst_rel = worst_rel.max(rel);
        worst_dt = worst_dt.max((t_back - t).abs());
        count += 1;
        assert!(
            value_ok(x_back, x, floor),
            "{name}: p={p} Pa T={t} K: input {x}, forward at T back {t_back} K gives {x_back}, rel dev {rel:e}"
        );
    }
    println!("{name}: {count} random points, max rel dev of forward value {worst_rel:.2e}, max |T back - T| {worst_dt:.2e} K");
}

#[test]
fn temperature_ph_inverts_forward_equations() {
    inversion_case("T(p,h)", false);
}

#[test]
fn temperature_ps_inverts_forward_equations() {
    inversion_case("T(p,s)", true);
}

/// Dense points along the saturation line just outside the dome: liquid
/// just below h', vapour just above h'' come back in their region with T
/// just below/above Tsat; inside the dome the result is Region 4 at Tsat.
#[test]
fn two_phase_and_edges_of_the_dome() {
    // From 1 kPa: at 611.213 Pa Tsat is 273.15 K and there is no liquid
    // below h' (checked separately in `inversion_bad_input`).
    for k in 0..=200 {
        let p = 1e3 * (21.9e6f64 / 1e3).powf(f64::from(k) / 200.0);
        let sat = saturation::at_pressure(p).unwrap();
        let tsat = region4::saturation_temperature_k_unchecked(p);
        for (entropy, xl, xv) in [
            (false, sat.liquid.enthalpy_j_kg, sat.vapour.enthalpy_j_kg),
            (true, sat.liquid.entropy_j_kgk, sat.vapour.entropy_j_kgk),
        ] {
            let f = |x: f64| {
                if entropy {
                    inverse::temperature_ps(p, x)
                } else {
                    inverse::temperature_ph(p, x)
                }
            };
            for quality in [1e-6, 0.25, 0.5, 0.999_999] {
                let x = xl + quality * (xv - xl);
                let (t, region) = f(x).unwrap_or_else(|e| panic!("p={p}: {e}"));
                assert_eq!(region, Region::Region4, "p={p} Pa quality {quality}: T {t}");
                assert!(
                    (t - tsat).abs() <= 1e-9 * tsat,
                    "p={p}: T {t} vs Tsat {tsat}"
                );
            }
            let delta = 1e-6 * (xv - xl);
            let (t_l, r_l) = f(xl - delta).unwrap_or_else(|e| {
                panic!("p={p} entropy={entropy}: liquid side x={}: {e}", xl - delta)
            });
            let (t_v, r_v) = f(xv + delta).unwrap_or_else(|e| {
                panic!("p={p} entropy={entropy}: vapour side x={}: {e}", xv + delta)
            });
            assert!(
                matches!(r_l, Region::Region1 | Region::Region3),
                "p={p}: liquid side gives {r_l:?}"
            );
            assert!(
                matches!(r_v, Region::Region2 | Region::Region3),
                "p={p}: vapour side gives {r_v:?}"
            );
            assert!(
                t_l <= tsat + 1e-9 && t_v >= tsat - 1e-9,
                "p={p}: T liquid {t_l}, vapour {t_v}, Tsat {tsat}"
            );
        }
    }
}

/// The backward equations alone against the exact inversion, inside their
/// regions: permissible |ΔT| of IAPWS R7-97(2012) sections 5.2.1 and 6.3.1
/// (FROM MEMORY): 25 mK in Region 1, 10 mK in 2a and 2b, 25 mK in 2c.
#[test]
fn backward_equations_within_permissible_deviation() {
    let mut worst = [0.0f64; 4]; // Region 1, 2a, 2b, 2c
                                 // Only p ≥ 611.213 Pa: the Region 2 backward equations are not meant for
                                 // the very low pressures IF97 Region 2 itself reaches (T(p,s) of 2a is
                                 // off by kelvins at tens of Pa).
    for (p, t) in random_points(3000)
        .into_iter()
        .filter(|&(p, _)| p >= 611.213)
    {
        let (props, region) = pt::properties_pt_with_region(p, t).unwrap();
        let (h, s) = (props.enthalpy_j_kg, props.entropy_j_kgk);
        let (slot, limit, th, ts) = match region {
            Region::Region1 => (
                0,
                0.025,
                backward::region1_temperature_ph_unchecked(p, h),
                backward::region1_temperature_ps_unchecked(p, s),
            ),
            Region::Region2 if t <= 1073.15 => {
                let sub_h = backward::subregion2_ph(p, h);
                let sub_s = backward::subregion2_ps(p, s);
                // The two splits (B2bc in h, s = 5.85 in s) differ slightly;
                // skip the few points where they disagree.
                if sub_h != sub_s {
                    continue;
                }
                let (slot, limit) = match sub_h {
                    backward::Subregion2::A => (1, 0.010),
                    backward::Subregion2::B => (2, 0.010),
                    backward::Subregion2::C => (3, 0.025),
                };
                (
                    slot,
                    limit,
                    backward::region2_temperature_ph_unchecked(p, h),
                    backward::region2_temperature_ps_unchecked(p, s),
                )
            }
            _ => continue,
        };
        for (name, tb) in [("T(p,h)", th), ("T(p,s)", ts)] {
            let dt = (tb - t).abs();
            worst[slot] = worst[slot].max(dt);
            assert!(dt <= limit, "{name} region {region:?} slot {slot}: p={p} Pa T={t} K backward {tb} K, |dT| {dt} K > {limit} K");
        }
    }
    println!(
        "backward |dT| max: Region 1 {:.2e} K, 2a {:.2e} K, 2b {:.2e} K, 2c {:.2e} K",
        worst[0], worst[1], worst[2], worst[3]
    );
}

#[test]
fn inversion_bad_input() {
    use vapora_tables::if97::FormulationError::*;
    for (p, x) in [
        (f64::NAN, 1e5),
        (1e5, f64::NAN),
        (f64::INFINITY, 1e5),
        (1e5, f64::NEG_INFINITY),
    ] {
        assert_eq!(inverse::temperature_ph(p, x), Err(NotFinite), "p={p} h={x}");
        assert_eq!(inverse::temperature_ps(p, x), Err(NotFinite), "p={p} s={x}");
    }
    for p in [0.0, -1.0, 101e6] {
        assert!(
            matches!(
                inverse::temperature_ph(p, 1e5),
                Err(PressureOutOfRange { .. })
            ),
            "p={p}"
        );
    }
    // Below the enthalpy of water at 273.15 K, above that of steam at 2273.15 K.
    assert_eq!(inverse::temperature_ph(1e6, -1e5), Err(PropertyOutOfRange));
    assert_eq!(inverse::temperature_ph(1e6, 1e8), Err(PropertyOutOfRange));
    assert_eq!(inverse::temperature_ps(1e6, -1e3), Err(PropertyOutOfRange));
    assert_eq!(inverse::temperature_ps(1e6, 1e5), Err(PropertyOutOfRange));
    // At 611.213 Pa, Tsat = 273.15 K: nothing below h'.
    let sat = saturation::at_pressure(611.213).unwrap();
    assert_eq!(
        inverse::temperature_ph(611.213, sat.liquid.enthalpy_j_kg - 1.0),
        Err(PropertyOutOfRange)
    );
    // Above 50 MPa the top is Region 2 at 1073.15 K.
    assert_eq!(
        inverse::temperature_ph(80e6, 4.5e6),
        Err(PropertyOutOfRange)
    );
}

/// Forward value of `region` at (p, T), evaluating the region's equation
/// directly even a little past its boundary (as the inversion may).
fn forward_in(region: Region, p: f64, t: f64, entropy: bool) -> f64 {
    let props = props_in(region, p, t);
    if entropy {
        props.entropy_j_kgk
    } else {
        props.enthalpy_j_kg
    }
}

/// Properties of `region` at (p, T), see [`forward_in`].
fn props_in(region: Region, p: f64, t: f64) -> vapora_tables::if97::Properties {
    use vapora_tables::if97::{region1, region2, region3, region5};
    match region {
        Region::Region1 => region1::properties_unchecked(p, t),
        Region::Region2 => region2::properties_unchecked(p, t),
        Region::Region5 => region5::properties_unchecked(p, t),
        Region::Region3 => {
            // Plain bisection on the whole density range of the isotherm
            // (above Tc, and below it on the liquid side above psat, there
            // is one root with p₃ increasing there).
            let (mut lo, mut hi) = match region3::spinodal_densities_kg_m3(t) {
                Some((vs, _)) if p <= region4::saturation_pressure_pa_unchecked(t) => (50.0, vs),
                Some((_, liquid_spinodal)) => (liquid_spinodal, 800.0),
                None => (50.0, 800.0),
            };
            for _ in 0..200 {
                let mid = 0.5 * (lo + hi);
                if region3::pressure_pa_unchecked(mid, t) < p {
                    lo = mid;
                } else {
                    hi = mid;
                }
            }
            region3::properties_rho_t_unchecked(0.5 * (lo + hi), t)
        }
        Region::Region4 => panic!("no single-phase forward value in Region 4"),
    }
}

/// Dense grid over Region 3 (which random points over the whole formulation
/// hit only rarely), inverted in h and s, checked with an independent
/// density solve.
#[test]
fn region3_dense_grid() {
    let mut worst: f64 = 0.0;
    let mut count = 0;
    for i in 0..=30 {
        let t = 623.2 + (863.1 - 623.2) * f64::from(i) / 30.0;
        let p_b23 = (0.348_051_856_289_69e3 - 0.116_718_598_799_75e1 * t
            + 0.101_929_700_393_26e-2 * t * t)
            * 1e6;
        for j in 0..=30 {
            let p = p_b23 * 1.001 + (100e6 - p_b23 * 1.001) * f64::from(j) / 30.0;
            let psat = if t < 647.096 {
                region4::saturation_pressure_pa_unchecked(t)
            } else {
                0.0
            };
            if (p - psat).abs() < 1e4 || p > 100e6 {
                continue; // too close to the dome for a clean (p, T) point
            }
            let props = pt::properties_pt(p, t).unwrap();
            for entropy in [false, true] {
                let x = if entropy {
                    props.entropy_j_kgk
                } else {
                    props.enthalpy_j_kg
                };
                let (t_back, region) = if entropy {
                    inverse::temperature_ps(p, x)
                } else {
                    inverse::temperature_ph(p, x)
                }
                .unwrap_or_else(|e| panic!("p={p} T={t} entropy={entropy}: {e}"));
                assert_eq!(
                    region,
                    Region::Region3,
                    "p={p} Pa T={t} K entropy={entropy}: T back {t_back}"
                );
                let x_back = forward_in(region, p, t_back, entropy);
                let rel = (x_back - x).abs() / x.abs();
                worst = worst.max(rel);
                count += 1;
                assert!(rel <= 1e-9, "p={p} Pa T={t} K entropy={entropy}: input {x}, forward at {t_back} K gives {x_back}, rel {rel:e}");
            }
        }
    }
    println!("Region 3 grid: {count} inversions, max rel dev of forward value {worst:.2e}");
}

/// Inputs in the small gaps or overlaps between adjacent regions (623.15 K,
/// B23, 1073.15 K) still come back with a temperature whose forward value in
/// the returned region equals the input.
#[test]
fn boundary_gaps_between_regions() {
    use vapora_tables::if97::{region1, region2, region5};
    let mut checked = 0;
    for k in 0..=20 {
        let p = 17e6 + (100e6 - 17e6) * f64::from(k) / 20.0;
        let t_b23 =
            572.544_598_627_46 + ((p / 1e6 - 13.918_839_778_870) / 0.101_929_700_393_26e-2).sqrt(); // B23 Eq. 6, Table 1
        let t_b23 = t_b23.min(863.15);
        let mut pairs = vec![(
            region1::properties_unchecked(p, 623.15),
            props_in(Region::Region3, p, 623.15),
        )];
        if t_b23 < 863.149 {
            pairs.push((
                props_in(Region::Region3, p, t_b23),
                region2::properties_unchecked(p, t_b23),
            ));
        }
        if p <= 50e6 {
            pairs.push((
                region2::properties_unchecked(p, 1073.15),
                region5::properties_unchecked(p, 1073.15),
            ));
        }
        for (cold, hot) in pairs {
            for entropy in [false, true] {
                let (a, b) = if entropy {
                    (cold.entropy_j_kgk, hot.entropy_j_kgk)
                } else {
                    (cold.enthalpy_j_kg, hot.enthalpy_j_kg)
                };
                let x = 0.5 * (a + b);
                let (t, region) = if entropy {
                    inverse::temperature_ps(p, x)
                } else {
                    inverse::temperature_ph(p, x)
                }
                .unwrap_or_else(|e| panic!("p={p} between {a} and {b}: {e}"));
                let back = forward_in(region, p, t, entropy);
                assert!(
                    (back - x).abs() <= 1e-9 * x.abs(),
                    "p={p} Pa x={x} ({a}..{b}): T {t} K in {region:?} gives {back}"
                );
                assert!(
                    (t - cold.temperature_k).abs() < 1.0,
                    "p={p}: T {t} far from the boundary {}",
                    cold.temperature_k
                );
                checked += 1;
            }
        }
    }
    assert!(checked > 80);
}

/// Region 3 enthalpy at (p, T) on an explicitly chosen branch, by plain
/// bisection between the branch's spinodal and its far end (above Tc on the
/// whole isotherm).
fn region3_h_on_branch(p: f64, t: f64, vapour: bool) -> f64 {
    use vapora_tables::if97::region3;
    let (mut lo, mut hi) = match (region3::spinodal_densities_kg_m3(t), vapour) {
        (Some((vs, _)), true) => (50.0, vs),
        (Some((_, ls)), false) => (ls, 800.0),
        (None, _) => (50.0, 800.0),
    };
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if region3::pressure_pa_unchecked(mid, t) < p {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    region3::properties_rho_t_unchecked(0.5 * (lo + hi), t).enthalpy_j_kg
}

/// Just below and at the critical pressure, around the top of the dome:
/// the inversion never fails and reproduces the input.
///
/// The check uses the branch the input h lies on (liquid-like below h',
/// vapour-like above h''): within a few mPa of the saturation line a (p, T)
/// pair alone cannot tell the branches apart (`properties_pt` decides by
/// psat(T) ≶ p, which rounding can flip there), so `properties_pt` is
/// compared only from 1 kPa below pc downward.
#[test]
fn inversion_near_critical_point() {
    let mut worst: f64 = 0.0;
    for dp in [1e5, 1e3, 100.0, 13.0, 1.0, 0.0] {
        let p = 22.064e6 - dp;
        let sat = saturation::at_pressure(p).unwrap();
        let (hl, hv) = (sat.liquid.enthalpy_j_kg, sat.vapour.enthalpy_j_kg);
        for h in [hl - 1e4, hl - 1.0, hv + 1.0, hv + 1e4] {
            let (t, region) =
                inverse::temperature_ph(p, h).unwrap_or_else(|e| panic!("p={p} h={h}: {e}"));
            if dp > 0.0 {
                assert_eq!(region, Region::Region3, "p={p} h={h}: T {t}");
            }
            // Independent density solve on the input's branch. Within 100 Pa
            // of pc (Tsat within 4e-4 K of Tc) the isotherms of Eq. 28 are so
            // flat near the saturated states that h(p, T) itself is
            // ill-conditioned: a 1e-13 residual in p moves ρ visibly, and
            // two correct solvers differ by ~1e-8 (10 … 100 Pa below pc) to
            // ~1e-6 (1 Pa below pc, next to the vapour spinodal). At pc
            // itself the returned T is within 1e-9 K of Tc, where Eq. 28
            // still has a loop below 1e-4 Pa high, so several densities give
            // p₃ = pc and their h differ by ~1e-5.
            let back = region3_h_on_branch(p, t, h > hv);
            let tol = match dp {
                d if d >= 100.0 => 1e-9,
                d if d >= 10.0 => 1e-7,
                d if d > 0.0 => 1e-5,
                _ => 3e-5,
            };
            let rel = (back - h).abs() / h;
            worst = worst.max(rel);
            if rel > 1e-9 {
                println!("  pc - {dp} Pa, h = {h:.3} J/kg: T {t} K, independent h {back:.3}, rel {rel:.2e}");
            }
            assert!(
                rel <= tol,
                "p={p} Pa h={h}: T {t} K in {region:?} gives h {back}, rel {rel:e}"
            );
            if dp >= 1e3 {
                let own = pt::properties_pt(p, t).unwrap().enthalpy_j_kg;
                assert!(
                    (own - h).abs() <= 1e-9 * h,
                    "p={p} Pa h={h}: T {t} K: properties_pt gives h {own}"
                );
            }
        }
    }
    println!("near-critical inversion: max rel dev of h {worst:.2e}");
}
