use vapora_tables::generator::single_phase as sp;
fn main() {
    let mut c = sp::SinglePhaseConfig::default();
    c.set("intervals", "26x22,22x30,14x28,46x18,46x28,18x24")
        .unwrap();
    let g = sp::generate_single_phase(&c).unwrap();
    let l = g.limits;
    let s = g.sheet(sp::SheetKind::LiquidHigh);
    for p in [16.55e6, 16.63e6, 17.0e6, 18.0e6, 22.0e6] {
        let x = sp::x_of_pressure(s.kind, &l, p);
        let e = sp::edges(s.kind, &l, s, p);
        let mut line = format!("p {p:.3e} delta {:.2}:", e.delta);
        for t in [290.0, 350.0, 420.0, 487.0, 550.0, 600.0, 620.0] {
            let want = sp::quantities(s.kind, p, t).unwrap();
            let got = s.properties.evaluate(x, e.y_of(t));
            line += &format!(" {t}:{:.1}", got[1] - want[1]);
        }
        println!("{line}");
    }
}
