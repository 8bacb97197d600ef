//! Exhaustive checks of the compiled tables over their whole domain: every
//! knot interval of every table at both ends and at 63 interior points,
//! through the raw cubics and through the kernel's public functions.
//!
//! - No value outside the physical range of its property anywhere
//!   (the ranges of `vapora_host_tests::robustness`).
//! - Saturation temperature and pressure strictly monotonic: on every
//!   interval the derivative of the stored cubic (f32 coefficients,
//!   evaluated exactly enough in f64) keeps its sign on all of [0, 1],
//!   checked at both ends and at the vertex of the derivative's parabola;
//!   the knots follow in order; the cubics evaluated in f32 never go
//!   backwards and go forwards wherever the exact step exceeds 2 ulp; and
//!   the f32 values the kernel's public functions return at every sample
//!   point, in order, never go backwards (neighbours may be equal where
//!   the samples are closer than the output's f32 resolution).
//! - Continuity across the 623.15 K split of the tables for p_sat and
//!   T_sat, which IF97 defines by one equation on both sides (the other
//!   properties jump there, as IF97's do; knot continuity of every
//!   quantity is checked in saturation_kernel_properties.rs).

use vapora_host_tests::robustness::{
    check_saturation_pressure, check_saturation_temperature, check_state, check_wet_steam,
};
use vapora_kernel::mixture::wet_steam_at_temperature;
use vapora_kernel::saturation::{
    saturated_state_at_pressure, saturated_state_at_temperature, saturation_pressure,
    saturation_temperature, PRESSURE_MAX_PA, PRESSURE_MIN_PA, TEMPERATURE_MAX_K, TEMPERATURE_MIN_K,
};
use vapora_kernel::spline::{cubic, OctaveCubicTable, UniformCubicTable};
use vapora_kernel::tables::saturation as table;
use vapora_kernel::units::{AbsolutePressure, Temperature};

/// Sample positions per interval: both ends and 63 interior points.
const SAMPLES: usize = 64;

/// The table's variable at interval `i`, position `t`, in f64.
fn x_at<const P: usize>(tab: &UniformCubicTable<P>, i: usize, t: f64) -> f64 {
    f64::from(tab.start) + (i as f64 + t) / f64::from(tab.inverse_step)
}

fn cubic_f64(c: &[f32; 4], t: f64) -> f64 {
    let [a, b, cc, d] = c.map(f64::from);
    a + t * (b + t * (cc + t * d))
}

/// Smallest of sign·derivative of the cubic over [0, 1]: at both ends and at
/// the vertex of the derivative's parabola when it lies inside.
fn least_slope(c: &[f32; 4], sign: f64) -> f64 {
    let [_, b, cc, d] = c.map(f64::from);
    let slope = |t: f64| sign * (b + t * (2.0 * cc + t * 3.0 * d));
    let mut least = slope(0.0).min(slope(1.0));
    if d != 0.0 {
        let vertex = -cc / (3.0 * d);
        if vertex > 0.0 && vertex < 1.0 {
            least = least.min(slope(vertex));
        }
    }
    least
}

/// Strict monotonicity of quantity `q` of a table in its variable, with
/// `sign` +1 for increasing, −1 for decreasing. Returns the number of
/// checks made and the failures.
fn strictly_monotonic<const P: usize>(
    name: &str,
    intervals: &[[[f32; 4]; P]],
    q: usize,
    sign: f64,
) -> (usize, Vec<String>) {
    let mut checks = 0;
    let mut bad = Vec::new();
    for (i, block) in intervals.iter().enumerate() {
        checks += 1;
        let least = least_slope(&block[q], sign);
        // NaN fails too.
        let right_sign = least > 0.0;
        if !right_sign {
            bad.push(format!(
                "{name} interval {i}: slope {least:e} has the wrong sign"
            ));
        }
        // f32 values as the kernel evaluates them: never backwards, and
        // forwards whenever the exact step is above 2 ulp.
        let mut previous: Option<(f32, f64)> = None;
        for k in 0..=SAMPLES {
            let t = k as f32 / SAMPLES as f32;
            let value = cubic(&block[q], t);
            let exact = cubic_f64(&block[q], f64::from(t));
            if let Some((v0, e0)) = previous {
                checks += 1;
                let step = sign * f64::from(value - v0);
                let exact_step = sign * (exact - e0);
                let ulp = f64::from(value.abs().max(v0.abs())) * f64::from(f32::EPSILON);
                if step < 0.0 || (exact_step > 2.0 * ulp && step <= 0.0) {
                    bad.push(format!(
                        "{name} interval {i} t = {t}: {v0} then {value} (exact step {exact_step:e})"
                    ));
                }
            }
            previous = Some((value, exact));
        }
    }
    // The knots in order: the next interval starts no earlier than this one
    // ends, within the f32 rounding of the stored coefficients.
    for (i, pair) in intervals.windows(2).enumerate() {
        checks += 1;
        let end = cubic_f64(&pair[0][q], 1.0);
        let start = f64::from(pair[1][q][0]);
        let scale: f64 = pair[0][q].iter().map(|c| f64::from(c.abs())).sum();
        if sign * (start - end) < -4.0 * f64::from(f32::EPSILON) * scale {
            bad.push(format!(
                "{name} knot {}: ends at {end}, next starts at {start}",
                i + 1
            ));
        }
    }
    (checks, bad)
}

#[test]
fn saturation_temperature_and_pressure_are_strictly_monotonic_on_every_interval() {
    let mut total = 0;
    let mut bad = Vec::new();
    // T_sat increases with p; τ = √(Tc − T) increases with q = pc − p.
    // Inside an interval of an octave table p (or q) is linear in t, so
    // the sign of d/dt is the sign of d/dp.
    for (checks, b) in [
        strictly_monotonic(
            "TEMPERATURE_LOW T(p)",
            table::TEMPERATURE_LOW.intervals,
            0,
            1.0,
        ),
        strictly_monotonic(
            "TEMPERATURE_HIGH τ(q)",
            table::TEMPERATURE_HIGH.intervals,
            0,
            1.0,
        ),
        // ln p_sat increases with T, so decreases with τ.
        strictly_monotonic("STATE_LOW ln p(T)", table::STATE_LOW.intervals, 0, 1.0),
        strictly_monotonic("STATE_HIGH ln p(τ)", table::STATE_HIGH.intervals, 0, -1.0),
    ] {
        total += checks;
        bad.extend(b);
    }
    println!("{total} monotonicity checks on the stored cubics");
    assert!(
        bad.is_empty(),
        "{} failures:\n{}",
        bad.len(),
        bad.join("\n")
    );
}

#[test]
fn the_monotonicity_check_can_fail() {
    // Asking for the wrong direction must fail on every interval.
    let (_, bad) = strictly_monotonic("TEMPERATURE_LOW", table::TEMPERATURE_LOW.intervals, 0, -1.0);
    assert!(
        bad.len() >= table::TEMPERATURE_LOW.intervals.len(),
        "{bad:?}"
    );
    let (_, bad) = strictly_monotonic("STATE_HIGH", table::STATE_HIGH.intervals, 0, 1.0);
    assert!(bad.len() >= table::STATE_HIGH.intervals.len(), "{bad:?}");
}

/// Every sample point of every interval of a state table, as a temperature.
fn state_table_temperatures() -> Vec<f32> {
    let mut out = Vec::new();
    for i in 0..table::STATE_LOW.intervals.len() {
        for k in 0..=SAMPLES {
            out.push(x_at(&table::STATE_LOW, i, k as f64 / SAMPLES as f64) as f32);
        }
    }
    for i in 0..table::STATE_HIGH.intervals.len() {
        for k in 0..=SAMPLES {
            let tau = x_at(&table::STATE_HIGH, i, k as f64 / SAMPLES as f64);
            out.push((f64::from(table::CRITICAL_TEMPERATURE_K) - tau * tau) as f32);
        }
    }
    out.retain(|t| (TEMPERATURE_MIN_K..=TEMPERATURE_MAX_K).contains(t));
    out.extend([
        TEMPERATURE_MIN_K,
        TEMPERATURE_MAX_K,
        table::BOUNDARY_TEMPERATURE_K,
    ]);
    out.sort_by(f32::total_cmp);
    out.dedup();
    out
}

/// The input of an octave table at interval `i`, position `t`: inside an
/// octave the input is linear in its bit pattern.
fn octave_x_at<const P: usize>(tab: &OctaveCubicTable<P>, i: usize, t: f64) -> f64 {
    let knot = |j: u32| f64::from(f32::from_bits((tab.first + j) << tab.shift));
    let (x0, x1) = (knot(i as u32), knot(i as u32 + 1));
    x0 + t * (x1 - x0)
}

/// Every sample point of every interval of a temperature table, as a pressure.
fn temperature_table_pressures() -> Vec<f32> {
    let mut out = Vec::new();
    for i in 0..table::TEMPERATURE_LOW.intervals.len() {
        for k in 0..=SAMPLES {
            out.push(octave_x_at(&table::TEMPERATURE_LOW, i, k as f64 / SAMPLES as f64) as f32);
        }
    }
    for i in 0..table::TEMPERATURE_HIGH.intervals.len() {
        for k in 0..=SAMPLES {
            let q = octave_x_at(&table::TEMPERATURE_HIGH, i, k as f64 / SAMPLES as f64);
            out.push((f64::from(table::CRITICAL_PRESSURE_PA) - q) as f32);
        }
    }
    out.retain(|p| (PRESSURE_MIN_PA..=PRESSURE_MAX_PA).contains(p));
    out.extend([
        PRESSURE_MIN_PA,
        PRESSURE_MAX_PA,
        table::BOUNDARY_PRESSURE_PA,
    ]);
    out.sort_by(f32::total_cmp);
    out.dedup();
    out
}

#[test]
fn no_table_gives_a_value_outside_its_physical_range_anywhere() {
    let mut bad = Vec::new();
    let mut points = 0;
    let state = [table::STATE_LOW.intervals, table::STATE_HIGH.intervals];
    for intervals in state {
        for (i, block) in intervals.iter().enumerate() {
            for k in 0..=SAMPLES {
                let t = k as f32 / SAMPLES as f32;
                for (q, c) in block.iter().enumerate() {
                    if !cubic(c, t).is_finite() {
                        bad.push(format!(
                            "state interval {i} quantity {q} t = {t}: not finite"
                        ));
                    }
                }
            }
        }
    }
    for t_k in state_table_temperatures() {
        points += 1;
        let t = Temperature::from_kelvin(t_k).unwrap();
        let state = saturated_state_at_temperature(t).unwrap();
        if let Err(e) = check_state(&state) {
            bad.push(format!("state at {t_k} K: {e}"));
        }
        for x in [0.0, 0.5, 1.0] {
            let w = wet_steam_at_temperature(t, x).unwrap();
            if let Err(e) = check_wet_steam(&w, &state) {
                bad.push(format!("wet steam x = {x} at {t_k} K: {e}"));
            }
        }
        if let Err(e) = check_saturation_pressure(saturation_pressure(t).unwrap()) {
            bad.push(format!("p_sat({t_k} K): {e}"));
        }
    }
    for p_pa in temperature_table_pressures() {
        points += 1;
        let p = AbsolutePressure::from_pa(p_pa).unwrap();
        if let Err(e) = check_saturation_temperature(saturation_temperature(p).unwrap()) {
            bad.push(format!("T_sat({p_pa} Pa): {e}"));
        }
        if let Err(e) = check_state(&saturated_state_at_pressure(p).unwrap()) {
            bad.push(format!("state at {p_pa} Pa: {e}"));
        }
    }
    println!("{points} points of the line, every interval of every table");
    assert!(
        bad.is_empty(),
        "{} failures:\n{}",
        bad.len(),
        bad[..bad.len().min(30)].join("\n")
    );
}

#[test]
fn the_kernel_never_returns_a_saturation_temperature_or_pressure_out_of_order() {
    // Every sample point of every interval, in order, through the kernel.
    let mut backwards = Vec::new();
    let (mut pairs, mut equal) = (0, 0);
    let temperatures = state_table_temperatures();
    for w in temperatures.windows(2) {
        let p0 = saturation_pressure(Temperature::from_kelvin(w[0]).unwrap())
            .unwrap()
            .as_pa();
        let p1 = saturation_pressure(Temperature::from_kelvin(w[1]).unwrap())
            .unwrap()
            .as_pa();
        pairs += 1;
        if p1 < p0 {
            backwards.push(format!("p_sat({}) = {p0} > p_sat({}) = {p1}", w[0], w[1]));
        } else if p1 == p0 {
            equal += 1;
        }
    }
    let pressures = temperature_table_pressures();
    for w in pressures.windows(2) {
        let t0 = saturation_temperature(AbsolutePressure::from_pa(w[0]).unwrap()).unwrap();
        let t1 = saturation_temperature(AbsolutePressure::from_pa(w[1]).unwrap()).unwrap();
        pairs += 1;
        if t1 < t0 {
            backwards.push(format!(
                "T_sat({}) = {t0:?} > T_sat({}) = {t1:?}",
                w[0], w[1]
            ));
        } else if t1 == t0 {
            equal += 1;
        }
    }
    println!("{pairs} neighbouring pairs through the kernel, {equal} equal in f32");
    assert!(backwards.is_empty(), "{}", backwards.join("\n"));
}

/// One f32 ulp below.
fn down(x: f32) -> f32 {
    f32::from_bits(x.to_bits() - 1)
}

#[test]
fn saturation_pressure_and_temperature_are_continuous_across_the_table_split() {
    // Either side of 623.15 K the pressure comes from a different table;
    // IF97's p_sat is one equation (Eq. 30) there, so the two must meet
    // within the kernel's stated accuracy (10 ppm) and be in order.
    let boundary_t = table::BOUNDARY_TEMPERATURE_K;
    let below = saturation_pressure(Temperature::from_kelvin(down(boundary_t)).unwrap()).unwrap();
    let at = saturation_pressure(Temperature::from_kelvin(boundary_t).unwrap()).unwrap();
    let rel = (at.as_pa() - below.as_pa()) / at.as_pa();
    assert!(
        (0.0..=1e-5).contains(&rel),
        "p_sat jumps by {rel:e} relative at 623.15 K: {below:?} then {at:?}"
    );
    let boundary_p = table::BOUNDARY_PRESSURE_PA;
    let below =
        saturation_temperature(AbsolutePressure::from_pa(down(boundary_p)).unwrap()).unwrap();
    let at = saturation_temperature(AbsolutePressure::from_pa(boundary_p).unwrap()).unwrap();
    let step = at.as_kelvin() - below.as_kelvin();
    assert!(
        (0.0..=1e-3).contains(&step),
        "T_sat jumps by {step} K at p_sat(623.15 K): {below:?} then {at:?}"
    );
}
