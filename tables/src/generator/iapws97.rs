//! The IAPWS-IF97 formulation as the generator's [`SaturationSource`].

use std::string::{String, ToString};

use super::{PhaseSample, SaturatedSample, SaturationSource};
use crate::if97::{region1, region2, region4, Properties};

/// The saturation line of IAPWS-IF97: Region 4 for p_sat and T_sat, Regions
/// 1 and 2 at (p_sat(T), T) for the phases below 623.15 K.
#[derive(Debug, Clone, Copy, Default)]
pub struct Iapws97;

fn phase(p: &Properties) -> PhaseSample {
    PhaseSample {
        density_kg_m3: p.density_kg_m3,
        enthalpy_j_kg: p.enthalpy_j_kg,
        entropy_j_kgk: p.entropy_j_kgk,
        cp_j_kgk: p.cp_j_kgk,
    }
}

impl SaturationSource for Iapws97 {
    fn saturation_pressure_pa(&self, t_k: f64) -> f64 {
        region4::saturation_pressure_pa_unchecked(t_k)
    }

    fn saturation_temperature_k(&self, p_pa: f64) -> f64 {
        region4::saturation_temperature_k_unchecked(p_pa)
    }

    fn saturated_sample(&self, t_k: f64) -> Result<SaturatedSample, String> {
        if !(273.15..=super::REGION3_BOUNDARY_TEMPERATURE_K).contains(&t_k) {
            return Err("the Region 3 saturation line is not available yet".to_string());
        }
        let p = region4::saturation_pressure_pa_unchecked(t_k);
        Ok(SaturatedSample {
            pressure_pa: p,
            liquid: phase(&region1::properties_unchecked(p, t_k)),
            vapour: phase(&region2::properties_unchecked(p, t_k)),
        })
    }
}
