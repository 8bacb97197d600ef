//! The kernel's saturation functions against the f64 formulation on a grid
//! 100 times finer than every table's knots plus 100 000 seeded random
//! temperatures and pressures: the accuracy table of issue 3, and the
//! kernel's own published bounds.

use vapora_host_tests::accuracy::{
    exceeding, measure_kernel, published, Deviations, Grid, REQUIRED_BELOW_NEAR_CRITICAL,
    REQUIRED_NEAR_CRITICAL,
};
use vapora_kernel::accuracy::{ACCURACY_BELOW_NEAR_CRITICAL, ACCURACY_NEAR_CRITICAL};

fn report(label: &str, d: &Deviations, points: usize) {
    println!("{label} ({points} points):");
    for (name, value) in d.fields() {
        println!("  {name:26} {value:.3e}");
    }
}

#[test]
fn kernel_meets_the_accuracy_table_and_its_published_bounds() {
    let (at_t, at_p) = measure_kernel(&Grid::default());
    let mut failures = Vec::new();
    for (path, z) in [("from temperature", &at_t), ("from pressure", &at_p)] {
        report(
            &format!("{path}, below Tc - 1 K"),
            &z.below_near_critical,
            z.points[0],
        );
        report(
            &format!("{path}, Tc - 1 K to Tc - 0.01 K"),
            &z.near_critical,
            z.points[1],
        );
        assert!(
            z.points[0] > 10_000,
            "{path}: too few points below Tc - 1 K: {}",
            z.points[0]
        );
        for (zone, measured, required, bound) in [
            (
                "below Tc - 1 K",
                &z.below_near_critical,
                &REQUIRED_BELOW_NEAR_CRITICAL,
                &ACCURACY_BELOW_NEAR_CRITICAL,
            ),
            (
                "Tc - 1 K to Tc - 0.01 K",
                &z.near_critical,
                &REQUIRED_NEAR_CRITICAL,
                &ACCURACY_NEAR_CRITICAL,
            ),
        ] {
            for (name, m, b) in exceeding(measured, required) {
                failures.push(format!(
                    "{path}, {zone}: {name} = {m:.3e} exceeds the required {b:.3e}"
                ));
            }
            for (name, m, b) in exceeding(measured, &published(bound)) {
                failures.push(format!(
                    "{path}, {zone}: {name} = {m:.3e} exceeds the published bound {b:.3e}"
                ));
            }
        }
    }
    assert!(failures.is_empty(), "{}", failures.join("\n"));
}
