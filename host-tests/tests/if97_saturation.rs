//! The saturation line: both saturated states from the triple point to the
//! critical point, continuity where the method changes at 623.15 K,
//! behaviour in the last millikelvins below Tc, and the Region 2/3 and 1/3
//! boundary consistency that continuity rests on.

use vapora_host_tests::tolerance::relative_deviation;
use vapora_tables::if97::{
    region1, region2, region3, region4, saturation, FormulationError, CRITICAL_DENSITY_KG_M3,
    CRITICAL_PRESSURE_PA, CRITICAL_TEMPERATURE_K,
};

/// B23 boundary pressure, Pa (IAPWS R7-97(2012), Eq. 5, Table 1), written out
/// here so the boundary does not come from the code under test.
fn b23_pressure_pa(t: f64) -> f64 {
    (0.348_051_856_289_69e3 - 0.116_718_598_799_75e1 * t + 0.101_929_700_393_26e-2 * t * t) * 1e6
}

/// A root of p₃(ρ, T) = p by plain bisection on [lo, hi] (an implementation
/// independent of the library's bracketed Newton solver).
fn bisect_density(p: f64, t: f64, lo: f64, hi: f64) -> f64 {
    let (mut lo, mut hi) = (lo, hi);
    let increasing = region3::pressure_pa_unchecked(hi, t) > region3::pressure_pa_unchecked(lo, t);
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if (region3::pressure_pa_unchecked(mid, t) < p) == increasing {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    0.5 * (lo + hi)
}

/// Permissible inconsistencies between adjacent regions on their common
/// boundary, IAPWS R7-97(2012) section 4 / the IF97 development (FROM MEMORY,
/// not checked against the release text): Δv/v 0.05 %, Δh 0.2 kJ/kg,
/// Δs 0.2 J/(kg K), Δcp/cp 1 %, Δw/w 1 %.
const PERMISSIBLE_DV_REL: f64 = 5e-4;
const PERMISSIBLE_DH_J_KG: f64 = 200.0;
const PERMISSIBLE_DS_J_KGK: f64 = 0.2;
const PERMISSIBLE_DCP_REL: f64 = 1e-2;
const PERMISSIBLE_DW_REL: f64 = 1e-2;

/// Largest |Δ| seen for (v rel, h J/kg, s J/(kg K), cp rel, w rel).
#[derive(Default, Debug)]
struct Worst([f64; 5]);

impl Worst {
    fn compare(
        &mut self,
        label: &str,
        a: &vapora_tables::if97::Properties,
        b: &vapora_tables::if97::Properties,
    ) {
        let d = [
            relative_deviation(a.specific_volume_m3_kg, b.specific_volume_m3_kg),
            (a.enthalpy_j_kg - b.enthalpy_j_kg).abs(),
            (a.entropy_j_kgk - b.entropy_j_kgk).abs(),
            relative_deviation(a.cp_j_kgk, b.cp_j_kgk),
            relative_deviation(a.speed_of_sound_m_s, b.speed_of_sound_m_s),
        ];
        let limits = [
            PERMISSIBLE_DV_REL,
            PERMISSIBLE_DH_J_KG,
            PERMISSIBLE_DS_J_KGK,
            PERMISSIBLE_DCP_REL,
            PERMISSIBLE_DW_REL,
        ];
        for (k, (dk, lim)) in d.iter().zip(limits).enumerate() {
            self.0[k] = self.0[k].max(*dk);
            assert!(
                *dk <= lim,
                "{label}: p={} Pa T={} K: quantity {k} (v,h,s,cp,w) differs by {dk:e} (limit {lim:e}); {a:?} vs {b:?}",
                a.pressure_pa,
                a.temperature_k
            );
        }
    }
}

#[test]
fn region2_region3_consistency_along_b23() {
    let mut worst = Worst::default();
    // The corner at 623.15 K is left out: there p_B23 exceeds psat(T) by
    // 2e-5 Pa, so the (p, T) solver rightly takes the liquid root (the
    // dispatcher gives T = 623.15 K to Regions 1/2 anyway). 1 mK above it
    // psat is already 10 Pa above p_B23 and the vapour root is taken.
    for k in 0..=48 {
        // Likewise the corner at 863.15 K, where p_B23 is 100 MPa + 3e-5 Pa
        // and the point belongs to Region 2.
        let t = match k {
            0 => 623.151,
            48 => 863.149,
            _ => 623.15 + (863.15 - 623.15) * f64::from(k) / 48.0,
        };
        let p = b23_pressure_pa(t);
        let r2 = region2::properties_unchecked(p, t);
        let r3 = region3::properties_pt(p, t)
            .unwrap_or_else(|e| panic!("Region 3 at B23 T={t} p={p}: {e}"));
        worst.compare("B23 Region 2 vs 3", &r2, &r3);
    }
    println!(
        "B23: max |dv/v| {:.2e}, |dh| {:.3} J/kg, |ds| {:.4} J/(kg K), |dcp/cp| {:.2e}, |dw/w| {:.2e}",
        worst.0[0], worst.0[1], worst.0[2], worst.0[3], worst.0[4]
    );
}

#[test]
fn region1_region3_consistency_at_623_15_k() {
    let t = 623.15;
    let psat = region4::saturation_pressure_pa_unchecked(t);
    let mut worst = Worst::default();
    for k in 0..=40 {
        // From just above psat (the liquid side) to 100 MPa.
        let p = (psat * (1.0 + 1e-9) + (100e6 - psat) * f64::from(k) / 40.0).min(100e6);
        let r1 = region1::properties_unchecked(p, t);
        let r3 =
            region3::properties_pt(p, t).unwrap_or_else(|e| panic!("Region 3 T={t} p={p}: {e}"));
        worst.compare("623.15 K Region 1 vs 3", &r1, &r3);
    }
    println!(
        "623.15 K (1/3): max |dv/v| {:.2e}, |dh| {:.3} J/kg, |ds| {:.4} J/(kg K), |dcp/cp| {:.2e}, |dw/w| {:.2e}",
        worst.0[0], worst.0[1], worst.0[2], worst.0[3], worst.0[4]
    );
}

/// The jump in the saturated states where the method changes from Regions
/// 1/2 to Region 3, measured at 623.15 K itself.
#[test]
fn saturation_continuity_at_623_15_k() {
    let t = 623.15;
    let p = region4::saturation_pressure_pa_unchecked(t);
    let low = saturation::at_temperature(t).unwrap(); // Regions 1 and 2
                                                      // Region 3 route at the same (psat, T), by independent bisection
                                                      // between the spinodals and the far ends.
    let (vs, ls) = region3::spinodal_densities_kg_m3(t).unwrap();
    let rho_l = bisect_density(p, t, ls, 800.0);
    let rho_v = bisect_density(p, t, 50.0, vs);
    let liq3 = region3::properties_rho_t_unchecked(rho_l, t);
    let vap3 = region3::properties_rho_t_unchecked(rho_v, t);
    // And the library's own Region 3 route just above 623.15 K.
    let high = saturation::at_temperature(t + 1e-9).unwrap();
    assert!(
        relative_deviation(high.liquid.density_kg_m3, rho_l) < 1e-8,
        "Region 3 route at 623.15 K + 1 nK: rho' {} vs bisection {rho_l}",
        high.liquid.density_kg_m3
    );
    assert!(
        relative_deviation(high.vapour.density_kg_m3, rho_v) < 1e-8,
        "Region 3 route at 623.15 K + 1 nK: rho'' {} vs bisection {rho_v}",
        high.vapour.density_kg_m3
    );

    let d_rho_l = relative_deviation(liq3.density_kg_m3, low.liquid.density_kg_m3);
    let d_rho_v = relative_deviation(vap3.density_kg_m3, low.vapour.density_kg_m3);
    let d_h_l = liq3.enthalpy_j_kg - low.liquid.enthalpy_j_kg;
    let d_h_v = vap3.enthalpy_j_kg - low.vapour.enthalpy_j_kg;
    let d_s_l = liq3.entropy_j_kgk - low.liquid.entropy_j_kgk;
    let d_s_v = vap3.entropy_j_kgk - low.vapour.entropy_j_kgk;
    println!(
        "623.15 K saturation jump (Region 3 minus Regions 1/2): rho' {d_rho_l:.3e} rel ({} vs {}), rho'' {d_rho_v:.3e} rel ({} vs {}), h' {d_h_l:.3} J/kg, h'' {d_h_v:.3} J/kg, s' {d_s_l:.4}, s'' {d_s_v:.4} J/(kg K)",
        liq3.density_kg_m3, low.liquid.density_kg_m3, vap3.density_kg_m3, low.vapour.density_kg_m3
    );
    // The jumps must stay within the permissible boundary inconsistencies.
    assert!(
        d_rho_l <= PERMISSIBLE_DV_REL && d_rho_v <= PERMISSIBLE_DV_REL,
        "density jump rho' {d_rho_l:e}, rho'' {d_rho_v:e}"
    );
    assert!(
        d_h_l.abs() <= PERMISSIBLE_DH_J_KG && d_h_v.abs() <= PERMISSIBLE_DH_J_KG,
        "enthalpy jump h' {d_h_l}, h'' {d_h_v} J/kg"
    );
    assert!(
        d_s_l.abs() <= PERMISSIBLE_DS_J_KGK && d_s_v.abs() <= PERMISSIBLE_DS_J_KGK,
        "entropy jump s' {d_s_l}, s'' {d_s_v}"
    );
}

/// Every state on a dense grid is sound: finite, ρ' > ρ'', h'' > h', both at
/// psat(T), and the (p) entry agrees with the (T) entry.
#[test]
fn dense_grid_along_the_line() {
    let n = 2000;
    for k in 0..=n {
        let t = 273.15 + (CRITICAL_TEMPERATURE_K - 1e-4 - 273.15) * f64::from(k) / f64::from(n);
        let sat = saturation::at_temperature(t).unwrap_or_else(|e| panic!("T={t}: {e}"));
        let psat = region4::saturation_pressure_pa_unchecked(t);
        for (name, s) in [("liquid", sat.liquid), ("vapour", sat.vapour)] {
            let fields = [
                s.pressure_pa,
                s.density_kg_m3,
                s.enthalpy_j_kg,
                s.entropy_j_kgk,
                s.cp_j_kgk,
                s.cv_j_kgk,
                s.speed_of_sound_m_s,
                s.isentropic_exponent,
            ];
            assert!(
                fields.iter().all(|x| x.is_finite()),
                "T={t} {name}: non-finite field in {s:?}"
            );
            assert!(
                s.cp_j_kgk > 0.0 && s.speed_of_sound_m_s > 0.0,
                "T={t} {name}: {s:?}"
            );
            assert!(
                relative_deviation(s.pressure_pa, psat) <= 1e-12,
                "T={t} {name}: p {} vs psat {psat}",
                s.pressure_pa
            );
            assert_eq!(s.temperature_k, t);
        }
        assert!(
            sat.liquid.density_kg_m3 > sat.vapour.density_kg_m3,
            "T={t}: rho' {} rho'' {}",
            sat.liquid.density_kg_m3,
            sat.vapour.density_kg_m3
        );
        assert!(
            sat.vapour.enthalpy_j_kg > sat.liquid.enthalpy_j_kg,
            "T={t}: h' {} h'' {}",
            sat.liquid.enthalpy_j_kg,
            sat.vapour.enthalpy_j_kg
        );
        if k % 50 == 0 && psat >= region4::MIN_PRESSURE_PA {
            let by_p = saturation::at_pressure(psat).unwrap();
            let dt = (by_p.liquid.temperature_k - t).abs();
            // Tsat(psat(T)) = T to ~1e-12 relative; near Tc the saturated
            // densities respond strongly to T, hence the loose density bound.
            assert!(
                dt <= 1e-9 * t,
                "T={t}: at_pressure(psat) gives T={}",
                by_p.liquid.temperature_k
            );
            let d_rho = relative_deviation(by_p.vapour.density_kg_m3, sat.vapour.density_kg_m3);
            assert!(
                d_rho <= 1e-6,
                "T={t}: rho'' by p {} by T {}",
                by_p.vapour.density_kg_m3,
                sat.vapour.density_kg_m3
            );
        }
    }
}

/// In the last hundredths of a kelvin below Tc the Region 3 route never
/// fails, the states straddle ρc, and p = psat(T) holds as long as psat lies
/// inside the loop of Eq. 28 (measured: down to 1e-4 K below Tc; closer,
/// the vapour state is taken at its spinodal, within 1 Pa of psat).
#[test]
fn near_critical() {
    for dt in [0.01, 0.001, 1e-4, 3e-5, 1e-5, 1e-6, 1e-7, 1e-8] {
        let t = CRITICAL_TEMPERATURE_K - dt;
        let sat = saturation::at_temperature(t).unwrap_or_else(|e| panic!("Tc - {dt} K: {e}"));
        let psat = region4::saturation_pressure_pa_unchecked(t);
        let (l, v) = (sat.liquid, sat.vapour);
        println!(
            "Tc - {dt:e} K: rho' {:.6} rho'' {:.6} kg/m3, p' - psat {:.3e} Pa, p'' - psat {:.3e} Pa, h'' - h' {:.1} J/kg",
            l.density_kg_m3,
            v.density_kg_m3,
            l.pressure_pa - psat,
            v.pressure_pa - psat,
            v.enthalpy_j_kg - l.enthalpy_j_kg
        );
        assert!(
            l.density_kg_m3 > CRITICAL_DENSITY_KG_M3 && CRITICAL_DENSITY_KG_M3 > v.density_kg_m3,
            "Tc - {dt}: rho' {} rho'' {}",
            l.density_kg_m3,
            v.density_kg_m3
        );
        assert!(
            v.enthalpy_j_kg > l.enthalpy_j_kg,
            "Tc - {dt}: h' {} h'' {}",
            l.enthalpy_j_kg,
            v.enthalpy_j_kg
        );
        let tol = if dt >= 1e-4 { 1e-13 * psat } else { 1.0 };
        assert!(
            (l.pressure_pa - psat).abs() <= tol && (v.pressure_pa - psat).abs() <= tol,
            "Tc - {dt}: p' {} p'' {} psat {psat}",
            l.pressure_pa,
            v.pressure_pa
        );
        for s in [l, v] {
            assert!(
                [
                    s.density_kg_m3,
                    s.enthalpy_j_kg,
                    s.entropy_j_kgk,
                    s.cv_j_kgk
                ]
                .iter()
                .all(|x| x.is_finite()),
                "Tc - {dt}: {s:?}"
            );
        }
    }
    // Exactly at Tc (and at pc): the critical state, documented with cp = +inf.
    for sat in [
        saturation::at_temperature(CRITICAL_TEMPERATURE_K).unwrap(),
        saturation::at_pressure(CRITICAL_PRESSURE_PA).unwrap(),
    ] {
        assert_eq!(sat.liquid, sat.vapour);
        let c = sat.liquid;
        assert_eq!(c.density_kg_m3, CRITICAL_DENSITY_KG_M3);
        assert_eq!(c.temperature_k, CRITICAL_TEMPERATURE_K);
        // IAPWS R7-97(2012) Eq. 28 reproduces pc = 22.064 MPa at (ρc, Tc).
        assert!(
            relative_deviation(c.pressure_pa, CRITICAL_PRESSURE_PA) < 1e-11,
            "p at critical {}",
            c.pressure_pa
        );
        assert_eq!(c.cp_j_kgk, f64::INFINITY);
        assert!(c.speed_of_sound_m_s.is_finite() && c.speed_of_sound_m_s > 0.0);
        println!("critical state: {c:?}");
    }
}

/// Below Tc the isotherm slope at ρc is negative, which the spinodal
/// search relies on, down to 1e-8 K below Tc.
#[test]
fn slope_at_critical_density_negative_below_tc() {
    let mut dt = 1e-8;
    while dt < 24.0 {
        let t = CRITICAL_TEMPERATURE_K - dt;
        let (_, slope) = region3::pressure_and_slope_unchecked(CRITICAL_DENSITY_KG_M3, t);
        assert!(slope < 0.0, "T = Tc - {dt} K: dp/drho at rho_c = {slope:e}");
        dt *= 1.05;
    }
}

#[test]
fn bad_input_gives_typed_errors() {
    use FormulationError::*;
    for x in [f64::NAN, f64::INFINITY, f64::NEG_INFINITY] {
        assert_eq!(saturation::at_temperature(x), Err(NotFinite), "T={x}");
        assert_eq!(saturation::at_pressure(x), Err(NotFinite), "p={x}");
    }
    for t in [273.0, 647.1, -1.0, 1e6] {
        assert!(
            matches!(
                saturation::at_temperature(t),
                Err(TemperatureOutOfRange { .. })
            ),
            "T={t}"
        );
    }
    for p in [0.0, 600.0, 22.1e6, -5.0] {
        assert!(
            matches!(saturation::at_pressure(p), Err(PressureOutOfRange { .. })),
            "p={p}"
        );
    }
    // The lower ends are accepted.
    assert!(saturation::at_temperature(273.15).is_ok());
    assert!(saturation::at_temperature(273.16).is_ok());
    assert!(saturation::at_pressure(region4::MIN_PRESSURE_PA).is_ok());
}
