//! Dynamic viscosity of water and steam: the IAPWS 2008 viscosity
//! formulation (IAPWS R12-08), in its form for industrial use.
//!
//! μ = μ*·μ̄₀(T̄)·μ̄₁(T̄, ρ̄)·μ̄₂ with T̄ = T/647.096 K, ρ̄ = ρ/322 kg/m³,
//! μ* = 1 µPa·s (R12-08 Eqs. 2, 10, 11, 12; coefficients Tables 1 and 2).
//! The critical enhancement μ̄₂ is set to 1, as R12-08 recommends for
//! industrial use: it matters only in a small neighbourhood of the critical
//! point (roughly 645.91 K < T < 650.77 K and 245.8 kg/m³ < ρ < 405.3
//! kg/m³, quoted from memory of R12-08 section 3), where omitting it changes
//! μ by up to a few per cent.
//!
//! Range for industrial use with IAPWS-IF97 densities (R12-08 section 3.2,
//! quoted from memory): the (p, T) range of IF97 Regions 1, 2, 3 and 5 up to
//! 1173.15 K, i.e. 273.15 K ≤ T ≤ 1073.15 K for p ≤ 100 MPa and
//! 1073.15 K < T ≤ 1173.15 K for p ≤ 50 MPa.

use super::{require_finite, FormulationError, CRITICAL_DENSITY_KG_M3, CRITICAL_TEMPERATURE_K};

/// H₀ … H₃ of the dilute-gas term μ̄₀, IAPWS R12-08 Table 1.
const H0: [f64; 4] = [1.677_52, 2.204_62, 0.636_656_4, -0.241_605];

/// Nonzero H_ij (i, j, H_ij) of the residual term μ̄₁, IAPWS R12-08 Table 2.
const H1: [(usize, usize, f64); 21] = [
    (0, 0, 5.200_94e-1),
    (1, 0, 8.508_95e-2),
    (2, 0, -1.083_74),
    (3, 0, -2.895_55e-1),
    (0, 1, 2.225_31e-1),
    (1, 1, 9.991_15e-1),
    (2, 1, 1.887_97),
    (3, 1, 1.266_13),
    (5, 1, 1.205_73e-1),
    (0, 2, -2.813_78e-1),
    (1, 2, -9.068_51e-1),
    (2, 2, -7.724_79e-1),
    (3, 2, -4.898_37e-1),
    (4, 2, -2.570_40e-1),
    (0, 3, 1.619_13e-1),
    (1, 3, 2.573_99e-1),
    (0, 4, -3.253_72e-2),
    (3, 4, 6.984_52e-2),
    (4, 5, 8.721_02e-3),
    (3, 6, -4.356_73e-3),
    (5, 6, -5.932_64e-4),
];

/// Reference viscosity μ*, Pa·s (IAPWS R12-08, Eq. 4: 1.00 × 10⁻⁶ Pa·s).
const REFERENCE_VISCOSITY_PA_S: f64 = 1.0e-6;

/// Lowest temperature accepted, K (IF97 Region 1 lower limit).
pub const MIN_TEMPERATURE_K: f64 = 273.15;
/// Highest temperature accepted, K (R12-08 industrial-use limit with IF97).
pub const MAX_TEMPERATURE_K: f64 = 1173.15;
/// Highest density accepted by [`viscosity_pa_s`], kg/m³. Liquid water at
/// 1000 MPa, the top of R12-08's range of validity, is below this density;
/// states of IF97 (p ≤ 100 MPa) stay below 1060 kg/m³.
pub const MAX_DENSITY_KG_M3: f64 = 1250.0;

/// Viscosity from density and temperature with no range check, Pa·s.
///
/// The caller guarantees ρ > 0 and T > 0.
pub fn viscosity_pa_s_unchecked(density_kg_m3: f64, temperature_k: f64) -> f64 {
    let t = temperature_k / CRITICAL_TEMPERATURE_K;
    let rho = density_kg_m3 / CRITICAL_DENSITY_KG_M3;
    // μ̄₀ = 100·√T̄ / Σ Hᵢ/T̄ⁱ (R12-08 Eq. 11), Horner in 1/T̄.
    let inv_t = 1.0 / t;
    let denominator = H0[0] + inv_t * (H0[1] + inv_t * (H0[2] + inv_t * H0[3]));
    let mu0 = 100.0 * libm::sqrt(t) / denominator;
    // μ̄₁ = exp(ρ̄ Σ Σ H_ij (1/T̄ − 1)ⁱ (ρ̄ − 1)ʲ) (R12-08 Eq. 12).
    let x = inv_t - 1.0;
    let y = rho - 1.0;
    let mut xp = [1.0; 6];
    let mut yp = [1.0; 7];
    for k in 1..6 {
        xp[k] = xp[k - 1] * x;
    }
    for k in 1..7 {
        yp[k] = yp[k - 1] * y;
    }
    let sum: f64 = H1.iter().map(|&(i, j, h)| h * xp[i] * yp[j]).sum();
    let mu1 = libm::exp(rho * sum);
    REFERENCE_VISCOSITY_PA_S * mu0 * mu1
}

/// Dynamic viscosity from density (kg/m³) and temperature (K), Pa·s
/// (IAPWS R12-08, industrial use: μ̄₂ = 1).
///
/// Range: 273.15 K ≤ T ≤ 1173.15 K and 0 < ρ ≤ 1250 kg/m³. The function does
/// not check that (ρ, T) is a state inside IF97; pair it with an IF97
/// density (or use [`viscosity_pt`]) to stay in the range for industrial use.
/// Accuracy: reproduces R12-08 Table 4 to every printed digit; the
/// correlation's own uncertainty is 1 % to a few per cent depending on the
/// state (R12-08 section 5), plus up to a few per cent near the critical
/// point from omitting μ̄₂.
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinite input,
/// [`FormulationError::TemperatureOutOfRange`] and
/// [`FormulationError::DensityOutOfRange`] outside the range.
///
/// # Example
/// ```
/// use vapora_tables::if97::viscosity::viscosity_pa_s;
/// // Liquid water at 25 °C, 998 kg/m³: about 890 µPa·s.
/// let mu = viscosity_pa_s(998.0, 298.15).unwrap();
/// assert!((mu - 889.7351e-6).abs() < 1e-9);
/// ```
pub fn viscosity_pa_s(density_kg_m3: f64, temperature_k: f64) -> Result<f64, FormulationError> {
    require_finite(&[density_kg_m3, temperature_k])?;
    if !(MIN_TEMPERATURE_K..=MAX_TEMPERATURE_K).contains(&temperature_k) {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k });
    }
    if density_kg_m3 <= 0.0 || density_kg_m3 > MAX_DENSITY_KG_M3 {
        return Err(FormulationError::DensityOutOfRange { density_kg_m3 });
    }
    Ok(viscosity_pa_s_unchecked(density_kg_m3, temperature_k))
}

/// Dynamic viscosity at pressure p (Pa) and temperature T (K), Pa·s: the
/// IF97 density from [`super::pt::properties_pt`] put into
/// [`viscosity_pa_s`] (R12-08 industrial use).
///
/// Range: the IF97 range up to 1173.15 K (273.15 K ≤ T ≤ 1073.15 K for
/// p ≤ 100 MPa, 1073.15 K < T ≤ 1173.15 K for p ≤ 50 MPa). On the
/// saturation line the liquid is taken (as in `properties_pt`).
///
/// # Errors
/// Those of [`super::pt::properties_pt`], and
/// [`FormulationError::TemperatureOutOfRange`] above 1173.15 K.
///
/// # Example
/// ```
/// use vapora_tables::if97::viscosity::viscosity_pt;
/// let mu = viscosity_pt(0.101_325e6, 293.15)?; // water at 20 °C
/// assert!((mu - 1.0016e-3).abs() < 1e-6);
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
pub fn viscosity_pt(pressure_pa: f64, temperature_k: f64) -> Result<f64, FormulationError> {
    require_finite(&[pressure_pa, temperature_k])?;
    if temperature_k > MAX_TEMPERATURE_K {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k });
    }
    let props = super::pt::properties_pt(pressure_pa, temperature_k)?;
    viscosity_pa_s(props.density_kg_m3, temperature_k)
}
