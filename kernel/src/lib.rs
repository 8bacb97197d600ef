#![doc = include_str!("../README.md")]
#![no_std]
#![forbid(unsafe_code)]
#![deny(missing_docs)]

pub mod accuracy;
// Application routines (issue 5, branch apps).
pub mod calorimeter;
pub mod drum_level;
pub mod energy;
pub mod error;
mod fast_math;
pub mod flowing;
pub mod integrity;
pub mod mixture;
pub mod quality;
pub mod saturation;
pub mod single_phase;
pub mod spline;
pub mod units;

/// The generated tables (written by `vapora-generate`, never edited by hand).
pub mod tables {
    #[rustfmt::skip]
    pub mod saturation;
    #[rustfmt::skip]
    pub mod single_phase;
}
