//! Drum level from a differential-pressure transmitter with a filled
//! reference leg (condensate pot), compensated for drum pressure.
//!
//! > **Caution.** This is a calculation library, not a certified safety
//! > device. A compensated level from this module is for indication and
//! > control; low-water trips and pressure relief stay with certified
//! > hardware (independent level limiters), as boiler codes require.
//!
//! # Geometry
//! ```text
//!                                       condensate pot
//!                                         +------+
//!   +----------------------+  upper tap   |      |
//!   |  steam        rho''  |==============+      |  - - - - - - - - - - - - -
//!   |                      |              +-+  +-+                          ^
//!   |~~~~~~~~~~~~~~~~~~~~~~|-- water level  |  |    reference leg,         |
//!   |  water        rho'   |     ^ L        |  |    full of condensate     |
//!   |- - - - - - - - - - - |-- zero mark    |  |    at T_leg: rho_ref      |  H
//!   |                      |     ^ Z        |  |                           |
//!   |                      |=========+      |  |                           v
//!   +----------------------+ lower   |      |  |  - - - - - - - - - - - - -
//!                            tap     |      |  |
//!                                    +-[LP  HP]
//!                                    DP transmitter
//! ```
//! H is the vertical distance between the lower and the upper tap, Z the
//! height of the level's zero mark (usually the normal water level) above
//! the lower tap, L the level above the zero mark (negative below it), and
//! h_w = Z + L the water height above the lower tap. The condensate pot at
//! the upper tap keeps the reference leg full of condensate up to the tap;
//! the leg cools to T_leg, so its density ρ_ref is that of compressed
//! liquid at drum pressure and T_leg. ρ' and ρ'' are the saturated liquid
//! and vapour densities at drum pressure ([`crate::saturation`]). The
//! impulse lines below the lower tap hold condensate at the same
//! temperature on both sides and cancel.
//!
//! # Formula
//! The transmitter reads DP = p_HP − p_LP (reference leg minus drum side,
//! at the lower tap's height), so the DP falls as the level rises:
//!
//! ```text
//! DP  = g·[ ρ_ref·H − ρ'·h_w − ρ''·(H − h_w) ]
//! h_w = [ g·(ρ_ref − ρ'')·H − DP ] / [ g·(ρ' − ρ'') ]
//! L   = h_w − Z
//! ```
//!
//! An empty drum (h_w = 0) reads DP = g·(ρ_ref − ρ'')·H, a drum full to the
//! upper tap (h_w = H) reads DP = g·(ρ_ref − ρ')·H. g is the local
//! acceleration of gravity ([`STANDARD_GRAVITY_M_S2`] where it is not
//! known better).
//!
//! # Start-up
//! At low drum pressure the compensation does not hold: the drum water is
//! not at saturation and the pot fills the leg only once steam condenses
//! in it. [`DrumLevelTransmitter::minimum_drum_pressure`] sets where the
//! plant starts to trust the compensated level; below it
//! [`drum_level`] returns [`ApplicationError::DrumPressureBelowStartUp`],
//! and below the saturation tables (611.657 Pa) or above the critical
//! pressure an [`ApplicationError::Saturation`] error. A leg that has not
//! filled (or has been drained) reads a low DP, which shows as a water
//! height above the upper tap: [`LevelSpan::AboveUpperTap`].

use crate::error::ApplicationError;
use crate::flowing::liquid_error;
use crate::saturation::saturated_state_at_pressure;
use crate::single_phase::compressed_liquid;
use crate::units::{AbsolutePressure, Temperature};

/// Standard acceleration of gravity, m/s² (its definition, 9.806 65).
pub const STANDARD_GRAVITY_M_S2: f32 = 9.806_65;

/// The tapping geometry and settings of a drum-level transmitter.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct DrumLevelTransmitter {
    /// Vertical distance H between the lower and the upper tap, m (> 0).
    pub tap_separation_m: f32,
    /// Height Z of the level's zero mark above the lower tap, m
    /// (0 ≤ Z ≤ H).
    pub zero_level_above_lower_tap_m: f32,
    /// Local acceleration of gravity g, m/s² (> 0); use
    /// [`STANDARD_GRAVITY_M_S2`] if it is not known better.
    pub gravity_m_s2: f32,
    /// Drum pressure (absolute) below which the level is not compensated
    /// (the start-up case): [`drum_level`] returns
    /// [`ApplicationError::DrumPressureBelowStartUp`] below it.
    pub minimum_drum_pressure: AbsolutePressure,
}

/// Where the computed water height lies against the taps.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum LevelSpan {
    /// Between the lower and the upper tap (0 ≤ h_w ≤ H): a level.
    WithinTaps,
    /// Above the upper tap (h_w > H): the reference leg has not filled
    /// (start-up, after draining or a leak) or the drum is flooded into the
    /// upper tap. Not a level the transmitter can measure.
    AboveUpperTap,
    /// Below the lower tap (h_w < 0): the drum side's impulse line or the
    /// transmitter is faulty, or the water is below the lower tap. Not a
    /// level the transmitter can measure.
    BelowLowerTap,
}

/// A compensated drum level and the densities it used.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct DrumLevel {
    /// Level L above the zero mark, m (negative below it). Computed from
    /// the formula also outside the taps; check [`DrumLevel::span`].
    pub level_m: f32,
    /// Water height h_w above the lower tap, m.
    pub water_height_above_lower_tap_m: f32,
    /// Whether h_w lies between the taps.
    pub span: LevelSpan,
    /// ρ' used, kg/m³.
    pub liquid_density_kg_m3: f32,
    /// ρ'' used, kg/m³.
    pub vapour_density_kg_m3: f32,
    /// ρ_ref of the reference leg used, kg/m³.
    pub reference_leg_density_kg_m3: f32,
}

fn check_transmitter(t: &DrumLevelTransmitter) -> Result<(), ApplicationError> {
    let h = t.tap_separation_m;
    let z = t.zero_level_above_lower_tap_m;
    let g = t.gravity_m_s2;
    let ok =
        h.is_finite() && h > 0.0 && z.is_finite() && z >= 0.0 && z <= h && g.is_finite() && g > 0.0;
    if ok {
        Ok(())
    } else {
        Err(ApplicationError::InvalidTransmitterGeometry {
            tap_separation_m: h,
            zero_level_above_lower_tap_m: z,
            gravity_m_s2: g,
        })
    }
}

fn check_differential_pressure(dp: f32) -> Result<f32, ApplicationError> {
    if dp.is_finite() {
        Ok(dp)
    } else {
        Err(ApplicationError::DifferentialPressureNotFinite {
            differential_pressure_pa: dp,
        })
    }
}

/// The level formula of the [module docs](self) on densities given by the
/// caller: h_w = [g·(ρ_ref − ρ'')·H − DP] / [g·(ρ' − ρ'')], L = h_w − Z.
///
/// Inputs: `differential_pressure_pa`, Pa, DP = p_HP − p_LP (reference leg
/// minus drum side); the transmitter geometry (its
/// `minimum_drum_pressure` is not used here); ρ', ρ'' and ρ_ref in kg/m³,
/// positive and finite, ρ' > ρ''. Accuracy: f32 rounding of the formula
/// (a few parts in 10⁷ of H); the densities' errors propagate as
/// ∂h_w/∂ρ_ref = H/(ρ' − ρ''), ∂h_w/∂ρ' = −h_w/(ρ' − ρ''),
/// ∂h_w/∂ρ'' = (h_w − H)/(ρ' − ρ'').
///
/// ```
/// use vapora_kernel::drum_level::{drum_level_from_densities, DrumLevelTransmitter, LevelSpan};
/// use vapora_kernel::units::AbsolutePressure;
/// let transmitter = DrumLevelTransmitter {
///     tap_separation_m: 0.6,
///     zero_level_above_lower_tap_m: 0.3,
///     gravity_m_s2: 10.0,
///     minimum_drum_pressure: AbsolutePressure::from_bar(2.0)?,
/// };
/// // Cold test: 1000 kg/m³ water on both sides, no vapour. DP = 0 means
/// // the drum is full to the upper tap: h_w = H = 0.6 m, L = +0.3 m.
/// let full = drum_level_from_densities(0.0, &transmitter, 1000.0, 0.0001, 1000.0)?;
/// assert!((full.level_m - 0.3).abs() < 1e-4);
/// assert_eq!(full.span, LevelSpan::WithinTaps);
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// [`ApplicationError::InvalidTransmitterGeometry`],
/// [`ApplicationError::DifferentialPressureNotFinite`],
/// [`ApplicationError::NoDensityDifference`] for densities not positive
/// and finite, ρ' ≤ ρ'', or a level that overflows f32.
pub fn drum_level_from_densities(
    differential_pressure_pa: f32,
    transmitter: &DrumLevelTransmitter,
    liquid_density_kg_m3: f32,
    vapour_density_kg_m3: f32,
    reference_leg_density_kg_m3: f32,
) -> Result<DrumLevel, ApplicationError> {
    check_transmitter(transmitter)?;
    let dp = check_differential_pressure(differential_pressure_pa)?;
    let (rho_l, rho_v, rho_ref) = (
        liquid_density_kg_m3,
        vapour_density_kg_m3,
        reference_leg_density_kg_m3,
    );
    let no_level = ApplicationError::NoDensityDifference {
        liquid_density_kg_m3: rho_l,
        vapour_density_kg_m3: rho_v,
        reference_leg_density_kg_m3: rho_ref,
    };
    let positive = |r: f32| r.is_finite() && r > 0.0;
    if !(positive(rho_l) && positive(rho_v) && positive(rho_ref) && rho_l > rho_v) {
        return Err(no_level);
    }
    let h = transmitter.tap_separation_m;
    let g = transmitter.gravity_m_s2;
    let water_height = (g * (rho_ref - rho_v) * h - dp) / (g * (rho_l - rho_v));
    let level = water_height - transmitter.zero_level_above_lower_tap_m;
    if !(water_height.is_finite() && level.is_finite()) {
        return Err(no_level);
    }
    let span = if water_height < 0.0 {
        LevelSpan::BelowLowerTap
    } else if water_height > h {
        LevelSpan::AboveUpperTap
    } else {
        LevelSpan::WithinTaps
    };
    Ok(DrumLevel {
        level_m: level,
        water_height_above_lower_tap_m: water_height,
        span,
        liquid_density_kg_m3: rho_l,
        vapour_density_kg_m3: rho_v,
        reference_leg_density_kg_m3: rho_ref,
    })
}

/// Compensated drum level from drum pressure, the DP reading and the
/// reference-leg temperature (geometry and formula in the
/// [module docs](self)).
///
/// Inputs: drum pressure (absolute); `differential_pressure_pa`, Pa,
/// DP = p_HP − p_LP (reference leg minus drum side); the mean temperature
/// of the reference leg (below T_sat at drum pressure); the transmitter.
/// Range: drum pressure from `minimum_drum_pressure` (and at least the
/// triple point) to below the critical pressure, 22.064 MPa; the leg from
/// 273.16 K. Accuracy: the densities' errors (ρ' and ρ'' within the
/// saturation bounds of [`crate::accuracy`], 20 ppm below Tc − 1 K; ρ_ref
/// within the single-phase bound of 20 ppm) propagated as in
/// [`drum_level_from_densities`]: about 0.02 mm for the example below. The
/// error of the DP transmitter and of the leg temperature (about
/// 0.3 mm per kelvin there) is far larger.
///
/// Worked example (demo data: Harrowmere Works, an invented plant): the
/// boiler drum at 10.5 bar(g) (1.151 325 MPa with 101.325 kPa ambient),
/// taps 600 mm apart, the zero mark (normal water level) 300 mm above the
/// lower tap, reference leg at 45 °C; the transmitter reads 3.100 kPa. The
/// plant compensates from 2 bar(a).
///
/// ```
/// use vapora_kernel::drum_level::{drum_level, DrumLevelTransmitter, LevelSpan, STANDARD_GRAVITY_M_S2};
/// use vapora_kernel::error::ApplicationError;
/// use vapora_kernel::units::{AbsolutePressure, Temperature};
/// let transmitter = DrumLevelTransmitter {
///     tap_separation_m: 0.600,
///     zero_level_above_lower_tap_m: 0.300,
///     gravity_m_s2: STANDARD_GRAVITY_M_S2,
///     minimum_drum_pressure: AbsolutePressure::from_bar(2.0)?,
/// };
/// let drum = AbsolutePressure::from_pa(1_151_325.0)?;
/// let leg = Temperature::from_celsius(45.0)?;
/// let level = drum_level(drum, 3_100.0, leg, &transmitter)?;
/// // f64 IAPWS-IF97: ρ' = 880.399, ρ'' = 5.887 27, ρ_ref = 990.680 kg/m³,
/// // h_w = 314.19 mm, L = +14.19 mm.
/// assert!((level.level_m - 0.014_19).abs() < 1e-4);
/// assert!((level.reference_leg_density_kg_m3 - 990.680).abs() < 0.03);
/// assert_eq!(level.span, LevelSpan::WithinTaps);
///
/// // Start-up: at 1.2 bar(a) the level is not compensated.
/// let cold = drum_level(AbsolutePressure::from_bar(1.2)?, 3_100.0, leg, &transmitter);
/// assert!(matches!(cold, Err(ApplicationError::DrumPressureBelowStartUp { .. })));
///
/// // A reference leg that has not filled reads a low DP: not a level.
/// let unfilled = drum_level(drum, 500.0, leg, &transmitter)?;
/// assert_eq!(unfilled.span, LevelSpan::AboveUpperTap);
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// Those of [`drum_level_from_densities`];
/// [`ApplicationError::DrumPressureBelowStartUp`] below the transmitter's
/// `minimum_drum_pressure`; [`ApplicationError::Saturation`] outside the
/// saturation tables; [`ApplicationError::ReferenceLegNotSubcooled`] for a
/// leg at or above T_sat at drum pressure; [`ApplicationError::SinglePhase`]
/// for a leg temperature outside the single-phase envelope.
pub fn drum_level(
    drum_pressure: AbsolutePressure,
    differential_pressure_pa: f32,
    leg_temperature: Temperature,
    transmitter: &DrumLevelTransmitter,
) -> Result<DrumLevel, ApplicationError> {
    check_transmitter(transmitter)?;
    check_differential_pressure(differential_pressure_pa)?;
    if drum_pressure.as_pa() < transmitter.minimum_drum_pressure.as_pa() {
        return Err(ApplicationError::DrumPressureBelowStartUp {
            pressure_pa: drum_pressure.as_pa(),
            minimum_pa: transmitter.minimum_drum_pressure.as_pa(),
        });
    }
    let saturated = saturated_state_at_pressure(drum_pressure)?;
    let leg =
        compressed_liquid(drum_pressure, leg_temperature).map_err(|e| match liquid_error(e) {
            ApplicationError::WaterNotSubcooled {
                subcooling_margin_k,
            } => ApplicationError::ReferenceLegNotSubcooled {
                subcooling_margin_k,
            },
            other => other,
        })?;
    drum_level_from_densities(
        differential_pressure_pa,
        transmitter,
        saturated.liquid.density_kg_m3,
        saturated.vapour.density_kg_m3,
        leg.density_kg_m3,
    )
}
