//! The firmware's output: one line per record, a record name then
//! `key=value` fields separated by single spaces, so a host test can parse
//! it with a split. Floats print with Rust's shortest round-trip form
//! (parsing the text back gives the same f32 bits); `-` marks a value that
//! the scan does not have.
//!
//! Records: `begin`, `scan`, `event`, `summary`, `end`.
use core::fmt;

/// Flag bit for a faulted channel `c` (value held or lost): `1 << c`.
pub const fn faulted_flag(channel: u8) -> u16 {
    1 << channel
}
/// Flag bit for a channel with no usable value (lost): `1 << (8 + c)`.
pub const fn lost_flag(channel: u8) -> u16 {
    1 << (8 + channel)
}
/// Flag: the superheat margin is below the alarm setting.
pub const SUPERHEAT_LOW: u16 = 1 << 13;
/// Flag: the kernel returned an error for this scan.
pub const STEAM_ERROR: u16 = 1 << 14;
/// Flag: this build has no kernel wired in; no steam figures.
pub const KERNEL_NOT_WIRED: u16 = 1 << 15;

/// Displays an optional value, `-` when absent.
pub struct Opt<T>(pub Option<T>);

impl<T: fmt::Display> fmt::Display for Opt<T> {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match &self.0 {
            Some(v) => v.fmt(f),
            None => f.write_str("-"),
        }
    }
}
