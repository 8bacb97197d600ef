//! Published verification points through the kernel's single-phase calls,
//! within the kernel's bounds for the zone each point is in
//! (`vapora_host_tests::single_phase`): IAPWS R7-97(2012) Tables 5
//! (Region 1), 15 (Region 2) and 33 (Region 3, given as (ρ, T): the printed
//! pressure is the input), and IAPWS R12-08 Table 4 (viscosity at (T, ρ):
//! the pressure comes from the formulation), for the points inside the
//! envelope (611.657 Pa to 25 MPa, 273.16 K to 1073.15 K).

use vapora_host_tests::single_phase::bound_at;
use vapora_kernel::single_phase::{state_at_pressure_temperature, FluidState};
use vapora_kernel::units::{AbsolutePressure, Temperature};
use vapora_tables::if97::pt;

/// (source, p in MPa, T in K, v m³/kg, h kJ/kg, s kJ/(kg·K), cp kJ/(kg·K), w m/s)
type Row = (&'static str, f64, f64, f64, f64, f64, f64, f64);

const POINTS: [Row; 4] = [
    (
        "IAPWS R7-97(2012) Table 5",
        3.0,
        300.0,
        0.100215168e-2,
        0.115331273e3,
        0.392294792,
        0.417301218e1,
        0.150773921e4,
    ),
    (
        "IAPWS R7-97(2012) Table 5",
        3.0,
        500.0,
        0.120241800e-2,
        0.975542239e3,
        0.258041912e1,
        0.465580682e1,
        0.124071337e4,
    ),
    (
        "IAPWS R7-97(2012) Table 15",
        0.0035,
        300.0,
        0.394913866e2,
        0.254991145e4,
        0.852238967e1,
        0.191300162e1,
        0.427920172e3,
    ),
    (
        "IAPWS R7-97(2012) Table 15",
        0.0035,
        700.0,
        0.923015898e2,
        0.333568375e4,
        0.101749996e2,
        0.208141274e1,
        0.644289068e3,
    ),
];

// IAPWS R7-97(2012) Table 33, T = 650 K, ρ = 200 kg/m³: p = 22.2930643 MPa
// (printed), h = 2375.12401 kJ/kg, s = 4.85438792 kJ/(kg·K), cp = 44.6579342
// kJ/(kg·K), w = 383.444594 m/s. (The other two Table 33 points are at
// 25.58 MPa and 78.3 MPa, outside the envelope.)
const REGION3: Row = (
    "IAPWS R7-97(2012) Table 33",
    0.222930643e2,
    650.0,
    1.0 / 200.0,
    0.237512401e4,
    0.485438792e1,
    0.446579342e2,
    0.383444594e3,
);

fn state(p_pa: f64, t_k: f64) -> vapora_kernel::single_phase::SinglePhaseState {
    let p = AbsolutePressure::from_pa(p_pa as f32).unwrap();
    let t = Temperature::from_kelvin(t_k as f32).unwrap();
    match state_at_pressure_temperature(p, t).unwrap() {
        FluidState::CompressedLiquid(s) | FluidState::SuperheatedVapour(s) => s,
        other => panic!("{other:?}"),
    }
}

#[test]
fn if97_verification_points_in_the_envelope() {
    for (source, p_mpa, t, v, h, s, cp, w) in POINTS.into_iter().chain([REGION3]) {
        let p = p_mpa * 1e6;
        let b = bound_at(p, t);
        let k = state(p, t);
        let rel = |a: f32, e: f64| ((f64::from(a) - e) / e).abs();
        let checks = [
            (
                "v",
                rel(k.specific_volume_m3_kg, v),
                b.density_relative * 1.01,
            ),
            (
                "h",
                (f64::from(k.enthalpy_j_kg) - h * 1e3).abs(),
                b.enthalpy_j_kg,
            ),
            (
                "s",
                (f64::from(k.entropy_j_kgk) - s * 1e3).abs(),
                b.entropy_j_kgk,
            ),
            ("cp", rel(k.cp_j_kgk, cp * 1e3), b.cp_relative),
            ("w", rel(k.speed_of_sound_m_s, w), b.speed_of_sound_relative),
        ];
        for (name, dev, bound) in checks {
            println!("{source} ({p_mpa} MPa, {t} K) {name}: {dev:.3e} (bound {bound:.1e})");
            assert!(
                dev <= bound,
                "{source} ({p_mpa} MPa, {t} K): {name} off by {dev:e} > {bound:e}"
            );
        }
    }
}

/// Pressure at (T, ρ) from the formulation: bisection on its density at
/// (p, T) between `lo` and `hi` (single-phase there).
fn pressure_at(t: f64, rho: f64, mut lo: f64, mut hi: f64) -> f64 {
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if pt::properties_pt(mid, t).unwrap().density_kg_m3 < rho {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    0.5 * (lo + hi)
}

#[test]
fn viscosity_verification_points_in_the_envelope() {
    // IAPWS R12-08 Table 4 (T, ρ, μ in µPa·s) inside the envelope, with a
    // bracket for the pressure on the right side of saturation. The other
    // rows need more than 25 MPa or more than 1073.15 K.
    let rows = [
        (298.15, 998.0, 889.735100, 1.0e5, 25.0e6),
        (433.15, 1.0, 14.538324, 1.0e3, 0.5e6),
        (873.15, 1.0, 32.619287, 1.0e3, 1.0e6),
    ];
    for (t, rho, mu, lo, hi) in rows {
        let p = pressure_at(t, rho, lo, hi);
        let k = state(p, t);
        let dev = ((f64::from(k.viscosity_pa_s) - mu * 1e-6) / (mu * 1e-6)).abs();
        let bound = bound_at(p, t).viscosity_relative;
        println!("IAPWS R12-08 Table 4 ({t} K, {rho} kg/m³, p = {p:.6e} Pa): μ off by {dev:.3e}");
        assert!(dev <= bound, "({t} K, {rho} kg/m³): {dev:e} > {bound:e}");
    }
}
