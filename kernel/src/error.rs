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
