//! The measuring harness shared by the cost benches (`src/bin/cost.rs` for
//! the sweeps, `src/bin/fuzz_cost.rs` for the fuzz corpus): the marker the
//! QEMU instruction-count plugin watches, and one measured call between two
//! marks with the stack painted before it. Both benches use this one path,
//! so their calibrations subtract the same overhead and their figures
//! compare directly.

use crate::stack_paint::{deepest_use, paint_below_sp};

/// The marker the instruction-count plugin watches (by address, found with
/// llvm-nm). A leaf that pushes nothing, so it does not disturb the paint.
#[no_mangle]
#[inline(never)]
pub extern "C" fn bench_mark() {
    cortex_m::asm::nop()
}

/// One measured call: paint, mark, call, mark, read the paint. The same code
/// path serves the calibration, so the difference is the call's own cost.
/// Returns the call's result word and the stack bytes it used.
#[inline(never)]
pub fn measure_one(call: fn([f32; 2]) -> u32, input: [f32; 2]) -> (u32, u32) {
    // SAFETY: the benches enable no interrupts, the stack has far more than
    // PAINT_BYTES of headroom on every board (see memory.x), and between
    // paint and read only bench_mark (a leaf) and `call` run.
    unsafe {
        let sp = paint_below_sp();
        bench_mark();
        let out = call(input);
        bench_mark();
        (out, deepest_use(sp))
    }
}
