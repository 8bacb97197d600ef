//! `vapora-generate`: writes the kernel's saturation tables from the f64
//! IAPWS-IF97 formulation.
//!
//! ```text
//! vapora-generate [--output FILE] [--SETTING VALUE]...
//! ```
//! Without `--output` the source goes to standard output. Every setting of
//! `vapora_tables::generator::Config` can be given with dashes for
//! underscores, e.g. `--temperature-min-k 373.15 --temperature-max-k 473.15
//! --state-intervals-low 16` for a small table covering 1 to 15.5 bar(a)
//! only. With `--accuracy-target FACTOR` the interval counts and octave bits
//! become a starting point: they are scaled (see
//! `vapora_tables::generator::fit_to_target`) and the smallest table whose
//! generator measurement meets FACTOR × the project's accuracy table (1 =
//! the table) is written. The measured maxima go to
//! standard error.
//!
//! The committed file is regenerated with
//! `cargo run -p vapora-tables --features generator --bin vapora-generate -- --output kernel/src/tables/saturation.rs`
//! plus the settings named in its header.

use std::process::ExitCode;

use vapora_tables::generator::{emit, fit_to_target, generate, iapws97::Iapws97, measure, Config};

fn run_single_phase(mut args: impl Iterator<Item = String>) -> Result<(), String> {
    use vapora_tables::generator::single_phase as sp;
    let mut config = sp::SinglePhaseConfig::default();
    let mut output: Option<String> = None;
    let mut measure_points = 0usize;
    while let Some(flag) = args.next() {
        let value = args.next().ok_or_else(|| format!("{flag} needs a value"))?;
        if flag == "--output" {
            output = Some(value);
        } else if flag == "--measure" {
            measure_points = value
                .parse()
                .map_err(|_| format!("bad --measure {value}"))?;
        } else if let Some(key) = flag.strip_prefix("--") {
            config.set(&key.replace('-', "_"), &value)?;
        } else {
            return Err(format!("unexpected argument {flag}"));
        }
    }
    let g = sp::generate_single_phase(&config)?;
    eprintln!("settings: {}", g.config.describe());
    eprintln!(
        "envelope: {} Pa to {} Pa, {} K to {} K",
        g.limits.pressure_min_pa,
        g.limits.pressure_max_pa,
        g.limits.temperature_min_k,
        g.limits.temperature_max_k
    );
    eprintln!(
        "coefficient flash: {} bytes ({:.1} KiB)",
        g.size_bytes(),
        g.size_bytes() as f64 / 1024.0
    );
    for s in &g.sheets {
        eprintln!("  {:22} {:6} bytes", s.kind.name(), s.size_bytes());
    }
    if measure_points > 0 {
        let m = sp::measure_single_phase(&g, measure_points)?;
        for (zone, z) in [
            "far from critical",
            "ring (15 K / 3 MPa)",
            "box (5 K / 1 MPa)",
        ]
        .iter()
        .zip(m)
        {
            eprintln!(
                "measured, {zone}: rho {:.2e} h {:.2e} J/kg s {:.2e} cp {:.2e} w {:.2e} mu {:.2e} T(p,h) {:.2e} K T(p,s) {:.2e} K",
                z[0], z[1], z[2], z[3], z[4], z[5], z[6], z[7]
            );
        }
    }
    let text = sp::emit_single_phase(&g);
    match output {
        Some(path) => std::fs::write(&path, text).map_err(|e| format!("writing {path}: {e}")),
        None => {
            print!("{text}");
            Ok(())
        }
    }
}

fn run() -> Result<(), String> {
    let mut peek = std::env::args().skip(1).peekable();
    if peek.peek().map(String::as_str) == Some("single-phase") {
        return run_single_phase(peek.skip(1));
    }
    let mut config = Config::default();
    let mut output: Option<String> = None;
    let mut target: Option<f64> = None;
    let mut args = std::env::args().skip(1);
    while let Some(flag) = args.next() {
        let value = args.next().ok_or_else(|| format!("{flag} needs a value"))?;
        if flag == "--output" {
            output = Some(value);
        } else if flag == "--accuracy-target" {
            target = Some(
                value
                    .parse()
                    .map_err(|_| format!("bad accuracy target {value}"))?,
            );
        } else if let Some(key) = flag.strip_prefix("--") {
            config
                .set(&key.replace('-', "_"), &value)
                .map_err(|e| e.to_string())?;
        } else {
            return Err(format!("unexpected argument {flag}"));
        }
    }
    let (g, m) = match target {
        Some(factor) => fit_to_target(&config, factor, &Iapws97).map_err(|e| e.to_string())?,
        None => {
            let g = generate(&config, &Iapws97).map_err(|e| e.to_string())?;
            let m = measure::measure(&g, &Iapws97).map_err(|e| e.to_string())?;
            (g, m)
        }
    };
    eprintln!("settings: {}", g.config.describe());
    eprintln!("coefficient flash: {} bytes", g.size_bytes());
    for (zone, z) in [
        ("below Tc - 1 K", &m.below_near_critical),
        ("Tc - 1 K to Tc - 0.01 K", &m.near_critical),
    ] {
        eprintln!("measured maxima, {zone}:");
        for (name, value) in z.fields() {
            eprintln!("  {name:26} {value:.3e}");
        }
    }
    let text = emit::emit(&g, &m);
    match output {
        Some(path) => std::fs::write(&path, text).map_err(|e| format!("writing {path}: {e}")),
        None => {
            print!("{text}");
            Ok(())
        }
    }
}

fn main() -> ExitCode {
    match run() {
        Ok(()) => ExitCode::SUCCESS,
        Err(e) => {
            eprintln!("vapora-generate: {e}");
            ExitCode::FAILURE
        }
    }
}
