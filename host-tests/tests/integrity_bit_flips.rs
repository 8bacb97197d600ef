//! The table self-test catches damaged tables: every single bit of every
//! table (start, inverse_step and every coefficient) is flipped in a copy,
//! one at a time, and the check the device runs (`check_checksums`, called
//! by `self_test` with the compiled tables) must name the damaged table.

use std::thread;

use vapora_kernel::integrity::{
    check_checksums, check_spot_points, self_test, IntegrityError, TableData, TableId, TableSet,
};
use vapora_kernel::spline::UniformCubicTable;
use vapora_kernel::tables::saturation as table;

#[test]
fn the_compiled_tables_pass_the_self_test() {
    assert_eq!(self_test(), Ok(()));
    assert_eq!(check_spot_points(), Ok(()));
    assert_eq!(check_checksums(&TableSet::compiled()), Ok(()));
}

/// The generated CRCs, recomputed here with the `crc` crate's table-driven
/// implementation (the kernel's is bitwise) over the bytes the kernel's
/// documentation names: the two must agree on layout and algorithm.
fn independent_crc<const P: usize>(t: &UniformCubicTable<P>) -> u32 {
    let mut bytes = Vec::new();
    bytes.extend_from_slice(&t.start.to_le_bytes());
    bytes.extend_from_slice(&t.inverse_step.to_le_bytes());
    for block in t.intervals {
        for c in block.iter().flatten() {
            bytes.extend_from_slice(&c.to_le_bytes());
        }
    }
    crc::Crc::<u32>::new(&crc::CRC_32_ISO_HDLC).checksum(&bytes)
}

#[test]
fn the_generated_crcs_match_an_independent_computation() {
    assert_eq!(independent_crc(&table::STATE_LOW), table::STATE_LOW_CRC32);
    assert_eq!(independent_crc(&table::STATE_HIGH), table::STATE_HIGH_CRC32);
    assert_eq!(
        independent_crc(&table::TEMPERATURE_LOW),
        table::TEMPERATURE_LOW_CRC32
    );
    assert_eq!(
        independent_crc(&table::TEMPERATURE_HIGH),
        table::TEMPERATURE_HIGH_CRC32
    );
}

/// A table's data as one flat list of f32 (start, inverse_step, coefficients).
fn flatten<const P: usize>(t: &UniformCubicTable<P>) -> Vec<f32> {
    let mut v = vec![t.start, t.inverse_step];
    for block in t.intervals {
        v.extend(block.iter().flatten());
    }
    v
}

fn unflatten<const P: usize>(v: &[f32]) -> (f32, f32, Vec<[[f32; 4]; P]>) {
    let blocks = v[2..]
        .chunks_exact(4 * P)
        .map(|chunk| {
            let mut block = [[0.0; 4]; P];
            for (q, c) in block.iter_mut().enumerate() {
                c.copy_from_slice(&chunk[4 * q..4 * q + 4]);
            }
            block
        })
        .collect();
    (v[0], v[1], blocks)
}

/// Flips every bit of the table `id` in turn (in a copy) and returns how
/// many flips `check_checksums` caught, naming `id`, out of how many.
fn flip_every_bit(id: TableId) -> (usize, usize) {
    let original = match id {
        TableId::StateLow => flatten(&table::STATE_LOW),
        TableId::StateHigh => flatten(&table::STATE_HIGH),
        TableId::TemperatureLow => flatten(&table::TEMPERATURE_LOW),
        TableId::TemperatureHigh => flatten(&table::TEMPERATURE_HIGH),
        other => panic!("table {other:?} not known to this test"),
    };
    let (mut caught, mut flips) = (0, 0);
    let mut damaged = original.clone();
    for word in 0..original.len() {
        for bit in 0..32 {
            damaged[word] = f32::from_bits(original[word].to_bits() ^ (1 << bit));
            let mut set = TableSet::compiled();
            // The copies must live while `set` borrows them.
            let (low9, high9, low1, high1);
            match id {
                TableId::StateLow | TableId::StateHigh => {
                    let (start, inverse_step, intervals) = unflatten::<9>(&damaged);
                    if id == TableId::StateLow {
                        low9 = intervals;
                        set.state_low.0 = TableData {
                            start,
                            inverse_step,
                            intervals: &low9,
                        };
                    } else {
                        high9 = intervals;
                        set.state_high.0 = TableData {
                            start,
                            inverse_step,
                            intervals: &high9,
                        };
                    }
                }
                _ => {
                    let (start, inverse_step, intervals) = unflatten::<1>(&damaged);
                    if id == TableId::TemperatureLow {
                        low1 = intervals;
                        set.temperature_low.0 = TableData {
                            start,
                            inverse_step,
                            intervals: &low1,
                        };
                    } else {
                        high1 = intervals;
                        set.temperature_high.0 = TableData {
                            start,
                            inverse_step,
                            intervals: &high1,
                        };
                    }
                }
            }
            flips += 1;
            if let Err(IntegrityError::ChecksumMismatch { table, .. }) = check_checksums(&set) {
                if table == id {
                    caught += 1;
                }
            }
        }
        damaged[word] = original[word];
    }
    (caught, flips)
}

#[test]
fn every_single_bit_flip_in_every_table_is_caught() {
    // Two threads: the machine has two cores.
    let handles: Vec<_> = [
        vec![TableId::StateLow, TableId::TemperatureHigh],
        vec![TableId::StateHigh, TableId::TemperatureLow],
    ]
    .into_iter()
    .map(|ids| {
        thread::spawn(move || {
            ids.into_iter()
                .map(|id| (id, flip_every_bit(id)))
                .collect::<Vec<_>>()
        })
    })
    .collect();
    let mut total = (0, 0);
    for h in handles {
        for (id, (caught, flips)) in h.join().unwrap() {
            println!("{id}: {caught} of {flips} single-bit flips caught");
            assert_eq!(
                caught,
                flips,
                "table {id}: {} flips not caught",
                flips - caught
            );
            total.0 += caught;
            total.1 += flips;
        }
    }
    println!(
        "all tables: {} of {} single-bit flips caught",
        total.0, total.1
    );
    assert!(total.1 > 0);
}

#[test]
fn a_damaged_crc_constant_is_caught_too() {
    for bit in 0..32 {
        let mut set = TableSet::compiled();
        set.temperature_high.1 ^= 1 << bit;
        assert!(matches!(
            check_checksums(&set),
            Err(IntegrityError::ChecksumMismatch {
                table: TableId::TemperatureHigh,
                ..
            })
        ));
    }
}
