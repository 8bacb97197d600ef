//! The saturation-temperature tables indexed on the f32 bit pattern
//! (`OctaveCubicTable`): every knot is where the bit pattern says, the
//! tables pass through the IAPWS-IF97 Region 4 equation at their knots (they
//! are Hermite interpolants of it), and the slope in p is continuous across
//! knots, octave boundaries included.

use vapora_kernel::spline::{cubic, OctaveCubicTable};
use vapora_kernel::tables::saturation as table;
use vapora_tables::if97::region4;

fn knot(t: &OctaveCubicTable<1>, i: usize) -> f32 {
    f32::from_bits((t.first + i as u32) << t.shift)
}

/// Interval i at its own knot has t = 0, and the last f32 below the next
/// knot is still in interval i with t just below 1.
fn locate_finds_every_knot(t: &OctaveCubicTable<1>) -> Vec<String> {
    let mut bad = Vec::new();
    for i in 0..t.intervals.len() {
        let x = knot(t, i);
        match t.locate(x) {
            Some((block, u)) if core::ptr::eq(block, &t.intervals[i]) && u == 0.0 => {}
            _ => bad.push(format!("knot {i} at {x}: wrong interval or t != 0")),
        }
        let before_next = f32::from_bits(knot(t, i + 1).to_bits() - 1);
        match t.locate(before_next) {
            Some((block, u)) if core::ptr::eq(block, &t.intervals[i]) && u < 1.0 && u > 0.99 => {}
            _ => bad.push(format!(
                "end of interval {i} at {before_next}: wrong interval or t"
            )),
        }
    }
    bad
}

#[test]
fn locate_finds_every_knot_of_both_temperature_tables() {
    let mut bad = locate_finds_every_knot(&table::TEMPERATURE_LOW);
    bad.extend(locate_finds_every_knot(&table::TEMPERATURE_HIGH));
    assert!(bad.is_empty(), "{}", bad.join("\n"));
}

/// Slope dy/dx of interval i at t = 0 and t = 1 (x the table's input).
fn slopes(t: &OctaveCubicTable<1>, i: usize) -> (f64, f64) {
    let c = t.intervals[i][0].map(f64::from);
    let dx = f64::from(knot(t, i + 1)) - f64::from(knot(t, i));
    (c[1] / dx, (c[1] + 2.0 * c[2] + 3.0 * c[3]) / dx)
}

#[test]
fn slope_in_p_is_continuous_at_every_knot() {
    let mut bad = Vec::new();
    for (name, t) in [
        ("TEMPERATURE_LOW", &table::TEMPERATURE_LOW),
        ("TEMPERATURE_HIGH", &table::TEMPERATURE_HIGH),
    ] {
        for i in 1..t.intervals.len() {
            let (_, left) = slopes(t, i - 1);
            let (right, _) = slopes(t, i);
            // f32 coefficients: c1 to about 1e-7 relative, c1 + 2c2 + 3c3
            // loses a little more to cancellation; 1e-4 relative is far
            // below the factor-of-two jump in dt/dp at an octave boundary
            // that a fit ignoring it would show.
            if ((left - right) / right).abs() > 1e-4 {
                bad.push(format!("{name} knot {i}: slope {left:e} vs {right:e}"));
            }
        }
    }
    assert!(bad.is_empty(), "{}", bad.join("\n"));
}

#[test]
fn temperature_tables_match_region_4_at_their_knots() {
    // Low table: T(p) at knots inside the kernel's pressure range; the
    // reference is IAPWS R7-97(2012) Eq. 31 (the formulation crate).
    let low = &table::TEMPERATURE_LOW;
    let mut worst: f64 = 0.0;
    for i in 0..low.intervals.len() {
        let p = knot(low, i);
        if !(table::PRESSURE_MIN_PA..table::BOUNDARY_PRESSURE_PA).contains(&p) {
            continue;
        }
        let reference = region4::saturation_temperature_k_unchecked(f64::from(p));
        let kernel = cubic(&low.intervals[i][0], 0.0);
        worst = worst.max((f64::from(kernel) - reference).abs());
    }
    // f32 storage of T ≈ 600 K: half an ulp is 3e-5 K.
    assert!(
        worst < 3.1e-5,
        "low table off Eq. 31 by {worst} K at a knot"
    );
    // High table: τ = √(Tc − T) at q = pc − p.
    let high = &table::TEMPERATURE_HIGH;
    let tc = f64::from(table::CRITICAL_TEMPERATURE_K);
    let pc = f64::from(table::CRITICAL_PRESSURE_PA);
    let mut worst: f64 = 0.0;
    for i in 0..high.intervals.len() {
        let q = f64::from(knot(high, i));
        let t_ref = region4::saturation_temperature_k_unchecked(pc - q);
        let kernel_tau = f64::from(cubic(&high.intervals[i][0], 0.0));
        let kernel_t = tc - kernel_tau * kernel_tau;
        worst = worst.max((kernel_t - t_ref).abs());
    }
    assert!(worst < 1e-5, "high table off Eq. 31 by {worst} K at a knot");
}
