//! The generator's own accuracy measurement: the f32 tables evaluated along
//! the kernel's paths (at temperature and at pressure) against the source,
//! on a grid `measurement_points_per_interval` times finer than the knots.
//!
//! The kernel-path functions here are the reference evaluation of the table
//! format (what each tabulated quantity means and how it is turned back into
//! a property); the kernel implements the same steps in its own code, and
//! `host-tests` measures the kernel itself independently.

use std::vec::Vec;

use super::{GenerateError, Generated, SaturationSource};

/// Smallest 1/cp the kernel accepts before dividing, kg·K/J: caps the heat
/// capacities at 1e10 J/(kg·K) where the fit is extended to the critical
/// point (cp diverges there).
pub const INVERSE_CP_FLOOR: f32 = 1e-10;

/// The saturated state as the kernel computes it, f32.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct KernelState {
    /// Saturation temperature, K.
    pub temperature_k: f32,
    /// Saturation pressure, Pa.
    pub pressure_pa: f32,
    /// ρ', ρ'' (kg/m³), h', h'' (J/kg), s', s'' (J/(kg·K)), cp', cp'' (J/(kg·K)).
    pub properties: [f32; 8],
}

fn finish(t: f32, p: f32, v: &[f32; 9]) -> KernelState {
    KernelState {
        temperature_k: t,
        pressure_pa: p,
        properties: [
            v[1],
            p * v[2],
            v[3],
            v[4],
            v[5],
            v[6],
            1.0 / v[7].max(INVERSE_CP_FLOOR),
            1.0 / v[8].max(INVERSE_CP_FLOOR),
        ],
    }
}

/// The kernel's path from a temperature (inside the accepted range).
pub fn state_at_temperature(g: &Generated, t_k: f32) -> KernelState {
    let l = &g.limits;
    let v = if t_k < l.boundary_temperature_k {
        g.state_low.evaluate(t_k)
    } else {
        g.state_high
            .evaluate(libm::sqrtf(l.critical_temperature_k - t_k))
    };
    finish(t_k, libm::expf(v[0]), &v)
}

/// The kernel's path from a pressure (inside the accepted range).
pub fn state_at_pressure(g: &Generated, p_pa: f32) -> KernelState {
    let l = &g.limits;
    if p_pa < l.boundary_pressure_pa {
        let [t] = g.temperature_low.evaluate(p_pa);
        finish(t, p_pa, &g.state_low.evaluate(t))
    } else {
        let q = l.critical_pressure_pa - p_pa;
        let [tau] = g.temperature_high.evaluate(q);
        let tau = if q > 0.0 { tau.max(0.0) } else { 0.0 };
        finish(
            l.critical_temperature_k - tau * tau,
            p_pa,
            &g.state_high.evaluate(tau),
        )
    }
}

/// Largest deviations in one temperature zone.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct ZoneMaxima {
    /// |ΔT|, K.
    pub temperature_k: f64,
    /// |Δp|/p.
    pub pressure_relative: f64,
    /// |Δρ'|/ρ'.
    pub liquid_density_relative: f64,
    /// |Δρ''|/ρ''.
    pub vapour_density_relative: f64,
    /// |Δh'|, J/kg.
    pub liquid_enthalpy_j_kg: f64,
    /// |Δh''|, J/kg.
    pub vapour_enthalpy_j_kg: f64,
    /// |Δs'|, J/(kg·K).
    pub liquid_entropy_j_kgk: f64,
    /// |Δs''|, J/(kg·K).
    pub vapour_entropy_j_kgk: f64,
    /// |Δcp'|/cp'.
    pub liquid_cp_relative: f64,
    /// |Δcp''|/cp''.
    pub vapour_cp_relative: f64,
    /// First-order bound of |Δx| for x from (p, h) or (T, h):
    /// (|Δh'| + |Δh''|)/(h'' − h').
    pub dryness_fraction: f64,
}

impl ZoneMaxima {
    /// The fields as (name, value) pairs, in declaration order.
    pub fn fields(&self) -> [(&'static str, f64); 11] {
        [
            ("temperature_k", self.temperature_k),
            ("pressure_relative", self.pressure_relative),
            ("liquid_density_relative", self.liquid_density_relative),
            ("vapour_density_relative", self.vapour_density_relative),
            ("liquid_enthalpy_j_kg", self.liquid_enthalpy_j_kg),
            ("vapour_enthalpy_j_kg", self.vapour_enthalpy_j_kg),
            ("liquid_entropy_j_kgk", self.liquid_entropy_j_kgk),
            ("vapour_entropy_j_kgk", self.vapour_entropy_j_kgk),
            ("liquid_cp_relative", self.liquid_cp_relative),
            ("vapour_cp_relative", self.vapour_cp_relative),
            ("dryness_fraction", self.dryness_fraction),
        ]
    }

    fn update(&mut self, k: &KernelState, t_ref: f64, r: &super::SaturatedSample) {
        let rel = |a: f32, b: f64| ((f64::from(a) - b) / b).abs();
        let abs = |a: f32, b: f64| (f64::from(a) - b).abs();
        let m =
            |slot: &mut f64, v: f64| *slot = slot.max(if v.is_nan() { f64::INFINITY } else { v });
        let q = &k.properties;
        m(&mut self.temperature_k, abs(k.temperature_k, t_ref));
        m(
            &mut self.pressure_relative,
            rel(k.pressure_pa, r.pressure_pa),
        );
        m(
            &mut self.liquid_density_relative,
            rel(q[0], r.liquid.density_kg_m3),
        );
        m(
            &mut self.vapour_density_relative,
            rel(q[1], r.vapour.density_kg_m3),
        );
        let dh_l = abs(q[2], r.liquid.enthalpy_j_kg);
        let dh_v = abs(q[3], r.vapour.enthalpy_j_kg);
        m(&mut self.liquid_enthalpy_j_kg, dh_l);
        m(&mut self.vapour_enthalpy_j_kg, dh_v);
        m(
            &mut self.liquid_entropy_j_kgk,
            abs(q[4], r.liquid.entropy_j_kgk),
        );
        m(
            &mut self.vapour_entropy_j_kgk,
            abs(q[5], r.vapour.entropy_j_kgk),
        );
        m(&mut self.liquid_cp_relative, rel(q[6], r.liquid.cp_j_kgk));
        m(&mut self.vapour_cp_relative, rel(q[7], r.vapour.cp_j_kgk));
        m(
            &mut self.dryness_fraction,
            (dh_l + dh_v) / (r.vapour.enthalpy_j_kg - r.liquid.enthalpy_j_kg),
        );
    }

    /// Field-wise maximum.
    pub fn max(&self, other: &Self) -> Self {
        let a = self.fields();
        let b = other.fields();
        let v: Vec<f64> = a.iter().zip(b.iter()).map(|(x, y)| x.1.max(y.1)).collect();
        Self {
            temperature_k: v[0],
            pressure_relative: v[1],
            liquid_density_relative: v[2],
            vapour_density_relative: v[3],
            liquid_enthalpy_j_kg: v[4],
            vapour_enthalpy_j_kg: v[5],
            liquid_entropy_j_kgk: v[6],
            vapour_entropy_j_kgk: v[7],
            liquid_cp_relative: v[8],
            vapour_cp_relative: v[9],
            dryness_fraction: v[10],
        }
    }
}

/// Maxima in the two zones of the accuracy table.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Measured {
    /// Saturation temperature below Tc − 1 K.
    pub below_near_critical: ZoneMaxima,
    /// From Tc − 1 K to Tc − `critical_margin_k`.
    pub near_critical: ZoneMaxima,
    /// Points measured in each zone (a zone outside the envelope has none).
    pub points: [usize; 2],
}

/// Upper end of the first zone: Tc − 1 K.
pub const NEAR_CRITICAL_START_K: f64 = 647.096 - 1.0;

/// Measures `g` against `source` along both kernel paths.
///
/// # Errors
/// [`GenerateError::Source`] when the source fails at a grid point.
pub fn measure<S: SaturationSource + ?Sized>(
    g: &Generated,
    source: &S,
) -> Result<Measured, GenerateError> {
    let c = &g.config;
    let l = &g.limits;
    let m = c.measurement_points_per_interval;
    let t_top = c.temperature_max_k.min(647.096 - c.critical_margin_k);
    let mut out = Measured::default();
    let mut record = |k: &KernelState, t_ref: f64| -> Result<(), GenerateError> {
        if t_ref > t_top || t_ref < c.temperature_min_k {
            return Ok(());
        }
        let r = source
            .saturated_sample(t_ref)
            .map_err(|message| GenerateError::Source { at: t_ref, message })?;
        if t_ref < NEAR_CRITICAL_START_K {
            out.below_near_critical.update(k, t_ref, &r);
            out.points[0] += 1;
        } else {
            out.near_critical.update(k, t_ref, &r);
            out.points[1] += 1;
        }
        Ok(())
    };
    // Temperature inputs: uniform in T below 623.15 K, uniform in τ above.
    let n = g.state_low.intervals.len() * m;
    let (lo, hi) = (
        f64::from(l.temperature_min_k),
        f64::from(l.boundary_temperature_k).min(t_top),
    );
    for k in 0..=n {
        let t = (lo + (hi - lo) * k as f64 / n as f64) as f32;
        if t >= l.temperature_min_k && t <= l.temperature_max_k {
            record(&state_at_temperature(g, t), f64::from(t))?;
        }
    }
    let n = g.state_high.intervals.len() * m;
    let tc32 = f64::from(l.critical_temperature_k);
    let (tau_lo, tau_hi) = (
        (tc32 - t_top).sqrt(),
        (tc32 - f64::from(l.boundary_temperature_k)).max(0.0).sqrt(),
    );
    for k in 0..=n {
        let tau = tau_lo + (tau_hi - tau_lo) * k as f64 / n as f64;
        let t = (tc32 - tau * tau) as f32;
        if t >= l.temperature_min_k && t <= l.temperature_max_k {
            record(&state_at_temperature(g, t), f64::from(t))?;
        }
    }
    // Pressure inputs: uniform in ln p below p_sat(623.15 K), in ln(pc − p)
    // above (the temperature tables' knots are nearly uniform in these; the
    // grid has twice `m` points per interval on average, so at least `m` in
    // the widest interval of an octave).
    let n = g.temperature_low.intervals.len() * m * 2;
    let (lo, hi) = (
        f64::from(l.pressure_min_pa).ln(),
        f64::from(l.boundary_pressure_pa).ln(),
    );
    for k in 0..=n {
        let p = (lo + (hi - lo) * k as f64 / n as f64).exp() as f32;
        if p >= l.pressure_min_pa && p <= l.pressure_max_pa {
            record(
                &state_at_pressure(g, p),
                source.saturation_temperature_k(f64::from(p)),
            )?;
        }
    }
    let n = g.temperature_high.intervals.len() * m * 2;
    let pc32 = f64::from(l.critical_pressure_pa);
    let (q_lo, q_hi) = (
        (pc32 - f64::from(l.pressure_max_pa)).max(2.0).ln(),
        (pc32 - f64::from(l.boundary_pressure_pa)).max(4.0).ln(),
    );
    for k in 0..=n {
        let q = (q_lo + (q_hi - q_lo) * k as f64 / n as f64).exp();
        let p = (pc32 - q) as f32;
        if p >= l.pressure_min_pa && p <= l.pressure_max_pa {
            record(
                &state_at_pressure(g, p),
                source.saturation_temperature_k(f64::from(p)),
            )?;
        }
    }
    Ok(out)
}

/// A published bound from a measured maximum: ×2 margin for points
/// between grid points, rounded up to two significant digits.
pub fn bound_from_measured(x: f64) -> f64 {
    if x <= 0.0 || !x.is_finite() {
        return x;
    }
    let y = x * 2.0;
    let e = y.log10().floor() - 1.0;
    let scale = 10f64.powf(e);
    (y / scale).ceil() * scale
}

/// The accuracy table of the project (issue 3) below Tc − 1 K, as a target
/// for [`super::fit_to_target`].
pub const ACCURACY_TABLE_BELOW_NEAR_CRITICAL: ZoneMaxima = ZoneMaxima {
    temperature_k: 1e-3,
    pressure_relative: 10e-6,
    liquid_density_relative: 20e-6,
    vapour_density_relative: 20e-6,
    liquid_enthalpy_j_kg: 10.0,
    vapour_enthalpy_j_kg: 10.0,
    liquid_entropy_j_kgk: 0.02,
    vapour_entropy_j_kgk: 0.02,
    liquid_cp_relative: 1e-3,
    vapour_cp_relative: 1e-3,
    dryness_fraction: 1e-5,
};

/// The accuracy table from Tc − 1 K to Tc − 0.01 K (cp is only measured
/// there, so it has no target).
pub const ACCURACY_TABLE_NEAR_CRITICAL: ZoneMaxima = ZoneMaxima {
    temperature_k: 1e-3,
    pressure_relative: 10e-6,
    liquid_density_relative: 1e-3,
    vapour_density_relative: 1e-3,
    liquid_enthalpy_j_kg: 200.0,
    vapour_enthalpy_j_kg: 200.0,
    liquid_entropy_j_kgk: 0.5,
    vapour_entropy_j_kgk: 0.5,
    liquid_cp_relative: f64::INFINITY,
    vapour_cp_relative: f64::INFINITY,
    dryness_fraction: 1e-3,
};

impl ZoneMaxima {
    /// True when every field is within `factor` × the same field of `target`.
    pub fn within(&self, target: &Self, factor: f64) -> bool {
        self.fields()
            .iter()
            .zip(target.fields().iter())
            .all(|(m, t)| m.1 <= t.1 * factor)
    }
}
