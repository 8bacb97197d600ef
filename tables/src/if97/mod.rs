//! The IAPWS Industrial Formulation 1997 (IAPWS R7-97(2012)) and the
//! supplementary releases it is used with.
//!
//! Layout: one module per region of the release, the boundary equations, the
//! saturation line, the backward equations and the inversions built on them,
//! region selection, and the viscosity release (IAPWS R12-08).

mod common;
pub use common::*;

pub mod region4;

// region 3, saturation line, viscosity, inversions
pub mod backward;
pub mod region3;
pub mod viscosity;
