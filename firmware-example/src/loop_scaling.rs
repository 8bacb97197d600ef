//! From ADC code to loop current to engineering units, with the range
//! checks a 4–20 mA input must make before a value is used.

/// The analogue front end: the loop current flows through a precision shunt
/// into the ADC input.
#[derive(Debug, Clone, Copy)]
pub struct LoopFrontEnd {
    /// Shunt resistance, Ω.
    pub shunt_ohms: f32,
    /// ADC reference voltage, V (code 65535).
    pub reference_volts: f32,
}

impl LoopFrontEnd {
    /// Loop current in mA for a 16-bit ADC code.
    pub fn current_milliamps(&self, code: u16) -> f32 {
        let volts = f32::from(code) / 65535.0 * self.reference_volts;
        volts / self.shunt_ohms * 1000.0
    }
}

/// Lowest loop current still taken as a measurement, mA. Transmitters
/// drive below this to signal a fault (common practice, no source: about
/// 3.8 mA is the usual under-range limit).
pub const UNDER_RANGE_LIMIT_MILLIAMPS: f32 = 3.8;
/// Highest loop current still taken as a measurement, mA (common practice,
/// no source: about 20.5 mA is the usual over-range limit).
pub const OVER_RANGE_LIMIT_MILLIAMPS: f32 = 20.5;

/// The engineering values a transmitter is ranged for: `lower_range_value`
/// at 4 mA, `upper_range_value` at 20 mA, in the channel's unit.
#[derive(Debug, Clone, Copy)]
pub struct LoopRange {
    /// Value at 4 mA.
    pub lower_range_value: f32,
    /// Value at 20 mA.
    pub upper_range_value: f32,
}

/// Why a loop reading is not used.
#[derive(Debug, Clone, Copy, PartialEq)]
#[non_exhaustive]
pub enum LoopFault {
    /// Current below [`UNDER_RANGE_LIMIT_MILLIAMPS`] (broken wire, dead
    /// transmitter, or the transmitter signalling a fault downscale).
    UnderRange {
        /// Measured loop current, mA.
        milliamps: f32,
    },
    /// Current above [`OVER_RANGE_LIMIT_MILLIAMPS`] (short circuit, or the
    /// transmitter signalling a fault upscale).
    OverRange {
        /// Measured loop current, mA.
        milliamps: f32,
    },
    /// The converter could not be read at all.
    ConverterUnreadable,
}

impl LoopRange {
    /// Engineering value for a loop current. Between 3.8 and 4 mA and
    /// between 20 and 20.5 mA the line is extended: a transmitter may read
    /// slightly beyond its range before it saturates.
    ///
    /// # Errors
    /// [`LoopFault::UnderRange`] below 3.8 mA, [`LoopFault::OverRange`] above
    /// 20.5 mA (NaN counts as under-range).
    pub fn scale(&self, milliamps: f32) -> Result<f32, LoopFault> {
        if milliamps > OVER_RANGE_LIMIT_MILLIAMPS {
            return Err(LoopFault::OverRange { milliamps });
        }
        // NaN must fail the check too, hence the explicit test.
        if milliamps.is_nan() || milliamps < UNDER_RANGE_LIMIT_MILLIAMPS {
            return Err(LoopFault::UnderRange { milliamps });
        }
        let span = self.upper_range_value - self.lower_range_value;
        Ok(self.lower_range_value + (milliamps - 4.0) / 16.0 * span)
    }
}
