//! Dryness fraction of line steam by throttling calorimeter, and by the
//! combined separating-and-throttling calorimeter.
//!
//! # Throttling
//! A sample of the line steam is throttled through a valve or orifice into
//! a small insulated chamber at a lower pressure p_cal, where its
//! temperature T_cal is read. Throttling keeps the enthalpy (no work, no
//! heat, negligible change of kinetic energy), so if the chamber is
//! superheated its state fixes h, and at line pressure p_line
//!
//! ```text
//! h_line = h(p_cal, T_cal)                      (superheated vapour)
//! x      = (h_line − h'(p_line)) / (h''(p_line) − h'(p_line))
//! ```
//!
//! The method applies only when the chamber is superheated,
//! T_cal > T_sat(p_cal): wetter line steam stays wet after throttling and
//! its temperature says nothing about x. With the chamber at atmospheric
//! pressure that limits the method to line steam drier than about x = 0.95
//! at 10 bar(a) (h'' of the atmosphere is 2675.5 kJ/kg, h' + 0.95·h_fg at
//! 10 bar(a) 2676.4 kJ/kg; IF97 figures, checked in the host tests).
//!
//! # Separating and throttling
//! Wetter steam first passes a mechanical separator that collects a mass
//! m_w of water; the steam leaving it is throttled as above (dryness x_t)
//! and condensed, m_s. The separator's dryness is x_s = m_s/(m_s + m_w)
//! (the collected water was liquid, the condensed mass carries the dry
//! steam), and the line steam's dryness is the product x = x_s·x_t.
//!
//! # Accuracy
//! From the enthalpy bounds: |Δx| ≤ (|Δh_cal| + |Δh'| + x·|Δh_fg|)/h_fg with
//! Δh_cal within 20 J/kg ([`crate::single_phase`]) and the saturated
//! enthalpies within 10 J/kg below Tc − 1 K ([`crate::accuracy`]), about
//! 2e-5 at 10 bar(a). The calorimeter's heat loss and the thermometer's
//! error are far larger in practice (1 K at the chamber is about 1e-3
//! in x).

use crate::error::ApplicationError;
use crate::flowing::vapour_error;
use crate::saturation::{saturated_state_at_pressure, saturation_temperature};
use crate::single_phase::superheated_vapour;
use crate::units::{AbsolutePressure, Temperature};

/// The result of a throttling calorimeter reading.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct ThrottlingCalorimeterReading {
    /// Dryness fraction x of the line steam, 0 to 1 (1 when
    /// [`ThrottlingCalorimeterReading::line_steam_dry`] is set).
    pub dryness_fraction: f32,
    /// Specific enthalpy of the line steam, J/kg (that of the chamber).
    pub line_enthalpy_j_kg: f32,
    /// Superheat of the chamber T_cal − T_sat(p_cal), K (> 0).
    pub calorimeter_superheat_k: f32,
    /// `true` when h_line ≥ h''(p_line): the line steam is dry saturated or
    /// superheated, and `dryness_fraction` is 1.
    pub line_steam_dry: bool,
}

/// The result of a separating-and-throttling calorimeter reading.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct SeparatingThrottlingReading {
    /// Dryness fraction of the line steam x = x_s·x_t.
    pub dryness_fraction: f32,
    /// The separator's dryness x_s = m_s/(m_s + m_w).
    pub separator_dryness_fraction: f32,
    /// The throttling stage (the steam after the separator), x_t.
    pub throttling: ThrottlingCalorimeterReading,
}

/// Dryness fraction of line steam from a throttling calorimeter (method in
/// the [module docs](self)).
///
/// Inputs: line pressure and calorimeter chamber pressure (absolute,
/// p_cal < p_line) and chamber temperature. Range: line pressure on the
/// saturation line (611.657 Pa to 22.064 MPa); the chamber in the vapour
/// side of [`crate::single_phase`]. Accuracy: see the
/// [module docs](self).
///
/// Worked example (demo data: Harrowmere Works, an invented plant): a
/// sample from the main header at 10.5 bar(g) (1.151 325 MPa with
/// 101.325 kPa ambient) is throttled to the atmosphere, 101.325 kPa, and
/// the chamber reads 112 °C.
///
/// ```
/// use vapora_kernel::calorimeter::throttling_calorimeter_dryness;
/// use vapora_kernel::error::ApplicationError;
/// use vapora_kernel::units::{AbsolutePressure, Temperature};
/// let line = AbsolutePressure::from_pa(1_151_325.0)?;
/// let chamber = AbsolutePressure::STANDARD_ATMOSPHERE;
/// let r = throttling_calorimeter_dryness(line, chamber, Temperature::from_celsius(112.0)?)?;
/// // f64 IAPWS-IF97: h = 2700.244 kJ/kg, T_sat(p_cal) = 99.974 °C, x = 0.958 80.
/// assert!((r.dryness_fraction - 0.958_80).abs() < 5e-5);
/// assert!((r.calorimeter_superheat_k - 12.026).abs() < 2e-3);
/// assert!(!r.line_steam_dry);
/// // At 99.9 °C the chamber is wet: the method does not apply.
/// let wet = throttling_calorimeter_dryness(line, chamber, Temperature::from_celsius(99.9)?);
/// assert!(matches!(wet, Err(ApplicationError::CalorimeterNotSuperheated { superheat_margin_k })
///     if superheat_margin_k < 0.0));
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// [`ApplicationError::CalorimeterNotSuperheated`] (with the margin,
/// ≤ 0) when T_cal ≤ T_sat(p_cal);
/// [`ApplicationError::CalorimeterPressureNotBelowLine`] for
/// p_cal ≥ p_line; [`ApplicationError::Saturation`] for a line pressure
/// outside the saturation tables; [`ApplicationError::SinglePhase`] for a
/// chamber outside the single-phase envelope.
pub fn throttling_calorimeter_dryness(
    line_pressure: AbsolutePressure,
    calorimeter_pressure: AbsolutePressure,
    calorimeter_temperature: Temperature,
) -> Result<ThrottlingCalorimeterReading, ApplicationError> {
    if calorimeter_pressure.as_pa() >= line_pressure.as_pa() {
        return Err(ApplicationError::CalorimeterPressureNotBelowLine {
            calorimeter_pressure_pa: calorimeter_pressure.as_pa(),
            line_pressure_pa: line_pressure.as_pa(),
        });
    }
    let line = saturated_state_at_pressure(line_pressure)?;
    // The chamber is below the line pressure, so on the saturation line too.
    let t_sat = saturation_temperature(calorimeter_pressure)?;
    let superheat = calorimeter_temperature.as_kelvin() - t_sat.as_kelvin();
    if superheat <= 0.0 {
        return Err(ApplicationError::CalorimeterNotSuperheated {
            superheat_margin_k: superheat,
        });
    }
    let chamber =
        superheated_vapour(calorimeter_pressure, calorimeter_temperature).map_err(|e| {
            match vapour_error(e) {
                ApplicationError::SteamNotSuperheated { superheat_margin_k } => {
                    ApplicationError::CalorimeterNotSuperheated { superheat_margin_k }
                }
                other => other,
            }
        })?;
    let h = chamber.enthalpy_j_kg;
    let h_liquid = line.liquid.enthalpy_j_kg;
    let h_vapour = line.vapour.enthalpy_j_kg;
    let line_steam_dry = h >= h_vapour;
    let dryness_fraction = if line_steam_dry {
        1.0
    } else {
        // h'' > h' on the line below pc, and h > h': the chamber's h is at
        // least h'' at a lower pressure, above every h' of the line. The
        // clamp only guards against rounding.
        ((h - h_liquid) / (h_vapour - h_liquid)).clamp(0.0, 1.0)
    };
    Ok(ThrottlingCalorimeterReading {
        dryness_fraction,
        line_enthalpy_j_kg: h,
        calorimeter_superheat_k: superheat,
        line_steam_dry,
    })
}

/// Dryness fraction of line steam from a separating-and-throttling
/// calorimeter: x = x_s·x_t (method in the [module docs](self)).
///
/// Inputs: as [`throttling_calorimeter_dryness`] for the throttling stage,
/// plus the masses collected over the test: `separated_water_kg` ≥ 0, kg,
/// from the separator, and `condensed_steam_kg` > 0, kg, condensed after
/// the throttling calorimeter. Range and accuracy: those of
/// [`throttling_calorimeter_dryness`]; x_s is exact up to f32 rounding.
///
/// Worked example (demo data: Harrowmere Works, an invented plant): in a
/// ten-minute test on the main header the separator collects 0.45 kg of
/// water and 8.6 kg of steam is condensed after the throttling chamber,
/// which reads 112 °C at 101.325 kPa.
///
/// ```
/// use vapora_kernel::calorimeter::separating_throttling_dryness;
/// use vapora_kernel::units::{AbsolutePressure, Temperature};
/// let r = separating_throttling_dryness(
///     AbsolutePressure::from_pa(1_151_325.0)?,
///     AbsolutePressure::STANDARD_ATMOSPHERE,
///     Temperature::from_celsius(112.0)?,
///     0.45,
///     8.6,
/// )?;
/// // x_s = 8.6/9.05 = 0.950 276; f64 IAPWS-IF97: x_t = 0.958 80, x = 0.911 13.
/// assert!((r.separator_dryness_fraction - 0.950_276).abs() < 1e-6);
/// assert!((r.dryness_fraction - 0.911_13).abs() < 5e-5);
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// Those of [`throttling_calorimeter_dryness`];
/// [`ApplicationError::InvalidSampleMass`] for a NaN, infinite or negative
/// mass, or a condensed mass of zero.
pub fn separating_throttling_dryness(
    line_pressure: AbsolutePressure,
    calorimeter_pressure: AbsolutePressure,
    calorimeter_temperature: Temperature,
    separated_water_kg: f32,
    condensed_steam_kg: f32,
) -> Result<SeparatingThrottlingReading, ApplicationError> {
    let total = separated_water_kg + condensed_steam_kg;
    let valid = separated_water_kg.is_finite()
        && separated_water_kg >= 0.0
        && condensed_steam_kg.is_finite()
        && condensed_steam_kg > 0.0
        && total.is_finite();
    if !valid {
        return Err(ApplicationError::InvalidSampleMass {
            separated_water_kg,
            condensed_steam_kg,
        });
    }
    let throttling = throttling_calorimeter_dryness(
        line_pressure,
        calorimeter_pressure,
        calorimeter_temperature,
    )?;
    // m_s ≤ total, so x_s is in (0, 1]; the clamp guards against rounding.
    let separator_dryness_fraction = (condensed_steam_kg / total).clamp(0.0, 1.0);
    Ok(SeparatingThrottlingReading {
        dryness_fraction: separator_dryness_fraction * throttling.dryness_fraction,
        separator_dryness_fraction,
        throttling,
    })
}
