//! Host side of vapora: the full IAPWS-IF97 formulation in `f64`, and (with
//! the feature `generator`) the generator that fits, measures and emits the
//! kernel's spline tables (module `generator`, binary `vapora-generate`).
//!
//! The formulation is written `no_std` with `libm`, so it can also be compiled
//! for a microcontroller as the honest "no tables" baseline against which the
//! kernel's cost is measured.
//!
//! All quantities are SI base units: Pa, K, kg/m³, m³/kg, J/kg, J/(kg·K), m/s,
//! Pa·s. The release itself tabulates MPa and kJ/kg; conversion happens at the
//! edge of each region module.
#![cfg_attr(not(feature = "std"), no_std)]
#![forbid(unsafe_code)]
#![deny(missing_docs)]

pub mod if97;

#[cfg(feature = "generator")]
pub mod generator;
