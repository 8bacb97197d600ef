//! Energy flow of a steam supply: the heat delivered by a mass flow of
//! steam that returns as feedwater or condensate,
//!
//! ```text
//! Φ = q_m · (h_steam − h_water)        W = kg/s · J/kg
//! ```
//!
//! with h_steam from the steam's pressure and temperature (superheated) or
//! pressure and dryness fraction (wet), and h_water from the water's
//! pressure and temperature (compressed or subcooled liquid). Units are in
//! the names: mass flow in kg/s, enthalpies in J/kg, the energy flow in W.
//!
//! Accuracy: |ΔΦ| ≤ q_m·(|Δh_steam| + |Δh_water|) plus f32 rounding (a few
//! parts in 10⁷ of q_m·h_steam): with the single-phase bound of 20 J/kg on
//! each enthalpy ([`crate::single_phase`]; 10 J/kg for wet steam below
//! Tc − 1 K, [`crate::accuracy`]), 40 J/kg times the mass flow, 56 W for
//! 1.39 kg/s. The uncertainty of the mass-flow measurement is usually far
//! larger.

use crate::error::ApplicationError;
use crate::flowing::{liquid_error, vapour_error};
use crate::mixture::wet_steam_at_pressure;
use crate::single_phase::{compressed_liquid, superheated_vapour};
use crate::units::{AbsolutePressure, Temperature};

/// The state of the steam delivered.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub enum SteamSupply {
    /// Superheated steam at a pressure and temperature (T > T_sat(p)).
    Superheated {
        /// Line pressure (absolute).
        pressure: AbsolutePressure,
        /// Line temperature.
        temperature: Temperature,
    },
    /// Wet (or dry saturated) steam at a pressure and dryness fraction
    /// x, kg vapour per kg mixture, 0 ≤ x ≤ 1.
    Wet {
        /// Line pressure (absolute).
        pressure: AbsolutePressure,
        /// Dryness fraction x.
        dryness_fraction: f32,
    },
}

/// The energy flow and the enthalpies it came from.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct EnergyFlow {
    /// Energy flow Φ = q_m·(h_steam − h_water), W (negative if the water
    /// is the hotter; it never is for a steam supply).
    pub energy_flow_w: f32,
    /// Mass flow q_m, kg/s, the input.
    pub mass_flow_kg_s: f32,
    /// h of the steam, J/kg.
    pub steam_enthalpy_j_kg: f32,
    /// h of the feedwater or condensate return, J/kg.
    pub water_enthalpy_j_kg: f32,
}

/// Energy flow from a mass flow and two specific enthalpies:
/// Φ = q_m·(h_steam − h_water), W.
///
/// Inputs: `mass_flow_kg_s` ≥ 0, kg/s; the enthalpies in J/kg (any finite
/// values, on the IF97 reference of the rest of the kernel). Accuracy:
/// f32 rounding of the product (the enthalpies' own errors add as in the
/// [module docs](self)).
///
/// ```
/// use vapora_kernel::energy::energy_flow_from_enthalpies_w;
/// // 2 kg/s delivering 1 MJ/kg: 2 MW.
/// let phi = energy_flow_from_enthalpies_w(2.0, 2_800.0e3, 1_800.0e3)?;
/// assert_eq!(phi, 2.0e6);
/// # Ok::<(), vapora_kernel::error::ApplicationError>(())
/// ```
///
/// # Errors
/// [`ApplicationError::InvalidMassFlow`] for a NaN, infinite or negative
/// mass flow, or one so large that the product overflows f32;
/// [`ApplicationError::EnthalpyNotFinite`] for a NaN or infinite enthalpy.
pub fn energy_flow_from_enthalpies_w(
    mass_flow_kg_s: f32,
    steam_enthalpy_j_kg: f32,
    water_enthalpy_j_kg: f32,
) -> Result<f32, ApplicationError> {
    if !(mass_flow_kg_s.is_finite() && mass_flow_kg_s >= 0.0) {
        return Err(ApplicationError::InvalidMassFlow { mass_flow_kg_s });
    }
    for h in [steam_enthalpy_j_kg, water_enthalpy_j_kg] {
        if !h.is_finite() {
            return Err(ApplicationError::EnthalpyNotFinite { enthalpy_j_kg: h });
        }
    }
    let difference = steam_enthalpy_j_kg - water_enthalpy_j_kg;
    let phi = mass_flow_kg_s * difference;
    if phi.is_finite() && difference.is_finite() {
        Ok(phi)
    } else {
        Err(ApplicationError::InvalidMassFlow { mass_flow_kg_s })
    }
}

/// Energy flow of a steam supply whose water comes back as feedwater or
/// condensate at a pressure and temperature.
///
/// Inputs: `mass_flow_kg_s` ≥ 0, kg/s; the steam as [`SteamSupply`]; the
/// water's pressure (absolute) and temperature, below T_sat of its
/// pressure. Range: the steam side that of
/// [`crate::single_phase::superheated_vapour`] or
/// [`crate::mixture::wet_steam_at_pressure`]; the water side that of
/// [`crate::single_phase::compressed_liquid`]. Accuracy: see the
/// [module docs](self).
///
/// Worked example (demo data: Brannock Vale creamery, an invented plant):
/// steam header 2 carries 1.390 625 kg/s (12.90 mA on its 0–2.5 kg/s
/// meter) at 9.2 bar(g) and 190 °C to the pasteurisers; the condensate
/// comes back to the boiler house at 3 bar(a) and 85 °C.
///
/// ```
/// use vapora_kernel::energy::{energy_flow, SteamSupply};
/// use vapora_kernel::units::{AbsolutePressure, GaugePressure, Temperature};
/// let header = SteamSupply::Superheated {
///     pressure: AbsolutePressure::from_gauge(
///         GaugePressure::from_bar(9.2)?,
///         AbsolutePressure::STANDARD_ATMOSPHERE,
///     )?,
///     temperature: Temperature::from_celsius(190.0)?,
/// };
/// let flow = energy_flow(
///     1.390_625,
///     header,
///     AbsolutePressure::from_bar(3.0)?,
///     Temperature::from_celsius(85.0)?,
/// )?;
/// // f64 IAPWS-IF97: h_steam = 2802.080 kJ/kg, h_water = 356.136 kJ/kg,
/// // Φ = 3.401 391 MW.
/// assert!((flow.energy_flow_w - 3.401_391e6).abs() < 100.0);
/// assert!((flow.water_enthalpy_j_kg - 356.136e3).abs() < 30.0);
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// Those of [`energy_flow_from_enthalpies_w`];
/// [`ApplicationError::SteamNotSuperheated`] for a `Superheated` supply at
/// or below saturation; [`ApplicationError::Mixture`] for a `Wet` supply
/// outside the saturation line or with x outside [0, 1];
/// [`ApplicationError::WaterNotSubcooled`] for water at or above T_sat of
/// its pressure; [`ApplicationError::SinglePhase`] outside the single-phase
/// envelope.
pub fn energy_flow(
    mass_flow_kg_s: f32,
    steam: SteamSupply,
    water_pressure: AbsolutePressure,
    water_temperature: Temperature,
) -> Result<EnergyFlow, ApplicationError> {
    let steam_enthalpy_j_kg = match steam {
        SteamSupply::Superheated {
            pressure,
            temperature,
        } => {
            superheated_vapour(pressure, temperature)
                .map_err(vapour_error)?
                .enthalpy_j_kg
        }
        SteamSupply::Wet {
            pressure,
            dryness_fraction,
        } => wet_steam_at_pressure(pressure, dryness_fraction)?.enthalpy_j_kg,
    };
    let water_enthalpy_j_kg = compressed_liquid(water_pressure, water_temperature)
        .map_err(liquid_error)?
        .enthalpy_j_kg;
    let energy_flow_w =
        energy_flow_from_enthalpies_w(mass_flow_kg_s, steam_enthalpy_j_kg, water_enthalpy_j_kg)?;
    Ok(EnergyFlow {
        energy_flow_w,
        mass_flow_kg_s,
        steam_enthalpy_j_kg,
        water_enthalpy_j_kg,
    })
}
