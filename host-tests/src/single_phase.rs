//! The kernel's single-phase calls against the f64 formulation: a dense
//! grid over the envelope plus points 0.01 K, 0.1 K and 1 K from saturation
//! on either side, sorted into three zones around the critical point.

use vapora_kernel::single_phase::{
    state_at_pressure_enthalpy, state_at_pressure_entropy, state_at_pressure_temperature,
    FluidState, SinglePhaseState,
};
use vapora_kernel::units::{AbsolutePressure, Temperature};
use vapora_tables::if97::{pt, region4, viscosity};

/// Critical temperature, K (IAPWS R7-97(2012), Eq. 3).
pub const TC: f64 = 647.096;
/// Critical pressure, Pa (IAPWS R7-97(2012), Eq. 4).
pub const PC: f64 = 22.064e6;

/// Zones of the accuracy statement (the generator's own measurement uses
/// the same ones).
pub use vapora_tables::generator::single_phase::{zone, Zone};

/// Largest deviations of one zone, with where they occur.
#[derive(Debug, Clone, Copy, Default, PartialEq)]
pub struct Maxima {
    /// ρ, relative.
    pub density_relative: f64,
    /// h, J/kg.
    pub enthalpy_j_kg: f64,
    /// s, J/(kg·K).
    pub entropy_j_kgk: f64,
    /// cp, relative.
    pub cp_relative: f64,
    /// w, relative.
    pub speed_of_sound_relative: f64,
    /// κ, relative.
    pub isentropic_exponent_relative: f64,
    /// μ, relative.
    pub viscosity_relative: f64,
    /// T from (p, h), K.
    pub temperature_from_enthalpy_k: f64,
    /// T from (p, s), K.
    pub temperature_from_entropy_k: f64,
    /// Points measured.
    pub points: usize,
}

impl Maxima {
    /// Name and value of every field (without the count).
    pub fn fields(&self) -> [(&'static str, f64); 9] {
        [
            ("density_relative", self.density_relative),
            ("enthalpy_j_kg", self.enthalpy_j_kg),
            ("entropy_j_kgk", self.entropy_j_kgk),
            ("cp_relative", self.cp_relative),
            ("speed_of_sound_relative", self.speed_of_sound_relative),
            (
                "isentropic_exponent_relative",
                self.isentropic_exponent_relative,
            ),
            ("viscosity_relative", self.viscosity_relative),
            (
                "temperature_from_enthalpy_k",
                self.temperature_from_enthalpy_k,
            ),
            (
                "temperature_from_entropy_k",
                self.temperature_from_entropy_k,
            ),
        ]
    }
}

/// The measurement per zone: [far, ring, box].
pub type ZoneMaxima = [Maxima; 3];

fn single(s: FluidState) -> Option<SinglePhaseState> {
    match s {
        FluidState::CompressedLiquid(s) | FluidState::SuperheatedVapour(s) => Some(s),
        _ => None,
    }
}

/// One deviation record of the kernel at (p, T), or `None` where the
/// formulation or the kernel gives no single-phase state.
pub fn deviations_at(p: f64, t: f64) -> Option<[f64; 9]> {
    let reference = pt::properties_pt(p, t).ok()?;
    let mu = viscosity::viscosity_pa_s(reference.density_kg_m3, t).ok()?;
    let pk = AbsolutePressure::from_pa(p as f32).ok()?;
    let tk = Temperature::from_kelvin(t as f32).ok()?;
    // Where the formulation has a single-phase value the kernel must have
    // one too: a failure counts as an infinite deviation.
    let Some(s) = state_at_pressure_temperature(pk, tk).ok().and_then(single) else {
        return Some([f64::INFINITY; 9]);
    };
    // The kernel's inputs are f32: compare with the formulation at the f32 point.
    let rel = |a: f32, b: f64| ((f64::from(a) - b) / b).abs();
    let t_h = state_at_pressure_enthalpy(pk, reference.enthalpy_j_kg as f32)
        .ok()
        .and_then(single)
        .map_or(f64::INFINITY, |s| {
            (f64::from(s.temperature.as_kelvin()) - t).abs()
        });
    let t_s = state_at_pressure_entropy(pk, reference.entropy_j_kgk as f32)
        .ok()
        .and_then(single)
        .map_or(f64::INFINITY, |s| {
            (f64::from(s.temperature.as_kelvin()) - t).abs()
        });
    let kappa = reference.density_kg_m3 * reference.speed_of_sound_m_s.powi(2) / p;
    Some([
        rel(s.density_kg_m3, reference.density_kg_m3),
        (f64::from(s.enthalpy_j_kg) - reference.enthalpy_j_kg).abs(),
        (f64::from(s.entropy_j_kgk) - reference.entropy_j_kgk).abs(),
        rel(s.cp_j_kgk, reference.cp_j_kgk),
        rel(s.speed_of_sound_m_s, reference.speed_of_sound_m_s),
        rel(s.isentropic_exponent, kappa),
        rel(s.viscosity_pa_s, mu),
        t_h,
        t_s,
    ])
}

/// The dense grid: `pressures` pressures (log-spaced below 10 MPa, linear
/// above) × `temperatures` temperatures, plus every pressure at 0.01 K,
/// 0.1 K and 1 K on either side of saturation. Points are f32-exact.
pub fn grid(pressures: usize, temperatures: usize) -> Vec<(f64, f64)> {
    let mut out = Vec::new();
    let f = |v: f64| f64::from(v as f32);
    let mut ps = Vec::new();
    for i in 0..pressures {
        let u = (i as f64 + 0.5) / pressures as f64;
        ps.push(f(611.657 * (10.0e6f64 / 611.657).powf(u)));
        ps.push(f(10.0e6 + 15.0e6 * u));
    }
    for &p in &ps {
        for j in 0..temperatures {
            let t = 273.16 + (1073.15 - 273.16) * (j as f64 + 0.5) / temperatures as f64;
            out.push((p, f(t)));
        }
        if p < PC {
            let ts = region4::saturation_temperature_k_unchecked(p);
            for d in [0.01, 0.1, 1.0, -0.01, -0.1, -1.0] {
                let t = f(ts + d);
                if t > 273.16 && t < 1073.15 {
                    out.push((p, t));
                }
            }
        }
    }
    out
}

/// Measures the kernel on the given points.
pub fn measure(points: &[(f64, f64)]) -> ZoneMaxima {
    let mut m = [Maxima::default(); 3];
    for &(p, t) in points {
        let Some(d) = deviations_at(p, t) else {
            continue;
        };
        let z = &mut m[zone(p, t) as usize];
        z.points += 1;
        let fields = [
            &mut z.density_relative,
            &mut z.enthalpy_j_kg,
            &mut z.entropy_j_kgk,
            &mut z.cp_relative,
            &mut z.speed_of_sound_relative,
            &mut z.isentropic_exponent_relative,
            &mut z.viscosity_relative,
            &mut z.temperature_from_enthalpy_k,
            &mut z.temperature_from_entropy_k,
        ];
        for (f, v) in fields.into_iter().zip(d) {
            if v > *f {
                *f = v;
            }
        }
    }
    m
}

/// The accuracy required of the kernel beyond 15 K and 3 MPa of the critical
/// point: issue 5's bounds (ρ 20 ppm, h 0.02 kJ/kg, s 0.05 J/(kg·K), κ and
/// cp 0.05 %, μ 0.05 %, T(p, h) 2 mK). Speed of sound: half the κ bound
/// (κ = ρw²/p), T(p, s) as T(p, h).
pub const REQUIRED_FAR: Maxima = Maxima {
    density_relative: 20e-6,
    enthalpy_j_kg: 20.0,
    entropy_j_kgk: 0.05,
    cp_relative: 5e-4,
    speed_of_sound_relative: 2.5e-4,
    isentropic_exponent_relative: 5e-4,
    viscosity_relative: 5e-4,
    temperature_from_enthalpy_k: 2e-3,
    temperature_from_entropy_k: 2e-3,
    points: 0,
};

/// What the committed tables are held to between the near-critical box and
/// 15 K / 3 MPa from the critical point (the ring): issue 5's bounds (as
/// [`REQUIRED_FAR`]) for every property, T from (p, h) and (p, s) included
/// (the kernel's correction step after the inverse sheet brings those from
/// 3.8 mK and 3.7 mK to 0.12 mK on the dense grid).
pub const STATED_RING: Maxima = REQUIRED_FAR;

/// The measured looser bound inside the near-critical box (5 K and 1 MPa of
/// the critical point), rounded up from the dense-grid maxima.
pub const STATED_BOX: Maxima = Maxima {
    density_relative: 3e-2,
    enthalpy_j_kg: 1.5e4,
    entropy_j_kgk: 25.0,
    cp_relative: 0.1,
    speed_of_sound_relative: 6e-3,
    isentropic_exponent_relative: 2e-2,
    viscosity_relative: 2e-2,
    temperature_from_enthalpy_k: 1e-2,
    temperature_from_entropy_k: 1e-2,
    points: 0,
};

/// The bound of the zone a point is in.
pub fn bound_at(p: f64, t: f64) -> &'static Maxima {
    match zone(p, t) {
        Zone::Far => &REQUIRED_FAR,
        Zone::Ring => &STATED_RING,
        Zone::Box => &STATED_BOX,
    }
}

/// The fields of `measured` above `bound`, by name.
pub fn exceeding(measured: &Maxima, bound: &Maxima) -> Vec<String> {
    measured
        .fields()
        .iter()
        .zip(bound.fields())
        .filter(|((_, m), (_, b))| m > b || m.is_nan())
        .map(|((name, m), (_, b))| format!("{name}: {m:.3e} > {b:.3e}"))
        .collect()
}
