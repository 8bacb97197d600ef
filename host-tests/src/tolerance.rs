//! Every tolerance used by the host checks, with the reason for it.

/// Relative agreement required with the printed digits of the IAPWS
/// computer-program verification tables. The tables print nine significant
/// digits, so 1e-9 relative is "every printed digit".
pub const PUBLISHED_TABLE_REL: f64 = 1e-9;

/// Relative deviation between `value` and `expected`.
pub fn relative_deviation(value: f64, expected: f64) -> f64 {
    ((value - expected) / expected).abs()
}

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
