//! The replayed scenario: Brannock Vale creamery (an invented plant),
//! boiler house, steam header 2, which feeds the pasteurisers through a
//! small superheater. Every number here is invented for the demo.
//!
//! The field side is given as loop currents, as the input card sees them;
//! the transmitter ranges say what those currents mean. Faults are injected
//! on purpose, and each scan says which channels must be flagged, so the
//! firmware can check its own fault handling and exit with failure if it
//! misses one or flags a healthy one.
use crate::loop_scaling::{LoopFrontEnd, LoopRange};

/// Input-card front end: 100 Ω shunt, 2.5 V reference, so 20 mA is 2.0 V
/// and 24 mA still fits below full scale (our design choice).
pub const FRONT_END: LoopFrontEnd = LoopFrontEnd {
    shunt_ohms: 100.0,
    reference_volts: 2.5,
};

/// ADC channel of the header pressure transmitter (gauge).
pub const CH_HEADER_PRESSURE: u8 = 0;
/// ADC channel of the barometer in the boiler house (absolute).
pub const CH_AMBIENT_PRESSURE: u8 = 1;
/// ADC channel of the header temperature transmitter.
pub const CH_HEADER_TEMPERATURE: u8 = 2;
/// ADC channel of the header's steam mass-flow meter.
pub const CH_MASS_FLOW: u8 = 3;
/// ADC channel of the inline dryness-fraction probe (an invented instrument
/// that reads 1.00 whenever the steam is dry or superheated).
pub const CH_DRYNESS: u8 = 4;
/// Channels scanned, in order.
pub const SCANNED_CHANNELS: [u8; 5] = [
    CH_HEADER_PRESSURE,
    CH_AMBIENT_PRESSURE,
    CH_HEADER_TEMPERATURE,
    CH_MASS_FLOW,
    CH_DRYNESS,
];

/// Header pressure transmitter: 0 to 1600 kPa gauge, in Pa.
pub const RANGE_HEADER_PRESSURE_PA: LoopRange = LoopRange {
    lower_range_value: 0.0,
    upper_range_value: 1.6e6,
};
/// Barometer: 80 to 110 kPa absolute, in Pa.
pub const RANGE_AMBIENT_PRESSURE_PA: LoopRange = LoopRange {
    lower_range_value: 80.0e3,
    upper_range_value: 110.0e3,
};
/// Header temperature: 0 to 300 °C.
pub const RANGE_HEADER_TEMPERATURE_C: LoopRange = LoopRange {
    lower_range_value: 0.0,
    upper_range_value: 300.0,
};
/// Steam mass flow: 0 to 2.5 kg/s.
pub const RANGE_MASS_FLOW_KG_S: LoopRange = LoopRange {
    lower_range_value: 0.0,
    upper_range_value: 2.5,
};
/// Dryness-fraction probe: 0.80 to 1.00.
pub const RANGE_DRYNESS: LoopRange = LoopRange {
    lower_range_value: 0.80,
    upper_range_value: 1.00,
};

/// Superheat below this margin raises the low-superheat alarm, K
/// (the plant's own setting, invented: the pasteurisers want dry steam).
pub const SUPERHEAT_ALARM_MARGIN_K: f32 = 5.0;

/// A header temperature less than this above saturation is taken as
/// saturated steam, and the probe's dryness fraction is used, K (the
/// plant's setting, invented: about the temperature loop's accuracy).
pub const SATURATED_BAND_K: f32 = 1.0;

/// One scan of the field as the input card sees it.
#[derive(Debug, Clone, Copy)]
pub struct FieldScan {
    /// Loop current on each of [`SCANNED_CHANNELS`], mA.
    pub loop_milliamps: [f32; 5],
    /// A channel whose SPI frame is corrupted this scan (the converter
    /// echoes a wrong channel byte), if any.
    pub corrupt_frame_on: Option<u8>,
    /// Bit `c` set: channel `c` must be flagged as faulted this scan.
    pub expected_faulted: u8,
    /// Bit `c` set: channel `c` must have no usable value this scan
    /// (faulted longer than the hold limit).
    pub expected_lost: u8,
    /// The low-superheat alarm must be raised this scan (checked on scans
    /// that have steam figures). Worked out by hand when the scenario was
    /// written, from IAPWS R7-97(2012) Table 36 (Tsat = 453.035632 K at
    /// 1 MPa) and a slope of about 23 kPa/K near 180 °C (from memory): the
    /// healthy header runs about 9 K above saturation, the tripped one at
    /// saturation.
    pub expected_superheat_low: bool,
}

const fn bit(channel: u8) -> u8 {
    1 << channel
}

/// Currents for a healthy header: 920 kPa g → 13.20 mA, 99.1 kPa →
/// 14.19 mA, 190 °C → 14.13 mA, 1.40 kg/s → 12.96 mA, dryness 1.00 → 20.00 mA.
const fn healthy(p: f32, amb: f32, t: f32, flow: f32) -> FieldScan {
    FieldScan {
        loop_milliamps: [p, amb, t, flow, 20.0],
        corrupt_frame_on: None,
        expected_faulted: 0,
        expected_lost: 0,
        expected_superheat_low: false,
    }
}

/// A scan with faults injected on the channels in `faulted` (their
/// currents are already in `loop_milliamps`).
const fn faulted(
    loop_milliamps: [f32; 5],
    expected_faulted: u8,
    expected_lost: u8,
    superheat_low: bool,
) -> FieldScan {
    FieldScan {
        loop_milliamps,
        corrupt_frame_on: None,
        expected_faulted,
        expected_lost,
        expected_superheat_low: superheat_low,
    }
}

/// The scan sequence, 100 ms apart.
pub const SCANS: [FieldScan; 18] = [
    healthy(13.20, 14.19, 14.13, 12.96),
    healthy(13.24, 14.19, 14.14, 12.99),
    healthy(13.31, 14.18, 14.16, 13.05),
    // Scans 3–4: the pressure transmitter's loop opens (a loose terminal):
    // about 1.2 mA from the card's leakage path. Held, flagged.
    faulted(
        [1.2, 14.18, 14.15, 13.02, 20.0],
        bit(CH_HEADER_PRESSURE),
        0,
        false,
    ),
    faulted(
        [1.2, 14.18, 14.15, 13.00, 20.0],
        bit(CH_HEADER_PRESSURE),
        0,
        false,
    ),
    healthy(13.28, 14.18, 14.14, 12.97),
    // Scan 6: the temperature transmitter drives upscale (22 mA) on a
    // sensor fault. Over-range, held.
    faulted(
        [13.27, 14.18, 22.0, 12.95, 20.0],
        bit(CH_HEADER_TEMPERATURE),
        0,
        false,
    ),
    // Scan 7: 20.3 mA on the flow meter, a flow peak just past its range,
    // is still inside the tolerated band above 20 mA: not a fault.
    healthy(13.25, 14.18, 14.13, 20.3),
    // Scan 8: a corrupted SPI frame on the flow channel.
    FieldScan {
        loop_milliamps: [13.22, 14.18, 14.12, 12.90, 20.0],
        corrupt_frame_on: Some(CH_MASS_FLOW),
        expected_faulted: bit(CH_MASS_FLOW),
        expected_lost: 0,
        expected_superheat_low: false,
    },
    // Scan 9: the superheater trips; 183 °C (13.76 mA) is about 3 K of
    // superheat: alarm.
    faulted([13.10, 14.18, 13.76, 12.70, 20.0], 0, 0, true),
    // Scans 10–16: the header at saturation, wet steam at about 0.96
    // (16.80 mA). The barometer dies at scan 10 (3.2 mA) and stays dead:
    // held for five scans, then lost (no absolute pressure, no figures).
    faulted(
        [13.02, 3.2, 13.59, 12.60, 16.80],
        bit(CH_AMBIENT_PRESSURE),
        0,
        true,
    ),
    faulted(
        [12.98, 3.2, 13.59, 12.55, 16.80],
        bit(CH_AMBIENT_PRESSURE),
        0,
        true,
    ),
    faulted(
        [12.95, 3.2, 13.58, 12.52, 16.72],
        bit(CH_AMBIENT_PRESSURE),
        0,
        true,
    ),
    faulted(
        [12.95, 3.2, 13.58, 12.50, 16.70],
        bit(CH_AMBIENT_PRESSURE),
        0,
        true,
    ),
    faulted(
        [12.96, 3.2, 13.58, 12.51, 16.72],
        bit(CH_AMBIENT_PRESSURE),
        0,
        true,
    ),
    faulted(
        [12.97, 3.2, 13.58, 12.53, 16.76],
        bit(CH_AMBIENT_PRESSURE),
        bit(CH_AMBIENT_PRESSURE),
        true,
    ),
    faulted(
        [12.99, 3.2, 13.59, 12.55, 16.80],
        bit(CH_AMBIENT_PRESSURE),
        bit(CH_AMBIENT_PRESSURE),
        true,
    ),
    // Scan 17: barometer replaced, superheater back.
    healthy(13.18, 14.17, 14.10, 12.90),
];
