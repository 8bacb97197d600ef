//! `vapora-single-phase-maps`: writes the SVG error maps of the single-phase
//! kernel over (p, T), `docs/accuracy-single-phase/<property>.svg`.
//!
//! Usage: `vapora-single-phase-maps [DOCS_DIR]` (default: the workspace's `docs/`).
#![forbid(unsafe_code)]

use std::error::Error;
use std::path::PathBuf;

use vapora_host_tests::single_phase_maps::{cell_maxima, map_svg, SHOWN};

const WORKSPACE: &str = concat!(env!("CARGO_MANIFEST_DIR"), "/..");

fn main() -> Result<(), Box<dyn Error>> {
    let docs = std::env::args_os()
        .nth(1)
        .map(PathBuf::from)
        .unwrap_or_else(|| PathBuf::from(WORKSPACE).join("docs"));
    std::fs::create_dir_all(docs.join("accuracy-single-phase"))?;
    let cells = cell_maxima();
    for shown in &SHOWN {
        let path = docs
            .join("accuracy-single-phase")
            .join(format!("{}.svg", shown.stem));
        std::fs::write(&path, map_svg(shown, &cells)?)?;
        println!("wrote {}", path.display());
    }
    Ok(())
}
