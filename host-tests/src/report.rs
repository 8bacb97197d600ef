//! The accuracy report (README, "Accuracy"): the kernel measured against
//! the f64 formulation with [`crate::accuracy`], written as a Markdown
//! table (`docs/accuracy.md`) and one SVG plot of error against saturation
//! temperature per property (`docs/accuracy/<property>.svg`).
//!
//! Both are pure functions of the measurement grid, so a test can check
//! that the committed files are what the tables give now.

use std::error::Error;

use plotters::prelude::*;

use crate::accuracy::{
    deviations_at_pressure, deviations_at_temperature, grid_inputs, measure_kernel, published,
    Deviations, Grid, ZoneMaxima, CRITICAL_TEMPERATURE_K, NEAR_CRITICAL_START_K,
    REQUIRED_BELOW_NEAR_CRITICAL, REQUIRED_NEAR_CRITICAL, STATED_END_K,
};
use vapora_kernel::accuracy::{ACCURACY_BELOW_NEAR_CRITICAL, ACCURACY_NEAR_CRITICAL};
use vapora_kernel::tables::saturation as table;

/// The command that regenerates the report, as written in its header.
pub const REGENERATE: &str =
    "cargo run --release -p vapora-host-tests --bin vapora-accuracy-report";

/// How one property is shown: file stem, table label, unit shown in the
/// table and the factor from the measured SI value to it, axis label.
struct Shown {
    field: &'static str,
    stem: &'static str,
    label: &'static str,
    unit: &'static str,
    scale: f64,
    axis: &'static str,
}

const SHOWN: [Shown; 11] = [
    Shown {
        field: "temperature_k",
        stem: "saturation-temperature",
        label: "T_sat",
        unit: "mK",
        scale: 1e3,
        axis: "|ΔT_sat| (mK)",
    },
    Shown {
        field: "pressure_relative",
        stem: "saturation-pressure",
        label: "p_sat",
        unit: "ppm",
        scale: 1e6,
        axis: "|Δp_sat|/p_sat (ppm)",
    },
    Shown {
        field: "liquid_density_relative",
        stem: "liquid-density",
        label: "ρ' (and v')",
        unit: "ppm",
        scale: 1e6,
        axis: "|Δρ'|/ρ' (ppm)",
    },
    Shown {
        field: "vapour_density_relative",
        stem: "vapour-density",
        label: "ρ'' (and v'')",
        unit: "ppm",
        scale: 1e6,
        axis: "|Δρ''|/ρ'' (ppm)",
    },
    Shown {
        field: "liquid_enthalpy_j_kg",
        stem: "liquid-enthalpy",
        label: "h'",
        unit: "J/kg",
        scale: 1.0,
        axis: "|Δh'| (J/kg)",
    },
    Shown {
        field: "vapour_enthalpy_j_kg",
        stem: "vapour-enthalpy",
        label: "h''",
        unit: "J/kg",
        scale: 1.0,
        axis: "|Δh''| (J/kg)",
    },
    Shown {
        field: "liquid_entropy_j_kgk",
        stem: "liquid-entropy",
        label: "s'",
        unit: "J/(kg·K)",
        scale: 1.0,
        axis: "|Δs'| (J/(kg·K))",
    },
    Shown {
        field: "vapour_entropy_j_kgk",
        stem: "vapour-entropy",
        label: "s''",
        unit: "J/(kg·K)",
        scale: 1.0,
        axis: "|Δs''| (J/(kg·K))",
    },
    Shown {
        field: "liquid_cp_relative",
        stem: "liquid-cp",
        label: "cp'",
        unit: "%",
        scale: 1e2,
        axis: "|Δcp'|/cp' (%)",
    },
    Shown {
        field: "vapour_cp_relative",
        stem: "vapour-cp",
        label: "cp''",
        unit: "%",
        scale: 1e2,
        axis: "|Δcp''|/cp'' (%)",
    },
    Shown {
        field: "dryness_fraction",
        stem: "dryness-fraction",
        label: "x from (p, h) and (T, h)",
        unit: "–",
        scale: 1.0,
        axis: "|Δx| (dryness fraction)",
    },
];

fn field(d: &Deviations, name: &str) -> f64 {
    d.fields()
        .iter()
        .find(|(n, _)| *n == name)
        .map_or(f64::NAN, |(_, v)| *v)
}

/// Three significant digits, plain for moderate magnitudes.
fn figure(v: f64) -> String {
    if v.is_infinite() {
        return "not bounded".into();
    }
    if v.is_nan() {
        return "NaN".into();
    }
    if v == 0.0 {
        return "0".into();
    }
    let a = v.abs();
    if (1e-3..1e5).contains(&a) {
        let digits = (2 - a.log10().floor() as i32).max(0) as usize;
        let text = format!("{v:.digits$}");
        // Three significant digits at most, without trailing zeros.
        if text.contains('.') {
            text.trim_end_matches('0').trim_end_matches('.').to_string()
        } else {
            text
        }
    } else {
        let text = format!("{v:.2e}");
        match text.split_once('e') {
            Some((mantissa, exponent)) if mantissa.contains('.') => format!(
                "{}e{exponent}",
                mantissa.trim_end_matches('0').trim_end_matches('.')
            ),
            _ => text,
        }
    }
}

/// The Markdown accuracy file for `grid`: header, the table (measured
/// maxima over both input paths, the requirement and the kernel's
/// published bound per zone) and the point counts.
pub fn accuracy_markdown(grid: &Grid) -> String {
    let (at_t, at_p) = measure_kernel(grid);
    markdown_from(grid, &at_t, &at_p)
}

fn markdown_from(grid: &Grid, at_t: &ZoneMaxima, at_p: &ZoneMaxima) -> String {
    let below = at_t.below_near_critical.max(&at_p.below_near_critical);
    let near = at_t.near_critical.max(&at_p.near_critical);
    let pub_below = published(&ACCURACY_BELOW_NEAR_CRITICAL);
    let pub_near = published(&ACCURACY_NEAR_CRITICAL);
    let mut s = String::new();
    s += "<!-- Generated by the accuracy report; do not edit. Regenerate with\n";
    s += &format!("     {REGENERATE}\n");
    s += "     host-tests/tests/accuracy_report.rs fails when this file is stale. -->\n\n";
    s += "# Accuracy of the saturation kernel against IAPWS-IF97\n\n";
    s += &format!(
        "The f32 kernel, called as firmware calls it, against the f64 formulation \
         (`vapora_tables::if97::saturation`) at the same inputs: {} points per table interval \
         (at least 50 times finer than the knots) plus {} seeded random temperatures and as \
         many random pressures (seed {:#x}). Each figure is the largest deviation over the \
         inputs from temperature and from pressure; x is checked at x = 0.02, 0.5 and 0.98. \
         The kernel bound is the constant it publishes in `vapora_kernel::accuracy`.\n\n",
        grid.points_per_interval, grid.random_points, grid.seed
    );
    s += &format!(
        "Points measured: {} below Tc − 1 K, {} from Tc − 1 K to Tc − 0.01 K \
         (Tc = {CRITICAL_TEMPERATURE_K} K).\n\n",
        at_t.points[0] + at_p.points[0],
        at_t.points[1] + at_p.points[1]
    );
    s += "| property | unit | below Tc − 1 K: required | measured | kernel bound \
          | Tc − 1 K to Tc − 0.01 K: required | measured | kernel bound |\n";
    s += "|---|---|---|---|---|---|---|---|\n";
    for p in &SHOWN {
        let g = |d: &Deviations| figure(field(d, p.field) * p.scale);
        s += &format!(
            "| {} | {} | ≤ {} | {} | {} | {} | {} | {} |\n",
            p.label,
            p.unit,
            g(&REQUIRED_BELOW_NEAR_CRITICAL),
            g(&below),
            g(&pub_below),
            match field(&REQUIRED_NEAR_CRITICAL, p.field) {
                v if v.is_finite() => format!("≤ {}", figure(v * p.scale)),
                _ => "measured and documented".into(),
            },
            g(&near),
            g(&pub_near),
        );
    }
    s += "\nPlots of the error against saturation temperature: `docs/accuracy/<property>.svg`.\n";
    s
}

/// Measured maxima per plot bin, for one property.
#[derive(Debug, Clone, PartialEq)]
pub struct Curve {
    /// File stem of the plot.
    pub stem: &'static str,
    /// (T_sat in K, largest deviation in the bin in the shown unit), below
    /// Tc − 1 K.
    pub below: Vec<(f64, f64)>,
    /// (Tc − T_sat in K, largest deviation), Tc − 1 K to Tc − 0.01 K.
    pub near: Vec<(f64, f64)>,
}

const BINS_BELOW: usize = 500;
const BINS_NEAR: usize = 200;

/// The per-property error curves on `grid`: every measured point goes into
/// a bin of saturation temperature (uniform in T below Tc − 1 K, uniform in
/// log(Tc − T) above), and each bin shows its largest deviation.
pub fn error_curves(grid: &Grid) -> Vec<Curve> {
    let (ts, ps) = grid_inputs(grid);
    let t_min = f64::from(table::TEMPERATURE_MIN_K);
    let mut below = vec![Deviations::default(); BINS_BELOW];
    let mut near = vec![Deviations::default(); BINS_NEAR];
    let mut filled = (vec![false; BINS_BELOW], vec![false; BINS_NEAR]);
    let points = ts
        .iter()
        .filter_map(|&t| deviations_at_temperature(t))
        .chain(ps.iter().filter_map(|&p| deviations_at_pressure(p)));
    for (r, d) in points {
        let t = r.temperature_k;
        if t > STATED_END_K {
            continue;
        }
        if t < NEAR_CRITICAL_START_K {
            let u = (t - t_min) / (NEAR_CRITICAL_START_K - t_min);
            let i = ((u * BINS_BELOW as f64) as usize).min(BINS_BELOW - 1);
            if let (Some(b), Some(f)) = (below.get_mut(i), filled.0.get_mut(i)) {
                *b = b.max(&d);
                *f = true;
            }
        } else {
            // −log10(Tc − T) runs from 0 (1 K below Tc) to 2 (0.01 K below).
            let u = -(CRITICAL_TEMPERATURE_K - t).log10() / 2.0;
            let i = ((u * BINS_NEAR as f64) as usize).min(BINS_NEAR - 1);
            if let (Some(b), Some(f)) = (near.get_mut(i), filled.1.get_mut(i)) {
                *b = b.max(&d);
                *f = true;
            }
        }
    }
    SHOWN
        .iter()
        .map(|p| Curve {
            stem: p.stem,
            below: below
                .iter()
                .zip(&filled.0)
                .enumerate()
                .filter(|(_, (_, f))| **f)
                .map(|(i, (d, _))| {
                    let t = t_min
                        + (NEAR_CRITICAL_START_K - t_min) * (i as f64 + 0.5) / BINS_BELOW as f64;
                    (t, field(d, p.field) * p.scale)
                })
                .collect(),
            near: near
                .iter()
                .zip(&filled.1)
                .enumerate()
                .filter(|(_, (_, f))| **f)
                .map(|(i, (d, _))| {
                    let u = 2.0 * (i as f64 + 0.5) / BINS_NEAR as f64;
                    (10f64.powf(-u), field(d, p.field) * p.scale)
                })
                .collect(),
        })
        .collect()
}

/// The SVG plot of one curve: left panel against T below Tc − 1 K, right
/// panel against Tc − T (log scale) up to Tc − 0.01 K; the required
/// bound in red, the kernel's published bound in green, log error axis.
///
/// # Errors
/// Drawing errors of the plotting library (none expected for SVG into a
/// string).
pub fn plot_svg(curve: &Curve) -> Result<String, Box<dyn Error>> {
    let Some(p) = SHOWN.iter().find(|p| p.stem == curve.stem) else {
        return Err(format!("unknown property {}", curve.stem).into());
    };
    let bounds = |d: &Deviations| field(d, p.field) * p.scale;
    let required = (
        bounds(&REQUIRED_BELOW_NEAR_CRITICAL),
        bounds(&REQUIRED_NEAR_CRITICAL),
    );
    let kernel = (
        bounds(&published(&ACCURACY_BELOW_NEAR_CRITICAL)),
        bounds(&published(&ACCURACY_NEAR_CRITICAL)),
    );
    let measured = curve.below.iter().chain(&curve.near).map(|v| v.1);
    let top = measured
        .clone()
        .chain([required.0, required.1, kernel.0, kernel.1])
        .filter(|v| v.is_finite())
        .fold(0.0f64, f64::max);
    // A decade of headroom above the largest figure for the legend.
    let top = if top > 0.0 { top * 10.0 } else { 1.0 };
    // Six decades below the top: enough to see the shape down to f32
    // rounding, and exact zeros (an input the kernel returns unchanged)
    // sit on the floor.
    let floor = top * 1e-6;
    let clamp = |v: f64| v.max(floor).min(top);

    let mut svg = String::new();
    {
        let root = SVGBackend::with_string(&mut svg, (1100, 480)).into_drawing_area();
        root.fill(&WHITE)?;
        let title = match p.unit {
            "–" => format!("Saturation kernel against IAPWS-IF97: {}", p.label),
            unit => format!("Saturation kernel against IAPWS-IF97: {} ({unit})", p.label),
        };
        let root = root.titled(&title, ("sans-serif", 22))?;
        let (left, right) = root.split_horizontally(700);
        let t_min = f64::from(table::TEMPERATURE_MIN_K);

        let mut chart = ChartBuilder::on(&left)
            .margin(12)
            .x_label_area_size(45)
            .y_label_area_size(80)
            .caption("below Tc − 1 K", ("sans-serif", 16))
            .build_cartesian_2d(t_min..NEAR_CRITICAL_START_K, (floor..top).log_scale())?;
        chart
            .configure_mesh()
            .x_desc("saturation temperature T (K)")
            .y_desc(p.axis)
            .x_label_formatter(&|t| format!("{t:.0}"))
            .y_label_formatter(&|v| format!("{v:.0e}"))
            .axis_desc_style(("sans-serif", 15))
            .draw()?;
        chart
            .draw_series(LineSeries::new(
                curve.below.iter().map(|&(t, v)| (t, clamp(v))),
                BLUE.stroke_width(1),
            ))?
            .label("measured (largest per bin)")
            .legend(|(x, y)| PathElement::new(vec![(x, y), (x + 20, y)], BLUE));
        if required.0.is_finite() {
            chart
                .draw_series(LineSeries::new(
                    [(t_min, required.0), (NEAR_CRITICAL_START_K, required.0)],
                    RED.stroke_width(2),
                ))?
                .label("required (issue 3)")
                .legend(|(x, y)| PathElement::new(vec![(x, y), (x + 20, y)], RED.stroke_width(2)));
        }
        let green = RGBColor(0, 140, 0);
        chart
            .draw_series(LineSeries::new(
                [
                    (t_min, clamp(kernel.0)),
                    (NEAR_CRITICAL_START_K, clamp(kernel.0)),
                ],
                green.stroke_width(2),
            ))?
            .label("kernel's published bound")
            .legend(move |(x, y)| {
                PathElement::new(vec![(x, y), (x + 20, y)], green.stroke_width(2))
            });
        chart
            .configure_series_labels()
            .position(SeriesLabelPosition::UpperLeft)
            .background_style(WHITE.mix(0.85))
            .border_style(BLACK)
            .label_font(("sans-serif", 13))
            .draw()?;

        // Right panel: x = −log10(Tc − T), labelled with Tc − T.
        let mut chart = ChartBuilder::on(&right)
            .margin(12)
            .margin_right(30)
            .x_label_area_size(45)
            .y_label_area_size(80)
            .caption("Tc − 1 K to Tc − 0.01 K", ("sans-serif", 16))
            .build_cartesian_2d(0.0f64..2.0, (floor..top).log_scale())?;
        chart
            .configure_mesh()
            .x_desc("Tc − T (K), log scale")
            .y_desc(p.axis)
            .x_labels(5)
            .x_label_formatter(&|u| figure(10f64.powf(-u)))
            .y_label_formatter(&|v| format!("{v:.0e}"))
            .axis_desc_style(("sans-serif", 15))
            .draw()?;
        chart.draw_series(LineSeries::new(
            curve.near.iter().map(|&(d, v)| (-d.log10(), clamp(v))),
            BLUE.stroke_width(1),
        ))?;
        if required.1.is_finite() {
            chart.draw_series(LineSeries::new(
                [(0.0, required.1), (2.0, required.1)],
                RED.stroke_width(2),
            ))?;
        } else {
            chart.draw_series(std::iter::once(Text::new(
                "no requirement: measured and documented",
                (0.05, top / 2.0),
                ("sans-serif", 13).into_font().color(&RED),
            )))?;
        }
        chart.draw_series(LineSeries::new(
            [(0.0, clamp(kernel.1)), (2.0, clamp(kernel.1))],
            green.stroke_width(2),
        ))?;
        root.present()?;
    }
    Ok(svg)
}

/// Marks the start of the table in README's "Accuracy" section.
pub const README_TABLE_START: &str = "<!-- accuracy table: generated by vapora-accuracy-report -->";
/// Marks the end of the table in README.
pub const README_TABLE_END: &str = "<!-- end of accuracy table -->";

/// The table lines of an accuracy file (those starting with `|`).
pub fn table_lines(markdown: &str) -> String {
    markdown
        .lines()
        .filter(|l| l.starts_with('|'))
        .map(|l| format!("{l}\n"))
        .collect()
}

/// `readme` with the text between the table marks replaced by the table of
/// `markdown`, or `None` when the marks are missing.
pub fn readme_with_table(readme: &str, markdown: &str) -> Option<String> {
    let start = readme.find(README_TABLE_START)? + README_TABLE_START.len();
    let end = readme[start..].find(README_TABLE_END)? + start;
    Some(format!(
        "{}\n{}{}",
        &readme[..start],
        table_lines(markdown),
        &readme[end..]
    ))
}

/// Stems of the plot files, in table order.
pub fn plot_stems() -> impl Iterator<Item = &'static str> {
    SHOWN.iter().map(|p| p.stem)
}
