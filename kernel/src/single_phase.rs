//! Single-phase states: compressed (subcooled) liquid and superheated vapour
//! from (p, T), and the state across phases from (p, h) or (p, s).
//!
// TEMPORARY STAND-IN: replaced by the table-based module from branch sp at merge.
// This file implements the public API of /work/wt/contract/single_phase_api.rs by
// calling the f64 IAPWS-IF97 formulation in `vapora-tables` (with its iterative
// Region 3 solver and backward inversions) and rounding to f32. It exists only so
// that the application routines (flowing, energy, drum_level, calorimeter) can be
// built and tested before the table-based module lands. Drop this file, the
// `vapora-tables` dependency of the kernel and the stand-in blocks in
// host-tests/src/robustness.rs and tools/no-panic-check/src/main.rs at merge.
//!
//! Range: pressure [`PRESSURE_MIN_PA`] to [`PRESSURE_MAX_PA`], temperature
//! [`TEMPERATURE_MIN_K`] to [`TEMPERATURE_MAX_K`]. Accuracy: that of the f64
//! formulation rounded to f32 (the table-based module states its own).
//! Errors: [`SinglePhaseError`].

use core::fmt;

use vapora_tables::if97::{inverse, pt, region1, region2, viscosity, Properties};

use crate::mixture::{wet_steam_at_pressure, WetSteam};
use crate::saturation;
use crate::units::{AbsolutePressure, Temperature};

/// Lowest pressure of the single-phase envelope, Pa (the triple point).
pub const PRESSURE_MIN_PA: f32 = 611.657;
/// Highest pressure of the single-phase envelope, Pa.
pub const PRESSURE_MAX_PA: f32 = 25.0e6;
/// Lowest temperature of the single-phase envelope, K (the triple point).
pub const TEMPERATURE_MIN_K: f32 = 273.16;
/// Highest temperature of the single-phase envelope, K.
pub const TEMPERATURE_MAX_K: f32 = 1073.15;

/// Critical pressure, Pa (IAPWS R7-97(2012)).
const CRITICAL_PRESSURE_PA: f32 = 22.064e6;
/// Critical temperature, K: the stand-in's liquid/vapour split above pc.
const CRITICAL_TEMPERATURE_K: f32 = 647.096;
/// Top of Region 1, K.
const REGION1_MAX_K: f32 = 623.15;

/// A single-phase state (compressed/subcooled liquid, superheated vapour, or
/// supercritical fluid).
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct SinglePhaseState {
    /// Pressure (absolute), the input.
    pub pressure: AbsolutePressure,
    /// Temperature.
    pub temperature: Temperature,
    /// ρ, kg/m³.
    pub density_kg_m3: f32,
    /// v = 1/ρ, m³/kg.
    pub specific_volume_m3_kg: f32,
    /// h, J/kg (IF97 reference).
    pub enthalpy_j_kg: f32,
    /// s, J/(kg·K).
    pub entropy_j_kgk: f32,
    /// cp, J/(kg·K).
    pub cp_j_kgk: f32,
    /// w, m/s.
    pub speed_of_sound_m_s: f32,
    /// Isentropic exponent κ = (ρ/p)·w² (dimensionless).
    pub isentropic_exponent: f32,
    /// Dynamic viscosity μ, Pa·s (IAPWS R12-08 industrial form).
    pub viscosity_pa_s: f32,
    /// T − T_sat(p), K: > 0 superheat of a vapour, < 0 subcooling of a
    /// liquid. `None` at or above the critical pressure.
    pub saturation_margin_k: Option<f32>,
}

/// Which side of the phase boundary a state is on.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum FluidState {
    /// Below T_sat(p) (or, above pc, below the split).
    CompressedLiquid(SinglePhaseState),
    /// Inside the dome.
    WetSteam(WetSteam),
    /// Above T_sat(p) (or above the split when p ≥ pc).
    SuperheatedVapour(SinglePhaseState),
}

/// Why a single-phase call gave no state.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum SinglePhaseError {
    /// Pressure below the envelope.
    PressureBelowRange {
        /// Pressure given, Pa.
        pressure_pa: f32,
        /// Lowest accepted, Pa.
        minimum_pa: f32,
    },
    /// Pressure above the envelope.
    PressureAboveRange {
        /// Pressure given, Pa.
        pressure_pa: f32,
        /// Highest accepted, Pa.
        maximum_pa: f32,
    },
    /// Temperature below the envelope.
    TemperatureBelowRange {
        /// Temperature given, K.
        temperature_k: f32,
        /// Lowest accepted, K.
        minimum_k: f32,
    },
    /// Temperature above the envelope.
    TemperatureAboveRange {
        /// Temperature given, K.
        temperature_k: f32,
        /// Highest accepted, K.
        maximum_k: f32,
    },
    /// `superheated_vapour` called at T ≤ T_sat(p).
    NotSuperheated {
        /// T − T_sat(p) (≤ 0), K.
        margin_k: f32,
    },
    /// `compressed_liquid` called at T ≥ T_sat(p).
    NotSubcooled {
        /// T − T_sat(p) (≥ 0), K.
        margin_k: f32,
    },
    /// Enthalpy NaN or infinite.
    EnthalpyNotFinite {
        /// Value given, J/kg.
        enthalpy_j_kg: f32,
    },
    /// Enthalpy outside the envelope at this pressure.
    EnthalpyOutOfRange {
        /// Value given, J/kg.
        enthalpy_j_kg: f32,
        /// Lowest accepted, J/kg.
        minimum_j_kg: f32,
        /// Highest accepted, J/kg.
        maximum_j_kg: f32,
    },
    /// Entropy NaN or infinite.
    EntropyNotFinite {
        /// Value given, J/(kg·K).
        entropy_j_kgk: f32,
    },
    /// Entropy outside the envelope at this pressure.
    EntropyOutOfRange {
        /// Value given, J/(kg·K).
        entropy_j_kgk: f32,
        /// Lowest accepted, J/(kg·K).
        minimum_j_kgk: f32,
        /// Highest accepted, J/(kg·K).
        maximum_j_kgk: f32,
    },
    /// A table is empty or malformed (stand-in: the formulation failed).
    EmptyTable,
}

impl fmt::Display for SinglePhaseError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            Self::PressureBelowRange { pressure_pa, minimum_pa } => write!(
                f,
                "pressure {pressure_pa} Pa is below the single-phase tables (minimum {minimum_pa} Pa)"
            ),
            Self::PressureAboveRange { pressure_pa, maximum_pa } => write!(
                f,
                "pressure {pressure_pa} Pa is above the single-phase tables (maximum {maximum_pa} Pa)"
            ),
            Self::TemperatureBelowRange { temperature_k, minimum_k } => write!(
                f,
                "temperature {temperature_k} K is below the single-phase tables (minimum {minimum_k} K)"
            ),
            Self::TemperatureAboveRange { temperature_k, maximum_k } => write!(
                f,
                "temperature {temperature_k} K is above the single-phase tables (maximum {maximum_k} K)"
            ),
            Self::NotSuperheated { margin_k } => {
                write!(f, "not superheated: T - Tsat = {margin_k} K")
            }
            Self::NotSubcooled { margin_k } => write!(f, "not subcooled: T - Tsat = {margin_k} K"),
            Self::EnthalpyNotFinite { enthalpy_j_kg } => {
                write!(f, "enthalpy {enthalpy_j_kg} J/kg is not a finite number")
            }
            Self::EnthalpyOutOfRange { enthalpy_j_kg, minimum_j_kg, maximum_j_kg } => write!(
                f,
                "enthalpy {enthalpy_j_kg} J/kg is outside {minimum_j_kg} to {maximum_j_kg} J/kg"
            ),
            Self::EntropyNotFinite { entropy_j_kgk } => {
                write!(f, "entropy {entropy_j_kgk} J/(kg K) is not a finite number")
            }
            Self::EntropyOutOfRange { entropy_j_kgk, minimum_j_kgk, maximum_j_kgk } => write!(
                f,
                "entropy {entropy_j_kgk} J/(kg K) is outside {minimum_j_kgk} to {maximum_j_kgk} J/(kg K)"
            ),
            Self::EmptyTable => write!(f, "a single-phase table is empty"),
        }
    }
}

impl core::error::Error for SinglePhaseError {}

fn check_range(p: f32, t: f32) -> Result<(), SinglePhaseError> {
    if p < PRESSURE_MIN_PA {
        return Err(SinglePhaseError::PressureBelowRange {
            pressure_pa: p,
            minimum_pa: PRESSURE_MIN_PA,
        });
    }
    if p > PRESSURE_MAX_PA {
        return Err(SinglePhaseError::PressureAboveRange {
            pressure_pa: p,
            maximum_pa: PRESSURE_MAX_PA,
        });
    }
    if t < TEMPERATURE_MIN_K {
        return Err(SinglePhaseError::TemperatureBelowRange {
            temperature_k: t,
            minimum_k: TEMPERATURE_MIN_K,
        });
    }
    if t > TEMPERATURE_MAX_K {
        return Err(SinglePhaseError::TemperatureAboveRange {
            temperature_k: t,
            maximum_k: TEMPERATURE_MAX_K,
        });
    }
    Ok(())
}

/// T − T_sat(p) below pc, `None` from pc up.
fn margin(p: AbsolutePressure, t: f32) -> Option<f32> {
    if p.as_pa() >= CRITICAL_PRESSURE_PA {
        return None;
    }
    saturation::saturation_temperature(p)
        .ok()
        .map(|ts| t - ts.as_kelvin())
}

fn to_f32(v: f64) -> Result<f32, SinglePhaseError> {
    let x = v as f32;
    if x.is_finite() {
        Ok(x)
    } else {
        Err(SinglePhaseError::EmptyTable)
    }
}

fn build(
    p: AbsolutePressure,
    t: f32,
    props: &Properties,
    margin_k: Option<f32>,
) -> Result<SinglePhaseState, SinglePhaseError> {
    let mu = viscosity::viscosity_pa_s_unchecked(props.density_kg_m3, f64::from(t));
    Ok(SinglePhaseState {
        pressure: p,
        temperature: Temperature::from_table_k(t),
        density_kg_m3: to_f32(props.density_kg_m3)?,
        specific_volume_m3_kg: to_f32(props.specific_volume_m3_kg)?,
        enthalpy_j_kg: to_f32(props.enthalpy_j_kg)?,
        entropy_j_kgk: to_f32(props.entropy_j_kgk)?,
        cp_j_kgk: to_f32(props.cp_j_kgk)?,
        speed_of_sound_m_s: to_f32(props.speed_of_sound_m_s)?,
        isentropic_exponent: to_f32(props.isentropic_exponent)?,
        viscosity_pa_s: to_f32(mu)?,
        saturation_margin_k: margin_k,
    })
}

fn vapour_unchecked(
    p: AbsolutePressure,
    t: f32,
    m: Option<f32>,
) -> Result<SinglePhaseState, SinglePhaseError> {
    let (pf, tf) = (f64::from(p.as_pa()), f64::from(t));
    let props = if t <= REGION1_MAX_K {
        region2::properties_unchecked(pf, tf)
    } else {
        pt::properties_pt(pf, tf).map_err(|_| SinglePhaseError::EmptyTable)?
    };
    build(p, t, &props, m)
}

fn liquid_unchecked(
    p: AbsolutePressure,
    t: f32,
    m: Option<f32>,
) -> Result<SinglePhaseState, SinglePhaseError> {
    let (pf, tf) = (f64::from(p.as_pa()), f64::from(t));
    let props = if t <= REGION1_MAX_K {
        region1::properties_unchecked(pf, tf)
    } else {
        pt::properties_pt(pf, tf).map_err(|_| SinglePhaseError::EmptyTable)?
    };
    build(p, t, &props, m)
}

/// Superheated vapour at (p, T) (stand-in: the f64 formulation).
///
/// # Errors
/// Range errors outside the envelope, [`SinglePhaseError::NotSuperheated`]
/// at T ≤ T_sat(p) (or below the split above pc).
pub fn superheated_vapour(
    pressure: AbsolutePressure,
    temperature: Temperature,
) -> Result<SinglePhaseState, SinglePhaseError> {
    let t = temperature.as_kelvin();
    check_range(pressure.as_pa(), t)?;
    let m = margin(pressure, t);
    match m {
        Some(margin_k) if margin_k <= 0.0 => Err(SinglePhaseError::NotSuperheated { margin_k }),
        None if t < CRITICAL_TEMPERATURE_K => Err(SinglePhaseError::NotSuperheated {
            margin_k: t - CRITICAL_TEMPERATURE_K,
        }),
        _ => vapour_unchecked(pressure, t, m),
    }
}

/// Compressed (subcooled) liquid at (p, T) (stand-in: the f64 formulation).
///
/// # Errors
/// Range errors outside the envelope, [`SinglePhaseError::NotSubcooled`]
/// at T ≥ T_sat(p) (or at or above the split above pc).
pub fn compressed_liquid(
    pressure: AbsolutePressure,
    temperature: Temperature,
) -> Result<SinglePhaseState, SinglePhaseError> {
    let t = temperature.as_kelvin();
    check_range(pressure.as_pa(), t)?;
    let m = margin(pressure, t);
    match m {
        Some(margin_k) if margin_k >= 0.0 => Err(SinglePhaseError::NotSubcooled { margin_k }),
        None if t >= CRITICAL_TEMPERATURE_K => Err(SinglePhaseError::NotSubcooled {
            margin_k: t - CRITICAL_TEMPERATURE_K,
        }),
        _ => liquid_unchecked(pressure, t, m),
    }
}

/// Either single phase, chosen from T against T_sat(p).
///
/// # Errors
/// As [`superheated_vapour`]; exactly on saturation `NotSuperheated` with
/// margin 0.
pub fn state_at_pressure_temperature(
    pressure: AbsolutePressure,
    temperature: Temperature,
) -> Result<FluidState, SinglePhaseError> {
    let t = temperature.as_kelvin();
    check_range(pressure.as_pa(), t)?;
    let split = match margin(pressure, t) {
        Some(m) => m,
        None => t - CRITICAL_TEMPERATURE_K,
    };
    if split == 0.0 {
        return Err(SinglePhaseError::NotSuperheated { margin_k: 0.0 });
    }
    if split > 0.0 {
        superheated_vapour(pressure, temperature).map(FluidState::SuperheatedVapour)
    } else {
        compressed_liquid(pressure, temperature).map(FluidState::CompressedLiquid)
    }
}

enum Second {
    Enthalpy,
    Entropy,
}

fn across(
    pressure: AbsolutePressure,
    y: f32,
    which: Second,
) -> Result<FluidState, SinglePhaseError> {
    let p = pressure.as_pa();
    if !y.is_finite() {
        return Err(match which {
            Second::Enthalpy => SinglePhaseError::EnthalpyNotFinite { enthalpy_j_kg: y },
            Second::Entropy => SinglePhaseError::EntropyNotFinite { entropy_j_kgk: y },
        });
    }
    check_range(p, TEMPERATURE_MIN_K)?;
    if p < CRITICAL_PRESSURE_PA {
        if let Ok(sat) = saturation::saturated_state_at_pressure(pressure) {
            let (yl, yv) = match which {
                Second::Enthalpy => (sat.liquid.enthalpy_j_kg, sat.vapour.enthalpy_j_kg),
                Second::Entropy => (sat.liquid.entropy_j_kgk, sat.vapour.entropy_j_kgk),
            };
            if y >= yl && y <= yv && yv > yl {
                let x = (y - yl) / (yv - yl);
                return wet_steam_at_pressure(pressure, x)
                    .map(FluidState::WetSteam)
                    .map_err(|_| SinglePhaseError::EmptyTable);
            }
        }
    }
    let out_of_range = match which {
        Second::Enthalpy => SinglePhaseError::EnthalpyOutOfRange {
            enthalpy_j_kg: y,
            minimum_j_kg: 0.0,
            maximum_j_kg: f32::MAX,
        },
        Second::Entropy => SinglePhaseError::EntropyOutOfRange {
            entropy_j_kgk: y,
            minimum_j_kgk: 0.0,
            maximum_j_kgk: f32::MAX,
        },
    };
    let r = match which {
        Second::Enthalpy => inverse::temperature_ph(f64::from(p), f64::from(y)),
        Second::Entropy => inverse::temperature_ps(f64::from(p), f64::from(y)),
    };
    let t = match r {
        Ok((t, _)) => t as f32,
        Err(_) => return Err(out_of_range),
    };
    let t = t.clamp(TEMPERATURE_MIN_K, TEMPERATURE_MAX_K);
    let m = margin(pressure, t);
    let vapour = match m {
        Some(m) => m > 0.0,
        None => t >= CRITICAL_TEMPERATURE_K,
    };
    if vapour {
        vapour_unchecked(pressure, t, m).map(FluidState::SuperheatedVapour)
    } else {
        liquid_unchecked(pressure, t, m).map(FluidState::CompressedLiquid)
    }
}

/// Across phases from (p, h) (stand-in: the f64 formulation's inversion).
///
/// # Errors
/// Range errors, [`SinglePhaseError::EnthalpyNotFinite`],
/// [`SinglePhaseError::EnthalpyOutOfRange`].
pub fn state_at_pressure_enthalpy(
    pressure: AbsolutePressure,
    enthalpy_j_kg: f32,
) -> Result<FluidState, SinglePhaseError> {
    across(pressure, enthalpy_j_kg, Second::Enthalpy)
}

/// Across phases from (p, s) (stand-in: the f64 formulation's inversion).
///
/// # Errors
/// Range errors, [`SinglePhaseError::EntropyNotFinite`],
/// [`SinglePhaseError::EntropyOutOfRange`].
pub fn state_at_pressure_entropy(
    pressure: AbsolutePressure,
    entropy_j_kgk: f32,
) -> Result<FluidState, SinglePhaseError> {
    across(pressure, entropy_j_kgk, Second::Entropy)
}
