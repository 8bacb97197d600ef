//! What the generator samples: the saturation line of a formulation.

use std::string::String;

/// One phase at saturation, SI base units.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PhaseSample {
    /// Density, kg/m³.
    pub density_kg_m3: f64,
    /// Specific enthalpy, J/kg.
    pub enthalpy_j_kg: f64,
    /// Specific entropy, J/(kg·K).
    pub entropy_j_kgk: f64,
    /// Specific isobaric heat capacity, J/(kg·K).
    pub cp_j_kgk: f64,
}

/// Both saturated phases at one temperature.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SaturatedSample {
    /// Saturation pressure, Pa.
    pub pressure_pa: f64,
    /// Saturated liquid.
    pub liquid: PhaseSample,
    /// Saturated vapour.
    pub vapour: PhaseSample,
}

/// A saturation line the generator can tabulate. The IAPWS-IF97 formulation
/// implements it; tests use analytic stand-ins.
pub trait SaturationSource {
    /// Saturation pressure at `t_k`, Pa.
    fn saturation_pressure_pa(&self, t_k: f64) -> f64;
    /// Saturation temperature at `p_pa`, K.
    fn saturation_temperature_k(&self, p_pa: f64) -> f64;
    /// Saturated liquid and vapour at `t_k`.
    ///
    /// # Errors
    /// A message when the source has no value there.
    fn saturated_sample(&self, t_k: f64) -> Result<SaturatedSample, String>;
}
