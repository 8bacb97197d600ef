//! Emits the generated tables as Rust source for the kernel.
//!
//! Every f32 is written in its shortest round-trip decimal form (Rust's own
//! `{:e}` formatting of `f32`), so the compiler reads back exactly the bits
//! the generator computed; [`format_f32`] checks that on every value. The
//! header names the generator and its settings and carries a CRC-32 of the
//! content below it, so a hand edit is detectable.

use std::format;
use std::string::String;

use super::measure::{bound_from_measured, Measured, ZoneMaxima};
use super::{Generated, OctaveTable, Table};

/// The command that regenerates the committed file, written into its header.
pub const REGENERATE_COMMAND: &str =
    "cargo run -p vapora-tables --features generator --bin vapora-generate -- --output kernel/src/tables/saturation.rs";

/// The header line that precedes the checksummed content.
pub const CHECKSUM_PREFIX: &str =
    "// Content checksum (CRC-32/ISO-HDLC of every byte after this line): 0x";

/// Shortest decimal form of `v` that reads back as the same f32.
///
/// # Panics
/// Never for finite values (the round trip is guaranteed by Rust's float
/// formatting); the generator only runs on the host.
pub fn format_f32(v: f32) -> String {
    let s = format!("{v:e}");
    let back: f32 = s.parse().unwrap_or(f32::NAN);
    assert!(
        back.to_bits() == v.to_bits(),
        "f32 {v} does not round-trip through {s}"
    );
    s
}

/// CRC-32/ISO-HDLC of `bytes`.
pub fn checksum(bytes: &[u8]) -> u32 {
    crc::Crc::<u32>::new(&crc::CRC_32_ISO_HDLC).checksum(bytes)
}

fn table<const P: usize>(out: &mut String, name: &str, doc: &str, t: &Table<P>) {
    out.push_str(&format!("/// {doc}\n"));
    out.push_str(&format!(
        "/// {} intervals × {P} cubics × 16 bytes = {} bytes.\n",
        t.intervals.len(),
        t.size_bytes()
    ));
    out.push_str(&format!(
        "pub static {name}: UniformCubicTable<{P}> = UniformCubicTable {{\n"
    ));
    out.push_str(&format!("    start: {},\n", format_f32(t.knots.start)));
    out.push_str(&format!(
        "    inverse_step: {},\n",
        format_f32(t.knots.inverse_step)
    ));
    out.push_str("    intervals: &[\n");
    for (i, block) in t.intervals.iter().enumerate() {
        out.push_str(&format!("        // interval {i}\n        [\n"));
        for c in block {
            out.push_str(&format!(
                "            [{}, {}, {}, {}],\n",
                format_f32(c[0]),
                format_f32(c[1]),
                format_f32(c[2]),
                format_f32(c[3])
            ));
        }
        out.push_str("        ],\n");
    }
    out.push_str("    ],\n};\n\n");
}

fn octave_table<const P: usize>(out: &mut String, name: &str, doc: &str, t: &OctaveTable<P>) {
    out.push_str(&format!("/// {doc}\n"));
    out.push_str(&format!(
        "/// {} intervals ({} per octave) × {P} cubics × 16 bytes = {} bytes.\n",
        t.intervals.len(),
        1u32 << (23 - t.shift),
        t.size_bytes()
    ));
    out.push_str(&format!(
        "pub static {name}: OctaveCubicTable<{P}> = OctaveCubicTable {{\n"
    ));
    out.push_str(&format!("    shift: {},\n", t.shift));
    out.push_str(&format!("    first: {},\n", t.first));
    out.push_str("    intervals: &[\n");
    for (i, block) in t.intervals.iter().enumerate() {
        out.push_str(&format!(
            "        // interval {i}: from {}\n        [\n",
            format_f32(t.knot(i) as f32)
        ));
        for c in block {
            out.push_str(&format!(
                "            [{}, {}, {}, {}],\n",
                format_f32(c[0]),
                format_f32(c[1]),
                format_f32(c[2]),
                format_f32(c[3])
            ));
        }
        out.push_str("        ],\n");
    }
    out.push_str("    ],\n};\n\n");
}

fn accuracy(out: &mut String, name: &str, doc: &str, z: &ZoneMaxima, points: usize) {
    out.push_str(&format!("/// {doc}\n"));
    if points == 0 {
        out.push_str(
            "///\n/// No part of this table's envelope lies in the zone: the zeros below\n\
             /// are not a measurement, and the zone is never reached.\n",
        );
    } else {
        out.push_str(&format!("///\n/// Measured at {points} points.\n"));
    }
    out.push_str(&format!(
        "pub const {name}: SaturationAccuracy = SaturationAccuracy {{\n"
    ));
    for (field, value) in z.fields() {
        let bound = bound_from_measured(value) as f32;
        out.push_str(&format!(
            "    {field}: {}, // measured maximum {value:.3e}\n",
            format_f32(bound)
        ));
    }
    out.push_str("};\n\n");
}

fn constant(out: &mut String, name: &str, doc: &str, v: f32) {
    out.push_str(&format!(
        "/// {doc}\npub const {name}: f32 = {};\n\n",
        format_f32(v)
    ));
}

/// The complete source of `kernel/src/tables.rs`.
pub fn emit(g: &Generated, measured: &Measured) -> String {
    let l = &g.limits;
    let mut body = String::new();
    body.push_str(
        "//! The generated saturation tables: four cubic-spline tables and the\n\
         //! constants that define their variables, produced by `vapora-generate`\n\
         //! from the IAPWS-IF97 formulation in f64. Never edit by hand.\n\
         //!\n\
         //! Layout (see the `vapora_tables::generator` docs for why these variables):\n\
         //! state tables hold, per interval, cubics in the local t ∈ [0, 1] for\n\
         //! ln p (ln Pa), ρ' (kg/m³), ρ''/p (kg/(m³·Pa)), h', h'' (J/kg), s', s''\n\
         //! (J/(kg·K)), 1/cp', 1/cp'' (kg·K/J); [`STATE_LOW`] is indexed on T (K)\n\
         //! below 623.15 K, [`STATE_HIGH`] on τ = √(Tc − T) (√K). The temperature\n\
         //! tables give T (K) from p below p_sat(623.15 K) ([`TEMPERATURE_LOW`])\n\
         //! and τ from q = pc − p (Pa) above it ([`TEMPERATURE_HIGH`]), both\n\
         //! indexed on the f32 bit pattern of their input (intervals of equal\n\
         //! width inside each octave, knots at the powers of two: no logarithm\n\
         //! and no root), as cubic Hermite interpolants of the formulation.\n",
    );
    body.push_str(&format!(
        "//!\n//! Coefficient flash: {} bytes in total.\n",
        g.size_bytes()
    ));
    body.push_str(
        "//!\n\
         //! The accuracy constants are the generator's own measurement of these\n\
         //! tables along the kernel's paths (from temperature and from pressure) on a\n\
         //! grid the configured number of times finer than the knots, ×2 (margin for\n\
         //! points between grid points), rounded up to two digits; `host-tests`\n\
         //! checks the kernel against them on a denser grid plus random points.\n\n",
    );
    body.push_str(
        "use crate::accuracy::SaturationAccuracy;\nuse crate::spline::{OctaveCubicTable, UniformCubicTable};\n\n",
    );
    constant(
        &mut body,
        "CRITICAL_TEMPERATURE_K",
        "Critical temperature 647.096 K as f32 (defines τ = √(Tc − T)).",
        l.critical_temperature_k,
    );
    constant(
        &mut body,
        "CRITICAL_PRESSURE_PA",
        "Critical pressure 22.064 MPa as f32 (defines q = pc − p).",
        l.critical_pressure_pa,
    );
    constant(
        &mut body,
        "BOUNDARY_TEMPERATURE_K",
        "First f32 above 623.15 K: temperatures below it use the low state table (the formulation takes T ≤ 623.15 K from Regions 1 and 2).",
        l.boundary_temperature_k,
    );
    constant(
        &mut body,
        "BOUNDARY_PRESSURE_PA",
        "First f32 above p_sat(623.15 K), Pa: pressures below it use the low tables.",
        l.boundary_pressure_pa,
    );
    constant(
        &mut body,
        "TEMPERATURE_MIN_K",
        "Lowest accepted saturation temperature, K.",
        l.temperature_min_k,
    );
    constant(
        &mut body,
        "TEMPERATURE_MAX_K",
        "Highest accepted saturation temperature, K.",
        l.temperature_max_k,
    );
    constant(
        &mut body,
        "PRESSURE_MIN_PA",
        "Lowest accepted saturation pressure, Pa.",
        l.pressure_min_pa,
    );
    constant(
        &mut body,
        "PRESSURE_MAX_PA",
        "Highest accepted saturation pressure, Pa.",
        l.pressure_max_pa,
    );
    table(
        &mut body,
        "STATE_LOW",
        "Saturated state below 623.15 K, indexed on T (K).",
        &g.state_low,
    );
    table(
        &mut body,
        "STATE_HIGH",
        "Saturated state from 623.15 K, indexed on τ = √(Tc − T) (√K).",
        &g.state_high,
    );
    octave_table(
        &mut body,
        "TEMPERATURE_LOW",
        "Saturation temperature T (K) below p_sat(623.15 K), indexed on the bit pattern of p (Pa).",
        &g.temperature_low,
    );
    octave_table(
        &mut body,
        "TEMPERATURE_HIGH",
        "τ = √(Tc − T_sat) (√K) from p_sat(623.15 K), indexed on the bit pattern of q = pc − p (Pa).",
        &g.temperature_high,
    );
    accuracy(
        &mut body,
        "ACCURACY_BELOW_NEAR_CRITICAL",
        "Accuracy bound for saturation temperatures below Tc − 1 K (generator's measurement).",
        &measured.below_near_critical,
        measured.points[0],
    );
    accuracy(
        &mut body,
        "ACCURACY_NEAR_CRITICAL",
        "Accuracy bound from Tc − 1 K to Tc − 0.01 K (generator's measurement).",
        &measured.near_critical,
        measured.points[1],
    );
    let mut out = String::new();
    out.push_str(&format!(
        "// @generated by vapora-generate {} (crate vapora-tables) from the IAPWS-IF97 formulation.\n",
        env!("CARGO_PKG_VERSION")
    ));
    out.push_str("// Do not edit by hand. Regenerate with:\n");
    out.push_str(&format!("//   {REGENERATE_COMMAND}\n"));
    out.push_str(&format!("// Settings: {}\n", g.config.describe()));
    out.push_str(&format!(
        "{CHECKSUM_PREFIX}{:08x}\n",
        checksum(body.as_bytes())
    ));
    out.push_str(&body);
    out
}
