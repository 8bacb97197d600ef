//! Physical quantities with their units in the type: absolute pressure,
//! gauge pressure and temperature.
//!
//! Absolute and gauge pressure are different types, so a gauge reading can
//! never be passed where the saturation line needs an absolute pressure; the
//! only way from one to the other names the ambient (barometric) pressure.
//! Every constructor rejects NaN and infinities, and absolute quantities
//! reject negative values, so a value of these types is always a physically
//! possible number; range limits of particular tables are checked by the
//! functions that use them.

use crate::error::UnitError;

/// Pascals per kilopascal.
const PA_PER_KPA: f32 = 1.0e3;
/// Pascals per bar (1 bar = 100 kPa, by definition).
const PA_PER_BAR: f32 = 1.0e5;
/// Pascals per megapascal.
const PA_PER_MPA: f32 = 1.0e6;
/// 0 °C in kelvin (by definition of the Celsius scale).
const ZERO_CELSIUS_K: f32 = 273.15;

/// An absolute pressure, stored in Pa as f32 (about 7 significant digits).
///
/// Always finite and ≥ 0.
///
/// ```
/// use vapora_kernel::units::{AbsolutePressure, GaugePressure};
/// let drum = AbsolutePressure::from_bar(10.0)?;
/// assert_eq!(drum.as_kpa(), 1000.0);
/// // A gauge reading of 9 bar(g) on a day with 101.325 kPa barometric pressure:
/// let p = AbsolutePressure::from_gauge(GaugePressure::from_bar(9.0)?, AbsolutePressure::STANDARD_ATMOSPHERE)?;
/// assert!((p.as_pa() - 1_001_325.0).abs() < 0.1);
/// # Ok::<(), vapora_kernel::error::UnitError>(())
/// ```
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct AbsolutePressure {
    pa: f32,
}

impl AbsolutePressure {
    /// The standard atmosphere, 101 325 Pa (its definition), a common stand-in
    /// for the ambient pressure when no barometer is fitted.
    pub const STANDARD_ATMOSPHERE: Self = Self { pa: 101_325.0 };

    /// From pascals.
    ///
    /// # Errors
    /// [`UnitError::NotFinite`] for NaN or infinity,
    /// [`UnitError::NegativeAbsolutePressure`] below 0 Pa.
    pub fn from_pa(pa: f32) -> Result<Self, UnitError> {
        // Every finite f32 with the sign bit clear has a bit pattern below
        // that of +∞: one unsigned compare accepts them all (a float
        // classification costs a few dozen instructions on a Cortex-M).
        if pa.to_bits() < f32::INFINITY.to_bits() {
            return Ok(Self { pa });
        }
        Self::from_pa_unusual(pa)
    }

    /// The rest of [`AbsolutePressure::from_pa`]: NaN, infinities, negative
    /// values, and −0.0 (accepted, as 0.0 is).
    #[cold]
    fn from_pa_unusual(pa: f32) -> Result<Self, UnitError> {
        if !pa.is_finite() {
            return Err(UnitError::NotFinite { value: pa });
        }
        if pa < 0.0 {
            return Err(UnitError::NegativeAbsolutePressure { pressure_pa: pa });
        }
        Ok(Self { pa })
    }

    /// From kilopascals (absolute).
    ///
    /// # Errors
    /// As [`AbsolutePressure::from_pa`] (also when the conversion overflows).
    pub fn from_kpa(kpa: f32) -> Result<Self, UnitError> {
        Self::from_scaled(kpa, PA_PER_KPA)
    }

    /// From bar (absolute, "bar(a)").
    ///
    /// # Errors
    /// As [`AbsolutePressure::from_pa`] (also when the conversion overflows).
    pub fn from_bar(bar: f32) -> Result<Self, UnitError> {
        Self::from_scaled(bar, PA_PER_BAR)
    }

    /// From megapascals (absolute).
    ///
    /// # Errors
    /// As [`AbsolutePressure::from_pa`] (also when the conversion overflows).
    pub fn from_mpa(mpa: f32) -> Result<Self, UnitError> {
        Self::from_scaled(mpa, PA_PER_MPA)
    }

    /// From a gauge reading and the ambient (barometric) pressure it was
    /// measured against: absolute = gauge + ambient.
    ///
    /// # Errors
    /// [`UnitError::NegativeAbsolutePressure`] when the vacuum reading is
    /// deeper than the ambient pressure allows, [`UnitError::NotFinite`] if
    /// the sum overflows.
    pub fn from_gauge(gauge: GaugePressure, ambient: AbsolutePressure) -> Result<Self, UnitError> {
        Self::from_pa(gauge.pa + ambient.pa)
    }

    fn from_scaled(value: f32, pa_per_unit: f32) -> Result<Self, UnitError> {
        if !value.is_finite() {
            return Err(UnitError::NotFinite { value });
        }
        Self::from_pa(value * pa_per_unit)
    }

    /// A pressure computed from the tables, positive and finite by
    /// construction (crate-internal: no check).
    pub(crate) const fn from_table_pa(pa: f32) -> Self {
        Self { pa }
    }

    /// The pressure in pascals (absolute).
    pub const fn as_pa(self) -> f32 {
        self.pa
    }

    /// The pressure in kilopascals (absolute).
    pub fn as_kpa(self) -> f32 {
        self.pa / PA_PER_KPA
    }

    /// The pressure in bar (absolute).
    pub fn as_bar(self) -> f32 {
        self.pa / PA_PER_BAR
    }

    /// The pressure in megapascals (absolute).
    pub fn as_mpa(self) -> f32 {
        self.pa / PA_PER_MPA
    }

    /// The gauge pressure this absolute pressure shows against `ambient`
    /// (negative for vacuum).
    pub fn to_gauge(self, ambient: AbsolutePressure) -> GaugePressure {
        GaugePressure {
            pa: self.pa - ambient.pa,
        }
    }
}

/// A gauge pressure (relative to the ambient), stored in Pa as f32; negative
/// values are vacuum. Always finite. Convert with
/// [`AbsolutePressure::from_gauge`] before using the saturation functions.
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct GaugePressure {
    pa: f32,
}

impl GaugePressure {
    /// From pascals (gauge).
    ///
    /// # Errors
    /// [`UnitError::NotFinite`] for NaN or infinity.
    pub fn from_pa(pa: f32) -> Result<Self, UnitError> {
        if pa.is_finite() {
            Ok(Self { pa })
        } else {
            Err(UnitError::NotFinite { value: pa })
        }
    }

    /// From kilopascals (gauge).
    ///
    /// # Errors
    /// [`UnitError::NotFinite`] for NaN, infinity or overflow.
    pub fn from_kpa(kpa: f32) -> Result<Self, UnitError> {
        Self::from_pa(kpa * PA_PER_KPA)
    }

    /// From bar (gauge, "bar(g)").
    ///
    /// # Errors
    /// [`UnitError::NotFinite`] for NaN, infinity or overflow.
    pub fn from_bar(bar: f32) -> Result<Self, UnitError> {
        Self::from_pa(bar * PA_PER_BAR)
    }

    /// From megapascals (gauge).
    ///
    /// # Errors
    /// [`UnitError::NotFinite`] for NaN, infinity or overflow.
    pub fn from_mpa(mpa: f32) -> Result<Self, UnitError> {
        Self::from_pa(mpa * PA_PER_MPA)
    }

    /// The gauge pressure in pascals.
    pub const fn as_pa(self) -> f32 {
        self.pa
    }

    /// The gauge pressure in kilopascals.
    pub fn as_kpa(self) -> f32 {
        self.pa / PA_PER_KPA
    }

    /// The gauge pressure in bar.
    pub fn as_bar(self) -> f32 {
        self.pa / PA_PER_BAR
    }

    /// The gauge pressure in megapascals.
    pub fn as_mpa(self) -> f32 {
        self.pa / PA_PER_MPA
    }
}

/// A thermodynamic temperature, stored in K as f32. Always finite and > 0 K.
///
/// ```
/// use vapora_kernel::units::Temperature;
/// let t = Temperature::from_celsius(100.0)?;
/// assert_eq!(t.as_kelvin(), 373.15);
/// # Ok::<(), vapora_kernel::error::UnitError>(())
/// ```
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct Temperature {
    k: f32,
}

impl Temperature {
    /// From kelvin.
    ///
    /// # Errors
    /// [`UnitError::NotFinite`] for NaN or infinity,
    /// [`UnitError::NonPositiveTemperature`] at or below 0 K.
    pub fn from_kelvin(k: f32) -> Result<Self, UnitError> {
        if !k.is_finite() {
            return Err(UnitError::NotFinite { value: k });
        }
        if k <= 0.0 {
            return Err(UnitError::NonPositiveTemperature { temperature_k: k });
        }
        Ok(Self { k })
    }

    /// From degrees Celsius (T = t + 273.15 K).
    ///
    /// # Errors
    /// As [`Temperature::from_kelvin`].
    pub fn from_celsius(c: f32) -> Result<Self, UnitError> {
        if !c.is_finite() {
            return Err(UnitError::NotFinite { value: c });
        }
        Self::from_kelvin(c + ZERO_CELSIUS_K)
    }

    /// A temperature computed from the tables, positive and finite by
    /// construction (crate-internal: no check).
    pub(crate) const fn from_table_k(k: f32) -> Self {
        Self { k }
    }

    /// The temperature in kelvin.
    pub const fn as_kelvin(self) -> f32 {
        self.k
    }

    /// The temperature in degrees Celsius.
    pub fn as_celsius(self) -> f32 {
        self.k - ZERO_CELSIUS_K
    }
}
