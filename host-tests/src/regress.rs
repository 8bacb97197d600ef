//! The engine of the plant regression tool `vapora-regress` (README,
//! "Regression tool"): CSV rows of plant points in, CSV rows of saturated
//! or state properties out, from the kernel (f32, as firmware computes
//! them) or from the f64 IAPWS-IF97 formulation; and a compare mode that
//! checks a file of expected values with tolerances.
//!
//! Every input row gives one output row, in order. A row that cannot be
//! evaluated keeps its input cells and gets the reason in `error`; the run
//! goes on. Numbers are written in Rust's shortest round-trip form of the
//! model's own type (f32 for the kernel, f64 for the formulation), so a
//! value read back is the value computed.

use std::collections::BTreeSet;
use std::error::Error;
use std::io::{Read, Write};

use vapora_kernel::accuracy::accuracy_at_saturation_temperature_k;
use vapora_kernel::mixture::wet_steam_at_pressure;
use vapora_kernel::quality::{
    phase_from_pressure_enthalpy, phase_from_pressure_entropy, Phase, SATURATION_TOLERANCE,
};
use vapora_kernel::saturation::{
    saturated_state_at_pressure, saturated_state_at_temperature, saturation_temperature,
};
use vapora_kernel::single_phase::{
    state_at_pressure_enthalpy, state_at_pressure_entropy, state_at_pressure_temperature,
    FluidState, SinglePhaseError,
};
use vapora_kernel::units::{AbsolutePressure, Temperature};
use vapora_tables::if97::{
    inverse, pt, region4, saturation, viscosity, Properties, CRITICAL_PRESSURE_PA,
};

/// Output columns of `saturation` mode, in order.
pub const SATURATION_COLUMNS: [&str; 9] = [
    "p_pa",
    "t_k",
    "rho_liq_kg_m3",
    "rho_vap_kg_m3",
    "h_liq_j_kg",
    "h_vap_j_kg",
    "s_liq_j_kgk",
    "s_vap_j_kgk",
    "error",
];

/// Output columns of `state` mode, in order.
pub const STATE_COLUMNS: [&str; 11] = [
    "p_pa",
    "t_k",
    "phase",
    "x",
    "rho_kg_m3",
    "h_j_kg",
    "s_j_kgk",
    "cp_j_kgk",
    "kappa",
    "viscosity_pa_s",
    "error",
];

/// Input columns of `saturation` mode: one of them per row.
pub const SATURATION_INPUTS: [&str; 2] = ["p_pa", "t_k"];

/// Input columns of `state` mode: `p_pa` and one of the others per row.
pub const STATE_INPUTS: [&str; 5] = ["p_pa", "t_k", "h_j_kg", "s_j_kgk", "x"];

/// Which calculation answers the rows.
#[derive(Debug, Clone, Copy, PartialEq, Eq, clap::ValueEnum)]
pub enum Model {
    /// The `no_std` kernel (f32 tables), called as firmware calls it.
    Kernel,
    /// The full IAPWS-IF97 formulation in f64 (`vapora_tables::if97`).
    Reference,
}

/// What each row asks for.
#[derive(Debug, Clone, Copy, PartialEq, Eq, clap::ValueEnum)]
pub enum Mode {
    /// Both saturated phases at `p_pa` or `t_k`.
    Saturation,
    /// Phase, dryness fraction and properties at `p_pa` and one more property.
    State,
}

impl Mode {
    /// The output columns.
    pub fn columns(self) -> &'static [&'static str] {
        match self {
            Self::Saturation => &SATURATION_COLUMNS,
            Self::State => &STATE_COLUMNS,
        }
    }

    /// The input columns.
    pub fn inputs(self) -> &'static [&'static str] {
        match self {
            Self::Saturation => &SATURATION_INPUTS,
            Self::State => &STATE_INPUTS,
        }
    }
}

/// One row being filled: a cell per output column of the mode.
struct Row {
    columns: &'static [&'static str],
    cells: Vec<String>,
    notes: Vec<String>,
}

impl Row {
    fn new(mode: Mode) -> Self {
        let columns = mode.columns();
        Self {
            columns,
            cells: vec![String::new(); columns.len()],
            notes: Vec::new(),
        }
    }

    fn set(&mut self, column: &str, text: String) {
        if let Some(i) = self.columns.iter().position(|c| *c == column) {
            if let Some(cell) = self.cells.get_mut(i) {
                *cell = text;
            }
        }
    }

    fn f32(&mut self, column: &str, value: f32) {
        if value.is_finite() {
            self.set(column, format!("{value}"));
        } else {
            self.notes.push(format!("{column} is not finite here"));
        }
    }

    fn f64(&mut self, column: &str, value: f64) {
        if value.is_finite() {
            self.set(column, format!("{value}"));
        } else {
            self.notes.push(format!("{column} is not finite here"));
        }
    }

    /// Whether a column is still empty (the given h or s stays as given).
    fn is_empty(&self, column: &str) -> bool {
        self.columns
            .iter()
            .position(|c| *c == column)
            .and_then(|i| self.cells.get(i))
            .is_some_and(|c| c.is_empty())
    }

    fn note(&mut self, text: impl Into<String>) {
        self.notes.push(text.into());
    }

    fn finish(mut self) -> Vec<String> {
        let error = self.notes.join("; ");
        self.set("error", error);
        self.cells
    }
}

/// The second property of a `state` row.
#[derive(Debug, Clone, Copy)]
enum Second {
    Temperature(f64),
    Enthalpy(f64),
    Entropy(f64),
    DrynessFraction(f64),
}

/// The trade's name of a phase, as written in the `phase` column.
pub fn phase_name(phase: &Phase) -> &'static str {
    match phase {
        Phase::SubcooledLiquid => "subcooled_liquid",
        Phase::SaturatedLiquid => "saturated_liquid",
        Phase::WetSteam { .. } => "wet_steam",
        Phase::SaturatedVapour => "saturated_vapour",
        Phase::SuperheatedVapour => "superheated_vapour",
        Phase::Supercritical => "supercritical",
    }
}

/// A row that is not evaluated: its input cells echoed, `message` in `error`.
fn rejected(mode: Mode, inputs: &[(&str, &str)], message: &str) -> Vec<String> {
    let mut row = Row::new(mode);
    for (column, text) in inputs {
        row.set(column, (*text).to_string());
    }
    row.note(message);
    row.finish()
}

/// Evaluates one row. `inputs` holds the non-empty input cells as
/// (column, text); the result has one cell per column of `mode`.
pub fn evaluate(mode: Mode, model: Model, inputs: &[(&str, &str)]) -> Vec<String> {
    let mut row = Row::new(mode);
    let mut values = Vec::new();
    for (column, text) in inputs {
        // Inputs are echoed as given, so a row can be recognised even when
        // its value cannot be read.
        row.set(column, (*text).to_string());
        match text.parse::<f64>() {
            Ok(v) => values.push((*column, v)),
            Err(_) => row.note(format!("{column}: cannot read '{text}' as a number")),
        }
    }
    if !row.notes.is_empty() {
        return row.finish();
    }
    let result = match mode {
        Mode::Saturation => saturation_row(&mut row, model, &values),
        Mode::State => state_row(&mut row, model, &values),
    };
    if let Err(message) = result {
        row.note(message);
    }
    row.finish()
}

type RowResult = Result<(), String>;

fn text(e: impl std::fmt::Display) -> String {
    e.to_string()
}

fn saturation_row(row: &mut Row, model: Model, values: &[(&str, f64)]) -> RowResult {
    let p = values.iter().find(|(c, _)| *c == "p_pa").map(|v| v.1);
    let t = values.iter().find(|(c, _)| *c == "t_k").map(|v| v.1);
    match (model, p, t) {
        (_, Some(_), Some(_)) => Err("give p_pa or t_k, not both".into()),
        (_, None, None) => Err("needs p_pa or t_k".into()),
        (Model::Kernel, Some(p), None) => {
            let s = saturated_state_at_pressure(AbsolutePressure::from_pa(p as f32).map_err(text)?)
                .map_err(text)?;
            row.f32("t_k", s.temperature.as_kelvin());
            kernel_saturated(row, &s);
            Ok(())
        }
        (Model::Kernel, None, Some(t)) => {
            let s =
                saturated_state_at_temperature(Temperature::from_kelvin(t as f32).map_err(text)?)
                    .map_err(text)?;
            row.f32("p_pa", s.pressure.as_pa());
            kernel_saturated(row, &s);
            Ok(())
        }
        (Model::Reference, Some(p), None) => {
            let s = saturation::at_pressure(p).map_err(text)?;
            row.f64("t_k", s.liquid.temperature_k);
            reference_saturated(row, &s);
            Ok(())
        }
        (Model::Reference, None, Some(t)) => {
            let s = saturation::at_temperature(t).map_err(text)?;
            row.f64("p_pa", s.liquid.pressure_pa);
            reference_saturated(row, &s);
            Ok(())
        }
    }
}

fn kernel_saturated(row: &mut Row, s: &vapora_kernel::saturation::SaturatedState) {
    row.f32("rho_liq_kg_m3", s.liquid.density_kg_m3);
    row.f32("rho_vap_kg_m3", s.vapour.density_kg_m3);
    row.f32("h_liq_j_kg", s.liquid.enthalpy_j_kg);
    row.f32("h_vap_j_kg", s.vapour.enthalpy_j_kg);
    row.f32("s_liq_j_kgk", s.liquid.entropy_j_kgk);
    row.f32("s_vap_j_kgk", s.vapour.entropy_j_kgk);
}

fn reference_saturated(row: &mut Row, s: &saturation::SaturatedStates) {
    row.f64("rho_liq_kg_m3", s.liquid.density_kg_m3);
    row.f64("rho_vap_kg_m3", s.vapour.density_kg_m3);
    row.f64("h_liq_j_kg", s.liquid.enthalpy_j_kg);
    row.f64("h_vap_j_kg", s.vapour.enthalpy_j_kg);
    row.f64("s_liq_j_kgk", s.liquid.entropy_j_kgk);
    row.f64("s_vap_j_kgk", s.vapour.entropy_j_kgk);
}

fn state_row(row: &mut Row, model: Model, values: &[(&str, f64)]) -> RowResult {
    let p = values
        .iter()
        .find(|(c, _)| *c == "p_pa")
        .map(|v| v.1)
        .ok_or("needs p_pa")?;
    let seconds: Vec<Second> = values
        .iter()
        .filter_map(|&(c, v)| match c {
            "t_k" => Some(Second::Temperature(v)),
            "h_j_kg" => Some(Second::Enthalpy(v)),
            "s_j_kgk" => Some(Second::Entropy(v)),
            "x" => Some(Second::DrynessFraction(v)),
            _ => None,
        })
        .collect();
    let [second] = seconds.as_slice() else {
        return Err(format!(
            "needs exactly one of t_k, h_j_kg, s_j_kgk, x besides p_pa (this row has {})",
            seconds.len()
        ));
    };
    match model {
        Model::Kernel => state_kernel(row, p, *second),
        Model::Reference => state_reference(row, p, *second),
    }
}

/// The message for a (p, T) point on the saturation line (within `band_k`).
fn on_line_message(
    t_k: impl std::fmt::Display,
    t_sat_k: impl std::fmt::Display,
    band_k: impl std::fmt::Display,
) -> String {
    format!(
        "t_k = {t_k} K is within {band_k} K of the saturation temperature {t_sat_k} K: \
         (p, T) does not fix the state on the saturation line; give h_j_kg, s_j_kgk or x"
    )
}

fn state_kernel(row: &mut Row, p_pa: f64, second: Second) -> RowResult {
    let p = AbsolutePressure::from_pa(p_pa as f32).map_err(text)?;
    let above_critical = p.as_pa() >= vapora_kernel::tables::saturation::CRITICAL_PRESSURE_PA;
    match second {
        Second::Temperature(t_k) => {
            let t = Temperature::from_kelvin(t_k as f32).map_err(text)?;
            if above_critical {
                row.set("phase", "supercritical".into());
            } else {
                let t_sat = saturation_temperature(p).map_err(text)?.as_kelvin();
                // The kernel cannot tell T from T_sat closer than its own
                // bound on T_sat.
                let band = accuracy_at_saturation_temperature_k(t_sat).temperature_k;
                let d = t.as_kelvin() - t_sat;
                if d.abs() <= band {
                    return Err(on_line_message(t_k, t_sat, band));
                }
                let phase = if d < 0.0 {
                    "subcooled_liquid"
                } else {
                    "superheated_vapour"
                };
                row.set("phase", phase.into());
            }
            let state = state_at_pressure_temperature(p, t).map_err(text)?;
            kernel_fluid(row, &state);
            Ok(())
        }
        Second::Enthalpy(h) => {
            let phase = phase_from_pressure_enthalpy(p, h as f32).map_err(text)?;
            kernel_phase(row, p, &phase, || state_at_pressure_enthalpy(p, h as f32))
        }
        Second::Entropy(s) => {
            let phase = phase_from_pressure_entropy(p, s as f32).map_err(text)?;
            kernel_phase(row, p, &phase, || state_at_pressure_entropy(p, s as f32))
        }
        Second::DrynessFraction(x) => {
            if above_critical {
                return Err("no wet steam at or above the critical pressure".into());
            }
            let w = wet_steam_at_pressure(p, x as f32).map_err(text)?;
            let phase = if w.dryness_fraction == 0.0 {
                Phase::SaturatedLiquid
            } else if w.dryness_fraction == 1.0 {
                Phase::SaturatedVapour
            } else {
                Phase::WetSteam {
                    dryness_fraction: w.dryness_fraction,
                }
            };
            row.set("phase", phase_name(&phase).into());
            row.f32("h_j_kg", w.enthalpy_j_kg);
            kernel_wet(row, p, &phase, &w)
        }
    }
}

/// Fills a (p, h) or (p, s) row from the kernel's phase: the saturation
/// calls in the dome (so the saturated band names the phase as the
/// reference model does), the single-phase call `single` outside it.
fn kernel_phase(
    row: &mut Row,
    p: AbsolutePressure,
    phase: &Phase,
    single: impl FnOnce() -> Result<FluidState, SinglePhaseError>,
) -> RowResult {
    row.set("phase", phase_name(phase).into());
    let Some(x) = phase.dryness_fraction() else {
        let state = single().map_err(text)?;
        kernel_fluid(row, &state);
        return Ok(());
    };
    let w = wet_steam_at_pressure(p, x).map_err(text)?;
    // The given h (or s) stays as given; the other one is computed.
    if row.is_empty("h_j_kg") {
        row.f32("h_j_kg", w.enthalpy_j_kg);
    }
    kernel_wet(row, p, phase, &w)
}

fn kernel_wet(
    row: &mut Row,
    p: AbsolutePressure,
    phase: &Phase,
    w: &vapora_kernel::mixture::WetSteam,
) -> RowResult {
    row.f32("t_k", w.temperature.as_kelvin());
    row.f32("x", w.dryness_fraction);
    row.f32("rho_kg_m3", w.density_kg_m3);
    if row.is_empty("s_j_kgk") {
        row.f32("s_j_kgk", w.entropy_j_kgk);
    }
    // cp is defined on the saturation line (cp' or cp''), not in wet steam.
    let cp = match phase {
        Phase::SaturatedLiquid => Some(saturated_state_at_pressure(p).map_err(text)?.liquid),
        Phase::SaturatedVapour => Some(saturated_state_at_pressure(p).map_err(text)?.vapour),
        _ => None,
    };
    if let Some(phase_properties) = cp {
        row.f32("cp_j_kgk", phase_properties.cp_j_kgk);
    }
    Ok(())
}

/// Fills the columns of a kernel single-phase result. The given h or s
/// stays as given; a state the single-phase call put in the dome (within
/// f32 rounding of the saturation band) fills the mixture columns.
fn kernel_fluid(row: &mut Row, state: &FluidState) {
    match state {
        FluidState::CompressedLiquid(s) | FluidState::SuperheatedVapour(s) => {
            row.f32("t_k", s.temperature.as_kelvin());
            row.f32("rho_kg_m3", s.density_kg_m3);
            if row.is_empty("h_j_kg") {
                row.f32("h_j_kg", s.enthalpy_j_kg);
            }
            if row.is_empty("s_j_kgk") {
                row.f32("s_j_kgk", s.entropy_j_kgk);
            }
            row.f32("cp_j_kgk", s.cp_j_kgk);
            row.f32("kappa", s.isentropic_exponent);
            row.f32("viscosity_pa_s", s.viscosity_pa_s);
        }
        FluidState::WetSteam(w) => {
            row.f32("t_k", w.temperature.as_kelvin());
            row.f32("x", w.dryness_fraction);
            row.f32("rho_kg_m3", w.density_kg_m3);
            if row.is_empty("h_j_kg") {
                row.f32("h_j_kg", w.enthalpy_j_kg);
            }
            if row.is_empty("s_j_kgk") {
                row.f32("s_j_kgk", w.entropy_j_kgk);
            }
        }
        other => row.note(format!("unexpected kernel state {other:?}")),
    }
}

/// Half-width of the saturated band in x, the kernel's, so both models name
/// the same phase for the same point.
fn band() -> f64 {
    f64::from(SATURATION_TOLERANCE)
}

fn state_reference(row: &mut Row, p_pa: f64, second: Second) -> RowResult {
    if !p_pa.is_finite() || p_pa <= 0.0 {
        return Err(format!("p_pa = {p_pa} is not a positive finite pressure"));
    }
    let above_critical = p_pa >= CRITICAL_PRESSURE_PA;
    match second {
        Second::Temperature(t_k) => {
            let phase = if above_critical {
                "supercritical"
            } else {
                let t_sat = region4::saturation_temperature_k(p_pa).map_err(text)?;
                if t_k == t_sat {
                    return Err(on_line_message(t_k, t_sat, 0.0));
                }
                if t_k < t_sat {
                    "subcooled_liquid"
                } else {
                    "superheated_vapour"
                }
            };
            let props = pt::properties_pt(p_pa, t_k).map_err(text)?;
            row.set("phase", phase.into());
            single_phase(row, &props);
            Ok(())
        }
        Second::Enthalpy(h) => reference_lever(row, p_pa, h, true),
        Second::Entropy(s) => reference_lever(row, p_pa, s, false),
        Second::DrynessFraction(x) => {
            if above_critical {
                return Err("no wet steam at or above the critical pressure".into());
            }
            if !(0.0..=1.0).contains(&x) {
                return Err(format!("dryness fraction {x} is outside [0, 1]"));
            }
            let sat = saturation::at_pressure(p_pa).map_err(text)?;
            let name = if x == 0.0 {
                "saturated_liquid"
            } else if x == 1.0 {
                "saturated_vapour"
            } else {
                "wet_steam"
            };
            row.set("phase", name.into());
            reference_wet(row, &sat, x, true, true);
            Ok(())
        }
    }
}

/// Fills every single-phase column from formulation properties.
fn single_phase(row: &mut Row, props: &Properties) {
    row.f64("t_k", props.temperature_k);
    row.f64("rho_kg_m3", props.density_kg_m3);
    if row.is_empty("h_j_kg") {
        row.f64("h_j_kg", props.enthalpy_j_kg);
    }
    if row.is_empty("s_j_kgk") {
        row.f64("s_j_kgk", props.entropy_j_kgk);
    }
    row.f64("cp_j_kgk", props.cp_j_kgk);
    row.f64("kappa", props.isentropic_exponent);
    match viscosity::viscosity_pa_s(props.density_kg_m3, props.temperature_k) {
        Ok(mu) => row.f64("viscosity_pa_s", mu),
        Err(e) => row.note(format!("viscosity: {e}")),
    }
}

/// Mixture columns at dryness fraction `x` (0 and 1 give the saturated
/// phase with its cp, κ and viscosity).
fn reference_wet(
    row: &mut Row,
    sat: &saturation::SaturatedStates,
    x: f64,
    fill_h: bool,
    fill_s: bool,
) {
    let (l, v) = (&sat.liquid, &sat.vapour);
    let lever = |a: f64, b: f64| a + x * (b - a);
    row.f64("t_k", l.temperature_k);
    row.f64("x", x);
    row.f64(
        "rho_kg_m3",
        1.0 / lever(l.specific_volume_m3_kg, v.specific_volume_m3_kg),
    );
    if fill_h {
        row.f64("h_j_kg", lever(l.enthalpy_j_kg, v.enthalpy_j_kg));
    }
    if fill_s {
        row.f64("s_j_kgk", lever(l.entropy_j_kgk, v.entropy_j_kgk));
    }
    let phase = if x == 0.0 {
        Some(l)
    } else if x == 1.0 {
        Some(v)
    } else {
        None
    };
    if let Some(props) = phase {
        row.f64("cp_j_kgk", props.cp_j_kgk);
        row.f64("kappa", props.isentropic_exponent);
        match viscosity::viscosity_pa_s(props.density_kg_m3, props.temperature_k) {
            Ok(mu) => row.f64("viscosity_pa_s", mu),
            Err(e) => row.note(format!("viscosity: {e}")),
        }
    }
}

/// A (p, h) or (p, s) row from the formulation: the lever rule on the
/// saturated states decides the phase (with the kernel's band around x = 0
/// and 1); outside the dome the temperature comes from the inversion.
fn reference_lever(row: &mut Row, p_pa: f64, y: f64, enthalpy: bool) -> RowResult {
    if !y.is_finite() {
        return Err(format!("{y} is not a finite number"));
    }
    let single = |row: &mut Row, phase: &str| -> RowResult {
        let (t, _) = if enthalpy {
            inverse::temperature_ph(p_pa, y)
        } else {
            inverse::temperature_ps(p_pa, y)
        }
        .map_err(text)?;
        let props = pt::properties_pt(p_pa, t).map_err(text)?;
        row.set("phase", phase.into());
        single_phase(row, &props);
        Ok(())
    };
    if p_pa >= CRITICAL_PRESSURE_PA {
        return single(row, "supercritical");
    }
    let sat = saturation::at_pressure(p_pa).map_err(text)?;
    let (y_l, y_v) = if enthalpy {
        (sat.liquid.enthalpy_j_kg, sat.vapour.enthalpy_j_kg)
    } else {
        (sat.liquid.entropy_j_kgk, sat.vapour.entropy_j_kgk)
    };
    let x = (y - y_l) / (y_v - y_l);
    let (name, x_reported) = if x < -band() {
        return single(row, "subcooled_liquid");
    } else if x <= band() {
        ("saturated_liquid", 0.0)
    } else if x < 1.0 - band() {
        ("wet_steam", x)
    } else if x <= 1.0 + band() {
        ("saturated_vapour", 1.0)
    } else {
        return single(row, "superheated_vapour");
    };
    row.set("phase", name.into());
    reference_wet(row, &sat, x_reported, !enthalpy, enthalpy);
    Ok(())
}

/// A CSV reader that tolerates ragged rows (reported per row), trims cells
/// and skips lines that start with `#` (comments naming a file's source).
fn reader(input: impl Read) -> csv::Reader<impl Read> {
    csv::ReaderBuilder::new()
        .flexible(true)
        .trim(csv::Trim::All)
        .comment(Some(b'#'))
        .from_reader(input)
}

fn headers(reader: &mut csv::Reader<impl Read>) -> Result<Vec<String>, Box<dyn Error>> {
    let names: Vec<String> = reader
        .byte_headers()?
        .iter()
        .map(|b| String::from_utf8_lossy(b).into_owned())
        .collect();
    let mut seen = BTreeSet::new();
    for n in &names {
        if !seen.insert(n.as_str()) {
            return Err(format!("column '{n}' appears twice in the header").into());
        }
    }
    Ok(names)
}

/// One data record: its line number and its cells as text.
struct Record {
    line: u64,
    cells: Vec<String>,
    /// Set when the record has a different number of fields than the header.
    shape_error: Option<String>,
}

fn records(
    reader: &mut csv::Reader<impl Read>,
    width: usize,
) -> impl Iterator<Item = Result<Record, csv::Error>> + '_ {
    reader.byte_records().map(move |r| {
        let r = r?;
        let line = r.position().map_or(0, |p| p.line());
        let cells: Vec<String> = r
            .iter()
            .map(|b| String::from_utf8_lossy(b).into_owned())
            .collect();
        let shape_error = (cells.len() != width).then(|| {
            format!(
                "line {line} has {} fields, the header has {width}",
                cells.len()
            )
        });
        Ok(Record {
            line,
            cells,
            shape_error,
        })
    })
}

/// Counts of one run.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub struct RunSummary {
    /// Rows read and written.
    pub rows: usize,
    /// Rows whose `error` cell is not empty.
    pub rows_with_error: usize,
}

/// Reads rows from `input`, writes one output row per input row to `output`
/// (header first), and warnings about ignored columns to `warnings`.
///
/// # Errors
/// I/O and CSV-framing errors, a header without any input column of the
/// mode, or a column named twice. Bad rows are not errors: they are
/// reported in their `error` cell.
pub fn run(
    mode: Mode,
    model: Model,
    input: impl Read,
    output: impl Write,
    mut warnings: impl Write,
) -> Result<RunSummary, Box<dyn Error>> {
    let mut reader = reader(input);
    let names = headers(&mut reader)?;
    let input_index: Vec<(usize, &'static str)> = mode
        .inputs()
        .iter()
        .filter_map(|c| names.iter().position(|n| n == c).map(|i| (i, *c)))
        .collect();
    if input_index.is_empty() {
        return Err(format!(
            "the header has none of the input columns {}",
            mode.inputs().join(", ")
        )
        .into());
    }
    for n in &names {
        if !mode.inputs().contains(&n.as_str()) {
            writeln!(
                warnings,
                "warning: column '{n}' is not an input of this mode; ignored"
            )?;
        }
    }
    let mut writer = csv::Writer::from_writer(output);
    writer.write_record(mode.columns())?;
    let mut summary = RunSummary::default();
    for record in records(&mut reader, names.len()) {
        let record = record?;
        let inputs: Vec<(&str, &str)> = input_index
            .iter()
            .filter_map(|&(i, c)| record.cells.get(i).map(|t| (c, t.as_str())))
            .filter(|(_, t)| !t.is_empty())
            .collect();
        let cells = match &record.shape_error {
            Some(message) => rejected(mode, &inputs, message),
            None => evaluate(mode, model, &inputs),
        };
        summary.rows += 1;
        if cells.last().is_some_and(|e| !e.is_empty()) {
            summary.rows_with_error += 1;
        }
        writer.write_record(&cells)?;
    }
    writer.flush()?;
    Ok(summary)
}

/// Suffix of an absolute tolerance column (same unit as the value).
pub const ABSOLUTE_TOLERANCE_SUFFIX: &str = "_tol";
/// Suffix of a relative tolerance column (a fraction of |expected|).
pub const RELATIVE_TOLERANCE_SUFFIX: &str = "_tol_rel";

/// Columns of the report written by [`compare`], one line per finding.
pub const COMPARE_COLUMNS: [&str; 8] = [
    "line",
    "label",
    "column",
    "expected",
    "computed",
    "deviation",
    "allowed",
    "problem",
];

/// Counts of one comparison.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub struct CompareSummary {
    /// Rows read.
    pub rows: usize,
    /// Expected values checked.
    pub values_checked: usize,
    /// Findings written (values out of tolerance or not checkable, rows
    /// with nothing to check).
    pub findings: usize,
    /// Rows with at least one finding.
    pub rows_failed: usize,
}

/// How one expected column is checked.
struct Expected {
    column: &'static str,
    value: usize,
    absolute: Option<usize>,
    relative: Option<usize>,
}

/// Checks a file of expected values: each row gives the inputs of `mode`
/// and expected outputs with tolerances; writes one report line per value
/// out of tolerance (or not checkable) to `output`.
///
/// Columns: an output column of `mode` is an expected value when it is not
/// an input, or when it has a tolerance column (so `t_k` with `t_k_tol` is
/// expected, `t_k` alone is an input). A numeric expected column needs
/// `<column>_tol` (absolute, in the column's unit) and/or
/// `<column>_tol_rel` (relative); the value passes when
/// |computed − expected| ≤ tol + tol_rel·|expected| (an empty tolerance
/// cell counts as 0, both empty is a finding). `phase` is compared as text.
/// Empty expected cells are not checked. Other columns (a tag, a comment)
/// label the report lines.
///
/// # Errors
/// I/O and CSV-framing errors and header problems (an expected column with
/// no tolerance column, a tolerance column of an unknown column, no input
/// column, a column named twice).
pub fn compare(
    mode: Mode,
    model: Model,
    input: impl Read,
    output: impl Write,
) -> Result<CompareSummary, Box<dyn Error>> {
    let mut reader = reader(input);
    let names = headers(&mut reader)?;
    let find = |n: &str| names.iter().position(|c| c == n);
    let outputs: Vec<&'static str> = mode
        .columns()
        .iter()
        .copied()
        .filter(|c| *c != "error")
        .collect();
    let mut known: BTreeSet<usize> = BTreeSet::new();
    let mut inputs = Vec::new();
    let mut expected = Vec::new();
    let mut phase_column = None;
    for &c in &outputs {
        let Some(i) = find(c) else { continue };
        known.insert(i);
        let absolute = find(&format!("{c}{ABSOLUTE_TOLERANCE_SUFFIX}"));
        let relative = find(&format!("{c}{RELATIVE_TOLERANCE_SUFFIX}"));
        known.extend(absolute);
        known.extend(relative);
        let has_tolerance = absolute.is_some() || relative.is_some();
        if c == "phase" {
            phase_column = Some(i);
        } else if mode.inputs().contains(&c) && !has_tolerance {
            inputs.push((i, c));
        } else if has_tolerance {
            expected.push(Expected {
                column: c,
                value: i,
                absolute,
                relative,
            });
        } else {
            return Err(format!(
                "expected column '{c}' has no tolerance column ('{c}{ABSOLUTE_TOLERANCE_SUFFIX}' or '{c}{RELATIVE_TOLERANCE_SUFFIX}')"
            )
            .into());
        }
    }
    for (i, n) in names.iter().enumerate() {
        let base = n
            .strip_suffix(RELATIVE_TOLERANCE_SUFFIX)
            .or_else(|| n.strip_suffix(ABSOLUTE_TOLERANCE_SUFFIX));
        if let Some(base) = base {
            if !known.contains(&i) {
                return Err(format!(
                    "tolerance column '{n}' belongs to '{base}', which is not a column of this mode or not in the header"
                )
                .into());
            }
        }
    }
    if inputs.is_empty() {
        return Err(format!(
            "the header has none of the input columns {} (a column with a tolerance column is an expected value, not an input)",
            mode.inputs().join(", ")
        )
        .into());
    }
    let error_column = find("error");
    let labels: Vec<usize> = (0..names.len())
        .filter(|i| !known.contains(i) && Some(*i) != error_column)
        .collect();

    let mut writer = csv::Writer::from_writer(output);
    writer.write_record(COMPARE_COLUMNS)?;
    let mut summary = CompareSummary::default();
    for record in records(&mut reader, names.len()) {
        let record = record?;
        summary.rows += 1;
        let cell = |i: usize| record.cells.get(i).map_or("", String::as_str);
        let label = labels
            .iter()
            .filter(|&&i| !cell(i).is_empty())
            .map(|&i| format!("{}={}", names.get(i).map_or("", String::as_str), cell(i)))
            .collect::<Vec<_>>()
            .join(";");
        let line = record.line.to_string();
        let mut findings: Vec<[String; 8]> = Vec::new();
        let mut finding = |column: &str, e: &str, c: &str, d: String, a: String, p: String| {
            findings.push([
                line.clone(),
                label.clone(),
                column.to_string(),
                e.to_string(),
                c.to_string(),
                d,
                a,
                p,
            ]);
        };
        if let Some(message) = &record.shape_error {
            finding("", "", "", String::new(), String::new(), message.clone());
        } else {
            let row_inputs: Vec<(&str, &str)> = inputs
                .iter()
                .map(|&(i, c)| (c, cell(i)))
                .filter(|(_, t)| !t.is_empty())
                .collect();
            let computed = evaluate(mode, model, &row_inputs);
            let out = |c: &str| {
                mode.columns()
                    .iter()
                    .position(|n| *n == c)
                    .and_then(|i| computed.get(i))
                    .map_or("", String::as_str)
            };
            let row_error = out("error");
            let why_empty = if row_error.is_empty() {
                "not computed".to_string()
            } else {
                row_error.to_string()
            };
            let mut checked = 0;
            if let Some(i) = phase_column {
                let e = cell(i);
                if !e.is_empty() {
                    checked += 1;
                    let c = out("phase");
                    if c.is_empty() {
                        finding(
                            "phase",
                            e,
                            c,
                            String::new(),
                            String::new(),
                            why_empty.clone(),
                        );
                    } else if c != e {
                        finding(
                            "phase",
                            e,
                            c,
                            String::new(),
                            String::new(),
                            "phase differs".into(),
                        );
                    }
                }
            }
            for x in &expected {
                let e_text = cell(x.value);
                if e_text.is_empty() {
                    continue;
                }
                checked += 1;
                let c_text = out(x.column);
                let tol = |i: Option<usize>| -> Result<f64, String> {
                    match i.map(cell).filter(|t| !t.is_empty()) {
                        None => Ok(0.0),
                        Some(t) => match t.parse::<f64>() {
                            Ok(v) if v >= 0.0 => Ok(v),
                            _ => Err(format!("tolerance '{t}' is not a number ≥ 0")),
                        },
                    }
                };
                let given = [x.absolute, x.relative]
                    .iter()
                    .any(|i| i.is_some_and(|i| !cell(i).is_empty()));
                let (e, a, r) = match (e_text.parse::<f64>(), tol(x.absolute), tol(x.relative)) {
                    (Err(_), _, _) => {
                        finding(
                            x.column,
                            e_text,
                            c_text,
                            String::new(),
                            String::new(),
                            format!("cannot read expected value '{e_text}' as a number"),
                        );
                        continue;
                    }
                    (_, Err(m), _) | (_, _, Err(m)) => {
                        finding(x.column, e_text, c_text, String::new(), String::new(), m);
                        continue;
                    }
                    (Ok(e), Ok(a), Ok(r)) => (e, a, r),
                };
                if !given {
                    finding(
                        x.column,
                        e_text,
                        c_text,
                        String::new(),
                        String::new(),
                        "no tolerance on this row".into(),
                    );
                    continue;
                }
                let allowed = a + r * e.abs();
                let Ok(c) = c_text.parse::<f64>() else {
                    finding(
                        x.column,
                        e_text,
                        c_text,
                        String::new(),
                        format!("{allowed:.3e}"),
                        why_empty.clone(),
                    );
                    continue;
                };
                let deviation = c - e;
                if deviation.is_nan() || deviation.abs() > allowed {
                    finding(
                        x.column,
                        e_text,
                        c_text,
                        format!("{deviation:.3e}"),
                        format!("{allowed:.3e}"),
                        "out of tolerance".into(),
                    );
                }
            }
            summary.values_checked += checked;
            if checked == 0 {
                finding(
                    "",
                    "",
                    "",
                    String::new(),
                    String::new(),
                    "no expected value on this row".into(),
                );
            }
        }
        if !findings.is_empty() {
            summary.rows_failed += 1;
        }
        summary.findings += findings.len();
        for f in &findings {
            writer.write_record(f)?;
        }
    }
    writer.flush()?;
    Ok(summary)
}
