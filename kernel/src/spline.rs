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
