//! The kernel's saturated state at a pressure against the f64 formulation
//! computing the same state (`saturation::at_pressure`), on the host.
//!
//! Run with `cargo bench -p vapora-host-tests --bench saturated_state`. It
//! prints criterion's timings and then the ratio formulation / kernel of the
//! time per call over the same pressures (all of them, and those above
//! p_sat(623.15 K) where the formulation iterates in Region 3). This is a measurement, not a
//! test: nothing fails on the figures. Issue 3 expects well over 50×.

use std::hint::black_box;
use std::time::{Duration, Instant};

use criterion::{criterion_group, criterion_main, Criterion};
use vapora_kernel::saturation::saturated_state_at_pressure;
use vapora_kernel::tables::saturation as table;
use vapora_kernel::units::AbsolutePressure;
use vapora_tables::if97::saturation;

/// Pressures spread evenly in ln p over the kernel's range, so both the
/// table segments and (below 623.15 K) the formulation's Region 1/2 route
/// and (above, with full tables) its Region 3 route are exercised in the
/// proportion a log-spaced plant survey would give.
fn pressures_pa() -> Vec<f32> {
    let (lo, hi) = (
        f64::from(table::PRESSURE_MIN_PA).ln(),
        f64::from(table::PRESSURE_MAX_PA).ln(),
    );
    let n = 64;
    (0..n)
        .map(|k| (lo + (hi - lo) * (k as f64 + 0.5) / n as f64).exp() as f32)
        .collect()
}

fn kernel_states(ps: &[AbsolutePressure]) -> f32 {
    let mut sum = 0.0;
    for &p in ps {
        if let Ok(s) = saturated_state_at_pressure(black_box(p)) {
            sum += s.vapour.enthalpy_j_kg + s.liquid.density_kg_m3;
        }
    }
    sum
}

fn formulation_states(ps: &[f64]) -> f64 {
    let mut sum = 0.0;
    for &p in ps {
        if let Ok(s) = saturation::at_pressure(black_box(p)) {
            sum += s.vapour.enthalpy_j_kg + s.liquid.density_kg_m3;
        }
    }
    sum
}

/// Time per call of `f` (which makes `calls` calls) over one batch of
/// about 100 ms.
fn ns_per_call(calls: usize, f: &mut impl FnMut() -> f64) -> f64 {
    let start = Instant::now();
    let mut reps = 0u32;
    while start.elapsed() < Duration::from_millis(100) {
        black_box(f());
        reps += 1;
    }
    start.elapsed().as_nanos() as f64 / (f64::from(reps) * calls as f64)
}

/// The smallest time per call of `a` and of `b` over interleaved batches:
/// on a shared machine the minimum is the figure least disturbed by other
/// work, and interleaving exposes both to the same conditions. The ratio
/// line is printed from these, so it does not depend on criterion's output
/// format.
fn fastest_ns_per_call(
    calls: usize,
    mut a: impl FnMut() -> f64,
    mut b: impl FnMut() -> f64,
) -> (f64, f64) {
    let (mut best_a, mut best_b) = (f64::INFINITY, f64::INFINITY);
    for _ in 0..10 {
        best_a = best_a.min(ns_per_call(calls, &mut a));
        best_b = best_b.min(ns_per_call(calls, &mut b));
    }
    (best_a, best_b)
}

fn bench(c: &mut Criterion) {
    let raw = pressures_pa();
    let kernel_inputs: Vec<AbsolutePressure> = raw
        .iter()
        .filter_map(|&p| AbsolutePressure::from_pa(p).ok())
        .collect();
    // The formulation gets the same pressures, exactly widened to f64.
    let formulation_inputs: Vec<f64> = raw.iter().map(|&p| f64::from(p)).collect();
    let calls = raw.len();

    let mut group = c.benchmark_group("saturated_state_at_pressure_64_points");
    group.bench_function("kernel_f32_tables", |b| {
        b.iter(|| kernel_states(&kernel_inputs))
    });
    group.bench_function("formulation_f64", |b| {
        b.iter(|| formulation_states(&formulation_inputs))
    });
    group.finish();

    let (kernel_ns, formulation_ns) = fastest_ns_per_call(
        calls,
        || f64::from(kernel_states(&kernel_inputs)),
        || formulation_states(&formulation_inputs),
    );
    println!(
        "saturated state at p, fastest of 10 interleaved batches, per call over {calls} \
         pressures {:.0} Pa to {:.0} Pa: kernel {kernel_ns:.1} ns, formulation \
         {formulation_ns:.1} ns, ratio formulation/kernel = {:.0}x",
        table::PRESSURE_MIN_PA,
        table::PRESSURE_MAX_PA,
        formulation_ns / kernel_ns
    );

    // The same above p_sat(623.15 K), where the formulation takes its
    // Region 3 route (spinodals and two density roots by iteration).
    let high: Vec<f32> = raw
        .iter()
        .copied()
        .filter(|&p| p > table::BOUNDARY_PRESSURE_PA)
        .collect();
    let high_kernel: Vec<AbsolutePressure> = high
        .iter()
        .filter_map(|&p| AbsolutePressure::from_pa(p).ok())
        .collect();
    let high_formulation: Vec<f64> = high.iter().map(|&p| f64::from(p)).collect();
    if !high.is_empty() {
        let (kernel_ns, formulation_ns) = fastest_ns_per_call(
            high.len(),
            || f64::from(kernel_states(&high_kernel)),
            || formulation_states(&high_formulation),
        );
        println!(
            "of these, the {} pressures above {:.0} Pa (Region 3 in the formulation): \
             kernel {kernel_ns:.1} ns, formulation {formulation_ns:.1} ns, \
             ratio formulation/kernel = {:.0}x",
            high.len(),
            table::BOUNDARY_PRESSURE_PA,
            formulation_ns / kernel_ns
        );
    }
}

criterion_group!(benches, bench);
criterion_main!(benches);
