//! Which region of IAPWS-IF97 a (p, T) point belongs to (IAPWS R7-97(2012),
//! section 4 and Fig. 1).
//!
//! The formulation covers 273.15 K ≤ T ≤ 1073.15 K for 0 < p ≤ 100 MPa and
//! 1073.15 K < T ≤ 2273.15 K for 0 < p ≤ 50 MPa.

use super::{b23, region1, region2, region4, region5};
use super::{require_finite, FormulationError, Region};

/// Lowest temperature of IAPWS-IF97, K.
pub const MIN_TEMPERATURE_K: f64 = region1::MIN_TEMPERATURE_K;
/// Highest temperature of IAPWS-IF97, K (the top of Region 5).
pub const MAX_TEMPERATURE_K: f64 = region5::MAX_TEMPERATURE_K;
/// Highest pressure of IAPWS-IF97, Pa (100 MPa, up to 1073.15 K).
pub const MAX_PRESSURE_PA: f64 = region1::MAX_PRESSURE_PA;

/// The region of IAPWS-IF97 that holds the point at pressure `p_pa` (Pa)
/// and temperature `t_k` (K).
///
/// - T ≤ 623.15 K: Region 1 when p ≥ psat(T), Region 2 when p < psat(T).
///   A point exactly on the saturation line is given to Region 1 (the
///   saturated liquid); a (p, T) pair cannot say which phase, or which
///   mixture of the two, is present there, so [`Region::Region4`] is never
///   returned by this function. Callers that know they are on the
///   saturation line use [`region4`] with p or T alone.
/// - 623.15 K < T ≤ 863.15 K: Region 3 when p > p_B23(T), else Region 2
///   (a point exactly on the B23 line is given to Region 2).
/// - 863.15 K < T ≤ 1073.15 K: Region 2.
/// - 1073.15 K < T ≤ 2273.15 K: Region 5 (p ≤ 50 MPa).
///
/// The boundaries at 623.15 K and 1073.15 K belong to the region below
/// them (Regions 1/2 and 2 respectively), as the ranges of Eqs. 7, 15 and
/// the B23 line state them.
///
/// # Example
/// ```
/// use vapora_tables::if97::{regions, Region};
/// assert_eq!(regions::region_pt(3.0e6, 300.0)?, Region::Region1); // subcooled water
/// assert_eq!(regions::region_pt(0.1e6, 450.0)?, Region::Region2); // superheated steam
/// assert_eq!(regions::region_pt(25.0e6, 650.0)?, Region::Region3); // near-critical
/// assert_eq!(regions::region_pt(1.0e6, 1500.0)?, Region::Region5); // very hot steam
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
///
/// # Errors
/// - [`FormulationError::NotFinite`] for NaN or infinite input.
/// - [`FormulationError::PressureOutOfRange`] for p ≤ 0 or p > 100 MPa.
/// - [`FormulationError::TemperatureOutOfRange`] for T < 273.15 K or
///   T > 2273.15 K.
/// - [`FormulationError::OutsideFormulation`] for 50 MPa < p ≤ 100 MPa
///   above 1073.15 K, which no region covers.
pub fn region_pt(p_pa: f64, t_k: f64) -> Result<Region, FormulationError> {
    require_finite(&[p_pa, t_k])?;
    if !(p_pa > 0.0 && p_pa <= MAX_PRESSURE_PA) {
        return Err(FormulationError::PressureOutOfRange { pressure_pa: p_pa });
    }
    if !(MIN_TEMPERATURE_K..=MAX_TEMPERATURE_K).contains(&t_k) {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k: t_k });
    }
    let region = if t_k <= region1::MAX_TEMPERATURE_K {
        if p_pa >= region4::saturation_pressure_pa_unchecked(t_k) {
            Region::Region1
        } else {
            Region::Region2
        }
    } else if t_k <= b23::MAX_TEMPERATURE_K {
        if p_pa > b23::pressure_pa_unchecked(t_k) {
            Region::Region3
        } else {
            Region::Region2
        }
    } else if t_k <= region2::MAX_TEMPERATURE_K {
        Region::Region2
    } else if p_pa <= region5::MAX_PRESSURE_PA {
        Region::Region5
    } else {
        return Err(FormulationError::OutsideFormulation {
            pressure_pa: p_pa,
            temperature_k: t_k,
        });
    };
    Ok(region)
}
