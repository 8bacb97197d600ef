//! Single-phase water and steam: compressed (subcooled) liquid, superheated
//! vapour and supercritical fluid, from (p, T), (p, h) or (p, s), with no
//! iteration and no search at run time.
//!
//! # Envelope
//! Pressure [`PRESSURE_MIN_PA`] to [`PRESSURE_MAX_PA`] (611.657 Pa to
//! 25 MPa), temperature [`TEMPERATURE_MIN_K`] to [`TEMPERATURE_MAX_K`]
//! (273.16 K to 1073.15 K): IAPWS-IF97 Regions 1, 2 and 3 (Region 5 starts
//! above 1073.15 K and is not covered).
//!
//! # How a call works
//! The envelope is cut into six sheets along the lines where the
//! formulation changes character: the saturation line (continued above the
//! critical pressure pc by T_split(p), a parabola with the slope and
//! curvature of the saturation line at the critical point, which runs close
//! to the pseudo-critical line where cp peaks), the 623.15 K boundary of Region 1,
//! and the B23 line between Regions 2 and 3. No sheet straddles any of
//! them, so the properties are smooth inside every sheet and the small jumps
//! the formulation itself has at 623.15 K and at B23 are reproduced.
//!
//! | sheet | pressure | from (y = 0) | to (y = 1) | IF97 |
//! |---|---|---|---|---|
//! | vapour, low | p < p_b | T_sat(p) | 1073.15 K | 2 |
//! | liquid, low | p < p_b | T_sat(p) | 273.16 K | 1 |
//! | liquid, high | p ≥ p_b | 623.15 K | 273.16 K | 1 |
//! | liquid, near-critical | p ≥ p_b | T_sat(p) or T_split(p) | 623.15 K | 3 |
//! | vapour, near-critical | p ≥ p_b | T_sat(p) or T_split(p) | T_B23(p) | 3 |
//! | vapour, high | p ≥ p_b | T_B23(p) | 1073.15 K | 2 |
//!
//! p_b = p_sat(623.15 K) = 16.529 MPa. Inside a sheet the coordinates are
//! x = ln(p/Pa) + p/p1 below p_b (p1 = 2 MPa: logarithmic at low pressure,
//! finer towards p_b), x = p/MPa for the liquid below 623.15 K and the vapour
//! beyond B23 from p_b up, and x = asinh((p − pc)/p_s) + (p − pc)/p_l
//! (p_s = 0.3 MPa, p_l = 6 MPa) in Region 3, smooth through pc with the
//! knots crowded towards it; and a temperature coordinate that follows the
//! sheet's edges T0(p) and T1(p): with d = |T − T0| and D = |T1 − T0|,
//! y = ln(1 + d/δ)/ln(1 + D/δ), δ = δ_base + δ_slope·√((p − p_ref)² + p_m²) (p_m = 0.5 MPa),
//! which crowds the knots towards saturation as the critical point nears.
//! Above pc the split T_split(p) = Tc + k·(p − pc) + c·(p − pc)² has the
//! slope and curvature of the saturation line at pc, so the coordinates are
//! smooth through pc. The saturation temperature comes from
//! [`crate::saturation`]. The logarithms, exponentials and square roots of
//! these coordinates are short fixed f32 sequences (bit-pattern range
//! reduction and a short series, the same functions as `libm` to a few
//! units in the last place), not library calls. One look-up of a tensor-product cubic B-spline
//! ([`crate::spline::BicubicSheet`]) gives ρ (ρ/p for the vapour sheets
//! outside Region 3), h, s, 1/cp, w and ln μ; κ = ρ·w²/p.
//!
//! From (p, h) the saturated state at p decides liquid, wet steam or
//! vapour; inside a sheet the enthalpy fraction φ = (h − h(x, 0))/(h(x, 1) −
//! h(x, 0)), stretched like y, indexes an inverse sheet that gives y, hence
//! T0 and the forward sheet's state there, again without iteration. (p, s)
//! works the same way. One explicit correction step follows (a single
//! fixed step, not an iteration: no loop, no convergence test): at constant
//! p, dh = cp·dT and ds = cp·dT/T, so with h(T0), s(T0) and cp(T0) from
//! that same forward look-up T1 = T0 + (h − h(T0))/cp(T0), or
//! T1 = T0 + (s − s(T0))·T0/cp(T0), clamped to the sheet's temperature
//! edges (never across saturation, T_split, 623.15 K or B23). The state
//! returned has T = T1, the given h (or s) as given, the other of the two
//! moved to first order with dh = T0·ds; ρ, v, cp, w, κ and μ are those
//! at T0 (the sheet is not evaluated a second time), which differs from T1
//! by the inverse sheet's error (up to 3.8 mK in the ring around the
//! critical point, 1.6 mK beyond 15 K / 3 MPa of it, 6.2 mK in the box).
//! Where the inverse sheet was already closer than the forward sheet's
//! own h (or s) error over cp, the step can move T away slightly: beyond
//! 15 K / 3 MPa the largest T error rose from 1.5 to 1.8 mK (still within
//! 2 mK), while in the ring it fell from 3.8 to 0.12 mK.
//!
//! # Accuracy
//! Measured against the f64 formulation (IAPWS-IF97 with the IAPWS R12-08
//! viscosity) by `host-tests/tests/single_phase_accuracy.rs`, which prints
//! the maxima per zone and fails above the bounds it states (figures in the
//! crate README, "Single phase"). Beyond 15 K and 3 MPa of the critical
//! point: ρ within 20 ppm, h 20 J/kg, s 0.05 J/(kg·K), cp and κ 0.05 %,
//! μ 0.05 %, T from (p, h) and from (p, s) 2 mK, down to 0.01 K from
//! saturation on either side. Between that and the near-critical box (5 K
//! and 1 MPa of the critical point) the same bounds (T from (p, h) and
//! (p, s) within 0.2 mK there, thanks to the correction step); inside the
//! box looser (ρ 3 %, h 15 kJ/kg, cp 10 %, T 10 mK).
//!
//! This is a calculation library, not a certified safety device: low-water
//! trips and pressure relief stay with certified hardware.

use core::fmt;

use crate::error::SaturationError;
use crate::fast_math;
use crate::mixture::WetSteam;
use crate::saturation;
use crate::spline::{at_least, SinglePhaseSheet};
use crate::tables::single_phase as table;
use crate::units::{AbsolutePressure, Temperature};

/// Lowest pressure of the tables, Pa: the triple-point pressure 611.657 Pa.
pub const PRESSURE_MIN_PA: f32 = table::PRESSURE_MIN_PA;
/// Highest pressure of the tables, Pa: 25 MPa.
pub const PRESSURE_MAX_PA: f32 = table::PRESSURE_MAX_PA;
/// Lowest temperature of the tables, K: the triple point 273.16 K.
pub const TEMPERATURE_MIN_K: f32 = table::TEMPERATURE_MIN_K;
/// Highest temperature of the tables, K: 1073.15 K (800 °C).
pub const TEMPERATURE_MAX_K: f32 = table::TEMPERATURE_MAX_K;

/// A single-phase state (compressed/subcooled liquid, superheated vapour, or
/// supercritical fluid). Accuracy of each field: see the module docs.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
pub struct SinglePhaseState {
    /// Absolute pressure (the input, or the input of the (p, h)/(p, s) call).
    pub pressure: AbsolutePressure,
    /// Temperature.
    pub temperature: Temperature,
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
    /// Speed of sound w, m/s.
    pub speed_of_sound_m_s: f32,
    /// Isentropic exponent κ = (ρ/p)·w² (dimensionless), as used in the
    /// expansion factor of differential-pressure meters.
    pub isentropic_exponent: f32,
    /// Dynamic viscosity μ, Pa·s (IAPWS R12-08 industrial form, as in
    /// vapora-tables).
    pub viscosity_pa_s: f32,
    /// T − T_sat(p), K: > 0 superheat of a vapour, < 0 subcooling of a
    /// liquid. `None` at or above the critical pressure (no saturation
    /// temperature there).
    pub saturation_margin_k: Option<f32>,
}

/// Which side of the phase boundary a state is on (result of the (p, T),
/// (p, h) and (p, s) calls).
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum FluidState {
    /// Below T_sat(p) (or, at and above the critical pressure, below
    /// T_split(p) = Tc + k·(p − pc), see the module docs).
    CompressedLiquid(SinglePhaseState),
    /// Inside the dome: dryness fraction and mixture by the lever rule
    /// (as [`crate::mixture`]).
    WetSteam(WetSteam),
    /// Above T_sat(p) (or above T_split(p) when p ≥ pc).
    SuperheatedVapour(SinglePhaseState),
}

/// Why a single-phase call gave no state.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum SinglePhaseError {
    /// Pressure below [`PRESSURE_MIN_PA`].
    PressureBelowRange {
        /// The pressure given, Pa (absolute).
        pressure_pa: f32,
        /// The lowest accepted pressure, Pa.
        minimum_pa: f32,
    },
    /// Pressure above [`PRESSURE_MAX_PA`].
    PressureAboveRange {
        /// The pressure given, Pa (absolute).
        pressure_pa: f32,
        /// The highest accepted pressure, Pa.
        maximum_pa: f32,
    },
    /// Temperature below [`TEMPERATURE_MIN_K`].
    TemperatureBelowRange {
        /// The temperature given, K.
        temperature_k: f32,
        /// The lowest accepted temperature, K.
        minimum_k: f32,
    },
    /// Temperature above [`TEMPERATURE_MAX_K`].
    TemperatureAboveRange {
        /// The temperature given, K.
        temperature_k: f32,
        /// The highest accepted temperature, K.
        maximum_k: f32,
    },
    /// [`superheated_vapour`] called at T ≤ T_sat(p) (or T ≤ T_split(p)
    /// at and above pc).
    NotSuperheated {
        /// T − T_sat(p) (≤ 0), K.
        margin_k: f32,
    },
    /// [`compressed_liquid`] called at T ≥ T_sat(p) (or T ≥ T_split(p)).
    NotSubcooled {
        /// T − T_sat(p) (≥ 0), K.
        margin_k: f32,
    },
    /// The enthalpy given is NaN or infinite.
    EnthalpyNotFinite {
        /// The value given, J/kg.
        enthalpy_j_kg: f32,
    },
    /// The enthalpy lies outside the envelope at this pressure.
    EnthalpyOutOfRange {
        /// The value given, J/kg.
        enthalpy_j_kg: f32,
        /// h(p, 273.16 K), J/kg.
        minimum_j_kg: f32,
        /// h(p, 1073.15 K), J/kg.
        maximum_j_kg: f32,
    },
    /// The entropy given is NaN or infinite.
    EntropyNotFinite {
        /// The value given, J/(kg·K).
        entropy_j_kgk: f32,
    },
    /// The entropy lies outside the envelope at this pressure.
    EntropyOutOfRange {
        /// The value given, J/(kg·K).
        entropy_j_kgk: f32,
        /// s(p, 273.16 K), J/(kg·K).
        minimum_j_kgk: f32,
        /// s(p, 1073.15 K), J/(kg·K).
        maximum_j_kgk: f32,
    },
    /// A generated table is empty or malformed (never written by the
    /// generator; exists so a broken table is an error, not a panic).
    EmptyTable,
    /// The saturation tables failed inside the single-phase envelope (not
    /// expected with the default tables).
    Saturation(SaturationError),
}

impl fmt::Display for SinglePhaseError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            Self::PressureBelowRange {
                pressure_pa,
                minimum_pa,
            } => write!(f, "pressure {pressure_pa} Pa is below the single-phase tables (minimum {minimum_pa} Pa)"),
            Self::PressureAboveRange {
                pressure_pa,
                maximum_pa,
            } => write!(f, "pressure {pressure_pa} Pa is above the single-phase tables (maximum {maximum_pa} Pa)"),
            Self::TemperatureBelowRange {
                temperature_k,
                minimum_k,
            } => write!(f, "temperature {temperature_k} K is below the single-phase tables (minimum {minimum_k} K)"),
            Self::TemperatureAboveRange {
                temperature_k,
                maximum_k,
            } => write!(f, "temperature {temperature_k} K is above the single-phase tables (maximum {maximum_k} K)"),
            Self::NotSuperheated { margin_k } => write!(
                f,
                "not superheated: T - T_sat = {margin_k} K (use the saturation or mixture calls)"
            ),
            Self::NotSubcooled { margin_k } => write!(
                f,
                "not subcooled: T - T_sat = {margin_k} K (use the saturation or mixture calls)"
            ),
            Self::EnthalpyNotFinite { enthalpy_j_kg } => {
                write!(f, "enthalpy {enthalpy_j_kg} J/kg is not a finite number")
            }
            Self::EnthalpyOutOfRange {
                enthalpy_j_kg,
                minimum_j_kg,
                maximum_j_kg,
            } => write!(
                f,
                "enthalpy {enthalpy_j_kg} J/kg is outside {minimum_j_kg} to {maximum_j_kg} J/kg at this pressure"
            ),
            Self::EntropyNotFinite { entropy_j_kgk } => {
                write!(f, "entropy {entropy_j_kgk} J/(kg K) is not a finite number")
            }
            Self::EntropyOutOfRange {
                entropy_j_kgk,
                minimum_j_kgk,
                maximum_j_kgk,
            } => write!(
                f,
                "entropy {entropy_j_kgk} J/(kg K) is outside {minimum_j_kgk} to {maximum_j_kgk} J/(kg K) at this pressure"
            ),
            Self::EmptyTable => write!(f, "a single-phase table is empty or malformed"),
            Self::Saturation(e) => write!(f, "saturation tables: {e}"),
        }
    }
}

impl core::error::Error for SinglePhaseError {}

impl From<SaturationError> for SinglePhaseError {
    fn from(e: SaturationError) -> Self {
        Self::Saturation(e)
    }
}

// Column order of the forward sheets (the generator's layout).
const DENSITY: usize = 0;
const ENTHALPY: usize = 1;
const ENTROPY: usize = 2;
const INVERSE_CP: usize = 3;
const SPEED_OF_SOUND: usize = 4;
const LN_VISCOSITY: usize = 5;

/// Smallest 1/cp used, kg·K/J: caps cp at 1e10 J/(kg·K), as the saturation
/// tables do, should the spline of 1/cp approach zero next to the critical
/// point.
const INVERSE_CP_FLOOR: f32 = 1e-10;

/// Narrowest sheet width used, K (a sheet vanishes where two of its edges
/// meet, e.g. at the triple point or at p_b).
const MIN_WIDTH_K: f32 = 1e-6;

#[derive(Clone, Copy, PartialEq, Eq)]
enum Sheet {
    VapourLow,
    LiquidLow,
    LiquidHigh,
    LiquidNearCritical,
    VapourNearCritical,
    VapourHigh,
}

impl Sheet {
    fn data(self) -> &'static SinglePhaseSheet {
        match self {
            Self::VapourLow => &table::VAPOUR_LOW,
            Self::LiquidLow => &table::LIQUID_LOW,
            Self::LiquidHigh => &table::LIQUID_HIGH,
            Self::LiquidNearCritical => &table::LIQUID_NEAR_CRITICAL,
            Self::VapourNearCritical => &table::VAPOUR_NEAR_CRITICAL,
            Self::VapourHigh => &table::VAPOUR_HIGH,
        }
    }

    fn is_liquid(self) -> bool {
        matches!(
            self,
            Self::LiquidLow | Self::LiquidHigh | Self::LiquidNearCritical
        )
    }

    /// Whether y = 1 is an end of the envelope (273.16 K or 1073.15 K).
    fn far_edge_is_envelope(self) -> bool {
        matches!(
            self,
            Self::VapourLow | Self::LiquidLow | Self::LiquidHigh | Self::VapourHigh
        )
    }
}

/// B23 temperature at a pressure, K (IAPWS R7-97(2012), Eq. 6, Table 1),
/// for p from p_b (where it is 623.15 K) up.
#[inline]
fn b23_temperature_k(p_pa: f32) -> f32 {
    // The release's coefficients in full, rounded to f32 by the compiler.
    #[allow(clippy::excessive_precision)]
    const N3: f32 = 0.101_929_700_393_26e-2;
    #[allow(clippy::excessive_precision)]
    const N4: f32 = 0.572_544_598_627_46e3;
    #[allow(clippy::excessive_precision)]
    const N5: f32 = 0.139_188_397_788_70e2;
    let ratio = (p_pa * 1.0e-6 - N5) * (1.0 / N3);
    N4 + fast_math::sqrt(if ratio > 0.0 { ratio } else { 0.0 })
}

/// The sheet's x coordinate of a pressure (see the module docs).
#[inline]
fn x_of(sheet: Sheet, p_pa: f32) -> f32 {
    let to_critical = p_pa - table::CRITICAL_PRESSURE_PA;
    match sheet {
        Sheet::VapourLow | Sheet::LiquidLow => {
            fast_math::ln(p_pa) + p_pa * table::X_INVERSE_PRESSURE_SCALE_PA
        }
        Sheet::LiquidHigh | Sheet::VapourHigh => p_pa * 1.0e-6,
        Sheet::LiquidNearCritical | Sheet::VapourNearCritical => {
            fast_math::asinh(to_critical * table::CRITICAL_INVERSE_SCALE_PA)
                + to_critical * table::CRITICAL_INVERSE_LINEAR_SCALE_PA
        }
    }
}

/// Where the sheet's coordinates put a pressure: x, the edges and the stretch.
#[derive(Clone, Copy)]
struct Geometry {
    x: f32,
    t0: f32,
    direction: f32,
    width: f32,
    delta: f32,
    log_span: f32,
}

impl Geometry {
    #[inline]
    fn new(sheet: Sheet, p_pa: f32, edge_k: f32) -> Self {
        Self::at_x(sheet, p_pa, edge_k, x_of(sheet, p_pa))
    }

    /// As [`Self::new`] with the sheet's x coordinate of `p_pa` already
    /// computed.
    #[inline(always)]
    fn at_x(sheet: Sheet, p_pa: f32, edge_k: f32, x: f32) -> Self {
        let data = sheet.data();
        let (t0, t1) = match sheet {
            Sheet::VapourLow => (edge_k, TEMPERATURE_MAX_K),
            Sheet::LiquidLow => (edge_k, TEMPERATURE_MIN_K),
            Sheet::LiquidHigh => (table::REGION3_TEMPERATURE_K, TEMPERATURE_MIN_K),
            Sheet::LiquidNearCritical => (edge_k, table::REGION3_TEMPERATURE_K),
            Sheet::VapourNearCritical => (edge_k, b23_temperature_k(p_pa)),
            Sheet::VapourHigh => (b23_temperature_k(p_pa), TEMPERATURE_MAX_K),
        };
        let direction = if sheet.is_liquid() { -1.0 } else { 1.0 };
        let width = direction * (t1 - t0);
        let width = if width > MIN_WIDTH_K {
            width
        } else {
            MIN_WIDTH_K
        };
        // δ = δ_base + δ_slope·√((p − p_ref)² + p_m²), in units of p_m.
        let d = (p_pa - data.cluster_reference_pa) * table::CLUSTER_INVERSE_SMOOTHING_PA;
        let delta = data.cluster_base_k
            + data.cluster_slope_k_pa
                * fast_math::sqrt(d * d + 1.0)
                * (1.0 / table::CLUSTER_INVERSE_SMOOTHING_PA);
        Self {
            x,
            t0,
            direction,
            width,
            delta,
            log_span: fast_math::ln_1p(width / delta),
        }
    }

    /// y of a temperature, 0 to 1.
    #[inline]
    fn y_of(&self, t_k: f32) -> f32 {
        let d = self.direction * (t_k - self.t0);
        let d = if d > 0.0 { d } else { 0.0 };
        clamp_unit(fast_math::ln_1p(d / self.delta) / self.log_span)
    }

    /// ψ of a property fraction φ (the inverse sheets' coordinate).
    #[inline]
    fn psi_of(&self, phi: f32) -> f32 {
        let phi = clamp_unit(phi);
        clamp_unit(fast_math::ln_1p(phi * self.width / self.delta) / self.log_span)
    }

    /// Temperature at y.
    #[inline]
    fn t_of(&self, y: f32) -> f32 {
        self.t0 + self.direction * self.delta * fast_math::exp_m1(y * self.log_span)
    }
}

/// `v` clamped to [0, 1] (NaN to 0).
#[inline]
fn clamp_unit(v: f32) -> f32 {
    if v > 1.0 {
        1.0
    } else if v > 0.0 {
        v
    } else {
        0.0
    }
}

fn check_pressure(p_pa: f32) -> Result<(), SinglePhaseError> {
    if p_pa.is_nan() || p_pa < PRESSURE_MIN_PA {
        return Err(SinglePhaseError::PressureBelowRange {
            pressure_pa: p_pa,
            minimum_pa: PRESSURE_MIN_PA,
        });
    }
    if p_pa > PRESSURE_MAX_PA {
        return Err(SinglePhaseError::PressureAboveRange {
            pressure_pa: p_pa,
            maximum_pa: PRESSURE_MAX_PA,
        });
    }
    Ok(())
}

fn check_temperature(t_k: f32) -> Result<(), SinglePhaseError> {
    if t_k.is_nan() || t_k < TEMPERATURE_MIN_K {
        return Err(SinglePhaseError::TemperatureBelowRange {
            temperature_k: t_k,
            minimum_k: TEMPERATURE_MIN_K,
        });
    }
    if t_k > TEMPERATURE_MAX_K {
        return Err(SinglePhaseError::TemperatureAboveRange {
            temperature_k: t_k,
            maximum_k: TEMPERATURE_MAX_K,
        });
    }
    Ok(())
}

/// The liquid/vapour edge at a pressure: T_sat(p) below pc (from the
/// saturation tables), T_split(p) = Tc + k·(p − pc) from pc up; and
/// whether a saturation temperature exists there.
#[inline]
fn edge_temperature(p_pa: f32) -> Result<(f32, bool), SinglePhaseError> {
    if p_pa < table::CRITICAL_PRESSURE_PA {
        let p = if p_pa > saturation::PRESSURE_MIN_PA {
            p_pa
        } else {
            saturation::PRESSURE_MIN_PA
        };
        let t = saturation::saturation_temperature(AbsolutePressure::from_table_pa(p))?;
        Ok((t.as_kelvin(), true))
    } else {
        let d = p_pa - table::CRITICAL_PRESSURE_PA;
        Ok((
            table::CRITICAL_TEMPERATURE_K
                + d * (table::SPLIT_SLOPE_K_PA + d * table::SPLIT_CURVATURE_K_PA2),
            false,
        ))
    }
}

/// The state on a sheet at table position y (temperature `t_k`).
#[inline]
fn state_on_sheet(
    sheet: Sheet,
    g: &Geometry,
    y: f32,
    p_pa: f32,
    t_k: f32,
    edge_k: f32,
    saturated: bool,
) -> Result<SinglePhaseState, SinglePhaseError> {
    let data = sheet.data();
    let q = data
        .properties
        .evaluate(g.x, y)
        .ok_or(SinglePhaseError::EmptyTable)?;
    let density = if data.density_over_pressure {
        q[DENSITY] * p_pa
    } else {
        q[DENSITY]
    };
    let w = q[SPEED_OF_SOUND];
    Ok(SinglePhaseState {
        pressure: AbsolutePressure::from_table_pa(p_pa),
        temperature: Temperature::from_table_k(t_k),
        density_kg_m3: density,
        specific_volume_m3_kg: 1.0 / density,
        enthalpy_j_kg: q[ENTHALPY],
        entropy_j_kgk: q[ENTROPY],
        cp_j_kgk: 1.0 / at_least(q[INVERSE_CP], INVERSE_CP_FLOOR),
        speed_of_sound_m_s: w,
        isentropic_exponent: density * w * w / p_pa,
        viscosity_pa_s: fast_math::exp(q[LN_VISCOSITY]),
        saturation_margin_k: if saturated { Some(t_k - edge_k) } else { None },
    })
}

fn state_at(
    sheet: Sheet,
    p_pa: f32,
    t_k: f32,
    edge_k: f32,
    saturated: bool,
) -> Result<SinglePhaseState, SinglePhaseError> {
    let g = Geometry::new(sheet, p_pa, edge_k);
    let y = g.y_of(t_k);
    state_on_sheet(sheet, &g, y, p_pa, t_k, edge_k, saturated)
}

fn vapour_sheet(p_pa: f32, t_k: f32) -> Sheet {
    if p_pa < table::BOUNDARY_PRESSURE_PA {
        Sheet::VapourLow
    } else if t_k < b23_temperature_k(p_pa) {
        Sheet::VapourNearCritical
    } else {
        Sheet::VapourHigh
    }
}

fn liquid_sheet(p_pa: f32, t_k: f32) -> Sheet {
    if p_pa < table::BOUNDARY_PRESSURE_PA {
        Sheet::LiquidLow
    } else if t_k <= table::REGION3_TEMPERATURE_K {
        Sheet::LiquidHigh
    } else {
        Sheet::LiquidNearCritical
    }
}

/// Superheated vapour at (p, T): IF97 Region 2 and the vapour side of
/// Region 3; at and above the critical pressure, the fluid above
/// T_split(p) = Tc + k·(p − pc) (k ≈ 3.7 K/MPa, see the module docs).
///
/// Range: the envelope ([`PRESSURE_MIN_PA`] … [`PRESSURE_MAX_PA`],
/// [`TEMPERATURE_MIN_K`] … [`TEMPERATURE_MAX_K`]) above the saturation
/// line. Accuracy: see the module docs (stated down to 0.01 K above
/// saturation).
///
/// ```
/// use vapora_kernel::single_phase::superheated_vapour;
/// use vapora_kernel::units::{AbsolutePressure, Temperature};
/// // Steam at 40 bar(a), 400 °C; IF97 (vapora-tables, f64) gives
/// // ρ = 13.618 kg/m³ and h = 3214.37 kJ/kg there.
/// let s = superheated_vapour(AbsolutePressure::from_bar(40.0)?, Temperature::from_celsius(400.0)?)?;
/// assert!((s.density_kg_m3 - 13.618).abs() < 0.001);
/// assert!((s.enthalpy_j_kg - 3214.37e3).abs() < 20.0);
/// assert!(s.saturation_margin_k.unwrap() > 140.0);
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// The range errors of [`SinglePhaseError`]; [`SinglePhaseError::NotSuperheated`]
/// with the (non-positive) margin T − T_sat(p) at or below saturation.
pub fn superheated_vapour(
    pressure: AbsolutePressure,
    temperature: Temperature,
) -> Result<SinglePhaseState, SinglePhaseError> {
    let p = pressure.as_pa();
    let t = temperature.as_kelvin();
    check_pressure(p)?;
    check_temperature(t)?;
    let (edge, saturated) = edge_temperature(p)?;
    if t <= edge || t.is_nan() {
        return Err(SinglePhaseError::NotSuperheated { margin_k: t - edge });
    }
    state_at(vapour_sheet(p, t), p, t, edge, saturated)
}

/// Compressed (subcooled) liquid at (p, T): IF97 Region 1 and the liquid
/// side of Region 3; at and above the critical pressure, the fluid below
/// T_split(p).
///
/// Range: the envelope below the saturation line. Accuracy: see the module
/// docs (stated down to 0.01 K below saturation).
///
/// ```
/// use vapora_kernel::single_phase::compressed_liquid;
/// use vapora_kernel::units::{AbsolutePressure, Temperature};
/// // Water at 60 bar(a), 150 °C; IF97 (vapora-tables, f64) gives
/// // ρ = 920.113 kg/m³ there.
/// let w = compressed_liquid(AbsolutePressure::from_bar(60.0)?, Temperature::from_celsius(150.0)?)?;
/// assert!((w.density_kg_m3 - 920.113).abs() < 0.01);
/// assert!(w.saturation_margin_k.unwrap() < -100.0);
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// The range errors of [`SinglePhaseError`]; [`SinglePhaseError::NotSubcooled`]
/// with the (non-negative) margin T − T_sat(p) at or above saturation.
pub fn compressed_liquid(
    pressure: AbsolutePressure,
    temperature: Temperature,
) -> Result<SinglePhaseState, SinglePhaseError> {
    let p = pressure.as_pa();
    let t = temperature.as_kelvin();
    check_pressure(p)?;
    check_temperature(t)?;
    let (edge, saturated) = edge_temperature(p)?;
    if t >= edge || t.is_nan() {
        return Err(SinglePhaseError::NotSubcooled { margin_k: t - edge });
    }
    state_at(liquid_sheet(p, t), p, t, edge, saturated)
}

/// Either single phase at (p, T), chosen from T against T_sat(p) (or
/// T_split(p) at and above pc). A point exactly on saturation is an error
/// ([`SinglePhaseError::NotSuperheated`] with margin 0): a (p, T) pair
/// cannot say how much of each phase is present; use
/// [`crate::saturation`] or [`crate::mixture`] there.
///
/// Range and accuracy as [`superheated_vapour`] and [`compressed_liquid`].
///
/// ```
/// use vapora_kernel::single_phase::{state_at_pressure_temperature, FluidState};
/// use vapora_kernel::units::{AbsolutePressure, Temperature};
/// let s = state_at_pressure_temperature(AbsolutePressure::from_bar(10.0)?, Temperature::from_celsius(20.0)?)?;
/// assert!(matches!(s, FluidState::CompressedLiquid(_)));
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// The range errors of [`SinglePhaseError`], and `NotSuperheated { margin_k: 0.0 }`
/// exactly on saturation.
pub fn state_at_pressure_temperature(
    pressure: AbsolutePressure,
    temperature: Temperature,
) -> Result<FluidState, SinglePhaseError> {
    let p = pressure.as_pa();
    let t = temperature.as_kelvin();
    check_pressure(p)?;
    check_temperature(t)?;
    let (edge, saturated) = edge_temperature(p)?;
    if t > edge {
        state_at(vapour_sheet(p, t), p, t, edge, saturated).map(FluidState::SuperheatedVapour)
    } else if t < edge {
        state_at(liquid_sheet(p, t), p, t, edge, saturated).map(FluidState::CompressedLiquid)
    } else {
        Err(SinglePhaseError::NotSuperheated { margin_k: 0.0 })
    }
}

/// Which property the cross-phase call is given.
#[derive(Clone, Copy)]
enum Given {
    Enthalpy(f32),
    Entropy(f32),
}

impl Given {
    fn column(self) -> usize {
        match self {
            Self::Enthalpy(_) => ENTHALPY,
            Self::Entropy(_) => ENTROPY,
        }
    }

    fn value(self) -> f32 {
        match self {
            Self::Enthalpy(v) | Self::Entropy(v) => v,
        }
    }

    fn out_of_range(self, minimum: f32, maximum: f32) -> SinglePhaseError {
        match self {
            Self::Enthalpy(v) => SinglePhaseError::EnthalpyOutOfRange {
                enthalpy_j_kg: v,
                minimum_j_kg: minimum,
                maximum_j_kg: maximum,
            },
            Self::Entropy(v) => SinglePhaseError::EntropyOutOfRange {
                entropy_j_kgk: v,
                minimum_j_kgk: minimum,
                maximum_j_kgk: maximum,
            },
        }
    }
}

/// The given property on both edges of a sheet (y = 0, y = 1) at the
/// sheet's x.
#[inline]
fn on_edges(sheet: Sheet, x: f32, column: usize) -> Result<(f32, f32), SinglePhaseError> {
    sheet
        .data()
        .properties
        .evaluate_edges(x, column)
        .ok_or(SinglePhaseError::EmptyTable)
}

/// The cold and hot ends of the envelope for the error of a (p, h) or
/// (p, s) call out of range (the rare path).
#[cold]
fn envelope_error(p_pa: f32, given: Given) -> SinglePhaseError {
    let (cold, hot) = if p_pa < table::BOUNDARY_PRESSURE_PA {
        (Sheet::LiquidLow, Sheet::VapourLow)
    } else {
        (Sheet::LiquidHigh, Sheet::VapourHigh)
    };
    let column = given.column();
    let at =
        |sheet: Sheet| on_edges(sheet, x_of(sheet, p_pa), column).map_or(f32::NAN, |(_, far)| far);
    given.out_of_range(at(cold), at(hot))
}

/// The state on `sheet` with the given property, through the inverse sheet.
/// `known`: the sheet's x of p and the given property on the sheet's edges
/// there, if the caller has them already.
fn state_from_given(
    sheet: Sheet,
    p_pa: f32,
    edge_k: f32,
    saturated: bool,
    given: Given,
    known: Option<(f32, (f32, f32))>,
) -> Result<SinglePhaseState, SinglePhaseError> {
    let (g, edges) = match known {
        Some((x, edges)) => (Geometry::at_x(sheet, p_pa, edge_k, x), Some(edges)),
        None => (Geometry::new(sheet, p_pa, edge_k), None),
    };
    let column = given.column();
    let (at0, at1) = match edges {
        Some(e) => e,
        None => on_edges(sheet, g.x, column)?,
    };
    let span = at1 - at0;
    let phi = if span != 0.0 {
        (given.value() - at0) / span
    } else {
        0.0
    };
    // Beyond the far edge of a sheet that ends the envelope: out of range.
    // (Slightly below 0 or beyond the far edge of an inner sheet is the
    // rounding between neighbouring sheets, and is clamped.)
    if sheet.far_edge_is_envelope() && phi > 1.0 + 1e-6 {
        return Err(envelope_error(p_pa, given));
    }
    let inverse = match given {
        Given::Enthalpy(_) => &sheet.data().y_of_enthalpy,
        Given::Entropy(_) => &sheet.data().y_of_entropy,
    };
    let y = clamp_unit(
        inverse
            .evaluate_one(g.x, g.psi_of(phi), 0)
            .ok_or(SinglePhaseError::EmptyTable)?,
    );
    let t0 = g.t_of(y);
    // Corrected in place (no copy of the state).
    let mut result = state_on_sheet(sheet, &g, y, p_pa, t0, edge_k, saturated);
    if let Ok(state) = result.as_mut() {
        correct(state, &g, given, t0, edge_k);
    }
    result
}

/// The single explicit correction of a (p, h) or (p, s) state (one step,
/// not an iteration, see the module docs): the forward sheet at T0 (from
/// the inverse sheet) gave h(T0), s(T0) and cp(T0); at constant p,
/// dh = cp·dT and ds = cp·dT/T, so T1 = T0 + (h − h(T0))/cp(T0) or
/// T1 = T0 + (s − s(T0))·T0/cp(T0), clamped to the sheet's temperature
/// edges (it never crosses saturation, T_split, 623.15 K or B23). The given
/// property is returned as given, the other of h and s moved to first order
/// with dh = T0·ds; ρ, v, cp, w, κ and μ stay those at T0.
#[inline]
fn correct(state: &mut SinglePhaseState, g: &Geometry, given: Given, t0: f32, edge_k: f32) {
    let dh = match given {
        Given::Enthalpy(h) => {
            let dh = h - state.enthalpy_j_kg;
            state.enthalpy_j_kg = h;
            state.entropy_j_kgk += dh / t0;
            dh
        }
        Given::Entropy(s) => {
            let dh = (s - state.entropy_j_kgk) * t0;
            state.entropy_j_kgk = s;
            state.enthalpy_j_kg += dh;
            dh
        }
    };
    // Distance from the sheet's y = 0 edge towards its far edge, kept
    // within the sheet: 0 to its width.
    let d = g.direction * (t0 + dh / state.cp_j_kgk - g.t0);
    let d = if d > g.width {
        g.width
    } else if d > 0.0 {
        d
    } else {
        0.0
    };
    let t1 = g.t0 + g.direction * d;
    state.temperature = Temperature::from_table_k(t1);
    if let Some(margin) = state.saturation_margin_k.as_mut() {
        *margin = t1 - edge_k;
    }
}

fn state_across_phases(
    pressure: AbsolutePressure,
    given: Given,
) -> Result<FluidState, SinglePhaseError> {
    let p = pressure.as_pa();
    check_pressure(p)?;
    let value = given.value();
    let column = given.column();
    // Which side of the dome (or of T_split above pc); one look-up of the
    // saturation tables gives T_sat and the saturated values.
    let (edge, saturated, vapour, near_critical_edges) = if p < table::CRITICAL_PRESSURE_PA {
        // The saturation tables' pressure (the input, or their lowest
        // pressure for an input a hair below it).
        let p_sat = if p > saturation::PRESSURE_MIN_PA {
            p
        } else {
            saturation::PRESSURE_MIN_PA
        };
        let (block, t, t_sat) =
            saturation::interval_at_pressure(AbsolutePressure::from_table_pa(p_sat))?;
        let (liquid_value, vapour_value) = match given {
            Given::Enthalpy(_) => (
                saturation::liquid_enthalpy(block, t),
                saturation::vapour_enthalpy(block, t),
            ),
            Given::Entropy(_) => (
                saturation::liquid_entropy(block, t),
                saturation::vapour_entropy(block, t),
            ),
        };
        if value > vapour_value {
            (t_sat, true, true, None)
        } else if value >= liquid_value {
            let span = vapour_value - liquid_value;
            let x = clamp_unit(if span > 0.0 {
                (value - liquid_value) / span
            } else {
                0.0
            });
            let h_l = saturation::liquid_enthalpy(block, t);
            let s_l = saturation::liquid_entropy(block, t);
            let v_l = 1.0 / saturation::liquid_density(block, t);
            let v_v = 1.0 / saturation::vapour_density(block, t, p_sat);
            let v = v_l + x * (v_v - v_l);
            return Ok(FluidState::WetSteam(WetSteam {
                pressure: AbsolutePressure::from_table_pa(p_sat),
                temperature: Temperature::from_table_k(t_sat),
                dryness_fraction: x,
                enthalpy_j_kg: h_l + x * (saturation::vapour_enthalpy(block, t) - h_l),
                entropy_j_kgk: s_l + x * (saturation::vapour_entropy(block, t) - s_l),
                specific_volume_m3_kg: v,
                density_kg_m3: 1.0 / v,
            }));
        } else {
            (t_sat, true, false, None)
        }
    } else {
        let (edge, _) = edge_temperature(p)?;
        let sheet = Sheet::VapourNearCritical;
        let x = x_of(sheet, p);
        let edges = on_edges(sheet, x, column)?;
        (edge, false, value >= edges.0, Some((x, edges)))
    };
    let low = p < table::BOUNDARY_PRESSURE_PA;
    if vapour {
        let (sheet, edges) = if low {
            (Sheet::VapourLow, None)
        } else {
            let high = Sheet::VapourHigh;
            let x = x_of(high, p);
            let high_edges = on_edges(high, x, column)?;
            if value < high_edges.0 {
                (Sheet::VapourNearCritical, near_critical_edges)
            } else {
                (Sheet::VapourHigh, Some((x, high_edges)))
            }
        };
        state_from_given(sheet, p, edge, saturated, given, edges).map(FluidState::SuperheatedVapour)
    } else {
        let (sheet, edges) = if low {
            (Sheet::LiquidLow, None)
        } else {
            let high = Sheet::LiquidHigh;
            let x = x_of(high, p);
            let high_edges = on_edges(high, x, column)?;
            if value <= high_edges.0 {
                (Sheet::LiquidHigh, Some((x, high_edges)))
            } else {
                (Sheet::LiquidNearCritical, None)
            }
        };
        state_from_given(sheet, p, edge, saturated, given, edges).map(FluidState::CompressedLiquid)
    }
}

/// The state at (p, h) across phases: compressed liquid, wet steam (with its
/// dryness fraction, when h'(p) ≤ h ≤ h''(p) from [`crate::saturation`]) or
/// superheated vapour. No iteration: an inverse table gives T0 from the
/// enthalpy fraction between the edges of the sheet, the forward sheet the
/// state at (p, T0), and one explicit correction step
/// T = T0 + (h − h(T0))/cp(T0) (see the module docs).
///
/// Range: the envelope; h between h(p, 273.16 K) and h(p, 1073.15 K).
/// Accuracy: T within the (p, h) bound of the module docs; h is returned
/// as given, s moved to first order (ds = dh/T0); ρ, v, cp, w, κ and μ are
/// the (p, T) state's at T0, a few mK from T at most (module docs). In the
/// dome: as [`crate::mixture`].
///
/// ```
/// use vapora_kernel::single_phase::{state_at_pressure_enthalpy, FluidState};
/// use vapora_kernel::units::AbsolutePressure;
/// let p = AbsolutePressure::from_bar(40.0)?;
/// // h(40 bar, 400 °C) = 3214.37 kJ/kg (IF97, vapora-tables).
/// match state_at_pressure_enthalpy(p, 3214.37e3)? {
///     FluidState::SuperheatedVapour(s) => assert!((s.temperature.as_celsius() - 400.0).abs() < 0.01),
///     other => panic!("expected vapour, got {other:?}"),
/// }
/// match state_at_pressure_enthalpy(p, 2000.0e3)? {
///     FluidState::WetSteam(w) => assert!(w.dryness_fraction > 0.5 && w.dryness_fraction < 0.6),
///     other => panic!("expected wet steam, got {other:?}"),
/// }
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// [`SinglePhaseError::EnthalpyNotFinite`], the pressure range errors,
/// [`SinglePhaseError::EnthalpyOutOfRange`] beyond the envelope's ends.
pub fn state_at_pressure_enthalpy(
    pressure: AbsolutePressure,
    enthalpy_j_kg: f32,
) -> Result<FluidState, SinglePhaseError> {
    if !enthalpy_j_kg.is_finite() {
        return Err(SinglePhaseError::EnthalpyNotFinite { enthalpy_j_kg });
    }
    state_across_phases(pressure, Given::Enthalpy(enthalpy_j_kg))
}

/// The state at (p, s) across phases, as [`state_at_pressure_enthalpy`]
/// with the entropy (for isentropic expansion: turbine stages, nozzles).
///
/// Range: the envelope; s between s(p, 273.16 K) and s(p, 1073.15 K).
/// Accuracy: T within the (p, s) bound of the module docs (one correction
/// step T = T0 + (s − s(T0))·T0/cp(T0)); s is returned as given, h moved
/// to first order (dh = T0·ds); ρ, v, cp, w, κ and μ are those at T0.
///
/// ```
/// use vapora_kernel::single_phase::{state_at_pressure_entropy, FluidState};
/// use vapora_kernel::units::AbsolutePressure;
/// // s(40 bar, 400 °C) = 6771.19 J/(kg·K) (IF97, vapora-tables).
/// match state_at_pressure_entropy(AbsolutePressure::from_bar(40.0)?, 6771.19)? {
///     FluidState::SuperheatedVapour(s) => assert!((s.temperature.as_celsius() - 400.0).abs() < 0.01),
///     other => panic!("expected vapour, got {other:?}"),
/// }
/// # Ok::<(), Box<dyn core::error::Error>>(())
/// ```
///
/// # Errors
/// [`SinglePhaseError::EntropyNotFinite`], the pressure range errors,
/// [`SinglePhaseError::EntropyOutOfRange`] beyond the envelope's ends.
pub fn state_at_pressure_entropy(
    pressure: AbsolutePressure,
    entropy_j_kgk: f32,
) -> Result<FluidState, SinglePhaseError> {
    if !entropy_j_kgk.is_finite() {
        return Err(SinglePhaseError::EntropyNotFinite { entropy_j_kgk });
    }
    state_across_phases(pressure, Given::Entropy(entropy_j_kgk))
}
