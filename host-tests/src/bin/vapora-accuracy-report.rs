//! `vapora-accuracy-report`: measures the saturation kernel against the f64
//! formulation and writes `docs/accuracy.md` and `docs/accuracy/*.svg`,
//! updates the table in README's "Accuracy" section (between its marks),
//! and prints the measured maxima.
//!
//! Usage: `vapora-accuracy-report [DOCS_DIR]` (default: the workspace's
//! `docs/`; README is updated only then).
#![forbid(unsafe_code)]

use std::error::Error;
use std::path::PathBuf;

use vapora_host_tests::accuracy::Grid;
use vapora_host_tests::report::{accuracy_markdown, error_curves, plot_svg, readme_with_table};

const WORKSPACE: &str = concat!(env!("CARGO_MANIFEST_DIR"), "/..");

fn main() -> Result<(), Box<dyn Error>> {
    let given = std::env::args_os().nth(1).map(PathBuf::from);
    let docs = given
        .clone()
        .unwrap_or_else(|| PathBuf::from(WORKSPACE).join("docs"));
    let grid = Grid::default();
    let markdown = accuracy_markdown(&grid);
    std::fs::create_dir_all(docs.join("accuracy"))?;
    let md_path = docs.join("accuracy.md");
    std::fs::write(&md_path, &markdown)?;
    println!("{markdown}");
    println!("wrote {}", md_path.display());
    for curve in error_curves(&grid) {
        let path = docs.join("accuracy").join(format!("{}.svg", curve.stem));
        std::fs::write(&path, plot_svg(&curve)?)?;
        println!("wrote {}", path.display());
    }
    if given.is_none() {
        let path = PathBuf::from(WORKSPACE).join("README.md");
        let readme = std::fs::read_to_string(&path)?;
        let updated = readme_with_table(&readme, &markdown)
            .ok_or("README.md has no accuracy table marks; table not updated")?;
        std::fs::write(&path, updated)?;
        println!("updated the table in {}", path.display());
    }
    Ok(())
}
