//! Wet steam: properties of a mixture of saturated liquid and vapour from
//! its pressure (or temperature) and dryness fraction x, by the lever rule
//! y = y' + x·(y'' − y') for h, s and v (ρ = 1/v).

use crate::error::MixtureError;
use crate::saturation::{self, interval_at_pressure, interval_at_temperature};
use crate::units::{AbsolutePressure, Temperature};

/// A wet-steam mixture.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct WetSteam {
    /// Saturation pressure (absolute).
    pub pressure: AbsolutePressure,
    /// Saturation temperature.
    pub temperature: Temperature,
    /// Dryness fraction x, kg vapour per kg mixture, 0 to 1.
    pub dryness_fraction: f32,
    /// Specific enthalpy h, J/kg.
    pub enthalpy_j_kg: f32,
    /// Specific entropy s, J/(kg·K).
    pub entropy_j_kgk: f32,
    /// Specific volume v, m³/kg.
    pub specific_volume_m3_kg: f32,
    /// Density ρ = 1/v, kg/m³.
    pub density_kg_m3: f32,
}

fn check_dryness(x: f32) -> Result<f32, MixtureError> {
    if (0.0..=1.0).contains(&x) {
        Ok(x)
    } else {
        Err(MixtureError::DrynessFractionOutOfRange {
            dryness_fraction: x,
        })
    }
}

fn mix(block: &[[f32; 4]; 9], t: f32, temperature_k: f32, pressure_pa: f32, x: f32) -> WetSteam {
    let h_l = saturation::liquid_enthalpy(block, t);
    let h_v = saturation::vapour_enthalpy(block, t);
    let s_l = saturation::liquid_entropy(block, t);
    let s_v = saturation::vapour_entropy(block, t);
    let v_l = 1.0 / saturation::liquid_density(block, t);
    let v_v = 1.0 / saturation::vapour_density(block, t, pressure_pa);
    let v = v_l + x * (v_v - v_l);
    WetSteam {
        pressure: AbsolutePressure::from_table_pa(pressure_pa),
        temperature: Temperature::from_table_k(temperature_k),
        dryness_fraction: x,
        enthalpy_j_kg: h_l + x * (h_v - h_l),
        entropy_j_kgk: s_l + x * (s_v - s_l),
        specific_volume_m3_kg: v,
        density_kg_m3: 1.0 / v,
    }
}

/// Wet steam at an absolute pressure and dryness fraction.
///
/// Range: the saturation line (see [`crate::saturation`]), 0 ≤ x ≤ 1.
/// Accuracy: h and s within the larger of the liquid and vapour bounds of
/// [`crate::accuracy`]; v and ρ within the larger relative density bound.
///
/// ```
/// use vapora_kernel::{mixture::wet_steam_at_pressure, units::AbsolutePressure};
/// let w = wet_steam_at_pressure(AbsolutePressure::from_bar(10.0)?, 0.95)?;
/// assert!((w.enthalpy_j_kg - 2676.5e3).abs() < 2e3);
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// [`MixtureError::DrynessFractionOutOfRange`] for NaN or x outside [0, 1],
/// [`MixtureError::Saturation`] outside the saturation tables.
pub fn wet_steam_at_pressure(
    pressure: AbsolutePressure,
    dryness_fraction: f32,
) -> Result<WetSteam, MixtureError> {
    let x = check_dryness(dryness_fraction)?;
    let (block, t, temperature_k) = interval_at_pressure(pressure)?;
    Ok(mix(block, t, temperature_k, pressure.as_pa(), x))
}

/// Wet steam at a saturation temperature and dryness fraction. Range and
/// accuracy as [`wet_steam_at_pressure`].
///
/// # Errors
/// [`MixtureError::DrynessFractionOutOfRange`] for NaN or x outside [0, 1],
/// [`MixtureError::Saturation`] outside the saturation tables.
pub fn wet_steam_at_temperature(
    temperature: Temperature,
    dryness_fraction: f32,
) -> Result<WetSteam, MixtureError> {
    let x = check_dryness(dryness_fraction)?;
    let (block, t) = interval_at_temperature(temperature)?;
    let pressure_pa = saturation::pressure_from_interval(block, t);
    Ok(mix(block, t, temperature.as_kelvin(), pressure_pa, x))
}
