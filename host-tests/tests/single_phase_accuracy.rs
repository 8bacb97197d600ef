//! The kernel's single-phase calls against the f64 formulation (IAPWS-IF97,
//! viscosity IAPWS R12-08 as in vapora-tables) on a dense grid over the
//! envelope, including every grid pressure at 0.01 K, 0.1 K and 1 K from
//! saturation on either side, plus seeded random points: prints the maxima
//! per zone and fails above the bounds of `vapora_host_tests::single_phase`
//! (issue 5's bounds beyond 15 K / 3 MPa of the critical point and in the
//! ring; the measured looser bounds of the committed tables in the box).

use rand::{Rng, SeedableRng};
use rand_chacha::ChaCha8Rng;
use vapora_host_tests::single_phase::{
    exceeding, grid, measure, zone, Zone, REQUIRED_FAR, STATED_BOX, STATED_RING,
};

#[test]
fn single_phase_dense_grid_within_the_bounds() {
    let mut points = grid(120, 400);
    let mut rng = ChaCha8Rng::seed_from_u64(5);
    for _ in 0..20_000 {
        let p = 611.657 * (25.0e6f64 / 611.657).powf(rng.random::<f64>());
        let t = 273.16 + (1073.15 - 273.16) * rng.random::<f64>();
        points.push((f64::from(p as f32), f64::from(t as f32)));
    }
    let m = measure(&points);
    let mut failures = Vec::new();
    for ((name, z), bound) in ["far (beyond 15 K / 3 MPa)", "ring", "box (5 K / 1 MPa)"]
        .iter()
        .zip(&m)
        .zip([&REQUIRED_FAR, &STATED_RING, &STATED_BOX])
    {
        println!("{name}: {} points", z.points);
        for (field, v) in z.fields() {
            println!("  {field:30} {v:.3e}");
        }
        for e in exceeding(z, bound) {
            failures.push(format!("{name}: {e}"));
        }
    }
    assert!(m[0].points > 50_000 && m[1].points > 100 && m[2].points > 20);
    assert!(failures.is_empty(), "{failures:#?}");
}

#[test]
fn the_grid_reaches_a_hundredth_of_a_kelvin_from_saturation_on_both_sides() {
    let points = grid(20, 10);
    let near: Vec<_> = points
        .iter()
        .filter(|&&(p, t)| {
            p < 20.0e6
                && (t - vapora_tables::if97::region4::saturation_temperature_k_unchecked(p)).abs()
                    < 0.011
        })
        .collect();
    assert!(near.len() >= 30, "{}", near.len());
    assert_eq!(zone(1.0e5, 373.0), Zone::Far);
}
