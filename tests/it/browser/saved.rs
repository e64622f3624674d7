//! Layouts at three widths with axe-core, and saved work: save, open, export, import, print.

use super::*;
/// axe-core's source, installed by `./setup.sh tools` into .tools/ (npm registry).
fn axe_source() -> Option<String> {
    let p =
        PathBuf::from(env!("CARGO_MANIFEST_DIR")).join(".tools/node_modules/axe-core/axe.min.js");
    std::fs::read_to_string(p).ok()
}

/// The violations axe-core reports at serious or critical impact.
async fn axe_serious(c: &Client, axe: &str) -> Vec<String> {
    c.execute(&format!("{axe}\n;return true;"), vec![])
        .await
        .expect("load axe-core");
    let v = c
        .execute_async(
            "const done = arguments[0]; axe.run(document).then(r => done(r.violations.filter(v => v.impact === 'serious' || v.impact === 'critical').map(v => v.id + ' (' + v.impact + '): ' + v.help + ' — ' + v.nodes.slice(0, 3).map(n => n.target.join(' ')).join(', '))));",
            vec![],
        )
        .await
        .expect("run axe-core");
    v.as_array()
        .unwrap()
        .iter()
        .map(|s| s.as_str().unwrap().to_string())
        .collect()
}

/// Layout at a tablet, a phone and a desktop size without horizontal scrolling, and no serious or
/// critical accessibility violation (axe-core) in the typed and the solved scenario.
#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn layouts_fit_and_pass_axe_core() {
    require_browser();
    let Some(axe) = axe_source() else {
        panic!("axe-core missing: run ./setup.sh tools");
    };
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        let solved = "#v=1&s=cyl&ax=h&w=h&f=humid&sm=x&wm=cs&nl=2&pm=p&hm=rh&D=0.0603&L=12&U=7&Ta=278.15&p=101325&rh=0.7&Tp=423.15&u=si";
        for (w, h) in [(768u32, 1024u32), (360, 740), (1440, 900)] {
            c.set_window_size(w, h).await.unwrap();
            let solved_us = solved.replace("u=si", "u=us");
            for frag in ["", solved, solved_us.as_str()] {
                c.goto("about:blank").await.unwrap();
                c.goto(&format!("{base}{frag}")).await.unwrap();
                wait_rendered(&c).await;
                let fit = js(
                    &c,
                    "return [document.documentElement.scrollWidth, window.innerWidth];",
                )
                .await;
                let (sw, iw) = (fit[0].as_u64().unwrap(), fit[1].as_u64().unwrap());
                assert!(
                    sw <= iw,
                    "{w}×{h} {frag}: page {sw} px wide in a {iw} px window"
                );
                let bad = axe_serious(&c, &axe).await;
                assert!(bad.is_empty(), "{w}×{h} {frag}: axe-core: {bad:#?}");
            }
        }
        c.close().await.unwrap();
    });
}

/// Pages in a PDF: page objects are written as "/Type /Page" (the tree as "/Type /Pages").
pub(super) fn pdf_pages(pdf: &[u8]) -> usize {
    let pat = b"/Type /Page";
    pdf.windows(pat.len() + 1)
        .filter(|w| &w[..pat.len()] == pat && w[pat.len()] != b's')
        .count()
}

/// Saved work: save → reload → still there; storage → file → import after clearing gives the same
/// store; a corrupt store opens with a message and its text kept; the report prints on one A4 and
/// one US Letter page.
#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn saved_work_survives_travels_and_prints() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        c.goto(&base).await.unwrap();
        wait_rendered(&c).await;
        js(&c, "localStorage.clear(); return true;").await;
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        let click = |css: &'static str| {
            let c = c.clone();
            async move { tap(&c, css).await }
        };
        // Save two, reload: both still there.
        click("[data-action=save]").await;
        type_into(&c, "D", "114.3").await;
        click("[data-action=save]").await;
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        let names = js(
            &c,
            "return [...document.querySelectorAll('[data-saved]')].map(e => e.dataset.saved);",
        )
        .await;
        assert_eq!(names, json!(["Line 1", "Line 1 (2)"]));
        // Open the first: the demo's diameter comes back.
        click("[data-saved='Line 1'] button").await;
        assert!(close(si(&c, "h").await, expect(&DEMO).h));
        // An item saved on a page in US units opens in the units this page is in (SI here).
        let kept = js(&c, "return localStorage.getItem('leeward.saved');").await;
        js(&c, "const s = JSON.parse(localStorage.getItem('leeward.saved')); s.scenarios.push({...s.scenarios[0], name: 'Saved in US units', link: s.scenarios[0].link.replace('u=si', 'u=us')}); localStorage.setItem('leeward.saved', JSON.stringify(s)); return true;").await;
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        click("[data-saved='Saved in US units'] button").await;
        assert!(close(si(&c, "h").await, expect(&DEMO).h));
        assert_eq!(
            js(&c, "return [document.querySelector('[data-system=si]').getAttribute('aria-pressed'), document.querySelector('#in-D').value];").await,
            json!(["true", "60.3"])
        );
        js(
            &c,
            &format!("localStorage.setItem('leeward.saved', {kept}); return true;"),
        )
        .await;
        c.refresh().await.unwrap();
        wait_rendered(&c).await;

        // Export (the stored text is the file's text) → clear → import → identical.
        let text = js(&c, "return localStorage.getItem('leeward.saved');").await;
        let text = text.as_str().unwrap().to_string();
        let file = std::env::temp_dir().join(format!("leeward-import-{}.json", std::process::id()));
        std::fs::write(&file, &text).unwrap();
        js(&c, "localStorage.clear(); return true;").await;
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        assert_eq!(
            js(
                &c,
                "return document.querySelectorAll('[data-saved]').length;"
            )
            .await,
            json!(0)
        );
        c.find(Locator::Css("[data-action=import]"))
            .await
            .unwrap()
            .send_keys(&file.display().to_string())
            .await
            .unwrap();
        let t0 = Instant::now();
        while js(
            &c,
            "return document.querySelectorAll('[data-import-plan]').length;",
        )
        .await
            != json!(1)
        {
            assert!(
                t0.elapsed() < Duration::from_secs(10),
                "no import plan shown"
            );
            tokio::time::sleep(Duration::from_millis(50)).await;
        }
        assert!(text_of(&c, "[data-import-plan]")
            .await
            .contains("Line 1 (2)"));
        click("[data-action=confirm-import]").await;
        let after = js(&c, "return localStorage.getItem('leeward.saved');").await;
        assert_eq!(
            after.as_str().unwrap(),
            text,
            "import did not give back the same store"
        );
        let _ = std::fs::remove_file(&file);

        // CSV: the engine's own export of two items plus a bad row imports the good rows and
        // reports the bad one by line and column.
        let items = vec![leeward::engine::store::Saved::new(
            "Tank T-4",
            "T-4",
            "Yard",
            &DEMO,
            leeward::engine::units::System::Si,
        )];
        let mut csv = leeward::engine::survey::to_csv(
            &items,
            leeward::engine::units::System::Us,
            &Default::default(),
        );
        csv.push_str("Bad row,,,cube\r\n");
        let csv_file =
            std::env::temp_dir().join(format!("leeward-import-{}.csv", std::process::id()));
        std::fs::write(&csv_file, &csv).unwrap();
        let before = js(
            &c,
            "return document.querySelectorAll('[data-saved]').length;",
        )
        .await
        .as_u64()
        .unwrap();
        c.find(Locator::Css("[data-action=import-csv]"))
            .await
            .unwrap()
            .send_keys(&csv_file.display().to_string())
            .await
            .unwrap();
        let t0 = Instant::now();
        while js(
            &c,
            "return document.querySelectorAll('[data-saved]').length;",
        )
        .await
        .as_u64()
        .unwrap()
            != before + 1
        {
            assert!(
                t0.elapsed() < Duration::from_secs(10),
                "CSV rows not imported"
            );
            tokio::time::sleep(Duration::from_millis(50)).await;
        }
        let note = text_of(&c, "[data-saved-note]").await;
        assert!(
            note.contains("line 3, column 4"),
            "bad row not reported: {note}"
        );
        let _ = std::fs::remove_file(&csv_file);
        // The imported tank computes as the engine does.
        let tank = leeward::engine::survey::evaluate_item(&DEMO).unwrap();
        let shown = text_of(&c, "[data-saved=\"Tank T-4\"] [data-item-loss]").await;
        assert!(
            shown.contains(&leeward::engine::units::show(
                tank.q_total,
                leeward::engine::units::unit("W").unwrap()
            )),
            "{shown}"
        );

        // 1,000 items: the list and its totals render.
        let many = leeward::engine::store::Store {
            items: (0..1000)
                .map(|i| {
                    let mut s = DEMO;
                    s.diameter = 0.02 + 0.0003 * i as f64;
                    leeward::engine::store::Saved::new(
                        &format!("Item {i}"),
                        "",
                        "",
                        &s,
                        leeward::engine::units::System::Si,
                    )
                })
                .collect(),
            unreadable: vec![],
        };
        let args = vec![json!(leeward::engine::store::to_json(&many))];
        c.execute(
            "localStorage.setItem('leeward.saved', arguments[0]); return true;",
            args,
        )
        .await
        .unwrap();
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        // The survey is worked out in slices after the first result: wait for all of it.
        let t0 = Instant::now();
        while js(
            &c,
            "return document.querySelector('[data-saved-list]').dataset.items;",
        )
        .await
            != json!("1000")
        {
            assert!(
                t0.elapsed() < Duration::from_secs(60),
                "the 1,000-item list never showed"
            );
            tokio::time::sleep(Duration::from_millis(50)).await;
        }
        assert!(text_of(&c, "[data-totals]").await.contains("1000 item"));
        // The first 100 rows are laid out; the rest are a tap away, 100 at a time.
        let rows = "return document.querySelectorAll('[data-saved]').length;";
        assert_eq!(js(&c, rows).await, json!(100));
        for shown in (200..=1000).step_by(100) {
            tap(&c, "[data-action=more]").await;
            assert_eq!(js(&c, rows).await, json!(shown));
        }
        assert!(
            js(
                &c,
                "return document.querySelector('[data-more]').classList.contains('hidden');"
            )
            .await
                == json!(true)
        );

        // A corrupt store: the page opens, says so, and keeps the text.
        js(
            &c,
            "localStorage.setItem('leeward.saved', '{\"format\": broken'); return true;",
        )
        .await;
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        assert!(text_of(&c, "[data-saved-note]")
            .await
            .contains("could not be read"));
        assert_eq!(
            js(
                &c,
                "return localStorage.getItem('leeward.saved.unreadable');"
            )
            .await,
            json!("{\"format\": broken")
        );
        assert!(close(si(&c, "h").await, expect(&DEMO).h));

        // The report: one page on A4 and on US Letter.
        use fantoccini::wd::{PrintConfiguration, PrintSize};
        // The longest report: a three-layer job on a cold night, with long names, in US units.
        c.goto("about:blank").await.unwrap();
        c.goto(&format!("{base}#v=1&s=cyl&ax=h&w=h&f=humid&pm=p&hm=rh&sm=x&nl=3&wm=cs&D=0.1683&L=40&U=6&Ta=258.15&Tr=258.15&p=101325&rh=0.8&Tp=453.15&t1=0.05&t2=0.04&t3=0.03&qt=60&tft=28800&u=us"))
            .await
            .unwrap();
        wait_rendered(&c).await;
        for (key, text) in [
            ("save-name", "Boiler house to tank farm, north rack, steam supply header after the pressure-reducing station"),
            ("save-tag", "LP-STM-0042-N-RACK-SECTION-B"),
            ("save-place", "North pipe rack, between column lines C7 and C12, elevation 6 m above grade"),
        ] {
            type_into(&c, key, text).await;
        }
        // The page builds its report on the browser's beforeprint event (WebDriver's print does
        // not send one, so the test does).
        js(
            &c,
            "window.dispatchEvent(new Event('beforeprint')); return true;",
        )
        .await;
        let t0 = Instant::now();
        while js(
            &c,
            "return document.querySelectorAll('[data-report]').length;",
        )
        .await
            != json!(1)
        {
            assert!(t0.elapsed() < Duration::from_secs(5), "no report built");
            tokio::time::sleep(Duration::from_millis(20)).await;
        }
        // What it says (read before printing: the print may end with afterprint, which takes
        // the report away).
        let report = text_of(&c, "[data-report]").await;
        for want in ["Boiler house to tank farm", "LP-STM-0042", "°F"] {
            assert!(report.contains(want), "the report lacks “{want}”: {report}");
        }
        // Each limit's thickness: needed where the layer falls short, "meets it from" where not.
        assert!(
            report.contains("needs ≥") || report.contains("meets it from"),
            "the report lacks the thickness that meets a limit: {report}"
        );
        for size in [PrintSize::A4, PrintSize::US_LETTER] {
            let pdf = c
                .print(PrintConfiguration::builder().size(size).build().unwrap())
                .await
                .unwrap();
            assert_eq!(pdf_pages(&pdf), 1, "the report is not one page");
        }

        js(&c, "localStorage.clear(); return true;").await;

        // The embed view for a wiki page: no header, no plots, inputs locked, same numbers; the
        // link keeps its view keys (a fresh load: a changed fragment alone is not a new page).
        c.goto("about:blank").await.unwrap();
        c.goto(&format!(
            "{base}#{}&view=embed&lock=1",
            scenario::to_fragment(&DEMO, leeward::engine::units::System::Si)
        ))
        .await
        .unwrap();
        wait_rendered(&c).await;
        assert!(close(si(&c, "h").await, expect(&DEMO).h));
        assert_eq!(
            js(
                &c,
                "return document.querySelector('header.bar').classList.contains('hidden');"
            )
            .await,
            json!(true)
        );
        assert_eq!(
            js(
                &c,
                "return document.querySelector('#in-D').matches(':disabled');"
            )
            .await,
            json!(true)
        );
        assert_eq!(
            js(
                &c,
                "return document.querySelectorAll('[data-panel=saved]').length;"
            )
            .await,
            json!(0)
        );
        let url = c.current_url().await.unwrap().to_string();
        assert!(url.ends_with("&view=embed&lock=1"), "{url}");
        c.close().await.unwrap();
    });
}
