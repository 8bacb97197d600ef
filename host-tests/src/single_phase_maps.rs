//! SVG error maps of the single-phase kernel over (p, T): for each shown
//! property, the envelope is cut into cells (log-spaced in pressure, linear
//! in temperature), the kernel is compared with the f64 formulation at 3 × 3
//! f32 points inside each cell, and the cell is coloured by its largest
//! deviation relative to issue 5's bound for that property (green: below a
//! tenth of the bound, yellow to red: up to the bound and beyond). The
//! saturation line and the near-critical box are drawn over it.
//! Deterministic: the same tables give the same SVG bytes
//! (`tests/single_phase_maps.rs` checks the committed files).

use std::error::Error;

use plotters::prelude::*;
use vapora_tables::if97::region4;

use crate::single_phase::{deviations_at, PC, REQUIRED_FAR, TC};

/// Cells in pressure and in temperature.
pub const CELLS: (usize, usize) = (48, 40);

/// The command that writes the maps.
pub const REGENERATE: &str =
    "cargo run --release -p vapora-host-tests --bin vapora-single-phase-maps";

/// One shown property: file stem, label, index into `deviations_at`, bound.
pub struct Shown {
    /// `docs/accuracy-single-phase/<stem>.svg`.
    pub stem: &'static str,
    /// Title.
    pub label: &'static str,
    /// Index in the deviation record.
    pub index: usize,
    /// Issue 5's bound for it.
    pub bound: f64,
}

/// The maps drawn.
pub const SHOWN: [Shown; 9] = [
    Shown {
        stem: "density",
        label: "density ρ, relative",
        index: 0,
        bound: REQUIRED_FAR.density_relative,
    },
    Shown {
        stem: "enthalpy",
        label: "enthalpy h, J/kg",
        index: 1,
        bound: REQUIRED_FAR.enthalpy_j_kg,
    },
    Shown {
        stem: "entropy",
        label: "entropy s, J/(kg·K)",
        index: 2,
        bound: REQUIRED_FAR.entropy_j_kgk,
    },
    Shown {
        stem: "cp",
        label: "isobaric heat capacity cp, relative",
        index: 3,
        bound: REQUIRED_FAR.cp_relative,
    },
    Shown {
        stem: "speed-of-sound",
        label: "speed of sound w, relative",
        index: 4,
        bound: REQUIRED_FAR.speed_of_sound_relative,
    },
    Shown {
        stem: "isentropic-exponent",
        label: "isentropic exponent κ, relative",
        index: 5,
        bound: REQUIRED_FAR.isentropic_exponent_relative,
    },
    Shown {
        stem: "viscosity",
        label: "viscosity μ, relative",
        index: 6,
        bound: REQUIRED_FAR.viscosity_relative,
    },
    Shown {
        stem: "temperature-from-enthalpy",
        label: "T from (p, h), K",
        index: 7,
        bound: REQUIRED_FAR.temperature_from_enthalpy_k,
    },
    Shown {
        stem: "temperature-from-entropy",
        label: "T from (p, s), K",
        index: 8,
        bound: REQUIRED_FAR.temperature_from_entropy_k,
    },
];

const P_MIN: f64 = 611.657;
const P_MAX: f64 = 25.0e6;
const T_MIN: f64 = 273.16;
const T_MAX: f64 = 1073.15;

/// Largest deviation per cell for every record field: `[cell][field]`,
/// cells row by row in pressure. NaN where no point of the cell has a
/// single-phase state.
pub fn cell_maxima() -> Vec<[f64; 9]> {
    let (np, nt) = CELLS;
    let mut out = vec![[f64::NAN; 9]; np * nt];
    let f = |v: f64| f64::from(v as f32);
    for i in 0..np {
        for j in 0..nt {
            let cell = &mut out[i * nt + j];
            for a in 0..3 {
                for b in 0..3 {
                    let u = (i as f64 + (a as f64 + 0.5) / 3.0) / np as f64;
                    let v = (j as f64 + (b as f64 + 0.5) / 3.0) / nt as f64;
                    let p = f(P_MIN * (P_MAX / P_MIN).powf(u));
                    let t = f(T_MIN + (T_MAX - T_MIN) * v);
                    if let Some(d) = deviations_at(p, t) {
                        for (c, x) in cell.iter_mut().zip(d) {
                            if c.is_nan() || x > *c {
                                *c = x;
                            }
                        }
                    }
                }
            }
        }
    }
    out
}

fn colour(ratio: f64) -> RGBColor {
    if ratio.is_nan() {
        return RGBColor(230, 230, 230);
    }
    // log10(ratio): ≤ −2 dark green, −1 green, 0 (the bound) red, above: dark red.
    let r = ratio.max(1e-4).log10();
    if r < -1.0 {
        let s = ((r + 2.0).clamp(0.0, 1.0) * 120.0) as u8;
        RGBColor(0, 100 + s, 0)
    } else if r < 0.0 {
        let s = r + 1.0;
        RGBColor((255.0 * s) as u8, (220.0 - 120.0 * s) as u8, 0)
    } else {
        let s = (r.min(2.0) / 2.0 * 120.0) as u8;
        RGBColor(255 - s, 0, 0)
    }
}

/// The SVG map of one property from [`cell_maxima`].
///
/// # Errors
/// Drawing errors of the plotting library.
pub fn map_svg(shown: &Shown, cells: &[[f64; 9]]) -> Result<String, Box<dyn Error>> {
    let (np, nt) = CELLS;
    let mut svg = String::new();
    {
        let root = SVGBackend::with_string(&mut svg, (900, 620)).into_drawing_area();
        root.fill(&WHITE)?;
        let root = root.titled(
            &format!("Single-phase kernel against IAPWS-IF97: {}", shown.label),
            ("sans-serif", 20),
        )?;
        let lp = (P_MIN.log10(), P_MAX.log10());
        let mut chart = ChartBuilder::on(&root)
            .margin(14)
            .x_label_area_size(45)
            .y_label_area_size(60)
            .caption(
                format!(
                    "largest deviation per cell / issue 5 bound ({:.0e}): green < 0.1, yellow to red up to 1, dark red above",
                    shown.bound
                ),
                ("sans-serif", 13),
            )
            .build_cartesian_2d(lp.0..lp.1, T_MIN..T_MAX)?;
        chart
            .configure_mesh()
            .disable_mesh()
            .x_desc("pressure (Pa), log scale")
            .y_desc("temperature (K)")
            .x_label_formatter(&|x| format!("{:.1e}", 10f64.powf(*x)))
            .y_label_formatter(&|t| format!("{t:.0}"))
            .draw()?;
        let dx = (lp.1 - lp.0) / np as f64;
        let dt = (T_MAX - T_MIN) / nt as f64;
        chart.draw_series((0..np).flat_map(|i| {
            (0..nt).map(move |j| {
                let ratio = cells[i * nt + j][shown.index] / shown.bound;
                let x0 = lp.0 + dx * i as f64;
                let t0 = T_MIN + dt * j as f64;
                Rectangle::new([(x0, t0), (x0 + dx, t0 + dt)], colour(ratio).filled())
            })
        }))?;
        // The saturation line and the near-critical box.
        chart.draw_series(LineSeries::new(
            (0..=200).map(|k| {
                let x = lp.0 + (PC.log10() - lp.0) * f64::from(k) / 200.0;
                (
                    x,
                    region4::saturation_temperature_k_unchecked(10f64.powf(x)),
                )
            }),
            BLACK.stroke_width(2),
        ))?;
        chart.draw_series(std::iter::once(Rectangle::new(
            [
                ((PC - 1.0e6).log10(), TC - 5.0),
                ((PC + 1.0e6).log10(), TC + 5.0),
            ],
            BLUE.stroke_width(2),
        )))?;
        root.present()?;
    }
    Ok(svg)
}
