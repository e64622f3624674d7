//! Water, steam and glycol–water against CoolProp 8.0.0 (PyPI): tests/data/water_coolprop.csv
//! (backend IF97::Water) and tests/data/glycol_coolprop.csv (INCOMP::MEG / INCOMP::MPG), each
//! made by the script beside it.

use crate::fixture;
use leeward::engine::props::{glycol, water, Glycol};

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

#[test]
fn water_and_steam_match_coolprop_if97_backend() {
    let t = fixture::load("water_coolprop.csv");
    for r in &t.rows {
        let (temp, p) = (r["T"], r["p"]);
        let props = if r["phase"] == 1.0 {
            water::liquid(temp, p)
        } else {
            water::steam(temp, p)
        }
        .unwrap_or_else(|e| panic!("{temp} K {p} Pa: {e}"));
        // Issue budget: IF97 quantities to 1e-8.
        assert!(
            rel(props.rho, r["rho"]) < 1e-8,
            "ρ {temp} {p}: {} vs {}",
            props.rho,
            r["rho"]
        );
        assert!(
            rel(props.cp, r["cp"]) < 1e-8,
            "cp {temp} {p}: {} vs {}",
            props.cp,
            r["cp"]
        );
        // Viscosity: the same formulation; CoolProp's critical enhancement is nil here.
        assert!(
            rel(props.mu, r["mu"]) < 1e-6,
            "μ {temp} {p}: {} vs {}",
            props.mu,
            r["mu"]
        );
        // Conductivity: CoolProp adds R15-11's critical enhancement λ̄2, which Leeward leaves
        // out (industrial form). Where λ̄2 is nil the two agree to rounding; in hot liquid and
        // in steam near saturation it is worth up to 0.8 %, the documented cost of leaving it out.
        let nil_enhancement = r["phase"] == 1.0 && temp <= 400.0;
        let tol = if nil_enhancement { 1e-10 } else { 8e-3 };
        assert!(
            rel(props.k, r["k"]) < tol,
            "k {temp} {p}: {} vs {}",
            props.k,
            r["k"]
        );
    }
}

#[test]
fn glycol_water_matches_coolprop_incomp() {
    let t = fixture::load("glycol_coolprop.csv");
    for r in &t.rows {
        let g = if r["fluid"] == 1.0 {
            Glycol::Ethylene
        } else {
            Glycol::Propylene
        };
        let (x, temp) = (r["x"], r["T"]);
        let props = glycol::properties(g, x, temp, 101_325.0).unwrap();
        for (name, got, want) in [
            ("ρ", props.rho, r["rho"]),
            ("cp", props.cp, r["cp"]),
            ("k", props.k, r["k"]),
            ("μ", props.mu, r["mu"]),
            ("freezing point", glycol::freezing_point(g, x), r["tfreeze"]),
        ] {
            // Issue budget: 1e-6.
            assert!(
                rel(got, want) < 1e-6,
                "{g:?} {x} {temp} K {name}: {got} vs {want}"
            );
        }
    }
}
