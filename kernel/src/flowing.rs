//! Flowing conditions for differential-pressure flow meters (orifice
//! plates, nozzles, Venturi tubes): density ρ, isentropic exponent κ and
//! dynamic viscosity μ at the measured line pressure and temperature, with
//! the distance from saturation and a configurable alarm on it.
//!
//! A DP meter's flow equation needs ρ at flowing conditions, its expansion
//! factor needs κ (gases and vapours only: for a liquid it is 1), and its
//! discharge coefficient needs the pipe Reynolds number
//! Re_D = 4·q_m/(π·D·μ). On a superheated steam line those come from
//! [`crate::single_phase::superheated_vapour`]; on a feedwater line from
//! [`crate::single_phase::compressed_liquid`]. The routines here add what
//! the meter's logic needs around them: the superheat margin T − T_sat(p)
//! (or the subcooling margin T_sat(p) − T of water) and an alarm flag when
//! it falls below a threshold the plant chooses. A reading on the wrong
//! side of saturation is an error saying so, never an extrapolated
//! property.
//!
//! # Wet steam
//! A saturated or wet steam line has no single-phase state: its pressure
//! fixes the saturation temperature, and density and enthalpy follow from
//! the dryness fraction x by the lever rule. That is
//! [`crate::mixture::wet_steam_at_pressure`] (range: the saturation line,
//! 611.657 Pa to 22.064 MPa, 0 ≤ x ≤ 1; accuracy: the saturated-property
//! bounds of [`crate::accuracy`], for example ρ within 20 ppm and h within
//! 10 J/kg below Tc − 1 K). The density it gives is the homogeneous
//! mixture's; a DP meter in wet steam over-reads and needs a wet-gas
//! correction this library does not make.
//!
//! Worked example (demo data: Harrowmere Works, an invented plant): the main
//! header at 10.5 bar(g) (1.151 325 MPa with 101.325 kPa ambient) carries
//! steam of dryness fraction 0.958 68 (the plant's demo steam-quality file):
//!
//! ```
//! use vapora_kernel::mixture::wet_steam_at_pressure;
//! use vapora_kernel::units::AbsolutePressure;
//! let header = AbsolutePressure::from_pa(1_151_325.0)?;
//! let steam = wet_steam_at_pressure(header, 0.958_68)?;
//! // f64 IAPWS-IF97: h = 2700.00 kJ/kg, ρ = 6.1392 kg/m³, T_sat = 186.10 °C.
//! assert!((steam.enthalpy_j_kg - 2_700.0e3).abs() < 50.0);
//! assert!((steam.density_kg_m3 - 6.1392).abs() < 1e-3);
//! assert!((steam.temperature.as_celsius() - 186.102).abs() < 1e-2);
//! # Ok::<(), Box<dyn core::error::Error>>(())
//! ```
//!
//! # Accuracy
//! The fields are those of the single-phase state (see
//! [`crate::single_phase`] for its bounds: ρ within 20 ppm, h within
//! 20 J/kg, κ and μ within 0.05 % outside the near-critical box); the
//! margins carry the error of the saturation temperature (below 1 mK, see
//! [`crate::accuracy`]).

use crate::error::ApplicationError;
use crate::single_phase::{
    compressed_liquid, superheated_vapour, SinglePhaseError, SinglePhaseState,
};
use crate::units::{AbsolutePressure, Temperature};

/// Density, enthalpy, isentropic exponent and viscosity of a metered
/// single-phase fluid at flowing conditions, with its distance from
/// saturation and the alarm on that distance.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct FlowingConditions {
    /// Line pressure (absolute), the input.
    pub pressure: AbsolutePressure,
    /// Line temperature, the input.
    pub temperature: Temperature,
    /// Density ρ at flowing conditions, kg/m³.
    pub density_kg_m3: f32,
    /// Specific enthalpy h, J/kg (IF97 reference), for an energy balance.
    pub enthalpy_j_kg: f32,
    /// Isentropic exponent κ (dimensionless), for the expansion factor of a
    /// DP meter in steam (a liquid's expansion factor is 1).
    pub isentropic_exponent: f32,
    /// Dynamic viscosity μ, Pa·s, for the Reynolds number.
    pub viscosity_pa_s: f32,
    /// Distance from saturation on the correct side, K: the superheat
    /// T − T_sat(p) of steam, the subcooling T_sat(p) − T of water; always
    /// positive when present. `None` at or above the critical pressure, where
    /// there is no saturation temperature.
    pub saturation_margin_k: Option<f32>,
    /// `true` when the margin is below the alarm threshold given ("superheat
    /// lost" for steam, "subcooling lost" for water). Never set when the
    /// margin is `None`.
    pub margin_alarm: bool,
}

/// The single-phase vapour error in the application's words.
pub(crate) fn vapour_error(e: SinglePhaseError) -> ApplicationError {
    match e {
        SinglePhaseError::NotSuperheated { margin_k } => ApplicationError::SteamNotSuperheated {
            superheat_margin_k: margin_k,
        },
        other => ApplicationError::SinglePhase(other),
    }
}

/// The single-phase liquid error in the application's words.
pub(crate) fn liquid_error(e: SinglePhaseError) -> ApplicationError {
    match e {
        SinglePhaseError::NotSubcooled { margin_k } => ApplicationError::WaterNotSubcooled {
            subcooling_margin_k: -margin_k,
        },
        other => ApplicationError::SinglePhase(other),
    }
}

fn check_threshold(threshold_k: f32) -> Result<f32, ApplicationError> {
    if threshold_k.is_finite() && threshold_k >= 0.0 {
        Ok(threshold_k)
    } else {
        Err(ApplicationError::InvalidAlarmThreshold { threshold_k })
    }
}

fn conditions(s: &SinglePhaseState, margin_k: Option<f32>, threshold_k: f32) -> FlowingConditions {
    FlowingConditions {
        pressure: s.pressure,
        temperature: s.temperature,
        density_kg_m3: s.density_kg_m3,
        enthalpy_j_kg: s.enthalpy_j_kg,
        isentropic_exponent: s.isentropic_exponent,
        viscosity_pa_s: s.viscosity_pa_s,
        saturation_margin_k: margin_k,
        margin_alarm: margin_k.is_some_and(|m| m < threshold_k),
    }
}

/// Flowing conditions of a superheated steam line at pressure p and
/// temperature T, with the superheat margin and a "superheat lost" alarm.
///
/// Inputs: line pressure (absolute) and temperature; `superheat_alarm_k`,
/// K (≥ 0): the alarm is raised when the superheat T − T_sat(p) is below
/// it (the plant's setting; a few kelvin above the temperature loop's
/// uncertainty is usual).
///
/// Range: the vapour side of [`crate::single_phase`] (611.657 Pa to 25 MPa,
/// up to 1073.15 K), T above T_sat(p). At and above the critical pressure
/// (22.064 MPa) there is no superheat: the margin is `None` and the alarm
/// is never raised. Accuracy: see the [module docs](self).
///
/// Worked example (demo data: Brannock Vale creamery, an invented plant):
/// steam header 2 reads 9.2 bar(g) (1.021 325 MPa with 101.325 kPa
/// ambient) and 190 °C after its small superheater; the plant's low
/// superheat alarm is set at 5 K.
///
/// ```
/// use vapora_kernel::flowing::steam_flowing_conditions;
/// use vapora_kernel::units::{AbsolutePressure, GaugePressure, Temperature};
/// let p = AbsolutePressure::from_gauge(
///     GaugePressure::from_bar(9.2)?,
///     AbsolutePressure::STANDARD_ATMOSPHERE,
/// )?;
/// let header = steam_flowing_conditions(p, Temperature::from_celsius(190.0)?, 5.0)?;
/// // f64 IAPWS-IF97 (and R12-08 for μ): ρ = 5.10683 kg/m³, κ = 1.29627,
/// // μ = 15.4240 µPa·s, h = 2802.08 kJ/kg, T_sat = 180.805 °C.
/// assert!((header.density_kg_m3 - 5.10683).abs() < 2e-4);
/// assert!((header.isentropic_exponent - 1.29627).abs() < 1e-3);
/// assert!((header.viscosity_pa_s - 15.4240e-6).abs() < 1e-8);
/// assert!((header.enthalpy_j_kg - 2_802.08e3).abs() < 30.0);
/// let superheat = header.saturation_margin_k.ok_or("no superheat")?;
/// assert!((superheat - 9.195).abs() < 2e-3);
/// assert!(!header.margin_alarm);
/// // 3 K of superheat is below the 5 K setting: the alarm is raised.
/// let low = steam_flowing_conditions(p, Temperature::from_celsius(183.8)?, 5.0)?;
/// assert!(low.margin_alarm);
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// [`ApplicationError::SteamNotSuperheated`] (with the margin, ≤ 0) when
/// T ≤ T_sat(p): the line is wet or saturated; use
/// [`crate::mixture::wet_steam_at_pressure`] with a dryness fraction
/// instead. [`ApplicationError::InvalidAlarmThreshold`] for a NaN, infinite
/// or negative threshold. [`ApplicationError::SinglePhase`] outside the
/// single-phase envelope.
pub fn steam_flowing_conditions(
    pressure: AbsolutePressure,
    temperature: Temperature,
    superheat_alarm_k: f32,
) -> Result<FlowingConditions, ApplicationError> {
    let threshold = check_threshold(superheat_alarm_k)?;
    let s = superheated_vapour(pressure, temperature).map_err(vapour_error)?;
    Ok(conditions(&s, s.saturation_margin_k, threshold))
}

/// Flowing conditions of a feedwater (compressed or subcooled water) line
/// at pressure p and temperature T, with the subcooling margin and a
/// "subcooling lost" alarm (the water is near flashing in the meter).
///
/// Inputs: line pressure (absolute) and temperature; `subcooling_alarm_k`,
/// K (≥ 0): the alarm is raised when T_sat(p) − T is below it. The
/// pressure drop across the meter lowers the local saturation
/// temperature, so the plant's setting should cover it.
///
/// Range: the liquid side of [`crate::single_phase`] (611.657 Pa to 25 MPa,
/// from 273.16 K), T below T_sat(p). At and above the critical pressure the
/// margin is `None` and the alarm is never raised. The isentropic exponent
/// of a liquid is large (about 1400 for feedwater) and the expansion
/// factor is 1; it is given for completeness. Accuracy: see the
/// [module docs](self).
///
/// Worked example (demo data: Harrowmere Works, an invented plant): the
/// boiler feed pump delivers 16 bar(a) at 118 °C from the deaerator; the
/// flow computer's subcooling alarm is set at 20 K.
///
/// ```
/// use vapora_kernel::flowing::water_flowing_conditions;
/// use vapora_kernel::units::{AbsolutePressure, Temperature};
/// let feed = water_flowing_conditions(
///     AbsolutePressure::from_bar(16.0)?,
///     Temperature::from_celsius(118.0)?,
///     20.0,
/// )?;
/// // f64 IAPWS-IF97 (and R12-08 for μ): ρ = 945.410 kg/m³,
/// // μ = 236.620 µPa·s, h = 496.288 kJ/kg, T_sat = 201.378 °C.
/// assert!((feed.density_kg_m3 - 945.410).abs() < 0.03);
/// assert!((feed.viscosity_pa_s - 236.620e-6).abs() < 2e-7);
/// assert!((feed.enthalpy_j_kg - 496.288e3).abs() < 30.0);
/// let subcooling = feed.saturation_margin_k.ok_or("no subcooling")?;
/// assert!((subcooling - 83.378).abs() < 2e-3);
/// assert!(!feed.margin_alarm);
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// [`ApplicationError::WaterNotSubcooled`] (with the margin, ≤ 0) when
/// T ≥ T_sat(p). [`ApplicationError::InvalidAlarmThreshold`] for a NaN,
/// infinite or negative threshold. [`ApplicationError::SinglePhase`]
/// outside the single-phase envelope.
pub fn water_flowing_conditions(
    pressure: AbsolutePressure,
    temperature: Temperature,
    subcooling_alarm_k: f32,
) -> Result<FlowingConditions, ApplicationError> {
    let threshold = check_threshold(subcooling_alarm_k)?;
    let s = compressed_liquid(pressure, temperature).map_err(liquid_error)?;
    Ok(conditions(&s, s.saturation_margin_k.map(|m| -m), threshold))
}
