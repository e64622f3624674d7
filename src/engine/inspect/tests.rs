//! Checks of the inspection. The band integral and the corrected temperatures against an
//! independent numerical Planck integration are in `tests/it/infrared.rs` (scipy fixture).

use super::radiometry::{self, band_radiance, tail_integral, total_radiation, Caveat, Reading};
use super::*;
use crate::engine::heatloss::tests_support::job;
use crate::engine::heatloss::SIGMA;

const BAND: (f64, f64) = (8e-6, 14e-6);

fn reading(displayed: f64, set: f64, reflected: f64) -> Reading {
    Reading {
        displayed,
        emissivity_set: set,
        reflected,
        band: BAND,
    }
}

/// Source: hand arithmetic of the σT⁴ balance, T_s⁴ = [ε_set·T_d⁴ + (ε_s − ε_set)·T_r⁴]/ε_s.
/// (a) ε_set = 1, ε_s = 0.5, T_d = 300 K, T_r = 200 K: 300⁴ = 8.1×10⁹, 200⁴ = 1.6×10⁹,
///     (8.1×10⁹ − 0.5·1.6×10⁹)/0.5 = 7.3×10⁹/0.5 = 1.46×10¹⁰; √1.46×10¹⁰ = 120 830.46,
///     √120 830.46 = 347.6068 K.
/// (b) bright aluminium: ε_set = 0.95, ε_s = 0.1, T_d = 323.15 K (50 °C), T_r = 293.15 K:
///     0.95·323.15⁴ = 1.035953×10¹⁰, −0.85·293.15⁴ = −6.277381×10⁹, sum 4.082153×10⁹,
///     /0.1 = 4.082153×10¹⁰, fourth root 449.4924 K (176.3 °C: the raw reading is 126 K low).
#[test]
fn total_radiation_form_matches_hand_arithmetic() {
    let a = total_radiation(&reading(300.0, 1.0, 200.0), 0.5).unwrap();
    assert!((a - 347.6068).abs() < 5e-4, "{a}");
    let b = total_radiation(&reading(323.15, 0.95, 293.15), 0.1).unwrap();
    assert!((b - 449.4924).abs() < 5e-4, "{b}");
    // The engine's corrected reading carries the same number as its cross-check.
    let c = radiometry::correct(&reading(323.15, 0.95, 293.15), 0.1).unwrap();
    assert!((c.total_radiation - 449.4924).abs() < 5e-4);
}

/// Source: the Stefan–Boltzmann law is Planck's law over all wavelengths (textbook identity,
/// from memory): π·L_total = σT⁴, with ∫₀^∞ x³/(eˣ − 1) dx = π⁴/15. A band from 0.05 µm to
/// 1 mm at 1000 K holds all of it but the long-wave tail ∫₀ˣ t³/(eᵗ − 1) dt ≈ x³/3 at
/// x = c₂/(1 mm · 1000 K) = 0.0144 (1.5×10⁻⁷ of the whole); the short-wave one is e⁻²⁸⁸.
#[test]
fn a_very_wide_band_holds_the_stefan_boltzmann_total() {
    let t = 1000.0;
    let x_long = radiometry::C2 / (1e-3 * t);
    let missing = x_long.powi(3) / 3.0 / (std::f64::consts::PI.powi(4) / 15.0);
    let l = band_radiance(t, (0.05e-6, 1e-3));
    let want = SIGMA * t.powi(4) / std::f64::consts::PI * (1.0 - missing);
    assert!((l / want - 1.0).abs() < 1e-6, "{l} vs {want}");
    // And the series itself at x → small: ∫ₓ^∞ = π⁴/15 − x³/3 + O(x⁴).
    let whole = std::f64::consts::PI.powi(4) / 15.0;
    assert!((tail_integral(1e-3) + 1e-9 / 3.0 - whole).abs() < 1e-8);
}

/// Source: the balance itself, read backwards — a surface at a known temperature, its signal as
/// an instrument set to ε_set would show it (computed here from the signal by a plain bisection
/// on the band radiance, not the engine's solver), then corrected: the known temperature back.
#[test]
fn a_known_surface_comes_back_from_its_reading() {
    for (ts, es, set, tr) in [
        (450.0, 0.1, 0.95, 293.15),
        (330.0, 0.9, 1.0, 280.0),
        (250.0, 0.3, 0.95, 300.0),
    ] {
        let s = es * band_radiance(ts, BAND) + (1.0 - es) * band_radiance(tr, BAND);
        let want = (s - (1.0 - set) * band_radiance(tr, BAND)) / set;
        let (mut lo, mut hi) = (50.0f64, 2000.0f64);
        for _ in 0..200 {
            let mid = 0.5 * (lo + hi);
            if band_radiance(mid, BAND) < want {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        let c = radiometry::correct(&reading(0.5 * (lo + hi), set, tr), es).unwrap();
        assert!((c.surface - ts).abs() < 1e-7, "{ts}: {}", c.surface);
    }
}

#[test]
fn bright_aluminium_is_flagged_and_painted_steel_is_not() {
    let alu = radiometry::correct(&reading(323.15, 0.95, 293.15), 0.1).unwrap();
    assert!(!alu.reliable());
    assert!(
        alu.caveats.contains(&Caveat::LowEmissivity)
            && alu.caveats.contains(&Caveat::LargeCorrection)
    );
    assert!(alu.correction > 50.0, "{}", alu.correction);
    let painted = radiometry::correct(&reading(333.15, 0.95, 293.15), 0.93).unwrap();
    assert!(painted.reliable(), "{:?}", painted.caveats);
    assert!(painted.sensitivity.unwrap() < 5.0);
    // A lower emissivity means a hotter surface behind the same reading above the reflection.
    assert!(
        alu.at_lower_emissivity.unwrap() > alu.surface && alu.at_higher_emissivity < alu.surface
    );
}

/// Near the reflected temperature, only a surface that reflects much is flagged: a painted
/// jacket (ε 0.95) read at 25 °C among 20 °C surroundings gets 95 % of its signal from itself
/// (0.95·L(T_s) of about L(T_s)), and a 5 K error in the reflected temperature moves the answer by
/// about (1 − ε)/ε·5 K = 0.26 K; a dull metal (ε 0.3) at the same contrast gets over a fifth of
/// its signal by reflection.
#[test]
fn near_the_reflected_temperature_only_a_reflective_surface_is_flagged() {
    let painted = radiometry::correct(&reading(298.15, 0.95, 293.15), 0.95).unwrap();
    assert!(painted.reliable(), "{:?}", painted.caveats);
    let dull = radiometry::correct(&reading(298.15, 0.95, 293.15), 0.3).unwrap();
    assert!(
        dull.caveats.contains(&Caveat::NearReflected),
        "{:?}",
        dull.caveats
    );
}

#[test]
fn bad_readings_name_their_field() {
    use crate::engine::error::Subject;
    let key = |e: EngineError| match e {
        EngineError::Undefined {
            subject: Subject::Input(k),
            ..
        } => k,
        other => panic!("{other:?}"),
    };
    let r = reading(320.0, 0.95, 290.0);
    assert_eq!(key(radiometry::correct(&r, 0.0).unwrap_err()), "e");
    assert_eq!(key(radiometry::correct(&r, 1.2).unwrap_err()), "e");
    assert_eq!(
        key(radiometry::correct(
            &Reading {
                emissivity_set: 0.0,
                ..r
            },
            0.9
        )
        .unwrap_err()),
        "eir"
    );
    assert_eq!(
        key(radiometry::correct(
            &Reading {
                band: (14e-6, 8e-6),
                ..r
            },
            0.9
        )
        .unwrap_err()),
        "lb2"
    );
    assert_eq!(
        key(radiometry::correct(
            &Reading {
                band: (8e-6, 8e-6),
                ..r
            },
            0.9
        )
        .unwrap_err()),
        "lb2"
    );
    assert_eq!(
        key(radiometry::correct(&reading(290.0, 0.95, 290.0), 0.9).unwrap_err()),
        "Tir"
    );
    // Below what the reflection alone shows: ε_s < ε_set, a cold reading under hot surroundings.
    assert_eq!(
        key(radiometry::correct(&reading(250.0, 0.95, 400.0), 0.1).unwrap_err()),
        "Tir"
    );
}

/// Source: the forward solve (`heatloss::solve`, the full one) with the outer layer's k scaled
/// by a known factor gives a surface; the inverse must give the factor back (1e-6 relative).
#[test]
fn known_k_factors_come_back_from_their_surfaces() {
    for emissivity in [0.9, 0.1] {
        let design = job(0.05, emissivity);
        for f in [0.5, 1.0, 2.0, 5.0] {
            let ts = heatloss::solve(&effective_k::scaled(&design, f))
                .unwrap()
                .t_surface;
            let k = effective_k(&design, ts).unwrap();
            assert!(
                (k.factor / f - 1.0).abs() < 1e-6,
                "ε {emissivity}, f {f}: {}",
                k.factor
            );
            assert!(k.residual.abs() < 1e-6, "{}", k.residual);
            // The direct value from the conduction carrying the measured loss agrees.
            assert!((k.from_loss / f - 1.0).abs() < 1e-6, "{}", k.from_loss);
        }
    }
    // With an inside film and two layers (the inner one as designed).
    let mut two = job(0.04, 0.9);
    two.h_inside = Some(800.0);
    let mut outer = two.construction.layers[1];
    outer.thickness = 0.03;
    outer.k.a = 0.045;
    two.construction.layers.push(outer);
    for f in [0.5, 2.0, 5.0] {
        let ts = heatloss::solve(&effective_k::scaled(&two, f))
            .unwrap()
            .t_surface;
        let k = effective_k(&two, ts).unwrap();
        assert!(
            (k.factor / f - 1.0).abs() < 1e-6,
            "two layers, f {f}: {}",
            k.factor
        );
    }
}

#[test]
fn surfaces_no_insulation_explains_are_messages() {
    let design = job(0.05, 0.9);
    let why = |ts: f64| match effective_k(&design, ts).unwrap_err() {
        EngineError::Undefined { why, .. } => why,
        other => panic!("{other:?}"),
    };
    // Hotter than the process (453.15 K).
    assert!(why(460.0).contains("process temperature"));
    // Colder than the air (278.15 K) and surroundings (268.15 K) of a hot line.
    assert!(why(260.0).contains("take heat in"));
    // Hotter than a bare pipe at its own loss: a missing outer layer could not leave it there.
    assert!(why(452.9).contains("missing outer layer"), "{}", why(452.9));
    // A bare line.
    let mut bare = design.clone();
    bare.construction.layers.truncate(1);
    assert!(effective_k(&bare, 300.0).is_err());
}

/// The whole inspection of an invented steam line under a weathered aluminium jacket (ε 0.3),
/// read at 20 °C with the instrument at 0.95: the corrected surface is far hotter, and the
/// ranges hold the answer.
#[test]
fn an_inspection_holds_together() {
    let design = job(0.05, 0.3);
    let terms = Terms {
        run: 10.0,
        hours: 8000.0,
        efficiency: 0.85,
        price: 0.05 / 3.6e6,
        accuracy: DEFAULT_ACCURACY,
        emissivity_uncertainty: DEFAULT_EMISSIVITY_UNCERTAINTY,
    };
    let r = Reading {
        displayed: 293.15,
        emissivity_set: 0.95,
        reflected: 268.15,
        band: BAND,
    };
    let i = inspect(&design, &r, &terms).unwrap();
    assert!(
        i.corrected.surface > 293.15 + 30.0,
        "{}",
        i.corrected.surface
    );
    assert!(i.k.factor > 1.0);
    assert_eq!(i.condition, Condition::from_ratio(i.k.factor));
    assert!((i.excess - (i.actual - i.design)).abs() < 1e-9 * i.actual.abs());
    assert!((i.excess_total - 10.0 * i.excess).abs() < 1e-9 * i.excess_total.abs());
    let g = &i.ranges;
    assert_eq!((g.corners, g.unexplained), (8, 0));
    assert!(g.surface.lo <= i.corrected.surface && i.corrected.surface <= g.surface.hi);
    assert!(g.k_ratio.lo < i.k.factor && i.k.factor < g.k_ratio.hi);
    assert!(g.excess_cost.lo < i.excess_cost && i.excess_cost < g.excess_cost.hi);
    assert!(g.convection.0 <= 1.0 && g.convection.1 >= 1.0);
    // Thresholds as documented.
    assert_eq!(Condition::from_ratio(1.3), Condition::AsDesigned);
    assert_eq!(Condition::from_ratio(1.31), Condition::Degraded);
    assert_eq!(Condition::from_ratio(2.6), Condition::Failed);
}
