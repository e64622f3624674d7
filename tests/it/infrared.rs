//! The infrared correction against an independent computation: scipy's adaptive quadrature of
//! Planck's law over wavelength and its `brentq` root finder (fixture `tests/data/ir_scipy.csv`,
//! made by `ir_scipy.py` beside it; an independent computation, not a published table). The
//! engine sums the exact series of the fractional blackbody integral and inverts with its own
//! bracketed solver; agreement to 1e-9 relative is asked (the series reaches about 1e-14; quad's own tolerance is 1e-13).

use crate::fixture;
use leeward::engine::inspect::radiometry::{self, band_radiance, Reading};

#[test]
fn band_radiance_and_corrected_readings_match_scipy_quadrature() {
    let t = fixture::load("ir_scipy.csv");
    assert!(t.header[0].contains("scipy") && t.header[0].contains("not a published table"));
    let mut seen = [0usize; 3];
    let mut worst = [0.0f64; 3];
    for r in &t.rows {
        let (kind, band) = (r["kind"] as usize, (r["l1"], r["l2"]));
        let want = r["value"];
        let got = match kind {
            1 => band_radiance(r["t"], band),
            2 => radiometry::surface_temperature(
                &Reading {
                    displayed: r["t"],
                    emissivity_set: r["eset"],
                    reflected: r["tr"],
                    band,
                },
                r["es"],
            )
            .unwrap_or_else(|e| panic!("{r:?}: {e}")),
            _ => panic!("unknown kind {kind}"),
        };
        assert!(
            (got / want - 1.0).abs() < 1e-9,
            "kind {kind} {r:?}: engine {got} vs scipy {want}"
        );
        seen[kind] += 1;
        worst[kind] = worst[kind].max((got / want - 1.0).abs());
    }
    eprintln!(
        "largest relative difference: radiance {:.1e}, corrected {:.1e}",
        worst[1], worst[2]
    );
    assert!(seen[1] >= 20 && seen[2] >= 80, "{seen:?}");
}
