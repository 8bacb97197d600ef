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

fn run() -> Result<(), String> {
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
