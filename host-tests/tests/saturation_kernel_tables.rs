//! The committed tables are exactly what the generator writes, untouched:
//! regenerating with the settings in the header gives the same bytes, and
//! the checksum in the header matches the content.

use vapora_tables::generator::emit::{checksum, emit, CHECKSUM_PREFIX};
use vapora_tables::generator::{generate, iapws97::Iapws97, measure::measure, Config};

const COMMITTED: &str = include_str!("../../kernel/src/tables/saturation.rs");

fn settings_line() -> &'static str {
    COMMITTED
        .lines()
        .find_map(|l| l.strip_prefix("// Settings: "))
        .expect("the generated header names its settings")
}

#[test]
fn regenerating_gives_the_committed_file_byte_for_byte() {
    let config = Config::parse(settings_line()).expect("settings parse");
    let g = generate(&config, &Iapws97).expect("generation succeeds");
    let m = measure(&g, &Iapws97).expect("measurement succeeds");
    let text = emit(&g, &m);
    if text != COMMITTED {
        let first = text
            .lines()
            .zip(COMMITTED.lines())
            .position(|(a, b)| a != b);
        panic!(
            "regenerated tables differ from kernel/src/tables/saturation.rs (first differing line: {first:?}); \
             regenerate with the command in its header"
        );
    }
}

#[test]
fn header_checksum_matches_the_content() {
    let start = COMMITTED
        .find(CHECKSUM_PREFIX)
        .expect("checksum line present");
    let line_end = start + COMMITTED[start..].find('\n').expect("line ends");
    let stated = u32::from_str_radix(&COMMITTED[start + CHECKSUM_PREFIX.len()..line_end], 16)
        .expect("hex checksum");
    let body = &COMMITTED[line_end + 1..];
    assert_eq!(
        checksum(body.as_bytes()),
        stated,
        "content was edited after generation"
    );
}

#[test]
fn every_table_has_intervals_and_all_fit_the_flash_budget() {
    use vapora_kernel::tables::saturation as t;
    assert!(!t::STATE_LOW.intervals.is_empty());
    assert!(!t::STATE_HIGH.intervals.is_empty());
    assert!(!t::TEMPERATURE_LOW.intervals.is_empty());
    assert!(!t::TEMPERATURE_HIGH.intervals.is_empty());
    let bytes = core::mem::size_of_val(t::STATE_LOW.intervals)
        + core::mem::size_of_val(t::STATE_HIGH.intervals)
        + core::mem::size_of_val(t::TEMPERATURE_LOW.intervals)
        + core::mem::size_of_val(t::TEMPERATURE_HIGH.intervals);
    println!("saturation table coefficients: {bytes} bytes");
    // Issue 3: all default saturation tables together at most 24 KiB.
    assert!(bytes <= 24 * 1024, "{bytes} bytes");
}
