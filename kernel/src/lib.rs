//! vapora kernel (work in progress: the tables arrive with the saturation issue).
#![no_std]
#![forbid(unsafe_code)]
#![deny(missing_docs)]
