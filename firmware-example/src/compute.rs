//! The steam computations of one scan. This is the only module that calls
//! the vapora kernel, so wiring the kernel in (or changing its API) touches
//! this file alone.
//!
//! Until the kernel's saturation functions land, [`steam_figures`] returns
//! [`ComputeError::KernelNotWired`] and the scan reports no steam figures:
//! the firmware never prints steam numbers that the kernel did not compute.

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
    /// Gauge plus ambient is not a usable absolute pressure (negative or
    /// not finite), Pa.
    InvalidAbsolutePressure {
        /// The offending sum, Pa.
        pressure_pa: f32,
    },
}

/// Whether this build computes steam figures with the kernel.
pub const KERNEL_WIRED: bool = false;

/// Absolute pressure from a gauge reading and the ambient (barometric)
/// pressure, Pa.
///
/// # Errors
/// [`ComputeError::InvalidAbsolutePressure`] if the sum is negative or not
/// finite (a vacuum reading deeper than the ambient allows).
pub fn absolute_pressure_pa(gauge_pa: f32, ambient_pa: f32) -> Result<f32, ComputeError> {
    // When the kernel lands: units::AbsolutePressure::from_gauge, which
    // makes the same checks.
    let pressure_pa = gauge_pa + ambient_pa;
    if pressure_pa.is_finite() && pressure_pa >= 0.0 {
        Ok(pressure_pa)
    } else {
        Err(ComputeError::InvalidAbsolutePressure { pressure_pa })
    }
}

/// Saturation temperature, superheat margin and alarm, saturated-vapour
/// density and enthalpy, wet-steam enthalpy and energy flow for one scan.
///
/// # Errors
/// [`ComputeError::KernelNotWired`] until the kernel is wired in; then the
/// kernel's own errors (pressure outside its range, dryness outside 0..=1).
pub fn steam_figures(inputs: &ScanInputs) -> Result<SteamFigures, ComputeError> {
    // Wiring the kernel in: replace this body with
    // saturated_state_at_pressure(p) and wet_steam_at_pressure(p, x) on a
    // units::AbsolutePressure built from `inputs.absolute_pressure_pa`, map
    // the kernel's errors into ComputeError variants and set KERNEL_WIRED.
    // See README.md, "Wiring the kernel in".
    let _ = inputs;
    Err(ComputeError::KernelNotWired)
}
