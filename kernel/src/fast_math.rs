//! Short f32 forms of ln, ln(1 + z), exp, exp(z) − 1, √ and asinh for the
//! single-phase coordinates, each a fixed straight-line sequence (integer
//! operations on the bit pattern, one short polynomial), so every call
//! costs the same few instructions whatever the input.
//!
//! They compute the same functions as `libm` (not approximations of the
//! coordinates: the generator's f64 definitions stay as they are) to within
//! a few units in the last place of f32 over the ranges the kernel uses:
//! positive finite arguments for the logarithms and the root, |z| < 87 for
//! the exponentials. They are faster than `libm` because they drop what the
//! kernel never needs: special cases for subnormals, infinities and
//! negative inputs (those give a finite but meaningless value, never a
//! panic, and the callers' range checks keep them out), and the last half
//! ulp of rounding.
//!
//! Methods (standard ones): the logarithm splits x = 2^k·m with
//! m ∈ [√½, √2) by integer arithmetic on the bit pattern and sums
//! k·ln 2 (in two parts) and ln m = 2·atanh(s), s = (m − 1)/(m + 1)
//! (|s| ≤ 0.172), by its odd series to s⁹ (truncation below 1e-9). The
//! exponential reduces z = k·ln 2 + r, |r| ≤ ln 2 / 2, and sums the Taylor
//! series of e^r − 1 to r⁷ (truncation below 6e-9), then adds k to the
//! exponent field. The square root takes an estimate of 1/√x from the bit
//! pattern and three Newton steps for 1/√x (a fixed count, like the
//! Goldschmidt steps inside `libm`'s own square root; relative error below
//! 1e-7 after the third), then x·(1/√x).

/// ln 2, high part: 0.693145751953125 exactly (pattern 0x3f317200, 16
/// significant bits, so k·LN2_HI is exact for |k| < 2^8).
const LN2_HI: f32 = 0.693_145_75;
/// ln 2 − LN2_HI.
const LN2_LO: f32 = 1.428_606_8e-6;
/// 1/ln 2.
const LOG2_E: f32 = core::f32::consts::LOG2_E;
/// 1.5·2^23: adding it to |v| < 2^22 rounds v to an integer in the low
/// mantissa bits.
const ROUNDER: f32 = 12_582_912.0;

/// ln x for a positive finite normal x.
#[inline]
pub(crate) fn ln(x: f32) -> f32 {
    let bits = x.to_bits();
    // k such that x/2^k lies in [√½, √2): 0x3f3504f3 is the pattern of √½.
    let k = (bits.wrapping_sub(0x3f35_04f3) as i32) >> 23;
    let m = f32::from_bits(bits.wrapping_sub((k as u32).wrapping_shl(23)));
    let s = (m - 1.0) / (m + 1.0);
    let s2 = s * s;
    let series =
        2.0 * s * (1.0 + s2 * (1.0 / 3.0 + s2 * (1.0 / 5.0 + s2 * (1.0 / 7.0 + s2 * (1.0 / 9.0)))));
    let kf = k as f32;
    kf * LN2_HI + (kf * LN2_LO + series)
}

/// ln(1 + z) for z ≥ 0 (finite), accurate also for small z: the rounding of
/// u = 1 + z is corrected by (z − (u − 1))/u.
#[inline]
pub(crate) fn ln_1p(z: f32) -> f32 {
    let u = 1.0 + z;
    ln(u) + (z - (u - 1.0)) / u
}

/// (2^k, e^r − 1) with z = k·ln 2 + r, |r| ≤ ln 2/2, for |z| < 87.
#[inline]
fn exp_parts(z: f32) -> (f32, f32) {
    let z = if z > 87.0 {
        87.0
    } else if z > -87.0 {
        z
    } else {
        -87.0
    };
    let shifted = z * LOG2_E + ROUNDER;
    let kf = shifted - ROUNDER;
    let k = shifted.to_bits().wrapping_sub(ROUNDER.to_bits()) as i32;
    let r = (z - kf * LN2_HI) - kf * LN2_LO;
    let em1 = r
        * (1.0
            + r * (1.0 / 2.0
                + r * (1.0 / 6.0
                    + r * (1.0 / 24.0
                        + r * (1.0 / 120.0 + r * (1.0 / 720.0 + r * (1.0 / 5040.0)))))));
    let scale = f32::from_bits((k.wrapping_add(127) as u32).wrapping_shl(23));
    (scale, em1)
}

/// e^z for |z| < 87 (clamped to that range; NaN stays NaN).
#[inline]
pub(crate) fn exp(z: f32) -> f32 {
    let (scale, em1) = exp_parts(z);
    let v = scale + scale * em1;
    if z.is_nan() {
        z
    } else {
        v
    }
}

/// e^z − 1 for |z| < 87 (clamped to that range), accurate also for small z.
#[inline]
pub(crate) fn exp_m1(z: f32) -> f32 {
    let (scale, em1) = exp_parts(z);
    // 2^k·(1 + q) − 1 = (2^k − 1) + 2^k·q; 2^k − 1 is exact for 0 ≤ k ≤ 24.
    (scale - 1.0) + scale * em1
}

/// √x for a finite x ≥ 0 (0 for x ≤ 0).
#[inline]
pub(crate) fn sqrt(x: f32) -> f32 {
    if x.is_nan() || x <= 0.0 {
        return 0.0;
    }
    // Estimate of 1/√x from the bit pattern (within 3.5 %), then Newton
    // steps y ← y·(3 − x·y²)/2: 3.5e-2 → 1.8e-3 → 5e-6 → below f32 rounding.
    let mut y = f32::from_bits(0x5f37_59df_u32.wrapping_sub(x.to_bits() >> 1));
    let half = 0.5 * x;
    y *= 1.5 - half * y * y;
    y *= 1.5 - half * y * y;
    y *= 1.5 - half * y * y;
    let r = x * y;
    // One correction of the root itself (Heron's step written with the
    // reciprocal, no division): r + (x − r²)·y/2.
    r + (x - r * r) * (0.5 * y)
}

/// asinh z = sign(z)·ln(1 + |z| + z²/(1 + √(z² + 1))), finite z.
#[inline]
pub(crate) fn asinh(z: f32) -> f32 {
    let a = if z < 0.0 { -z } else { z };
    let a2 = a * a;
    let v = ln_1p(a + a2 / (1.0 + sqrt(a2 + 1.0)));
    if z < 0.0 {
        -v
    } else {
        v
    }
}
