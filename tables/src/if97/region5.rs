//! Region 5: high-temperature steam, the basic equation for the Gibbs free
//! energy (IAPWS R7-97(2012), section 9, Eq. 32: ideal-gas part Table 37,
//! residual part Table 38 as revised in 2007).
//!
//! Range: 1073.15 K ≤ T ≤ 2273.15 K and 0 < p ≤ 50 MPa.

use super::gibbs::{properties_from_gibbs, GibbsDerivatives};
use super::{require_finite, require_finite_properties};
use super::{FormulationError, Properties};

/// Reducing pressure p* of Eq. 32, Pa (1 MPa).
const REDUCING_PRESSURE_PA: f64 = 1.0e6;
/// Reducing temperature T* of Eq. 32, K.
const REDUCING_TEMPERATURE_K: f64 = 1000.0;

/// Lowest temperature of Region 5, K.
pub const MIN_TEMPERATURE_K: f64 = 1073.15;
/// Highest temperature of Region 5, K.
pub const MAX_TEMPERATURE_K: f64 = 2273.15;
/// Highest pressure of Region 5, Pa (50 MPa).
pub const MAX_PRESSURE_PA: f64 = 50.0e6;

/// Exponents J° and coefficients n° of the ideal-gas part of Eq. 32,
/// IAPWS R7-97(2012), Table 37.
#[allow(clippy::excessive_precision, clippy::unreadable_literal)]
const IDEAL: [(i32, f64); 6] = [
    (0, -0.13179983674201e2),
    (1, 0.68540841634434e1),
    (-3, -0.24805148933466e-1),
    (-2, 0.36901534980333e0),
    (-1, -0.31161318213925e1),
    (2, -0.32961626538917e0),
];

/// Exponents I, J and coefficients n of the residual part of Eq. 32,
/// IAPWS R7-97(2012), Table 38.
#[allow(clippy::excessive_precision, clippy::unreadable_literal)]
const RESIDUAL: [(i32, i32, f64); 6] = [
    (1, 1, 0.15736404855259e-2),
    (1, 2, 0.90153761673944e-3),
    (1, 3, -0.50270077677648e-2),
    (2, 3, 0.22440037409485e-5),
    (2, 9, -0.41163275453471e-5),
    (3, 7, 0.37919454822955e-7),
];

/// γ = γ° + γʳ of Eq. 32 and its derivatives.
fn gibbs_derivatives(pressure_pa: f64, temperature_k: f64) -> GibbsDerivatives {
    let pi = pressure_pa / REDUCING_PRESSURE_PA;
    let tau = REDUCING_TEMPERATURE_K / temperature_k;

    // Ideal-gas part γ° = ln π + Σ n°ᵢ τ^J°ᵢ (Eq. 33).
    let mut d = GibbsDerivatives::ideal_gas(pi, tau, IDEAL);
    // Residual part γʳ = Σ nᵢ π^Iᵢ τ^Jᵢ (Eq. 34): unlike Region 2, Region 5
    // uses τ itself, not τ − 0.5.
    d.add_residual(tau, &RESIDUAL);
    d
}

/// Region 5 properties at (p, T) with no range check.
///
/// Outside Region 5 the values are an extrapolation with no stated accuracy
/// (and NaN or infinite for p ≤ 0).
pub fn properties_unchecked(pressure_pa: f64, temperature_k: f64) -> Properties {
    properties_from_gibbs(
        pressure_pa,
        temperature_k,
        &gibbs_derivatives(pressure_pa, temperature_k),
    )
}

/// Region 5 properties (high-temperature steam) at pressure `p_pa` (Pa) and
/// temperature `t_k` (K).
///
/// Range: 1073.15 K ≤ T ≤ 2273.15 K and 0 < p ≤ 50 MPa. Eq. 32 has the
/// accuracy stated in IAPWS R7-97(2012), section 9; this implementation
/// reproduces the release's Table 42 in every printed digit.
///
/// # Example
/// ```
/// use vapora_tables::if97::region5;
/// let steam = region5::properties(0.5e6, 1500.0)?;
/// assert!((steam.speed_of_sound_m_s - 917.069).abs() < 0.001);
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinite input,
/// [`FormulationError::TemperatureOutOfRange`] outside 1073.15–2273.15 K,
/// [`FormulationError::PressureOutOfRange`] for p ≤ 0, p > 50 MPa, or p so
/// low (below about 1e-300 Pa) that the specific volume overflows f64.
pub fn properties(p_pa: f64, t_k: f64) -> Result<Properties, FormulationError> {
    require_finite(&[p_pa, t_k])?;
    if !(MIN_TEMPERATURE_K..=MAX_TEMPERATURE_K).contains(&t_k) {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k: t_k });
    }
    if !(p_pa > 0.0 && p_pa <= MAX_PRESSURE_PA) {
        return Err(FormulationError::PressureOutOfRange { pressure_pa: p_pa });
    }
    require_finite_properties(properties_unchecked(p_pa, t_k))
}
