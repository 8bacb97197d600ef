//! The committed accuracy report (`docs/accuracy.md`, `docs/accuracy/*.svg`,
//! shown in README) is what the report command gives for the tables now,
//! so README cannot go stale. On failure, regenerate with the command in
//! the file's header and commit the result.

use vapora_host_tests::accuracy::Grid;
use vapora_host_tests::report::{
    accuracy_markdown, error_curves, plot_stems, plot_svg, readme_with_table, REGENERATE,
};

const DOCS: &str = concat!(env!("CARGO_MANIFEST_DIR"), "/../docs");

fn committed(path: &str) -> String {
    std::fs::read_to_string(format!("{DOCS}/{path}"))
        .unwrap_or_else(|e| panic!("docs/{path}: {e}; generate it with {REGENERATE}"))
}

#[test]
fn committed_accuracy_table_is_current() {
    let now = accuracy_markdown(&Grid::default());
    let file = committed("accuracy.md");
    if file != now {
        let first = file
            .lines()
            .zip(now.lines())
            .find(|(a, b)| a != b)
            .map_or_else(
                || "(lengths differ)".to_string(),
                |(a, b)| format!("committed: {a}\nnow:       {b}"),
            );
        panic!("docs/accuracy.md is stale; regenerate with {REGENERATE}\n{first}");
    }
    let readme = committed("../README.md");
    let updated = readme_with_table(&readme, &now).expect("README has the accuracy table marks");
    assert!(
        readme == updated,
        "the table in README's Accuracy section is stale; regenerate with {REGENERATE}"
    );
}

#[test]
fn committed_accuracy_plots_are_current() {
    let curves = error_curves(&Grid::default());
    let stems: Vec<&str> = plot_stems().collect();
    assert_eq!(curves.len(), stems.len());
    for curve in &curves {
        assert!(!curve.below.is_empty(), "{}: no points plotted", curve.stem);
        let path = format!("accuracy/{}.svg", curve.stem);
        assert!(
            committed(&path) == plot_svg(curve).expect("plot"),
            "docs/{path} is stale; regenerate with {REGENERATE}"
        );
    }
    // The plots drawn are exactly the committed ones: no stale extra file.
    let mut files: Vec<String> = std::fs::read_dir(format!("{DOCS}/accuracy"))
        .expect("docs/accuracy")
        .map(|e| e.expect("entry").file_name().to_string_lossy().into_owned())
        .collect();
    files.sort();
    let mut expected: Vec<String> = stems.iter().map(|s| format!("{s}.svg")).collect();
    expected.sort();
    assert_eq!(files, expected);
}

#[test]
fn report_figures_agree_with_the_accuracy_test_bounds() {
    // The table shows the measured maxima below the requirement:
    // every "measured" figure must be at most its "required" one where one
    // is stated (the accuracy test proves the same on the same grid; this
    // keeps the published table from showing a failing figure).
    let file = committed("accuracy.md");
    let rows: Vec<&str> = file
        .lines()
        .filter(|l| l.starts_with("| ") && !l.starts_with("| property"))
        .collect();
    assert_eq!(rows.len(), 11, "{file}");
    for row in rows {
        let cells: Vec<&str> = row.split('|').map(str::trim).collect();
        for (required, measured) in [(cells[3], cells[4]), (cells[6], cells[7])] {
            let Some(r) = required.strip_prefix("≤ ") else {
                continue;
            };
            let (r, m): (f64, f64) = (r.parse().unwrap(), measured.parse().unwrap());
            assert!(m <= r, "{row}");
        }
    }
}
