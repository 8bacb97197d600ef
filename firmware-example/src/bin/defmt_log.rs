//! The kernel's results logged with defmt instead of semihosting text: the
//! shape a production image takes, where formatting happens on the host
//! (`defmt-print` decodes the frames with the ELF's symbol table) and the
//! device only sends indices and raw values. Every kernel type derives
//! `defmt::Format` under the kernel's `defmt` feature; this binary is what
//! checks that it builds and decodes on each core.
//!
//! Built only with `--features defmt-log` (build.rs then adds `defmt.x` to
//! this binary's link). Run and decode (what `scripts/firmware-tests.sh` does):
//! `qemu-system-arm ... -kernel ELF | defmt-print -e ELF`.
//!
//! Operating points of the invented Brannock Vale header: start-up at
//! 2 bar(a), normal running at 10.2 bar(a), the superheater inlet at
//! 16 bar(a), the probe's dryness fraction 0.97, and the flash of a
//! condensate return (h = 800 kJ/kg at 2 bar(a)).
#![no_std]
#![no_main]

use cortex_m_rt::entry;
use cortex_m_semihosting::debug;
use defmt_semihosting as _;
use panic_semihosting as _;

use vapora_kernel::mixture::wet_steam_at_pressure;
use vapora_kernel::quality::phase_from_pressure_enthalpy;
use vapora_kernel::saturation::saturated_state_at_pressure;
use vapora_kernel::units::AbsolutePressure;

/// Header pressures, bar(a) (invented).
const POINTS_BAR: [f32; 3] = [2.0, 10.2, 16.0];
/// Dryness fraction of the inline probe (invented).
const PROBE_DRYNESS: f32 = 0.97;
/// Condensate return enthalpy, J/kg (invented).
const CONDENSATE_J_KG: f32 = 800e3;

fn run() -> bool {
    let mut ok = true;
    for (i, &bar) in POINTS_BAR.iter().enumerate() {
        let Ok(p) = AbsolutePressure::from_bar(bar) else {
            defmt::error!("point {}: {} bar is not a pressure", i, bar);
            ok = false;
            continue;
        };
        match saturated_state_at_pressure(p) {
            Ok(state) => defmt::info!("point {} saturated {}", i, state),
            Err(e) => {
                defmt::error!("point {} saturated {}", i, e);
                ok = false;
            }
        }
        match wet_steam_at_pressure(p, PROBE_DRYNESS) {
            Ok(wet) => defmt::info!("point {} wet {}", i, wet),
            Err(e) => {
                defmt::error!("point {} wet {}", i, e);
                ok = false;
            }
        }
    }
    let flash = AbsolutePressure::from_bar(2.0)
        .map_err(|_| ())
        .and_then(|p| phase_from_pressure_enthalpy(p, CONDENSATE_J_KG).map_err(|_| ()));
    match flash {
        Ok(phase) => defmt::info!("condensate flash {}", phase),
        Err(()) => {
            defmt::error!("condensate flash failed");
            ok = false;
        }
    }
    // A rejected input is logged with its typed error.
    if let Ok(p) = AbsolutePressure::from_bar(300.0) {
        if let Err(e) = saturated_state_at_pressure(p) {
            defmt::info!("expected error {}", e);
        } else {
            ok = false;
        }
    }
    ok
}

#[entry]
fn main() -> ! {
    defmt::info!(
        "begin firmware=defmt-log board={=str}",
        env!("VAPORA_BOARD")
    );
    let ok = run();
    defmt::info!("end result={=str}", if ok { "pass" } else { "fail" });
    defmt::flush();
    debug::exit(if ok {
        debug::EXIT_SUCCESS
    } else {
        debug::EXIT_FAILURE
    });
    #[allow(clippy::empty_loop)]
    loop {}
}
