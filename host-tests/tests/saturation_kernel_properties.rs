//! Consistency properties of the kernel's saturation tables: monotonicity,
//! the order of the phases, round trips, the dome and continuity at knots.

use proptest::prelude::*;
use vapora_kernel::accuracy::{accuracy_at_saturation_temperature_k, STATED_ACCURACY_END_K};
use vapora_kernel::quality::{
    phase_from_pressure_enthalpy, phase_from_temperature_entropy, Phase, SATURATION_TOLERANCE,
};
use vapora_kernel::saturation::{
    saturated_state_at_pressure, saturated_state_at_temperature, saturation_pressure,
    saturation_temperature, PRESSURE_MAX_PA, PRESSURE_MIN_PA, TEMPERATURE_MAX_K, TEMPERATURE_MIN_K,
};
use vapora_kernel::spline::cubic;
use vapora_kernel::tables::saturation as table;
use vapora_kernel::units::{AbsolutePressure, Temperature};

/// Largest d(ln p_sat)/dT along the line, 1/K: L/(R T²) at the triple
/// point, 2.50e6/(461.5 × 273.16²) = 0.073 (from the latent heat at the
/// triple point, common practice, no source), rounded up.
const MAX_DLNP_DT: f64 = 0.08;

fn ln_pressure() -> impl Strategy<Value = f64> {
    f64::from(PRESSURE_MIN_PA).ln()..f64::from(PRESSURE_MAX_PA).ln()
}

fn p(pa: f64) -> AbsolutePressure {
    AbsolutePressure::from_pa(pa as f32).unwrap()
}

fn t(k: f64) -> Temperature {
    Temperature::from_kelvin(k as f32).unwrap()
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(4000))]

    #[test]
    fn saturation_temperature_increases_with_pressure(a in ln_pressure(), step in 1e-5f64..0.5) {
        // Pressures 1e-5 relative apart are ≥ 1e-3 K apart in T_sat, more
        // than the 1 mK accuracy, so the order must show.
        let (p1, p2) = (a.exp(), (a + step).exp().min(f64::from(PRESSURE_MAX_PA)));
        prop_assume!(p2 > p1 * (1.0 + 1e-5));
        let (t1, t2) = (saturation_temperature(p(p1)).unwrap(), saturation_temperature(p(p2)).unwrap());
        prop_assert!(t2.as_kelvin() > t1.as_kelvin(), "T_sat({p1}) = {:?}, T_sat({p2}) = {:?}", t1, t2);
    }

    #[test]
    fn saturation_pressure_increases_with_temperature(
        a in f64::from(TEMPERATURE_MIN_K)..f64::from(TEMPERATURE_MAX_K),
        step in 1e-3f64..20.0,
    ) {
        let b = (a + step).min(f64::from(TEMPERATURE_MAX_K));
        prop_assume!(b > a + 1e-3);
        let (p1, p2) = (saturation_pressure(t(a)).unwrap(), saturation_pressure(t(b)).unwrap());
        prop_assert!(p2.as_pa() > p1.as_pa(), "p_sat({a}) = {:?}, p_sat({b}) = {:?}", p1, p2);
    }

    #[test]
    fn liquid_is_denser_and_vapour_holds_more_enthalpy(
        k in f64::from(TEMPERATURE_MIN_K)..f64::from(STATED_ACCURACY_END_K.min(TEMPERATURE_MAX_K)),
        lnp in ln_pressure(),
    ) {
        for s in [saturated_state_at_temperature(t(k)).unwrap(), saturated_state_at_pressure(p(lnp.exp())).unwrap()] {
            if f64::from(s.temperature.as_kelvin()) > f64::from(STATED_ACCURACY_END_K) {
                continue;
            }
            prop_assert!(s.liquid.density_kg_m3 > s.vapour.density_kg_m3, "{s:?}");
            prop_assert!(s.vapour.enthalpy_j_kg > s.liquid.enthalpy_j_kg, "{s:?}");
            prop_assert!(s.vapour.entropy_j_kgk > s.liquid.entropy_j_kgk, "{s:?}");
            prop_assert!(s.latent_heat_j_kg > 0.0 && s.entropy_of_vaporisation_j_kgk > 0.0, "{s:?}");
        }
    }

    #[test]
    fn pressure_round_trips_through_the_saturation_temperature(lnp in ln_pressure()) {
        let p_in = p(lnp.exp());
        let t_sat = saturation_temperature(p_in).unwrap();
        prop_assume!(t_sat.as_kelvin() <= STATED_ACCURACY_END_K);
        let p_back = saturation_pressure(t_sat).unwrap();
        let acc = accuracy_at_saturation_temperature_k(t_sat.as_kelvin());
        // Each direction errs by at most its bound; T's error moves p by
        // d(ln p)/dT × ΔT.
        let bound = f64::from(acc.pressure_relative) + MAX_DLNP_DT * f64::from(acc.temperature_k);
        let rel = (f64::from(p_back.as_pa()) / f64::from(p_in.as_pa()) - 1.0).abs();
        prop_assert!(rel <= bound, "p {} -> T {} -> p {}: {rel:.2e} > {bound:.2e}",
            p_in.as_pa(), t_sat.as_kelvin(), p_back.as_pa());
    }

    #[test]
    fn dryness_is_in_0_1_exactly_inside_the_dome(lnp in ln_pressure(), y in -0.5f64..1.5) {
        let pressure = p(lnp.exp());
        let s = saturated_state_at_pressure(pressure).unwrap();
        let (h_l, h_v) = (f64::from(s.liquid.enthalpy_j_kg), f64::from(s.vapour.enthalpy_j_kg));
        let h = (h_l + y * (h_v - h_l)) as f32;
        let x = (f64::from(h) - h_l) / (h_v - h_l); // lever rule on the kernel's own h', h''
        let phase = phase_from_pressure_enthalpy(pressure, h).unwrap();
        let tol = f64::from(SATURATION_TOLERANCE) * 1.01;
        match phase.dryness_fraction() {
            Some(q) => {
                prop_assert!((0.0..=1.0).contains(&q), "{phase:?}");
                prop_assert!(x >= -tol && x <= 1.0 + tol, "x = {x} but {phase:?}");
            }
            None => {
                prop_assert!(x <= tol || x >= 1.0 - tol, "x = {x} but {phase:?}");
                let expected = if x < 0.5 { Phase::SubcooledLiquid } else { Phase::SuperheatedVapour };
                prop_assert_eq!(phase, expected);
            }
        }
        if let Phase::WetSteam { dryness_fraction } = phase {
            prop_assert!((f64::from(dryness_fraction) - x).abs() < 1e-5, "{dryness_fraction} vs {x}");
        }
    }

    #[test]
    fn temperature_and_entropy_give_the_same_dome(
        k in f64::from(TEMPERATURE_MIN_K)..f64::from(STATED_ACCURACY_END_K.min(TEMPERATURE_MAX_K)),
        y in -0.5f64..1.5,
    ) {
        let temperature = t(k);
        let s = saturated_state_at_temperature(temperature).unwrap();
        let (s_l, s_v) = (f64::from(s.liquid.entropy_j_kgk), f64::from(s.vapour.entropy_j_kgk));
        let entropy = (s_l + y * (s_v - s_l)) as f32;
        let x = (f64::from(entropy) - s_l) / (s_v - s_l);
        let phase = phase_from_temperature_entropy(temperature, entropy).unwrap();
        let inside = phase.dryness_fraction().is_some();
        let tol = f64::from(SATURATION_TOLERANCE) * 1.01;
        // Right at a band edge the f32 lever rule may round either way.
        let near_edge = [-tol, 1.0 + tol].iter().any(|e| (x - e).abs() < 1e-6);
        prop_assert!(near_edge || inside == (-tol..=1.0 + tol).contains(&x), "x = {x}, {phase:?}");
    }
}

/// Checks that interval i−1 at t = 1 meets interval i at t = 0 for every
/// quantity, within the f32 rounding of the stored coefficients and of
/// Horner's rule: 4 ε × (Σ|cᵢ| of the left cubic + |c₀| of the right).
/// (Works for both table kinds: in an octave table the last interval of an
/// octave ends at t = 1 on the power of two where the next one starts.)
fn continuous<const P: usize>(name: &str, intervals: &[[[f32; 4]; P]]) -> Vec<String> {
    let mut bad = Vec::new();
    for (i, pair) in intervals.windows(2).enumerate() {
        for (q, (l, r)) in pair[0].iter().zip(pair[1].iter()).enumerate() {
            let left = cubic(l, 1.0);
            let right = cubic(r, 0.0);
            let scale = l.iter().map(|c| c.abs()).sum::<f32>() + r[0].abs();
            let tol = 4.0 * f32::EPSILON * scale;
            if (left - right).abs() > tol {
                bad.push(format!(
                    "{name}: knot {} quantity {q}: {left} vs {right} (tolerance {tol:e})",
                    i + 1
                ));
            }
        }
    }
    bad
}

#[test]
fn every_table_is_continuous_at_every_knot() {
    let mut bad = continuous("STATE_LOW", table::STATE_LOW.intervals);
    bad.extend(continuous("STATE_HIGH", table::STATE_HIGH.intervals));
    bad.extend(continuous(
        "TEMPERATURE_LOW",
        table::TEMPERATURE_LOW.intervals,
    ));
    bad.extend(continuous(
        "TEMPERATURE_HIGH",
        table::TEMPERATURE_HIGH.intervals,
    ));
    assert!(bad.is_empty(), "{}", bad.join("\n"));
}
