//! The measured accuracy of the compiled tables against the full IAPWS-IF97
//! formulation (f64), for a flow computer's uncertainty budget.
//!
//! The two constants are written by the table generator from its own
//! measurement: the f32 tables evaluated along the kernel's paths (from
//! temperature and from pressure) on a grid 64 times finer than the knots,
//! the largest deviation ×2 (margin for points between grid points), rounded
//! up to two significant digits. The
//! host tests (`host-tests/tests/saturation_kernel_accuracy.rs`) measure
//! the kernel itself on a denser grid plus random points and fail if it
//! exceeds these bounds or the bounds of the project's accuracy table.
//!
//! These are deviations from IF97, not from the real fluid: IF97 itself
//! differs from the scientific formulation IAPWS-95 by amounts its release
//! states (for example ±0.025 % in saturation pressure).

pub use crate::tables::saturation::{ACCURACY_BELOW_NEAR_CRITICAL, ACCURACY_NEAR_CRITICAL};

/// Start of the near-critical zone: Tc − 1 K = 646.096 K. Saturation
/// temperatures below it are covered by [`ACCURACY_BELOW_NEAR_CRITICAL`],
/// from it to Tc − 0.01 K by [`ACCURACY_NEAR_CRITICAL`].
pub const NEAR_CRITICAL_START_K: f32 = 646.096;

/// Upper end of the stated accuracy: Tc − 0.01 K = 647.086 K.
pub const STATED_ACCURACY_END_K: f32 = 647.086;

/// Largest deviation of each saturated property from IAPWS-IF97 in one zone
/// of the line. Relative bounds are |Δy|/y; absolute bounds carry units.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct SaturationAccuracy {
    /// Saturation temperature, K.
    pub temperature_k: f32,
    /// Saturation pressure, relative.
    pub pressure_relative: f32,
    /// ρ' (and v'), relative.
    pub liquid_density_relative: f32,
    /// ρ'' (and v''), relative.
    pub vapour_density_relative: f32,
    /// h', J/kg.
    pub liquid_enthalpy_j_kg: f32,
    /// h'', J/kg.
    pub vapour_enthalpy_j_kg: f32,
    /// s', J/(kg·K).
    pub liquid_entropy_j_kgk: f32,
    /// s'', J/(kg·K).
    pub vapour_entropy_j_kgk: f32,
    /// cp', relative.
    pub liquid_cp_relative: f32,
    /// cp'', relative.
    pub vapour_cp_relative: f32,
    /// Dryness fraction from (p, h) or (T, h): (|Δh'| + |Δh''|)/h_fg, the
    /// first-order bound for any x in [0, 1].
    pub dryness_fraction: f32,
}

/// The bounds that apply at a saturation temperature: the near-critical
/// ones from [`NEAR_CRITICAL_START_K`] up, otherwise the others.
pub fn accuracy_at_saturation_temperature_k(temperature_k: f32) -> &'static SaturationAccuracy {
    if temperature_k >= NEAR_CRITICAL_START_K {
        &ACCURACY_NEAR_CRITICAL
    } else {
        &ACCURACY_BELOW_NEAR_CRITICAL
    }
}
