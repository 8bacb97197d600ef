//! The steam-header monitor of an invented plant, Brannock Vale creamery
//! (boiler house, header 2), shaped the way a real flow-computer firmware is:
//! a transmitter driver written against `embedded-hal` 1.0 traits, a
//! simulated SPI bus that replays the scenario inside the emulator, 4–20 mA
//! scaling with fault detection, last-good-value holding, a queue between
//! acquisition and computation, and the steam computations behind one small
//! module ([`compute`]) that calls the vapora kernel.
//!
//! Everything here is `no_std` and heap-free; it builds for
//! `thumbv6m-none-eabi`, `thumbv7m-none-eabi` and `thumbv7em-none-eabihf`.
#![no_std]
#![deny(missing_docs)]

pub mod adc;
pub mod bench;
pub mod compute;
pub mod hold;
pub mod kernel_calls;
pub mod loop_scaling;
pub mod measured;
pub mod report;
pub mod scenario;
pub mod sim_bus;
pub mod stack_paint;
pub mod vector_file;
