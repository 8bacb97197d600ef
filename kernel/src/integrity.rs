//! Table integrity: a self-test a device runs at start-up and periodically,
//! which notices when the coefficient tables in flash are no longer the
//! ones the generator wrote (a flipped bit, a bad flash write, a
//! half-programmed image).
//!
//! [`self_test`] does two things:
//! 1. For every table it computes a CRC-32 (CRC-32/ISO-HDLC, the common
//!    Ethernet/zip CRC) of the table's data as stored, and compares it with
//!    the CRC the generator computed when it wrote the table
//!    (`*_CRC32` in [`crate::tables::saturation`]). A CRC-32 detects every
//!    single-bit error, every burst of up to 32 bits and every odd number
//!    of flipped bits; the host tests flip each bit of each table and check
//!    that this really is caught.
//! 2. It evaluates a few published points through the public functions,
//!    one per table, and checks them against the kernel's own stated
//!    accuracy ([`crate::accuracy`]). This catches what a CRC cannot: code
//!    and tables from different generator runs, or a wrong table linked in.
//!
//! # How firmware uses it
//! Call [`self_test`] once before the first computation and then
//! periodically from a low-priority task (every few minutes is common
//! practice for flash checks of measuring instruments). On `Err`, stop
//! computing: hold the outputs at their fail-safe values (for example
//! drive a 4–20 mA output below 3.6 mA, the common "fault" signal), raise
//! a device fault with the error's [`TableId`] in the diagnostic log, and
//! do not clear it without a reset. Never fall back to the damaged tables.
//!
//! ```
//! use vapora_kernel::integrity::self_test;
//! let tables_intact = self_test().is_ok();
//! // Firmware: if !tables_intact, hold the outputs fail-safe, log the
//! // error's table, raise a device fault and compute nothing more.
//! assert!(tables_intact);
//! ```
//!
//! # Cost
//! The CRC is computed bit by bit (the `crc` crate's `NoTable`), so the
//! self-test costs no flash for a CRC look-up table; it reads every byte of
//! the tables once (the default tables are listed in
//! [`crate::tables::saturation`]), about eight shift-and-xor steps per byte.
//! It allocates nothing and uses no static RAM.

use core::fmt;

use crc::{Crc, NoTable, CRC_32_ISO_HDLC};

use crate::accuracy::ACCURACY_BELOW_NEAR_CRITICAL;
use crate::saturation::{saturation_pressure, saturation_temperature};
use crate::single_phase::{compressed_liquid, superheated_vapour};
use crate::spline::{BicubicSheet, OctaveCubicTable, SinglePhaseSheet, UniformCubicTable};
use crate::tables::saturation as table;
use crate::tables::single_phase;
use crate::units::{AbsolutePressure, Temperature};

/// The generator's CRC: CRC-32/ISO-HDLC, bitwise (no look-up table in flash).
const CRC32: Crc<u32, NoTable> = Crc::<u32, NoTable>::new(&CRC_32_ISO_HDLC);

/// One of the compiled tables.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum TableId {
    /// [`table::STATE_LOW`]: saturated state below 623.15 K.
    StateLow,
    /// [`table::STATE_HIGH`]: saturated state from 623.15 K.
    StateHigh,
    /// [`table::TEMPERATURE_LOW`]: saturation temperature below p_sat(623.15 K).
    TemperatureLow,
    /// [`table::TEMPERATURE_HIGH`]: saturation temperature from p_sat(623.15 K).
    TemperatureHigh,
    /// [`single_phase::VAPOUR_LOW`]: superheated vapour below p_b (all three sheets).
    VapourLow,
    /// [`single_phase::LIQUID_LOW`]: compressed liquid below p_b.
    LiquidLow,
    /// [`single_phase::LIQUID_HIGH`]: compressed liquid from p_b, up to 623.15 K.
    LiquidHigh,
    /// [`single_phase::LIQUID_NEAR_CRITICAL`]: liquid side of Region 3.
    LiquidNearCritical,
    /// [`single_phase::VAPOUR_NEAR_CRITICAL`]: vapour side of Region 3.
    VapourNearCritical,
    /// [`single_phase::VAPOUR_HIGH`]: Region 2 beyond the B23 line.
    VapourHigh,
}

impl TableId {
    /// Every table, in the order the self-test checks them.
    pub const ALL: [TableId; 10] = [
        TableId::StateLow,
        TableId::StateHigh,
        TableId::TemperatureLow,
        TableId::TemperatureHigh,
        TableId::VapourLow,
        TableId::LiquidLow,
        TableId::LiquidHigh,
        TableId::LiquidNearCritical,
        TableId::VapourNearCritical,
        TableId::VapourHigh,
    ];
}

impl fmt::Display for TableId {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            Self::StateLow => "STATE_LOW",
            Self::StateHigh => "STATE_HIGH",
            Self::TemperatureLow => "TEMPERATURE_LOW",
            Self::TemperatureHigh => "TEMPERATURE_HIGH",
            Self::VapourLow => "VAPOUR_LOW",
            Self::LiquidLow => "LIQUID_LOW",
            Self::LiquidHigh => "LIQUID_HIGH",
            Self::LiquidNearCritical => "LIQUID_NEAR_CRITICAL",
            Self::VapourNearCritical => "VAPOUR_NEAR_CRITICAL",
            Self::VapourHigh => "VAPOUR_HIGH",
        })
    }
}

/// A table failed the self-test: the device must not compute with it.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "defmt", derive(defmt::Format))]
#[non_exhaustive]
pub enum IntegrityError {
    /// The CRC of the table's data differs from the generator's.
    ChecksumMismatch {
        /// The damaged table.
        table: TableId,
        /// CRC written by the generator.
        expected: u32,
        /// CRC of the data found now.
        computed: u32,
    },
    /// A published point computed through the table is outside the
    /// kernel's stated accuracy.
    SpotCheckFailed {
        /// The table the point is computed through.
        table: TableId,
        /// The input of the point (Pa for a saturation temperature, K for a
        /// saturation pressure).
        input: f32,
        /// The published value (K or Pa).
        expected: f32,
        /// What the kernel computed (K or Pa; NaN if it returned an error).
        computed: f32,
    },
}

impl fmt::Display for IntegrityError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            Self::ChecksumMismatch {
                table,
                expected,
                computed,
            } => write!(
                f,
                "table {table} is damaged: CRC-32 {computed:#010x}, generated as {expected:#010x}"
            ),
            Self::SpotCheckFailed {
                table,
                input,
                expected,
                computed,
            } => write!(
                f,
                "table {table} fails its spot check at {input}: {computed}, published {expected}"
            ),
        }
    }
}

impl core::error::Error for IntegrityError {}

/// The data of one table as the self-test sees it: its two header fields
/// and its cubics, borrowed, so a host test can hand it a copy with a
/// flipped bit.
#[derive(Debug, Clone, Copy)]
pub struct TableData<'a, const P: usize> {
    /// The two fields that place the intervals, as 32-bit words:
    /// `start` and `inverse_step` (f32 bit patterns) of a
    /// [`UniformCubicTable`], `shift` and `first` of an [`OctaveCubicTable`].
    pub header: [u32; 2],
    /// The cubics, as in the table's `intervals`.
    pub intervals: &'a [[[f32; 4]; P]],
}

impl<const P: usize> TableData<'static, P> {
    /// The data of a compiled table on uniform knots.
    pub const fn of_uniform(table: &UniformCubicTable<P>) -> Self {
        Self {
            header: [table.start.to_bits(), table.inverse_step.to_bits()],
            intervals: table.intervals,
        }
    }

    /// The data of a compiled table on octave knots.
    pub const fn of_octave(table: &OctaveCubicTable<P>) -> Self {
        Self {
            header: [table.shift, table.first],
            intervals: table.intervals,
        }
    }
}

impl<const P: usize> TableData<'_, P> {
    /// CRC-32/ISO-HDLC of the data: the two header words, then every
    /// coefficient in storage order (interval, quantity, power), each as the
    /// 4 little-endian bytes of its 32-bit pattern. The generator computes
    /// the same from the values it writes, so the result does not depend on
    /// the device's byte order.
    pub fn checksum(&self) -> u32 {
        let mut digest = CRC32.digest();
        for word in self.header {
            digest.update(&word.to_le_bytes());
        }
        for block in self.intervals {
            for cubic in block {
                for c in cubic {
                    digest.update(&c.to_bits().to_le_bytes());
                }
            }
        }
        digest.finalize()
    }

    fn check(&self, table: TableId, expected: u32) -> Result<(), IntegrityError> {
        let computed = self.checksum();
        if computed == expected {
            Ok(())
        } else {
            Err(IntegrityError::ChecksumMismatch {
                table,
                expected,
                computed,
            })
        }
    }
}

/// The data of every table, with the CRCs they must have.
#[derive(Debug, Clone, Copy)]
pub struct TableSet<'a> {
    /// [`TableId::StateLow`] and its generated CRC.
    pub state_low: (TableData<'a, 9>, u32),
    /// [`TableId::StateHigh`] and its generated CRC.
    pub state_high: (TableData<'a, 9>, u32),
    /// [`TableId::TemperatureLow`] and its generated CRC.
    pub temperature_low: (TableData<'a, 1>, u32),
    /// [`TableId::TemperatureHigh`] and its generated CRC.
    pub temperature_high: (TableData<'a, 1>, u32),
}

impl TableSet<'static> {
    /// The compiled tables and the CRCs the generator wrote beside them.
    pub const fn compiled() -> Self {
        Self {
            state_low: (
                TableData::of_uniform(&table::STATE_LOW),
                table::STATE_LOW_CRC32,
            ),
            state_high: (
                TableData::of_uniform(&table::STATE_HIGH),
                table::STATE_HIGH_CRC32,
            ),
            temperature_low: (
                TableData::of_octave(&table::TEMPERATURE_LOW),
                table::TEMPERATURE_LOW_CRC32,
            ),
            temperature_high: (
                TableData::of_octave(&table::TEMPERATURE_HIGH),
                table::TEMPERATURE_HIGH_CRC32,
            ),
        }
    }
}

/// Checks the CRC of every table in `tables` against the CRC given with it,
/// in the order of [`TableId::ALL`]. [`self_test`] calls this with
/// [`TableSet::compiled`]; it takes the data as a parameter so that the host
/// tests can show it catches damaged copies.
///
/// # Errors
/// [`IntegrityError::ChecksumMismatch`] naming the first table whose CRC
/// differs.
pub fn check_checksums(tables: &TableSet<'_>) -> Result<(), IntegrityError> {
    let (data, crc) = &tables.state_low;
    data.check(TableId::StateLow, *crc)?;
    let (data, crc) = &tables.state_high;
    data.check(TableId::StateHigh, *crc)?;
    let (data, crc) = &tables.temperature_low;
    data.check(TableId::TemperatureLow, *crc)?;
    let (data, crc) = &tables.temperature_high;
    data.check(TableId::TemperatureHigh, *crc)
}

/// The data of one single-phase B-spline sheet as the CRC covers it: the
/// four header words (`x_start` and `x_inverse_step` as f32 bit patterns,
/// the two interval counts), then every coefficient in storage order.
#[derive(Debug, Clone, Copy)]
pub struct SheetData<'a, const Q: usize> {
    /// The four header words.
    pub header: [u32; 4],
    /// The coefficients.
    pub coefficients: &'a [[f32; Q]],
}

impl<const Q: usize> SheetData<'static, Q> {
    /// The data of a compiled sheet.
    pub const fn of_sheet(sheet: &BicubicSheet<Q>) -> Self {
        Self {
            header: [
                sheet.x_start.to_bits(),
                sheet.x_inverse_step.to_bits(),
                sheet.x_intervals,
                sheet.y_intervals,
            ],
            coefficients: sheet.coefficients,
        }
    }
}

impl<const Q: usize> SheetData<'_, Q> {
    /// CRC-32/ISO-HDLC of the header words and the coefficients, each as 4
    /// little-endian bytes (what the generator computed for `*_CRC32` in
    /// [`crate::tables::single_phase`]).
    pub fn checksum(&self) -> u32 {
        let mut digest = CRC32.digest();
        for word in self.header {
            digest.update(&word.to_le_bytes());
        }
        for c in self.coefficients {
            for v in c {
                digest.update(&v.to_bits().to_le_bytes());
            }
        }
        digest.finalize()
    }
}

/// One single-phase sheet's three arrays with the CRCs the generator gave them.
#[derive(Debug, Clone, Copy)]
pub struct SinglePhaseSheetData<'a> {
    /// Which sheet.
    pub table: TableId,
    /// The properties over (x, y).
    pub properties: SheetData<'a, 6>,
    /// y over (x, ψ_h).
    pub y_of_enthalpy: SheetData<'a, 1>,
    /// y over (x, ψ_s).
    pub y_of_entropy: SheetData<'a, 1>,
    /// The generator's CRCs of the three, in that order.
    pub expected: [u32; 3],
}

impl SinglePhaseSheetData<'static> {
    const fn of(table: TableId, sheet: &'static SinglePhaseSheet, expected: [u32; 3]) -> Self {
        Self {
            table,
            properties: SheetData::of_sheet(&sheet.properties),
            y_of_enthalpy: SheetData::of_sheet(&sheet.y_of_enthalpy),
            y_of_entropy: SheetData::of_sheet(&sheet.y_of_entropy),
            expected,
        }
    }
}

/// Every single-phase sheet with its CRCs: [`SinglePhaseTables::compiled`]
/// for the tables linked into the firmware, or a copy (the host tests damage
/// copies to show that [`check_single_phase_checksums`] notices).
#[derive(Debug, Clone, Copy)]
pub struct SinglePhaseTables<'a> {
    /// The six sheets, in the order of [`TableId::ALL`].
    pub sheets: [SinglePhaseSheetData<'a>; 6],
}

impl SinglePhaseTables<'static> {
    /// The compiled single-phase tables and their generated CRCs.
    pub const fn compiled() -> Self {
        use single_phase as t;
        Self {
            sheets: [
                SinglePhaseSheetData::of(TableId::VapourLow, &t::VAPOUR_LOW, t::VAPOUR_LOW_CRC32),
                SinglePhaseSheetData::of(TableId::LiquidLow, &t::LIQUID_LOW, t::LIQUID_LOW_CRC32),
                SinglePhaseSheetData::of(
                    TableId::LiquidHigh,
                    &t::LIQUID_HIGH,
                    t::LIQUID_HIGH_CRC32,
                ),
                SinglePhaseSheetData::of(
                    TableId::LiquidNearCritical,
                    &t::LIQUID_NEAR_CRITICAL,
                    t::LIQUID_NEAR_CRITICAL_CRC32,
                ),
                SinglePhaseSheetData::of(
                    TableId::VapourNearCritical,
                    &t::VAPOUR_NEAR_CRITICAL,
                    t::VAPOUR_NEAR_CRITICAL_CRC32,
                ),
                SinglePhaseSheetData::of(
                    TableId::VapourHigh,
                    &t::VAPOUR_HIGH,
                    t::VAPOUR_HIGH_CRC32,
                ),
            ],
        }
    }
}

/// Checks the CRC of every array of every single-phase sheet in `tables`.
/// [`self_test`] calls this with [`SinglePhaseTables::compiled`].
///
/// # Errors
/// [`IntegrityError::ChecksumMismatch`] naming the first sheet with a
/// differing CRC (`expected`/`computed` those of its first damaged array).
pub fn check_single_phase_checksums(tables: &SinglePhaseTables<'_>) -> Result<(), IntegrityError> {
    for sheet in &tables.sheets {
        let computed = [
            sheet.properties.checksum(),
            sheet.y_of_enthalpy.checksum(),
            sheet.y_of_entropy.checksum(),
        ];
        for (c, e) in computed.iter().zip(sheet.expected.iter()) {
            if c != e {
                return Err(IntegrityError::ChecksumMismatch {
                    table: sheet.table,
                    expected: *e,
                    computed: *c,
                });
            }
        }
    }
    Ok(())
}

/// A published saturation temperature at a pressure.
struct TemperaturePoint {
    table: TableId,
    pressure_pa: f32,
    temperature_k: f32,
}

/// A published saturation pressure at a temperature.
struct PressurePoint {
    table: TableId,
    temperature_k: f32,
    pressure_pa: f32,
}

// The published values have more digits than an f32 holds: written in full
// as f64 (so they read as printed) and rounded once, at compile time.

/// One point through each temperature table.
const TEMPERATURE_POINTS: [TemperaturePoint; 2] = [
    // IAPWS R7-97(2012) Table 36: T_sat(1 MPa) = 453.035632 K.
    TemperaturePoint {
        table: TableId::TemperatureLow,
        pressure_pa: 1.0e6,
        temperature_k: 453.035_632_f64 as f32,
    },
    // IAPWS R7-97(2012) Eq. 31 evaluated in f64 (vapora-tables, checked
    // against Table 36): T_sat(20 MPa) = 638.8959115 K.
    TemperaturePoint {
        table: TableId::TemperatureHigh,
        pressure_pa: 20.0e6,
        temperature_k: 638.895_911_5_f64 as f32,
    },
];

/// One point through each state table (the saturation pressure comes from
/// the state tables' ln p quantity).
const PRESSURE_POINTS: [PressurePoint; 2] = [
    // IAPWS R7-97(2012) Table 35: p_sat(500 K) = 2.63889776 MPa.
    PressurePoint {
        table: TableId::StateLow,
        temperature_k: 500.0,
        pressure_pa: 2.638_897_76e6_f64 as f32,
    },
    // IAPWS R7-97(2012) Eq. 30 evaluated in f64 (vapora-tables, checked
    // against Table 35): p_sat(640 K) = 20.26594217 MPa.
    PressurePoint {
        table: TableId::StateHigh,
        temperature_k: 640.0,
        pressure_pa: 2.026_594_217e7_f64 as f32,
    },
];

/// Evaluates one published point per table through the public functions and
/// compares with the kernel's stated accuracy below Tc − 1 K (every point
/// is below 646 K).
///
/// # Errors
/// [`IntegrityError::SpotCheckFailed`] for the first point outside the
/// stated accuracy (or whose computation returned an error).
pub fn check_spot_points() -> Result<(), IntegrityError> {
    let accuracy = &ACCURACY_BELOW_NEAR_CRITICAL;
    for point in &TEMPERATURE_POINTS {
        let computed = AbsolutePressure::from_pa(point.pressure_pa)
            .ok()
            .and_then(|p| saturation_temperature(p).ok())
            .map_or(f32::NAN, Temperature::as_kelvin);
        // NaN fails: a comparison with NaN is false.
        let within = (computed - point.temperature_k).abs() <= accuracy.temperature_k;
        if !within {
            return Err(IntegrityError::SpotCheckFailed {
                table: point.table,
                input: point.pressure_pa,
                expected: point.temperature_k,
                computed,
            });
        }
    }
    for point in &PRESSURE_POINTS {
        let computed = Temperature::from_kelvin(point.temperature_k)
            .ok()
            .and_then(|t| saturation_pressure(t).ok())
            .map_or(f32::NAN, AbsolutePressure::as_pa);
        let within =
            (computed - point.pressure_pa).abs() <= accuracy.pressure_relative * point.pressure_pa;
        if !within {
            return Err(IntegrityError::SpotCheckFailed {
                table: point.table,
                input: point.temperature_k,
                expected: point.pressure_pa,
                computed,
            });
        }
    }
    // One published single-phase point per side of the saturation line:
    // IAPWS R7-97(2012) Table 5 (Region 1, 3 MPa, 300 K: v = 0.100215168e-2
    // m³/kg) and Table 15 (Region 2, 3.5 kPa, 700 K: v = 0.923015898e2
    // m³/kg), density within 1e-4 relative (looser than the tables' bound:
    // a damaged table is far off, rounding is not).
    let liquid = AbsolutePressure::from_pa(3.0e6)
        .ok()
        .zip(Temperature::from_kelvin(300.0).ok())
        .and_then(|(p, t)| compressed_liquid(p, t).ok())
        .map_or(f32::NAN, |s| s.specific_volume_m3_kg);
    let vapour = AbsolutePressure::from_pa(3.5e3)
        .ok()
        .zip(Temperature::from_kelvin(700.0).ok())
        .and_then(|(p, t)| superheated_vapour(p, t).ok())
        .map_or(f32::NAN, |s| s.specific_volume_m3_kg);
    for (table, input, expected, computed) in [
        (
            TableId::LiquidLow,
            3.0e6,
            0.100_215_168e-2_f64 as f32,
            liquid,
        ),
        (
            TableId::VapourLow,
            3.5e3,
            0.923_015_898e2_f64 as f32,
            vapour,
        ),
    ] {
        let within = (computed - expected).abs() <= 1e-4 * expected;
        if !within {
            return Err(IntegrityError::SpotCheckFailed {
                table,
                input,
                expected,
                computed,
            });
        }
    }
    Ok(())
}

/// The device's self-test of its tables: the CRC of every compiled table
/// against the generator's ([`check_checksums`]), then one published point
/// per table against the stated accuracy ([`check_spot_points`]).
///
/// Takes no input and has no range; call it at start-up and periodically
/// (see the module documentation for what to do on failure). Reads every
/// table byte once; no allocation, no static RAM.
///
/// # Errors
/// [`IntegrityError::ChecksumMismatch`] or
/// [`IntegrityError::SpotCheckFailed`], naming the table that failed.
pub fn self_test() -> Result<(), IntegrityError> {
    check_checksums(&TableSet::compiled())?;
    check_single_phase_checksums(&SinglePhaseTables::compiled())?;
    check_spot_points()
}
