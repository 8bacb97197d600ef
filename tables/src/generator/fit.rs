//! Least-squares cubic splines on uniform knots, and their f32 form.
//!
//! Why least squares and not interpolation: the near-critical segment is
//! indexed on τ = √(Tc − T) from τ = 0, but the formulation is only trusted
//! down to Tc − 0.01 K (τ ≈ 0.1); a least-squares fit needs no value at the
//! knots themselves, so the first interval is fitted to the data it has and
//! extended smoothly to τ = 0. The result is a C² cubic spline (uniform cubic
//! B-splines), converted to one power-form cubic per interval in the local
//! variable t ∈ [0, 1], which is what the kernel evaluates by Horner's rule.

use std::vec::Vec;

/// Why a fit could not be made.
#[derive(Debug, Clone, PartialEq)]
#[non_exhaustive]
pub enum FitError {
    /// The interval count was zero or the range empty or not finite.
    BadRange,
    /// Fewer samples than unknowns, or a sample was not finite.
    BadSamples,
    /// The normal equations were not positive definite (no data in some part
    /// of the range).
    Singular,
}

impl core::fmt::Display for FitError {
    fn fmt(&self, f: &mut core::fmt::Formatter<'_>) -> core::fmt::Result {
        match self {
            Self::BadRange => write!(f, "empty or non-finite range, or zero intervals"),
            Self::BadSamples => write!(f, "too few samples, or a sample is not finite"),
            Self::Singular => write!(f, "normal equations singular: no data in part of the range"),
        }
    }
}

impl std::error::Error for FitError {}

/// The knots of a uniform table as the kernel sees them: the start and the
/// inverse step are stored as f32, so the fit uses exactly those rounded
/// values to place its knots.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct UniformKnots {
    /// Transformed variable at the first knot, as stored (f32).
    pub start: f32,
    /// Intervals per unit of the transformed variable, as stored (f32).
    pub inverse_step: f32,
    /// Number of intervals.
    pub intervals: usize,
}

impl UniformKnots {
    /// Knots covering `[start, end]` with `intervals` equal intervals, with
    /// the f32 rounding the kernel will see. The last knot may lie a few f32
    /// ulps from `end`; the kernel clamps the interval index, so points up to
    /// `end` use the last interval.
    pub fn covering(start: f64, end: f64, intervals: usize) -> Result<Self, FitError> {
        if intervals == 0 || !start.is_finite() || !end.is_finite() || end <= start {
            return Err(FitError::BadRange);
        }
        Ok(Self {
            start: start as f32,
            inverse_step: (intervals as f64 / (end - start)) as f32,
            intervals,
        })
    }

    /// Local coordinate u = (x − start)·inverse_step in f64 (interval index
    /// plus fraction), with the stored f32 parameters.
    pub fn local(&self, x: f64) -> f64 {
        (x - f64::from(self.start)) * f64::from(self.inverse_step)
    }

    /// Position of knot `k` in the transformed variable.
    pub fn knot(&self, k: usize) -> f64 {
        f64::from(self.start) + k as f64 / f64::from(self.inverse_step)
    }

    /// Interval index and local t for `u`, clamped as the kernel clamps it.
    pub fn split(&self, u: f64) -> (usize, f64) {
        let u = u.max(0.0);
        let i = (u as usize).min(self.intervals - 1);
        (i, u - i as f64)
    }
}

/// Values of the four uniform cubic B-splines that are non-zero on an
/// interval, at local t.
fn basis(t: f64) -> [f64; 4] {
    let s = 1.0 - t;
    [
        s * s * s / 6.0,
        (3.0 * t * t * t - 6.0 * t * t + 4.0) / 6.0,
        (-3.0 * t * t * t + 3.0 * t * t + 3.0 * t + 1.0) / 6.0,
        t * t * t / 6.0,
    ]
}

/// Least-squares cubic spline through `(x, y)` samples on `knots`.
/// Returns one power-form cubic `[a0, a1, a2, a3]` per interval, value
/// `a0 + a1 t + a2 t² + a3 t³` in the local variable t of that interval.
///
/// # Errors
/// [`FitError::BadSamples`] for non-finite samples or fewer samples than
/// unknowns, [`FitError::Singular`] when some B-spline has no data.
pub fn fit_cubic(knots: &UniformKnots, xs: &[f64], ys: &[f64]) -> Result<Vec<[f64; 4]>, FitError> {
    let n = knots.intervals;
    let unknowns = n + 3;
    if xs.len() != ys.len() || xs.len() < unknowns {
        return Err(FitError::BadSamples);
    }
    if xs.iter().chain(ys).any(|v| !v.is_finite()) {
        return Err(FitError::BadSamples);
    }
    // Normal equations, dense (a few hundred unknowns at most).
    let mut a = vec![0.0f64; unknowns * unknowns];
    let mut b = vec![0.0f64; unknowns];
    for (&x, &y) in xs.iter().zip(ys) {
        let (i, t) = knots.split(knots.local(x));
        let w = basis(t);
        for r in 0..4 {
            b[i + r] += w[r] * y;
            for c in 0..4 {
                a[(i + r) * unknowns + i + c] += w[r] * w[c];
            }
        }
    }
    // A whisper of smoothing on the fourth differences of the coefficients
    // (proportional to the jumps of the third derivative at the knots): zero
    // for any single cubic, so it biases nothing a cubic spline can
    // represent, changes intervals with data by ~1e-9 relative, and
    // continues the neighbouring cubic into an interval without data (the
    // start of the near-critical table).
    let scale = (0..unknowns).map(|j| a[j * unknowns + j]).sum::<f64>() / unknowns as f64;
    let lambda = 1e-9 * scale;
    const FOURTH_DIFFERENCE: [f64; 5] = [1.0, -4.0, 6.0, -4.0, 1.0];
    for j in 0..unknowns.saturating_sub(4) {
        for (r, dr) in FOURTH_DIFFERENCE.iter().enumerate() {
            for (c, dc) in FOURTH_DIFFERENCE.iter().enumerate() {
                a[(j + r) * unknowns + j + c] += lambda * dr * dc;
            }
        }
    }
    let c = solve_symmetric_positive(&mut a, &mut b, unknowns)?;
    Ok((0..n)
        .map(|i| {
            let (c0, c1, c2, c3) = (c[i], c[i + 1], c[i + 2], c[i + 3]);
            [
                (c0 + 4.0 * c1 + c2) / 6.0,
                (c2 - c0) / 2.0,
                (c0 - 2.0 * c1 + c2) / 2.0,
                (-c0 + 3.0 * c1 - 3.0 * c2 + c3) / 6.0,
            ]
        })
        .collect())
}

/// Cholesky solution of `a x = b` (row-major `n × n`); `a` and `b` are
/// overwritten.
fn solve_symmetric_positive(a: &mut [f64], b: &mut [f64], n: usize) -> Result<Vec<f64>, FitError> {
    cholesky_factor(a, n)?;
    cholesky_solve(a, n, b);
    Ok(b.to_vec())
}

/// Cholesky factorisation in place: the lower triangle of the row-major
/// `n × n` symmetric matrix `a` becomes L with a = L·Lᵀ (the upper triangle
/// is left as it was).
///
/// # Errors
/// [`FitError::Singular`] if `a` is not positive definite (or not finite).
pub(crate) fn cholesky_factor(a: &mut [f64], n: usize) -> Result<(), FitError> {
    for j in 0..n {
        let mut d = a[j * n + j];
        for k in 0..j {
            d -= a[j * n + k] * a[j * n + k];
        }
        if d <= 0.0 || !d.is_finite() {
            return Err(FitError::Singular);
        }
        let d = d.sqrt();
        a[j * n + j] = d;
        for i in j + 1..n {
            let mut s = a[i * n + j];
            for k in 0..j {
                s -= a[i * n + k] * a[j * n + k];
            }
            a[i * n + j] = s / d;
        }
    }
    Ok(())
}

/// Solves L·Lᵀ x = b in place, L the lower triangle that
/// [`cholesky_factor`] left in the row-major `n × n` `l`.
pub(crate) fn cholesky_solve(l: &[f64], n: usize, b: &mut [f64]) {
    for i in 0..n {
        let mut s = b[i];
        for k in 0..i {
            s -= l[i * n + k] * b[k];
        }
        b[i] = s / l[i * n + i];
    }
    for i in (0..n).rev() {
        let mut s = b[i];
        for k in i + 1..n {
            s -= l[k * n + i] * b[k];
        }
        b[i] = s / l[i * n + i];
    }
}

/// Rounds power-form coefficients to the f32 the kernel stores.
pub fn to_f32(coefficients: &[[f64; 4]]) -> Vec<[f32; 4]> {
    coefficients
        .iter()
        .map(|c| [c[0] as f32, c[1] as f32, c[2] as f32, c[3] as f32])
        .collect()
}

/// Evaluates a stored table at `x` exactly as the kernel does: f32 local
/// coordinate, clamped index, Horner's rule in f32. This is the reference
/// evaluation of the table format the generator emits.
pub fn evaluate_f32(knots: &UniformKnots, coefficients: &[[f32; 4]], x: f32) -> f32 {
    let u = ((x - knots.start) * knots.inverse_step).max(0.0);
    let i = (u as usize).min(coefficients.len().saturating_sub(1));
    let t = u - i as f32;
    match coefficients.get(i) {
        Some(c) => c[0] + t * (c[1] + t * (c[2] + t * c[3])),
        None => f32::NAN,
    }
}

/// Sample positions for fitting an interval-based spline: `per_interval`
/// points strictly inside each interval, plus every knot, restricted to
/// `[data_lo, data_hi]` (the part of the range where the source is trusted).
pub fn sample_positions(
    knots: &UniformKnots,
    per_interval: usize,
    data_lo: f64,
    data_hi: f64,
) -> Vec<f64> {
    let mut xs = Vec::new();
    for i in 0..knots.intervals {
        let a = knots.knot(i);
        let b = knots.knot(i + 1);
        xs.push(a);
        for j in 0..per_interval {
            xs.push(a + (b - a) * (j as f64 + 0.5) / per_interval as f64);
        }
    }
    xs.push(knots.knot(knots.intervals));
    xs.retain(|&x| x >= data_lo && x <= data_hi);
    xs
}
