//! The committed single-phase tables are exactly what the generator writes:
//! regenerating with the settings in the header gives the same bytes, the
//! header checksum matches the content, and the tables fit the flash budget
//! of issue 5 (160 KiB).

use vapora_tables::generator::emit::{checksum, CHECKSUM_PREFIX};
use vapora_tables::generator::single_phase::{
    emit_single_phase, generate_single_phase, SinglePhaseConfig,
};

const COMMITTED: &str = include_str!("../../kernel/src/tables/single_phase.rs");

#[test]
fn regenerating_gives_the_committed_single_phase_file_byte_for_byte() {
    let settings = COMMITTED
        .lines()
        .find_map(|l| l.strip_prefix("// Settings: "))
        .expect("settings line");
    let config = SinglePhaseConfig::parse(settings).expect("settings parse");
    assert_eq!(
        config,
        SinglePhaseConfig::default(),
        "the committed file uses the defaults"
    );
    let g = generate_single_phase(&config).expect("generation succeeds");
    let text = emit_single_phase(&g);
    if text != COMMITTED {
        let first = text
            .lines()
            .zip(COMMITTED.lines())
            .position(|(a, b)| a != b);
        panic!(
            "regenerated tables differ from kernel/src/tables/single_phase.rs (first differing line: {first:?}); \
             regenerate with the command in its header"
        );
    }
    assert!(g.size_bytes() <= 160 * 1024, "{} bytes", g.size_bytes());
}

#[test]
fn single_phase_header_checksum_matches_the_content() {
    let start = COMMITTED.find(CHECKSUM_PREFIX).expect("checksum line");
    let line_end = start + COMMITTED[start..].find('\n').expect("line ends");
    let stated =
        u32::from_str_radix(&COMMITTED[start + CHECKSUM_PREFIX.len()..line_end], 16).unwrap();
    assert_eq!(checksum(&COMMITTED.as_bytes()[line_end + 1..]), stated);
}

#[test]
fn every_sheet_is_complete_and_all_fit_the_budget() {
    use vapora_kernel::tables::single_phase as t;
    let mut bytes = 0;
    for s in [
        &t::VAPOUR_LOW,
        &t::LIQUID_LOW,
        &t::LIQUID_HIGH,
        &t::LIQUID_NEAR_CRITICAL,
        &t::VAPOUR_NEAR_CRITICAL,
        &t::VAPOUR_HIGH,
    ] {
        for (len, nx, ny) in [
            (
                s.properties.coefficients.len(),
                s.properties.x_intervals,
                s.properties.y_intervals,
            ),
            (
                s.y_of_enthalpy.coefficients.len(),
                s.y_of_enthalpy.x_intervals,
                s.y_of_enthalpy.y_intervals,
            ),
            (
                s.y_of_entropy.coefficients.len(),
                s.y_of_entropy.x_intervals,
                s.y_of_entropy.y_intervals,
            ),
        ] {
            assert_eq!(len, (nx as usize + 3) * (ny as usize + 3));
        }
        bytes += core::mem::size_of_val(s.properties.coefficients)
            + core::mem::size_of_val(s.y_of_enthalpy.coefficients)
            + core::mem::size_of_val(s.y_of_entropy.coefficients);
    }
    println!("single-phase coefficient flash: {bytes} bytes");
    assert!(bytes <= 160 * 1024);
}

#[test]
fn a_small_envelope_can_be_built() {
    // A small part's envelope: 0.1 to 4 MPa, 100 to 450 °C.
    let mut c = SinglePhaseConfig::default();
    for (k, v) in [
        ("pressure_min_pa", "1e5"),
        ("pressure_max_pa", "4e6"),
        ("temperature_min_k", "373.15"),
        ("temperature_max_k", "723.15"),
    ] {
        c.set(k, v).unwrap();
    }
    let g = generate_single_phase(&c).expect("small envelope");
    assert!(
        g.size_bytes()
            < generate_single_phase(&SinglePhaseConfig::default())
                .unwrap()
                .size_bytes()
    );
}
