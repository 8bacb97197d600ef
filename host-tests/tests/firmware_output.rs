//! The steam figures the firmware example printed on each emulated core,
//! checked against the f64 IAPWS-IF97 formulation within the kernel's
//! stated accuracy (`vapora_kernel::accuracy`).
//!
//! The firmware's output comes from `scripts/firmware-tests.sh`, which runs
//! the monitor in QEMU and then this test with `--ignored` and
//! `VAPORA_FIRMWARE_OUTPUT` set to the folder of `<target>-monitor.txt`. A
//! plain `cargo test` has no emulator output, so the test is ignored there.
//!
//! Printed floats are Rust's shortest round-trip form: parsing them back as
//! f32 gives the firmware's exact bits.

use std::collections::HashMap;
use std::path::PathBuf;

use vapora_host_tests::accuracy::reference_at_pressure;
use vapora_kernel::accuracy::accuracy_at_saturation_temperature_k;

const TARGETS: [&str; 3] = [
    "thumbv6m-none-eabi",
    "thumbv7m-none-eabi",
    "thumbv7em-none-eabihf",
];

/// The plant's settings the firmware applies (firmware-example
/// `scenario.rs`, invented): low-superheat alarm below 5 K, wet-steam
/// enthalpy from the probe's dryness below 1 K of superheat.
const SUPERHEAT_ALARM_MARGIN_K: f64 = 5.0;
const SATURATED_BAND_K: f64 = 1.0;

/// Flag bit of the low-superheat alarm (firmware-example `report.rs`).
const SUPERHEAT_LOW_FLAG: u32 = 1 << 13;

/// Kelvin of 0 °C as the kernel holds it (f32), to undo its °C conversion.
const ZERO_CELSIUS_K_F32: f64 = 273.15f32 as f64;

/// Unit in the last place of an f32 value: the rounding of one f32
/// operation the firmware does after the kernel (°C conversion, margin,
/// lever rule, mass flow × enthalpy) is at most half of it.
fn ulp(value: f32) -> f64 {
    let v = value.abs();
    f64::from(f32::from_bits(v.to_bits() + 1) - v)
}

/// A failure message when `value` is farther than `allowed` from `expected`.
fn out_of_bound(
    context: &str,
    p_pa: f64,
    name: &str,
    value: f64,
    expected: f64,
    allowed: f64,
) -> Option<String> {
    let deviation = (value - expected).abs();
    // Written so that NaN fails.
    (deviation.is_nan() || deviation > allowed).then(|| {
        format!(
            "{context}: {name} = {value}, IF97 {expected}, deviation {deviation:e} > allowed {allowed:e} (p = {p_pa} Pa)"
        )
    })
}

type Record = HashMap<String, String>;

fn parse(line: &str) -> Record {
    line.split(' ')
        .skip(1)
        .filter_map(|field| field.split_once('='))
        .map(|(k, v)| (k.to_string(), v.to_string()))
        .collect()
}

fn number(record: &Record, key: &str, context: &str) -> f32 {
    let text = record
        .get(key)
        .unwrap_or_else(|| panic!("{context}: no field {key}"));
    text.parse()
        .unwrap_or_else(|_| panic!("{context}: {key}={text} is not a number"))
}

fn optional(record: &Record, key: &str, context: &str) -> Option<f32> {
    match record.get(key).map(String::as_str) {
        Some("-") => None,
        _ => Some(number(record, key, context)),
    }
}

/// Checks one core's output; returns the number of scans with steam
/// figures and a list of failure messages.
fn check_core(target: &str, text: &str) -> (usize, Vec<String>) {
    let mut scans: HashMap<String, Record> = HashMap::new();
    let mut steams: Vec<Record> = Vec::new();
    let mut scans_ok = 0;
    for line in text.lines() {
        if line.starts_with("scan ") {
            let r = parse(line);
            if r.get("steam").map(String::as_str) == Some("ok") {
                scans_ok += 1;
            }
            scans.insert(r["i"].clone(), r);
        } else if line.starts_with("steam ") {
            steams.push(parse(line));
        }
    }
    let mut failures = Vec::new();
    if steams.len() != scans_ok {
        failures.push(format!(
            "{target}: {scans_ok} scans say steam=ok but {} steam records",
            steams.len()
        ));
    }
    for steam in &steams {
        let i = &steam["i"];
        let context = format!("{target} scan {i}");
        let scan = &scans[i];
        let p_pa = f64::from(number(scan, "p_abs_pa", &context));
        let reference = reference_at_pressure(p_pa)
            .unwrap_or_else(|| panic!("{context}: no IF97 saturated state at {p_pa} Pa"));
        // ρ', ρ'', h', h'' of the formulation (IAPWS R7-97(2012) Regions 1,
        // 2 and 4, f64).
        let [_, rho_v_ref, h_l_ref, h_v_ref, ..] = reference.properties;
        let t_sat_ref_k = reference.temperature_k;
        let bound = accuracy_at_saturation_temperature_k(t_sat_ref_k as f32);

        let mut found: Vec<String> = Vec::new();
        let check =
            |found: &mut Vec<String>, name: &str, value: f64, expected: f64, allowed: f64| {
                found.extend(out_of_bound(&context, p_pa, name, value, expected, allowed));
            };

        let t_sat_c = number(steam, "t_sat_c", &context);
        let t_sat_k = f64::from(t_sat_c) + ZERO_CELSIUS_K_F32;
        check(
            &mut found,
            "saturation temperature, K",
            t_sat_k,
            t_sat_ref_k,
            f64::from(bound.temperature_k) + ulp(t_sat_c),
        );

        let rho_v = f64::from(number(steam, "rho_v_kg_m3", &context));
        check(
            &mut found,
            "saturated vapour density, relative",
            (rho_v - rho_v_ref) / rho_v_ref,
            0.0,
            f64::from(bound.vapour_density_relative),
        );

        let h_v = number(steam, "h_v_j_kg", &context);
        check(
            &mut found,
            "saturated vapour enthalpy, J/kg",
            f64::from(h_v),
            h_v_ref,
            f64::from(bound.vapour_enthalpy_j_kg),
        );

        let t_c = optional(scan, "t_c", &context);
        let margin = optional(steam, "margin_k", &context);
        let margin_ref = t_c.map(|t| f64::from(t) - (t_sat_ref_k - 273.15));
        match (margin, margin_ref, t_c) {
            (Some(m), Some(m_ref), Some(t)) => {
                check(
                    &mut found,
                    "superheat margin, K",
                    f64::from(m),
                    m_ref,
                    f64::from(bound.temperature_k) + ulp(t) + ulp(m),
                );
                let alarm = u32::from_str_radix(scan["flags"].trim_start_matches("0x"), 16)
                    .unwrap_or_else(|_| panic!("{context}: bad flags"))
                    & SUPERHEAT_LOW_FLAG
                    != 0;
                // Only where the reference margin is clear of the setting by
                // more than the kernel's temperature bound.
                if (m_ref - SUPERHEAT_ALARM_MARGIN_K).abs() > f64::from(bound.temperature_k) + 1e-3
                    && alarm != (m_ref < SUPERHEAT_ALARM_MARGIN_K)
                {
                    found.push(format!(
                        "{context}: low-superheat alarm {alarm}, IF97 margin {m_ref} K"
                    ));
                }
            }
            (None, None, None) => {}
            other => found.push(format!(
                "{context}: margin and temperature disagree: {other:?}"
            )),
        }

        let h = number(steam, "h_j_kg", &context);
        let dryness = optional(scan, "dryness", &context);
        let wet = matches!((margin_ref, dryness), (Some(m), Some(_)) if m < SATURATED_BAND_K);
        let h_ref = match (wet, dryness) {
            (true, Some(x)) => h_l_ref + f64::from(x) * (h_v_ref - h_l_ref),
            _ => h_v_ref,
        };
        // Wet steam: the larger of the liquid and vapour bounds (the kernel's
        // stated accuracy for the lever rule) plus its f32 arithmetic.
        let h_allowed = if wet {
            f64::from(bound.liquid_enthalpy_j_kg.max(bound.vapour_enthalpy_j_kg)) + 4.0 * ulp(h)
        } else {
            f64::from(bound.vapour_enthalpy_j_kg)
        };
        check(
            &mut found,
            "steam enthalpy, J/kg",
            f64::from(h),
            h_ref,
            h_allowed,
        );

        let flow = optional(scan, "flow_kg_s", &context);
        let energy = optional(steam, "energy_kw", &context);
        match (flow, energy) {
            (Some(m), Some(e)) => {
                let e_ref = f64::from(m) * h_ref / 1000.0;
                check(
                    &mut found,
                    "energy flow, kW",
                    f64::from(e),
                    e_ref,
                    f64::from(m) * h_allowed / 1000.0 + 4.0 * ulp(e),
                );
            }
            (None, None) => {}
            other => found.push(format!("{context}: flow and energy disagree: {other:?}")),
        }
        failures.extend(found);
    }
    (steams.len(), failures)
}

#[test]
#[ignore = "needs the emulator output: run by scripts/firmware-tests.sh"]
fn firmware_steam_figures_match_the_formulation() {
    let dir = PathBuf::from(
        std::env::var("VAPORA_FIRMWARE_OUTPUT")
            .expect("VAPORA_FIRMWARE_OUTPUT: the folder of <target>-monitor.txt"),
    );
    let mut failures = Vec::new();
    for target in TARGETS {
        let path = dir.join(format!("{target}-monitor.txt"));
        let text = std::fs::read_to_string(&path)
            .unwrap_or_else(|e| panic!("cannot read {}: {e}", path.display()));
        let (checked, mut f) = check_core(target, &text);
        // The scenario has 18 scans, two without an absolute pressure (the
        // barometer lost): a wired kernel gives figures on the other 16.
        if checked != 16 {
            f.push(format!(
                "{target}: {checked} scans with steam figures, 16 expected"
            ));
        }
        println!("{target}: {checked} scans checked against IF97");
        failures.extend(f);
    }
    assert!(failures.is_empty(), "{}", failures.join("\n"));
}
