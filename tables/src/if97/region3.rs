//! Region 3: the near-critical region, a Helmholtz free energy in density and
//! temperature (IAPWS R7-97(2012), section 6, Eq. 28, coefficients from
//! Table 30, property relations from Table 31).
//!
//! The basic equation takes (ρ, T). For (p, T) inputs the density is found by
//! a bracketed, safeguarded Newton iteration on p₃(ρ, T) = p (see
//! [`density_pt`]); this is used *instead of* the 2005 supplementary backward
//! equations v(p, T), so the result is consistent with Eq. 28 to f64
//! precision rather than to the backward equations' tolerance.
//!
//! Range of Region 3 (release, section 4): 623.15 K ≤ T ≤ T_B23(p) and
//! p_B23(T) ≤ p ≤ 100 MPa. The (ρ, T) functions accept any T between
//! 623.15 K and 863.15 K (the B23 temperature at 100 MPa) and any density
//! between [`MIN_DENSITY_KG_M3`] and [`MAX_DENSITY_KG_M3`]; they do not check
//! the B23 line because that needs a pressure.

use super::region4::saturation_pressure_pa_unchecked;
use super::{
    require_finite, FormulationError, Properties, CRITICAL_DENSITY_KG_M3, CRITICAL_TEMPERATURE_K,
    SPECIFIC_GAS_CONSTANT_J_KGK,
};

/// Coefficient n₁ of the logarithmic term, IAPWS R7-97(2012), Table 30.
const N1: f64 = 0.106_580_700_285_13e1;

/// (Iᵢ, Jᵢ, nᵢ) for i = 2 … 40 of IAPWS R7-97(2012), Table 30.
const IJN: [(u8, u8, f64); 39] = [
    (0, 0, -0.157_328_452_902_39e2),
    (0, 1, 0.209_443_969_743_07e2),
    (0, 2, -0.768_677_078_787_16e1),
    (0, 7, 0.261_859_477_879_54e1),
    (0, 10, -0.280_807_811_486_20e1),
    (0, 12, 0.120_533_696_965_17e1),
    (0, 23, -0.845_668_128_125_02e-2),
    (1, 2, -0.126_543_154_777_14e1),
    (1, 6, -0.115_244_078_066_81e1),
    (1, 15, 0.885_210_439_843_18),
    (1, 17, -0.642_077_651_816_07),
    (2, 0, 0.384_934_601_866_71),
    (2, 2, -0.852_147_088_242_06),
    (2, 6, 0.489_722_815_418_77e1),
    (2, 7, -0.305_026_172_569_65e1),
    (2, 22, 0.394_205_368_791_54e-1),
    (2, 26, 0.125_584_084_243_08),
    (3, 0, -0.279_993_296_987_10),
    (3, 2, 0.138_997_995_694_60e1),
    (3, 4, -0.201_899_150_235_70e1),
    (3, 16, -0.821_476_371_739_63e-2),
    (3, 26, -0.475_960_357_349_23),
    (4, 0, 0.439_840_744_735_00e-1),
    (4, 2, -0.444_764_354_287_39),
    (4, 4, 0.905_720_707_197_33),
    (4, 26, 0.705_224_500_879_67),
    (5, 1, 0.107_705_126_263_32),
    (5, 3, -0.329_136_232_589_54),
    (5, 26, -0.508_710_620_411_58),
    (6, 0, -0.221_754_008_730_96e-1),
    (6, 2, 0.942_607_516_650_92e-1),
    (6, 26, 0.164_362_784_479_61),
    (7, 2, -0.135_033_722_413_48e-1),
    (8, 26, -0.148_343_453_524_72e-1),
    (9, 2, 0.579_229_536_280_84e-3),
    (9, 26, 0.323_089_047_037_11e-2),
    (10, 0, 0.809_648_029_962_15e-4),
    (10, 1, -0.165_576_797_950_37e-3),
    (11, 26, -0.449_238_990_618_15e-4),
];

/// Highest exponent Iᵢ of δ in Table 30.
const MAX_I: usize = 11;
/// Highest exponent Jᵢ of τ in Table 30.
const MAX_J: usize = 26;

/// Lowest temperature of Region 3, K (IAPWS R7-97(2012), section 4).
pub const MIN_TEMPERATURE_K: f64 = 623.15;
/// Highest temperature of Region 3, K: T_B23(100 MPa) = 863.15 K to the
/// printed digits of the B23 equation (IAPWS R7-97(2012), Eq. 5).
pub const MAX_TEMPERATURE_K: f64 = 863.15;
/// Highest pressure of Region 3, Pa (IAPWS R7-97(2012), section 4).
pub const MAX_PRESSURE_PA: f64 = 100.0e6;
/// Lowest density accepted by the (ρ, T) functions, kg/m³, and the low end
/// of the density brackets: on every isotherm of 623.15 … 863.15 K,
/// p₃(50 kg/m³, T) lies below both p_B23(T) and psat(T), so every Region 3
/// state is denser (checked by the test suite).
pub const MIN_DENSITY_KG_M3: f64 = 50.0;
/// Highest density accepted by the (ρ, T) functions, kg/m³, and the high
/// end of the density brackets: on every isotherm of 623.15 … 863.15 K,
/// p₃(800 kg/m³, T) exceeds 100 MPa, so every Region 3 state is less dense
/// (checked by the test suite).
pub const MAX_DENSITY_KG_M3: f64 = 800.0;

/// φ = f/(RT) and its derivatives at one (δ, τ) (IAPWS R7-97(2012), Table 32).
#[derive(Debug, Clone, Copy)]
pub(crate) struct HelmholtzDerivatives {
    pub delta: f64,
    pub tau: f64,
    pub phi: f64,
    pub phi_delta: f64,
    pub phi_deltadelta: f64,
    pub phi_tau: f64,
    pub phi_tautau: f64,
    pub phi_deltatau: f64,
}

/// Powers x⁰ … x^N of one base, built by repeated multiplication so each
/// entry costs one multiplication and stays within a few ulp.
fn powers<const N: usize>(x: f64) -> [f64; N] {
    let mut out = [1.0; N];
    let mut acc = 1.0;
    for slot in out.iter_mut().skip(1) {
        acc *= x;
        *slot = acc;
    }
    out
}

/// All derivatives of φ at (δ, τ). Terms with a zero exponent contribute
/// exactly zero to the derivative in that variable (no 0·x⁻¹ products), so
/// the sums are finite for every δ > 0, τ > 0.
pub(crate) fn helmholtz(delta: f64, tau: f64) -> HelmholtzDerivatives {
    // dp[k] = δ^k, tp[k] = τ^k; negative powers are never needed because a
    // zero exponent multiplies its derivative by zero and is skipped.
    let dp: [f64; MAX_I + 2] = powers(delta);
    let tp: [f64; MAX_J + 2] = powers(tau);
    let inv_delta = 1.0 / delta;
    let mut phi = N1 * libm::log(delta);
    let mut phi_d = N1 * inv_delta;
    let mut phi_dd = -N1 * inv_delta * inv_delta;
    let mut phi_t = 0.0;
    let mut phi_tt = 0.0;
    let mut phi_dt = 0.0;
    for &(i, j, n) in IJN.iter() {
        let (i, j) = (usize::from(i), usize::from(j));
        let (fi, fj) = (i as f64, j as f64);
        // δ^I, τ^J from the tables; δ^(I−1) = δ^I/δ only where I ≥ 1, etc.
        let di = dp.get(i).copied().unwrap_or(0.0);
        let tj = tp.get(j).copied().unwrap_or(0.0);
        let di1 = if i >= 1 {
            dp.get(i - 1).copied().unwrap_or(0.0)
        } else {
            0.0
        };
        let di2 = if i >= 2 {
            dp.get(i - 2).copied().unwrap_or(0.0)
        } else {
            0.0
        };
        let tj1 = if j >= 1 {
            tp.get(j - 1).copied().unwrap_or(0.0)
        } else {
            0.0
        };
        let tj2 = if j >= 2 {
            tp.get(j - 2).copied().unwrap_or(0.0)
        } else {
            0.0
        };
        phi += n * di * tj;
        phi_d += n * fi * di1 * tj;
        phi_dd += n * fi * (fi - 1.0) * di2 * tj;
        phi_t += n * fj * di * tj1;
        phi_tt += n * fj * (fj - 1.0) * di * tj2;
        phi_dt += n * fi * fj * di1 * tj1;
    }
    HelmholtzDerivatives {
        delta,
        tau,
        phi,
        phi_delta: phi_d,
        phi_deltadelta: phi_dd,
        phi_tau: phi_t,
        phi_tautau: phi_tt,
        phi_deltatau: phi_dt,
    }
}

/// Reduced variables δ = ρ/ρc, τ = Tc/T of Eq. 28.
fn reduce(density_kg_m3: f64, temperature_k: f64) -> (f64, f64) {
    (
        density_kg_m3 / CRITICAL_DENSITY_KG_M3,
        CRITICAL_TEMPERATURE_K / temperature_k,
    )
}

/// Pressure from Eq. 28 with no range check, Pa: p = ρRT·δφ_δ.
pub fn pressure_pa_unchecked(density_kg_m3: f64, temperature_k: f64) -> f64 {
    let (delta, tau) = reduce(density_kg_m3, temperature_k);
    let d = helmholtz(delta, tau);
    density_kg_m3 * SPECIFIC_GAS_CONSTANT_J_KGK * temperature_k * delta * d.phi_delta
}

/// Pressure and its isothermal density derivative (∂p/∂ρ)_T from Eq. 28,
/// with no range check, in Pa and Pa·m³/kg.
///
/// (∂p/∂ρ)_T = RT(2δφ_δ + δ²φ_δδ); it is negative between the spinodals
/// below Tc, where the equation describes no stable state.
pub fn pressure_and_slope_unchecked(density_kg_m3: f64, temperature_k: f64) -> (f64, f64) {
    let (delta, tau) = reduce(density_kg_m3, temperature_k);
    let d = helmholtz(delta, tau);
    let rt = SPECIFIC_GAS_CONSTANT_J_KGK * temperature_k;
    let p = density_kg_m3 * rt * delta * d.phi_delta;
    let dp = rt * (2.0 * delta * d.phi_delta + delta * delta * d.phi_deltadelta);
    (p, dp)
}

/// The properties from φ and its derivatives (IAPWS R7-97(2012), Table 31).
///
/// p = ρRT·δφ_δ, u = RT·τφ_τ, s = R(τφ_τ − φ), h = RT(τφ_τ + δφ_δ),
/// cv = −Rτ²φ_ττ, cp = cv + R(δφ_δ − δτφ_δτ)²/(2δφ_δ + δ²φ_δδ),
/// w² = RT(2δφ_δ + δ²φ_δδ − (δφ_δ − δτφ_δτ)²/(τ²φ_ττ)).
/// The isentropic exponent is κ = −(v/p)(∂p/∂v)_s = ρw²/p, since
/// w² = (∂p/∂ρ)_s.
pub(crate) fn properties_from_helmholtz(
    density_kg_m3: f64,
    temperature_k: f64,
    d: &HelmholtzDerivatives,
) -> Properties {
    let r = SPECIFIC_GAS_CONSTANT_J_KGK;
    let rt = r * temperature_k;
    let delta_phi_d = d.delta * d.phi_delta;
    let tau_phi_t = d.tau * d.phi_tau;
    let tau2_phi_tt = d.tau * d.tau * d.phi_tautau;
    let cross = delta_phi_d - d.delta * d.tau * d.phi_deltatau;
    let stiffness = 2.0 * delta_phi_d + d.delta * d.delta * d.phi_deltadelta;
    let pressure_pa = density_kg_m3 * rt * delta_phi_d;
    let cv = -r * tau2_phi_tt;
    let speed_of_sound_sq = rt * (stiffness - cross * cross / tau2_phi_tt);
    Properties {
        pressure_pa,
        temperature_k,
        density_kg_m3,
        specific_volume_m3_kg: 1.0 / density_kg_m3,
        enthalpy_j_kg: rt * (tau_phi_t + delta_phi_d),
        internal_energy_j_kg: rt * tau_phi_t,
        entropy_j_kgk: r * (tau_phi_t - d.phi),
        cp_j_kgk: cv + r * cross * cross / stiffness,
        cv_j_kgk: cv,
        speed_of_sound_m_s: libm::sqrt(speed_of_sound_sq),
        isentropic_exponent: density_kg_m3 * speed_of_sound_sq / pressure_pa,
    }
}

/// The properties at (ρ, T) from Eq. 28 with no range check.
///
/// The caller guarantees ρ > 0 and T > 0; inside the spinodal region below
/// the critical temperature (where (∂p/∂ρ)_T < 0) cp is negative and the
/// speed of sound may be NaN, because the state is mechanically unstable.
pub fn properties_rho_t_unchecked(density_kg_m3: f64, temperature_k: f64) -> Properties {
    let (delta, tau) = reduce(density_kg_m3, temperature_k);
    properties_from_helmholtz(density_kg_m3, temperature_k, &helmholtz(delta, tau))
}

/// Checks the (ρ, T) domain of the checked functions.
fn check_rho_t(density_kg_m3: f64, temperature_k: f64) -> Result<(), FormulationError> {
    require_finite(&[density_kg_m3, temperature_k])?;
    if !(MIN_TEMPERATURE_K..=MAX_TEMPERATURE_K).contains(&temperature_k) {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k });
    }
    if !(MIN_DENSITY_KG_M3..=MAX_DENSITY_KG_M3).contains(&density_kg_m3) {
        return Err(FormulationError::DensityOutOfRange { density_kg_m3 });
    }
    Ok(())
}

/// The properties at density ρ (kg/m³) and temperature T (K) from the Region
/// 3 basic equation, IAPWS R7-97(2012) Eq. 28.
///
/// Range: 623.15 K ≤ T ≤ 863.15 K and 50 kg/m³ ≤ ρ ≤ 800 kg/m³, which
/// contains all of Region 3; the B23 boundary and the 100 MPa limit are not
/// checked (they need the pressure, see [`properties_pt`]). Accuracy: this is
/// Eq. 28 itself, evaluated to a few ulp (reproduces every printed digit of
/// the release's Table 33).
///
/// # Errors
/// [`FormulationError::NotFinite`] for NaN or infinite input,
/// [`FormulationError::TemperatureOutOfRange`] and
/// [`FormulationError::DensityOutOfRange`] outside the range above, and
/// [`FormulationError::OutsideFormulation`] for a mechanically unstable
/// state (inside the spinodal, (∂p/∂ρ)_T ≤ 0), where the properties have no
/// physical meaning.
///
/// # Example
/// ```
/// use vapora_tables::if97::region3;
/// let props = region3::properties_rho_t(500.0, 650.0).unwrap();
/// assert!((props.pressure_pa - 25.583_701_8e6).abs() < 100.0);
/// ```
pub fn properties_rho_t(
    density_kg_m3: f64,
    temperature_k: f64,
) -> Result<Properties, FormulationError> {
    check_rho_t(density_kg_m3, temperature_k)?;
    let (_, slope) = pressure_and_slope_unchecked(density_kg_m3, temperature_k);
    let props = properties_rho_t_unchecked(density_kg_m3, temperature_k);
    if slope <= 0.0 || !props.speed_of_sound_m_s.is_finite() || props.pressure_pa <= 0.0 {
        return Err(FormulationError::OutsideFormulation {
            pressure_pa: props.pressure_pa,
            temperature_k,
        });
    }
    Ok(props)
}

/// Which root of p₃(ρ, T) = p to take on an isotherm below Tc.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Branch {
    /// The liquid-like root, at densities above the liquid spinodal.
    Liquid,
    /// The vapour-like root, at densities below the vapour spinodal.
    Vapour,
}

/// The two spinodal densities (vapour, liquid) of an isotherm of Eq. 28,
/// kg/m³: the zeros of (∂p/∂ρ)_T. `None` when (∂p/∂ρ)_T is nowhere negative
/// (every isotherm from about 2e-6 K above Tc upward). No range check; meant
/// for 623.15 K ≤ T < Tc.
///
/// Method: below Tc the slope at ρc is negative (checked by the test suite
/// on a dense grid up to 1e-8 K below Tc), so each spinodal is bracketed
/// between ρc and a far end where the slope is positive (50 or 800 kg/m³)
/// and found by the Illinois variant of regula falsi to 1e-12 relative.
/// Should the slope at ρc not be negative (at or above Tc), the minimum of
/// the slope is sought by golden-section search in 200 … 600 kg/m³ and used
/// instead. The test suite checks on a dense grid that the slope changes
/// sign exactly twice on every isotherm of 623.15 K … Tc and that these are
/// the two spinodals found.
pub fn spinodal_densities_kg_m3(temperature_k: f64) -> Option<(f64, f64)> {
    let slope = |rho: f64| pressure_and_slope_unchecked(rho, temperature_k).1;
    let mut inner = CRITICAL_DENSITY_KG_M3;
    let mut inner_slope = slope(inner);
    if inner_slope >= 0.0 {
        inner = golden_minimum(&slope, 200.0, 600.0);
        inner_slope = slope(inner);
        if inner_slope >= 0.0 {
            return None;
        }
    }
    let vapour = illinois(&slope, MIN_DENSITY_KG_M3, inner, inner_slope)?;
    let liquid = illinois(&slope, MAX_DENSITY_KG_M3, inner, inner_slope)?;
    Some((vapour, liquid))
}

/// Minimum of a unimodal `f` on [a, b] by golden-section search (to 1e-6).
fn golden_minimum(f: &impl Fn(f64) -> f64, a: f64, b: f64) -> f64 {
    let (mut a, mut b) = (a, b);
    // 1/φ, the golden-section ratio.
    let g = 0.618_033_988_749_894_9;
    let mut c = b - g * (b - a);
    let mut d = a + g * (b - a);
    let (mut fc, mut fd) = (f(c), f(d));
    // 400 shrinks below 1e-6 in 42 steps.
    for _ in 0..42 {
        if fc < fd {
            b = d;
            d = c;
            fd = fc;
            c = b - g * (b - a);
            fc = f(c);
        } else {
            a = c;
            c = d;
            fc = fd;
            d = a + g * (b - a);
            fd = f(d);
        }
    }
    0.5 * (a + b)
}

/// Zero of `f` between `outer` (where f > 0 is required) and `inner`
/// (where f = `f_inner` < 0), by the Illinois method: regula falsi that
/// halves the weight of an end kept twice, so it converges superlinearly.
/// Stops when the bracket is narrower than 1e-12 relative.
fn illinois(f: &impl Fn(f64) -> f64, outer: f64, inner: f64, f_inner: f64) -> Option<f64> {
    let (mut a, mut fa) = (outer, f(outer));
    let (mut b, mut fb) = (inner, f_inner);
    if fa <= 0.0 {
        return None;
    }
    let mut side = 0;
    for _ in 0..100 {
        let c = (a * fb - b * fa) / (fb - fa);
        if !c.is_finite() || libm::fabs(b - a) <= 1e-12 * libm::fabs(c) {
            return Some(if c.is_finite() { c } else { 0.5 * (a + b) });
        }
        let fc = f(c);
        if fc == 0.0 {
            return Some(c);
        }
        if (fc > 0.0) == (fa > 0.0) {
            a = c;
            fa = fc;
            if side == -1 {
                fb *= 0.5;
            }
            side = -1;
        } else {
            b = c;
            fb = fc;
            if side == 1 {
                fa *= 0.5;
            }
            side = 1;
        }
    }
    Some(0.5 * (a + b))
}

/// Root of p₃(ρ, T) = p in [lo, hi] where p₃ − p changes sign and p₃ is
/// monotone increasing in ρ: Newton steps kept inside a shrinking bracket,
/// falling back to bisection whenever a step leaves it. Converges to a
/// relative residual of 1e-13 on p with a last Newton step below 1e-14·ρ, or, where the rounding noise of Eq. 28
/// is larger than that (up to about 5e-13 relative in compressed liquid near
/// 623 K, where terms of order 100 cancel), to a bracket a few ulp wide.
pub(crate) fn solve_in_bracket(
    pressure_pa: f64,
    temperature_k: f64,
    lo: f64,
    hi: f64,
) -> Result<f64, FormulationError> {
    let (mut lo, mut hi) = (lo, hi);
    let residual = |rho: f64| pressure_pa_unchecked(rho, temperature_k) - pressure_pa;
    let (rlo, rhi) = (residual(lo), residual(hi));
    if !(rlo <= 0.0 && rhi >= 0.0) {
        return Err(FormulationError::NoConvergence);
    }
    let mut rho = lo + (hi - lo) * (-rlo) / (rhi - rlo);
    if !rho.is_finite() {
        rho = 0.5 * (lo + hi);
    }
    let mut polish = 3;
    for _ in 0..200 {
        let (p, slope) = pressure_and_slope_unchecked(rho, temperature_k);
        let r = p - pressure_pa;
        // Stop when p matches to 1e-13 and the next Newton step would move
        // ρ by less than 1e-14 relative (at most three extra steps, as the
        // rounding noise of p₃ may keep it from getting there). This matters only
        // near the critical point, where (∂p/∂ρ)_T is nearly 0 and a 1e-13
        // residual in p still leaves ρ uncertain by ~1e-3 kg/m³, which would
        // make h(p, T) and s(p, T) ragged at the 1e-9 level.
        if libm::fabs(r) <= 1e-13 * pressure_pa {
            if libm::fabs(r) <= 1e-14 * rho * slope || polish == 0 {
                return Ok(rho);
            }
            polish -= 1;
        }
        if r < 0.0 {
            lo = rho;
        } else {
            hi = rho;
        }
        if hi - lo <= 4.0 * f64::EPSILON * hi {
            return Ok(rho);
        }
        let newton = rho - r / slope;
        rho = if slope > 0.0 && newton > lo && newton < hi {
            newton
        } else {
            0.5 * (lo + hi)
        };
    }
    Err(FormulationError::NoConvergence)
}

/// Density on an isotherm at a given pressure, choosing the root by branch
/// below Tc. No check that (p, T) is in Region 3; used by the saturation line.
///
/// At and above Tc the whole density range is one bracket. (Eq. 28 has a
/// loop of about 1e-4 Pa height at exactly Tc and up to about 647.1 K, far
/// below any pressure resolution; the bracketed solver then returns one of
/// the roots, all within a few kg/m³·1e-3 of each other.)
///
/// Below Tc, if the pressure lies beyond the loop for the chosen branch
/// (above the vapour spinodal pressure for [`Branch::Vapour`], below the
/// liquid spinodal pressure for [`Branch::Liquid`]) there is no root on that
/// branch and the root on the other branch, the only one, is returned. With
/// the branch chosen by psat(T) this happens only where psat(T) lies outside
/// the loop of Eq. 28, which the test suite bounds to the last microkelvins
/// below Tc (where the loop is below 1 Pa high).
pub(crate) fn density_on_branch(
    pressure_pa: f64,
    temperature_k: f64,
    branch: Branch,
) -> Result<f64, FormulationError> {
    let whole = || {
        solve_in_bracket(
            pressure_pa,
            temperature_k,
            MIN_DENSITY_KG_M3,
            MAX_DENSITY_KG_M3,
        )
    };
    if temperature_k >= CRITICAL_TEMPERATURE_K {
        return whole();
    }
    match spinodal_densities_kg_m3(temperature_k) {
        Some((vapour_spinodal, liquid_spinodal)) => {
            let liquid = || {
                solve_in_bracket(
                    pressure_pa,
                    temperature_k,
                    liquid_spinodal,
                    MAX_DENSITY_KG_M3,
                )
            };
            let vapour = || {
                solve_in_bracket(
                    pressure_pa,
                    temperature_k,
                    MIN_DENSITY_KG_M3,
                    vapour_spinodal,
                )
            };
            match branch {
                Branch::Liquid => liquid().or_else(|_| vapour()),
                Branch::Vapour => vapour().or_else(|_| liquid()),
            }
        }
        None => whole(),
    }
}

/// B23 boundary pressure, Pa (IAPWS R7-97(2012), Eq. 5, Table 1), kept local
/// so that this module stands on its own.
fn b23_pressure_pa(temperature_k: f64) -> f64 {
    let t = temperature_k;
    (0.348_051_856_289_69e3 - 0.116_718_598_799_75e1 * t + 0.101_929_700_393_26e-2 * t * t) * 1.0e6
}

/// Checks that (p, T) lies in Region 3 (IAPWS R7-97(2012), section 4):
/// 623.15 K ≤ T, p ≤ 100 MPa, p ≥ p_B23(T) (which also gives T ≤ T_B23(p)).
fn check_pt(pressure_pa: f64, temperature_k: f64) -> Result<(), FormulationError> {
    require_finite(&[pressure_pa, temperature_k])?;
    if !(MIN_TEMPERATURE_K..=MAX_TEMPERATURE_K).contains(&temperature_k) {
        return Err(FormulationError::TemperatureOutOfRange { temperature_k });
    }
    if pressure_pa > MAX_PRESSURE_PA || pressure_pa < b23_pressure_pa(temperature_k) {
        return Err(FormulationError::PressureOutOfRange { pressure_pa });
    }
    Ok(())
}

/// Density at pressure p (Pa) and temperature T (K) in Region 3, kg/m³.
///
/// Method (instead of the 2005 backward equations v(p, T) of IAPWS SR5-05,
/// which are not used here): below Tc the isotherm of Eq. 28 has a loop
/// between two spinodals; for p > psat(T) (Region 4 equation) the
/// liquid-like root above the liquid spinodal is taken, for p ≤ psat(T) the
/// vapour-like root below the vapour spinodal. Each root is bracketed between
/// its spinodal and a safe far end (50 or 800 kg/m³) and found by Newton
/// steps kept inside the bracket. At and above Tc the isotherm is monotone
/// (checked numerically by the test suite over all of Region 3) and the
/// single root is bracketed in 50 … 800 kg/m³. The result satisfies
/// |p₃(ρ, T) − p| ≤ 1e-13·p, or, where the rounding noise of evaluating
/// Eq. 28 exceeds that (up to about 5e-13 relative), lies within a few ulp
/// of where the computed p₃ crosses p.
///
/// Range: Region 3, 623.15 K ≤ T ≤ 863.15 K, p_B23(T) ≤ p ≤ 100 MPa.
///
/// # Errors
/// [`FormulationError::NotFinite`], [`FormulationError::TemperatureOutOfRange`],
/// [`FormulationError::PressureOutOfRange`] outside Region 3;
/// [`FormulationError::NoConvergence`] should not occur inside the range.
pub fn density_pt(pressure_pa: f64, temperature_k: f64) -> Result<f64, FormulationError> {
    check_pt(pressure_pa, temperature_k)?;
    let branch = if temperature_k < CRITICAL_TEMPERATURE_K
        && pressure_pa <= saturation_pressure_pa_unchecked(temperature_k)
    {
        Branch::Vapour
    } else {
        Branch::Liquid
    };
    density_on_branch(pressure_pa, temperature_k, branch)
}

/// The properties at pressure p (Pa) and temperature T (K) in Region 3.
///
/// The density comes from [`density_pt`]; the properties are then Eq. 28 at
/// (ρ, T). The returned `pressure_pa` is p₃(ρ, T), equal to the input to
/// 1e-13 relative (5e-13 where Eq. 28's own rounding noise is that large).
///
/// # Errors
/// As [`density_pt`].
pub fn properties_pt(pressure_pa: f64, temperature_k: f64) -> Result<Properties, FormulationError> {
    let rho = density_pt(pressure_pa, temperature_k)?;
    Ok(properties_rho_t_unchecked(rho, temperature_k))
}
