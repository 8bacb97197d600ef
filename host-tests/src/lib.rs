//! Shared helpers for the host-side checks: tolerances in one place.
#![forbid(unsafe_code)]
#![deny(missing_docs)]

pub mod accuracy;
pub mod bit_vectors;
pub mod fuzz_vectors;
pub mod regress;
pub mod report;
pub mod robustness;
pub mod single_phase;
pub mod tolerance;
