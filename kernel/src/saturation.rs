//! The saturation line: saturation temperature from pressure, saturation
//! pressure from temperature, and the whole saturated state (both phases)
//! at a pressure or a temperature.
//!
//! # How a call works
//! A pressure needs no logarithm and no square root: the bit pattern of the
//! f32 p (below p_sat(623.15 K) = 16.53 MPa) or of pc − p (above) numbers
//! the interval of a table with a fixed number of intervals per octave of
//! its input (eight with the default tables); one look-up gives the
//! saturation temperature (or τ = √(Tc − T) near the critical point), and
//! one more look-up gives the interval of the state
//! table that every property of both phases shares. A temperature goes
//! straight to the state table (through τ above 623.15 K) and needs one
//! exponential for the pressure. There is no iteration and no search: the
//! instruction count does not depend on the input beyond the choice of
//! segment.
//!
//! # Range and accuracy
//! The default tables cover the whole line, from the triple point
//! (273.16 K, 611.657 Pa) to the critical point (647.096 K, 22.064 MPa),
//! both included; the limits of the compiled tables are
//! [`TEMPERATURE_MIN_K`], [`TEMPERATURE_MAX_K`], [`PRESSURE_MIN_PA`] and
//! [`PRESSURE_MAX_PA`]. Against the full IAPWS-IF97 formulation the results
//! are within [`crate::accuracy::ACCURACY_BELOW_NEAR_CRITICAL`] for
//! saturation temperatures below Tc − 1 K and within
//! [`crate::accuracy::ACCURACY_NEAR_CRITICAL`] from there to Tc − 0.01 K.
//! The last 0.01 K below the critical point is reached by extending the
//! fitted polynomials (the formulation's own iteration is not trusted that
//! close); no accuracy is stated there, and the heat capacities, which
//! diverge at the critical point, are capped at 1e10 J/(kg·K).
//!
//! At 623.15 K IF97 hands over from Regions 1 and 2 to Region 3, and its
//! saturated properties jump by a few 1e-5 relative; the tables are split
//! there and reproduce the jump.

use crate::error::SaturationError;
use crate::spline::{at_least, cubic};
use crate::tables::saturation as table;
use crate::units::{AbsolutePressure, Temperature};

pub use crate::tables::saturation::{
    PRESSURE_MAX_PA, PRESSURE_MIN_PA, TEMPERATURE_MAX_K, TEMPERATURE_MIN_K,
};

/// Smallest tabulated 1/cp used, kg·K/J: caps cp at 1e10 J/(kg·K) in the
/// extension of the tables to the critical point, where cp diverges.
const INVERSE_CP_FLOOR: f32 = 1e-10;

// Order of the quantities in a state-table interval (the generator's layout).
const LN_PRESSURE: usize = 0;
const LIQUID_DENSITY: usize = 1;
const VAPOUR_DENSITY_OVER_PRESSURE: usize = 2;
const LIQUID_ENTHALPY: usize = 3;
const VAPOUR_ENTHALPY: usize = 4;
const LIQUID_ENTROPY: usize = 5;
const VAPOUR_ENTROPY: usize = 6;
const LIQUID_INVERSE_CP: usize = 7;
const VAPOUR_INVERSE_CP: usize = 8;

type Block = [[f32; 4]; 9];

/// One phase at saturation.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct PhaseProperties {
    /// Density ρ, kg/m³.
    pub density_kg_m3: f32,
    /// Specific volume v = 1/ρ, m³/kg.
    pub specific_volume_m3_kg: f32,
    /// Specific enthalpy h, J/kg (IF97 reference: u = s = 0 for the liquid
    /// at the triple point).
    pub enthalpy_j_kg: f32,
    /// Specific entropy s, J/(kg·K).
    pub entropy_j_kgk: f32,
    /// Specific isobaric heat capacity cp, J/(kg·K).
    pub cp_j_kgk: f32,
}

/// Saturated liquid and saturated vapour at one point of the line.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct SaturatedState {
    /// Saturation pressure (absolute).
    pub pressure: AbsolutePressure,
    /// Saturation temperature.
    pub temperature: Temperature,
    /// Saturated liquid (′).
    pub liquid: PhaseProperties,
    /// Saturated vapour (″).
    pub vapour: PhaseProperties,
    /// Latent heat of vaporisation h_fg = h'' − h', J/kg.
    pub latent_heat_j_kg: f32,
    /// Entropy of vaporisation s_fg = s'' − s', J/(kg·K).
    pub entropy_of_vaporisation_j_kgk: f32,
}

/// One saturated property, for the single-property calls
/// [`saturated_property_at_pressure`] and [`saturated_property_at_temperature`].
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum SaturatedProperty {
    /// ρ' of the saturated liquid, kg/m³.
    LiquidDensity,
    /// ρ'' of the saturated vapour, kg/m³.
    VapourDensity,
    /// v' of the saturated liquid, m³/kg.
    LiquidSpecificVolume,
    /// v'' of the saturated vapour, m³/kg.
    VapourSpecificVolume,
    /// h' of the saturated liquid, J/kg.
    LiquidEnthalpy,
    /// h'' of the saturated vapour, J/kg.
    VapourEnthalpy,
    /// Latent heat h_fg = h'' − h', J/kg.
    LatentHeat,
    /// s' of the saturated liquid, J/(kg·K).
    LiquidEntropy,
    /// s'' of the saturated vapour, J/(kg·K).
    VapourEntropy,
    /// s_fg = s'' − s', J/(kg·K).
    EntropyOfVaporisation,
    /// cp' of the saturated liquid, J/(kg·K).
    LiquidCp,
    /// cp'' of the saturated vapour, J/(kg·K).
    VapourCp,
}

/// Which state table a point falls in.
#[derive(Clone, Copy)]
enum Segment {
    /// Below 623.15 K, variable T.
    Low,
    /// From 623.15 K, variable τ = √(Tc − T).
    High,
}

/// The error for a pressure outside the tables (the rare path of
/// [`line_at_pressure`]).
#[cold]
fn pressure_error(p_pa: f32) -> SaturationError {
    if p_pa > PRESSURE_MAX_PA {
        SaturationError::PressureAboveRange {
            pressure_pa: p_pa,
            maximum_pa: PRESSURE_MAX_PA,
        }
    } else {
        // Below the minimum, and the unit type's -0.0 (whose bit pattern is
        // above every positive one).
        SaturationError::PressureBelowRange {
            pressure_pa: p_pa,
            minimum_pa: PRESSURE_MIN_PA,
        }
    }
}

const PRESSURE_MIN_BITS: u32 = PRESSURE_MIN_PA.to_bits();
const PRESSURE_SPAN_BITS: u32 = PRESSURE_MAX_PA.to_bits() - PRESSURE_MIN_PA.to_bits();
const BOUNDARY_PRESSURE_BITS: u32 = table::BOUNDARY_PRESSURE_PA.to_bits();
const CRITICAL_PRESSURE_BITS: u32 = table::CRITICAL_PRESSURE_PA.to_bits();

fn check_temperature(t_k: f32) -> Result<(), SaturationError> {
    if t_k < TEMPERATURE_MIN_K {
        return Err(SaturationError::TemperatureBelowRange {
            temperature_k: t_k,
            minimum_k: TEMPERATURE_MIN_K,
        });
    }
    if t_k > TEMPERATURE_MAX_K {
        return Err(SaturationError::TemperatureAboveRange {
            temperature_k: t_k,
            maximum_k: TEMPERATURE_MAX_K,
        });
    }
    Ok(())
}

/// The point of the line at a pressure: segment, state-table variable, T.
///
/// No logarithm and no root: the temperature tables are indexed on the f32
/// bit pattern of p (below the boundary) or of pc − p (above it), see
/// [`crate::spline::OctaveCubicTable`].
#[inline]
fn line_at_pressure(p_pa: f32) -> Result<(Segment, f32, f32), SaturationError> {
    // Positive f32 values are ordered as their bit patterns read as
    // unsigned integers, so integer compares (cheaper than float compares
    // on a Cortex-M4F, and no soft-float calls on an M0/M3) check the range
    // and pick the segment. One subtraction and one unsigned compare test
    // both ends: below the minimum the difference wraps round to a huge
    // number. NaN and negative patterns fail it too.
    let bits = p_pa.to_bits();
    if bits.wrapping_sub(PRESSURE_MIN_BITS) > PRESSURE_SPAN_BITS {
        return Err(pressure_error(p_pa));
    }
    if bits < BOUNDARY_PRESSURE_BITS {
        let (c, t) = table::TEMPERATURE_LOW
            .locate(p_pa)
            .ok_or(SaturationError::EmptyTable)?;
        let temperature_k = cubic(&c[0], t);
        Ok((Segment::Low, temperature_k, temperature_k))
    } else {
        let tau = if bits < CRITICAL_PRESSURE_BITS {
            // Exact in f32 (Sterbenz: p ≥ pc/2 here). Above 2^24 Pa an f32
            // pressure is an even number of pascals, so q ≥ 2 Pa, where the
            // table starts.
            let q = table::CRITICAL_PRESSURE_PA - p_pa;
            let (c, t) = table::TEMPERATURE_HIGH
                .locate(q)
                .ok_or(SaturationError::EmptyTable)?;
            at_least(cubic(&c[0], t), 0.0)
        } else {
            // τ = 0 exactly at the critical pressure.
            0.0
        };
        Ok((
            Segment::High,
            tau,
            table::CRITICAL_TEMPERATURE_K - tau * tau,
        ))
    }
}

/// The point of the line at a temperature: segment and state-table variable.
#[inline]
fn line_at_temperature(t_k: f32) -> Result<(Segment, f32), SaturationError> {
    check_temperature(t_k)?;
    if t_k < table::BOUNDARY_TEMPERATURE_K {
        Ok((Segment::Low, t_k))
    } else {
        // t_k ≤ TEMPERATURE_MAX_K ≤ CRITICAL_TEMPERATURE_K, so the root is real.
        Ok((
            Segment::High,
            libm::sqrtf(at_least(table::CRITICAL_TEMPERATURE_K - t_k, 0.0)),
        ))
    }
}

#[inline]
fn state_interval(segment: Segment, x: f32) -> Result<(&'static Block, f32), SaturationError> {
    match segment {
        Segment::Low => table::STATE_LOW.locate(x),
        Segment::High => table::STATE_HIGH.locate(x),
    }
    .ok_or(SaturationError::EmptyTable)
}

/// Where the line is for a pressure: the shared state-table interval, the
/// position in it and the saturation temperature. For the other modules.
#[inline]
pub(crate) fn interval_at_pressure(
    p: AbsolutePressure,
) -> Result<(&'static Block, f32, f32), SaturationError> {
    let (segment, x, temperature_k) = line_at_pressure(p.as_pa())?;
    let (block, t) = state_interval(segment, x)?;
    Ok((block, t, temperature_k))
}

/// The same for a temperature: the shared interval and the position in it.
#[inline]
pub(crate) fn interval_at_temperature(
    t: Temperature,
) -> Result<(&'static Block, f32), SaturationError> {
    let (segment, x) = line_at_temperature(t.as_kelvin())?;
    state_interval(segment, x)
}

#[inline]
pub(crate) fn pressure_from_interval(block: &Block, t: f32) -> f32 {
    libm::expf(cubic(&block[LN_PRESSURE], t))
}

#[inline]
pub(crate) fn liquid_enthalpy(block: &Block, t: f32) -> f32 {
    cubic(&block[LIQUID_ENTHALPY], t)
}

#[inline]
pub(crate) fn vapour_enthalpy(block: &Block, t: f32) -> f32 {
    cubic(&block[VAPOUR_ENTHALPY], t)
}

#[inline]
pub(crate) fn liquid_entropy(block: &Block, t: f32) -> f32 {
    cubic(&block[LIQUID_ENTROPY], t)
}

#[inline]
pub(crate) fn vapour_entropy(block: &Block, t: f32) -> f32 {
    cubic(&block[VAPOUR_ENTROPY], t)
}

#[inline]
pub(crate) fn liquid_density(block: &Block, t: f32) -> f32 {
    cubic(&block[LIQUID_DENSITY], t)
}

#[inline]
pub(crate) fn vapour_density(block: &Block, t: f32, pressure_pa: f32) -> f32 {
    pressure_pa * cubic(&block[VAPOUR_DENSITY_OVER_PRESSURE], t)
}

#[inline]
fn liquid_cp(block: &Block, t: f32) -> f32 {
    1.0 / at_least(cubic(&block[LIQUID_INVERSE_CP], t), INVERSE_CP_FLOOR)
}

#[inline]
fn vapour_cp(block: &Block, t: f32) -> f32 {
    1.0 / at_least(cubic(&block[VAPOUR_INVERSE_CP], t), INVERSE_CP_FLOOR)
}

fn state_from_interval(
    block: &Block,
    t: f32,
    temperature_k: f32,
    pressure_pa: f32,
) -> SaturatedState {
    let liquid_density_kg_m3 = liquid_density(block, t);
    let vapour_density_kg_m3 = vapour_density(block, t, pressure_pa);
    let liquid = PhaseProperties {
        density_kg_m3: liquid_density_kg_m3,
        specific_volume_m3_kg: 1.0 / liquid_density_kg_m3,
        enthalpy_j_kg: liquid_enthalpy(block, t),
        entropy_j_kgk: liquid_entropy(block, t),
        cp_j_kgk: liquid_cp(block, t),
    };
    let vapour = PhaseProperties {
        density_kg_m3: vapour_density_kg_m3,
        specific_volume_m3_kg: 1.0 / vapour_density_kg_m3,
        enthalpy_j_kg: vapour_enthalpy(block, t),
        entropy_j_kgk: vapour_entropy(block, t),
        cp_j_kgk: vapour_cp(block, t),
    };
    SaturatedState {
        pressure: AbsolutePressure::from_table_pa(pressure_pa),
        temperature: Temperature::from_table_k(temperature_k),
        latent_heat_j_kg: vapour.enthalpy_j_kg - liquid.enthalpy_j_kg,
        entropy_of_vaporisation_j_kgk: vapour.entropy_j_kgk - liquid.entropy_j_kgk,
        liquid,
        vapour,
    }
}

fn property_from_interval(
    block: &Block,
    t: f32,
    pressure_pa: f32,
    property: SaturatedProperty,
) -> f32 {
    match property {
        SaturatedProperty::LiquidDensity => liquid_density(block, t),
        SaturatedProperty::VapourDensity => vapour_density(block, t, pressure_pa),
        SaturatedProperty::LiquidSpecificVolume => 1.0 / liquid_density(block, t),
        SaturatedProperty::VapourSpecificVolume => 1.0 / vapour_density(block, t, pressure_pa),
        SaturatedProperty::LiquidEnthalpy => liquid_enthalpy(block, t),
        SaturatedProperty::VapourEnthalpy => vapour_enthalpy(block, t),
        SaturatedProperty::LatentHeat => vapour_enthalpy(block, t) - liquid_enthalpy(block, t),
        SaturatedProperty::LiquidEntropy => liquid_entropy(block, t),
        SaturatedProperty::VapourEntropy => vapour_entropy(block, t),
        SaturatedProperty::EntropyOfVaporisation => {
            vapour_entropy(block, t) - liquid_entropy(block, t)
        }
        SaturatedProperty::LiquidCp => liquid_cp(block, t),
        SaturatedProperty::VapourCp => vapour_cp(block, t),
    }
}

/// Saturation temperature at an absolute pressure (the boiling point).
///
/// Range: [`PRESSURE_MIN_PA`] to [`PRESSURE_MAX_PA`] (611.657 Pa to
/// 22.064 MPa with the default tables). Accuracy against IAPWS-IF97
/// (Eq. 31): `temperature_k` of [`crate::accuracy::ACCURACY_BELOW_NEAR_CRITICAL`]
/// (below Tc − 1 K) and [`crate::accuracy::ACCURACY_NEAR_CRITICAL`].
///
/// ```
/// use vapora_kernel::{saturation::saturation_temperature, units::AbsolutePressure};
/// let t = saturation_temperature(AbsolutePressure::STANDARD_ATMOSPHERE)?;
/// assert!((t.as_celsius() - 99.97).abs() < 0.01);
/// # Ok::<(), vapora_kernel::error::SaturationError>(())
/// ```
///
/// # Errors
/// [`SaturationError::PressureBelowRange`] below the triple point,
/// [`SaturationError::PressureAboveRange`] above the critical point.
pub fn saturation_temperature(pressure: AbsolutePressure) -> Result<Temperature, SaturationError> {
    let (_, _, temperature_k) = line_at_pressure(pressure.as_pa())?;
    Ok(Temperature::from_table_k(temperature_k))
}

/// Saturation pressure at a temperature (the vapour pressure).
///
/// Range: [`TEMPERATURE_MIN_K`] to [`TEMPERATURE_MAX_K`] (273.16 K to
/// 647.096 K with the default tables). Accuracy against IAPWS-IF97 (Eq. 30):
/// `pressure_relative` of the accuracy constants.
///
/// ```
/// use vapora_kernel::{saturation::saturation_pressure, units::Temperature};
/// let p = saturation_pressure(Temperature::from_celsius(200.0)?)?;
/// assert!((p.as_mpa() - 1.5549).abs() < 1e-3);
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// [`SaturationError::TemperatureBelowRange`] below the triple point,
/// [`SaturationError::TemperatureAboveRange`] above the critical point.
pub fn saturation_pressure(temperature: Temperature) -> Result<AbsolutePressure, SaturationError> {
    let (block, t) = interval_at_temperature(temperature)?;
    Ok(AbsolutePressure::from_table_pa(pressure_from_interval(
        block, t,
    )))
}

/// The saturated liquid and vapour at an absolute pressure, in one call that
/// shares one table look-up between all properties.
///
/// Range as [`saturation_temperature`]. Accuracy: the per-property bounds
/// of [`crate::accuracy`]; `pressure` is the input.
///
/// ```
/// use vapora_kernel::{saturation::saturated_state_at_pressure, units::AbsolutePressure};
/// let s = saturated_state_at_pressure(AbsolutePressure::from_bar(10.0)?)?;
/// assert!((s.temperature.as_celsius() - 179.88).abs() < 0.01);
/// assert!((s.latent_heat_j_kg - 2014.6e3).abs() < 1e3);
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// As [`saturation_temperature`].
pub fn saturated_state_at_pressure(
    pressure: AbsolutePressure,
) -> Result<SaturatedState, SaturationError> {
    let (block, t, temperature_k) = interval_at_pressure(pressure)?;
    Ok(state_from_interval(
        block,
        t,
        temperature_k,
        pressure.as_pa(),
    ))
}

/// The saturated liquid and vapour at a temperature, in one call that
/// shares one table look-up between all properties.
///
/// Range as [`saturation_pressure`]. Accuracy: the per-property bounds of
/// [`crate::accuracy`]; `temperature` is the input.
///
/// # Errors
/// As [`saturation_pressure`].
pub fn saturated_state_at_temperature(
    temperature: Temperature,
) -> Result<SaturatedState, SaturationError> {
    let (block, t) = interval_at_temperature(temperature)?;
    let pressure_pa = pressure_from_interval(block, t);
    Ok(state_from_interval(
        block,
        t,
        temperature.as_kelvin(),
        pressure_pa,
    ))
}

/// One saturated property at an absolute pressure, for code that needs a
/// single number (units: see [`SaturatedProperty`]).
///
/// Range and accuracy as [`saturated_state_at_pressure`].
///
/// # Errors
/// As [`saturation_temperature`].
pub fn saturated_property_at_pressure(
    pressure: AbsolutePressure,
    property: SaturatedProperty,
) -> Result<f32, SaturationError> {
    let (block, t, _) = interval_at_pressure(pressure)?;
    Ok(property_from_interval(block, t, pressure.as_pa(), property))
}

/// One saturated property at a temperature (units: see
/// [`SaturatedProperty`]). The vapour density and volume need the
/// saturation pressure, which costs one exponential more.
///
/// Range and accuracy as [`saturated_state_at_temperature`].
///
/// # Errors
/// As [`saturation_pressure`].
pub fn saturated_property_at_temperature(
    temperature: Temperature,
    property: SaturatedProperty,
) -> Result<f32, SaturationError> {
    let (block, t) = interval_at_temperature(temperature)?;
    let pressure_pa = match property {
        SaturatedProperty::VapourDensity | SaturatedProperty::VapourSpecificVolume => {
            pressure_from_interval(block, t)
        }
        _ => 0.0,
    };
    Ok(property_from_interval(block, t, pressure_pa, property))
}
