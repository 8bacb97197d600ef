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
