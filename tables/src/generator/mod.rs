//! The generator of the kernel's saturation tables (host only, feature
//! `generator`).
//!
//! It samples a [`SaturationSource`] (the f64 IAPWS-IF97 formulation in
//! normal use), fits least-squares cubic splines on uniform knots in
//! transformed variables for the state tables ([`fit`]) and cubic Hermite
//! interpolants on the f32 bit pattern for the temperature tables
//! ([`OctaveTable`]), measures the error of the f32 tables
//! evaluated exactly as the kernel evaluates them ([`measure`]), and emits
//! the Rust source of `kernel/src/tables.rs` ([`emit`]).
//!
//! # The table layout (the contract with the kernel)
//! Four tables, each a list of intervals holding one cubic per tabulated
//! quantity in the local variable t ∈ [0, 1]. The state tables are uniform
//! in their variable; the temperature tables are indexed on the f32 bit
//! pattern of theirs (2^`temperature_octave_bits_*` equal intervals per
//! octave, knots on the powers of two: a logarithmic spacing that costs no
//! logarithm):
//!
//! | table | independent variable | range | quantities |
//! |---|---|---|---|
//! | state, low | T, K | T_min … 623.15 K | ln p, ρ', ρ''/p, h', h'', s', s'', 1/cp', 1/cp'' |
//! | state, high | τ = √(Tc − T), √K | 0 … √(Tc − 623.15 K) | same |
//! | temperature, low | bit pattern of p, Pa | p_min … p_sat(623.15 K) | T |
//! | temperature, high | bit pattern of q = pc − p, Pa | 2 Pa … pc − p_sat(623.15 K) | τ |
//!
//! Why these variables: along the saturation line of IF97's Region 3 (an
//! analytic equation of state) the densities, enthalpies and entropies behave
//! like a + b·√(Tc − T) near the critical point, so in τ they are smooth
//! polynomials. For pressure inputs pc − p is nearly proportional to Tc − T,
//! so τ ≈ c·√q, which on one octave of q (a factor of two) is as smooth as
//! √ on [1, 2]: the octave spacing resolves it down to the last pascals
//! below pc without a square root. Below 16.53 MPa T(p) is smooth in ln p,
//! which the octave spacing follows. ln p is nearly linear in T (Clausius–Clapeyron),
//! ρ''/p is nearly 1/(R T) (ideal gas at low pressure) and 1/cp stays finite
//! where cp diverges at the critical point. The break at 623.15 K is where
//! the formulation hands over from Regions 1 and 2 to Region 3 and its
//! saturated properties jump by a few 1e-5 relative: a separate table on each
//! side reproduces the jump instead of smearing it over many intervals.

pub mod emit;
pub mod fit;
pub mod iapws97;
pub mod measure;
pub mod single_phase;
pub mod source;

pub use source::{PhaseSample, SaturatedSample, SaturationSource};

use std::string::String;
use std::vec::Vec;

use fit::{FitError, UniformKnots};

/// Number of quantities in a state table (see the module docs for the order).
pub const STATE_QUANTITIES: usize = 9;

/// Temperature where Regions 1 and 2 hand over to Region 3 along the
/// saturation line, K (IAPWS R7-97(2012), section 4).
pub const REGION3_BOUNDARY_TEMPERATURE_K: f64 = 623.15;

/// Settings of one generation run. [`Config::default`] is the committed
/// table: the whole line from the triple point to the critical point.
#[derive(Debug, Clone, PartialEq)]
pub struct Config {
    /// Lowest saturation temperature of the envelope, K (≥ 273.16).
    pub temperature_min_k: f64,
    /// Highest saturation temperature of the envelope, K (≤ 647.096).
    pub temperature_max_k: f64,
    /// Intervals of the state table below 623.15 K (uniform in T).
    pub state_intervals_low: usize,
    /// Intervals of the state table from 623.15 K up (uniform in τ).
    pub state_intervals_high: usize,
    /// The saturation-temperature table below p_sat(623.15 K) has
    /// 2^`temperature_octave_bits_low` intervals per octave of p (0 to 12).
    pub temperature_octave_bits_low: u32,
    /// The table from p_sat(623.15 K) up has 2^`temperature_octave_bits_high`
    /// intervals per octave of pc − p (0 to 12).
    pub temperature_octave_bits_high: u32,
    /// Fitting samples inside each interval (plus the knots).
    pub samples_per_interval: usize,
    /// Measuring points per interval for the accuracy bounds (≥ 50 by the
    /// issue's rule: a grid at least 50 times finer than the knots).
    pub measurement_points_per_interval: usize,
    /// The formulation is sampled no closer than this to the critical
    /// temperature, K; the last bit of the line is an extension of the fit.
    pub critical_margin_k: f64,
}

impl Default for Config {
    fn default() -> Self {
        Self {
            temperature_min_k: 273.16,
            temperature_max_k: 647.096,
            state_intervals_low: 48,
            state_intervals_high: 48,
            temperature_octave_bits_low: 3,
            temperature_octave_bits_high: 3,
            samples_per_interval: 12,
            measurement_points_per_interval: 64,
            critical_margin_k: 0.01,
        }
    }
}

impl Config {
    /// One line naming every setting, written into the generated header.
    pub fn describe(&self) -> String {
        format!(
            "temperature_min_k={} temperature_max_k={} state_intervals_low={} state_intervals_high={} \
             temperature_octave_bits_low={} temperature_octave_bits_high={} samples_per_interval={} \
             measurement_points_per_interval={} critical_margin_k={}",
            self.temperature_min_k,
            self.temperature_max_k,
            self.state_intervals_low,
            self.state_intervals_high,
            self.temperature_octave_bits_low,
            self.temperature_octave_bits_high,
            self.samples_per_interval,
            self.measurement_points_per_interval,
            self.critical_margin_k
        )
    }
}

impl Config {
    /// Reads the settings line written by [`Config::describe`] (the
    /// `// Settings:` header line of a generated file, without the prefix);
    /// settings not named keep their default.
    ///
    /// # Errors
    /// [`GenerateError::Config`] for an unknown key or a value that does not
    /// parse.
    pub fn parse(settings: &str) -> Result<Self, GenerateError> {
        let mut c = Self::default();
        for item in settings.split_whitespace() {
            let (key, value) = item
                .split_once('=')
                .ok_or_else(|| GenerateError::Config(format!("expected key=value, got {item}")))?;
            c.set(key, value)?;
        }
        Ok(c)
    }

    /// Sets one setting by its name in [`Config::describe`].
    ///
    /// # Errors
    /// [`GenerateError::Config`] for an unknown key or a bad value.
    pub fn set(&mut self, key: &str, value: &str) -> Result<(), GenerateError> {
        let bad = || GenerateError::Config(format!("bad value {value} for {key}"));
        let float = || value.parse::<f64>().map_err(|_| bad());
        let count = || value.parse::<usize>().map_err(|_| bad());
        let bits = || value.parse::<u32>().map_err(|_| bad());
        match key {
            "temperature_min_k" => self.temperature_min_k = float()?,
            "temperature_max_k" => self.temperature_max_k = float()?,
            "state_intervals_low" => self.state_intervals_low = count()?,
            "state_intervals_high" => self.state_intervals_high = count()?,
            "temperature_octave_bits_low" => self.temperature_octave_bits_low = bits()?,
            "temperature_octave_bits_high" => self.temperature_octave_bits_high = bits()?,
            "samples_per_interval" => self.samples_per_interval = count()?,
            "measurement_points_per_interval" => self.measurement_points_per_interval = count()?,
            "critical_margin_k" => self.critical_margin_k = float()?,
            _ => return Err(GenerateError::Config(format!("unknown setting {key}"))),
        }
        Ok(())
    }
}

/// Why a generation run failed.
#[derive(Debug, Clone, PartialEq)]
#[non_exhaustive]
pub enum GenerateError {
    /// The configuration is inconsistent (message says which setting).
    Config(String),
    /// The source could not give a value at a sampling point.
    Source {
        /// Temperature or pressure sampled (K or Pa).
        at: f64,
        /// The source's message.
        message: String,
    },
    /// A least-squares fit failed.
    Fit(FitError),
}

impl core::fmt::Display for GenerateError {
    fn fmt(&self, f: &mut core::fmt::Formatter<'_>) -> core::fmt::Result {
        match self {
            Self::Config(m) => write!(f, "bad configuration: {m}"),
            Self::Source { at, message } => write!(f, "formulation failed at {at}: {message}"),
            Self::Fit(e) => write!(f, "fit failed: {e}"),
        }
    }
}

impl std::error::Error for GenerateError {}

impl From<FitError> for GenerateError {
    fn from(e: FitError) -> Self {
        Self::Fit(e)
    }
}

/// A fitted table: its knots and one f32 cubic per quantity per interval.
#[derive(Debug, Clone, PartialEq)]
pub struct Table<const P: usize> {
    /// Knots as stored.
    pub knots: UniformKnots,
    /// `intervals[i][q]` is the cubic of quantity `q` on interval `i`.
    pub intervals: Vec<[[f32; 4]; P]>,
}

impl<const P: usize> Table<P> {
    /// Evaluates every quantity at `x` as the kernel does (f32).
    pub fn evaluate(&self, x: f32) -> [f32; P] {
        let u = ((x - self.knots.start) * self.knots.inverse_step).max(0.0);
        let i = (u as usize).min(self.intervals.len().saturating_sub(1));
        let t = u - i as f32;
        let mut out = [f32::NAN; P];
        if let Some(block) = self.intervals.get(i) {
            for (o, c) in out.iter_mut().zip(block) {
                *o = c[0] + t * (c[1] + t * (c[2] + t * c[3]));
            }
        }
        out
    }

    /// Flash taken by the coefficients, bytes.
    pub fn size_bytes(&self) -> usize {
        self.intervals.len() * P * 4 * 4
    }
}

/// The f32 constants that define the transformed variables; the kernel uses
/// the very same values, so they are part of the emitted file.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Limits {
    /// Critical temperature as f32, K (defines τ).
    pub critical_temperature_k: f32,
    /// Critical pressure as f32, Pa (defines σ).
    pub critical_pressure_pa: f32,
    /// First f32 above 623.15 K: below it the low state table is used.
    pub boundary_temperature_k: f32,
    /// First f32 above p_sat(623.15 K), Pa: below it the low temperature table is used.
    pub boundary_pressure_pa: f32,
    /// Lowest accepted temperature, K.
    pub temperature_min_k: f32,
    /// Highest accepted temperature, K.
    pub temperature_max_k: f32,
    /// Lowest accepted pressure, Pa.
    pub pressure_min_pa: f32,
    /// Highest accepted pressure, Pa.
    pub pressure_max_pa: f32,
}

/// Everything one run produces.
#[derive(Debug, Clone, PartialEq)]
pub struct Generated {
    /// The settings used.
    pub config: Config,
    /// Range and transformation constants.
    pub limits: Limits,
    /// State table below 623.15 K (variable T).
    pub state_low: Table<STATE_QUANTITIES>,
    /// State table from 623.15 K (variable τ).
    pub state_high: Table<STATE_QUANTITIES>,
    /// Saturation temperature below p_sat(623.15 K) (bit pattern of p, value T).
    pub temperature_low: OctaveTable<1>,
    /// From p_sat(623.15 K) (bit pattern of q = pc − p, value τ).
    pub temperature_high: OctaveTable<1>,
}

impl Generated {
    /// Flash taken by all coefficient arrays, bytes.
    pub fn size_bytes(&self) -> usize {
        self.state_low.size_bytes()
            + self.state_high.size_bytes()
            + self.temperature_low.size_bytes()
            + self.temperature_high.size_bytes()
    }
}

/// The tabulated quantities at a temperature, in the order of the state table.
pub fn transformed_state(sample: &SaturatedSample) -> [f64; STATE_QUANTITIES] {
    [
        sample.pressure_pa.ln(),
        sample.liquid.density_kg_m3,
        sample.vapour.density_kg_m3 / sample.pressure_pa,
        sample.liquid.enthalpy_j_kg,
        sample.vapour.enthalpy_j_kg,
        sample.liquid.entropy_j_kgk,
        sample.vapour.entropy_j_kgk,
        1.0 / sample.liquid.cp_j_kgk,
        1.0 / sample.vapour.cp_j_kgk,
    ]
}

fn fit_table<const P: usize>(
    knots: UniformKnots,
    xs: &[f64],
    values: &[[f64; P]],
) -> Result<Table<P>, GenerateError> {
    let mut intervals = vec![[[0.0f32; 4]; P]; knots.intervals];
    for q in 0..P {
        let ys: Vec<f64> = values.iter().map(|v| v[q]).collect();
        let c = fit::to_f32(&fit::fit_cubic(&knots, xs, &ys)?);
        for (block, cubic) in intervals.iter_mut().zip(c) {
            block[q] = cubic;
        }
    }
    Ok(Table { knots, intervals })
}

fn sample_state<S: SaturationSource + ?Sized>(
    source: &S,
    t_k: f64,
) -> Result<[f64; STATE_QUANTITIES], GenerateError> {
    let s = source
        .saturated_sample(t_k)
        .map_err(|message| GenerateError::Source { at: t_k, message })?;
    let v = transformed_state(&s);
    if v.iter().all(|x| x.is_finite()) {
        Ok(v)
    } else {
        Err(GenerateError::Source {
            at: t_k,
            message: "non-finite property".into(),
        })
    }
}

/// Runs the generator: fits all four tables for `config` from `source`.
///
/// # Errors
/// [`GenerateError`] when the configuration is inconsistent, the source fails
/// at a sampling point or a fit is singular.
pub fn generate<S: SaturationSource + ?Sized>(
    config: &Config,
    source: &S,
) -> Result<Generated, GenerateError> {
    let tc = 647.096f64;
    let pc = 22.064e6f64;
    let tb = REGION3_BOUNDARY_TEMPERATURE_K;
    let c = config;
    if !(c.temperature_min_k >= 273.16
        && c.temperature_min_k < c.temperature_max_k
        && c.temperature_max_k <= tc)
    {
        return Err(GenerateError::Config(
            "need 273.16 <= temperature_min_k < temperature_max_k <= 647.096".into(),
        ));
    }
    if [c.state_intervals_low, c.state_intervals_high].contains(&0) {
        return Err(GenerateError::Config(
            "every interval count must be at least 1".into(),
        ));
    }
    if c.temperature_octave_bits_low > MAX_OCTAVE_BITS
        || c.temperature_octave_bits_high > MAX_OCTAVE_BITS
    {
        return Err(GenerateError::Config(format!(
            "temperature_octave_bits_low and _high must be at most {MAX_OCTAVE_BITS}"
        )));
    }
    if c.samples_per_interval < 4 || c.measurement_points_per_interval < 50 {
        return Err(GenerateError::Config(
            "samples_per_interval >= 4 and measurement_points_per_interval >= 50".into(),
        ));
    }
    if !(c.critical_margin_k > 0.0 && c.critical_margin_k < 1.0) {
        return Err(GenerateError::Config("0 < critical_margin_k < 1".into()));
    }
    let tc32 = tc as f32;
    let pc32 = pc as f32;
    let tau_of = |t: f64| (f64::from(tc32) - t).max(0.0).sqrt();
    let pb = source.saturation_pressure_pa(tb);
    let limits = Limits {
        critical_temperature_k: tc32,
        critical_pressure_pa: pc32,
        // The formulation takes T ≤ 623.15 K (and p ≤ p_sat(623.15 K)) from
        // Regions 1 and 2; the kernel takes the low tables below these
        // constants, so they are the first f32 strictly above the boundary.
        boundary_temperature_k: round_up_strictly_f32(tb),
        boundary_pressure_pa: round_up_strictly_f32(pb),
        temperature_min_k: round_up_f32(c.temperature_min_k),
        temperature_max_k: c.temperature_max_k as f32,
        pressure_min_pa: round_up_f32(source.saturation_pressure_pa(c.temperature_min_k)),
        pressure_max_pa: if c.temperature_max_k >= tc {
            pc32
        } else {
            round_down_f32(source.saturation_pressure_pa(c.temperature_max_k))
        },
    };
    // Trusted data stops short of the critical point by `critical_margin_k`.
    let t_data_max = c.temperature_max_k.min(tc - c.critical_margin_k);

    // A segment outside the envelope is never reached (the range check
    // rejects its inputs); it is written as one constant interval holding
    // the values at 623.15 K, so no data beyond the envelope is needed.
    let at_boundary = sample_state(source, tb)?;
    let constant = |knots: UniformKnots, v: &[f64]| -> Table<STATE_QUANTITIES> {
        let mut block = [[0.0f32; 4]; STATE_QUANTITIES];
        for (b, &x) in block.iter_mut().zip(v) {
            b[0] = x as f32;
        }
        Table {
            knots,
            intervals: vec![block],
        }
    };
    let low_in_envelope = c.temperature_min_k < tb;
    let high_in_envelope = c.temperature_max_k > tb;

    // State table, low: T from the envelope's bottom to 623.15 K.
    let low_lo = c.temperature_min_k.min(tb - 1.0);
    let low_hi = c.temperature_max_k.min(tb);
    let state_low = if low_in_envelope {
        let knots = UniformKnots::covering(low_lo, low_hi, c.state_intervals_low)?;
        let xs = fit::sample_positions(
            &knots,
            c.samples_per_interval,
            low_lo,
            low_hi.min(t_data_max),
        );
        let values = xs
            .iter()
            .map(|&t| sample_state(source, t))
            .collect::<Result<Vec<_>, _>>()?;
        fit_table(knots, &xs, &values)?
    } else {
        constant(UniformKnots::covering(tb - 1.0, tb, 1)?, &at_boundary)
    };

    // State table, high: τ from the top of the envelope (τ = 0 at the
    // critical point) to τ(623.15 K).
    let high_t_lo = c.temperature_min_k.max(tb);
    let high_t_hi = c.temperature_max_k.max(tb + 1.0);
    let high_data_top = high_t_hi.min(tc - c.critical_margin_k);
    let state_high = if high_in_envelope {
        let knots =
            UniformKnots::covering(tau_of(high_t_hi), tau_of(high_t_lo), c.state_intervals_high)?;
        let xs = fit::sample_positions(
            &knots,
            c.samples_per_interval,
            tau_of(high_data_top),
            tau_of(high_t_lo),
        );
        let values = xs
            .iter()
            .map(|&tau| sample_state(source, f64::from(tc32) - tau * tau))
            .collect::<Result<Vec<_>, _>>()?;
        fit_table(knots, &xs, &values)?
    } else {
        constant(
            UniformKnots::covering(tau_of(tb + 1.0), tau_of(tb), 1)?,
            &at_boundary,
        )
    };

    // Saturation temperature, low: p → T, on the bit pattern of p.
    let temperature_low = if low_in_envelope {
        let p_lo = f64::from(limits.pressure_min_pa);
        let p_hi = source.saturation_pressure_pa(low_hi);
        hermite_octave_table(c.temperature_octave_bits_low, p_lo, p_hi, |p| {
            source.saturation_temperature_k(p)
        })?
    } else {
        OctaveTable::constant(pb as f32, tb as f32)
    };

    // Saturation temperature, high: q = pc − p → τ = √(Tc − T), on the bit
    // pattern of q. Above 2^24 Pa every f32 pressure is an even number of
    // pascals, so q (exact in f32) is 0 or at least 2 Pa: the table starts
    // at 2 Pa and the kernel sets τ = 0 at q = 0. The Region 4 equation is
    // closed-form and smooth up to pc, so it is sampled right up to there.
    let pc_f = f64::from(pc32);
    let temperature_high = if high_in_envelope {
        let q_lo = (pc_f - f64::from(limits.pressure_max_pa)).max(2.0);
        let q_hi = pc_f - source.saturation_pressure_pa(high_t_lo);
        hermite_octave_table(c.temperature_octave_bits_high, q_lo, q_hi, |q| {
            tau_of(source.saturation_temperature_k(pc_f - q))
        })?
    } else {
        OctaveTable::constant((pc_f - pb) as f32, tau_of(tb) as f32)
    };

    Ok(Generated {
        config: c.clone(),
        limits,
        state_low,
        state_high,
        temperature_low,
        temperature_high,
    })
}

/// Largest octave subdivision accepted (2^12 intervals per octave).
pub const MAX_OCTAVE_BITS: u32 = 12;

/// A table on the f32 bit pattern of its input (see the kernel's
/// `OctaveCubicTable`): interval `(x.to_bits() >> shift) − first`, local t
/// the low `shift` bits scaled to [0, 1).
#[derive(Debug, Clone, PartialEq)]
pub struct OctaveTable<const P: usize> {
    /// Low bits of the pattern that make up t.
    pub shift: u32,
    /// `x.to_bits() >> shift` of the first interval.
    pub first: u32,
    /// `intervals[i][q]` is the cubic of quantity `q` on interval `i`.
    pub intervals: Vec<[[f32; 4]; P]>,
}

impl<const P: usize> OctaveTable<P> {
    /// Evaluates every quantity at `x` (positive, finite) as the kernel does.
    pub fn evaluate(&self, x: f32) -> [f32; P] {
        let bits = x.to_bits();
        let i = ((bits >> self.shift).wrapping_sub(self.first) as usize)
            .min(self.intervals.len().saturating_sub(1));
        let t =
            (bits & ((1u32 << self.shift) - 1)) as f32 * f32::from_bits((127 - self.shift) << 23);
        let mut out = [f32::NAN; P];
        if let Some(block) = self.intervals.get(i) {
            for (o, c) in out.iter_mut().zip(block) {
                *o = c[0] + t * (c[1] + t * (c[2] + t * c[3]));
            }
        }
        out
    }

    /// Lower end of interval `i` (`i` up to the interval count: the last
    /// knot), in the input variable.
    pub fn knot(&self, i: usize) -> f64 {
        f64::from(f32::from_bits((self.first + i as u32) << self.shift))
    }

    /// Flash taken by the coefficients, bytes.
    pub fn size_bytes(&self) -> usize {
        self.intervals.len() * P * 4 * 4
    }

    /// One interval holding the constant `value`, at `x` (for a segment
    /// outside the envelope, never reached).
    fn constant(x: f32, value: f32) -> Self {
        let mut block = [[0.0f32; 4]; P];
        for b in &mut block {
            b[0] = value;
        }
        Self {
            shift: 20,
            first: x.to_bits() >> 20,
            intervals: vec![block],
        }
    }
}

/// Cubic Hermite interpolation of `f` on the bit-pattern intervals with
/// 2^`octave_bits` intervals per octave covering `[x_lo, x_hi]` (x_lo > 0):
/// each cubic takes f and its derivative at both knots, so the table passes
/// through the formulation's values at the knots and is continuous with a
/// continuous first derivative in x (the kernel's t is linear in x inside an
/// interval; dt/dx halves from one octave to the next, which the derivative
/// at each end takes into account).
fn hermite_octave_table(
    octave_bits: u32,
    x_lo: f64,
    x_hi: f64,
    f: impl Fn(f64) -> f64,
) -> Result<OctaveTable<1>, GenerateError> {
    let shift = 23 - octave_bits;
    let lo = round_down_f32(x_lo);
    let hi = round_up_f32(x_hi);
    if !(lo > 0.0 && hi > lo && hi.is_finite()) {
        return Err(GenerateError::Config(format!(
            "bad octave-table range {x_lo} to {x_hi}"
        )));
    }
    let first = lo.to_bits() >> shift;
    let last = hi.to_bits() >> shift;
    let mut table = OctaveTable {
        shift,
        first,
        intervals: Vec::new(),
    };
    // Derivative by a fourth-order central difference, step 1e-3 of x.
    let derivative = |x: f64| {
        let h = x * 1e-3;
        (8.0 * (f(x + h) - f(x - h)) - (f(x + 2.0 * h) - f(x - 2.0 * h))) / (12.0 * h)
    };
    for i in 0..=(last - first) as usize {
        let (a, b) = (table.knot(i), table.knot(i + 1));
        let (ya, yb) = (f(a), f(b));
        let (ma, mb) = (derivative(a) * (b - a), derivative(b) * (b - a));
        let c = [
            ya,
            ma,
            3.0 * (yb - ya) - 2.0 * ma - mb,
            2.0 * (ya - yb) + ma + mb,
        ];
        if c.iter().any(|v| !v.is_finite()) {
            return Err(GenerateError::Source {
                at: a,
                message: "non-finite value or derivative".into(),
            });
        }
        table.intervals.push([fit::to_f32(&[c])[0]]);
    }
    Ok(table)
}

/// Smallest f32 not below `x`.
fn round_up_f32(x: f64) -> f32 {
    let r = x as f32;
    if f64::from(r) < x {
        f32::from_bits(r.to_bits() + 1)
    } else {
        r
    }
}

/// Smallest f32 strictly above `x` (x > 0).
fn round_up_strictly_f32(x: f64) -> f32 {
    let r = round_up_f32(x);
    if f64::from(r) == x {
        f32::from_bits(r.to_bits() + 1)
    } else {
        r
    }
}

/// Largest f32 not above `x` (x > 0).
fn round_down_f32(x: f64) -> f32 {
    let r = x as f32;
    if f64::from(r) > x {
        f32::from_bits(r.to_bits() - 1)
    } else {
        r
    }
}

/// Generates the smallest table of a family that meets the project's
/// accuracy table scaled by `factor` (1.0 = the table itself, 0.5 = twice as
/// strict) over the envelope of `base`: the two state-table interval counts
/// of `base` are scaled together by 1/4, 1/3, 1/2, 2/3, 1, 3/2, 2, 3, 4, and
/// for each scale the two temperature tables' octave bits are tried from
/// two below to two above those of `base` (they set the temperature error,
/// the interval counts the state error, so the two are searched
/// independently); of the candidates that pass the generator's measurement
/// the one with the fewest coefficient bytes is returned.
///
/// # Errors
/// [`GenerateError::Config`] when no candidate meets the target, and the
/// errors of [`generate`].
pub fn fit_to_target<S: SaturationSource + ?Sized>(
    base: &Config,
    factor: f64,
    source: &S,
) -> Result<(Generated, measure::Measured), GenerateError> {
    const SCALES: [(usize, usize); 9] = [
        (1, 4),
        (1, 3),
        (1, 2),
        (2, 3),
        (1, 1),
        (3, 2),
        (2, 1),
        (3, 1),
        (4, 1),
    ];
    let mut best: Option<(Generated, measure::Measured)> = None;
    for (num, den) in SCALES {
        let scale = |n: usize| (n * num).div_ceil(den).max(1);
        for offset in -2i64..=2 {
            let bits = |b: u32| (i64::from(b) + offset).clamp(0, i64::from(MAX_OCTAVE_BITS)) as u32;
            let config = Config {
                state_intervals_low: scale(base.state_intervals_low),
                state_intervals_high: scale(base.state_intervals_high),
                temperature_octave_bits_low: bits(base.temperature_octave_bits_low),
                temperature_octave_bits_high: bits(base.temperature_octave_bits_high),
                ..base.clone()
            };
            let g = generate(&config, source)?;
            if best
                .as_ref()
                .is_some_and(|(b, _)| b.size_bytes() <= g.size_bytes())
            {
                continue;
            }
            let m = measure::measure(&g, source)?;
            if m.below_near_critical
                .within(&measure::ACCURACY_TABLE_BELOW_NEAR_CRITICAL, factor)
                && m.near_critical
                    .within(&measure::ACCURACY_TABLE_NEAR_CRITICAL, factor)
            {
                best = Some((g, m));
            }
        }
    }
    best.ok_or_else(|| {
        GenerateError::Config(format!(
            "no interval count up to 4x the given ones meets {factor} x the accuracy table"
        ))
    })
}
