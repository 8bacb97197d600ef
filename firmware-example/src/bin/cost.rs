//! Cost bench: calls every function of `measured::KERNEL`, `measured::LOOKUPS`,
//! `measured::BASELINE` and `measured::STAND_INS` over its sweep,
//! with `bench_mark()` right before and right after each call, and paints
//! the stack before each call to measure its depth.
//!
//! Output (semihosting): `function name=N calls=C` before each function's
//! calls, in the order the marks come, then `stack name=N bytes=B
//! checksum=X`. The instruction counts come from the QEMU plugin in
//! `tools/qemu-insn-count/`, which logs the running count at every
//! `bench_mark`; `scripts/measure-cost.sh` pairs the marks up.
#![no_std]
#![no_main]

use cortex_m_rt::entry;
use cortex_m_semihosting::{debug, hprintln};
use panic_semihosting as _;

use vapora_firmware_example::bench::measure_one;
use vapora_firmware_example::measured::{
    Measured, BASELINE, CALIBRATION, KERNEL, LOOKUPS, STAND_INS,
};
use vapora_firmware_example::stack_paint::PAINT_BYTES;

fn run(m: &Measured) -> bool {
    hprintln!("function name={} calls={}", m.name, m.calls);
    let mut max_stack = 0u32;
    let mut checksum = 0u32;
    for i in 0..m.calls {
        let input = (m.input)(i);
        // black_box: keep the call indirect, so the optimiser cannot
        // specialise measure_one per function and the calibration path
        // stays identical to the measured one.
        let (out, stack) = measure_one(core::hint::black_box(m.call), input);
        checksum = checksum.rotate_left(5) ^ out;
        max_stack = max_stack.max(stack);
    }
    hprintln!(
        "stack name={} bytes={} checksum=0x{:08x}",
        m.name,
        max_stack,
        checksum
    );
    if max_stack >= PAINT_BYTES {
        hprintln!(
            "error name={} stack reached the end of the painted region",
            m.name
        );
        return false;
    }
    true
}

#[entry]
fn main() -> ! {
    hprintln!(
        "begin firmware=cost board={} paint_bytes={} functions={}",
        env!("VAPORA_BOARD"),
        PAINT_BYTES,
        KERNEL.len() + LOOKUPS.len() + BASELINE.len() + STAND_INS.len()
    );
    let mut ok = run(&CALIBRATION);
    // Without the kernel's functions referenced, the linker drops their
    // code and tables: measure-cost.sh sizes both images.
    if !cfg!(feature = "without-kernel") {
        for m in KERNEL {
            ok &= run(m);
        }
        if !cfg!(feature = "without-lookups") {
            for m in LOOKUPS {
                ok &= run(m);
            }
        }
    }
    if !cfg!(feature = "without-baseline") {
        for m in BASELINE {
            ok &= run(m);
        }
    }
    for m in STAND_INS {
        ok &= run(m);
    }
    hprintln!("end result={}", if ok { "pass" } else { "fail" });
    debug::exit(if ok {
        debug::EXIT_SUCCESS
    } else {
        debug::EXIT_FAILURE
    });
    #[allow(clippy::empty_loop)]
    loop {}
}
