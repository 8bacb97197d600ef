//! The committed single-phase error maps (`docs/accuracy-single-phase/*.svg`,
//! shown in the kernel README) are what the map command gives for the
//! tables now. On failure, regenerate with `single_phase_maps::REGENERATE`.

use vapora_host_tests::single_phase_maps::{cell_maxima, map_svg, REGENERATE, SHOWN};

#[test]
fn committed_single_phase_maps_are_current() {
    let cells = cell_maxima();
    for shown in &SHOWN {
        let path = format!(
            "{}/../docs/accuracy-single-phase/{}.svg",
            env!("CARGO_MANIFEST_DIR"),
            shown.stem
        );
        let committed = std::fs::read_to_string(&path)
            .unwrap_or_else(|e| panic!("{path}: {e}; generate with {REGENERATE}"));
        let now = map_svg(shown, &cells).unwrap();
        assert!(
            committed == now,
            "{path} is stale; regenerate with {REGENERATE}"
        );
    }
}
