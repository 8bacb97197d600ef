//! The table self-test catches damaged tables: every single bit of every
//! table (start, inverse_step and every coefficient) is flipped in a copy,
//! one at a time, and the check the device runs (`check_checksums`, called
//! by `self_test` with the compiled tables) must name the damaged table.

use std::thread;

use vapora_kernel::integrity::{
    check_checksums, check_spot_points, self_test, IntegrityError, TableData, TableId, TableSet,
};
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
fn independent_crc<const P: usize>(header: [u32; 2], intervals: &[[[f32; 4]; P]]) -> u32 {
    let bytes: Vec<u8> = words(header, intervals)
        .iter()
        .flat_map(|w| w.to_le_bytes())
        .collect();
    crc::Crc::<u32>::new(&crc::CRC_32_ISO_HDLC).checksum(&bytes)
}

#[test]
fn the_generated_crcs_match_an_independent_computation() {
    let (s, t) = (&table::STATE_LOW, &table::TEMPERATURE_LOW);
    assert_eq!(
        independent_crc([s.start.to_bits(), s.inverse_step.to_bits()], s.intervals),
        table::STATE_LOW_CRC32
    );
    assert_eq!(
        independent_crc([t.shift, t.first], t.intervals),
        table::TEMPERATURE_LOW_CRC32
    );
    let (s, t) = (&table::STATE_HIGH, &table::TEMPERATURE_HIGH);
    assert_eq!(
        independent_crc([s.start.to_bits(), s.inverse_step.to_bits()], s.intervals),
        table::STATE_HIGH_CRC32
    );
    assert_eq!(
        independent_crc([t.shift, t.first], t.intervals),
        table::TEMPERATURE_HIGH_CRC32
    );
}

/// A table's data as one flat list of 32-bit words: the header, then the
/// bit pattern of every coefficient.
fn words<const P: usize>(header: [u32; 2], intervals: &[[[f32; 4]; P]]) -> Vec<u32> {
    let mut v = header.to_vec();
    for block in intervals {
        v.extend(block.iter().flatten().map(|c| c.to_bits()));
    }
    v
}

fn unflatten<const P: usize>(v: &[u32]) -> ([u32; 2], Vec<[[f32; 4]; P]>) {
    let blocks = v[2..]
        .chunks_exact(4 * P)
        .map(|chunk| {
            let mut block = [[0.0; 4]; P];
            for (q, c) in block.iter_mut().enumerate() {
                for (k, x) in c.iter_mut().enumerate() {
                    *x = f32::from_bits(chunk[4 * q + k]);
                }
            }
            block
        })
        .collect();
    ([v[0], v[1]], blocks)
}

/// Flips every bit of the table `id` in turn (in a copy) and returns how
/// many flips `check_checksums` caught, naming `id`, out of how many.
fn flip_every_bit(id: TableId) -> (usize, usize) {
    let compiled = TableSet::compiled();
    let original = match id {
        TableId::StateLow => words(compiled.state_low.0.header, compiled.state_low.0.intervals),
        TableId::StateHigh => words(
            compiled.state_high.0.header,
            compiled.state_high.0.intervals,
        ),
        TableId::TemperatureLow => words(
            compiled.temperature_low.0.header,
            compiled.temperature_low.0.intervals,
        ),
        TableId::TemperatureHigh => words(
            compiled.temperature_high.0.header,
            compiled.temperature_high.0.intervals,
        ),
        other => panic!("table {other:?} not known to this test"),
    };
    let (mut caught, mut flips) = (0, 0);
    let mut damaged = original.clone();
    for word in 0..original.len() {
        for bit in 0..32 {
            damaged[word] = original[word] ^ (1 << bit);
            let mut set = TableSet::compiled();
            // The copies must live while `set` borrows them.
            let (nine, one);
            match id {
                TableId::StateLow | TableId::StateHigh => {
                    let (header, intervals) = unflatten::<9>(&damaged);
                    nine = intervals;
                    let data = TableData {
                        header,
                        intervals: &nine,
                    };
                    if id == TableId::StateLow {
                        set.state_low.0 = data;
                    } else {
                        set.state_high.0 = data;
                    }
                }
                _ => {
                    let (header, intervals) = unflatten::<1>(&damaged);
                    one = intervals;
                    let data = TableData {
                        header,
                        intervals: &one,
                    };
                    if id == TableId::TemperatureLow {
                        set.temperature_low.0 = data;
                    } else {
                        set.temperature_high.0 = data;
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

/// A copy of `data` with bit `bit` of word `word` flipped (words: the four
/// header words, then the coefficients in storage order).
fn flipped<const Q: usize>(
    data: &vapora_kernel::integrity::SheetData<'_, Q>,
    word: usize,
    bit: u32,
) -> ([u32; 4], Vec<[f32; Q]>) {
    let mut header = data.header;
    let mut coefficients = data.coefficients.to_vec();
    if word < 4 {
        header[word] ^= 1 << bit;
    } else {
        let w = word - 4;
        let c = &mut coefficients[w / Q][w % Q];
        *c = f32::from_bits(c.to_bits() ^ (1 << bit));
    }
    (header, coefficients)
}

#[test]
fn sampled_bit_flips_in_every_single_phase_sheet_are_caught() {
    use vapora_kernel::integrity::{check_single_phase_checksums, SheetData, SinglePhaseTables};
    assert_eq!(
        check_single_phase_checksums(&SinglePhaseTables::compiled()),
        Ok(())
    );
    // Every bit of the header words and of every 149th coefficient word
    // (about 60 000 flips of 160 KiB would take minutes with a bitwise CRC;
    // a CRC-32 catches every single-bit error wherever it is, the sample
    // shows the data really is covered).
    let (mut caught, mut flips) = (0, 0);
    for index in 0..6 {
        let compiled = SinglePhaseTables::compiled();
        let id = compiled.sheets[index].table;
        for part in 0..3 {
            let words = 4 + match part {
                0 => compiled.sheets[index].properties.coefficients.len() * 6,
                1 => compiled.sheets[index].y_of_enthalpy.coefficients.len(),
                _ => compiled.sheets[index].y_of_entropy.coefficients.len(),
            };
            for word in (0..4).chain((4..words).step_by(149)) {
                for bit in 0..32 {
                    let mut set = SinglePhaseTables::compiled();
                    let sheet = &mut set.sheets[index];
                    let (six, one);
                    match part {
                        0 => {
                            let (header, c) = flipped(&sheet.properties, word, bit);
                            six = c;
                            sheet.properties = SheetData {
                                header,
                                coefficients: &six,
                            };
                        }
                        1 => {
                            let (header, c) = flipped(&sheet.y_of_enthalpy, word, bit);
                            one = c;
                            sheet.y_of_enthalpy = SheetData {
                                header,
                                coefficients: &one,
                            };
                        }
                        _ => {
                            let (header, c) = flipped(&sheet.y_of_entropy, word, bit);
                            one = c;
                            sheet.y_of_entropy = SheetData {
                                header,
                                coefficients: &one,
                            };
                        }
                    }
                    flips += 1;
                    if let Err(IntegrityError::ChecksumMismatch { table, .. }) =
                        check_single_phase_checksums(&set)
                    {
                        if table == id {
                            caught += 1;
                        }
                    }
                }
            }
        }
    }
    println!("single-phase sheets: {caught} of {flips} sampled single-bit flips caught");
    assert!(flips > 1000);
    assert_eq!(caught, flips);
}
