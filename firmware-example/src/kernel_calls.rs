//! Every public kernel function as one uniform call: two f32 inputs in, the
//! exact bits of every output (or the error's discriminant and payload) out.
//!
//! This one file is compiled twice: here, for the bit-identity firmware
//! (`src/bin/bit_identity.rs`), and on the host by the vector generator in
//! `host-tests` (through `#[path]`), so host and device encode results the
//! same way and a difference in the vector file can only come from the
//! arithmetic. It depends on `core` and `vapora_kernel` alone.

use vapora_kernel::accuracy::accuracy_at_saturation_temperature_k;
use vapora_kernel::error::{MixtureError, PhaseError, SaturationError, UnitError};
use vapora_kernel::mixture::{wet_steam_at_pressure, wet_steam_at_temperature, WetSteam};
use vapora_kernel::quality::{
    phase_from_pressure_enthalpy, phase_from_pressure_entropy, phase_from_pressure_specific_volume,
    phase_from_temperature_enthalpy, phase_from_temperature_entropy, Phase,
};
use vapora_kernel::saturation::{
    saturated_property_at_pressure, saturated_property_at_temperature, saturated_state_at_pressure,
    saturated_state_at_temperature, saturation_pressure, saturation_temperature, SaturatedProperty,
    SaturatedState,
};
use vapora_kernel::spline::cubic;
use vapora_kernel::tables::saturation::{STATE_LOW, TEMPERATURE_LOW};
use vapora_kernel::units::{AbsolutePressure, GaugePressure, Temperature};

/// Most output words of any function (the saturated state: status plus 14).
pub const MAX_WORDS: usize = 15;

/// One call's result: `words[0]` is the status (0 = `Ok`, otherwise an
/// error code, see [`unit_code`] and friends), then the output bits; only
/// the first `len` words are meaningful.
#[derive(Clone, Copy, PartialEq, Eq, Debug)]
pub struct Output {
    /// Status word, then the f32 bits of each output (or the error's payload).
    pub words: [u32; MAX_WORDS],
    /// Number of meaningful words.
    pub len: usize,
}

impl Output {
    fn new(values: &[u32]) -> Self {
        let mut words = [0u32; MAX_WORDS];
        for (w, v) in words.iter_mut().zip(values) {
            *w = *v;
        }
        Output {
            words,
            len: values.len().min(MAX_WORDS),
        }
    }

    fn ok(values: &[f32]) -> Self {
        let mut words = [0u32; MAX_WORDS];
        for (w, v) in words.iter_mut().skip(1).zip(values) {
            *w = v.to_bits();
        }
        Output {
            words,
            len: (values.len() + 1).min(MAX_WORDS),
        }
    }

    /// The meaningful words.
    pub fn as_slice(&self) -> &[u32] {
        self.words.get(..self.len).unwrap_or(&self.words)
    }
}

/// One public kernel function in uniform form.
pub struct KernelCall {
    /// Name (the kernel's path, shortened).
    pub name: &'static str,
    /// The call: the inputs' meaning is per function (see its docs line).
    pub eval: fn([f32; 2]) -> Output,
}

/// Error code of a unit error: 0x1nn.
pub fn unit_code(e: UnitError) -> Output {
    match e {
        UnitError::NotFinite { value } => Output::new(&[0x101, value.to_bits()]),
        UnitError::NegativeAbsolutePressure { pressure_pa } => {
            Output::new(&[0x102, pressure_pa.to_bits()])
        }
        UnitError::NonPositiveTemperature { temperature_k } => {
            Output::new(&[0x103, temperature_k.to_bits()])
        }
        _ => Output::new(&[0x1ff]),
    }
}

/// Error code of a saturation error: 0x2nn.
pub fn saturation_code(e: SaturationError) -> Output {
    match e {
        SaturationError::PressureBelowRange {
            pressure_pa,
            minimum_pa,
        } => Output::new(&[0x201, pressure_pa.to_bits(), minimum_pa.to_bits()]),
        SaturationError::PressureAboveRange {
            pressure_pa,
            maximum_pa,
        } => Output::new(&[0x202, pressure_pa.to_bits(), maximum_pa.to_bits()]),
        SaturationError::TemperatureBelowRange {
            temperature_k,
            minimum_k,
        } => Output::new(&[0x203, temperature_k.to_bits(), minimum_k.to_bits()]),
        SaturationError::TemperatureAboveRange {
            temperature_k,
            maximum_k,
        } => Output::new(&[0x204, temperature_k.to_bits(), maximum_k.to_bits()]),
        SaturationError::EmptyTable => Output::new(&[0x205]),
        _ => Output::new(&[0x2ff]),
    }
}

/// Error code of a phase error: 0x3nn, or 0x1000 + the saturation code.
pub fn phase_code(e: PhaseError) -> Output {
    match e {
        PhaseError::Saturation(s) => {
            let mut out = saturation_code(s);
            out.words[0] += 0x1000;
            out
        }
        PhaseError::EnthalpyNotFinite { enthalpy_j_kg } => {
            Output::new(&[0x301, enthalpy_j_kg.to_bits()])
        }
        PhaseError::EntropyNotFinite { entropy_j_kgk } => {
            Output::new(&[0x302, entropy_j_kgk.to_bits()])
        }
        PhaseError::SpecificVolumeNotPositive {
            specific_volume_m3_kg,
        } => Output::new(&[0x303, specific_volume_m3_kg.to_bits()]),
        _ => Output::new(&[0x3ff]),
    }
}

/// Error code of a mixture error: 0x4nn, or 0x2000 + the saturation code.
pub fn mixture_code(e: MixtureError) -> Output {
    match e {
        MixtureError::Saturation(s) => {
            let mut out = saturation_code(s);
            out.words[0] += 0x2000;
            out
        }
        MixtureError::DrynessFractionOutOfRange { dryness_fraction } => {
            Output::new(&[0x401, dryness_fraction.to_bits()])
        }
        _ => Output::new(&[0x4ff]),
    }
}

/// The saturated properties in the order of the single-property calls'
/// second input (0..12).
pub const PROPERTIES: [SaturatedProperty; 12] = [
    SaturatedProperty::LiquidDensity,
    SaturatedProperty::VapourDensity,
    SaturatedProperty::LiquidSpecificVolume,
    SaturatedProperty::VapourSpecificVolume,
    SaturatedProperty::LiquidEnthalpy,
    SaturatedProperty::VapourEnthalpy,
    SaturatedProperty::LatentHeat,
    SaturatedProperty::LiquidEntropy,
    SaturatedProperty::VapourEntropy,
    SaturatedProperty::EntropyOfVaporisation,
    SaturatedProperty::LiquidCp,
    SaturatedProperty::VapourCp,
];

/// The property selected by a second input `index` (0.0, 1.0, …, 11.0);
/// anything else selects the last one.
pub fn property(index: f32) -> SaturatedProperty {
    let i = if (0.0..12.0).contains(&index) {
        index as usize
    } else {
        11
    };
    PROPERTIES
        .get(i)
        .copied()
        .unwrap_or(SaturatedProperty::VapourCp)
}

fn state(s: SaturatedState) -> Output {
    Output::ok(&[
        s.pressure.as_pa(),
        s.temperature.as_kelvin(),
        s.liquid.density_kg_m3,
        s.liquid.specific_volume_m3_kg,
        s.liquid.enthalpy_j_kg,
        s.liquid.entropy_j_kgk,
        s.liquid.cp_j_kgk,
        s.vapour.density_kg_m3,
        s.vapour.specific_volume_m3_kg,
        s.vapour.enthalpy_j_kg,
        s.vapour.entropy_j_kgk,
        s.vapour.cp_j_kgk,
        s.latent_heat_j_kg,
        s.entropy_of_vaporisation_j_kgk,
    ])
}

fn phase(p: Phase) -> Output {
    let discriminant = match p {
        Phase::SubcooledLiquid => 1,
        Phase::SaturatedLiquid => 2,
        Phase::WetSteam { .. } => 3,
        Phase::SaturatedVapour => 4,
        Phase::SuperheatedVapour => 5,
        Phase::Supercritical => 6,
    };
    Output::new(&[
        0,
        discriminant,
        p.dryness_fraction().map_or(u32::MAX, f32::to_bits),
    ])
}

fn wet(w: WetSteam) -> Output {
    Output::ok(&[
        w.pressure.as_pa(),
        w.temperature.as_kelvin(),
        w.dryness_fraction,
        w.enthalpy_j_kg,
        w.entropy_j_kgk,
        w.specific_volume_m3_kg,
        w.density_kg_m3,
    ])
}

fn with_pressure(pa: f32, f: impl FnOnce(AbsolutePressure) -> Output) -> Output {
    AbsolutePressure::from_pa(pa).map_or_else(unit_code, f)
}

fn with_temperature(k: f32, f: impl FnOnce(Temperature) -> Output) -> Output {
    Temperature::from_kelvin(k).map_or_else(unit_code, f)
}

fn pressure_out(r: Result<AbsolutePressure, UnitError>) -> Output {
    r.map_or_else(unit_code, |p| Output::ok(&[p.as_pa()]))
}

fn gauge_out(r: Result<GaugePressure, UnitError>) -> Output {
    r.map_or_else(unit_code, |p| Output::ok(&[p.as_pa()]))
}

fn temperature_out(r: Result<Temperature, UnitError>) -> Output {
    r.map_or_else(unit_code, |t| Output::ok(&[t.as_kelvin()]))
}

/// A table's `locate(x)` result, and `cubic` on every quantity of the
/// interval found: t, then the P values; status 0x501 for an empty table.
fn evaluate_located<const P: usize>(located: Option<(&[[f32; 4]; P], f32)>) -> Output {
    match located {
        None => Output::new(&[0x501]),
        Some((block, t)) => {
            let mut out = Output::ok(&[t]);
            for (w, c) in out.words.iter_mut().skip(2).zip(block.iter()) {
                *w = cubic(c, t).to_bits();
            }
            out.len = (2 + P).min(MAX_WORDS);
            out
        }
    }
}

/// Every public kernel function, in the vector file's order. Inputs: `p`
/// absolute pressure in Pa, `T` temperature in K, then the function's own
/// second input.
pub const CALLS: &[KernelCall] = &[
    // --- saturation line ---
    KernelCall {
        name: "saturation_temperature(p)",
        eval: |x| {
            with_pressure(x[0], |p| {
                saturation_temperature(p)
                    .map_or_else(saturation_code, |t| Output::ok(&[t.as_kelvin()]))
            })
        },
    },
    KernelCall {
        name: "saturation_pressure(T)",
        eval: |x| {
            with_temperature(x[0], |t| {
                saturation_pressure(t).map_or_else(saturation_code, |p| Output::ok(&[p.as_pa()]))
            })
        },
    },
    KernelCall {
        name: "saturated_state_at_pressure(p)",
        eval: |x| {
            with_pressure(x[0], |p| {
                saturated_state_at_pressure(p).map_or_else(saturation_code, state)
            })
        },
    },
    KernelCall {
        name: "saturated_state_at_temperature(T)",
        eval: |x| {
            with_temperature(x[0], |t| {
                saturated_state_at_temperature(t).map_or_else(saturation_code, state)
            })
        },
    },
    KernelCall {
        name: "saturated_property_at_pressure(p,property)",
        eval: |x| {
            with_pressure(x[0], |p| {
                saturated_property_at_pressure(p, property(x[1]))
                    .map_or_else(saturation_code, |v| Output::ok(&[v]))
            })
        },
    },
    KernelCall {
        name: "saturated_property_at_temperature(T,property)",
        eval: |x| {
            with_temperature(x[0], |t| {
                saturated_property_at_temperature(t, property(x[1]))
                    .map_or_else(saturation_code, |v| Output::ok(&[v]))
            })
        },
    },
    // --- phase and dryness fraction ---
    KernelCall {
        name: "phase_from_pressure_enthalpy(p,h)",
        eval: |x| {
            with_pressure(x[0], |p| {
                phase_from_pressure_enthalpy(p, x[1]).map_or_else(phase_code, phase)
            })
        },
    },
    KernelCall {
        name: "phase_from_pressure_entropy(p,s)",
        eval: |x| {
            with_pressure(x[0], |p| {
                phase_from_pressure_entropy(p, x[1]).map_or_else(phase_code, phase)
            })
        },
    },
    KernelCall {
        name: "phase_from_pressure_specific_volume(p,v)",
        eval: |x| {
            with_pressure(x[0], |p| {
                phase_from_pressure_specific_volume(p, x[1]).map_or_else(phase_code, phase)
            })
        },
    },
    KernelCall {
        name: "phase_from_temperature_enthalpy(T,h)",
        eval: |x| {
            with_temperature(x[0], |t| {
                phase_from_temperature_enthalpy(t, x[1]).map_or_else(phase_code, phase)
            })
        },
    },
    KernelCall {
        name: "phase_from_temperature_entropy(T,s)",
        eval: |x| {
            with_temperature(x[0], |t| {
                phase_from_temperature_entropy(t, x[1]).map_or_else(phase_code, phase)
            })
        },
    },
    // --- wet steam ---
    KernelCall {
        name: "wet_steam_at_pressure(p,x)",
        eval: |x| {
            with_pressure(x[0], |p| {
                wet_steam_at_pressure(p, x[1]).map_or_else(mixture_code, wet)
            })
        },
    },
    KernelCall {
        name: "wet_steam_at_temperature(T,x)",
        eval: |x| {
            with_temperature(x[0], |t| {
                wet_steam_at_temperature(t, x[1]).map_or_else(mixture_code, wet)
            })
        },
    },
    // --- stated accuracy ---
    KernelCall {
        name: "accuracy_at_saturation_temperature_k(T)",
        eval: |x| {
            let a = accuracy_at_saturation_temperature_k(x[0]);
            Output::ok(&[
                a.temperature_k,
                a.pressure_relative,
                a.liquid_density_relative,
                a.vapour_density_relative,
                a.liquid_enthalpy_j_kg,
                a.vapour_enthalpy_j_kg,
                a.liquid_entropy_j_kgk,
                a.vapour_entropy_j_kgk,
                a.liquid_cp_relative,
                a.vapour_cp_relative,
                a.dryness_fraction,
            ])
        },
    },
    // --- spline evaluation on the generated tables ---
    KernelCall {
        name: "UniformCubicTable::locate,cubic(STATE_LOW,T)",
        eval: |x| evaluate_located(STATE_LOW.locate(x[0])),
    },
    KernelCall {
        name: "OctaveCubicTable::locate,cubic(TEMPERATURE_LOW,p)",
        eval: |x| evaluate_located(TEMPERATURE_LOW.locate(x[0])),
    },
    // --- units ---
    KernelCall {
        name: "AbsolutePressure::from_pa(pa)",
        eval: |x| pressure_out(AbsolutePressure::from_pa(x[0])),
    },
    KernelCall {
        name: "AbsolutePressure::from_kpa(kpa)",
        eval: |x| pressure_out(AbsolutePressure::from_kpa(x[0])),
    },
    KernelCall {
        name: "AbsolutePressure::from_bar(bar)",
        eval: |x| pressure_out(AbsolutePressure::from_bar(x[0])),
    },
    KernelCall {
        name: "AbsolutePressure::from_mpa(mpa)",
        eval: |x| pressure_out(AbsolutePressure::from_mpa(x[0])),
    },
    KernelCall {
        name: "AbsolutePressure::from_gauge(gauge_pa,ambient_pa)",
        eval: |x| {
            GaugePressure::from_pa(x[0]).map_or_else(unit_code, |g| {
                with_pressure(x[1], |a| pressure_out(AbsolutePressure::from_gauge(g, a)))
            })
        },
    },
    KernelCall {
        name: "AbsolutePressure::as_kpa,as_bar,as_mpa(pa)",
        eval: |x| with_pressure(x[0], |p| Output::ok(&[p.as_kpa(), p.as_bar(), p.as_mpa()])),
    },
    KernelCall {
        name: "AbsolutePressure::to_gauge(pa,ambient_pa)",
        eval: |x| {
            with_pressure(x[0], |p| {
                with_pressure(x[1], |a| Output::ok(&[p.to_gauge(a).as_pa()]))
            })
        },
    },
    KernelCall {
        name: "GaugePressure::from_pa(pa)",
        eval: |x| gauge_out(GaugePressure::from_pa(x[0])),
    },
    KernelCall {
        name: "GaugePressure::from_kpa(kpa)",
        eval: |x| gauge_out(GaugePressure::from_kpa(x[0])),
    },
    KernelCall {
        name: "GaugePressure::from_bar(bar)",
        eval: |x| gauge_out(GaugePressure::from_bar(x[0])),
    },
    KernelCall {
        name: "GaugePressure::from_mpa(mpa)",
        eval: |x| gauge_out(GaugePressure::from_mpa(x[0])),
    },
    KernelCall {
        name: "GaugePressure::as_kpa,as_bar,as_mpa(pa)",
        eval: |x| {
            GaugePressure::from_pa(x[0]).map_or_else(unit_code, |g| {
                Output::ok(&[g.as_kpa(), g.as_bar(), g.as_mpa()])
            })
        },
    },
    KernelCall {
        name: "Temperature::from_kelvin(k)",
        eval: |x| temperature_out(Temperature::from_kelvin(x[0])),
    },
    KernelCall {
        name: "Temperature::from_celsius(c)",
        eval: |x| temperature_out(Temperature::from_celsius(x[0])),
    },
    KernelCall {
        name: "Temperature::as_celsius(k)",
        eval: |x| with_temperature(x[0], |t| Output::ok(&[t.as_celsius()])),
    },
];
