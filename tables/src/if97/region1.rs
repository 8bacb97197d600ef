//! Region 1: compressed (subcooled) liquid, the basic equation for the Gibbs
//! free energy (IAPWS R7-97(2012), section 5, Eq. 7, coefficients of Table 2).
//!
//! Range: 273.15 K ≤ T ≤ 623.15 K and psat(T) ≤ p ≤ 100 MPa.

use super::gibbs::{properties_from_gibbs, GibbsDerivatives};
use super::region4;
use super::{d2powi, dpowi, powi, require_finite, require_finite_properties};
use super::{FormulationError, Properties};

/// Reducing pressure p* of Eq. 7, Pa (16.53 MPa).
const REDUCING_PRESSURE_PA: f64 = 16.53e6;
/// Reducing temperature T* of Eq. 7, K.
const REDUCING_TEMPERATURE_K: f64 = 1386.0;

/// Lowest temperature of Region 1, K.
pub const MIN_TEMPERATURE_K: f64 = 273.15;
/// Highest temperature of Region 1, K (the boundary to Region 3).
pub const MAX_TEMPERATURE_K: f64 = 623.15;
/// Highest pressure of Region 1, Pa (100 MPa).
pub const MAX_PRESSURE_PA: f64 = 100.0e6;
/// Relative amount by which the checked functions accept a pressure below
/// psat(T). It lets a caller evaluate the saturated-liquid limit at a
/// saturation pressure that went through a round trip of rounding
/// (e.g. psat(Tsat(p))), without letting in real metastable liquid.
pub const SATURATION_PRESSURE_SLACK: f64 = 1e-9;

/// Exponents I, J and coefficients n of Eq. 7, IAPWS R7-97(2012), Table 2.
#[allow(clippy::excessive_precision, clippy::unreadable_literal)]
const IJN: [(i32, i32, f64); 34] = [
    (0, -2, 0.14632971213167e0),
    (0, -1, -0.84548187169114e0),
    (0, 0, -0.37563603672040e1),
    (0, 1, 0.33855169168385e1),
    (0, 2, -0.95791963387872e0),
    (0, 3, 0.15772038513228e0),
    (0, 4, -0.16616417199501e-1),
    (0, 5, 0.81214629983568e-3),
    (1, -9, 0.28319080123804e-3),
    (1, -7, -0.60706301565874e-3),
    (1, -1, -0.18990068218419e-1),
    (1, 0, -0.32529748770505e-1),
    (1, 1, -0.21841717175414e-1),
    (1, 3, -0.52838357969930e-4),
    (2, -3, -0.47184321073267e-3),
    (2, 0, -0.30001780793026e-3),
    (2, 1, 0.47661393906987e-4),
    (2, 3, -0.44141845330846e-5),
    (2, 17, -0.72694996297594e-15),
    (3, -4, -0.31679644845054e-4),
    (3, 0, -0.28270797985312e-5),
    (3, 6, -0.85205128120103e-9),
    (4, -5, -0.22425281908000e-5),
    (4, -2, -0.65171222895601e-6),
    (4, 10, -0.14341729937924e-12),
    (5, -8, -0.40516996860117e-6),
    (8, -11, -0.12734301741641e-8),
    (8, -6, -0.17424871230634e-9),
    (21, -29, -0.68762131295531e-18),
    (23, -31, 0.14478307828521e-19),
    (29, -38, 0.26335781662795e-22),
    (30, -39, -0.11947622640071e-22),
    (31, -40, 0.18228094581404e-23),
    (32, -41, -0.93537087292458e-25),
];

/// γ(π, τ) of Eq. 7 and its derivatives.
fn gibbs_derivatives(pressure_pa: f64, temperature_k: f64) -> GibbsDerivatives {
    let pi = pressure_pa / REDUCING_PRESSURE_PA;
    let tau = REDUCING_TEMPERATURE_K / temperature_k;
    // Eq. 7 is written in (7.1 − π) and (τ − 1.222); d(7.1 − π)/dπ = −1.
    let a = 7.1 - pi;
    let b = tau - 1.222;
    let mut d = GibbsDerivatives {
        pi,
        tau,
        gamma: 0.0,
        gamma_pi: 0.0,
        gamma_pipi: 0.0,
        gamma_tau: 0.0,
        gamma_tautau: 0.0,
        gamma_pitau: 0.0,
    };
    for &(i, j, n) in &IJN {
        let ai = powi(a, i);
        let bj = powi(b, j);
        let dai = dpowi(a, i);
        let dbj = dpowi(b, j);
        d.gamma += n * ai * bj;
        d.gamma_pi -= n * dai * bj;
        d.gamma_pipi += n * d2powi(a, i) * bj;
        d.gamma_tau += n * ai * dbj;
        d.gamma_tautau += n * ai * d2powi(b, j);
        d.gamma_pitau -= n * dai * dbj;
    }
    d
}

/// Region 1 properties at (p, T) with no range check.
///
/// Evaluates Eq. 7 wherever it is asked to; outside Region 1 the values are
/// an extrapolation with no stated accuracy. The table generator and the
/// saturation code call it exactly at p = psat(T) (the saturated-liquid
/// state), where rounding may put p a few ulp below psat.
pub fn properties_unchecked(pressure_pa: f64, temperature_k: f64) -> Properties {
    properties_from_gibbs(
        pressure_pa,
        temperature_k,
        &gibbs_derivatives(pressure_pa, temperature_k),
    )
}

/// Region 1 properties (subcooled or compressed liquid) at pressure `p_pa`
/// (Pa) and temperature `t_k` (K).
///
/// Range: 273.15 K ≤ T ≤ 623.15 K and psat(T)·(1 − 1e-9) ≤ p ≤ 100 MPa
/// (see [`SATURATION_PRESSURE_SLACK`]). Eq. 7 represents IAPWS-95 within
/// the permissible tolerances of IAPWS R7-97(2012), section 5.1; this
/// implementation reproduces the release's Table 5 in every printed digit.
///
/// # Example
/// ```
/// use vapora_tables::if97::region1;
/// // Cold feedwater at 3 MPa, 300 K (the first point of Table 5).
/// let water = region1::properties(3.0e6, 300.0)?;
/// assert!((water.density_kg_m3 - 997.85).abs() < 0.01);
/// assert!((water.enthalpy_j_kg - 115.331e3).abs() < 1.0);
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinite input,
/// [`FormulationError::TemperatureOutOfRange`] outside 273.15–623.15 K,
/// [`FormulationError::PressureOutOfRange`] below psat(T) or above 100 MPa.
pub fn properties(p_pa: f64, t_k: f64) -> Result<Properties, FormulationError> {
    require_finite(&[p_pa, t_k])?;
    if !(MIN_TEMPERATURE_K..=MAX_TEMPERATURE_K).contains(&t_k) {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k: t_k });
    }
    let p_sat = region4::saturation_pressure_pa_unchecked(t_k);
    if !(p_pa >= p_sat * (1.0 - SATURATION_PRESSURE_SLACK) && p_pa <= MAX_PRESSURE_PA) {
        return Err(FormulationError::PressureOutOfRange { pressure_pa: p_pa });
    }
    require_finite_properties(properties_unchecked(p_pa, t_k))
}
