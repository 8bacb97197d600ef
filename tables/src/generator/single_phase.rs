//! The generator of the kernel's single-phase tables (compressed liquid,
//! superheated vapour, supercritical fluid), host only.
//!
//! # Layout (the contract with `vapora_kernel::single_phase`)
//! Six sheets, each a tensor-product cubic B-spline over a rectangle of
//! table coordinates (x, y) with y ∈ [0, 1]. No sheet straddles the
//! saturation line, the 623.15 K boundary of Region 1 or the B23 line:
//! every sheet's temperature range runs between two edges T0(p) and T1(p)
//! that follow those lines.
//!
//! | sheet | pressure | T0(p) (y = 0) | T1(p) (y = 1) | x | IF97 |
//! |---|---|---|---|---|---|
//! | vapour, low | p_min … p_b | T_sat(p) | T_max | ln p + p/p1 | 2 |
//! | liquid, low | p_min … p_b | T_sat(p) | T_min | ln p + p/p1 | 1 |
//! | liquid, high | p_b … p_max | 623.15 K | T_min | p/MPa | 1 |
//! | liquid, near-critical | p_b … p_max | T_edge(p) | 623.15 K | asinh | 3 |
//! | vapour, near-critical | p_b … p_max | T_edge(p) | T_B23(p) | asinh | 3 |
//! | vapour, high | p_b … p_max | T_B23(p) | T_max | p/MPa | 2 |
//!
//! p_b = p_sat(623.15 K) = 16.529 MPa (first f32 above it); "asinh" is
//! x = asinh((p − pc)/p_s) + (p − pc)/p_l, smooth through pc with the knots
//! crowded towards it (see [`XCoordinate`]). T_edge(p) is T_sat(p) below pc
//! and, at and above pc, the continuation Tc + k·(p − pc) + c·(p − pc)² with
//! the slope k and curvature c of the saturation line at pc (close to the
//! pseudo-critical line, where cp peaks); the "liquid" and "vapour" of the
//! kernel above pc are the fluid below and above that line.
//!
//! The position between the edges is stretched logarithmically towards
//! T0: with d = |T − T0| and D = |T1 − T0|,
//! y = ln(1 + d/δ)/ln(1 + D/δ), δ(p) = δ_base + δ_slope·√((p − p_ref)² + p_s²)
//! ([`cluster_delta`]). δ shrinks towards p_ref (pc, or p_b where the
//! 623.15 K and B23 edges meet saturation), where the properties change
//! fastest next to the edge.
//!
//! Each sheet holds six quantities per B-spline coefficient: ρ (or ρ/p for
//! the vapour sheets outside Region 3), h, s, 1/cp, w, ln μ; and two
//! inverse sheets with one quantity each: y as a function of (x, ψ_h) and of
//! (x, ψ_s), ψ = ln(1 + φ·D/δ)/ln(1 + D/δ) the stretched enthalpy (entropy)
//! fraction φ between the sheet's own edges h(x, 0) and h(x, 1). The inverse
//! sheets are fitted to the f32 forward sheet itself (bisection on it), so
//! (p, h) and the (p, T) state agree. All fits are least-squares tensor
//! products (separable: along y for every x sample, then along x), four
//! samples per interval and direction.

use std::string::String;
use std::vec::Vec;

use super::emit::{checksum, format_f32};
use super::fit::{cholesky_factor, cholesky_solve};
use crate::if97::{b23, region1, region2, region3, region4, viscosity, Properties};

/// Number of quantities in a forward sheet.
pub const QUANTITIES: usize = 6;

const TC: f64 = 647.096;
const PC: f64 = 22.064e6;
const T_REGION3: f64 = 623.15;

/// The six sheets, in the order they are emitted.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum SheetKind {
    /// Region 2 below p_b.
    VapourLow,
    /// Region 1 below p_b.
    LiquidLow,
    /// Region 1 from p_b.
    LiquidHigh,
    /// Region 3, liquid side, from p_b.
    LiquidNearCritical,
    /// Region 3, vapour side, from p_b.
    VapourNearCritical,
    /// Region 2 beyond B23, from p_b.
    VapourHigh,
}

impl SheetKind {
    /// All sheets in emission order.
    pub const ALL: [Self; 6] = [
        Self::VapourLow,
        Self::LiquidLow,
        Self::LiquidHigh,
        Self::LiquidNearCritical,
        Self::VapourNearCritical,
        Self::VapourHigh,
    ];

    /// Name of the static in the generated file.
    pub fn name(self) -> &'static str {
        match self {
            Self::VapourLow => "VAPOUR_LOW",
            Self::LiquidLow => "LIQUID_LOW",
            Self::LiquidHigh => "LIQUID_HIGH",
            Self::LiquidNearCritical => "LIQUID_NEAR_CRITICAL",
            Self::VapourNearCritical => "VAPOUR_NEAR_CRITICAL",
            Self::VapourHigh => "VAPOUR_HIGH",
        }
    }

    fn high(self) -> bool {
        !matches!(self, Self::VapourLow | Self::LiquidLow)
    }

    /// Whether the density column holds ρ/p instead of ρ.
    pub fn density_over_pressure(self) -> bool {
        matches!(self, Self::VapourLow | Self::VapourHigh)
    }

    fn index(self) -> usize {
        Self::ALL.iter().position(|&k| k == self).unwrap_or(0)
    }
}

/// Settings of one single-phase generation run.
#[derive(Debug, Clone, PartialEq)]
pub struct SinglePhaseConfig {
    /// Lowest pressure, Pa (≥ 611.657).
    pub pressure_min_pa: f64,
    /// Highest pressure, Pa (≤ 25e6).
    pub pressure_max_pa: f64,
    /// Lowest temperature, K (≥ 273.16).
    pub temperature_min_k: f64,
    /// Highest temperature, K (≤ 1073.15).
    pub temperature_max_k: f64,
    /// Intervals in x and y of each sheet, in [`SheetKind::ALL`] order.
    pub intervals: [[usize; 2]; 6],
    /// Intervals in φ of the inverse sheets.
    pub inverse_intervals: [usize; 6],
    /// δ_base of the stretch, K, per sheet.
    pub cluster_base_k: [f64; 6],
    /// δ_slope of the stretch, K per MPa of |p − p_ref|, per sheet.
    pub cluster_k_per_mpa: [f64; 6],
    /// p_ref of the stretch, MPa, per sheet (where δ is smallest).
    pub cluster_reference_mpa: [f64; 6],
    /// Fitting samples per interval and direction.
    pub samples_per_interval: usize,
    /// p1 of the low sheets' coordinate x = ln(p/Pa) + p/p1, Pa.
    pub x_pressure_scale_pa: f64,
    /// p_s of the near-critical sheets' coordinate x = asinh((p − pc)/p_s) + (p − pc)/p_l, Pa.
    pub critical_scale_pa: f64,
    /// p_l of the same, Pa.
    pub critical_linear_scale_pa: f64,
    /// p_m of the stretch scale δ(p) = δ_base + δ_slope·√((p − p_ref)² + p_m²), Pa.
    pub cluster_smoothing_pa: f64,
}

impl Default for SinglePhaseConfig {
    fn default() -> Self {
        Self {
            pressure_min_pa: 611.657,
            pressure_max_pa: 25.0e6,
            temperature_min_k: 273.16,
            temperature_max_k: 1073.15,
            intervals: [[36, 22], [24, 32], [14, 28], [38, 20], [40, 24], [16, 20]],
            inverse_intervals: [24, 24, 18, 24, 28, 22],
            cluster_base_k: [0.5, 60.0, 100.0, 0.05, 0.1, 20.0],
            cluster_k_per_mpa: [1.0, 0.0, 5.0, 0.7, 1.0, 1.0],
            cluster_reference_mpa: [22.064, 22.064, 16.53, 22.064, 22.064, 16.53],
            samples_per_interval: 4,
            x_pressure_scale_pa: 2.0e6,
            critical_scale_pa: 0.3e6,
            critical_linear_scale_pa: 6.0e6,
            cluster_smoothing_pa: 0.5e6,
        }
    }
}

fn list<T: core::fmt::Display>(v: &[T]) -> String {
    v.iter()
        .map(|x| x.to_string())
        .collect::<Vec<_>>()
        .join(",")
}

impl SinglePhaseConfig {
    /// One line naming every setting (the `// Settings:` header line).
    pub fn describe(&self) -> String {
        let iv: Vec<String> = self
            .intervals
            .iter()
            .map(|[a, b]| format!("{a}x{b}"))
            .collect();
        format!(
            "pressure_min_pa={} pressure_max_pa={} temperature_min_k={} temperature_max_k={} \
             intervals={} inverse_intervals={} cluster_base_k={} cluster_k_per_mpa={} cluster_reference_mpa={} samples_per_interval={} \
             x_pressure_scale_pa={} critical_scale_pa={} critical_linear_scale_pa={} \
             cluster_smoothing_pa={}",
            self.pressure_min_pa,
            self.pressure_max_pa,
            self.temperature_min_k,
            self.temperature_max_k,
            iv.join(","),
            list(&self.inverse_intervals),
            list(&self.cluster_base_k),
            list(&self.cluster_k_per_mpa),
            list(&self.cluster_reference_mpa),
            self.samples_per_interval,
            self.x_pressure_scale_pa,
            self.critical_scale_pa,
            self.critical_linear_scale_pa,
            self.cluster_smoothing_pa
        )
    }

    /// Reads a settings line written by [`Self::describe`].
    ///
    /// # Errors
    /// A message for an unknown key or bad value.
    pub fn parse(settings: &str) -> Result<Self, String> {
        let mut c = Self::default();
        for item in settings.split_whitespace() {
            let (k, v) = item
                .split_once('=')
                .ok_or_else(|| format!("expected key=value, got {item}"))?;
            c.set(k, v)?;
        }
        Ok(c)
    }

    /// Sets one setting by name.
    ///
    /// # Errors
    /// A message for an unknown key or bad value.
    pub fn set(&mut self, key: &str, value: &str) -> Result<(), String> {
        let bad = || format!("bad value {value} for {key}");
        let float = |s: &str| s.parse::<f64>().map_err(|_| bad());
        let count = |s: &str| s.parse::<usize>().map_err(|_| bad());
        fn six<T: Copy, F: Fn(&str) -> Result<T, String>>(
            value: &str,
            f: F,
            bad: String,
        ) -> Result<[T; 6], String> {
            let parts: Vec<&str> = value.split(',').collect();
            if parts.len() != 6 {
                return Err(bad);
            }
            let v: Vec<T> = parts.iter().map(|s| f(s)).collect::<Result<_, _>>()?;
            Ok([v[0], v[1], v[2], v[3], v[4], v[5]])
        }
        match key {
            "pressure_min_pa" => self.pressure_min_pa = float(value)?,
            "pressure_max_pa" => self.pressure_max_pa = float(value)?,
            "temperature_min_k" => self.temperature_min_k = float(value)?,
            "temperature_max_k" => self.temperature_max_k = float(value)?,
            "intervals" => {
                self.intervals = six(
                    value,
                    |s| {
                        let (a, b) = s.split_once('x').ok_or_else(bad)?;
                        Ok([count(a)?, count(b)?])
                    },
                    bad(),
                )?
            }
            "inverse_intervals" => self.inverse_intervals = six(value, count, bad())?,
            "cluster_base_k" => self.cluster_base_k = six(value, float, bad())?,
            "cluster_k_per_mpa" => self.cluster_k_per_mpa = six(value, float, bad())?,
            "cluster_reference_mpa" => self.cluster_reference_mpa = six(value, float, bad())?,
            "samples_per_interval" => self.samples_per_interval = count(value)?,
            "x_pressure_scale_pa" => self.x_pressure_scale_pa = float(value)?,
            "critical_scale_pa" => self.critical_scale_pa = float(value)?,
            "critical_linear_scale_pa" => self.critical_linear_scale_pa = float(value)?,
            "cluster_smoothing_pa" => self.cluster_smoothing_pa = float(value)?,
            _ => return Err(format!("unknown setting {key}")),
        }
        Ok(())
    }
}

/// A tensor-product cubic B-spline sheet as the kernel stores it.
#[derive(Debug, Clone, PartialEq)]
pub struct Sheet<const Q: usize> {
    /// x at the first knot (f32 as stored).
    pub x_start: f32,
    /// Intervals per unit of x (f32 as stored).
    pub x_inverse_step: f32,
    /// Intervals in x.
    pub x_intervals: usize,
    /// Intervals in y (y from 0 to 1).
    pub y_intervals: usize,
    /// (x_intervals + 3) rows of (y_intervals + 3) coefficients.
    pub coefficients: Vec<[f32; Q]>,
}

/// Cubic B-spline basis weights at local t.
pub fn basis(t: f64) -> [f64; 4] {
    let s = 1.0 - t;
    [
        s * s * s / 6.0,
        (3.0 * t * t * t - 6.0 * t * t + 4.0) / 6.0,
        (-3.0 * t * t * t + 3.0 * t * t + 3.0 * t + 1.0) / 6.0,
        t * t * t / 6.0,
    ]
}

fn split(u: f64, n: usize) -> (usize, f64) {
    let u = u.clamp(0.0, n as f64);
    let i = (u as usize).min(n - 1);
    (i, u - i as f64)
}

impl<const Q: usize> Sheet<Q> {
    /// Local x coordinate.
    pub fn ux(&self, x: f64) -> f64 {
        (x - f64::from(self.x_start)) * f64::from(self.x_inverse_step)
    }

    /// x of local coordinate u.
    pub fn x_of(&self, u: f64) -> f64 {
        f64::from(self.x_start) + u / f64::from(self.x_inverse_step)
    }

    /// Evaluates in f64 from the f32 coefficients (the kernel does the same in f32).
    pub fn evaluate(&self, x: f64, y: f64) -> [f64; Q] {
        let (i, tx) = split(self.ux(x), self.x_intervals);
        let (j, ty) = split(y * self.y_intervals as f64, self.y_intervals);
        let wx = basis(tx);
        let wy = basis(ty);
        let stride = self.y_intervals + 3;
        let mut out = [0.0; Q];
        for (a, wa) in wx.iter().enumerate() {
            for (b, wb) in wy.iter().enumerate() {
                let c = &self.coefficients[(i + a) * stride + j + b];
                for q in 0..Q {
                    out[q] += wa * wb * f64::from(c[q]);
                }
            }
        }
        out
    }

    /// Flash taken, bytes.
    pub fn size_bytes(&self) -> usize {
        self.coefficients.len() * Q * 4
    }
}

/// Least-squares cubic B-spline on [0, n] in local coordinates, for many
/// right-hand sides sampled at the same positions.
struct Fitter {
    n: usize,
    rows: Vec<(usize, [f64; 4])>,
    chol: Vec<f64>,
}

impl Fitter {
    fn new(n: usize, us: &[f64]) -> Result<Self, String> {
        let m = n + 3;
        let rows: Vec<(usize, [f64; 4])> = us
            .iter()
            .map(|&u| {
                let (i, t) = split(u, n);
                (i, basis(t))
            })
            .collect();
        let mut a = vec![0.0; m * m];
        for (i, w) in &rows {
            for r in 0..4 {
                for c in 0..4 {
                    a[(i + r) * m + i + c] += w[r] * w[c];
                }
            }
        }
        cholesky_factor(&mut a, m).map_err(|_| String::from("singular single-phase fit"))?;
        Ok(Self { n, rows, chol: a })
    }

    fn solve(&self, ys: &[f64]) -> Vec<f64> {
        let m = self.n + 3;
        let mut b = vec![0.0; m];
        for ((i, w), y) in self.rows.iter().zip(ys) {
            for r in 0..4 {
                b[i + r] += w[r] * y;
            }
        }
        cholesky_solve(&self.chol, m, &mut b);
        b
    }
}

/// Fits a sheet to values on the tensor grid of local coordinates
/// (`ux[i]`, `uy[j]` · y_intervals) → `values[i][j]`.
fn fit_sheet<const Q: usize>(
    x_start: f32,
    x_inverse_step: f32,
    nx: usize,
    ny: usize,
    ux: &[f64],
    uy: &[f64],
    values: &[Vec<[f64; Q]>],
) -> Result<Sheet<Q>, String> {
    let fy = Fitter::new(ny, uy)?;
    let fx = Fitter::new(nx, ux)?;
    let my = ny + 3;
    // Stage 1: along y for every x sample.
    let mut stage: Vec<Vec<[f64; Q]>> = Vec::with_capacity(ux.len());
    for row in values {
        let mut c = vec![[0.0; Q]; my];
        for q in 0..Q {
            let ys: Vec<f64> = row.iter().map(|v| v[q]).collect();
            for (cj, s) in c.iter_mut().zip(fy.solve(&ys)) {
                cj[q] = s;
            }
        }
        stage.push(c);
    }
    // Stage 2: along x for every y coefficient.
    let mut coefficients = vec![[0.0f32; Q]; (nx + 3) * my];
    for j in 0..my {
        for q in 0..Q {
            let ys: Vec<f64> = stage.iter().map(|c| c[j][q]).collect();
            for (i, s) in fx.solve(&ys).into_iter().enumerate() {
                coefficients[i * my + j][q] = s as f32;
            }
        }
    }
    Ok(Sheet {
        x_start,
        x_inverse_step,
        x_intervals: nx,
        y_intervals: ny,
        coefficients,
    })
}

/// The constants shared with the kernel (all f32 as stored).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SinglePhaseLimits {
    /// Lowest pressure, Pa.
    pub pressure_min_pa: f32,
    /// Highest pressure, Pa.
    pub pressure_max_pa: f32,
    /// Lowest temperature, K.
    pub temperature_min_k: f32,
    /// Highest temperature, K.
    pub temperature_max_k: f32,
    /// p_b: pressures below it use the low sheets, Pa.
    pub boundary_pressure_pa: f32,
    /// 623.15 K as f32.
    pub region3_temperature_k: f32,
    /// Critical pressure, Pa.
    pub critical_pressure_pa: f32,
    /// Critical temperature, K.
    pub critical_temperature_k: f32,
    /// k = dT_sat/dp at pc, K/Pa (slope of the split above pc).
    pub split_slope_k_pa: f32,
    /// c = ½·d²T_sat/dp² at pc, K/Pa² (curvature of the split above pc).
    pub split_curvature_k_pa2: f32,
    /// 1/p1 of the low sheets' x = ln p + p/p1, 1/Pa.
    pub x_inverse_pressure_scale: f32,
    /// 1/p_s of the near-critical sheets' x = asinh((p − pc)/p_s) + (p − pc)/p_l, 1/Pa.
    pub critical_inverse_scale_pa: f32,
    /// 1/p_l of the same, 1/Pa.
    pub critical_inverse_linear_scale_pa: f32,
    /// 1/p_m of the stretch scale δ(p) (see [`cluster_delta`]), 1/Pa.
    pub cluster_inverse_smoothing_pa: f32,
}

/// One generated sheet with its inverse sheets and stretch.
#[derive(Debug, Clone, PartialEq)]
pub struct GeneratedSheet {
    /// Which sheet.
    pub kind: SheetKind,
    /// ρ (or ρ/p), h, s, 1/cp, w, ln μ over (x, y).
    pub properties: Sheet<QUANTITIES>,
    /// y over (x, φ_h).
    pub y_of_enthalpy: Sheet<1>,
    /// y over (x, φ_s).
    pub y_of_entropy: Sheet<1>,
    /// δ_base, K (f32 as stored).
    pub cluster_base_k: f32,
    /// δ_slope, K/Pa (f32 as stored).
    pub cluster_slope_k_pa: f32,
    /// p_ref, Pa (f32 as stored).
    pub cluster_reference_pa: f32,
}

impl GeneratedSheet {
    /// Flash of the three coefficient arrays, bytes.
    pub fn size_bytes(&self) -> usize {
        self.properties.size_bytes()
            + self.y_of_enthalpy.size_bytes()
            + self.y_of_entropy.size_bytes()
    }
}

/// Everything one single-phase run produces.
#[derive(Debug, Clone, PartialEq)]
pub struct SinglePhaseGenerated {
    /// Settings.
    pub config: SinglePhaseConfig,
    /// Constants.
    pub limits: SinglePhaseLimits,
    /// Sheets in [`SheetKind::ALL`] order.
    pub sheets: Vec<GeneratedSheet>,
}

impl SinglePhaseGenerated {
    /// Flash of every coefficient array, bytes.
    pub fn size_bytes(&self) -> usize {
        self.sheets.iter().map(GeneratedSheet::size_bytes).sum()
    }

    /// The sheet of one kind.
    pub fn sheet(&self, kind: SheetKind) -> &GeneratedSheet {
        &self.sheets[kind.index()]
    }
}

/// The geometry of a sheet at a pressure, as the kernel computes it.
#[derive(Debug, Clone, Copy)]
pub struct Edges {
    /// T at y = 0, K.
    pub t0: f64,
    /// +1 when T grows with y, −1 when it falls.
    pub direction: f64,
    /// |T1 − T0|, K (at least 1e-9).
    pub width: f64,
    /// δ, K.
    pub delta: f64,
}

impl Edges {
    /// y of a temperature.
    pub fn y_of(&self, t: f64) -> f64 {
        let d = (self.direction * (t - self.t0)).max(0.0);
        (d / self.delta).ln_1p() / (self.width / self.delta).ln_1p()
    }

    /// ψ, the inverse sheets' coordinate, of a property fraction φ: the
    /// same stretch applied to φ·D.
    pub fn psi_of(&self, phi: f64) -> f64 {
        (phi.max(0.0) * self.width / self.delta).ln_1p() / (self.width / self.delta).ln_1p()
    }

    /// φ of ψ (inverse of [`Self::psi_of`]).
    pub fn phi_of(&self, psi: f64) -> f64 {
        (psi * (self.width / self.delta).ln_1p()).exp_m1() * self.delta / self.width
    }

    /// Temperature at y.
    pub fn t_of(&self, y: f64) -> f64 {
        self.t0 + self.direction * self.delta * (y * (self.width / self.delta).ln_1p()).exp_m1()
    }
}

/// δ(p) = δ_base + δ_slope·√((p − p_ref)² + p_m²), K: a smooth form of
/// δ_base + δ_slope·|p − p_ref| (p_m the smoothing pressure), so the
/// coordinate lines have no kink at p_ref.
pub fn cluster_delta(l: &SinglePhaseLimits, g: &GeneratedSheet, p: f64) -> f64 {
    let d = (p - f64::from(g.cluster_reference_pa)) * f64::from(l.cluster_inverse_smoothing_pa);
    f64::from(g.cluster_base_k)
        + f64::from(g.cluster_slope_k_pa) * (d * d + 1.0).sqrt()
            / f64::from(l.cluster_inverse_smoothing_pa)
}

/// The liquid/vapour edge: T_sat(p) below pc, and from pc up the
/// continuation Tc + k·(p − pc) + c·(p − pc)² with the slope and curvature
/// of the saturation line at pc (so the edge is smooth through pc).
pub fn edge_temperature(l: &SinglePhaseLimits, p: f64) -> f64 {
    let pc = f64::from(l.critical_pressure_pa);
    if p < pc {
        region4::saturation_temperature_k_unchecked(p)
    } else {
        let d = p - pc;
        f64::from(l.critical_temperature_k)
            + f64::from(l.split_slope_k_pa) * d
            + f64::from(l.split_curvature_k_pa2) * d * d
    }
}

/// Edges of a sheet at pressure p with the f64 formulation's lines.
pub fn edges(kind: SheetKind, l: &SinglePhaseLimits, g: &GeneratedSheet, p: f64) -> Edges {
    let t_edge = edge_temperature(l, p);
    let tmin = f64::from(l.temperature_min_k);
    let tmax = f64::from(l.temperature_max_k);
    let t3 = f64::from(l.region3_temperature_k);
    let tb23 = || b23::temperature_k_unchecked(p);
    let (t0, t1) = match kind {
        SheetKind::VapourLow => (t_edge, tmax),
        SheetKind::LiquidLow => (t_edge, tmin),
        SheetKind::LiquidHigh => (t3, tmin),
        SheetKind::LiquidNearCritical => (t_edge, t3),
        SheetKind::VapourNearCritical => (t_edge, tb23()),
        SheetKind::VapourHigh => (tb23(), tmax),
    };
    let direction = match kind {
        SheetKind::LiquidLow | SheetKind::LiquidHigh | SheetKind::LiquidNearCritical => -1.0,
        _ => 1.0,
    };
    Edges {
        t0,
        direction,
        width: (direction * (t1 - t0)).max(1e-9),
        delta: cluster_delta(l, g, p),
    }
}

fn formulation(kind: SheetKind, p: f64, t: f64) -> Result<Properties, String> {
    match kind {
        SheetKind::VapourLow | SheetKind::VapourHigh => Ok(region2::properties_unchecked(p, t)),
        SheetKind::LiquidLow | SheetKind::LiquidHigh => Ok(region1::properties_unchecked(p, t)),
        SheetKind::LiquidNearCritical | SheetKind::VapourNearCritical => {
            region3::properties_pt(p, t).map_err(|e| format!("Region 3 at {p} Pa, {t} K: {e}"))
        }
    }
}

/// The tabulated quantities at (p, T) from the formulation, as stored.
///
/// # Errors
/// When the formulation has no value there.
pub fn quantities(kind: SheetKind, p: f64, t: f64) -> Result<[f64; QUANTITIES], String> {
    let pr = formulation(kind, p, t)?;
    let mu = viscosity::viscosity_pa_s_unchecked(pr.density_kg_m3, t);
    let rho = if kind.density_over_pressure() {
        pr.density_kg_m3 / p
    } else {
        pr.density_kg_m3
    };
    let v = [
        rho,
        pr.enthalpy_j_kg,
        pr.entropy_j_kgk,
        1.0 / pr.cp_j_kgk,
        pr.speed_of_sound_m_s,
        mu.ln(),
    ];
    if v.iter().all(|x| x.is_finite()) {
        Ok(v)
    } else {
        Err(format!("non-finite property at {p} Pa, {t} K"))
    }
}

/// Pressure range of a sheet, Pa.
pub fn pressure_range(kind: SheetKind, l: &SinglePhaseLimits) -> (f64, f64) {
    let pb = f64::from(l.boundary_pressure_pa);
    let lo = f64::from(l.pressure_min_pa);
    let hi = f64::from(l.pressure_max_pa);
    if kind.high() {
        (pb.max(lo), hi.max(pb + 1.0))
    } else {
        // Liquid exists only above p_sat(T_min), vapour only below
        // p_sat(T_max) (for an envelope smaller than the default).
        let (lo, hi) = match kind {
            SheetKind::LiquidLow => (
                lo.max(region4::saturation_pressure_pa_unchecked(f64::from(
                    l.temperature_min_k,
                ))),
                hi,
            ),
            _ => (
                lo,
                hi.min(region4::saturation_pressure_pa_unchecked(
                    f64::from(l.temperature_max_k).min(T_REGION3),
                )),
            ),
        };
        (lo.min(hi.min(pb) - 1.0), hi.min(pb))
    }
}

/// How a sheet's x coordinate is made from the pressure.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum XCoordinate {
    /// x = ln(p/Pa) + p/p1 (the low sheets: logarithmic at low pressure,
    /// finer towards p_b).
    LogPressure,
    /// x = p/MPa (liquid and vapour away from the critical point above p_b).
    Pressure,
    /// x = asinh((p − pc)/p_s) (the near-critical sheets: smooth through pc,
    /// knots crowded towards it).
    Critical,
}

impl SheetKind {
    /// The x coordinate of the sheet.
    pub fn x_coordinate(self) -> XCoordinate {
        match self {
            Self::VapourLow | Self::LiquidLow => XCoordinate::LogPressure,
            Self::LiquidHigh | Self::VapourHigh => XCoordinate::Pressure,
            Self::LiquidNearCritical | Self::VapourNearCritical => XCoordinate::Critical,
        }
    }
}

/// Pressure at table coordinate x.
pub fn pressure_of_x(kind: SheetKind, l: &SinglePhaseLimits, x: f64) -> f64 {
    let pc = f64::from(l.critical_pressure_pa);
    match kind.x_coordinate() {
        XCoordinate::Pressure => x * 1.0e6,
        XCoordinate::Critical => {
            // Newton on asinh(d/p_s) + d/p_l = x (monotone in d).
            let ks = f64::from(l.critical_inverse_scale_pa);
            let kl = f64::from(l.critical_inverse_linear_scale_pa);
            let mut d = x.sinh() / ks;
            for _ in 0..200 {
                let f = (d * ks).asinh() + d * kl - x;
                let slope = ks / (1.0 + (d * ks).powi(2)).sqrt() + kl;
                let step = f / slope;
                d -= step;
                if step.abs() < 1e-9 {
                    break;
                }
            }
            pc + d
        }
        XCoordinate::LogPressure => {
            // Newton on ln p + p/p1 = x (monotone, convex in ln p).
            let k = f64::from(l.x_inverse_pressure_scale);
            let mut lp = x.min(30.0);
            for _ in 0..100 {
                let p = lp.exp();
                let f = lp + p * k - x;
                let step = f / (1.0 + p * k);
                lp -= step;
                if step.abs() < 1e-15 * (1.0 + lp.abs()) {
                    break;
                }
            }
            lp.exp()
        }
    }
}

/// Table coordinate x of a pressure.
pub fn x_of_pressure(kind: SheetKind, l: &SinglePhaseLimits, p: f64) -> f64 {
    let pc = f64::from(l.critical_pressure_pa);
    match kind.x_coordinate() {
        XCoordinate::Pressure => p * 1.0e-6,
        XCoordinate::Critical => {
            ((p - pc) * f64::from(l.critical_inverse_scale_pa)).asinh()
                + (p - pc) * f64::from(l.critical_inverse_linear_scale_pa)
        }
        XCoordinate::LogPressure => p.ln() + p * f64::from(l.x_inverse_pressure_scale),
    }
}

fn round_up_strictly_f32(x: f64) -> f32 {
    let r = x as f32;
    if f64::from(r) <= x {
        f32::from_bits(r.to_bits() + 1)
    } else {
        r
    }
}

/// Runs the single-phase generator.
///
/// # Errors
/// A message for an inconsistent configuration or a failing fit.
pub fn generate_single_phase(c: &SinglePhaseConfig) -> Result<SinglePhaseGenerated, String> {
    if !(c.pressure_min_pa >= 611.657
        && c.pressure_min_pa < c.pressure_max_pa
        && c.pressure_max_pa <= 25.0e6
        && c.temperature_min_k >= 273.16
        && c.temperature_min_k < c.temperature_max_k
        && c.temperature_max_k <= 1073.15)
    {
        return Err(
            "need 611.657 <= pressure_min_pa < pressure_max_pa <= 25e6 and \
                    273.16 <= temperature_min_k < temperature_max_k <= 1073.15"
                .into(),
        );
    }
    if c.intervals
        .iter()
        .flatten()
        .chain(&c.inverse_intervals)
        .any(|&n| n == 0)
        || c.samples_per_interval < 2
    {
        return Err("interval counts >= 1 and samples_per_interval >= 2".into());
    }
    let pc = PC as f32;
    // One-sided differences of the Region 4 equation below pc, to second
    // order: T(pc − h) and T(pc − 2h).
    let dp = 1.0e4;
    let t0 = region4::saturation_temperature_k_unchecked(PC);
    let t1 = region4::saturation_temperature_k_unchecked(PC - dp);
    let t2 = region4::saturation_temperature_k_unchecked(PC - 2.0 * dp);
    let slope = (3.0 * t0 - 4.0 * t1 + t2) / (2.0 * dp);
    let curvature = 0.5 * (t0 - 2.0 * t1 + t2) / (dp * dp);
    let limits = SinglePhaseLimits {
        pressure_min_pa: c.pressure_min_pa as f32,
        pressure_max_pa: c.pressure_max_pa as f32,
        temperature_min_k: c.temperature_min_k as f32,
        temperature_max_k: c.temperature_max_k as f32,
        boundary_pressure_pa: round_up_strictly_f32(region4::saturation_pressure_pa_unchecked(
            T_REGION3,
        )),
        region3_temperature_k: T_REGION3 as f32,
        critical_pressure_pa: pc,
        critical_temperature_k: TC as f32,
        split_slope_k_pa: slope as f32,
        split_curvature_k_pa2: curvature as f32,
        x_inverse_pressure_scale: (1.0 / c.x_pressure_scale_pa) as f32,
        critical_inverse_scale_pa: (1.0 / c.critical_scale_pa) as f32,
        critical_inverse_linear_scale_pa: (1.0 / c.critical_linear_scale_pa) as f32,
        cluster_inverse_smoothing_pa: (1.0 / c.cluster_smoothing_pa) as f32,
    };
    let mut sheets = Vec::new();
    for kind in SheetKind::ALL {
        sheets.push(generate_sheet(kind, c, &limits)?);
    }
    Ok(SinglePhaseGenerated {
        config: c.clone(),
        limits,
        sheets,
    })
}

fn generate_sheet(
    kind: SheetKind,
    c: &SinglePhaseConfig,
    l: &SinglePhaseLimits,
) -> Result<GeneratedSheet, String> {
    let k = kind.index();
    let [nx_full, ny] = c.intervals[k];
    let (p_lo, p_hi) = pressure_range(kind, l);
    let (xa, xb) = {
        let a = x_of_pressure(kind, l, p_lo);
        let b = x_of_pressure(kind, l, p_hi);
        (a.min(b), a.max(b))
    };
    // A smaller envelope keeps the knot spacing of the default one: the
    // interval count in x shrinks with the share of the default x range
    // covered (a sheet wholly outside the envelope, never reached, gets one
    // interval).
    let default_limits = SinglePhaseLimits {
        pressure_min_pa: 611.657,
        pressure_max_pa: 25.0e6,
        ..*l
    };
    let (da, db) = pressure_range(kind, &default_limits);
    let full = (x_of_pressure(kind, l, db) - x_of_pressure(kind, l, da)).abs();
    let outside =
        p_hi <= p_lo + 1.0 || (kind.high() && l.pressure_max_pa <= l.boundary_pressure_pa);
    let nx = if outside {
        1
    } else {
        ((nx_full as f64 * (xb - xa) / full).ceil() as usize).clamp(2, nx_full)
    };
    let ny = if outside { 1 } else { ny };
    let x_start = xa as f32;
    let x_inverse_step = (nx as f64 / (xb - xa)) as f32;
    let s = c.samples_per_interval;
    let ux: Vec<f64> = (0..=nx * s).map(|i| i as f64 / s as f64).collect();
    let uy: Vec<f64> = (0..=ny * s).map(|j| j as f64 / s as f64).collect();
    let mut shell = GeneratedSheet {
        kind,
        properties: Sheet {
            x_start,
            x_inverse_step,
            x_intervals: nx,
            y_intervals: ny,
            coefficients: Vec::new(),
        },
        y_of_enthalpy: Sheet {
            x_start,
            x_inverse_step,
            x_intervals: nx,
            y_intervals: 1,
            coefficients: Vec::new(),
        },
        y_of_entropy: Sheet {
            x_start,
            x_inverse_step,
            x_intervals: nx,
            y_intervals: 1,
            coefficients: Vec::new(),
        },
        cluster_base_k: c.cluster_base_k[k] as f32,
        cluster_slope_k_pa: (c.cluster_k_per_mpa[k] * 1e-6) as f32,
        cluster_reference_pa: (c.cluster_reference_mpa[k] * 1e6) as f32,
    };
    let pressures: Vec<f64> = ux
        .iter()
        .map(|&u| pressure_of_x(kind, l, shell.properties.x_of(u)).clamp(p_lo, p_hi))
        .collect();
    let mut values = Vec::with_capacity(ux.len());
    for &p in &pressures {
        let e = edges(kind, l, &shell, p);
        let mut row = Vec::with_capacity(uy.len());
        for &u in &uy {
            let y = u / ny as f64;
            // Stay a hair inside the edges, where the formulation's own
            // region and root choice is unambiguous.
            let d_max = e.width;
            let t = e.t_of(y);
            let d = (e.direction * (t - e.t0))
                .clamp(1e-6f64.min(d_max * 0.5), d_max - 1e-9f64.min(d_max * 0.5));
            row.push(quantities(kind, p, e.t0 + e.direction * d)?);
        }
        values.push(row);
    }
    let uyl: Vec<f64> = uy.clone();
    shell.properties = fit_sheet(x_start, x_inverse_step, nx, ny, &ux, &uyl, &values)?;
    // Inverse sheets: y over (x, φ) of the fitted forward sheet.
    let ni = if outside { 1 } else { c.inverse_intervals[k] };
    let uphi: Vec<f64> = (0..=ni * s).map(|j| j as f64 / s as f64).collect();
    for column in [1usize, 2] {
        let mut inv = Vec::with_capacity(ux.len());
        for (&u, &p) in ux.iter().zip(&pressures) {
            let x = shell.properties.x_of(u);
            let e = edges(kind, l, &shell, p);
            let f = |y: f64| shell.properties.evaluate(x, y)[column];
            let (a, b) = (f(0.0), f(1.0));
            let mut row = Vec::with_capacity(uphi.len());
            for &w in &uphi {
                if e.width < 0.05 {
                    // A thin strip (where an edge meets another): h is
                    // nearly linear in T across it and bisection on a
                    // nearly constant table would return noise, which the
                    // fit would spread to wider rows; y = ψ there.
                    row.push([w / ni as f64]);
                    continue;
                }
                let target = a + e.phi_of(w / ni as f64) * (b - a);
                // Bisection on the monotone table.
                let (mut lo, mut hi) = (0.0f64, 1.0f64);
                let rising = b >= a;
                for _ in 0..60 {
                    let mid = 0.5 * (lo + hi);
                    if (f(mid) < target) == rising {
                        lo = mid;
                    } else {
                        hi = mid;
                    }
                }
                row.push([0.5 * (lo + hi)]);
            }
            inv.push(row);
        }
        let sheet = fit_sheet(x_start, x_inverse_step, nx, ni, &ux, &uphi, &inv)?;
        if column == 1 {
            shell.y_of_enthalpy = sheet;
        } else {
            shell.y_of_entropy = sheet;
        }
    }
    Ok(shell)
}

/// The command that regenerates the committed file.
pub const REGENERATE_COMMAND: &str = "cargo run -p vapora-tables --features generator --bin vapora-generate -- single-phase --output kernel/src/tables/single_phase.rs";

fn sheet_source<const Q: usize>(out: &mut String, s: &Sheet<Q>) {
    out.push_str("BicubicSheet {\n");
    out.push_str(&format!("        x_start: {},\n", format_f32(s.x_start)));
    out.push_str(&format!(
        "        x_inverse_step: {},\n",
        format_f32(s.x_inverse_step)
    ));
    out.push_str(&format!("        x_intervals: {},\n", s.x_intervals));
    out.push_str(&format!("        y_intervals: {},\n", s.y_intervals));
    out.push_str("        coefficients: &[\n");
    let stride = s.y_intervals + 3;
    for (i, row) in s.coefficients.chunks(stride).enumerate() {
        out.push_str(&format!("            // row {i}\n"));
        for c in row {
            let items: Vec<String> = c.iter().map(|&v| format_f32(v)).collect();
            out.push_str(&format!("            [{}],\n", items.join(", ")));
        }
    }
    out.push_str("        ],\n    }");
}

/// CRC-32 of a sheet's data as the kernel's integrity test computes it: the
/// four header words (x_start and x_inverse_step bit patterns, the two
/// interval counts), then every coefficient, 4 little-endian bytes each.
pub fn sheet_checksum<const Q: usize>(s: &Sheet<Q>) -> u32 {
    let mut bytes = Vec::new();
    for w in [
        s.x_start.to_bits(),
        s.x_inverse_step.to_bits(),
        s.x_intervals as u32,
        s.y_intervals as u32,
    ] {
        bytes.extend_from_slice(&w.to_le_bytes());
    }
    for c in &s.coefficients {
        for v in c {
            bytes.extend_from_slice(&v.to_bits().to_le_bytes());
        }
    }
    checksum(&bytes)
}

fn constant(out: &mut String, name: &str, doc: &str, v: f32) {
    out.push_str(&format!(
        "/// {doc}\npub const {name}: f32 = {};\n\n",
        format_f32(v)
    ));
}

/// The complete source of `kernel/src/tables/single_phase.rs`.
pub fn emit_single_phase(g: &SinglePhaseGenerated) -> String {
    let l = &g.limits;
    let mut body = String::new();
    body.push_str(
        "//! The generated single-phase tables: six tensor-product cubic B-spline\n\
         //! sheets (and their inverse sheets for (p, h) and (p, s)), produced by\n\
         //! `vapora-generate single-phase` from the IAPWS-IF97 formulation in f64.\n\
         //! Never edit by hand. Layout and coordinates: see\n\
         //! `vapora_tables::generator::single_phase` and [`crate::single_phase`].\n\
         //! Forward sheets hold per coefficient ρ (kg/m³; ρ/p in kg/(m³·Pa) where\n\
         //! `density_over_pressure`), h (J/kg), s (J/(kg·K)), 1/cp (kg·K/J),\n\
         //! w (m/s), ln(μ/(Pa·s)).\n",
    );
    body.push_str(&format!(
        "//!\n//! Coefficient flash: {} bytes in total (envelope {} Pa to {} Pa, {} K to {} K).\n\n",
        g.size_bytes(),
        g.config.pressure_min_pa,
        g.config.pressure_max_pa,
        g.config.temperature_min_k,
        g.config.temperature_max_k
    ));
    body.push_str("use crate::spline::{BicubicSheet, SinglePhaseSheet};\n\n");
    constant(
        &mut body,
        "PRESSURE_MIN_PA",
        "Lowest pressure of the tables, Pa.",
        l.pressure_min_pa,
    );
    constant(
        &mut body,
        "PRESSURE_MAX_PA",
        "Highest pressure of the tables, Pa.",
        l.pressure_max_pa,
    );
    constant(
        &mut body,
        "TEMPERATURE_MIN_K",
        "Lowest temperature of the tables, K.",
        l.temperature_min_k,
    );
    constant(
        &mut body,
        "TEMPERATURE_MAX_K",
        "Highest temperature of the tables, K.",
        l.temperature_max_k,
    );
    constant(
        &mut body,
        "BOUNDARY_PRESSURE_PA",
        "First f32 above p_sat(623.15 K), Pa: pressures below it use the low sheets.",
        l.boundary_pressure_pa,
    );
    constant(
        &mut body,
        "REGION3_TEMPERATURE_K",
        "623.15 K, where Region 1 hands over to Region 3.",
        l.region3_temperature_k,
    );
    constant(
        &mut body,
        "X_INVERSE_PRESSURE_SCALE_PA",
        "1/p1 of the low sheets' coordinate x = ln(p/Pa) + p/p1, 1/Pa.",
        l.x_inverse_pressure_scale,
    );
    constant(
        &mut body,
        "SPLIT_CURVATURE_K_PA2",
        "½·d²T_sat/dp² at the critical point, K/Pa²: the split is Tc + k·(p − pc) + c·(p − pc)².",
        l.split_curvature_k_pa2,
    );
    constant(
        &mut body,
        "CRITICAL_INVERSE_SCALE_PA",
        "1/p_s of the near-critical sheets' coordinate x = asinh((p − pc)/p_s), 1/Pa.",
        l.critical_inverse_scale_pa,
    );
    constant(
        &mut body,
        "CRITICAL_INVERSE_LINEAR_SCALE_PA",
        "1/p_l of the near-critical sheets' coordinate x = asinh((p − pc)/p_s) + (p − pc)/p_l, 1/Pa.",
        l.critical_inverse_linear_scale_pa,
    );
    constant(
        &mut body,
        "CLUSTER_INVERSE_SMOOTHING_PA",
        "1/p_m of the stretch scale δ(p) = δ_base + δ_slope·√((p − p_ref)² + p_m²), 1/Pa.",
        l.cluster_inverse_smoothing_pa,
    );
    constant(
        &mut body,
        "CRITICAL_PRESSURE_PA",
        "Critical pressure, Pa (origin of the near-critical x coordinate).",
        l.critical_pressure_pa,
    );
    constant(
        &mut body,
        "CRITICAL_TEMPERATURE_K",
        "Critical temperature, K.",
        l.critical_temperature_k,
    );
    constant(
        &mut body,
        "SPLIT_SLOPE_K_PA",
        "dT_sat/dp at the critical point, K/Pa: the liquid/vapour split above pc is Tc + k·(p − pc).",
        l.split_slope_k_pa,
    );
    for s in &g.sheets {
        let name = s.kind.name();
        body.push_str(&format!(
            "/// Sheet {name}: {} + {} + {} coefficients, {} bytes.\n",
            s.properties.coefficients.len(),
            s.y_of_enthalpy.coefficients.len(),
            s.y_of_entropy.coefficients.len(),
            s.size_bytes()
        ));
        body.push_str(&format!(
            "pub static {name}: SinglePhaseSheet = SinglePhaseSheet {{\n"
        ));
        body.push_str("    properties: ");
        sheet_source(&mut body, &s.properties);
        body.push_str(",\n    y_of_enthalpy: ");
        sheet_source(&mut body, &s.y_of_enthalpy);
        body.push_str(",\n    y_of_entropy: ");
        sheet_source(&mut body, &s.y_of_entropy);
        body.push_str(",\n");
        body.push_str(&format!(
            "    cluster_base_k: {},\n    cluster_slope_k_pa: {},\n    cluster_reference_pa: {},\n    density_over_pressure: {},\n}};\n\n",
            format_f32(s.cluster_base_k),
            format_f32(s.cluster_slope_k_pa),
            format_f32(s.cluster_reference_pa),
            s.kind.density_over_pressure()
        ));
        let crcs = [
            sheet_checksum(&s.properties),
            sheet_checksum(&s.y_of_enthalpy),
            sheet_checksum(&s.y_of_entropy),
        ];
        body.push_str(&format!(
            "/// CRC-32/ISO-HDLC of [`{name}`]'s three sheets (header words, then every\n\
             /// coefficient; 4 little-endian bytes each), checked by `crate::integrity::self_test`.\n\
             pub const {name}_CRC32: [u32; 3] = [0x{:08x}, 0x{:08x}, 0x{:08x}];\n\n",
            crcs[0], crcs[1], crcs[2]
        ));
    }
    let mut out = String::new();
    out.push_str(&format!(
        "// @generated by vapora-generate {} (crate vapora-tables) from the IAPWS-IF97 formulation.\n",
        env!("CARGO_PKG_VERSION")
    ));
    out.push_str("// Do not edit by hand. Regenerate with:\n");
    out.push_str(&format!("//   {REGENERATE_COMMAND}\n"));
    out.push_str(&format!("// Settings: {}\n", g.config.describe()));
    out.push_str(&format!(
        "{}{:08x}\n",
        super::emit::CHECKSUM_PREFIX,
        checksum(body.as_bytes())
    ));
    out.push_str(&body);
    out
}

/// Which zone a (p, T) point lies in for the accuracy statement.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Zone {
    /// Beyond 15 K and 3 MPa of the critical point.
    Far,
    /// Outside the near-critical box but within 15 K and 3 MPa of it.
    Ring,
    /// Within 5 K and 1 MPa of the critical point.
    Box,
}

/// The zone of a point.
pub fn zone(p: f64, t: f64) -> Zone {
    let dp = (p - PC).abs();
    let dt = (t - TC).abs();
    if dp <= 1.0e6 && dt <= 5.0 {
        Zone::Box
    } else if dp <= 3.0e6 && dt <= 15.0 {
        Zone::Ring
    } else {
        Zone::Far
    }
}

/// Largest deviations: ρ relative, h J/kg, s J/(kg·K), cp relative,
/// w relative, μ relative, T(p, h) K, T(p, s) K.
pub type Maxima = [f64; 8];

/// The generator's own measurement of the sheets (f64 evaluation of the f32
/// coefficients) against the formulation, halfway between fitting samples,
/// per zone ([`Zone::Far`], [`Zone::Ring`], [`Zone::Box`]).
///
/// # Errors
/// When the formulation fails at a point.
pub fn measure_single_phase(
    g: &SinglePhaseGenerated,
    points: usize,
) -> Result<[Maxima; 3], String> {
    let l = &g.limits;
    let mut out = [[0.0f64; 8]; 3];
    for s in &g.sheets {
        let kind = s.kind;
        if kind.high() && l.pressure_max_pa <= l.boundary_pressure_pa {
            // Outside the envelope: never reached.
            continue;
        }
        let mut worst = [(0.0f64, 0.0f64, 0.0f64); 8];
        let mut worst_ring = [(0.0f64, 0.0f64, 0.0f64); 8];
        let (p_lo, p_hi) = pressure_range(kind, l);
        let (xa, xb) = (x_of_pressure(kind, l, p_lo), x_of_pressure(kind, l, p_hi));
        let nx = s.properties.x_intervals * points;
        let ny = s.properties.y_intervals * points;
        for i in 0..nx {
            let x = xa + (xb - xa) * (i as f64 + 0.5) / nx as f64;
            let p = pressure_of_x(kind, l, x);
            let e = edges(kind, l, s, p);
            for j in 0..=ny {
                let y = ((j as f64 + 0.37) / (ny as f64 + 1.0)).min(1.0);
                let t = e.t_of(y);
                let d = e.direction * (t - e.t0);
                if d < 0.01 || d > e.width - 1e-6 || t < 273.16 {
                    continue;
                }
                let want = quantities(kind, p, t)?;
                let got = s.properties.evaluate(x, e.y_of(t));
                let z = zone(p, t) as usize;
                let m = &mut out[z];
                let rel = |a: f64, b: f64| ((a - b) / b).abs();
                // T from (p, h) through the inverse sheet.
                let (a, b) = (
                    s.properties.evaluate(x, 0.0)[1],
                    s.properties.evaluate(x, 1.0)[1],
                );
                let phi = (want[1] - a) / (b - a);
                let yh = s.y_of_enthalpy.evaluate(x, e.psi_of(phi.clamp(0.0, 1.0)))[0];
                // T from (p, s) likewise.
                let (a, b) = (
                    s.properties.evaluate(x, 0.0)[2],
                    s.properties.evaluate(x, 1.0)[2],
                );
                let phi = (want[2] - a) / (b - a);
                let ys = s.y_of_entropy.evaluate(x, e.psi_of(phi.clamp(0.0, 1.0)))[0];
                let errs = [
                    rel(got[0], want[0]),
                    (got[1] - want[1]).abs(),
                    (got[2] - want[2]).abs(),
                    rel(got[3], want[3]),
                    rel(got[4], want[4]),
                    (got[5] - want[5]).abs(),
                    (e.t_of(yh) - t).abs(),
                    (e.t_of(ys) - t).abs(),
                ];
                for q in 0..8 {
                    m[q] = m[q].max(errs[q]);
                    if z == 0 && errs[q] > worst[q].0 {
                        worst[q] = (errs[q], p, t);
                    }
                    if z == 1 && errs[q] > worst_ring[q].0 {
                        worst_ring[q] = (errs[q], p, t);
                    }
                }
            }
        }
        if std::env::var_os("VAPORA_SP_VERBOSE").is_some() {
            std::eprintln!(
                "{:22} far-zone worst (value, p, T): {:?}",
                kind.name(),
                worst.map(|(v, p, t)| (format!("{v:.2e}"), p as f32, t as f32))
            );
            std::eprintln!(
                "{:22} ring worst (value, p, T): {:?}",
                kind.name(),
                worst_ring.map(|(v, p, t)| (format!("{v:.2e}"), p as f32, t as f32))
            );
        }
    }
    Ok(out)
}
