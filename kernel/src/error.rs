//! The errors of the kernel, one enum per concern. Each carries the
//! offending value (and the limit it broke, where there is one) so a field
//! engineer can see from a log line what went wrong.

use core::fmt;

/// A quantity could not be constructed ([`crate::units`]).
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum UnitError {
    /// The number given was NaN or infinite (or a unit conversion overflowed).
    NotFinite {
        /// The value given, in the unit of the constructor called.
        value: f32,
    },
    /// An absolute pressure below 0 Pa.
    NegativeAbsolutePressure {
        /// The absolute pressure that resulted, Pa.
        pressure_pa: f32,
    },
    /// A temperature at or below absolute zero.
    NonPositiveTemperature {
        /// The temperature that resulted, K.
        temperature_k: f32,
    },
}

impl fmt::Display for UnitError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            Self::NotFinite { value } => write!(f, "value {value} is not a finite number"),
            Self::NegativeAbsolutePressure { pressure_pa } => {
                write!(f, "absolute pressure {pressure_pa} Pa is negative")
            }
            Self::NonPositiveTemperature { temperature_k } => {
                write!(
                    f,
                    "temperature {temperature_k} K is at or below absolute zero"
                )
            }
        }
    }
}

impl core::error::Error for UnitError {}

// ---- application routines (issue 5, branch apps): the one error of
// crate::flowing, crate::energy, crate::drum_level and crate::calorimeter.

/// An application routine could not give a result ([`crate::flowing`],
/// [`crate::energy`], [`crate::drum_level`], [`crate::calorimeter`]). Each
/// function names the variants it returns.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum ApplicationError {
    /// The single-phase state could not be computed (outside the envelope
    /// of [`crate::single_phase`], for example).
    SinglePhase(crate::single_phase::SinglePhaseError),
    /// The saturation line could not be used (pressure outside its tables).
    Saturation(SaturationError),
    /// The wet-steam mixture could not be computed.
    Mixture(MixtureError),
    /// Steam that must be superheated is at or below saturation (wet side):
    /// no single-phase vapour property is extrapolated there.
    SteamNotSuperheated {
        /// Superheat margin T − T_sat(p), K (≤ 0).
        superheat_margin_k: f32,
    },
    /// Water that must be subcooled is at or above saturation (it would
    /// flash): no liquid property is extrapolated there.
    WaterNotSubcooled {
        /// Subcooling margin T_sat(p) − T, K (≤ 0).
        subcooling_margin_k: f32,
    },
    /// An alarm threshold is NaN, infinite or negative.
    InvalidAlarmThreshold {
        /// The threshold given, K.
        threshold_k: f32,
    },
    /// A mass flow is NaN, infinite or negative, or so large that the
    /// energy flow overflows f32.
    InvalidMassFlow {
        /// The mass flow given, kg/s.
        mass_flow_kg_s: f32,
    },
    /// A specific enthalpy given is NaN or infinite.
    EnthalpyNotFinite {
        /// The value given, J/kg.
        enthalpy_j_kg: f32,
    },
    /// A drum-level transmitter setting is invalid: tap separation not
    /// positive and finite, zero mark outside the taps, or gravity not
    /// positive and finite.
    InvalidTransmitterGeometry {
        /// Vertical distance between the taps given, m.
        tap_separation_m: f32,
        /// Zero mark above the lower tap given, m.
        zero_level_above_lower_tap_m: f32,
        /// Acceleration of gravity given, m/s².
        gravity_m_s2: f32,
    },
    /// The differential-pressure reading is NaN or infinite.
    DifferentialPressureNotFinite {
        /// The reading given, Pa.
        differential_pressure_pa: f32,
    },
    /// Drum pressure below the transmitter's configured minimum for
    /// compensation (cold start-up: the drum is not at saturation and the
    /// condensate pot is not yet filling the reference leg).
    DrumPressureBelowStartUp {
        /// Drum pressure given, Pa (absolute).
        pressure_pa: f32,
        /// The configured minimum, Pa (absolute).
        minimum_pa: f32,
    },
    /// The reference leg is at or above the saturation temperature at drum
    /// pressure: it would not hold liquid.
    ReferenceLegNotSubcooled {
        /// Subcooling margin T_sat(p) − T_leg, K (≤ 0).
        subcooling_margin_k: f32,
    },
    /// The densities give no level: not positive and finite, the liquid
    /// not denser than the vapour (at or next to the critical point), or a
    /// level that overflows f32.
    NoDensityDifference {
        /// Liquid density used, kg/m³.
        liquid_density_kg_m3: f32,
        /// Vapour density used, kg/m³.
        vapour_density_kg_m3: f32,
        /// Reference-leg density used, kg/m³.
        reference_leg_density_kg_m3: f32,
    },
    /// The throttling calorimeter's outlet is not superheated: the method
    /// does not apply (the line steam is too wet for it).
    CalorimeterNotSuperheated {
        /// Superheat margin T_cal − T_sat(p_cal), K (≤ 0).
        superheat_margin_k: f32,
    },
    /// The calorimeter pressure is not below the line pressure (nothing is
    /// throttled).
    CalorimeterPressureNotBelowLine {
        /// Calorimeter pressure, Pa (absolute).
        calorimeter_pressure_pa: f32,
        /// Line pressure, Pa (absolute).
        line_pressure_pa: f32,
    },
    /// A collected mass of the separating calorimeter is NaN, infinite or
    /// negative, or the condensed steam mass is zero.
    InvalidSampleMass {
        /// Water collected by the separator, kg.
        separated_water_kg: f32,
        /// Steam condensed after the throttling calorimeter, kg.
        condensed_steam_kg: f32,
    },
}

impl From<crate::single_phase::SinglePhaseError> for ApplicationError {
    fn from(e: crate::single_phase::SinglePhaseError) -> Self {
        Self::SinglePhase(e)
    }
}

impl From<SaturationError> for ApplicationError {
    fn from(e: SaturationError) -> Self {
        Self::Saturation(e)
    }
}

impl From<MixtureError> for ApplicationError {
    fn from(e: MixtureError) -> Self {
        Self::Mixture(e)
    }
}

impl fmt::Display for ApplicationError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            Self::SinglePhase(e) => e.fmt(f),
            Self::Saturation(e) => e.fmt(f),
            Self::Mixture(e) => e.fmt(f),
            Self::SteamNotSuperheated { superheat_margin_k } => write!(
                f,
                "steam is not superheated (superheat margin {superheat_margin_k} K)"
            ),
            Self::WaterNotSubcooled {
                subcooling_margin_k,
            } => write!(
                f,
                "water is not subcooled (subcooling margin {subcooling_margin_k} K)"
            ),
            Self::InvalidAlarmThreshold { threshold_k } => write!(
                f,
                "alarm threshold {threshold_k} K is not a finite number of at least 0 K"
            ),
            Self::InvalidMassFlow { mass_flow_kg_s } => write!(
                f,
                "mass flow {mass_flow_kg_s} kg/s is not a usable finite number of at least 0 kg/s"
            ),
            Self::EnthalpyNotFinite { enthalpy_j_kg } => {
                write!(
                    f,
                    "specific enthalpy {enthalpy_j_kg} J/kg is not a finite number"
                )
            }
            Self::InvalidTransmitterGeometry {
                tap_separation_m,
                zero_level_above_lower_tap_m,
                gravity_m_s2,
            } => write!(
                f,
                "invalid level transmitter: taps {tap_separation_m} m apart, zero mark \
                 {zero_level_above_lower_tap_m} m above the lower tap, gravity {gravity_m_s2} m/s2"
            ),
            Self::DifferentialPressureNotFinite {
                differential_pressure_pa,
            } => write!(
                f,
                "differential pressure {differential_pressure_pa} Pa is not a finite number"
            ),
            Self::DrumPressureBelowStartUp {
                pressure_pa,
                minimum_pa,
            } => write!(
                f,
                "drum pressure {pressure_pa} Pa is below the start-up minimum {minimum_pa} Pa: \
                 level not compensated"
            ),
            Self::ReferenceLegNotSubcooled {
                subcooling_margin_k,
            } => write!(
                f,
                "reference leg is not subcooled (subcooling margin {subcooling_margin_k} K)"
            ),
            Self::NoDensityDifference {
                liquid_density_kg_m3,
                vapour_density_kg_m3,
                reference_leg_density_kg_m3,
            } => write!(
                f,
                "no level from densities: liquid {liquid_density_kg_m3} kg/m3, vapour \
                 {vapour_density_kg_m3} kg/m3, reference leg {reference_leg_density_kg_m3} kg/m3"
            ),
            Self::CalorimeterNotSuperheated { superheat_margin_k } => write!(
                f,
                "calorimeter outlet is not superheated (superheat margin {superheat_margin_k} K): \
                 the throttling method does not apply"
            ),
            Self::CalorimeterPressureNotBelowLine {
                calorimeter_pressure_pa,
                line_pressure_pa,
            } => write!(
                f,
                "calorimeter pressure {calorimeter_pressure_pa} Pa is not below the line \
                 pressure {line_pressure_pa} Pa"
            ),
            Self::InvalidSampleMass {
                separated_water_kg,
                condensed_steam_kg,
            } => write!(
                f,
                "invalid calorimeter sample: separated water {separated_water_kg} kg, condensed \
                 steam {condensed_steam_kg} kg"
            ),
        }
    }
}

impl core::error::Error for ApplicationError {
    fn source(&self) -> Option<&(dyn core::error::Error + 'static)> {
        match self {
            Self::SinglePhase(e) => Some(e),
            Self::Saturation(e) => Some(e),
            Self::Mixture(e) => Some(e),
            _ => None,
        }
    }
}
// ---- end of the application routines' error

/// A point is outside the saturation line the tables cover
/// ([`crate::saturation`]). With the default tables the line runs from the
/// triple point (273.16 K, 611.657 Pa) to the critical point (647.096 K,
/// 22.064 MPa), both ends included.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum SaturationError {
    /// Pressure below the lowest tabulated saturation pressure.
    PressureBelowRange {
        /// The pressure given, Pa (absolute).
        pressure_pa: f32,
        /// The lowest accepted pressure, Pa (the triple point by default).
        minimum_pa: f32,
    },
    /// Pressure above the highest tabulated saturation pressure.
    PressureAboveRange {
        /// The pressure given, Pa (absolute).
        pressure_pa: f32,
        /// The highest accepted pressure, Pa (the critical point by default).
        maximum_pa: f32,
    },
    /// Temperature below the lowest tabulated saturation temperature.
    TemperatureBelowRange {
        /// The temperature given, K.
        temperature_k: f32,
        /// The lowest accepted temperature, K (the triple point by default).
        minimum_k: f32,
    },
    /// Temperature above the highest tabulated saturation temperature.
    TemperatureAboveRange {
        /// The temperature given, K.
        temperature_k: f32,
        /// The highest accepted temperature, K (the critical point by default).
        maximum_k: f32,
    },
    /// A generated table has no intervals. The generator never writes one
    /// and a host test checks every committed table; the variant exists so
    /// that a broken table gives an error instead of a panic.
    EmptyTable,
}

impl fmt::Display for SaturationError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            Self::PressureBelowRange { pressure_pa, minimum_pa } => write!(
                f,
                "pressure {pressure_pa} Pa is below the saturation tables (minimum {minimum_pa} Pa)"
            ),
            Self::PressureAboveRange { pressure_pa, maximum_pa } => write!(
                f,
                "pressure {pressure_pa} Pa is above the saturation tables (maximum {maximum_pa} Pa)"
            ),
            Self::TemperatureBelowRange { temperature_k, minimum_k } => write!(
                f,
                "temperature {temperature_k} K is below the saturation tables (minimum {minimum_k} K)"
            ),
            Self::TemperatureAboveRange { temperature_k, maximum_k } => write!(
                f,
                "temperature {temperature_k} K is above the saturation tables (maximum {maximum_k} K)"
            ),
            Self::EmptyTable => write!(f, "a generated saturation table is empty"),
        }
    }
}

impl core::error::Error for SaturationError {}

/// The phase of a point could not be decided ([`crate::quality`]).
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum PhaseError {
    /// The pressure or temperature is below the saturation tables (above the
    /// critical point the answer is [`crate::quality::Phase::Supercritical`],
    /// not an error).
    Saturation(SaturationError),
    /// The specific enthalpy given was NaN or infinite.
    EnthalpyNotFinite {
        /// The value given, J/kg.
        enthalpy_j_kg: f32,
    },
    /// The specific entropy given was NaN or infinite.
    EntropyNotFinite {
        /// The value given, J/(kg·K).
        entropy_j_kgk: f32,
    },
    /// The specific volume given was NaN, infinite, zero or negative.
    SpecificVolumeNotPositive {
        /// The value given, m³/kg.
        specific_volume_m3_kg: f32,
    },
}

impl From<SaturationError> for PhaseError {
    fn from(e: SaturationError) -> Self {
        Self::Saturation(e)
    }
}

impl fmt::Display for PhaseError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            Self::Saturation(e) => e.fmt(f),
            Self::EnthalpyNotFinite { enthalpy_j_kg } => {
                write!(
                    f,
                    "specific enthalpy {enthalpy_j_kg} J/kg is not a finite number"
                )
            }
            Self::EntropyNotFinite { entropy_j_kgk } => {
                write!(
                    f,
                    "specific entropy {entropy_j_kgk} J/(kg K) is not a finite number"
                )
            }
            Self::SpecificVolumeNotPositive {
                specific_volume_m3_kg,
            } => {
                write!(
                    f,
                    "specific volume {specific_volume_m3_kg} m3/kg is not a positive finite number"
                )
            }
        }
    }
}

impl core::error::Error for PhaseError {
    fn source(&self) -> Option<&(dyn core::error::Error + 'static)> {
        match self {
            Self::Saturation(e) => Some(e),
            _ => None,
        }
    }
}

/// Wet-steam mixture properties could not be computed ([`crate::mixture`]).
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum MixtureError {
    /// The pressure or temperature is outside the saturation tables.
    Saturation(SaturationError),
    /// The dryness fraction was NaN or outside [0, 1].
    DrynessFractionOutOfRange {
        /// The value given (dimensionless, kg vapour per kg mixture).
        dryness_fraction: f32,
    },
}

impl From<SaturationError> for MixtureError {
    fn from(e: SaturationError) -> Self {
        Self::Saturation(e)
    }
}

impl fmt::Display for MixtureError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            Self::Saturation(e) => e.fmt(f),
            Self::DrynessFractionOutOfRange { dryness_fraction } => {
                write!(
                    f,
                    "dryness fraction {dryness_fraction} is not between 0 and 1"
                )
            }
        }
    }
}

impl core::error::Error for MixtureError {
    fn source(&self) -> Option<&(dyn core::error::Error + 'static)> {
        match self {
            Self::Saturation(e) => Some(e),
            Self::DrynessFractionOutOfRange { .. } => None,
        }
    }
}
