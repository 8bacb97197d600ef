//! Bit-identity test: recomputes every vector of
//! `vectors/kernel-bits.bin` (written on the host by
//! `host-tests --bin write-kernel-vectors`) on this core and compares every
//! output word with the host's bits.
//!
//! Output (semihosting): one `diff` line per differing word (the first 40),
//! `function` lines with the vectors and worst difference per function,
//! then `summary` and `end result=pass|fail`. Exits with failure on any
//! difference or a malformed file.
#![no_std]
#![no_main]

use cortex_m_rt::entry;
use cortex_m_semihosting::{debug, hprintln};
use panic_semihosting as _;

use vapora_firmware_example::kernel_calls::CALLS;
use vapora_firmware_example::vector_file::{self, u32_at, VectorFileError};

static VECTORS: &[u8] = include_bytes!("../../vectors/kernel-bits.bin");

/// Diff lines printed at most (the counts cover all of them).
const MAX_PRINTED: u32 = 40;

/// f32 bits mapped to integers in the order of the values, so the distance
/// of two mapped values is the number of ulps between them (+0 and −0 are
/// 0 apart).
fn ordered(bits: u32) -> i64 {
    let magnitude = i64::from(bits & 0x7fff_ffff);
    if bits & 0x8000_0000 != 0 {
        -magnitude
    } else {
        magnitude
    }
}

fn ulps(a: u32, b: u32) -> u64 {
    (ordered(a) - ordered(b)).unsigned_abs()
}

/// Checks the header's function list against this build's [`CALLS`].
fn header_matches(header: &str) -> bool {
    let mut names = header.lines().filter(|l| !l.starts_with('#'));
    for call in CALLS {
        if names.next() != Some(call.name) {
            hprintln!(
                "error header lists other functions than this build (at {})",
                call.name
            );
            return false;
        }
    }
    names.next().is_none()
}

fn run() -> bool {
    let file = match vector_file::open(VECTORS, b"VKBV") {
        Ok(file) => file,
        Err(VectorFileError::NoMagic) => {
            hprintln!("error vector file has no magic");
            return false;
        }
        Err(VectorFileError::BadHeader) => {
            hprintln!("error vector file header unreadable");
            return false;
        }
    };
    if !header_matches(file.header) {
        return false;
    }
    let (count, records_start) = (file.count, file.records_start);
    let mut at = records_start;
    let mut per_function = [(0u32, 0u32, 0u64); 64];
    let (mut differing, mut words_compared) = (0u32, 0u32);
    for _ in 0..count {
        let (Some(&function), Some(&len)) = (VECTORS.get(at), VECTORS.get(at + 1)) else {
            hprintln!("error vector file truncated");
            return false;
        };
        let (function, len) = (function as usize, len as usize);
        let (Some(call), Some(in0), Some(in1)) = (
            CALLS.get(function),
            u32_at(VECTORS, at + 2),
            u32_at(VECTORS, at + 6),
        ) else {
            hprintln!("error bad record at byte {}", at);
            return false;
        };
        let input = [f32::from_bits(in0), f32::from_bits(in1)];
        let mut device = (call.eval)(input);
        // Test of the test harness: one flipped bit must make this fail.
        if cfg!(feature = "inject-check-failure") && at == records_start {
            device.words[1] ^= 1;
        }
        let stats = &mut per_function[function % 64];
        stats.0 += 1;
        if device.len != len {
            differing += 1;
            stats.1 += 1;
            hprintln!(
                "diff function={} in=0x{:08x},0x{:08x} words host={} device={}",
                call.name,
                in0,
                in1,
                len,
                device.len
            );
        }
        for (k, &dev) in device.as_slice().iter().enumerate().take(len) {
            let Some(host) = u32_at(VECTORS, at + 10 + 4 * k) else {
                hprintln!("error vector file truncated");
                return false;
            };
            words_compared += 1;
            if host != dev {
                differing += 1;
                stats.1 += 1;
                // Word 0 is a status code, not a float.
                let u = if k == 0 { 0 } else { ulps(host, dev) };
                stats.2 = stats.2.max(u);
                if differing <= MAX_PRINTED {
                    hprintln!(
                        "diff function={} in={:e},{:e} word={} host=0x{:08x} device=0x{:08x} ulps={}",
                        call.name,
                        input[0],
                        input[1],
                        k,
                        host,
                        dev,
                        u
                    );
                }
            }
        }
        at += 10 + 4 * len;
    }
    if at != VECTORS.len() {
        hprintln!("error {} bytes after the last record", VECTORS.len() - at);
        return false;
    }
    for (call, (n, d, u)) in CALLS.iter().zip(per_function.iter()) {
        hprintln!(
            "function name={} vectors={} differing_words={} max_ulps={}",
            call.name,
            n,
            d,
            u
        );
    }
    hprintln!(
        "summary vectors={} words={} differing_words={}",
        count,
        words_compared,
        differing
    );
    differing == 0
}

#[entry]
fn main() -> ! {
    hprintln!(
        "begin firmware=bit-identity board={} bytes={}",
        env!("VAPORA_BOARD"),
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
