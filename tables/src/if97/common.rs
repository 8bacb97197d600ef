//! Types and constants shared by every region of the formulation.

use core::fmt;

/// Specific gas constant of ordinary water used by IAPWS-IF97, J/(kg·K)
/// (IAPWS R7-97(2012), Eq. 1: R = 0.461 526 kJ kg⁻¹ K⁻¹).
pub const SPECIFIC_GAS_CONSTANT_J_KGK: f64 = 461.526;
/// Critical temperature, K (IAPWS R7-97(2012), Eq. 3).
pub const CRITICAL_TEMPERATURE_K: f64 = 647.096;
/// Critical pressure, Pa (IAPWS R7-97(2012), Eq. 4: 22.064 MPa).
pub const CRITICAL_PRESSURE_PA: f64 = 22.064e6;
/// Critical density, kg/m³ (IAPWS R7-97(2012), Eq. 5).
pub const CRITICAL_DENSITY_KG_M3: f64 = 322.0;
/// Triple-point temperature, K (IAPWS R7-97(2012), section 4).
pub const TRIPLE_POINT_TEMPERATURE_K: f64 = 273.16;
/// Triple-point pressure, Pa: psat(273.16 K) from the Region 4 equation,
/// 611.657 Pa as given in IAPWS R7-97(2012), section 8.1.
pub const TRIPLE_POINT_PRESSURE_PA: f64 = 611.657;

/// The regions of IAPWS-IF97 (IAPWS R7-97(2012), Fig. 1).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Region {
    /// Region 1: compressed (subcooled) liquid, 273.15 K to 623.15 K.
    Region1,
    /// Region 2: superheated vapour (and the metastable-vapour extension).
    Region2,
    /// Region 3: the near-critical region bounded by 623.15 K and the B23 line.
    Region3,
    /// Region 4: the saturation line (two-phase).
    Region4,
    /// Region 5: high-temperature steam, 1073.15 K to 2273.15 K, p ≤ 50 MPa.
    Region5,
}

/// The thermodynamic state of a single phase at one point, in SI base units.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Properties {
    /// Absolute pressure, Pa.
    pub pressure_pa: f64,
    /// Temperature, K.
    pub temperature_k: f64,
    /// Density, kg/m³.
    pub density_kg_m3: f64,
    /// Specific volume, m³/kg.
    pub specific_volume_m3_kg: f64,
    /// Specific enthalpy, J/kg.
    pub enthalpy_j_kg: f64,
    /// Specific internal energy, J/kg.
    pub internal_energy_j_kg: f64,
    /// Specific entropy, J/(kg·K).
    pub entropy_j_kgk: f64,
    /// Specific isobaric heat capacity, J/(kg·K).
    pub cp_j_kgk: f64,
    /// Specific isochoric heat capacity, J/(kg·K).
    pub cv_j_kgk: f64,
    /// Speed of sound, m/s.
    pub speed_of_sound_m_s: f64,
    /// Isentropic exponent κ = −(v/p)(∂p/∂v)_s, dimensionless.
    pub isentropic_exponent: f64,
}

/// Why the formulation could not give a value.
#[derive(Debug, Clone, Copy, PartialEq)]
#[non_exhaustive]
pub enum FormulationError {
    /// An input was NaN or infinite.
    NotFinite,
    /// Pressure outside the range of the equation asked for, Pa.
    PressureOutOfRange {
        /// The pressure given, Pa.
        pressure_pa: f64,
    },
    /// Temperature outside the range of the equation asked for, K.
    TemperatureOutOfRange {
        /// The temperature given, K.
        temperature_k: f64,
    },
    /// Density outside the range of the equation asked for, kg/m³.
    DensityOutOfRange {
        /// The density given, kg/m³.
        density_kg_m3: f64,
    },
    /// The (p, T) point lies outside every region of IAPWS-IF97.
    OutsideFormulation {
        /// Pressure, Pa.
        pressure_pa: f64,
        /// Temperature, K.
        temperature_k: f64,
    },
    /// A second input (enthalpy or entropy) is outside the range reachable at
    /// the given pressure.
    PropertyOutOfRange,
    /// An iterative solution did not converge (should not happen inside the
    /// documented range; report it as a bug).
    NoConvergence,
}

impl fmt::Display for FormulationError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            Self::NotFinite => write!(f, "input is NaN or infinite"),
            Self::PressureOutOfRange { pressure_pa } => {
                write!(
                    f,
                    "pressure {pressure_pa} Pa is outside the range of this equation"
                )
            }
            Self::TemperatureOutOfRange { temperature_k } => {
                write!(
                    f,
                    "temperature {temperature_k} K is outside the range of this equation"
                )
            }
            Self::DensityOutOfRange { density_kg_m3 } => {
                write!(
                    f,
                    "density {density_kg_m3} kg/m3 is outside the range of this equation"
                )
            }
            Self::OutsideFormulation {
                pressure_pa,
                temperature_k,
            } => write!(
                f,
                "point p = {pressure_pa} Pa, T = {temperature_k} K lies outside IAPWS-IF97"
            ),
            Self::PropertyOutOfRange => {
                write!(
                    f,
                    "enthalpy or entropy is outside the range reachable at this pressure"
                )
            }
            Self::NoConvergence => write!(f, "iteration did not converge"),
        }
    }
}

impl core::error::Error for FormulationError {}

/// Returns `Err(NotFinite)` unless every value is finite.
pub(crate) fn require_finite(values: &[f64]) -> Result<(), FormulationError> {
    if values.iter().all(|v| v.is_finite()) {
        Ok(())
    } else {
        Err(FormulationError::NotFinite)
    }
}

/// Returns `Err(PressureOutOfRange)` unless every property is finite.
///
/// The Gibbs regions accept any p > 0, but below about 1e-300 Pa the
/// specific volume RT/p overflows f64; such a pressure is reported as out of
/// range rather than returned as an infinite or NaN property.
pub(crate) fn require_finite_properties(props: Properties) -> Result<Properties, FormulationError> {
    let values = [
        props.density_kg_m3,
        props.specific_volume_m3_kg,
        props.enthalpy_j_kg,
        props.internal_energy_j_kg,
        props.entropy_j_kgk,
        props.cp_j_kgk,
        props.cv_j_kgk,
        props.speed_of_sound_m_s,
        props.isentropic_exponent,
    ];
    if values.iter().all(|v| v.is_finite()) && props.density_kg_m3 > 0.0 {
        Ok(props)
    } else {
        Err(FormulationError::PressureOutOfRange {
            pressure_pa: props.pressure_pa,
        })
    }
}

/// `x` raised to an integer power by repeated squaring.
///
/// The region equations are sums of integer powers (exponents −41 … 58);
/// squaring keeps them exact to a few ulp without needing `powi`, which
/// `core` does not offer on every toolchain this crate supports.
pub(crate) fn powi(x: f64, n: i32) -> f64 {
    let mut base = x;
    let mut exponent = n.unsigned_abs();
    let mut result = 1.0;
    while exponent > 0 {
        if exponent & 1 == 1 {
            result *= base;
        }
        base *= base;
        exponent >>= 1;
    }
    if n < 0 {
        1.0 / result
    } else {
        result
    }
}

/// `k · x^(k−1)`, the derivative of `x^k`, taken as exactly 0 when `k` = 0
/// (so that a base of 0 never produces `0 · ∞`).
pub(crate) fn dpowi(x: f64, k: i32) -> f64 {
    if k == 0 {
        0.0
    } else {
        f64::from(k) * powi(x, k - 1)
    }
}

/// `k (k−1) · x^(k−2)`, the second derivative of `x^k`, taken as exactly 0
/// when `k` is 0 or 1.
pub(crate) fn d2powi(x: f64, k: i32) -> f64 {
    if k == 0 || k == 1 {
        0.0
    } else {
        f64::from(k) * f64::from(k - 1) * powi(x, k - 2)
    }
}
