//! Issue 6 over the whole of every single-phase sheet (the tables of
//! `vapora_kernel::single_phase`): every cell of every sheet, at both ends
//! and at interior points in both directions, evaluated with the kernel's own
//! f32 look-up (`BicubicSheet::evaluate`, the function the public calls use);
//! every stored quantity, turned into its property, inside the physical range
//! the robustness checks use for single-phase results
//! (`vapora_host_tests::robustness`); and the look-up continuous across every
//! knot to within f32 rounding.
//!
//! The sheets store ρ (ρ/p on the vapour sheets of Region 2), h, s, 1/cp, w
//! and ln μ over (x, y), and y over (x, ψ) for the (p, h) and (p, s) calls;
//! x is the sheet's pressure coordinate (turned into p with the generator's
//! `pressure_of_x`, needed for ρ/p and the isentropic exponent ρw²/p).

use vapora_host_tests::robustness::{
    CP_MAX_J_KGK, CP_MIN_J_KGK, DENSITY_MAX_KG_M3, ISENTROPIC_EXPONENT_RANGE,
    SINGLE_PHASE_DENSITY_MIN_KG_M3, SINGLE_PHASE_ENTHALPY_MAX_J_KG, SINGLE_PHASE_ENTHALPY_MIN_J_KG,
    SINGLE_PHASE_ENTROPY_MAX_J_KGK, SINGLE_PHASE_ENTROPY_MIN_J_KGK, SPEED_OF_SOUND_RANGE_M_S,
    VISCOSITY_RANGE_PA_S,
};
use vapora_kernel::spline::{BicubicSheet, SinglePhaseSheet};
use vapora_kernel::tables::single_phase as compiled;
use vapora_tables::generator::single_phase::{
    generate_single_phase, pressure_of_x, SheetKind, SinglePhaseConfig, SinglePhaseLimits,
};

/// Points per cell and direction, both ends included (u = i + k/STEPS).
const STEPS: u32 = 6;

/// The compiled sheets in the generator's order ([`SheetKind::ALL`]).
fn sheets() -> [(SheetKind, &'static SinglePhaseSheet); 6] {
    [
        (SheetKind::VapourLow, &compiled::VAPOUR_LOW),
        (SheetKind::LiquidLow, &compiled::LIQUID_LOW),
        (SheetKind::LiquidHigh, &compiled::LIQUID_HIGH),
        (
            SheetKind::LiquidNearCritical,
            &compiled::LIQUID_NEAR_CRITICAL,
        ),
        (
            SheetKind::VapourNearCritical,
            &compiled::VAPOUR_NEAR_CRITICAL,
        ),
        (SheetKind::VapourHigh, &compiled::VAPOUR_HIGH),
    ]
}

fn limits() -> SinglePhaseLimits {
    generate_single_phase(&SinglePhaseConfig::default())
        .expect("the default single-phase generation runs")
        .limits
}

/// x at local coordinate u of a sheet (u = 0 … x_intervals).
fn x_at<const Q: usize>(s: &BicubicSheet<Q>, u: f64) -> f32 {
    (f64::from(s.x_start) + u / f64::from(s.x_inverse_step)) as f32
}

fn in_range(what: &str, v: f32, lo: f32, hi: f32) -> Result<(), String> {
    if v.is_finite() && v >= lo && v <= hi {
        Ok(())
    } else {
        Err(format!("{what} = {v:e} outside [{lo:e}, {hi:e}]"))
    }
}

/// The properties of one stored point, each inside its physical range.
fn check_properties(kind: SheetKind, p: f64, q: &[f32; 6]) -> Result<(), String> {
    let rho = if kind.density_over_pressure() {
        q[0] * p as f32
    } else {
        q[0]
    };
    in_range(
        "density",
        rho,
        SINGLE_PHASE_DENSITY_MIN_KG_M3,
        DENSITY_MAX_KG_M3,
    )?;
    in_range(
        "enthalpy",
        q[1],
        SINGLE_PHASE_ENTHALPY_MIN_J_KG,
        SINGLE_PHASE_ENTHALPY_MAX_J_KG,
    )?;
    in_range(
        "entropy",
        q[2],
        SINGLE_PHASE_ENTROPY_MIN_J_KGK,
        SINGLE_PHASE_ENTROPY_MAX_J_KGK,
    )?;
    in_range("cp", 1.0 / q[3], CP_MIN_J_KGK, CP_MAX_J_KGK)?;
    in_range(
        "speed of sound",
        q[4],
        SPEED_OF_SOUND_RANGE_M_S.0,
        SPEED_OF_SOUND_RANGE_M_S.1,
    )?;
    in_range(
        "isentropic exponent",
        rho * q[4] * q[4] / p as f32,
        ISENTROPIC_EXPONENT_RANGE.0,
        ISENTROPIC_EXPONENT_RANGE.1,
    )?;
    in_range(
        "viscosity",
        q[5].exp(),
        VISCOSITY_RANGE_PA_S.0,
        VISCOSITY_RANGE_PA_S.1,
    )
}

/// Largest jump of any quantity across the knots of a sheet with
/// `x_intervals` × `y_intervals` cells looked up by `eval` (u and v are the
/// local coordinates, 0 … intervals), as a multiple of the allowance: the
/// look-up just below and just above a knot (1e-4 of a cell either side) may
/// differ by 1e-3 of the change over the two cells around the knot plus 64
/// f32 ulps of the largest coefficient of the two blocks (the f32 sum of
/// weighted coefficients rounds at that scale, not at the scale of the
/// result: near 273.16 K h and s are close to 0 while their coefficients are
/// not). A look-up that picks the wrong block at a knot jumps by the order of
/// the change over a whole cell.
fn worst_knot_jump<const Q: usize>(
    sheet: &BicubicSheet<Q>,
    eval: impl Fn(f64, f64) -> [f32; Q],
) -> f64 {
    let (x_intervals, y_intervals) = (sheet.x_intervals, sheet.y_intervals);
    let eps = 1e-4;
    let mut worst: f64 = 0.0;
    let stride = (y_intervals + 3) as usize;
    // Largest |coefficient| of quantity q in the blocks of the cells on
    // either side of the knot at (u, v).
    let block_scale = |u: f64, v: f64, q: usize| -> f64 {
        let (i, j) = (u.floor() as usize, v.floor() as usize);
        let rows = i.saturating_sub(1)..(i + 4).min(x_intervals as usize + 3);
        let cols = j.saturating_sub(1)..(j + 4).min(y_intervals as usize + 3);
        rows.flat_map(|r| cols.clone().map(move |c| r * stride + c))
            .filter_map(|k| sheet.coefficients.get(k))
            .map(|c| f64::from(c[q].abs()))
            .fold(0.0, f64::max)
    };
    let mut compare =
        |at: (f64, f64), lo: [f32; Q], hi: [f32; Q], far_lo: [f32; Q], far_hi: [f32; Q]| {
            for q in 0..Q {
                let jump = f64::from((hi[q] - lo[q]).abs());
                let spread = f64::from((far_hi[q] - far_lo[q]).abs());
                let ulps = 64.0 * f64::from(f32::EPSILON) * block_scale(at.0, at.1, q);
                worst = worst.max(jump / (1e-3 * spread + ulps + f64::from(f32::MIN_POSITIVE)));
            }
        };
    // Knots in u, at every v knot and mid-cell.
    for i in 1..x_intervals {
        let u = f64::from(i);
        for j2 in 0..=2 * y_intervals {
            let v = f64::from(j2) / 2.0;
            compare(
                (u, v),
                eval(u - eps, v),
                eval(u + eps, v),
                eval(u - 1.0, v),
                eval(u + 1.0, v),
            );
        }
    }
    // Knots in v, at every u knot and mid-cell.
    for j in 1..y_intervals {
        let v = f64::from(j);
        for i2 in 0..=2 * x_intervals {
            let u = f64::from(i2) / 2.0;
            compare(
                (u, v),
                eval(u, v - eps),
                eval(u, v + eps),
                eval(u, v - 1.0),
                eval(u, v + 1.0),
            );
        }
    }
    worst
}

/// The kernel's look-up of `s` at local coordinates (u, v).
fn look_up<const Q: usize>(s: &BicubicSheet<Q>) -> impl Fn(f64, f64) -> [f32; Q] + '_ {
    move |u, v| {
        s.evaluate(x_at(s, u), (v / f64::from(s.y_intervals)) as f32)
            .expect("inside the sheet")
    }
}

#[test]
fn every_cell_of_every_single_phase_sheet_gives_physical_properties() {
    let l = limits();
    let mut points = 0usize;
    let mut y_range = (f32::INFINITY, f32::NEG_INFINITY);
    for (kind, sheet) in sheets() {
        let s = &sheet.properties;
        let (nx, ny) = (s.x_intervals * STEPS, s.y_intervals * STEPS);
        for a in 0..=nx {
            let x = x_at(s, f64::from(a) / f64::from(STEPS));
            let p = pressure_of_x(kind, &l, f64::from(x));
            for b in 0..=ny {
                let y = b as f32 / ny as f32;
                let q = s
                    .evaluate(x, y)
                    .unwrap_or_else(|| panic!("{kind:?}: no value at x = {x}, y = {y}"));
                if let Err(e) = check_properties(kind, p, &q) {
                    panic!("{kind:?} at x = {x} (p = {p:.6e} Pa), y = {y}: {e}");
                }
                points += 1;
            }
        }
        // The inverse sheets give the position y in the sheet, [0, 1] up to
        // the fit's error (the kernel clamps it). They must be finite and
        // within a thousandth of the sheet's width of [0, 1].
        for inverse in [&sheet.y_of_enthalpy, &sheet.y_of_entropy] {
            let (nx, ny) = (inverse.x_intervals * STEPS, inverse.y_intervals * STEPS);
            for a in 0..=nx {
                let x = x_at(inverse, f64::from(a) / f64::from(STEPS));
                for b in 0..=ny {
                    let psi = b as f32 / ny as f32;
                    let [y] = inverse
                        .evaluate(x, psi)
                        .unwrap_or_else(|| panic!("{kind:?}: no y at x = {x}, ψ = {psi}"));
                    if let Err(e) = in_range("y", y, -1e-3, 1.0 + 1e-3) {
                        panic!("{kind:?} inverse sheet at x = {x}, ψ = {psi}: {e}");
                    }
                    y_range = (y_range.0.min(y), y_range.1.max(y));
                    points += 1;
                }
            }
        }
    }
    println!(
        "single-phase sheets: {points} points ({STEPS} steps per cell and direction), \
         all in range; y of the inverse sheets from {} to {}",
        y_range.0, y_range.1
    );
}

#[test]
fn every_single_phase_sheet_is_continuous_across_its_knots() {
    for (kind, sheet) in sheets() {
        let (p, h, s) = (&sheet.properties, &sheet.y_of_enthalpy, &sheet.y_of_entropy);
        for (part, worst) in [
            ("properties", worst_knot_jump(p, look_up(p))),
            ("y of h", worst_knot_jump(h, look_up(h))),
            ("y of s", worst_knot_jump(s, look_up(s))),
        ] {
            println!("{kind:?} {part}: largest knot jump {worst:.3} of the allowance");
            assert!(
                worst <= 1.0,
                "{kind:?} {part}: knot jump {worst} × allowance"
            );
        }
    }
}

#[test]
fn the_knot_check_can_fail() {
    // A look-up that takes the next block from the middle knot on (an
    // off-by-one in the block index) must be caught, in either direction.
    let s = &compiled::VAPOUR_LOW.properties;
    let good = look_up(s);
    let mid_u = f64::from(s.x_intervals / 2);
    let mid_v = f64::from(s.y_intervals / 2);
    let off_in_u = |u: f64, v: f64| {
        good(
            if u > mid_u {
                (u + 1.0).min(f64::from(s.x_intervals))
            } else {
                u
            },
            v,
        )
    };
    let off_in_v = |u: f64, v: f64| {
        good(
            u,
            if v > mid_v {
                (v + 1.0).min(f64::from(s.y_intervals))
            } else {
                v
            },
        )
    };
    assert!(worst_knot_jump(s, &good) <= 1.0);
    assert!(worst_knot_jump(s, off_in_u) > 1.0);
    assert!(worst_knot_jump(s, off_in_v) > 1.0);
}
