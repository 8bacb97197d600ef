//! `BicubicSheet` with hand-built (not generated) coefficients: a sheet of
//! the wrong shape gives `None` from every look-up, never a panic or a read
//! of the wrong entries, whatever its dimensions claim; a well-formed one
//! gives the tensor-product B-spline sum written out here term by term in
//! f64 (the definition in the type's docs, not the kernel's code).

use vapora_kernel::spline::BicubicSheet;

/// Coefficients c(r, k) = r + k/100 + q/10000 for quantity q, so every
/// entry is distinct and a wrong row or column shows.
fn entries(rows: usize, stride: usize) -> &'static [[f32; 2]] {
    let v: Vec<[f32; 2]> = (0..rows * stride)
        .map(|n| {
            let (r, k) = ((n / stride) as f32, (n % stride) as f32);
            [r + k / 100.0, r + k / 100.0 + 1e-4]
        })
        .collect();
    Vec::leak(v)
}

fn sheet(x_intervals: u32, y_intervals: u32, coefficients: &'static [[f32; 2]]) -> BicubicSheet<2> {
    BicubicSheet {
        x_start: 0.0,
        x_inverse_step: 1.0,
        x_intervals,
        y_intervals,
        coefficients,
    }
}

/// Uniform cubic B-spline weights in f64: the four pieces of the cardinal
/// cubic B-spline at position t in an interval.
fn b(t: f64) -> [f64; 4] {
    [
        (1.0 - t).powi(3) / 6.0,
        (3.0 * t.powi(3) - 6.0 * t * t + 4.0) / 6.0,
        (-3.0 * t.powi(3) + 3.0 * t * t + 3.0 * t + 1.0) / 6.0,
        t.powi(3) / 6.0,
    ]
}

#[test]
fn wrong_shapes_give_none() {
    let good = entries(7, 6); // 4 × 3 intervals
    let cases: [(&str, BicubicSheet<2>); 7] = [
        ("one coefficient short", sheet(4, 3, &good[..41])),
        ("one coefficient too many", sheet(4, 3, entries(43, 1))),
        ("no x interval", sheet(0, 3, entries(3, 6))),
        ("no y interval", sheet(4, 0, entries(7, 3))),
        ("empty", sheet(4, 3, &[])),
        (
            "dimensions near u32::MAX",
            sheet(u32::MAX, u32::MAX - 2, good),
        ),
        (
            "product wrapping to the length",
            sheet(u32::MAX - 2, 3, good),
        ),
    ];
    for (what, s) in &cases {
        for &(x, y) in &[(0.0, 0.0), (2.5, 0.5), (1e9, 1e9), (f32::NAN, -1.0)] {
            assert_eq!(s.evaluate(x, y), None, "{what}: evaluate({x}, {y})");
            assert_eq!(
                s.evaluate_one(x, y, 0),
                None,
                "{what}: evaluate_one({x}, {y})"
            );
        }
    }
    // The same dimensions with the right count work.
    assert!(sheet(4, 3, good).evaluate(2.5, 0.5).is_some());
}

#[test]
fn well_formed_sheet_is_the_tensor_sum() {
    let (nx, ny) = (4u32, 3u32);
    let stride = ny as usize + 3;
    let c = entries(nx as usize + 3, stride);
    let s = sheet(nx, ny, c);
    let mut worst = 0.0f64;
    for xi in 0..=40 {
        for yi in 0..=30 {
            let (x, y) = (xi as f32 * 0.1, yi as f32 / 30.0);
            let got = s.evaluate(x, y).expect("well formed");
            // Interval and position, clamped as the type's docs say.
            let u = f64::from(x).min(f64::from(nx));
            let i = (u.floor() as usize).min(nx as usize - 1);
            let v = (f64::from(y) * f64::from(ny)).min(f64::from(ny));
            let j = (v.floor() as usize).min(ny as usize - 1);
            let (wx, wy) = (b(u - i as f64), b(v - j as f64));
            for q in 0..2 {
                let mut want = 0.0;
                for a in 0..4 {
                    for bb in 0..4 {
                        want += wx[a] * wy[bb] * f64::from(c[(i + a) * stride + j + bb][q]);
                    }
                }
                let one = s.evaluate_one(x, y, q).expect("well formed");
                assert_eq!(
                    one.to_bits(),
                    got[q].to_bits(),
                    "evaluate_one = evaluate at ({x}, {y})"
                );
                worst = worst.max((f64::from(got[q]) - want).abs());
            }
        }
    }
    // Values up to ~7; f32 sums of 16 terms stay within a few ulp.
    assert!(
        worst < 5e-6,
        "largest difference from the f64 sum {worst:e}"
    );
}
