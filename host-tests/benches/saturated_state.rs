//! The kernel's saturated state at a pressure against the f64 formulation
//! computing the same state (`saturation::at_pressure`), on the host.
//!
//! Run with `cargo bench -p vapora-host-tests --bench saturated_state`. It
//! prints criterion's timings and then the ratio formulation / kernel of the
//! mean time per call over the same pressures. This is a measurement, not a
//! test: nothing fails on the figures. Issue 3 expects well over 50×.

use std::hint::black_box;
use std::time::Duration;

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

/// Mean time per call of `f` over `calls` calls, measured directly (the
/// ratio line is printed from these so it does not depend on criterion's
/// output format).
fn mean_ns_per_call(calls: usize, mut f: impl FnMut() -> f64) -> f64 {
    // Warm up, then time enough repetitions for ~0.5 s.
    black_box(f());
    let start = std::time::Instant::now();
    let mut reps = 0u32;
    while start.elapsed() < Duration::from_millis(500) {
        black_box(f());
        reps += 1;
    }
    start.elapsed().as_nanos() as f64 / (f64::from(reps) * calls as f64)
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

    let kernel_ns = mean_ns_per_call(calls, || f64::from(kernel_states(&kernel_inputs)));
    let formulation_ns = mean_ns_per_call(calls, || formulation_states(&formulation_inputs));
    println!(
        "saturated state at p, mean per call over {calls} pressures \
         {:.0} Pa to {:.0} Pa: kernel {kernel_ns:.1} ns, formulation {formulation_ns:.1} ns, \
         ratio formulation/kernel = {:.0}x",
        table::PRESSURE_MIN_PA,
        table::PRESSURE_MAX_PA,
        formulation_ns / kernel_ns
    );
}

criterion_group!(benches, bench);
criterion_main!(benches);
