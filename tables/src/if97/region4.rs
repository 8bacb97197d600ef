//! Region 4: the saturation-pressure equation and its exact inverse, the
//! saturation-temperature equation (IAPWS R7-97(2012), section 8, Eqs. 28–31,
//! coefficients from Table 34).

use super::{require_finite, FormulationError, CRITICAL_PRESSURE_PA, CRITICAL_TEMPERATURE_K};

/// Coefficients n1 … n10 of IAPWS R7-97(2012), Table 34.
const N: [f64; 10] = [
    0.116_705_214_527_67e4,
    -0.724_213_167_032_06e6,
    -0.170_738_469_400_92e2,
    0.120_208_247_024_70e5,
    -0.323_255_503_223_33e7,
    0.149_151_086_135_30e2,
    -0.482_326_573_615_91e4,
    0.405_113_405_420_57e6,
    -0.238_555_575_678_49,
    0.650_175_348_447_98e3,
];

/// Lowest temperature of the saturation-pressure equation, K (IAPWS
/// R7-97(2012), section 8.1: 273.15 K ≤ T ≤ 647.096 K).
pub const MIN_TEMPERATURE_K: f64 = 273.15;
/// Highest temperature of the saturation-pressure equation, K: the critical point.
pub const MAX_TEMPERATURE_K: f64 = CRITICAL_TEMPERATURE_K;
/// Lowest pressure of the saturation-temperature equation, Pa: psat(273.15 K)
/// (IAPWS R7-97(2012), section 8.2 gives 611.213 Pa).
pub const MIN_PRESSURE_PA: f64 = 611.213;
/// Highest pressure of the saturation-temperature equation, Pa: the critical point.
pub const MAX_PRESSURE_PA: f64 = CRITICAL_PRESSURE_PA;

/// Saturation pressure from temperature with no range check, Pa.
///
/// The raw Eq. 30 of IAPWS R7-97(2012); callers that have already checked
/// 273.15 K ≤ T ≤ 647.096 K use this to avoid the check in inner loops.
pub fn saturation_pressure_pa_unchecked(temperature_k: f64) -> f64 {
    let t = temperature_k; // T* = 1 K
    let theta = t + N[8] / (t - N[9]);
    let a = theta * theta + N[0] * theta + N[1];
    let b = N[2] * theta * theta + N[3] * theta + N[4];
    let c = N[5] * theta * theta + N[6] * theta + N[7];
    let ratio = 2.0 * c / (-b + libm::sqrt(b * b - 4.0 * a * c));
    let r2 = ratio * ratio;
    r2 * r2 * 1.0e6 // p* = 1 MPa
}

/// Saturation temperature from pressure with no range check, K.
///
/// The raw Eq. 31 of IAPWS R7-97(2012).
pub fn saturation_temperature_k_unchecked(pressure_pa: f64) -> f64 {
    let beta = libm::sqrt(libm::sqrt(pressure_pa / 1.0e6));
    let e = beta * beta + N[2] * beta + N[5];
    let f = N[0] * beta * beta + N[3] * beta + N[6];
    let g = N[1] * beta * beta + N[4] * beta + N[7];
    let d = 2.0 * g / (-f - libm::sqrt(f * f - 4.0 * e * g));
    let s = N[9] + d;
    (s - libm::sqrt(s * s - 4.0 * (N[8] + N[9] * d))) / 2.0
}

/// Saturation pressure at a temperature, Pa (IAPWS R7-97(2012), Eq. 30).
///
/// Range 273.15 K ≤ T ≤ 647.096 K. The equation reproduces the IAPWS-95
/// saturation pressure to within ±0.025 % (release, section 8.1).
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinity,
/// [`FormulationError::TemperatureOutOfRange`] outside the range.
pub fn saturation_pressure_pa(temperature_k: f64) -> Result<f64, FormulationError> {
    require_finite(&[temperature_k])?;
    if !(MIN_TEMPERATURE_K..=MAX_TEMPERATURE_K).contains(&temperature_k) {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k });
    }
    Ok(saturation_pressure_pa_unchecked(temperature_k))
}

/// Saturation temperature at a pressure, K (IAPWS R7-97(2012), Eq. 31).
///
/// Range 611.213 Pa ≤ p ≤ 22.064 MPa.
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinity,
/// [`FormulationError::PressureOutOfRange`] outside the range.
pub fn saturation_temperature_k(pressure_pa: f64) -> Result<f64, FormulationError> {
    require_finite(&[pressure_pa])?;
    if !(MIN_PRESSURE_PA..=MAX_PRESSURE_PA).contains(&pressure_pa) {
        return Err(FormulationError::PressureOutOfRange { pressure_pa });
    }
    Ok(saturation_temperature_k_unchecked(pressure_pa))
}

#[cfg(test)]
mod tests {
    use super::*;

    /// True when `value` rounds to the nine significant digits printed in
    /// the release: |value − printed| ≤ half a unit of the ninth digit.
    fn printed_digits_match(value: f64, printed: f64) -> bool {
        let exponent = libm::floor(libm::log10(printed.abs()));
        let half_unit = 0.5 * libm::pow(10.0, exponent - 8.0);
        (value - printed).abs() <= half_unit * (1.0 + 1e-9)
    }

    // IAPWS R7-97(2012), Table 35: psat at 300, 500, 600 K (MPa).
    #[test]
    fn table_35() {
        for (t, p_mpa) in [
            (300.0, 0.353658941e-2),
            (500.0, 0.263889776e1),
            (600.0, 0.123443146e2),
        ] {
            let p = saturation_pressure_pa(t).unwrap() / 1e6;
            assert!(printed_digits_match(p, p_mpa), "T={t}: {p} vs {p_mpa}");
        }
    }

    // IAPWS R7-97(2012), Table 36: Tsat at 0.1, 1, 10 MPa (K).
    #[test]
    fn table_36() {
        for (p_mpa, t_ref) in [
            (0.1, 0.372755919e3),
            (1.0, 0.453035632e3),
            (10.0, 0.584149488e3),
        ] {
            let t = saturation_temperature_k(p_mpa * 1e6).unwrap();
            assert!(printed_digits_match(t, t_ref), "p={p_mpa}: {t} vs {t_ref}");
        }
    }
}
