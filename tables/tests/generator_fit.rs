//! The generator's fitting machinery on analytic functions, where the exact
//! answer is known without the formulation.
#![cfg(feature = "generator")]

use vapora_tables::generator::emit::{checksum, format_f32};
use vapora_tables::generator::fit::{
    evaluate_f32, fit_cubic, sample_positions, to_f32, UniformKnots,
};
use vapora_tables::generator::{
    generate, measure, Config, PhaseSample, SaturatedSample, SaturationSource,
};
use vapora_tables::if97::region4;

fn fit_max_error(f: impl Fn(f64) -> f64, lo: f64, hi: f64, n: usize) -> f64 {
    let knots = UniformKnots::covering(lo, hi, n).unwrap();
    let xs = sample_positions(&knots, 12, lo, hi);
    let ys: Vec<f64> = xs.iter().map(|&x| f(x)).collect();
    let c = fit_cubic(&knots, &xs, &ys).unwrap();
    let mut worst = 0.0f64;
    for k in 0..=n * 64 {
        let x = lo + (hi - lo) * k as f64 / (n * 64) as f64;
        let (i, t) = knots.split(knots.local(x));
        let a = c[i];
        let y = a[0] + t * (a[1] + t * (a[2] + t * a[3]));
        worst = worst.max((y - f(x)).abs());
    }
    worst
}

#[test]
fn a_cubic_is_reproduced_exactly() {
    // Any cubic lies in the spline space, so least squares must return it.
    let f = |x: f64| 2.0 - 3.0 * x + 0.5 * x * x - 0.25 * x * x * x;
    let e = fit_max_error(f, -1.0, 2.0, 7);
    assert!(e < 1e-12, "max error {e:e}");
}

#[test]
fn error_falls_with_the_fourth_power_of_the_step() {
    // A cubic spline's error scales as h⁴: doubling the intervals divides it
    // by about 16 (allow 10 to 22 for the least-squares weighting).
    let e16 = fit_max_error(f64::sin, 0.0, 3.0, 16);
    let e32 = fit_max_error(f64::sin, 0.0, 3.0, 32);
    let ratio = e16 / e32;
    assert!(
        (10.0..22.0).contains(&ratio),
        "e16 {e16:e}, e32 {e32:e}, ratio {ratio}"
    );
    // Interpolation would give h⁴·max|f⁗|/384 = 2.0e-7 here; least squares is as good.
    assert!(e32 < 2.0e-7, "e32 {e32:e}");
}

#[test]
fn partial_data_in_the_first_interval_still_fits() {
    // As in the near-critical table: no data below 0.1 on knots from 0.
    let f = |x: f64| 1.0 + x + 0.3 * x * x;
    let knots = UniformKnots::covering(0.0, 5.0, 10).unwrap();
    let xs = sample_positions(&knots, 12, 0.1, 5.0);
    assert!(xs.iter().all(|&x| x >= 0.1));
    let ys: Vec<f64> = xs.iter().map(|&x| f(x)).collect();
    let c = to_f32(&fit_cubic(&knots, &xs, &ys).unwrap());
    for x in [0.0f32, 0.05, 0.1, 2.5, 5.0] {
        let y = evaluate_f32(&knots, &c, x);
        assert!((f64::from(y) - f(f64::from(x))).abs() < 1e-5, "x {x}: {y}");
    }
}

#[test]
fn f32_values_round_trip_through_the_emitted_text() {
    for v in [
        0.0f32,
        -0.0,
        1.0,
        0.1,
        -273.16,
        1.0e-38,
        1.4e-45,
        3.4028235e38,
        647.096,
        22.064e6,
        1.0 / 3.0,
    ] {
        let s = format_f32(v);
        let back: f32 = s.parse().unwrap();
        assert_eq!(back.to_bits(), v.to_bits(), "{v} -> {s}");
    }
}

#[test]
fn checksum_is_crc32_iso_hdlc() {
    // The CRC-32/ISO-HDLC check value of "123456789" is 0xCBF43926
    // (the catalogue check value of this CRC, from memory).
    assert_eq!(checksum(b"123456789"), 0xCBF4_3926);
}

/// A smooth stand-in for the saturation line: the Region 4 pressure and
/// simple polynomials in τ = √(Tc − T) for the phases (continuous across
/// 623.15 K, so the two tables must agree there).
struct Analytic;

impl SaturationSource for Analytic {
    fn saturation_pressure_pa(&self, t_k: f64) -> f64 {
        region4::saturation_pressure_pa_unchecked(t_k)
    }
    fn saturation_temperature_k(&self, p_pa: f64) -> f64 {
        region4::saturation_temperature_k_unchecked(p_pa)
    }
    fn saturated_sample(&self, t_k: f64) -> Result<SaturatedSample, String> {
        let tau = (647.096 - t_k).max(0.0).sqrt();
        let phase = |sign: f64| PhaseSample {
            density_kg_m3: 322.0 + sign * (60.0 * tau + 2.0 * tau * tau).min(700.0),
            enthalpy_j_kg: 2.0e6 - sign * 1.0e5 * tau,
            entropy_j_kgk: 4400.0 - sign * 300.0 * tau,
            cp_j_kgk: 4000.0 + 1.0e5 / (1.0 + tau * tau),
        };
        Ok(SaturatedSample {
            pressure_pa: self.saturation_pressure_pa(t_k),
            liquid: phase(1.0),
            vapour: PhaseSample {
                density_kg_m3: 0.01 + tau.powi(-2) * 1e-3,
                ..phase(-1.0)
            },
        })
    }
}

#[test]
fn the_whole_pipeline_runs_on_an_analytic_line() {
    let g = generate(&Config::default(), &Analytic).unwrap();
    let m = measure::measure(&g, &Analytic).unwrap();
    // Saturation temperature and pressure come from the real Region 4 equation.
    assert!(m.below_near_critical.temperature_k < 1e-3, "{m:?}");
    assert!(m.below_near_critical.pressure_relative < 1e-5, "{m:?}");
    assert!(m.near_critical.temperature_k < 1e-3, "{m:?}");
    let text = vapora_tables::generator::emit::emit(&g, &m);
    assert!(text.starts_with("// @generated"));
    assert_eq!(
        text,
        vapora_tables::generator::emit::emit(&g, &m),
        "emission is deterministic"
    );
}

#[test]
fn settings_round_trip_through_the_header_line() {
    let c = Config {
        temperature_min_k: 373.15,
        state_intervals_low: 7,
        critical_margin_k: 0.02,
        ..Config::default()
    };
    assert_eq!(Config::parse(&c.describe()).unwrap(), c);
    assert!(Config::parse("no_such_setting=1").is_err());
    assert!(Config::parse("state_intervals_low=many").is_err());
}

#[test]
fn a_narrow_envelope_gives_a_small_table_that_meets_the_accuracy_table() {
    use vapora_tables::generator::{fit_to_target, iapws97::Iapws97};
    // A process-steam header run between 100 °C and 200 °C saturation.
    let base = Config {
        temperature_min_k: 373.15,
        temperature_max_k: 473.15,
        state_intervals_low: 16,
        temperature_octave_bits_low: 2,
        ..Config::default()
    };
    let (g, m) = fit_to_target(&base, 1.0, &Iapws97).unwrap();
    assert!(g.size_bytes() < 2048, "{} bytes", g.size_bytes());
    assert!(
        m.below_near_critical
            .within(&measure::ACCURACY_TABLE_BELOW_NEAR_CRITICAL, 1.0),
        "{m:?}"
    );
    assert!(g.limits.temperature_min_k >= 373.15 && g.limits.temperature_max_k <= 473.150_03);
    assert!(
        f64::from(g.limits.pressure_min_pa) >= region4::saturation_pressure_pa(373.15).unwrap()
    );
    // Inside the envelope the kernel-path evaluation agrees with the source.
    let s = measure::state_at_temperature(&g, 423.15);
    let r = Iapws97.saturated_sample(423.15).unwrap();
    assert!((f64::from(s.properties[2]) - r.liquid.enthalpy_j_kg).abs() < 10.0);
}
