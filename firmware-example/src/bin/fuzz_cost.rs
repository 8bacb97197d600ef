//! Fuzz-corpus cost bench: runs every input of the committed fuzz corpus
//! (`vectors/fuzz-corpus.bin`, written on the host by
//! `host-tests --bin write-fuzz-vectors` with the fuzz target's own
//! decoding) through the kernel function it names
//! (`measured::CORPUS_CALLS`), with `bench_mark()` right before and right
//! after each call and the stack painted before it, as `src/bin/cost.rs`
//! does for the sweeps.
//!
//! Output (semihosting): `calibration calls=C` (the calibration's calls
//! come first in the marks), then one line per corpus input, in the order
//! of the marks: `input index=I function=F sweep=S|- a=0x.. b=0x..
//! selector=N file=NAME stack=B`, then `end result=pass|fail`.
//! `scripts/measure-fuzz-cost.sh` pairs the marks up and
//! `scripts/cost-table.py corpus` takes the worst case per function.
#![no_std]
#![no_main]

use cortex_m_rt::entry;
use cortex_m_semihosting::{debug, hprintln};
use panic_semihosting as _;

use vapora_firmware_example::bench::measure_one;
use vapora_firmware_example::measured::{CorpusCall, CALIBRATION, CORPUS_CALLS};
use vapora_firmware_example::stack_paint::PAINT_BYTES;
use vapora_firmware_example::vector_file::{self, u32_at, VectorFileError};

static VECTORS: &[u8] = include_bytes!("../../vectors/fuzz-corpus.bin");

/// Functions in the file's header at most.
const MAX_FUNCTIONS: usize = 64;

/// The header's function lines mapped to this build's corpus calls; `None`
/// (after printing why) if one is unknown or there are too many.
fn calls_of(header: &str) -> Option<[Option<&'static CorpusCall>; MAX_FUNCTIONS]> {
    let mut calls = [None; MAX_FUNCTIONS];
    let names = header.lines().filter(|l| !l.starts_with('#'));
    for (i, name) in names.enumerate() {
        let Some(call) = CORPUS_CALLS.iter().find(|c| c.name == name) else {
            hprintln!(
                "error the vector file names {} which CORPUS_CALLS lacks",
                name
            );
            return None;
        };
        let Some(slot) = calls.get_mut(i) else {
            hprintln!("error more than {} functions in the header", MAX_FUNCTIONS);
            return None;
        };
        *slot = Some(call);
    }
    Some(calls)
}

fn run() -> bool {
    let file = match vector_file::open(VECTORS, b"VFZC") {
        Ok(file) => file,
        Err(VectorFileError::NoMagic) => {
            hprintln!("error vector file has no magic");
            return false;
        }
        Err(VectorFileError::BadHeader) => {
            hprintln!("error vector file header unusable");
            return false;
        }
    };
    let Some(calls) = calls_of(file.header) else {
        hprintln!("error vector file header unusable");
        return false;
    };
    let count = file.count;

    hprintln!("calibration calls={}", CALIBRATION.calls);
    for i in 0..CALIBRATION.calls {
        let input = (CALIBRATION.input)(i);
        measure_one(core::hint::black_box(CALIBRATION.call), input);
    }

    let mut at = file.records_start;
    let mut ok = true;
    for index in 0..count {
        let (Some(&function), Some(a), Some(b), Some(selector), Some(&name_len)) = (
            VECTORS.get(at),
            u32_at(VECTORS, at + 1),
            u32_at(VECTORS, at + 5),
            u32_at(VECTORS, at + 9),
            VECTORS.get(at + 13),
        ) else {
            hprintln!("error vector file truncated at byte {}", at);
            return false;
        };
        let name_start = at + 14;
        let name_end = name_start + usize::from(name_len);
        let file = VECTORS
            .get(name_start..name_end)
            .and_then(|n| core::str::from_utf8(n).ok());
        let (Some(Some(call)), Some(file)) = (calls.get(usize::from(function)), file) else {
            hprintln!("error bad record {} at byte {}", index, at);
            return false;
        };
        let input = (call.input)(f32::from_bits(a), f32::from_bits(b), selector);
        // black_box: keep the call indirect, as in the sweep bench.
        let (_, stack) = measure_one(core::hint::black_box(call.call), input);
        hprintln!(
            "input index={} function={} sweep={} a=0x{:08x} b=0x{:08x} selector={} file={} stack={}",
            index,
            call.name,
            call.sweep.unwrap_or("-"),
            a,
            b,
            selector,
            file,
            stack
        );
        if stack >= PAINT_BYTES {
            hprintln!("error input {} reached the end of the painted stack", index);
            ok = false;
        }
        at = name_end;
    }
    if at != VECTORS.len() {
        hprintln!("error {} bytes after the last record", VECTORS.len() - at);
        return false;
    }
    ok
}

#[entry]
fn main() -> ! {
    hprintln!(
        "begin firmware=fuzz-cost board={} paint_bytes={} bytes={}",
        env!("VAPORA_BOARD"),
        PAINT_BYTES,
        VECTORS.len()
    );
    let ok = run();
    hprintln!("end result={}", if ok { "pass" } else { "fail" });
    debug::exit(if ok {
        debug::EXIT_SUCCESS
    } else {
        debug::EXIT_FAILURE
    });
    #[allow(clippy::empty_loop)]
    loop {}
}
