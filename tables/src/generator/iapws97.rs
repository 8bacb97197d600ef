//! The IAPWS-IF97 formulation as the generator's [`SaturationSource`].

use std::string::{String, ToString};

use super::{PhaseSample, SaturatedSample, SaturationSource};
use crate::if97::{region4, saturation, Properties};

/// The saturation line of IAPWS-IF97: Region 4 for p_sat and T_sat, and
/// [`saturation::at_temperature`] for both phases (Regions 1 and 2 at
/// (p_sat(T), T) up to 623.15 K, the two roots of Region 3 above).
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
        let s = saturation::at_temperature(t_k).map_err(|e| e.to_string())?;
        Ok(SaturatedSample {
            pressure_pa: s.liquid.pressure_pa,
            liquid: phase(&s.liquid),
            vapour: phase(&s.vapour),
        })
    }
}
