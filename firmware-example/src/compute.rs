//! The steam computations of one scan. This is the only module that calls
//! the vapora kernel, so wiring the kernel in (or changing its API) touches
//! this file alone.
//! Every steam figure comes from the kernel; this module only picks which
//! kernel call a scan needs and maps the kernel's errors.

use vapora_kernel::error::{MixtureError, SaturationError, UnitError};
use vapora_kernel::mixture::wet_steam_at_pressure;
use vapora_kernel::saturation::saturated_state_at_pressure;
use vapora_kernel::units::{AbsolutePressure, GaugePressure};

use crate::scenario::{SATURATED_BAND_K, SUPERHEAT_ALARM_MARGIN_K};

/// What one scan hands to the steam computation (values already scaled,
/// range-checked and, where a transmitter faulted, held).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ScanInputs {
    /// Absolute header pressure, Pa.
    pub absolute_pressure_pa: f32,
    /// Header temperature, °C, if its transmitter has a usable value.
    pub header_temperature_c: Option<f32>,
    /// Steam mass flow, kg/s, if usable.
    pub mass_flow_kg_s: Option<f32>,
    /// Dryness fraction from the inline probe, if usable.
    pub dryness_fraction: Option<f32>,
}

/// The steam figures of one scan, all from the kernel.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SteamFigures {
    /// Saturation temperature at the header pressure, °C.
    pub saturation_temperature_c: f32,
    /// Header temperature minus saturation temperature, K (negative values
    /// mean the temperature reads below saturation: wet steam).
    pub superheat_margin_k: Option<f32>,
    /// Superheat margin below the plant's alarm setting
    /// ([`crate::scenario::SUPERHEAT_ALARM_MARGIN_K`]).
    pub superheat_low: bool,
    /// Density of saturated vapour at the header pressure, kg/m³.
    pub saturated_vapour_density_kg_m3: f32,
    /// Specific enthalpy of saturated vapour at the header pressure, J/kg.
    pub saturated_vapour_enthalpy_j_kg: f32,
    /// Specific enthalpy used for the energy flow, J/kg: wet steam at the
    /// probe's dryness fraction when the header is at saturation (margin
    /// below [`crate::scenario::SATURATED_BAND_K`]), saturated vapour
    /// otherwise (a lower bound for superheated steam).
    pub steam_enthalpy_j_kg: f32,
    /// Energy flow carried by the steam (mass flow × enthalpy), kW.
    pub energy_flow_kw: Option<f32>,
}

/// Why a scan has no steam figures.
#[derive(Debug, Clone, Copy, PartialEq)]
#[non_exhaustive]
pub enum ComputeError {
    /// The kernel's saturation functions are not in this build yet.
    KernelNotWired,
    /// A value the kernel's unit types reject.
    Unit(UnitError),
    /// Pressure outside the kernel's saturation tables.
    Saturation(SaturationError),
    /// Dryness fraction outside 0..=1, or pressure outside the tables.
    Mixture(MixtureError),
    /// Gauge plus ambient is not a usable absolute pressure (negative or
    /// not finite), Pa.
    InvalidAbsolutePressure {
        /// The offending sum, Pa.
        pressure_pa: f32,
    },
}

/// Whether this build computes steam figures with the kernel.
pub const KERNEL_WIRED: bool = true;

/// Absolute pressure from a gauge reading and the ambient (barometric)
/// pressure, Pa.
///
/// # Errors
/// [`ComputeError::Unit`] if either reading is not finite, the ambient is
/// negative, or the sum is negative (a vacuum reading deeper than the
/// ambient allows).
pub fn absolute_pressure_pa(gauge_pa: f32, ambient_pa: f32) -> Result<f32, ComputeError> {
    let gauge = GaugePressure::from_pa(gauge_pa).map_err(ComputeError::Unit)?;
    let ambient = AbsolutePressure::from_pa(ambient_pa).map_err(ComputeError::Unit)?;
    let absolute = AbsolutePressure::from_gauge(gauge, ambient).map_err(ComputeError::Unit)?;
    Ok(absolute.as_pa())
}

/// Saturation temperature, superheat margin and alarm, saturated-vapour
/// density and enthalpy, wet-steam enthalpy and energy flow for one scan.
///
/// # Errors
/// The kernel's errors: [`ComputeError::Unit`] for a non-finite or negative
/// pressure, [`ComputeError::Saturation`] outside the saturation tables,
/// [`ComputeError::Mixture`] for a dryness fraction outside 0..=1.
pub fn steam_figures(inputs: &ScanInputs) -> Result<SteamFigures, ComputeError> {
    let pressure =
        AbsolutePressure::from_pa(inputs.absolute_pressure_pa).map_err(ComputeError::Unit)?;
    let saturated = saturated_state_at_pressure(pressure).map_err(ComputeError::Saturation)?;
    let saturation_temperature_c = saturated.temperature.as_celsius();
    let superheat_margin_k = inputs
        .header_temperature_c
        .map(|t| t - saturation_temperature_c);
    let superheat_low = superheat_margin_k.is_some_and(|m| m < SUPERHEAT_ALARM_MARGIN_K);
    let steam_enthalpy_j_kg = match (superheat_margin_k, inputs.dryness_fraction) {
        (Some(margin), Some(x)) if margin < SATURATED_BAND_K => {
            wet_steam_at_pressure(pressure, x)
                .map_err(ComputeError::Mixture)?
                .enthalpy_j_kg
        }
        _ => saturated.vapour.enthalpy_j_kg,
    };
    Ok(SteamFigures {
        saturation_temperature_c,
        superheat_margin_k,
        superheat_low,
        saturated_vapour_density_kg_m3: saturated.vapour.density_kg_m3,
        saturated_vapour_enthalpy_j_kg: saturated.vapour.enthalpy_j_kg,
        steam_enthalpy_j_kg,
        // J/s to kW.
        energy_flow_kw: inputs
            .mass_flow_kg_s
            .map(|m| m * steam_enthalpy_j_kg / 1000.0),
    })
}
