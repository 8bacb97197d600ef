//! Steam-header monitor of Brannock Vale creamery (an invented plant):
//! scans five 4–20 mA transmitters through the SPI ADC driver, scales and
//! range-checks them, holds last good values on a fault, computes the steam
//! figures through [`compute`], prints one line per scan over semihosting
//! (format in `report.rs`) and exits with success only if every fault the
//! scenario injects was flagged on the scan it was injected, and no other.
#![no_std]
#![no_main]

use cortex_m_rt::entry;
use cortex_m_semihosting::{debug, hprintln};
use heapless::{spsc::Queue, Vec};
use panic_semihosting as _;

use vapora_firmware_example::adc::{AdcError, LoopInputAdc};
use vapora_firmware_example::compute::{self, ScanInputs, KERNEL_WIRED};
use vapora_firmware_example::hold::{LastGood, Reading};
use vapora_firmware_example::loop_scaling::{LoopFault, LoopRange};
use vapora_firmware_example::report::{self, Opt};
use vapora_firmware_example::scenario::{self, SCANNED_CHANNELS, SCANS};
use vapora_firmware_example::sim_bus::{ScenarioBus, SimBusError};

/// Transmitter range per scanned channel, in the order of
/// [`SCANNED_CHANNELS`].
const RANGES: [LoopRange; 5] = [
    scenario::RANGE_HEADER_PRESSURE_PA,
    scenario::RANGE_AMBIENT_PRESSURE_PA,
    scenario::RANGE_HEADER_TEMPERATURE_C,
    scenario::RANGE_MASS_FLOW_KG_S,
    scenario::RANGE_DRYNESS,
];

/// What acquisition hands to computation through the queue. On a device
/// acquisition runs in a timer interrupt and computation in the main loop;
/// the single-producer single-consumer queue is the hand-over.
struct RawScan {
    index: usize,
    codes: [Result<u16, AdcError<SimBusError>>; 5],
}

/// One rejected reading, for the event log.
#[derive(Clone, Copy)]
struct Event {
    scan: usize,
    channel: u8,
    fault: LoopFault,
}

/// Event log capacity: enough for the scenario's faults; further events
/// are counted, not stored (a real device would wrap or send them on).
const EVENT_LOG_CAPACITY: usize = 16;

fn fault_text(fault: LoopFault) -> (&'static str, Option<f32>) {
    match fault {
        LoopFault::UnderRange { milliamps } => ("under-range", Some(milliamps)),
        LoopFault::OverRange { milliamps } => ("over-range", Some(milliamps)),
        LoopFault::ConverterUnreadable => ("converter-unreadable", None),
        // LoopFault is non_exhaustive for other crates only; keep a text
        // for any variant added later.
        #[allow(unreachable_patterns)]
        _ => ("other", None),
    }
}

#[entry]
fn main() -> ! {
    hprintln!(
        "begin firmware=steam-header-monitor board={} scans={} kernel={}",
        env!("VAPORA_BOARD"),
        SCANS.len(),
        if KERNEL_WIRED {
            "wired"
        } else {
            "not-yet-wired"
        }
    );
    if !KERNEL_WIRED {
        hprintln!("note kernel not yet wired: no steam figures are computed");
    }

    let mut queue: Queue<RawScan, 4> = Queue::new();
    let (mut producer, mut consumer) = queue.split();
    let mut adc = LoopInputAdc::new(ScenarioBus::new(scenario::FRONT_END, SCANS[0]));
    let mut last_good = [LastGood::default(); 5];
    let mut events: Vec<Event, EVENT_LOG_CAPACITY> = Vec::new();
    let mut events_dropped = 0u32;
    let mut queue_overruns = 0u32;
    let mut check_failures = 0u32;
    let mut steam_errors = 0u32;

    for (index, field) in SCANS.iter().enumerate() {
        // Acquisition.
        adc.bus_mut().set_field(*field);
        let codes = SCANNED_CHANNELS.map(|channel| adc.read_code(channel));
        if producer.enqueue(RawScan { index, codes }).is_err() {
            queue_overruns += 1;
        }

        // Computation.
        while let Some(raw) = consumer.dequeue() {
            let mut flags = 0u16;
            let mut readings = [Reading::Fresh(0.0); 5];
            for (slot, ((code, range), (&channel, state))) in readings.iter_mut().zip(
                raw.codes
                    .iter()
                    .zip(RANGES.iter())
                    .zip(SCANNED_CHANNELS.iter().zip(last_good.iter_mut())),
            ) {
                let scaled = match code {
                    Ok(code) => range.scale(scenario::FRONT_END.current_milliamps(*code)),
                    Err(_) => Err(LoopFault::ConverterUnreadable),
                };
                if let Err(fault) = scaled {
                    let event = Event {
                        scan: raw.index,
                        channel,
                        fault,
                    };
                    if events.push(event).is_err() {
                        events_dropped += 1;
                    }
                }
                *slot = state.update(scaled);
                match slot {
                    Reading::Fresh(_) => {}
                    Reading::Held { .. } => flags |= report::faulted_flag(channel),
                    Reading::Lost(_) => {
                        flags |= report::faulted_flag(channel) | report::lost_flag(channel)
                    }
                }
            }

            // Self-check against the faults the scenario injected.
            let mut expected = SCANS
                .get(raw.index)
                .map_or((0, 0), |s| (s.expected_faulted, s.expected_lost));
            if cfg!(feature = "inject-check-failure") && raw.index == 0 {
                // Proves the harness sees a failing firmware: scan 0 is
                // healthy, so expecting a fault on it must fail the run.
                expected.0 |= 1;
            }
            let faulted = (flags & 0xFF) as u8;
            let lost = (flags >> 8 & 0x1F) as u8;
            if (faulted, lost) != expected {
                check_failures += 1;
                hprintln!(
                    "check scan={} faulted=0x{:02x} expected_faulted=0x{:02x} lost=0x{:02x} expected_lost=0x{:02x}",
                    raw.index, faulted, expected.0, lost, expected.1
                );
            }

            let [gauge, ambient, temperature, flow, dryness] = readings.map(|r| r.value());
            let absolute = match (gauge, ambient) {
                (Some(g), Some(a)) => Some(compute::absolute_pressure_pa(g, a)),
                _ => None,
            };
            let figures = absolute.map(|p| {
                p.and_then(|p| {
                    compute::steam_figures(&ScanInputs {
                        absolute_pressure_pa: p,
                        header_temperature_c: temperature,
                        mass_flow_kg_s: flow,
                        dryness_fraction: dryness,
                    })
                })
            });
            let absolute = absolute.and_then(Result::ok);
            let steam = match figures {
                None => "no-pressure",
                Some(Ok(f)) => {
                    if f.superheat_low {
                        flags |= report::SUPERHEAT_LOW;
                    }
                    let expected = SCANS
                        .get(raw.index)
                        .is_some_and(|s| s.expected_superheat_low);
                    if f.superheat_low != expected {
                        check_failures += 1;
                        hprintln!(
                            "check scan={} superheat_low={} expected={}",
                            raw.index,
                            f.superheat_low,
                            expected
                        );
                    }
                    "ok"
                }
                Some(Err(compute::ComputeError::KernelNotWired)) => {
                    flags |= report::KERNEL_NOT_WIRED;
                    "not-wired"
                }
                #[allow(unreachable_patterns)]
                Some(Err(_)) => {
                    flags |= report::STEAM_ERROR;
                    steam_errors += 1;
                    "error"
                }
            };
            hprintln!(
                "scan i={} p_gauge_pa={} ambient_pa={} p_abs_pa={} t_c={} flow_kg_s={} dryness={} flags=0x{:04x} steam={}",
                raw.index,
                Opt(gauge),
                Opt(ambient),
                Opt(absolute),
                Opt(temperature),
                Opt(flow),
                Opt(dryness),
                flags,
                steam
            );
            if let Some(Ok(f)) = figures {
                hprintln!(
                    "steam i={} t_sat_c={} margin_k={} rho_v_kg_m3={} h_v_j_kg={} h_j_kg={} energy_kw={}",
                    raw.index,
                    f.saturation_temperature_c,
                    Opt(f.superheat_margin_k),
                    f.saturated_vapour_density_kg_m3,
                    f.saturated_vapour_enthalpy_j_kg,
                    f.steam_enthalpy_j_kg,
                    Opt(f.energy_flow_kw)
                );
            }
        }
    }

    for e in &events {
        let (kind, milliamps) = fault_text(e.fault);
        hprintln!(
            "event scan={} channel={} fault={} milliamps={}",
            e.scan,
            e.channel,
            kind,
            Opt(milliamps)
        );
    }
    let pass =
        check_failures == 0 && queue_overruns == 0 && events_dropped == 0 && steam_errors == 0;
    hprintln!(
        "summary scans={} events={} events_dropped={} queue_overruns={} check_failures={} steam_errors={}",
        SCANS.len(),
        events.len(),
        events_dropped,
        queue_overruns,
        check_failures,
        steam_errors
    );
    hprintln!("end result={}", if pass { "pass" } else { "fail" });
    debug::exit(if pass {
        debug::EXIT_SUCCESS
    } else {
        debug::EXIT_FAILURE
    });
    #[allow(clippy::empty_loop)]
    loop {}
}
