//! Heat made inside on the page (issue #19): a tracer's heat, then a current through a
//! conductor, each followed by the engine; the card with its caution, and what the mode hides.

use super::*;
use leeward::engine::scenario::{HeatSource, SurfaceMode};

#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn heat_made_inside_sets_the_surface() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        c.goto(&base).await.unwrap();
        wait_rendered(&c).await;

        // A tracer: the third way to know the surface. The typed surface is gone, the heat asked.
        tap(&c, "[data-toggle=surface-mode] button:nth-child(3)").await;
        assert!(hidden(&c, "Ts").await, "the typed surface still shown");
        assert!(!hidden(&c, "qm").await && !hidden(&c, "Th").await);
        assert!(hidden(&c, "I").await, "the current shown for a heat");
        type_into(&c, "qm", "30").await;
        let mut s = DEMO;
        s.surface_mode = SurfaceMode::Made;
        s.heat_made = 30.0;
        let want = expect(&s);
        assert!(close(
            si(&c, "surface_temperature").await,
            want.surface_temp
        ));
        assert!(close(
            si(&c, "q_per_length").await,
            want.q_per_length.unwrap()
        ));
        let card = text_of(&c, "[data-verdict=made]").await;
        assert!(
            card.contains("Heat made inside") && card.contains("electrical"),
            "{card}"
        );

        // A current through a conductor: its fields replace the heat's.
        tap(&c, "[data-toggle=heat-source] button:nth-child(2)").await;
        assert!(hidden(&c, "qm").await && !hidden(&c, "I").await && !hidden(&c, "R2").await);
        type_into(&c, "I", "300").await;
        s.heat_source = HeatSource::Current;
        s.current = 300.0;
        let want = expect(&s);
        assert!(close(
            si(&c, "surface_temperature").await,
            want.surface_temp
        ));
        // Resistances are typed per km, as SI data sheets give them.
        let shown = js(&c, "return document.querySelector('#in-R1').value;").await;
        assert_eq!(shown.as_str().unwrap(), "0.08", "0.080 Ω/km");
        assert_no_nan_shown(&c).await;
        c.close().await.unwrap();
    });
}
