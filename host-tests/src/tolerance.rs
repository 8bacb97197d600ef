//! Every tolerance used by the host checks, with the reason for it.

/// Relative agreement required with the printed digits of the IAPWS
/// computer-program verification tables. The tables print nine significant
/// digits, so 1e-9 relative is "every printed digit".
pub const PUBLISHED_TABLE_REL: f64 = 1e-9;

/// Relative deviation between `value` and `expected`.
pub fn relative_deviation(value: f64, expected: f64) -> f64 {
    ((value - expected) / expected).abs()
}

// ---- application routines (issue 5, branch apps): the tolerances of
// host-tests/tests/application_*.rs. They are derived from the accuracy the
// kernel must meet, not from what the current implementation reaches, so
// the table-based single-phase module passes them as well as any stand-in.

/// Density of the single-phase module, relative: the bound issue 5 sets
/// for it outside the near-critical box.
pub const SINGLE_PHASE_DENSITY_REL: f64 = 20e-6;
/// Enthalpy of the single-phase module, J/kg (issue 5: 0.02 kJ/kg).
pub const SINGLE_PHASE_ENTHALPY_J_KG: f64 = 20.0;
/// Isentropic exponent of the single-phase module, relative (issue 5: 0.05 %).
pub const SINGLE_PHASE_KAPPA_REL: f64 = 5e-4;
/// Viscosity of the single-phase module, relative (issue 5: 0.05 %).
pub const SINGLE_PHASE_VISCOSITY_REL: f64 = 5e-4;
/// A superheat or subcooling margin T − T_sat(p), K: the kernel's
/// saturation temperature is within 1 mK of IF97 (its accuracy table),
/// doubled for a single-phase module that may compute T_sat its own way,
/// plus the f32 rounding of T (3e-5 K at 1000 K).
pub const SATURATION_MARGIN_K: f64 = 2e-3;
/// f32 rounding of a result computed in a few f32 operations, relative:
/// eight units in the last place (2⁻²³ ≈ 1.2e-7 each).
pub const F32_ROUNDING_REL: f64 = 8.0 * f32::EPSILON as f64;

/// Largest change of `f` when each input `x[i]` moves by ±`dx[i]` (all
/// sign combinations, the worst case of a first-order error budget and of
/// any curvature between the corners): the tolerance of a derived quantity
/// whose inputs have the error bounds `dx`.
pub fn worst_corner_deviation(f: impl Fn(&[f64]) -> f64, x: &[f64], dx: &[f64]) -> f64 {
    let nominal = f(x);
    let n = x.len().min(dx.len());
    let mut worst: f64 = 0.0;
    for corner in 0u32..(1 << n) {
        let moved: Vec<f64> = (0..n)
            .map(|i| {
                if corner & (1 << i) == 0 {
                    x[i] - dx[i]
                } else {
                    x[i] + dx[i]
                }
            })
            .collect();
        worst = worst.max((f(&moved) - nominal).abs());
    }
    worst
}
// ---- end of the application routines' tolerances

/// True when `value` agrees with a value printed to `digits` significant
/// digits in every printed digit: |value − printed| ≤ half a unit of the last
/// printed digit (a hair of slack for the decimal-to-binary conversion).
///
/// The IAPWS verification tables print nine significant digits; a correct
/// implementation rounds to exactly those digits, so this is stricter than a
/// fixed relative 1e-9 for values whose leading digit is large and looser
/// (up to 5e-9 relative) for values whose leading digit is 1.
pub fn printed_digits_match(value: f64, printed: f64, digits: i32) -> bool {
    if !value.is_finite() || printed == 0.0 {
        return false;
    }
    let exponent = printed.abs().log10().floor() as i32;
    let half_unit = 0.5 * 10f64.powi(exponent - (digits - 1));
    (value - printed).abs() <= half_unit * (1.0 + 1e-9)
}

/// Relative agreement required of psat(Tsat(p)) with p. Eq. 31 of IAPWS
/// R7-97(2012) is the exact algebraic inverse of Eq. 30, so only f64
/// rounding in the two evaluations (a few hundred ulp at worst through the
/// square roots and the fourth power) separates them.
pub const SATURATION_ROUND_TRIP_REL: f64 = 1e-12;

/// Relative agreement required between the two sides of the saturation
/// line when the pressure is moved by 1e-9 relative either side of psat(T).
/// Along the saturation line below 623.15 K the logarithmic pressure
/// derivatives of the Region 1 and 2 properties reach about 11 (cp and κ of
/// the saturated vapour at 623.15 K), so a 1e-9 step may move a property by
/// about 1.1e-8; 1e-7 allows that with margin and still catches a jump or a
/// wrong branch, which would show up at 1e-4 or more.
pub const SATURATION_CONTINUITY_REL: f64 = 1e-7;

/// Relative agreement required between a property and the same quantity
/// obtained from central finite differences of other computed properties
/// (e.g. cp against ∂h/∂T at constant p). With a relative step of 1e-5 the
/// truncation error is below 1e-8 even in the strongly curved vapour near
/// the B23 line (cp ≈ 10 kJ/(kg·K) at 30 MPa, 700 K), and the rounding error
/// is below 1e-8 even for the small volume change of compressed liquid.
pub const FINITE_DIFFERENCE_REL: f64 = 1e-6;

/// Relative tolerance for figures of the trade quoted with "about"
/// (common practice, no source): e.g. "about 1.55 MPa at 200 °C" is
/// meant to two or three significant digits.
pub const ABOUT_REL: f64 = 0.005;

/// Absolute tolerance for saturation temperatures of the trade quoted with
/// "about", K (common practice, no source). 0.5 % in pressure corresponds to
/// 0.1–0.2 K in saturation temperature between 20 °C and 200 °C.
pub const ABOUT_TEMPERATURE_K: f64 = 0.2;

/// "Water boils at 100 °C at 101.325 kPa" (common practice, no source) holds
/// for IF97 to 0.03 K: the 1990 temperature scale moved the normal boiling
/// point to about 99.97 °C.
pub const BOILING_POINT_K: f64 = 0.03;

/// "Latent heat at 100 °C is about 2256 kJ/kg" (common practice, no
/// source), J/kg: the figure is quoted to four digits.
pub const LATENT_HEAT_J_KG: f64 = 1000.0;
