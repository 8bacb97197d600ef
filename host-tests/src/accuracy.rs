//! Accuracy of the kernel's saturation functions against the f64 IAPWS-IF97
//! formulation: per-point deviations, and their maxima per zone of the
//! accuracy table (below Tc − 1 K, and Tc − 1 K to Tc − 0.01 K).
//!
//! The kernel is called exactly as firmware calls it (f32 inputs through
//! the unit types); the formulation is evaluated at the same f32 input
//! converted exactly to f64, so input rounding is not counted as error.

use rand::{Rng, SeedableRng};
use rand_chacha::ChaCha8Rng;
use vapora_kernel::quality::{phase_from_pressure_enthalpy, phase_from_temperature_enthalpy};
use vapora_kernel::saturation::{
    saturated_state_at_pressure, saturated_state_at_temperature, SaturatedState,
};
use vapora_kernel::tables::saturation as table;
use vapora_kernel::units::{AbsolutePressure, Temperature};
use vapora_tables::if97::saturation;

/// Critical temperature, K (IAPWS R7-97(2012), Eq. 3).
pub const CRITICAL_TEMPERATURE_K: f64 = 647.096;
/// Start of the near-critical zone, K: Tc − 1 K.
pub const NEAR_CRITICAL_START_K: f64 = CRITICAL_TEMPERATURE_K - 1.0;
/// End of the stated accuracy, K: Tc − 0.01 K.
pub const STATED_END_K: f64 = CRITICAL_TEMPERATURE_K - 0.01;

/// Dryness fractions at which x from (p, h) and (T, h) is checked. The
/// error of x is linear in x between its values at 0 and 1, so points near
/// both ends and the middle find the largest.
pub const DRYNESS_PROBES: [f64; 3] = [0.02, 0.5, 0.98];

/// The accuracy the project requires below Tc − 1 K (issue 3, accuracy
/// table): 1 mK, 10 ppm, 20 ppm, 0.01 kJ/kg, 0.02 J/(kg·K), 0.1 %, 1e-5.
pub const REQUIRED_BELOW_NEAR_CRITICAL: Deviations = Deviations {
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

/// The accuracy the project requires from Tc − 1 K to Tc − 0.01 K (issue 3,
/// accuracy table). cp is "measured and documented" there, not bounded:
/// infinity here, and the kernel's own published bound is checked instead.
pub const REQUIRED_NEAR_CRITICAL: Deviations = Deviations {
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

/// The kernel's published bound as [`Deviations`] (f32 constants widened).
pub fn published(a: &vapora_kernel::accuracy::SaturationAccuracy) -> Deviations {
    let w = f64::from;
    Deviations {
        temperature_k: w(a.temperature_k),
        pressure_relative: w(a.pressure_relative),
        liquid_density_relative: w(a.liquid_density_relative),
        vapour_density_relative: w(a.vapour_density_relative),
        liquid_enthalpy_j_kg: w(a.liquid_enthalpy_j_kg),
        vapour_enthalpy_j_kg: w(a.vapour_enthalpy_j_kg),
        liquid_entropy_j_kgk: w(a.liquid_entropy_j_kgk),
        vapour_entropy_j_kgk: w(a.vapour_entropy_j_kgk),
        liquid_cp_relative: w(a.liquid_cp_relative),
        vapour_cp_relative: w(a.vapour_cp_relative),
        dryness_fraction: w(a.dryness_fraction),
    }
}

/// The fields of `measured` that exceed `bound`, as (name, measured, bound).
pub fn exceeding(measured: &Deviations, bound: &Deviations) -> Vec<(&'static str, f64, f64)> {
    measured
        .fields()
        .iter()
        .zip(bound.fields().iter())
        .filter(|(m, b)| m.1.is_nan() || m.1 > b.1)
        .map(|(m, b)| (m.0, m.1, b.1))
        .collect()
}

/// Both saturated phases from the formulation at a temperature, SI units.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ReferenceState {
    /// Saturation pressure, Pa.
    pub pressure_pa: f64,
    /// Saturation temperature, K.
    pub temperature_k: f64,
    /// ρ', ρ'' (kg/m³), h', h'' (J/kg), s', s'' (J/(kg·K)), cp', cp'' (J/(kg·K)).
    pub properties: [f64; 8],
}

fn reference(
    s: &saturation::SaturatedStates,
    pressure_pa: f64,
    temperature_k: f64,
) -> ReferenceState {
    let (l, v) = (&s.liquid, &s.vapour);
    ReferenceState {
        pressure_pa,
        temperature_k,
        properties: [
            l.density_kg_m3,
            v.density_kg_m3,
            l.enthalpy_j_kg,
            v.enthalpy_j_kg,
            l.entropy_j_kgk,
            v.entropy_j_kgk,
            l.cp_j_kgk,
            v.cp_j_kgk,
        ],
    }
}

/// The formulation's saturated state at `t_k` ([`saturation::at_temperature`]),
/// or `None` outside its range.
pub fn reference_at_temperature(t_k: f64) -> Option<ReferenceState> {
    let s = saturation::at_temperature(t_k).ok()?;
    Some(reference(&s, s.liquid.pressure_pa, t_k))
}

/// The formulation's saturated state at `p_pa` ([`saturation::at_pressure`]),
/// or `None` outside its range.
pub fn reference_at_pressure(p_pa: f64) -> Option<ReferenceState> {
    let s = saturation::at_pressure(p_pa).ok()?;
    Some(reference(&s, p_pa, s.liquid.temperature_k))
}

/// Deviations of one kernel result from the formulation (all ≥ 0), or the
/// maxima of many. Relative fields are |Δy|/y, the others carry units.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Deviations {
    /// |ΔT_sat|, K.
    pub temperature_k: f64,
    /// |Δp_sat|/p_sat.
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
    /// |Δx| of the dryness fraction from (p, h) or (T, h), at the
    /// [`DRYNESS_PROBES`].
    pub dryness_fraction: f64,
}

impl Deviations {
    /// Every field infinite: the mark of a failed kernel call.
    pub const INFINITE: Self = Self {
        temperature_k: f64::INFINITY,
        pressure_relative: f64::INFINITY,
        liquid_density_relative: f64::INFINITY,
        vapour_density_relative: f64::INFINITY,
        liquid_enthalpy_j_kg: f64::INFINITY,
        vapour_enthalpy_j_kg: f64::INFINITY,
        liquid_entropy_j_kgk: f64::INFINITY,
        vapour_entropy_j_kgk: f64::INFINITY,
        liquid_cp_relative: f64::INFINITY,
        vapour_cp_relative: f64::INFINITY,
        dryness_fraction: f64::INFINITY,
    };

    /// Names and values in declaration order (names match the kernel's
    /// `SaturationAccuracy` fields).
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

    /// Field-wise maximum; a NaN on either side gives infinity, so a NaN
    /// can never hide in a maximum.
    pub fn max(&self, o: &Self) -> Self {
        let m = |a: f64, b: f64| {
            if a.is_nan() || b.is_nan() {
                f64::INFINITY
            } else {
                a.max(b)
            }
        };
        Self {
            temperature_k: m(self.temperature_k, o.temperature_k),
            pressure_relative: m(self.pressure_relative, o.pressure_relative),
            liquid_density_relative: m(self.liquid_density_relative, o.liquid_density_relative),
            vapour_density_relative: m(self.vapour_density_relative, o.vapour_density_relative),
            liquid_enthalpy_j_kg: m(self.liquid_enthalpy_j_kg, o.liquid_enthalpy_j_kg),
            vapour_enthalpy_j_kg: m(self.vapour_enthalpy_j_kg, o.vapour_enthalpy_j_kg),
            liquid_entropy_j_kgk: m(self.liquid_entropy_j_kgk, o.liquid_entropy_j_kgk),
            vapour_entropy_j_kgk: m(self.vapour_entropy_j_kgk, o.vapour_entropy_j_kgk),
            liquid_cp_relative: m(self.liquid_cp_relative, o.liquid_cp_relative),
            vapour_cp_relative: m(self.vapour_cp_relative, o.vapour_cp_relative),
            dryness_fraction: m(self.dryness_fraction, o.dryness_fraction),
        }
    }
}

fn state_deviations(k: &SaturatedState, r: &ReferenceState) -> Deviations {
    let rel = |a: f32, b: f64| ((f64::from(a) - b) / b).abs();
    let abs = |a: f32, b: f64| (f64::from(a) - b).abs();
    let q = &r.properties;
    Deviations {
        temperature_k: abs(k.temperature.as_kelvin(), r.temperature_k),
        pressure_relative: rel(k.pressure.as_pa(), r.pressure_pa),
        liquid_density_relative: rel(k.liquid.density_kg_m3, q[0]),
        vapour_density_relative: rel(k.vapour.density_kg_m3, q[1]),
        liquid_enthalpy_j_kg: abs(k.liquid.enthalpy_j_kg, q[2]),
        vapour_enthalpy_j_kg: abs(k.vapour.enthalpy_j_kg, q[3]),
        liquid_entropy_j_kgk: abs(k.liquid.entropy_j_kgk, q[4]),
        vapour_entropy_j_kgk: abs(k.vapour.entropy_j_kgk, q[5]),
        liquid_cp_relative: rel(k.liquid.cp_j_kgk, q[6]),
        vapour_cp_relative: rel(k.vapour.cp_j_kgk, q[7]),
        dryness_fraction: 0.0,
    }
}

/// |Δx| over the probes, given the kernel's dryness function at an enthalpy.
fn dryness_deviation(r: &ReferenceState, dryness: impl Fn(f32) -> Option<f32>) -> f64 {
    let (h_l, h_v) = (r.properties[2], r.properties[3]);
    DRYNESS_PROBES
        .iter()
        .map(|&x| {
            let h = (h_l + x * (h_v - h_l)) as f32;
            let x_ref = (f64::from(h) - h_l) / (h_v - h_l);
            match dryness(h) {
                Some(x_kernel) => (f64::from(x_kernel) - x_ref).abs(),
                None => f64::INFINITY,
            }
        })
        .fold(0.0, f64::max)
}

/// Deviations of the kernel at a temperature input (saturated state and x
/// from (T, h)), or `None` outside the kernel's or the formulation's range.
/// A kernel error where the formulation has a value counts as an infinite
/// deviation, so it cannot go unnoticed.
pub fn deviations_at_temperature(t_k: f32) -> Option<(ReferenceState, Deviations)> {
    let t = Temperature::from_kelvin(t_k).ok()?;
    let r = reference_at_temperature(f64::from(t_k))?;
    let Ok(k) = saturated_state_at_temperature(t) else {
        return Some((r, Deviations::INFINITE));
    };
    let mut d = state_deviations(&k, &r);
    d.dryness_fraction = dryness_deviation(&r, |h| {
        phase_from_temperature_enthalpy(t, h)
            .ok()
            .and_then(|p| p.dryness_fraction())
    });
    Some((r, d))
}

/// Deviations of the kernel at a pressure input (saturated state and x
/// from (p, h)), or `None` outside the kernel's or the formulation's range.
pub fn deviations_at_pressure(p_pa: f32) -> Option<(ReferenceState, Deviations)> {
    let p = AbsolutePressure::from_pa(p_pa).ok()?;
    let r = reference_at_pressure(f64::from(p_pa))?;
    let Ok(k) = saturated_state_at_pressure(p) else {
        return Some((r, Deviations::INFINITE));
    };
    let mut d = state_deviations(&k, &r);
    d.dryness_fraction = dryness_deviation(&r, |h| {
        phase_from_pressure_enthalpy(p, h)
            .ok()
            .and_then(|ph| ph.dryness_fraction())
    });
    Some((r, d))
}

/// Maxima in the two zones of the accuracy table.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct ZoneMaxima {
    /// Saturation temperature below Tc − 1 K.
    pub below_near_critical: Deviations,
    /// From Tc − 1 K to Tc − 0.01 K.
    pub near_critical: Deviations,
    /// Points measured in each zone.
    pub points: [usize; 2],
}

impl ZoneMaxima {
    /// Adds one point (ignored above Tc − 0.01 K, where no accuracy is stated).
    pub fn add(&mut self, r: &ReferenceState, d: &Deviations) {
        if r.temperature_k > STATED_END_K {
            return;
        }
        if r.temperature_k < NEAR_CRITICAL_START_K {
            self.below_near_critical = self.below_near_critical.max(d);
            self.points[0] += 1;
        } else {
            self.near_critical = self.near_critical.max(d);
            self.points[1] += 1;
        }
    }
}

/// The measurement grid: inputs in each table's own variable, so every
/// table gets `points_per_interval` points per interval (≥ 50 by the
/// issue's rule), plus `random_points` seeded random temperatures and as
/// many random pressures along the whole line.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Grid {
    /// Points per table interval.
    pub points_per_interval: usize,
    /// Random temperature inputs (and as many random pressure inputs).
    pub random_points: usize,
    /// Seed of the ChaCha8 generator.
    pub seed: u64,
}

impl Default for Grid {
    fn default() -> Self {
        Self {
            points_per_interval: 100,
            random_points: 100_000,
            seed: 0x5eed_57ea,
        }
    }
}

/// Every kernel input of a [`Grid`]: temperatures (K) and pressures (Pa).
pub fn grid_inputs(grid: &Grid) -> (Vec<f32>, Vec<f32>) {
    let m = grid.points_per_interval;
    let tc32 = f64::from(table::CRITICAL_TEMPERATURE_K);
    let pc32 = f64::from(table::CRITICAL_PRESSURE_PA);
    let t_min = f64::from(table::TEMPERATURE_MIN_K);
    let t_max = f64::from(table::TEMPERATURE_MAX_K).min(STATED_END_K);
    let tb = f64::from(table::BOUNDARY_TEMPERATURE_K);
    let p_min = f64::from(table::PRESSURE_MIN_PA);
    let p_max = f64::from(table::PRESSURE_MAX_PA);
    let pb = f64::from(table::BOUNDARY_PRESSURE_PA);
    let lerp = |a: f64, b: f64, k: usize, n: usize| a + (b - a) * k as f64 / n as f64;
    let mut ts = Vec::new();
    let n = table::STATE_LOW.intervals.len() * m;
    ts.extend((0..=n).map(|k| lerp(t_min, tb.min(t_max), k, n) as f32));
    if t_max > tb {
        let n = table::STATE_HIGH.intervals.len() * m;
        let (a, b) = ((tc32 - t_max).sqrt(), (tc32 - tb).sqrt());
        ts.extend((0..=n).map(|k| {
            let tau = lerp(a, b, k, n);
            (tc32 - tau * tau) as f32
        }));
    }
    let mut ps = Vec::new();
    let n = table::TEMPERATURE_LOW.intervals.len() * m;
    ps.extend((0..=n).map(|k| lerp(p_min.ln(), pb.min(p_max).ln(), k, n).exp() as f32));
    if p_max > pb {
        let n = table::TEMPERATURE_HIGH.intervals.len() * m;
        let (a, b) = (0.0, (pc32 - pb).sqrt());
        ps.extend((0..=n).map(|k| {
            let s = lerp(a, b, k, n);
            (pc32 - s * s) as f32
        }));
        // The temperature table there is indexed on the bit pattern of
        // q = pc − p, its knots nearly uniform in ln q: a grid uniform in
        // ln q as well, twice the points per interval on average (at least
        // `m` in the widest interval of an octave).
        let n = table::TEMPERATURE_HIGH.intervals.len() * m * 2;
        let (a, b) = ((pc32 - p_max).max(2.0).ln(), (pc32 - pb).ln());
        ps.extend((0..=n).map(|k| (pc32 - lerp(a, b, k, n).exp()) as f32));
    }
    let mut rng = ChaCha8Rng::seed_from_u64(grid.seed);
    // A fifth as many again in the near-critical zone, uniform in τ and σ,
    // which a uniform draw over the whole line would barely visit.
    if t_max > NEAR_CRITICAL_START_K {
        let (a, b) = ((tc32 - t_max).sqrt(), (tc32 - NEAR_CRITICAL_START_K).sqrt());
        let p_start =
            saturation::at_temperature(NEAR_CRITICAL_START_K).map_or(pb, |s| s.liquid.pressure_pa);
        let (c, d) = (
            (pc32 - p_max).max(0.0).sqrt(),
            (pc32 - p_start).max(0.0).sqrt(),
        );
        for _ in 0..grid.random_points / 5 {
            let tau = rng.random_range(a..=b);
            ts.push((tc32 - tau * tau) as f32);
            let sigma = rng.random_range(c..=d);
            ps.push((pc32 - sigma * sigma) as f32);
        }
    }
    for _ in 0..grid.random_points {
        ts.push(rng.random_range(t_min..=t_max) as f32);
        // Uniform in ln p, then a share uniform in p near the top.
        ps.push(rng.random_range(p_min.ln()..=p_max.ln()).exp() as f32);
        if p_max > pb {
            ps.push(rng.random_range(pb..=p_max) as f32);
        }
    }
    (ts, ps)
}

/// Measures the kernel on `grid`: maxima per zone from temperature inputs
/// and from pressure inputs, in that order.
pub fn measure_kernel(grid: &Grid) -> (ZoneMaxima, ZoneMaxima) {
    let (ts, ps) = grid_inputs(grid);
    let mut at_t = ZoneMaxima::default();
    for &t in &ts {
        if let Some((r, d)) = deviations_at_temperature(t) {
            at_t.add(&r, &d);
        }
    }
    let mut at_p = ZoneMaxima::default();
    for &p in &ps {
        if let Some((r, d)) = deviations_at_pressure(p) {
            at_p.add(&r, &d);
        }
    }
    (at_t, at_p)
}
