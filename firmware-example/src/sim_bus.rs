//! A simulated SPI bus that plays the converter's side of the protocol in
//! [`crate::adc`] with the loop currents of [`crate::scenario`], so the same
//! driver code that would run on a board runs in the emulator.
use embedded_hal::spi::{self, ErrorKind, ErrorType, Operation, SpiDevice};

use crate::loop_scaling::LoopFrontEnd;
use crate::scenario::{FieldScan, SCANNED_CHANNELS};

/// Errors of the simulated bus.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum SimBusError {
    /// A transaction did not have the shape the converter understands
    /// (one command byte written, then three bytes read).
    UnexpectedTransaction,
}

impl spi::Error for SimBusError {
    fn kind(&self) -> ErrorKind {
        ErrorKind::Other
    }
}

/// The converter and its inputs, replaying one [`FieldScan`] at a time.
pub struct ScenarioBus {
    front_end: LoopFrontEnd,
    field: FieldScan,
}

impl ScenarioBus {
    /// A bus whose converter sees `field` through `front_end`.
    pub fn new(front_end: LoopFrontEnd, field: FieldScan) -> Self {
        Self { front_end, field }
    }

    /// Moves the field on to the next scan.
    pub fn set_field(&mut self, field: FieldScan) {
        self.field = field;
    }

    /// The ADC code the converter produces for a loop current: the shunt
    /// voltage over the reference, rounded, clipped at full scale.
    fn code_for(&self, milliamps: f32) -> u16 {
        let volts = milliamps / 1000.0 * self.front_end.shunt_ohms;
        let counts = libm::roundf(volts / self.front_end.reference_volts * 65535.0);
        counts.clamp(0.0, 65535.0) as u16
    }

    fn respond(&self, command: u8) -> [u8; 3] {
        let channel = command & 0x7F;
        let milliamps = SCANNED_CHANNELS
            .iter()
            .zip(self.field.loop_milliamps.iter())
            .find(|(c, _)| **c == channel)
            .map_or(0.0, |(_, ma)| *ma);
        let [high, low] = self.code_for(milliamps).to_be_bytes();
        let echo = if self.field.corrupt_frame_on == Some(channel) {
            // A bit slip on MISO: the echo comes back shifted.
            channel << 1 | 1
        } else {
            channel
        };
        [echo, high, low]
    }
}

impl ErrorType for ScenarioBus {
    type Error = SimBusError;
}

impl SpiDevice for ScenarioBus {
    fn transaction(&mut self, operations: &mut [Operation<'_, u8>]) -> Result<(), SimBusError> {
        match operations {
            [Operation::Write([command]), Operation::Read(response)] if response.len() == 3 => {
                response.copy_from_slice(&self.respond(*command));
                Ok(())
            }
            _ => Err(SimBusError::UnexpectedTransaction),
        }
    }
}
