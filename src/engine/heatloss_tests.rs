//! The checks of `heatloss`: the balance, the lean path against the full one, the limits and
//! the thickness search.

use super::tests_support::job;
use super::*;

#[test]
fn energy_balance_closes() {
    for (ins, eps) in [(0.0, 0.9), (0.05, 0.1), (0.2, 0.9), (0.0, 0.0)] {
        let s = solve(&job(ins, eps)).unwrap();
        let out = s.loss.q_conv + s.loss.q_rad;
        assert!(
            (out - s.q).abs() <= 1e-9 * s.q.abs(),
            "{ins} {eps}: {out} vs {}",
            s.q
        );
        // Between the coldest and the hottest temperature of the job (the 268 K sky can pull
        // a well-insulated surface below the air temperature).
        assert!(
            s.t_surface > 268.15 && s.t_surface < 453.15,
            "{}",
            s.t_surface
        );
    }
}

/// The lean solve gives the same numbers as the full one, bit for bit; only the analysis is
/// left out.
#[test]
fn lean_solve_equals_the_full_one() {
    for (ins, eps) in [(0.0, 0.9), (0.05, 0.1), (0.2, 0.9), (0.0, 0.0)] {
        for speed in [0.0, 0.3, 4.0, 30.0] {
            let mut j = job(ins, eps);
            j.stream.speed = speed;
            let full = solve(&j).unwrap();
            let lean = solve_lean(&j).unwrap();
            assert!(full.loss.analysis.is_some() && lean.loss.analysis.is_none());
            let mut stripped = full.clone();
            stripped.loss.analysis = None;
            assert_eq!(stripped, lean, "{ins} {eps} {speed}");
        }
    }
}

/// The sweeps' lean surface loss equals the full one at every speed and surface temperature.
#[test]
fn lean_surface_loss_equals_the_full_one() {
    let j = job(0.0, 0.9);
    for speed in [0.0, 0.2, 2.0, 15.0, 60.0] {
        for ts in [250.0, 290.0, 350.0, 700.0] {
            let mut b = j.stream;
            b.speed = speed;
            let full = surface_loss(&b, 0.1143, ts, 0.9, 268.15).unwrap();
            let lean = surface_loss_lean(&b, 0.1143, ts, 0.9, 268.15).unwrap();
            assert!(full.analysis.is_some() && lean.analysis.is_none());
            let mut stripped = full.clone();
            stripped.analysis = None;
            assert_eq!(stripped, lean, "{speed} {ts}");
        }
    }
}

#[test]
fn limits() {
    // No insulation is the bare pipe; emissivity 0 is convection only.
    let bare = solve(&job(0.0, 0.9)).unwrap();
    assert!((bare.outer_d - 0.1143).abs() < 1e-12);
    let none = solve(&job(0.0, 0.0)).unwrap();
    assert_eq!(none.loss.q_rad, 0.0);
    assert!(none.q < bare.q);
    // More insulation: less loss and a cooler surface (well past the critical radius).
    let mut last = bare.clone();
    for t in [0.02, 0.05, 0.1, 0.2] {
        let s = solve(&job(t, 0.9)).unwrap();
        assert!(s.q < last.q && s.t_surface < last.t_surface, "{t}");
        last = s;
    }
}

/// Very thick insulation: the loss tends to conduction alone between the process and the air
/// temperature (the outside resistance becomes negligible beside the layer's).
#[test]
fn thick_insulation_tends_to_conduction_only() {
    let mut j = job(2.0, 0.9);
    j.t_surround = j.stream.t_inf;
    let s = solve(&j).unwrap();
    let c = &j.construction;
    let r = c.radii();
    let k = c.layers[1].k.mean(s.interfaces[0], 278.15);
    let cond_only =
        2.0 * std::f64::consts::PI * k * (s.interfaces[0] - 278.15) / (r[1] / r[0]).ln();
    assert!(
        (s.q / cond_only - 1.0).abs() < 0.01,
        "{} vs {cond_only}",
        s.q
    );
}

#[test]
fn thickness_for_a_touch_limit() {
    let j = job(0.05, 0.9);
    let (t, s) = thickness_for(&j, 0.5, 323.15, |s| s.t_surface)
        .unwrap()
        .unwrap();
    assert!((s.t_surface - 323.15).abs() < 1e-6, "{}", s.t_surface);
    assert!(t > 0.0 && t < 0.5);
    // A limit below the air temperature cannot be met by any thickness.
    assert!(thickness_for(&j, 0.5, 270.0, |s| s.t_surface)
        .unwrap()
        .is_none());
}

/// The sun as a gain (issue #19): conduction out = convection + radiation − sun closes to 1e-9
/// (conservation of energy at the surface). A sun strong enough turns the flow inward (q < 0)
/// with the surface above the process, the air and the surroundings — beyond the span the
/// trial temperatures were clamped to without sun, which `sunlit_bound` widens. The lean solve
/// still gives the same numbers.
#[test]
fn solar_gain_enters_the_balance() {
    for eps in [0.9, 0.0] {
        let mut j = job(0.05, eps);
        j.process_temp = 280.0;
        j.t_surround = 270.0;
        j.solar = 600.0;
        let s = solve(&j).unwrap();
        let sun = j.solar * outer_area(j.stream.shape, s.outer_d);
        let net = s.loss.q_conv + s.loss.q_rad - sun;
        assert!(
            (net - s.q).abs() <= 1e-9 * s.q.abs(),
            "{eps}: {net} vs {}",
            s.q
        );
        assert!(s.residual.abs() <= 1e-9 * s.q.abs());
        assert!(
            s.q < 0.0 && s.t_surface > 280.0,
            "{eps}: {} {}",
            s.q,
            s.t_surface
        );
        let mut stripped = s.clone();
        stripped.loss.analysis = None;
        assert_eq!(stripped, solve_lean(&j).unwrap());
    }
}
