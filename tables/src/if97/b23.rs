//! The boundary between Regions 2 and 3, the B23 equation (IAPWS
//! R7-97(2012), section 4, Eqs. 5 and 6, coefficients of Table 1).
//!
//! A simple quadratic pressure–temperature relation from 623.15 K
//! (16.529 MPa, on the saturation line) to 863.15 K (100 MPa). It is a
//! definition of where Region 3 begins, not a physical phase boundary; the
//! properties on either side agree only to within the consistency stated in
//! the release.

use super::{require_finite, FormulationError};

/// Coefficients n1 … n5 of Eqs. 5 and 6, IAPWS R7-97(2012), Table 1.
#[allow(clippy::excessive_precision, clippy::unreadable_literal)]
const N: [f64; 5] = [
    0.34805185628969e3,
    -0.11671859879975e1,
    0.10192970039326e-2,
    0.57254459862746e3,
    0.13918839778870e2,
];

/// Lowest temperature of the B23 line, K.
pub const MIN_TEMPERATURE_K: f64 = 623.15;
/// Highest temperature of the B23 line, K.
pub const MAX_TEMPERATURE_K: f64 = 863.15;
/// Lowest pressure of the B23 line, Pa: p_B23(623.15 K) = 16.529 164 3 MPa
/// (the release rounds it to 16.5292 MPa). Computed from Eq. 5 itself so that
/// the two directions of the line have exactly matching ranges.
pub const MIN_PRESSURE_PA: f64 = pressure_pa_unchecked(MIN_TEMPERATURE_K);
/// Highest pressure of the B23 line, Pa: p_B23(863.15 K), which is 100 MPa
/// to within 1e-12 relative; computed from Eq. 5 for the same reason.
pub const MAX_PRESSURE_PA: f64 = pressure_pa_unchecked(MAX_TEMPERATURE_K);

/// B23 pressure at a temperature with no range check, Pa (Eq. 5).
///
/// Outside 623.15–863.15 K this is an extrapolation of the quadratic with no
/// meaning in the release.
pub const fn pressure_pa_unchecked(temperature_k: f64) -> f64 {
    let theta = temperature_k; // T* = 1 K
    (N[0] + N[1] * theta + N[2] * theta * theta) * 1.0e6 // p* = 1 MPa
}

/// B23 temperature at a pressure with no range check, K (Eq. 6).
///
/// Below the lowest B23 pressure the square root goes negative and the
/// result is NaN; callers must have checked the range.
pub fn temperature_k_unchecked(pressure_pa: f64) -> f64 {
    let pi = pressure_pa / 1.0e6;
    N[3] + libm::sqrt((pi - N[4]) / N[2])
}

/// Pressure on the Region 2/3 boundary at a temperature, Pa (Eq. 5).
///
/// Range 623.15 K ≤ T ≤ 863.15 K. Eq. 6 is the exact inverse of Eq. 5; the
/// line is a definition, so there is no accuracy to state beyond f64
/// rounding.
///
/// # Example
/// ```
/// use vapora_tables::if97::b23;
/// // The check value of the release: 623.15 K ↔ 16.5291643 MPa.
/// let p = b23::pressure_pa(623.15)?;
/// assert!((p - 16.529_164_3e6).abs() < 0.1);
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinity,
/// [`FormulationError::TemperatureOutOfRange`] outside the range.
pub fn pressure_pa(t_k: f64) -> Result<f64, FormulationError> {
    require_finite(&[t_k])?;
    if !(MIN_TEMPERATURE_K..=MAX_TEMPERATURE_K).contains(&t_k) {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k: t_k });
    }
    Ok(pressure_pa_unchecked(t_k))
}

/// Temperature on the Region 2/3 boundary at a pressure, K (Eq. 6).
///
/// Range p_B23(623.15 K) ≤ p ≤ p_B23(863.15 K), i.e. 16.5292 MPa to
/// 100 MPa as the release rounds them ([`MIN_PRESSURE_PA`],
/// [`MAX_PRESSURE_PA`]).
///
/// # Example
/// ```
/// use vapora_tables::if97::b23;
/// let t = b23::temperature_k(16.529_164_3e6)?;
/// assert!((t - 623.15).abs() < 1e-6);
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinity,
/// [`FormulationError::PressureOutOfRange`] outside the range.
pub fn temperature_k(p_pa: f64) -> Result<f64, FormulationError> {
    require_finite(&[p_pa])?;
    if !(MIN_PRESSURE_PA..=MAX_PRESSURE_PA).contains(&p_pa) {
        return Err(FormulationError::PressureOutOfRange { pressure_pa: p_pa });
    }
    Ok(temperature_k_unchecked(p_pa))
}
