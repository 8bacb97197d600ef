//! Region 2: superheated vapour, the basic equation for the Gibbs free
//! energy (IAPWS R7-97(2012), section 6.1, Eq. 15: ideal-gas part Table 10,
//! residual part Table 11), and the supplementary equation for the metastable
//! vapour region (section 6.2, Eq. 18: ideal-gas part as Table 10 with n°1,
//! n°2 changed as stated with Eq. 19, residual part Table 16).
//!
//! Range of Eq. 15: 273.15 K ≤ T ≤ 623.15 K for 0 < p ≤ psat(T);
//! 623.15 K < T ≤ 863.15 K for 0 < p ≤ p_B23(T); 863.15 K < T ≤ 1073.15 K
//! for 0 < p ≤ 100 MPa.

use super::gibbs::{properties_from_gibbs, GibbsDerivatives};
use super::{b23, region1, region4};
use super::{require_finite, require_finite_properties};
use super::{FormulationError, Properties};

/// Reducing pressure p* of Eqs. 15 and 18, Pa (1 MPa).
const REDUCING_PRESSURE_PA: f64 = 1.0e6;
/// Reducing temperature T* of Eqs. 15 and 18, K.
const REDUCING_TEMPERATURE_K: f64 = 540.0;

/// Lowest temperature of Region 2, K.
pub const MIN_TEMPERATURE_K: f64 = 273.15;
/// Highest temperature of Region 2, K (the boundary to Region 5).
pub const MAX_TEMPERATURE_K: f64 = 1073.15;
/// Highest pressure of Region 2, Pa (100 MPa, reached above 863.15 K).
pub const MAX_PRESSURE_PA: f64 = 100.0e6;
/// Highest pressure of the metastable-vapour equation, Pa (10 MPa).
pub const METASTABLE_MAX_PRESSURE_PA: f64 = 10.0e6;
/// Relative amount by which the checked functions accept a pressure above
/// psat(T) (and above p_B23(T)), so that the saturated-vapour limit can be
/// evaluated at a saturation pressure that went through rounding.
pub const BOUNDARY_PRESSURE_SLACK: f64 = 1e-9;

/// Exponents J° and coefficients n° of the ideal-gas part of Eq. 15,
/// IAPWS R7-97(2012), Table 10.
#[allow(clippy::excessive_precision, clippy::unreadable_literal)]
const IDEAL: [(i32, f64); 9] = [
    (0, -0.96927686500217e1),
    (1, 0.10086655968018e2),
    (-5, -0.56087911283020e-2),
    (-4, 0.71452738081455e-1),
    (-3, -0.40710498223928e0),
    (-2, 0.14240819171444e1),
    (-1, -0.43839511319450e1),
    (2, -0.28408632460772e0),
    (3, 0.21268463753307e-1),
];

/// n°1 and n°2 of the ideal-gas part of the metastable-vapour equation
/// (IAPWS R7-97(2012), with Eq. 19); they replace the first two entries of
/// Table 10 so that Eqs. 15 and 18 meet on the saturated-vapour line.
#[allow(clippy::excessive_precision, clippy::unreadable_literal)]
const METASTABLE_IDEAL_N1_N2: [f64; 2] = [-0.96937268393049e1, 0.10087275970006e2];

/// Exponents I, J and coefficients n of the residual part of Eq. 15,
/// IAPWS R7-97(2012), Table 11.
#[allow(clippy::excessive_precision, clippy::unreadable_literal)]
const RESIDUAL: [(i32, i32, f64); 43] = [
    (1, 0, -0.17731742473213e-2),
    (1, 1, -0.17834862292358e-1),
    (1, 2, -0.45996013696365e-1),
    (1, 3, -0.57581259083432e-1),
    (1, 6, -0.50325278727930e-1),
    (2, 1, -0.33032641670203e-4),
    (2, 2, -0.18948987516315e-3),
    (2, 4, -0.39392777243355e-2),
    (2, 7, -0.43797295650573e-1),
    (2, 36, -0.26674547914087e-4),
    (3, 0, 0.20481737692309e-7),
    (3, 1, 0.43870667284435e-6),
    (3, 3, -0.32277677238570e-4),
    (3, 6, -0.15033924542148e-2),
    (3, 35, -0.40668253562649e-1),
    (4, 1, -0.78847309559367e-9),
    (4, 2, 0.12790717852285e-7),
    (4, 3, 0.48225372718507e-6),
    (5, 7, 0.22922076337661e-5),
    (6, 3, -0.16714766451061e-10),
    (6, 16, -0.21171472321355e-2),
    (6, 35, -0.23895741934104e2),
    (7, 0, -0.59059564324270e-17),
    (7, 11, -0.12621808899101e-5),
    (7, 25, -0.38946842435739e-1),
    (8, 8, 0.11256211360459e-10),
    (8, 36, -0.82311340897998e1),
    (9, 13, 0.19809712802088e-7),
    (10, 4, 0.10406965210174e-18),
    (10, 10, -0.10234747095929e-12),
    (10, 14, -0.10018179379511e-8),
    (16, 29, -0.80882908646985e-10),
    (16, 50, 0.10693031879409e0),
    (18, 57, -0.33662250574171e0),
    (20, 20, 0.89185845355421e-24),
    (20, 35, 0.30629316876232e-12),
    (20, 48, -0.42002467698208e-5),
    (21, 21, -0.59056029685639e-25),
    (22, 53, 0.37826947613457e-5),
    (23, 39, -0.12768608934681e-14),
    (24, 26, 0.73087610595061e-28),
    (24, 40, 0.55414715350778e-16),
    (24, 58, -0.94369707241210e-6),
];

/// Exponents I, J and coefficients n of the residual part of the
/// metastable-vapour equation, Eq. 18, IAPWS R7-97(2012), Table 16.
#[allow(clippy::excessive_precision, clippy::unreadable_literal)]
const METASTABLE_RESIDUAL: [(i32, i32, f64); 13] = [
    (1, 0, -0.73362260186506e-2),
    (1, 2, -0.88223831943146e-1),
    (1, 5, -0.72334555213245e-1),
    (1, 11, -0.40813178534455e-2),
    (2, 1, 0.20097803380207e-2),
    (2, 7, -0.53045921898642e-1),
    (2, 16, -0.76190409086970e-2),
    (3, 4, -0.63498037657313e-2),
    (3, 16, -0.86043093028588e-1),
    (4, 7, 0.75321581522770e-2),
    (4, 10, -0.79238375446139e-2),
    (5, 9, -0.22888160778447e-3),
    (5, 10, -0.26456501482810e-2),
];

/// γ = γ° + γʳ and its derivatives for the given ideal-gas n°1, n°2 and
/// residual table. The remaining ideal-gas terms are those of Table 10 in
/// both Eq. 15 and Eq. 18.
fn gibbs_derivatives(
    pressure_pa: f64,
    temperature_k: f64,
    ideal_n1_n2: [f64; 2],
    residual: &[(i32, i32, f64)],
) -> GibbsDerivatives {
    let pi = pressure_pa / REDUCING_PRESSURE_PA;
    let tau = REDUCING_TEMPERATURE_K / temperature_k;

    // Ideal-gas part γ° = ln π + Σ n°ᵢ τ^J°ᵢ (Eq. 16), with n°1 and n°2
    // supplied by the caller (Eq. 18 changes them).
    let ideal = IDEAL.iter().enumerate().map(|(index, &(j, table_n))| {
        let n = match index {
            0 => ideal_n1_n2[0],
            1 => ideal_n1_n2[1],
            _ => table_n,
        };
        (j, n)
    });
    let mut d = GibbsDerivatives::ideal_gas(pi, tau, ideal);
    // Residual part γʳ = Σ nᵢ π^Iᵢ (τ − 0.5)^Jᵢ (Eqs. 17 and 18).
    d.add_residual(tau - 0.5, residual);
    d
}

/// Region 2 properties at (p, T) from Eq. 15 with no range check.
///
/// Outside Region 2 the values are an extrapolation with no stated
/// accuracy (and NaN or infinite for p ≤ 0). The table generator and the
/// saturation code call it exactly at p = psat(T) (the saturated-vapour
/// state), where rounding may put p a few ulp above psat.
pub fn properties_unchecked(pressure_pa: f64, temperature_k: f64) -> Properties {
    let n1_n2 = [IDEAL[0].1, IDEAL[1].1];
    let d = gibbs_derivatives(pressure_pa, temperature_k, n1_n2, &RESIDUAL);
    properties_from_gibbs(pressure_pa, temperature_k, &d)
}

/// Highest pressure of Region 2 at a temperature inside its temperature
/// range, Pa: psat(T) up to 623.15 K, p_B23(T) up to 863.15 K, 100 MPa above.
fn max_pressure_pa_at(temperature_k: f64) -> f64 {
    if temperature_k <= region1::MAX_TEMPERATURE_K {
        region4::saturation_pressure_pa_unchecked(temperature_k)
    } else if temperature_k <= b23::MAX_TEMPERATURE_K {
        b23::pressure_pa_unchecked(temperature_k)
    } else {
        MAX_PRESSURE_PA
    }
}

/// Region 2 properties (superheated vapour, and saturated vapour at the
/// limit p = psat(T)) at pressure `p_pa` (Pa) and temperature `t_k` (K),
/// from Eq. 15.
///
/// Range: 273.15 K ≤ T ≤ 623.15 K for 0 < p ≤ psat(T); 623.15 K < T ≤
/// 863.15 K for 0 < p ≤ p_B23(T); 863.15 K < T ≤ 1073.15 K for
/// 0 < p ≤ 100 MPa. At psat(T) and p_B23(T) a relative excess of 1e-9 is
/// accepted (see [`BOUNDARY_PRESSURE_SLACK`]). Eq. 15 represents IAPWS-95
/// within the permissible tolerances of IAPWS R7-97(2012), section 6.1; this
/// implementation reproduces the release's Table 15 in every printed digit.
///
/// # Example
/// ```
/// use vapora_tables::if97::region2;
/// // Superheated steam at 30 MPa, 700 K (a point of Table 15).
/// let steam = region2::properties(30.0e6, 700.0)?;
/// assert!((steam.specific_volume_m3_kg - 5.42947e-3).abs() < 1e-8);
/// // Eq. 15 stops at the saturation line: 1 MPa at 300 K is liquid.
/// assert!(region2::properties(1.0e6, 300.0).is_err());
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinite input,
/// [`FormulationError::TemperatureOutOfRange`] outside 273.15–1073.15 K,
/// [`FormulationError::PressureOutOfRange`] for p ≤ 0, above the upper
/// pressure limit at that temperature, or so low (below about 1e-300 Pa)
/// that the specific volume overflows f64.
pub fn properties(p_pa: f64, t_k: f64) -> Result<Properties, FormulationError> {
    require_finite(&[p_pa, t_k])?;
    if !(MIN_TEMPERATURE_K..=MAX_TEMPERATURE_K).contains(&t_k) {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k: t_k });
    }
    let limit = if t_k <= b23::MAX_TEMPERATURE_K {
        max_pressure_pa_at(t_k) * (1.0 + BOUNDARY_PRESSURE_SLACK)
    } else {
        MAX_PRESSURE_PA
    };
    if !(p_pa > 0.0 && p_pa <= limit) {
        return Err(FormulationError::PressureOutOfRange { pressure_pa: p_pa });
    }
    require_finite_properties(properties_unchecked(p_pa, t_k))
}

/// Metastable-vapour properties (supercooled vapour, "wet steam" that has
/// not yet condensed) from Eq. 18, with no range check.
pub fn metastable_properties_unchecked(pressure_pa: f64, temperature_k: f64) -> Properties {
    let d = gibbs_derivatives(
        pressure_pa,
        temperature_k,
        METASTABLE_IDEAL_N1_N2,
        &METASTABLE_RESIDUAL,
    );
    properties_from_gibbs(pressure_pa, temperature_k, &d)
}

/// Metastable-vapour properties at pressure `p_pa` (Pa) and temperature
/// `t_k` (K), from the supplementary Eq. 18 of IAPWS R7-97(2012).
///
/// Range (section 6.2 of the release): p ≤ 10 MPa, from the saturated-vapour
/// line (T ≤ Tsat(p), with a relative slack of 1e-9) down to the 5 %
/// equilibrium-moisture line. That line is defined with the equilibrium
/// saturated-liquid and saturated-vapour enthalpies at the given pressure:
/// the point is accepted when its metastable enthalpy h satisfies
/// h ≥ h′ + 0.95·(h″ − h′), with h′ from Region 1 and h″ from Region 2 at
/// psat. Since Tsat is defined only from 611.213 Pa, that is the lowest
/// pressure. On the saturated-vapour line Eq. 18 agrees with Eq. 15 within
/// the consistency stated in the release. The accuracy is that of Eq. 18
/// against IAPWS-95 stated in the release; this implementation reproduces
/// the release's Table 18 in every printed digit.
///
/// # Example
/// ```
/// use vapora_tables::if97::region2;
/// // Vapour supercooled 3 K below Tsat(1 MPa) = 453.03 K.
/// let steam = region2::metastable_properties(1.0e6, 450.0)?;
/// assert!((steam.enthalpy_j_kg - 2768.81e3).abs() < 10.0);
/// # Ok::<(), vapora_tables::if97::FormulationError>(())
/// ```
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinite input,
/// [`FormulationError::PressureOutOfRange`] outside 611.213 Pa – 10 MPa,
/// [`FormulationError::TemperatureOutOfRange`] above Tsat(p), below 273.15 K
/// or beyond the 5 % equilibrium-moisture line.
pub fn metastable_properties(p_pa: f64, t_k: f64) -> Result<Properties, FormulationError> {
    require_finite(&[p_pa, t_k])?;
    if !(region4::MIN_PRESSURE_PA..=METASTABLE_MAX_PRESSURE_PA).contains(&p_pa) {
        return Err(FormulationError::PressureOutOfRange { pressure_pa: p_pa });
    }
    let t_sat = region4::saturation_temperature_k_unchecked(p_pa);
    if !(t_k >= MIN_TEMPERATURE_K && t_k <= t_sat * (1.0 + BOUNDARY_PRESSURE_SLACK)) {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k: t_k });
    }
    let props = metastable_properties_unchecked(p_pa, t_k);
    let h_liquid = region1::properties_unchecked(p_pa, t_sat).enthalpy_j_kg;
    let h_vapour = properties_unchecked(p_pa, t_sat).enthalpy_j_kg;
    if props.enthalpy_j_kg < h_liquid + 0.95 * (h_vapour - h_liquid) {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k: t_k });
    }
    require_finite_properties(props)
}
