//! Stack depth of one call, measured on the target: fill the memory below
//! the stack pointer with a pattern, make the call, then find the lowest
//! word that no longer holds the pattern.
//!
//! The fill runs in inline assembly using registers only, so nothing of the
//! measuring code itself lands in the painted region; the caller must make
//! no other call between [`paint_below_sp`] and [`deepest_use`] except the
//! one measured (and leaf functions that push nothing, like `bench_mark`).

/// The pattern written below the stack pointer.
pub const PATTERN: u32 = 0x5EA5_0A1F;

/// Bytes painted below SP. Covers the kernel's 256-byte target with a wide
/// margin, and the f64 formulation baseline (about 2 KiB for a saturated
/// state: its Region 3 solver), and fits the 16 KiB of RAM on the micro:bit.
pub const PAINT_BYTES: u32 = 8192;

/// Paints [`PAINT_BYTES`] below the current stack pointer and returns that
/// stack pointer.
///
/// # Safety
/// Writes below SP, which is free memory only if no interrupt handler runs
/// meanwhile and the stack has [`PAINT_BYTES`] of headroom.
#[inline(always)]
pub unsafe fn paint_below_sp() -> u32 {
    let sp: u32;
    core::arch::asm!(
        "mov {sp}, sp",
        "mov {p}, {sp}",
        "subs {end}, {sp}, {n}",
        "2:",
        "subs {p}, {p}, #4",
        "str {pat}, [{p}]",
        "cmp {p}, {end}",
        "bhi 2b",
        sp = out(reg) sp,
        p = out(reg) _,
        end = out(reg) _,
        n = in(reg) PAINT_BYTES,
        pat = in(reg) PATTERN,
        options(nostack),
    );
    sp
}

/// Bytes of stack used below `sp` since [`paint_below_sp`] returned it.
/// Returns [`PAINT_BYTES`] if even the lowest painted word was overwritten
/// (the call may have gone deeper: treat as "at least").
///
/// # Safety
/// `sp` must come from [`paint_below_sp`] in the same function, with no
/// call in between other than the one measured.
#[inline(always)]
pub unsafe fn deepest_use(sp: u32) -> u32 {
    let mut offset = PAINT_BYTES;
    while offset > 0 {
        let word = core::ptr::read_volatile((sp - offset) as *const u32);
        if word != PATTERN {
            return offset;
        }
        offset -= 4;
    }
    0
}
