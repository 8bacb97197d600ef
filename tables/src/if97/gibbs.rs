//! From a dimensionless Gibbs free energy and its derivatives to the full
//! set of properties (IAPWS R7-97(2012), Tables 3, 12 and 39, which share one
//! form for Regions 1, 2 and 5).
//!
//! Each region supplies γ(π, τ) = g/(RT) with π = p/p* and τ = T*/T; the
//! relations below are the same for all three. Region 3 is a Helmholtz
//! formulation and has its own counterpart.

use super::{d2powi, dpowi, powi, Properties, SPECIFIC_GAS_CONSTANT_J_KGK};

/// γ and its first and second derivatives at one (π, τ), total (ideal-gas
/// plus residual part where the region has both).
#[derive(Debug, Clone, Copy)]
pub(crate) struct GibbsDerivatives {
    /// Reduced pressure π = p/p*.
    pub pi: f64,
    /// Inverse reduced temperature τ = T*/T.
    pub tau: f64,
    /// γ.
    pub gamma: f64,
    /// ∂γ/∂π.
    pub gamma_pi: f64,
    /// ∂²γ/∂π².
    pub gamma_pipi: f64,
    /// ∂γ/∂τ.
    pub gamma_tau: f64,
    /// ∂²γ/∂τ².
    pub gamma_tautau: f64,
    /// ∂²γ/∂π∂τ.
    pub gamma_pitau: f64,
}

impl GibbsDerivatives {
    /// The ideal-gas part γ° = ln π + Σ n°ᵢ τ^J°ᵢ shared by Region 2
    /// (Eq. 16) and Region 5 (Eq. 33), with its derivatives.
    pub(crate) fn ideal_gas(
        pi: f64,
        tau: f64,
        terms: impl IntoIterator<Item = (i32, f64)>,
    ) -> Self {
        let mut d = Self {
            pi,
            tau,
            gamma: libm::log(pi),
            // d(ln π)/dπ = 1/π; the ideal-gas part has no π–τ cross term.
            gamma_pi: 1.0 / pi,
            gamma_pipi: -1.0 / (pi * pi),
            gamma_tau: 0.0,
            gamma_tautau: 0.0,
            gamma_pitau: 0.0,
        };
        for (j, n) in terms {
            d.gamma += n * powi(tau, j);
            d.gamma_tau += n * dpowi(tau, j);
            d.gamma_tautau += n * d2powi(tau, j);
        }
        d
    }

    /// Adds a residual part γʳ = Σ nᵢ π^Iᵢ b^Jᵢ, where b is τ shifted by the
    /// region's constant (τ − 0.5 in Region 2, Eq. 17; τ itself in Region 5,
    /// Eq. 34), so ∂b/∂τ = 1.
    pub(crate) fn add_residual(&mut self, b: f64, terms: &[(i32, i32, f64)]) {
        let pi = self.pi;
        for &(i, j, n) in terms {
            let pi_i = powi(pi, i);
            let dpi_i = dpowi(pi, i);
            let b_j = powi(b, j);
            let db_j = dpowi(b, j);
            self.gamma += n * pi_i * b_j;
            self.gamma_pi += n * dpi_i * b_j;
            self.gamma_pipi += n * d2powi(pi, i) * b_j;
            self.gamma_tau += n * pi_i * db_j;
            self.gamma_tautau += n * pi_i * d2powi(b, j);
            self.gamma_pitau += n * dpi_i * db_j;
        }
    }
}

/// The properties at (p, T) given the derivatives of γ there.
///
/// The relations are those of IAPWS R7-97(2012), Table 3:
/// v = (RT/p)·πγπ, h = RT·τγτ, u = RT·(τγτ − πγπ), s = R·(τγτ − γ),
/// cp = −R·τ²γττ, cv = R·(−τ²γττ + (γπ − τγπτ)²/γππ),
/// w² = RT·γπ² / ((γπ − τγπτ)²/(τ²γττ) − γππ).
///
/// The isentropic exponent follows from the speed of sound: with
/// w² = (∂p/∂ρ)_s = −v²(∂p/∂v)_s one has κ = −(v/p)(∂p/∂v)_s = w²/(p·v).
/// (For an ideal gas this is cp/cv, as it should be.)
pub(crate) fn properties_from_gibbs(
    pressure_pa: f64,
    temperature_k: f64,
    d: &GibbsDerivatives,
) -> Properties {
    let rt = SPECIFIC_GAS_CONSTANT_J_KGK * temperature_k;
    let pi_gamma_pi = d.pi * d.gamma_pi;
    let tau_gamma_tau = d.tau * d.gamma_tau;
    let tau2_gamma_tautau = d.tau * d.tau * d.gamma_tautau;
    let cross = d.gamma_pi - d.tau * d.gamma_pitau;

    let specific_volume_m3_kg = rt / pressure_pa * pi_gamma_pi;
    let speed_of_sound_sq =
        rt * d.gamma_pi * d.gamma_pi / (cross * cross / tau2_gamma_tautau - d.gamma_pipi);

    Properties {
        pressure_pa,
        temperature_k,
        density_kg_m3: 1.0 / specific_volume_m3_kg,
        specific_volume_m3_kg,
        enthalpy_j_kg: rt * tau_gamma_tau,
        internal_energy_j_kg: rt * (tau_gamma_tau - pi_gamma_pi),
        entropy_j_kgk: SPECIFIC_GAS_CONSTANT_J_KGK * (tau_gamma_tau - d.gamma),
        cp_j_kgk: -SPECIFIC_GAS_CONSTANT_J_KGK * tau2_gamma_tautau,
        cv_j_kgk: SPECIFIC_GAS_CONSTANT_J_KGK * (-tau2_gamma_tautau + cross * cross / d.gamma_pipi),
        speed_of_sound_m_s: libm::sqrt(speed_of_sound_sq),
        isentropic_exponent: speed_of_sound_sq / (pressure_pa * specific_volume_m3_kg),
    }
}
