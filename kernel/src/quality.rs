//! Phase and dryness fraction (quality) of a point given by pressure or
//! temperature and one more property: (p, h), (p, s), (p, v), (T, h), (T, s).
//!
//! The saturated values y' and y'' of the second property come from the
//! saturation tables in one look-up; the lever rule x = (y − y')/(y'' − y')
//! decides the phase.
//!
//! # Where "saturated" ends
//! A point whose lever-rule x lies within [`SATURATION_TOLERANCE`] of 0 (or
//! of 1) is reported as [`Phase::SaturatedLiquid`] (or
//! [`Phase::SaturatedVapour`]); farther inside it is [`Phase::WetSteam`] with
//! its x, farther outside subcooled liquid or superheated vapour. The
//! tolerance, 1e-5 in dryness fraction, is the accuracy of x from the tables
//! below Tc − 1 K: inside that band the tables cannot tell the point from
//! the saturation line. Between Tc − 1 K and the critical point x is only
//! good to about 1e-3 (see [`crate::accuracy`]), so points that close to the
//! line may fall on either side of it.
//!
//! At and above the critical pressure (or temperature) there is no
//! two-phase region, and the answer is [`Phase::Supercritical`] whatever
//! the second property; so it is also within the last few pascals below the
//! critical pressure, where the tabulated liquid and vapour values meet.

use crate::error::PhaseError;
use crate::saturation::{self, interval_at_pressure, interval_at_temperature};
use crate::tables::saturation::{CRITICAL_PRESSURE_PA, CRITICAL_TEMPERATURE_K};
use crate::units::{AbsolutePressure, Temperature};

/// Half-width of the band around x = 0 and x = 1 reported as saturated
/// liquid or saturated vapour (dimensionless, in dryness fraction).
pub const SATURATION_TOLERANCE: f32 = 1e-5;

/// The phase of water at a point, in the trade's words.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub enum Phase {
    /// Compressed (subcooled) liquid: colder, or at higher pressure, than
    /// saturated liquid.
    SubcooledLiquid,
    /// Saturated liquid (x = 0 within [`SATURATION_TOLERANCE`]).
    SaturatedLiquid,
    /// Wet steam, a mixture of saturated liquid and vapour.
    WetSteam {
        /// Dryness fraction x (quality), kg vapour per kg mixture, strictly
        /// between [`SATURATION_TOLERANCE`] and 1 − [`SATURATION_TOLERANCE`].
        dryness_fraction: f32,
    },
    /// Saturated (dry) vapour (x = 1 within [`SATURATION_TOLERANCE`]).
    SaturatedVapour,
    /// Superheated vapour: hotter, or at lower pressure, than saturated vapour.
    SuperheatedVapour,
    /// At or above the critical pressure or temperature: one fluid phase,
    /// no saturation line.
    Supercritical,
}

impl Phase {
    /// The dryness fraction where it is defined: 0 for saturated liquid, x
    /// for wet steam, 1 for saturated vapour, `None` outside the dome.
    pub fn dryness_fraction(&self) -> Option<f32> {
        match *self {
            Self::SaturatedLiquid => Some(0.0),
            Self::WetSteam { dryness_fraction } => Some(dryness_fraction),
            Self::SaturatedVapour => Some(1.0),
            Self::SubcooledLiquid | Self::SuperheatedVapour | Self::Supercritical => None,
        }
    }
}

/// The lever rule and the tolerance bands. `y_liquid < y_vapour` is what
/// every property used here has below the critical point; where the two
/// meet (or cross, in the extension to the critical point) the point is
/// treated as supercritical.
fn classify(y: f32, y_liquid: f32, y_vapour: f32) -> Phase {
    let span = y_vapour - y_liquid;
    if span.is_nan() || span <= 0.0 {
        return Phase::Supercritical;
    }
    let x = (y - y_liquid) / span;
    if x < -SATURATION_TOLERANCE {
        Phase::SubcooledLiquid
    } else if x <= SATURATION_TOLERANCE {
        Phase::SaturatedLiquid
    } else if x < 1.0 - SATURATION_TOLERANCE {
        Phase::WetSteam {
            dryness_fraction: x,
        }
    } else if x <= 1.0 + SATURATION_TOLERANCE {
        Phase::SaturatedVapour
    } else {
        Phase::SuperheatedVapour
    }
}

fn supercritical_pressure(p: AbsolutePressure) -> bool {
    p.as_pa() >= CRITICAL_PRESSURE_PA
}

fn supercritical_temperature(t: Temperature) -> bool {
    t.as_kelvin() >= CRITICAL_TEMPERATURE_K
}

fn finite_enthalpy(h: f32) -> Result<f32, PhaseError> {
    if h.is_finite() {
        Ok(h)
    } else {
        Err(PhaseError::EnthalpyNotFinite { enthalpy_j_kg: h })
    }
}

fn finite_entropy(s: f32) -> Result<f32, PhaseError> {
    if s.is_finite() {
        Ok(s)
    } else {
        Err(PhaseError::EntropyNotFinite { entropy_j_kgk: s })
    }
}

/// Phase and dryness fraction from absolute pressure and specific enthalpy
/// (J/kg, IF97 reference state). The usual call in a flow computer that
/// knows the enthalpy from an energy balance.
///
/// Range: pressure from the triple point up (above the critical pressure:
/// [`Phase::Supercritical`]); any finite enthalpy. Accuracy of x:
/// `dryness_fraction` of [`crate::accuracy::ACCURACY_BELOW_NEAR_CRITICAL`]
/// (1e-5 or better below Tc − 1 K) and
/// [`crate::accuracy::ACCURACY_NEAR_CRITICAL`].
///
/// ```
/// use vapora_kernel::quality::{phase_from_pressure_enthalpy, Phase};
/// use vapora_kernel::units::AbsolutePressure;
/// let p = AbsolutePressure::from_bar(10.0)?;
/// match phase_from_pressure_enthalpy(p, 2_600e3)? {
///     Phase::WetSteam { dryness_fraction } => assert!((dryness_fraction - 0.912).abs() < 0.002),
///     other => panic!("expected wet steam, got {other:?}"),
/// }
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// [`PhaseError::EnthalpyNotFinite`] for NaN or infinite enthalpy,
/// [`PhaseError::Saturation`] below the triple-point pressure.
pub fn phase_from_pressure_enthalpy(
    pressure: AbsolutePressure,
    enthalpy_j_kg: f32,
) -> Result<Phase, PhaseError> {
    let h = finite_enthalpy(enthalpy_j_kg)?;
    if supercritical_pressure(pressure) {
        return Ok(Phase::Supercritical);
    }
    let (block, t, _) = interval_at_pressure(pressure)?;
    Ok(classify(
        h,
        saturation::liquid_enthalpy(block, t),
        saturation::vapour_enthalpy(block, t),
    ))
}

/// Phase and dryness fraction from absolute pressure and specific entropy,
/// J/(kg·K) (IF97 reference state). Range and accuracy as
/// [`phase_from_pressure_enthalpy`], with s in place of h (the x accuracy
/// follows from the entropy bounds of [`crate::accuracy`] divided by s_fg).
///
/// # Errors
/// [`PhaseError::EntropyNotFinite`] for NaN or infinite entropy,
/// [`PhaseError::Saturation`] below the triple-point pressure.
pub fn phase_from_pressure_entropy(
    pressure: AbsolutePressure,
    entropy_j_kgk: f32,
) -> Result<Phase, PhaseError> {
    let s = finite_entropy(entropy_j_kgk)?;
    if supercritical_pressure(pressure) {
        return Ok(Phase::Supercritical);
    }
    let (block, t, _) = interval_at_pressure(pressure)?;
    Ok(classify(
        s,
        saturation::liquid_entropy(block, t),
        saturation::vapour_entropy(block, t),
    ))
}

/// Phase and dryness fraction from absolute pressure and specific volume,
/// m³/kg (for example from a measured density, v = 1/ρ). Range as
/// [`phase_from_pressure_enthalpy`]; the x accuracy follows from the
/// density bounds of [`crate::accuracy`] (relative error of v'' times x).
///
/// # Errors
/// [`PhaseError::SpecificVolumeNotPositive`] for NaN, infinite, zero or
/// negative volume; [`PhaseError::Saturation`] below the triple-point
/// pressure.
pub fn phase_from_pressure_specific_volume(
    pressure: AbsolutePressure,
    specific_volume_m3_kg: f32,
) -> Result<Phase, PhaseError> {
    let v = specific_volume_m3_kg;
    if !(v > 0.0 && v.is_finite()) {
        return Err(PhaseError::SpecificVolumeNotPositive {
            specific_volume_m3_kg: v,
        });
    }
    if supercritical_pressure(pressure) {
        return Ok(Phase::Supercritical);
    }
    let (block, t, _) = interval_at_pressure(pressure)?;
    let v_liquid = 1.0 / saturation::liquid_density(block, t);
    let v_vapour = 1.0 / saturation::vapour_density(block, t, pressure.as_pa());
    Ok(classify(v, v_liquid, v_vapour))
}

/// Phase and dryness fraction from temperature and specific enthalpy, J/kg.
/// Range: temperature from the triple point up (at and above the critical
/// temperature: [`Phase::Supercritical`]); accuracy as
/// [`phase_from_pressure_enthalpy`].
///
/// # Errors
/// [`PhaseError::EnthalpyNotFinite`] for NaN or infinite enthalpy,
/// [`PhaseError::Saturation`] below the triple-point temperature.
pub fn phase_from_temperature_enthalpy(
    temperature: Temperature,
    enthalpy_j_kg: f32,
) -> Result<Phase, PhaseError> {
    let h = finite_enthalpy(enthalpy_j_kg)?;
    if supercritical_temperature(temperature) {
        return Ok(Phase::Supercritical);
    }
    let (block, t) = interval_at_temperature(temperature)?;
    Ok(classify(
        h,
        saturation::liquid_enthalpy(block, t),
        saturation::vapour_enthalpy(block, t),
    ))
}

/// Phase and dryness fraction from temperature and specific entropy,
/// J/(kg·K). Range as [`phase_from_temperature_enthalpy`], accuracy as
/// [`phase_from_pressure_entropy`].
///
/// # Errors
/// [`PhaseError::EntropyNotFinite`] for NaN or infinite entropy,
/// [`PhaseError::Saturation`] below the triple-point temperature.
pub fn phase_from_temperature_entropy(
    temperature: Temperature,
    entropy_j_kgk: f32,
) -> Result<Phase, PhaseError> {
    let s = finite_entropy(entropy_j_kgk)?;
    if supercritical_temperature(temperature) {
        return Ok(Phase::Supercritical);
    }
    let (block, t) = interval_at_temperature(temperature)?;
    Ok(classify(
        s,
        saturation::liquid_entropy(block, t),
        saturation::vapour_entropy(block, t),
    ))
}
