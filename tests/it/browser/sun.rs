//! The sun from a date, time and place on the page (issue #19): the device's local date and time
//! become the instant in the link, and the sun and the clear sky follow the engine.

use super::*;

#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn a_clear_sky_at_a_date_and_place_follows_the_engine() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        c.goto(&base).await.unwrap();
        wait_rendered(&c).await;
        tap(&c, "[data-toggle=setting] button:nth-child(2)").await;
        tap(&c, "[data-toggle=sun-input] button:nth-child(2)").await;
        assert!(hidden(&c, "Gb").await, "typed sunlight still asked");
        assert!(!hidden(&c, "lat").await && !hidden(&c, "lon").await);
        type_into(&c, "lat", "45.5").await;
        type_into(&c, "lon", "-73.6").await;
        // Midsummer noon on the device's clock, set as a person picks it.
        js(
            &c,
            "const i = document.querySelector('#in-sun-time'); i.value = '2026-06-21T12:00'; \
             i.dispatchEvent(new Event('change', {bubbles: true})); return 1;",
        )
        .await;
        let want_t = js(&c, "return new Date(2026, 5, 21, 12, 0).getTime() / 1000;")
            .await
            .as_f64()
            .unwrap();
        let hash = js(&c, "return location.hash;").await;
        let (s, _) = scenario::from_fragment(hash.as_str().unwrap()).unwrap();
        assert_eq!(s.sun_time, want_t);
        assert_eq!((s.latitude, s.longitude), (45.5, -73.6));
        let want = expect(&s);
        assert!(close(
            si(&c, "sun_elevation").await,
            want.sun_elevation.unwrap()
        ));
        assert!(close(
            si(&c, "clear_beam").await,
            want.sunlight.unwrap().beam_normal
        ));
        assert!(close(
            si(&c, "surface_temperature").await,
            want.surface_temp
        ));
        assert_no_nan_shown(&c).await;
        c.close().await.unwrap();
    });
}
