//! Exact inversions of the (p, T) equations: the temperature at a given
//! pressure and enthalpy, or pressure and entropy, in Regions 1, 2, 3 and 5,
//! with the two-phase dome reported as Region 4.
//!
//! Method: the region is found from the pressure and the values of h (or s)
//! on the region boundaries at that pressure; the temperature then comes
//! from a Newton iteration on the forward equation, (∂h/∂T)_p = cp and
//! (∂s/∂T)_p = cp/T, kept inside a bracket of the region's temperature range
//! (falling back to bisection when a step would leave it). The starting
//! value is the backward equation of IAPWS R7-97(2012) ([`super::backward`])
//! in Regions 1 and 2, and linear interpolation in Regions 3 and 5. The
//! iteration stops when the forward value matches the input to
//! 1e-12 relative (plus 1e-8 J/kg or 1e-11 J/(kg·K) absolute, for values
//! near 0 at the triple point), so the result agrees with the forward
//! equations far better than the backward equations alone (25 mK).
//!
//! Region boundaries: where two regions meet (623.15 K, the B23 line,
//! 1073.15 K) their values of h and s differ slightly (the release's
//! boundary inconsistency, tens of J/kg). An input that falls in such a gap
//! is given to the lower-temperature region, whose equation is then used a
//! little beyond its boundary, so that the returned T always reproduces the
//! input through the forward equation of the returned region.
//!
//! Near the critical point: within about 100 Pa of 22.064 MPa the Region 3
//! isotherms are so flat near the saturated states that h(p, T) and s(p, T)
//! are themselves ill-conditioned. The returned T still reproduces the input
//! through this crate's Region 3 evaluation on the input's branch to the
//! stated tolerance, but an independent density solve at that (p, T) agrees
//! only to about 1e-8 (10–100 Pa below pc) … 1e-5 (at pc) relative in h
//! (measured by the test suite). A (p, T) pair within a few mPa of the
//! saturation line cannot say which branch it is on; `properties_pt` decides
//! by psat(T) there, so for such T prefer the states of [`super::saturation`].
//!
//! Two-phase states: for 611.213 Pa ≤ p < 22.064 MPa and h′ < h < h″ (or
//! s′ < s < s″), with h′, h″ the saturated states of [`super::saturation`],
//! the result is `(Tsat(p), Region::Region4)`; the dryness fraction is then
//! x = (h − h′)/(h″ − h′) and is left to the caller.

use super::backward;
use super::region3::{self, Branch};
use super::region4::saturation_temperature_k_unchecked;
use super::saturation;
use super::{
    b23, region1, region2, region5, require_finite, FormulationError, Properties, Region,
    CRITICAL_PRESSURE_PA,
};

/// Which second property is given with the pressure.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Quantity {
    Enthalpy,
    Entropy,
}

impl Quantity {
    /// The property and its isobaric temperature derivative.
    fn of(self, props: &Properties) -> (f64, f64) {
        match self {
            Quantity::Enthalpy => (props.enthalpy_j_kg, props.cp_j_kgk),
            Quantity::Entropy => (props.entropy_j_kgk, props.cp_j_kgk / props.temperature_k),
        }
    }

    /// Absolute part of the stopping tolerance.
    fn absolute_tolerance(self) -> f64 {
        match self {
            Quantity::Enthalpy => 1e-8,
            Quantity::Entropy => 1e-11,
        }
    }
}

/// Lowest temperature of IF97, K.
const T_MIN_K: f64 = 273.15;
/// Region 1 / Region 3 boundary temperature, K.
const T_13_K: f64 = 623.15;
/// Region 2 / Region 5 boundary temperature, K.
const T_25_K: f64 = 1073.15;
/// Highest temperature of Region 5, K.
const T_MAX_K: f64 = 2273.15;
/// Highest pressure of Region 5, Pa.
const P_MAX_5_PA: f64 = 50.0e6;
/// Highest pressure of IF97, Pa.
const P_MAX_PA: f64 = 100.0e6;
/// Saturation pressure at 623.15 K, Pa: below it Regions 1 and 2 meet on
/// the saturation line, above it Region 3 lies between them.
fn p_13_sat_pa() -> f64 {
    super::region4::saturation_pressure_pa_unchecked(T_13_K)
}
/// How far past its boundary a region's equation is used to close a gap, K.
const GAP_EXTENSION_K: f64 = 1.0;

/// A region equation at fixed pressure as a function of temperature.
#[derive(Debug, Clone, Copy)]
enum Equation {
    Region1,
    Region2,
    Region3(Branch),
    Region5,
}

impl Equation {
    fn region(self) -> Region {
        match self {
            Equation::Region1 => Region::Region1,
            Equation::Region2 => Region::Region2,
            Equation::Region3(_) => Region::Region3,
            Equation::Region5 => Region::Region5,
        }
    }

    fn properties(self, p: f64, t: f64) -> Result<Properties, FormulationError> {
        Ok(match self {
            Equation::Region1 => region1::properties_unchecked(p, t),
            Equation::Region2 => region2::properties_unchecked(p, t),
            Equation::Region5 => region5::properties_unchecked(p, t),
            Equation::Region3(branch) => {
                let rho = region3::density_on_branch(p, t, branch)?;
                region3::properties_rho_t_unchecked(rho, t)
            }
        })
    }

    fn value(self, q: Quantity, p: f64, t: f64) -> Result<(f64, f64), FormulationError> {
        Ok(q.of(&self.properties(p, t)?))
    }
}

/// Newton iteration for T with f(T) = target on [lo, hi], f increasing.
fn solve(
    eq: Equation,
    q: Quantity,
    p: f64,
    target: f64,
    bracket: (f64, f64),
    start: f64,
) -> Result<f64, FormulationError> {
    let (mut lo, mut hi) = bracket;
    let tolerance = 1e-12 * libm::fabs(target) + q.absolute_tolerance();
    let mut t = if start.is_finite() && start > lo && start < hi {
        start
    } else {
        0.5 * (lo + hi)
    };
    for _ in 0..100 {
        let (f, df) = eq.value(q, p, t)?;
        let r = f - target;
        if libm::fabs(r) <= tolerance {
            return Ok(t);
        }
        if r < 0.0 {
            lo = t;
        } else {
            hi = t;
        }
        if hi - lo <= 4.0 * f64::EPSILON * hi {
            return Ok(t);
        }
        let newton = t - r / df;
        t = if df > 0.0 && newton > lo && newton < hi {
            newton
        } else {
            0.5 * (lo + hi)
        };
    }
    Err(FormulationError::NoConvergence)
}

/// Linear interpolation of T between two boundary values, as a start.
fn interpolate(target: f64, (t0, f0): (f64, f64), (t1, f1): (f64, f64)) -> f64 {
    t0 + (t1 - t0) * (target - f0) / (f1 - f0)
}

/// The backward-equation starting value for Regions 1 and 2.
fn backward_start(eq: Equation, q: Quantity, p: f64, x: f64) -> f64 {
    match (eq, q) {
        (Equation::Region1, Quantity::Enthalpy) => backward::region1_temperature_ph_unchecked(p, x),
        (Equation::Region1, Quantity::Entropy) => backward::region1_temperature_ps_unchecked(p, x),
        (Equation::Region2, Quantity::Enthalpy) => backward::region2_temperature_ph_unchecked(p, x),
        (Equation::Region2, Quantity::Entropy) => backward::region2_temperature_ps_unchecked(p, x),
        _ => f64::NAN,
    }
}

/// One candidate region at the given pressure: equation and temperature range.
struct Span {
    eq: Equation,
    t_lo: f64,
    t_hi: f64,
}

/// The general inversion.
fn invert(q: Quantity, p: f64, x: f64) -> Result<(f64, Region), FormulationError> {
    require_finite(&[p, x])?;
    if !(p > 0.0 && p <= P_MAX_PA) {
        return Err(FormulationError::PressureOutOfRange { pressure_pa: p });
    }
    let at = |eq: Equation, t: f64| -> Result<f64, FormulationError> { Ok(eq.value(q, p, t)?.0) };

    // The ordered list of single-phase spans at this pressure, from cold to
    // hot, and the two-phase interval between two of them if there is one.
    let mut spans: [Option<Span>; 5] = [None, None, None, None, None];
    let mut dome: Option<(f64, f64, f64)> = None; // (x', x'', Tsat)
    let p13 = p_13_sat_pa();
    if p <= p13 {
        if p >= saturation::MIN_PRESSURE_PA {
            let tsat = saturation_temperature_k_unchecked(p).min(T_13_K);
            let sat = saturation::at_pressure(p)?;
            dome = Some((q.of(&sat.liquid).0, q.of(&sat.vapour).0, tsat));
            spans[0] = Some(Span {
                eq: Equation::Region1,
                t_lo: T_MIN_K,
                t_hi: tsat,
            });
            spans[2] = Some(Span {
                eq: Equation::Region2,
                t_lo: tsat,
                t_hi: T_25_K,
            });
        } else {
            spans[2] = Some(Span {
                eq: Equation::Region2,
                t_lo: T_MIN_K,
                t_hi: T_25_K,
            });
        }
    } else {
        let t_b23 = b23::temperature_k_unchecked(p).min(region3::MAX_TEMPERATURE_K);
        spans[0] = Some(Span {
            eq: Equation::Region1,
            t_lo: T_MIN_K,
            t_hi: T_13_K,
        });
        if p < CRITICAL_PRESSURE_PA {
            let tsat = saturation_temperature_k_unchecked(p);
            let sat = saturation::at_pressure(p)?;
            dome = Some((q.of(&sat.liquid).0, q.of(&sat.vapour).0, tsat));
            spans[1] = Some(Span {
                eq: Equation::Region3(Branch::Liquid),
                t_lo: T_13_K,
                t_hi: tsat,
            });
            spans[2] = Some(Span {
                eq: Equation::Region3(Branch::Vapour),
                t_lo: tsat,
                t_hi: t_b23,
            });
        } else {
            spans[1] = Some(Span {
                eq: Equation::Region3(Branch::Liquid),
                t_lo: T_13_K,
                t_hi: t_b23,
            });
        }
        spans[3] = Some(Span {
            eq: Equation::Region2,
            t_lo: t_b23,
            t_hi: T_25_K,
        });
    }
    if p <= P_MAX_5_PA {
        spans[4] = Some(Span {
            eq: Equation::Region5,
            t_lo: T_25_K,
            t_hi: T_MAX_K,
        });
    }

    // Walk the spans from cold to hot.
    let mut first = true;
    let mut previous_hi: Option<(Equation, f64, f64)> = None; // (eq, T, value at T)
    for span in spans.iter().flatten() {
        let f_lo = at(span.eq, span.t_lo)?;
        let f_hi = at(span.eq, span.t_hi)?;
        if first && x < f_lo {
            return Err(FormulationError::PropertyOutOfRange);
        }
        first = false;
        // Two-phase interval between the liquid-side and vapour-side spans.
        if let (Some((x_l, x_v, tsat)), Some((_, t_prev, _))) = (dome, previous_hi) {
            if libm::fabs(t_prev - tsat) < 1e-9
                && libm::fabs(span.t_lo - tsat) < 1e-9
                && x > x_l
                && x < x_v
            {
                return Ok((tsat, Region::Region4));
            }
        }
        // A gap between the previous span's top value and this span's bottom
        // value: extend the previous (colder) equation past its boundary.
        if let Some((prev_eq, t_prev, f_prev)) = previous_hi {
            if x > f_prev && x < f_lo && libm::fabs(t_prev - span.t_lo) < 1e-9 {
                let start = interpolate(x, (t_prev, f_prev), (span.t_lo, f_lo));
                let t = solve(prev_eq, q, p, x, (t_prev, t_prev + GAP_EXTENSION_K), start)?;
                return Ok((t, prev_eq.region()));
            }
        }
        // Reaching here means x is above every colder span and not in a gap
        // or the dome below this span, so x ≥ f_lo.
        if x <= f_hi {
            let start = match span.eq {
                Equation::Region1 | Equation::Region2 => backward_start(span.eq, q, p, x),
                _ => interpolate(x, (span.t_lo, f_lo), (span.t_hi, f_hi)),
            };
            let t = solve(span.eq, q, p, x, (span.t_lo, span.t_hi), start)?;
            return Ok((t, span.eq.region()));
        }
        previous_hi = Some((span.eq, span.t_hi, f_hi));
    }
    Err(FormulationError::PropertyOutOfRange)
}

/// Temperature at pressure p (Pa) and specific enthalpy h (J/kg), with the
/// region it lies in: `(T K, region)`.
///
/// Range: all of IAPWS-IF97 (0 < p ≤ 100 MPa, h between its values at
/// 273.15 K and at 1073.15 K, or at 2273.15 K for p ≤ 50 MPa). Inside the
/// two-phase dome (611.213 Pa ≤ p < 22.064 MPa, h′ < h < h″) the result is
/// `(Tsat(p), Region::Region4)`. Accuracy: the forward enthalpy of the
/// returned region at (p, T) equals h to 1e-12 relative (plus 1e-8 J/kg);
/// see the module docs for the method and boundary gaps.
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinite input,
/// [`FormulationError::PressureOutOfRange`] for p ≤ 0 or p > 100 MPa,
/// [`FormulationError::PropertyOutOfRange`] for h below its value at 273.15 K
/// or above the top of the formulation at that pressure,
/// [`FormulationError::NoConvergence`] should not occur.
///
/// # Example
/// ```
/// use vapora_tables::if97::{inverse, Region};
/// // IAPWS R7-97(2012) Table 7: T1(3 MPa, 500 kJ/kg) ≈ 391.798509 K.
/// let (t, region) = inverse::temperature_ph(3.0e6, 500.0e3)?;
/// assert_eq!(region, Region::Region1);
/// assert!((t - 391.798509).abs() < 0.03);
/// // Wet steam at 1 MPa: two-phase, at Tsat.
/// let (t, region) = inverse::temperature_ph(1.0e6, 2.0e6)?;
/// assert_eq!(region, Region::Region4);
/// assert!((t - 453.035632).abs() < 1e-6);
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
pub fn temperature_ph(
    pressure_pa: f64,
    enthalpy_j_kg: f64,
) -> Result<(f64, Region), FormulationError> {
    invert(Quantity::Enthalpy, pressure_pa, enthalpy_j_kg)
}

/// Temperature at pressure p (Pa) and specific entropy s (J/(kg·K)), with
/// the region it lies in: `(T K, region)`.
///
/// Range and behaviour as [`temperature_ph`] with s in place of h (the
/// two-phase result for s′ < s < s″). Accuracy: the forward entropy equals s
/// to 1e-12 relative (plus 1e-11 J/(kg·K)).
///
/// # Errors
/// As [`temperature_ph`].
///
/// # Example
/// ```
/// use vapora_tables::if97::{inverse, Region};
/// // IAPWS R7-97(2012) Table 29: T2(0.1 MPa, 7.5 kJ/(kg K)) ≈ 399.517097 K.
/// let (t, region) = inverse::temperature_ps(0.1e6, 7.5e3)?;
/// assert_eq!(region, Region::Region2);
/// assert!((t - 399.517097).abs() < 0.01);
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
pub fn temperature_ps(
    pressure_pa: f64,
    entropy_j_kgk: f64,
) -> Result<(f64, Region), FormulationError> {
    invert(Quantity::Entropy, pressure_pa, entropy_j_kgk)
}
