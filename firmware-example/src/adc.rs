//! Driver for a 4–20 mA input card's ADC, generic over any
//! [`embedded_hal::spi::SpiDevice`] (a real bus on a board, the scenario
//! replay in the emulator).
//!
//! The converter is a generic 16-bit, 8-channel SAR ADC of our own
//! description (not a particular part): the host writes one command byte
//! `0x80 | channel` (start bit plus channel number) and reads three bytes
//! back, `[channel echo, code high byte, code low byte]`. The echo lets the
//! driver catch a shifted or stuck bus, which a bare code cannot show.
use embedded_hal::spi::{Operation, SpiDevice};

/// Number of input channels on the converter.
pub const CHANNELS: u8 = 8;

/// Why a conversion could not be read.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
#[non_exhaustive]
pub enum AdcError<E> {
    /// The bus transaction itself failed.
    Bus(E),
    /// The converter echoed a different channel than the one asked for:
    /// the frame is not trusted.
    Framing {
        /// Channel asked for.
        requested: u8,
        /// Channel byte that came back.
        echoed: u8,
    },
    /// Channel number outside `0..CHANNELS`.
    NoSuchChannel(u8),
}

/// The converter on an SPI bus.
pub struct LoopInputAdc<SPI> {
    spi: SPI,
}

impl<SPI: SpiDevice> LoopInputAdc<SPI> {
    /// Wraps the SPI device the converter is on.
    pub fn new(spi: SPI) -> Self {
        Self { spi }
    }

    /// Converts one channel and returns the raw 16-bit code
    /// (0 = 0 V, 65535 = the reference voltage).
    ///
    /// # Errors
    /// [`AdcError::NoSuchChannel`] for a channel ≥ [`CHANNELS`],
    /// [`AdcError::Bus`] if the transaction fails, [`AdcError::Framing`] if
    /// the echoed channel does not match.
    pub fn read_code(&mut self, channel: u8) -> Result<u16, AdcError<SPI::Error>> {
        if channel >= CHANNELS {
            return Err(AdcError::NoSuchChannel(channel));
        }
        let command = [0x80 | channel];
        let mut response = [0u8; 3];
        self.spi
            .transaction(&mut [Operation::Write(&command), Operation::Read(&mut response)])
            .map_err(AdcError::Bus)?;
        let [echoed, high, low] = response;
        if echoed != channel {
            return Err(AdcError::Framing {
                requested: channel,
                echoed,
            });
        }
        Ok(u16::from_be_bytes([high, low]))
    }

    /// The SPI device, for a test harness that drives the simulated field.
    pub fn bus_mut(&mut self) -> &mut SPI {
        &mut self.spi
    }

    /// Gives the SPI device back.
    pub fn release(self) -> SPI {
        self.spi
    }
}
