//! The saturation line: both saturated states (boiling liquid and dry
//! saturated vapour) at a temperature or a pressure, from the triple point
//! (and down to 273.15 K, the lower end of the Region 4 equation) to the
//! critical point.
//!
//! Method (IAPWS R7-97(2012), sections 5–8):
//!
//! - 273.15 K ≤ T ≤ 623.15 K: p = psat(T) from the Region 4 equation (Eq.
//!   30); the saturated liquid is Region 1 (Eq. 7) and the saturated vapour
//!   Region 2 (Eq. 15) at (psat, T). This is how the release defines the
//!   saturation states below 623.15 K.
//! - 623.15 K < T < Tc: p = psat(T) from Eq. 30 again, and the saturated
//!   densities are the roots of p₃(ρ, T) = psat(T) of the Region 3 equation
//!   (Eq. 28): ρ' on the liquid-like branch above the liquid spinodal, ρ''
//!   on the vapour-like branch below the vapour spinodal. Each root is
//!   bracketed between its spinodal (where (∂p/∂ρ)_T = 0) and a far end and
//!   found by bracketed Newton iteration to a residual of 1e-13·p. The
//!   properties are Eq. 28 at (ρ', T) and (ρ'', T). (The release leaves the
//!   choice between this and a Maxwell construction on Eq. 28 to the user;
//!   this one keeps p exactly on the Region 4 line that Regions 1/2 use.)
//! - Within about 5e-5 K below Tc the loop of Eq. 28 becomes lower than the
//!   difference between psat(T) and Eq. 28's own phase-equilibrium
//!   pressure: psat(T) lies above the vapour spinodal pressure, so the
//!   vapour branch has no root at psat(T). The vapour state is then taken at
//!   its spinodal (the state of that branch whose pressure is closest to
//!   psat, measured within 1e-3 Pa of it). The test suite shows the roots
//!   exist from Tc − 1e-4 K downward and that ρ' > ρc > ρ'' holds to
//!   Tc − 1e-8 K.
//! - T = Tc exactly: both states are the critical state of Eq. 28,
//!   ρ' = ρ'' = ρc = 322 kg/m³, with p = p₃(ρc, Tc) = 22.064 MPa to 2e-12
//!   relative. Eq. 28 gives (∂p/∂ρ)_T ≈ −1e-3 Pa·m³/kg there instead of
//!   exactly 0, which would make cp and κ meaningless; cp is returned as
//!   +∞ (it diverges at the critical point) and the speed of sound and κ
//!   are those of Eq. 28 with the (∂p/∂ρ)_T term set to 0.
//!
//! Continuity at 623.15 K: the Region 1/2 and Region 3 routes meet there
//! with small jumps (the release's stated consistency of the regions on
//! their boundaries); the test suite measures and prints them.

use super::region3;
use super::region4::{saturation_pressure_pa_unchecked, saturation_temperature_k_unchecked};
use super::{
    region1, region2, require_finite, FormulationError, Properties, CRITICAL_DENSITY_KG_M3,
    CRITICAL_PRESSURE_PA, CRITICAL_TEMPERATURE_K, SPECIFIC_GAS_CONSTANT_J_KGK,
};

/// Lowest temperature of the saturation line, K (lower end of Eq. 30).
pub const MIN_TEMPERATURE_K: f64 = 273.15;
/// Highest temperature of the saturation line, K: the critical temperature.
pub const MAX_TEMPERATURE_K: f64 = CRITICAL_TEMPERATURE_K;
/// Lowest pressure of the saturation line, Pa: psat(273.15 K).
pub const MIN_PRESSURE_PA: f64 = super::region4::MIN_PRESSURE_PA;
/// Highest pressure of the saturation line, Pa: the critical pressure.
pub const MAX_PRESSURE_PA: f64 = CRITICAL_PRESSURE_PA;
/// Temperature above which the saturated states come from Region 3, K.
pub const REGION3_TEMPERATURE_K: f64 = 623.15;

/// The two coexisting states on the saturation line at one temperature.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SaturatedStates {
    /// Saturated (boiling) liquid, dryness fraction 0.
    pub liquid: Properties,
    /// Dry saturated vapour, dryness fraction 1.
    pub vapour: Properties,
}

/// The critical state of Eq. 28 as described in the module docs.
fn critical_state() -> Properties {
    let r = SPECIFIC_GAS_CONSTANT_J_KGK;
    let t = CRITICAL_TEMPERATURE_K;
    let mut props = region3::properties_rho_t_unchecked(CRITICAL_DENSITY_KG_M3, t);
    let d = region3::helmholtz(1.0, 1.0);
    let cross = d.phi_delta - d.phi_deltatau;
    // w² = RT((∂p/∂ρ)_T/(RT) − (δφ_δ − δτφ_δτ)²/(τ²φ_ττ)) with the first
    // term, zero at a true critical point, dropped.
    let w_sq = r * t * (-cross * cross / d.phi_tautau);
    props.cp_j_kgk = f64::INFINITY;
    props.speed_of_sound_m_s = libm::sqrt(w_sq);
    props.isentropic_exponent = CRITICAL_DENSITY_KG_M3 * w_sq / props.pressure_pa;
    props
}

/// Saturated states from Region 3 at T in (623.15 K, Tc) and pressure p
/// (psat(T), or the pressure asked for in [`at_pressure`]).
fn region3_states(
    pressure_pa: f64,
    temperature_k: f64,
) -> Result<SaturatedStates, FormulationError> {
    let Some((vapour_spinodal, liquid_spinodal)) = region3::spinodal_densities_kg_m3(temperature_k)
    else {
        // No loop: not seen below Tc (the slope at ρc is negative there,
        // checked by the test suite), kept so that no input can fail here.
        let c = critical_state();
        return Ok(SaturatedStates {
            liquid: c,
            vapour: c,
        });
    };
    let rho_liquid = region3::solve_in_bracket(
        pressure_pa,
        temperature_k,
        liquid_spinodal,
        region3::MAX_DENSITY_KG_M3,
    )
    .unwrap_or(liquid_spinodal);
    let rho_vapour = region3::solve_in_bracket(
        pressure_pa,
        temperature_k,
        region3::MIN_DENSITY_KG_M3,
        vapour_spinodal,
    )
    .unwrap_or(vapour_spinodal);
    Ok(SaturatedStates {
        liquid: region3::properties_rho_t_unchecked(rho_liquid, temperature_k),
        vapour: region3::properties_rho_t_unchecked(rho_vapour, temperature_k),
    })
}

/// Both saturated states at temperature T with no range check.
///
/// The caller guarantees 273.15 K ≤ T ≤ Tc (outside, the result has no
/// meaning). Cost: two Region 1/2 evaluations (about 2 µs on a desktop
/// host) up to 623.15 K; some tens of evaluations of Eq. 28 for the
/// spinodals and the two roots (about 11 µs) above it.
///
/// # Errors
/// Never in the stated range (kept as a `Result` for the Region 3 solver's
/// [`FormulationError::NoConvergence`], which the test suite shows does not
/// occur).
pub fn at_temperature_unchecked(temperature_k: f64) -> Result<SaturatedStates, FormulationError> {
    if temperature_k >= CRITICAL_TEMPERATURE_K {
        let c = critical_state();
        return Ok(SaturatedStates {
            liquid: c,
            vapour: c,
        });
    }
    let p = saturation_pressure_pa_unchecked(temperature_k);
    states_at(p, temperature_k)
}

/// The saturated states at (p, T) with T = Tsat(p) or p = psat(T).
fn states_at(pressure_pa: f64, temperature_k: f64) -> Result<SaturatedStates, FormulationError> {
    if temperature_k <= REGION3_TEMPERATURE_K {
        Ok(SaturatedStates {
            liquid: region1::properties_unchecked(pressure_pa, temperature_k),
            vapour: region2::properties_unchecked(pressure_pa, temperature_k),
        })
    } else {
        region3_states(pressure_pa, temperature_k)
    }
}

/// Both saturated states at temperature T (K), 273.15 K ≤ T ≤ 647.096 K.
///
/// The pressure of both states is psat(T) of the Region 4 equation (Eq. 30;
/// for T > 623.15 K it is p₃(ρ, T), equal to psat(T) to 1e-13 relative).
/// Accuracy: that of IF97 itself (the module docs give the method; the
/// Region 1/2 and Region 3 routes meet at 623.15 K within the release's
/// boundary consistency, measured by the test suite). Near and at Tc see the
/// module docs: at exactly Tc both states are the critical state with
/// cp = +∞.
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinite input,
/// [`FormulationError::TemperatureOutOfRange`] outside the range.
///
/// # Example
/// ```
/// use vapora_tables::if97::saturation;
/// // Drum of a small boiler at 200 °C.
/// let sat = saturation::at_temperature(473.15)?;
/// let latent_heat_j_kg = sat.vapour.enthalpy_j_kg - sat.liquid.enthalpy_j_kg;
/// assert!((latent_heat_j_kg - 1.9403e6).abs() < 1e3);
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
pub fn at_temperature(temperature_k: f64) -> Result<SaturatedStates, FormulationError> {
    require_finite(&[temperature_k])?;
    if !(MIN_TEMPERATURE_K..=MAX_TEMPERATURE_K).contains(&temperature_k) {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k });
    }
    at_temperature_unchecked(temperature_k)
}

/// Both saturated states at pressure p (Pa), 611.213 Pa ≤ p ≤ 22.064 MPa.
///
/// T = Tsat(p) from the Region 4 equation (Eq. 31), then the states as in
/// [`at_temperature`] but at the pressure given (not at psat(Tsat(p)),
/// which differs from it by rounding only). At p = 22.064 MPa both states
/// are the critical state (see the module docs).
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinite input,
/// [`FormulationError::PressureOutOfRange`] outside the range.
///
/// # Example
/// ```
/// use vapora_tables::if97::saturation;
/// let sat = saturation::at_pressure(0.101_325e6)?; // normal boiling point
/// assert!((sat.liquid.temperature_k - 373.124).abs() < 1e-3);
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
pub fn at_pressure(pressure_pa: f64) -> Result<SaturatedStates, FormulationError> {
    require_finite(&[pressure_pa])?;
    if !(MIN_PRESSURE_PA..=MAX_PRESSURE_PA).contains(&pressure_pa) {
        return Err(FormulationError::PressureOutOfRange { pressure_pa });
    }
    let t = saturation_temperature_k_unchecked(pressure_pa);
    if pressure_pa >= MAX_PRESSURE_PA || t >= CRITICAL_TEMPERATURE_K {
        let c = critical_state();
        return Ok(SaturatedStates {
            liquid: c,
            vapour: c,
        });
    }
    states_at(pressure_pa, t)
}
