//! Dryness fraction from (p, s), (p, v), (T, s) and wet-steam properties from
//! (p, x), (T, x) against the f64 formulation's saturated states, within the
//! bounds that follow from the kernel's published saturated-property bounds;
//! and the single-property calls against the full state.

use rand::{Rng, SeedableRng};
use rand_chacha::ChaCha8Rng;
use vapora_host_tests::accuracy::{
    reference_at_pressure, reference_at_temperature, NEAR_CRITICAL_START_K,
};
use vapora_kernel::accuracy::ACCURACY_BELOW_NEAR_CRITICAL as ACC;
use vapora_kernel::mixture::{wet_steam_at_pressure, wet_steam_at_temperature};
use vapora_kernel::quality::{
    phase_from_pressure_entropy, phase_from_pressure_specific_volume,
    phase_from_temperature_entropy,
};
use vapora_kernel::saturation::{
    saturated_property_at_pressure, saturated_property_at_temperature, saturated_state_at_pressure,
    saturated_state_at_temperature, SaturatedProperty as P, PRESSURE_MIN_PA, TEMPERATURE_MIN_K,
};
use vapora_kernel::units::{AbsolutePressure, Temperature};
use vapora_tables::if97::region4;

/// Slack for rounding the f64 test input (s, v, x) to f32, in dryness
/// fraction or relative terms: far below every bound checked.
const INPUT_ROUNDING: f64 = 1e-6;

const PROBES: [f64; 3] = [0.1, 0.5, 0.9];

fn random_pressures(n: usize) -> Vec<f32> {
    let p_top = region4::saturation_pressure_pa(NEAR_CRITICAL_START_K).unwrap();
    let mut rng = ChaCha8Rng::seed_from_u64(7);
    (0..n)
        .map(|_| {
            rng.random_range(f64::from(PRESSURE_MIN_PA).ln()..p_top.ln())
                .exp() as f32
        })
        .collect()
}

fn random_temperatures(n: usize) -> Vec<f32> {
    let mut rng = ChaCha8Rng::seed_from_u64(8);
    (0..n)
        .map(|_| rng.random_range(f64::from(TEMPERATURE_MIN_K)..NEAR_CRITICAL_START_K) as f32)
        .collect()
}

#[test]
fn dryness_from_entropy_and_volume_below_tc_minus_1_k() {
    let (ds_l, ds_v) = (
        f64::from(ACC.liquid_entropy_j_kgk),
        f64::from(ACC.vapour_entropy_j_kgk),
    );
    let (dr_l, dr_v) = (
        f64::from(ACC.liquid_density_relative),
        f64::from(ACC.vapour_density_relative),
    );
    let mut worst = [0.0f64; 3];
    for p_pa in random_pressures(20_000) {
        let p = AbsolutePressure::from_pa(p_pa).unwrap();
        let r = reference_at_pressure(f64::from(p_pa)).unwrap();
        let (s_l, s_v) = (r.properties[4], r.properties[5]);
        let (v_l, v_v) = (1.0 / r.properties[0], 1.0 / r.properties[1]);
        for x in PROBES {
            let s = (s_l + x * (s_v - s_l)) as f32;
            let x_ref = (f64::from(s) - s_l) / (s_v - s_l);
            let got = phase_from_pressure_entropy(p, s)
                .unwrap()
                .dryness_fraction()
                .unwrap();
            let err = (f64::from(got) - x_ref).abs();
            let bound = (ds_l + ds_v) / (s_v - s_l) + INPUT_ROUNDING;
            assert!(
                err <= bound,
                "(p, s) = ({p_pa}, {s}): x {got} vs {x_ref}, {err:.2e} > {bound:.2e}"
            );
            worst[0] = worst[0].max(err);

            let v = (v_l + x * (v_v - v_l)) as f32;
            let x_ref = (f64::from(v) - v_l) / (v_v - v_l);
            let got = phase_from_pressure_specific_volume(p, v)
                .unwrap()
                .dryness_fraction()
                .unwrap();
            let err = (f64::from(got) - x_ref).abs();
            // v = 1/ρ has the relative error of ρ (to first order).
            let bound =
                ((1.0 - x) * dr_l * v_l + x * dr_v * v_v) / (v_v - v_l) * 1.01 + INPUT_ROUNDING;
            assert!(
                err <= bound,
                "(p, v) = ({p_pa}, {v}): x {got} vs {x_ref}, {err:.2e} > {bound:.2e}"
            );
            worst[1] = worst[1].max(err);
        }
    }
    for t_k in random_temperatures(20_000) {
        let t = Temperature::from_kelvin(t_k).unwrap();
        let r = reference_at_temperature(f64::from(t_k)).unwrap();
        let (s_l, s_v) = (r.properties[4], r.properties[5]);
        for x in PROBES {
            let s = (s_l + x * (s_v - s_l)) as f32;
            let x_ref = (f64::from(s) - s_l) / (s_v - s_l);
            let got = phase_from_temperature_entropy(t, s)
                .unwrap()
                .dryness_fraction()
                .unwrap();
            let err = (f64::from(got) - x_ref).abs();
            let bound = (ds_l + ds_v) / (s_v - s_l) + INPUT_ROUNDING;
            assert!(
                err <= bound,
                "(T, s) = ({t_k}, {s}): x {got} vs {x_ref}, {err:.2e} > {bound:.2e}"
            );
            worst[2] = worst[2].max(err);
        }
    }
    println!(
        "largest |Δx|: (p, s) {:.2e}, (p, v) {:.2e}, (T, s) {:.2e}",
        worst[0], worst[1], worst[2]
    );
}

#[test]
fn wet_steam_follows_the_lever_rule_of_the_formulation() {
    let dh = f64::from(ACC.liquid_enthalpy_j_kg.max(ACC.vapour_enthalpy_j_kg));
    let ds = f64::from(ACC.liquid_entropy_j_kgk.max(ACC.vapour_entropy_j_kgk));
    let dr = f64::from(ACC.liquid_density_relative.max(ACC.vapour_density_relative));
    let check = |w: &vapora_kernel::mixture::WetSteam,
                 r: &vapora_host_tests::accuracy::ReferenceState,
                 x: f64| {
        let lever = |a: f64, b: f64| a + x * (b - a);
        let h = lever(r.properties[2], r.properties[3]);
        let s = lever(r.properties[4], r.properties[5]);
        let v = lever(1.0 / r.properties[0], 1.0 / r.properties[1]);
        assert!(
            (f64::from(w.enthalpy_j_kg) - h).abs() <= dh + 0.5,
            "h {w:?} vs {h}"
        );
        assert!(
            (f64::from(w.entropy_j_kgk) - s).abs() <= ds + 1e-3,
            "s {w:?} vs {s}"
        );
        assert!(
            (f64::from(w.specific_volume_m3_kg) / v - 1.0).abs() <= dr * 1.01 + INPUT_ROUNDING,
            "v {w:?} vs {v}"
        );
        assert!(
            (f64::from(w.density_kg_m3) * v - 1.0).abs() <= dr * 1.01 + INPUT_ROUNDING,
            "ρ {w:?} vs {}",
            1.0 / v
        );
    };
    for p_pa in random_pressures(5_000) {
        let r = reference_at_pressure(f64::from(p_pa)).unwrap();
        for x in [0.0, 0.3, 1.0] {
            let w =
                wet_steam_at_pressure(AbsolutePressure::from_pa(p_pa).unwrap(), x as f32).unwrap();
            check(&w, &r, x);
        }
    }
    for t_k in random_temperatures(5_000) {
        let r = reference_at_temperature(f64::from(t_k)).unwrap();
        for x in [0.0, 0.7, 1.0] {
            let w =
                wet_steam_at_temperature(Temperature::from_kelvin(t_k).unwrap(), x as f32).unwrap();
            check(&w, &r, x);
        }
    }
}

#[test]
fn single_property_calls_agree_with_the_full_state() {
    for (p_pa, t_k) in random_pressures(2_000)
        .into_iter()
        .zip(random_temperatures(2_000))
    {
        let p = AbsolutePressure::from_pa(p_pa).unwrap();
        let t = Temperature::from_kelvin(t_k).unwrap();
        for (s, get) in [
            (
                saturated_state_at_pressure(p).unwrap(),
                &(|q| saturated_property_at_pressure(p, q).unwrap()) as &dyn Fn(P) -> f32,
            ),
            (saturated_state_at_temperature(t).unwrap(), &|q| {
                saturated_property_at_temperature(t, q).unwrap()
            }),
        ] {
            let pairs = [
                (P::LiquidDensity, s.liquid.density_kg_m3),
                (P::VapourDensity, s.vapour.density_kg_m3),
                (P::LiquidSpecificVolume, s.liquid.specific_volume_m3_kg),
                (P::VapourSpecificVolume, s.vapour.specific_volume_m3_kg),
                (P::LiquidEnthalpy, s.liquid.enthalpy_j_kg),
                (P::VapourEnthalpy, s.vapour.enthalpy_j_kg),
                (P::LatentHeat, s.latent_heat_j_kg),
                (P::LiquidEntropy, s.liquid.entropy_j_kgk),
                (P::VapourEntropy, s.vapour.entropy_j_kgk),
                (P::EntropyOfVaporisation, s.entropy_of_vaporisation_j_kgk),
                (P::LiquidCp, s.liquid.cp_j_kgk),
                (P::VapourCp, s.vapour.cp_j_kgk),
            ];
            for (q, full) in pairs {
                assert_eq!(get(q), full, "{q:?} at {s:?}");
            }
        }
    }
}
