//! Evaluation of the generated tables: cubic polynomials on uniform
//! intervals of a transformed variable.
//!
//! Finding the interval is one subtraction, one multiplication and a
//! truncation, clamped to the table, so every look-up costs the same number
//! of instructions whatever the input: no search, no iteration. Each
//! interval holds one cubic per tabulated quantity, so one look-up serves
//! every property of the saturated state.

/// A table of `P` quantities as cubics on equal intervals of a variable x.
///
/// Interval i covers x from `start + i/inverse_step` to
/// `start + (i+1)/inverse_step`; on it, quantity q is
/// `c[0] + c[1]·t + c[2]·t² + c[3]·t³` with `c = intervals[i][q]` and t the
/// position inside the interval, 0 to 1.
#[derive(Debug)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct UniformCubicTable<const P: usize> {
    /// x at the first knot, in the table's variable.
    pub start: f32,
    /// Intervals per unit of x (the inverse of the knot spacing).
    pub inverse_step: f32,
    /// One block of `P` cubics per interval.
    pub intervals: &'static [[[f32; 4]; P]],
}

impl<const P: usize> UniformCubicTable<P> {
    /// The interval holding `x` and the position t in it.
    ///
    /// Points before the first knot use the first interval at t = 0, points
    /// past the last knot use the last interval (t slightly above 1 for the
    /// rounding slack at the end of a range). `None` only for an empty table,
    /// which the generator never writes.
    #[inline]
    pub fn locate(&self, x: f32) -> Option<(&'static [[f32; 4]; P], f32)> {
        let u = at_least((x - self.start) * self.inverse_step, 0.0);
        // `as usize` saturates (and maps NaN to 0), so this cannot misbehave.
        let i = (u as usize).min(self.intervals.len().saturating_sub(1));
        let t = u - i as f32;
        self.intervals.get(i).map(|block| (block, t))
    }
}

/// Value of one cubic at t, by Horner's rule.
#[inline]
pub fn cubic(c: &[f32; 4], t: f32) -> f32 {
    c[0] + t * (c[1] + t * (c[2] + t * c[3]))
}

/// `x`, or `floor` if x is smaller (or NaN). Written out because `f32::max`
/// becomes a library call (`fmaxf`) on Cortex-M; this is one compare.
#[inline]
pub(crate) fn at_least(x: f32, floor: f32) -> f32 {
    if x > floor {
        x
    } else {
        floor
    }
}

/// A table of `P` quantities as cubics on intervals of the f32 bit pattern
/// of the input: `2^(23 − shift)` intervals per octave (power of two) of
/// the input, so every power of two is a knot.
///
/// For a positive finite f32 `x`, `x.to_bits()` is `(exponent << 23) |
/// mantissa`, which grows monotonically with x, linearly inside each
/// octave. Its top bits `x.to_bits() >> shift` number the interval (minus
/// `first`, the number of the table's first interval) and the `shift` low
/// bits, scaled to [0, 1), are the position t in it, linear in x. This is a
/// logarithmic spacing without a logarithm: an integer shift, a subtraction,
/// a mask and one conversion, the same few instructions for every input.
/// On interval i, quantity q is `c[0] + c[1]·t + c[2]·t² + c[3]·t³` with
/// `c = intervals[i][q]`.
#[derive(Debug)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct OctaveCubicTable<const P: usize> {
    /// Low bits of the pattern that make up t (1 to 23).
    pub shift: u32,
    /// `x.to_bits() >> shift` at the table's first interval.
    pub first: u32,
    /// One block of `P` cubics per interval.
    pub intervals: &'static [[[f32; 4]; P]],
}

impl<const P: usize> OctaveCubicTable<P> {
    /// The interval holding `x` (a positive finite f32 inside the table) and
    /// the position t in it, 0 ≤ t < 1.
    ///
    /// An input outside the table (below the first interval or past the
    /// last) uses the last interval with t its position inside its own
    /// octave: harmless, but meaningless, so the caller's range check must
    /// keep inputs inside the table (the kernel's does). `None` only for an
    /// empty table, which the generator never writes.
    #[inline]
    pub fn locate(&self, x: f32) -> Option<(&'static [[f32; 4]; P], f32)> {
        let bits = x.to_bits();
        let shift = self.shift & 31;
        // Below `first` the difference wraps round to a huge index, so one
        // clamp covers both ends.
        let i = ((bits >> shift).wrapping_sub(self.first) as usize)
            .min(self.intervals.len().saturating_sub(1));
        // The low `shift` bits (< 2^23) convert to f32 exactly; the scale is
        // the power of two 2^-shift, built from its exponent field.
        let fraction = bits & ((1u32 << shift) - 1);
        let scale = f32::from_bits((127 - shift) << 23);
        let t = fraction as f32 * scale;
        self.intervals.get(i).map(|block| (block, t))
    }
}

/// A tensor-product cubic B-spline of `Q` quantities over a rectangle of
/// table coordinates: x from `x_start` in `x_intervals` equal intervals of
/// width 1/`x_inverse_step`, y from 0 to 1 in `y_intervals` equal intervals.
///
/// The coefficients are stored row by row: row r (r = 0 … x_intervals + 2)
/// holds `y_intervals + 3` entries. At local position (i + tx, j + ty) the
/// value is Σₐ Σ_b Bₐ(tx)·B_b(ty)·c[(i + a)·(y_intervals + 3) + j + b] with
/// B the four uniform cubic B-spline weights. Every look-up costs the same:
/// two truncations, eight weights and 16 multiply-adds per quantity. Inputs
/// outside the rectangle are clamped to it.
#[derive(Debug)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct BicubicSheet<const Q: usize> {
    /// x at the first knot, in the sheet's x variable.
    pub x_start: f32,
    /// Intervals per unit of x.
    pub x_inverse_step: f32,
    /// Intervals in x (at least 1).
    pub x_intervals: u32,
    /// Intervals in y over [0, 1] (at least 1).
    pub y_intervals: u32,
    /// (x_intervals + 3)·(y_intervals + 3) coefficients, row by row.
    pub coefficients: &'static [[f32; Q]],
}

/// The four uniform cubic B-spline weights at t ∈ [0, 1].
#[inline]
fn weights(t: f32) -> [f32; 4] {
    let s = 1.0 - t;
    let t2 = t * t;
    let t3 = t2 * t;
    const SIXTH: f32 = 1.0 / 6.0;
    [
        s * s * s * SIXTH,
        (3.0 * t3 - 6.0 * t2 + 4.0) * SIXTH,
        (-3.0 * t3 + 3.0 * t2 + 3.0 * t + 1.0) * SIXTH,
        t3 * SIXTH,
    ]
}

/// Interval index and position for a local coordinate u, clamped to
/// [0, n] (NaN goes to 0).
#[inline]
fn interval(u: f32, n: u32) -> (usize, f32) {
    let last = n.saturating_sub(1);
    let u = at_least(u, 0.0);
    let u = if u < n as f32 { u } else { n as f32 };
    // `as u32` saturates; the min keeps the index inside the table.
    let i = (u as u32).min(last);
    (i as usize, u - i as f32)
}

/// Four rows of four coefficients: the block of a bicubic look-up.
type Block<const Q: usize> = [&'static [[f32; Q]; 4]; 4];

impl<const Q: usize> BicubicSheet<Q> {
    /// The row length (y_intervals + 3) and the coefficients, if the sheet
    /// is well formed: at least one interval each way and exactly
    /// (x_intervals + 3)·(y_intervals + 3) coefficients. Every index the
    /// look-ups compute from interval numbers clamped to the sheet is then
    /// below that count, so their arithmetic cannot overflow and a single
    /// range check covers each block. `None` for a malformed sheet (the
    /// generator never writes one; the fields are public, so a sheet built
    /// by hand is checked here, at the cost of one multiply and compare).
    #[inline]
    fn shape(&self) -> Option<(usize, &'static [[f32; Q]])> {
        let coefficients: &'static [[f32; Q]] = self.coefficients;
        let stride = usize::try_from(self.y_intervals).ok()?.checked_add(3)?;
        let rows = usize::try_from(self.x_intervals).ok()?.checked_add(3)?;
        if stride < 4 || rows < 4 || rows.checked_mul(stride)? != coefficients.len() {
            return None;
        }
        Some((stride, coefficients))
    }

    /// The x weights and the 4 × 4 block of coefficients around (x, y),
    /// with the y position. `None` only for a malformed sheet.
    #[inline]
    fn block(&self, x: f32, y: f32) -> Option<([f32; 4], f32, Block<Q>)> {
        let (stride, coefficients) = self.shape()?;
        let (i, tx) = interval((x - self.x_start) * self.x_inverse_step, self.x_intervals);
        let (j, ty) = interval(y * self.y_intervals as f32, self.y_intervals);
        // i ≤ x_intervals − 1 and j ≤ y_intervals − 1, so the block's last
        // entry, i·stride + j + 3·stride + 3, is below (x_intervals + 3)·stride,
        // the length checked by `shape`: no wrapping happens.
        let start = i.wrapping_mul(stride).wrapping_add(j);
        let (s2, s3) = (stride.wrapping_add(stride), stride.wrapping_mul(3));
        // Rows i … i + 3 from column j: one slice (one range check), cut
        // into four rows of four.
        let block = coefficients.get(start..start.wrapping_add(s3).wrapping_add(4))?;
        let row = |o: usize| block.get(o..).and_then(|r| r.first_chunk::<4>());
        Some((weights(tx), ty, [row(0)?, row(stride)?, row(s2)?, row(s3)?]))
    }

    /// Every quantity at (x, y). `None` only for a malformed sheet (no
    /// interval in x or y, or not exactly (x_intervals + 3)·(y_intervals + 3)
    /// coefficients), which the generator never writes.
    #[inline]
    pub fn evaluate(&self, x: f32, y: f32) -> Option<[f32; Q]> {
        let (wx, ty, rows) = self.block(x, y)?;
        let wy = weights(ty);
        let mut out = [0.0f32; Q];
        for (a, (row, wa)) in rows.iter().zip(wx.iter()).enumerate() {
            for (q, o) in out.iter_mut().enumerate() {
                let r =
                    wy[0] * row[0][q] + wy[1] * row[1][q] + wy[2] * row[2][q] + wy[3] * row[3][q];
                *o = if a == 0 { wa * r } else { *o + wa * r };
            }
        }
        Some(out)
    }

    /// One quantity at (x, y) (the same arithmetic as [`Self::evaluate`]
    /// for that quantity). `None` for a malformed sheet or `q ≥ Q`.
    #[inline]
    pub fn evaluate_one(&self, x: f32, y: f32, q: usize) -> Option<f32> {
        if q >= Q {
            return None;
        }
        let (wx, ty, rows) = self.block(x, y)?;
        let wy = weights(ty);
        let mut out = 0.0f32;
        for (a, (row, wa)) in rows.iter().zip(wx.iter()).enumerate() {
            let r = wy[0] * row[0].get(q)?
                + wy[1] * row[1].get(q)?
                + wy[2] * row[2].get(q)?
                + wy[3] * row[3].get(q)?;
            out = if a == 0 { wa * r } else { out + wa * r };
        }
        Some(out)
    }

    /// One quantity at both y edges, (value at y = 0, value at y = 1), with
    /// the x weights computed once: the same values as
    /// [`Self::evaluate_one`] at y = 0 and y = 1 up to rounding (the y
    /// weights there are the constants 1/6, 4/6, 1/6). `None` for a
    /// malformed sheet or `q ≥ Q`.
    #[inline]
    pub(crate) fn evaluate_edges(&self, x: f32, q: usize) -> Option<(f32, f32)> {
        if q >= Q {
            return None;
        }
        const SIXTH: f32 = 1.0 / 6.0;
        const FOUR_SIXTHS: f32 = 4.0 / 6.0;
        let (stride, coefficients) = self.shape()?;
        let (i, tx) = interval((x - self.x_start) * self.x_inverse_step, self.x_intervals);
        let wx = weights(tx);
        // Rows i … i + 3 whole: (i + 4)·stride ≤ (x_intervals + 3)·stride,
        // the length `shape` checked, so nothing wraps.
        let start = i.wrapping_mul(stride);
        let block = coefficients.get(start..start.wrapping_add(stride.wrapping_mul(4)))?;
        // The four rows; in each, the first interval's block starts at
        // column 0 and the last one's at y_intervals − 1, its non-zero
        // weights on the row's last three columns.
        let (r0, rest) = block.split_at_checked(stride)?;
        let (r1, rest) = rest.split_at_checked(stride)?;
        let (r2, r3) = rest.split_at_checked(stride)?;
        let (mut low, mut high) = (0.0f32, 0.0f32);
        for (a, (row, wa)) in [r0, r1, r2, r3].into_iter().zip(wx.iter()).enumerate() {
            let first = row.first_chunk::<3>()?;
            let last = row.last_chunk::<3>()?;
            let r0 = SIXTH * *first[0].get(q)?
                + FOUR_SIXTHS * *first[1].get(q)?
                + SIXTH * *first[2].get(q)?;
            let r1 = SIXTH * *last[0].get(q)?
                + FOUR_SIXTHS * *last[1].get(q)?
                + SIXTH * *last[2].get(q)?;
            if a == 0 {
                low = wa * r0;
                high = wa * r1;
            } else {
                low += wa * r0;
                high += wa * r1;
            }
        }
        Some((low, high))
    }
}

/// One single-phase sheet of the generated tables: the properties over
/// (x, y) and the inverse sheets giving y from (x, ψ) for an enthalpy or
/// entropy fraction, with the constants of the sheet's temperature stretch
/// (see [`crate::single_phase`] for the coordinates).
#[derive(Debug)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct SinglePhaseSheet {
    /// ρ (or ρ/p), h, s, 1/cp, w, ln μ over (x, y).
    pub properties: BicubicSheet<6>,
    /// y over (x, ψ_h).
    pub y_of_enthalpy: BicubicSheet<1>,
    /// y over (x, ψ_s).
    pub y_of_entropy: BicubicSheet<1>,
    /// δ_base of the stretch, K.
    pub cluster_base_k: f32,
    /// δ_slope of the stretch, K/Pa.
    pub cluster_slope_k_pa: f32,
    /// p_ref of the stretch, Pa.
    pub cluster_reference_pa: f32,
    /// Whether the density column holds ρ/p (kg/(m³·Pa)) instead of ρ.
    pub density_over_pressure: bool,
}
