//! `vapora-regress`: the plant regression tool (README, "Regression tool").
//!
//! Reads a CSV of plant points (a file or standard input), writes a CSV of
//! saturated or state properties to standard output, or checks a CSV of
//! expected values with tolerances. Exit status: 0 done (bad rows are
//! reported in their `error` cell), 1 a compare found values out of
//! tolerance, 2 a usage, header or I/O error.
#![forbid(unsafe_code)]

use std::fs::File;
use std::io::{self, Read};
use std::path::PathBuf;
use std::process::ExitCode;

use clap::{Parser, Subcommand};
use vapora_host_tests::regress::{compare, run, Mode, Model};

/// Steam and water properties of plant points from the vapora kernel or the
/// full IAPWS-IF97 formulation, CSV in and CSV out (SI units in the column
/// names).
#[derive(Parser)]
#[command(name = "vapora-regress", version)]
struct Cli {
    #[command(subcommand)]
    command: Command,
    /// Which calculation answers: the f32 kernel or the f64 formulation.
    #[arg(long, value_enum, default_value_t = Model::Kernel, global = true)]
    model: Model,
    /// CSV file to read (default: standard input).
    #[arg(long, global = true)]
    input: Option<PathBuf>,
}

#[derive(Subcommand)]
enum Command {
    /// Both saturated phases at each row's p_pa or t_k.
    Saturation,
    /// Phase, dryness fraction and properties at each row's p_pa and one of
    /// t_k, h_j_kg, s_j_kgk, x.
    State,
    /// Check expected values (with COLUMN_tol / COLUMN_tol_rel
    /// tolerances) and list every value out of tolerance.
    Compare {
        /// Which mode's inputs and outputs the expected file holds.
        #[arg(long, value_enum)]
        mode: Mode,
    },
}

fn main() -> ExitCode {
    let cli = Cli::parse();
    let input: Box<dyn Read> = match &cli.input {
        Some(path) => match File::open(path) {
            Ok(f) => Box::new(io::BufReader::new(f)),
            Err(e) => {
                eprintln!("vapora-regress: cannot open {}: {e}", path.display());
                return ExitCode::from(2);
            }
        },
        None => Box::new(io::stdin().lock()),
    };
    let stdout = io::stdout().lock();
    match cli.command {
        Command::Saturation | Command::State => {
            let mode = match cli.command {
                Command::Saturation => Mode::Saturation,
                _ => Mode::State,
            };
            match run(mode, cli.model, input, stdout, io::stderr()) {
                Ok(s) => {
                    if s.rows_with_error > 0 {
                        eprintln!(
                            "vapora-regress: {} rows, {} with a message in 'error'",
                            s.rows, s.rows_with_error
                        );
                    }
                    ExitCode::SUCCESS
                }
                Err(e) => {
                    eprintln!("vapora-regress: {e}");
                    ExitCode::from(2)
                }
            }
        }
        Command::Compare { mode } => match compare(mode, cli.model, input, stdout) {
            Ok(s) => {
                eprintln!(
                    "vapora-regress compare: {} rows, {} values checked, {} rows failed ({} findings)",
                    s.rows, s.values_checked, s.rows_failed, s.findings
                );
                if s.findings > 0 {
                    ExitCode::FAILURE
                } else {
                    ExitCode::SUCCESS
                }
            }
            Err(e) => {
                eprintln!("vapora-regress: {e}");
                ExitCode::from(2)
            }
        },
    }
}
