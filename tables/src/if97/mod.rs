//! The IAPWS Industrial Formulation 1997 (IAPWS R7-97(2012)) and the
//! supplementary releases it is used with.
//!
//! Layout: one module per region of the release, the boundary equations, the
//! saturation line, the backward equations and the inversions built on them,
//! region selection, and the viscosity release (IAPWS R12-08).

mod common;
pub use common::*;

pub mod region4;

// regions 1, 2, 5, B23 and selection
pub mod b23;
mod gibbs;
pub mod region1;
pub mod region2;
pub mod region5;
pub mod regions;

// region 3, saturation line, viscosity, inversions
pub mod backward;
pub mod inverse;
pub mod pt;
pub mod region3;
pub mod saturation;
pub mod viscosity;
