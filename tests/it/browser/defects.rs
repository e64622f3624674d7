//! The hostile-user report's defects that only the page can show, each with a regression test
//! named after it (the engine-side ones are in `store`, `survey`, `units`, `tests/it/entry.rs` and
//! the server's own tests).

use super::*;

/// Wait until the JavaScript expression `expr` is true, at most `secs` seconds.
async fn wait_for(c: &Client, expr: &str, what: &str, secs: u64) {
    let t0 = Instant::now();
    while js(c, &format!("return !!({expr});")).await != json!(true) {
        assert!(t0.elapsed() < Duration::from_secs(secs), "{what}");
        tokio::time::sleep(Duration::from_millis(50)).await;
    }
}

async fn rows(c: &Client) -> u64 {
    js(
        c,
        "return document.querySelectorAll('[data-saved]').length;",
    )
    .await
    .as_u64()
    .unwrap()
}

/// Choose a file in one of the page's file inputs.
async fn choose_file(c: &Client, action: &str, name: &str, text: &str) {
    let path = std::env::temp_dir().join(format!("leeward-{}-{name}", std::process::id()));
    std::fs::write(&path, text).unwrap();
    c.find(Locator::Css(&format!("[data-action={action}]")))
        .await
        .unwrap()
        .send_keys(&path.display().to_string())
        .await
        .unwrap();
}

/// A CSV of `n` rows, every one named "Pipe" (the demo line, sizes varied).
fn csv_of(n: usize) -> String {
    let items: Vec<_> = (0..n)
        .map(|i| {
            let mut s = DEMO;
            s.diameter = 0.02 + 1e-5 * i as f64;
            leeward::engine::store::Saved::new(
                "Pipe",
                "",
                "",
                &s,
                leeward::engine::units::System::Si,
            )
        })
        .collect();
    leeward::engine::survey::to_csv(
        &items,
        leeward::engine::units::System::Si,
        &Default::default(),
    )
}

/// Defects 1 and 5: a 10,000-row CSV then a 1,100-row one were both "Imported", wrote a store the
/// reader refused (the next load showed nothing and the next save lost it all), and 10,000 rows
/// of one name froze the tab for minutes. Now each import either is stored and reads back after a
/// reload, or is refused before anything changes; the names stay distinct.
#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn defect_1_and_5_large_imports_read_back_or_are_refused() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        c.goto(&base).await.unwrap();
        js(&c, "localStorage.clear(); return true;").await;
        c.refresh().await.unwrap();
        wait_rendered(&c).await;

        // 10,001 rows: the one past the limit is reported (defect 7), never dropped silently.
        choose_file(&c, "import-csv", "10000.csv", &csv_of(10_001)).await;
        wait_for(
            &c,
            "document.querySelector('[data-saved-note]').textContent.includes('10000 row')",
            "the 10,000-row import never reported",
            120,
        )
        .await;
        assert!(text_of(&c, "[data-saved-note]")
            .await
            .contains("1 more left out"));
        wait_for(
            &c,
            "document.querySelector('[data-saved-list]').dataset.items === '10000'",
            "the 10,000 rows never showed",
            120,
        )
        .await;
        // The list lays out its first rows and offers the rest; the store holds every name once.
        assert_eq!(
            js(
                &c,
                "return document.querySelectorAll('[data-saved]').length;"
            )
            .await,
            json!(100)
        );
        assert!(text_of(&c, "[data-more]")
            .await
            .contains("Showing 100 of 10000 items"));
        let names: std::collections::HashSet<String> = serde_json::from_value(
            js(&c, "return JSON.parse(localStorage.getItem('leeward.saved')).scenarios.map(s => s.name);").await,
        )
        .unwrap();
        assert_eq!(names.len(), 10_000, "names repeat");

        choose_file(&c, "import-csv", "1100.csv", &csv_of(1_100)).await;
        wait_for(
            &c,
            "/1100 row|Not saved/.test(document.querySelector('[data-saved-note]').textContent)",
            "the 1,100-row import never reported",
            120,
        )
        .await;
        let note = text_of(&c, "[data-saved-note]").await;
        let expect = if note.contains("Not saved") {
            10_000
        } else {
            11_100
        };
        if note.contains("Not saved") {
            assert!(note.contains("MB") && note.contains("xport"), "{note}");
        }
        // What the page said it kept is what a reload finds.
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        wait_for(
            &c,
            &format!("document.querySelector('[data-saved-list]').dataset.items === '{expect}'"),
            "the saved work did not read back",
            120,
        )
        .await;
        assert!(!text_of(&c, "[data-saved-note]")
            .await
            .contains("could not be read"));
        js(&c, "localStorage.clear(); return true;").await;
        c.close().await.unwrap();
    });
}

/// Defect 1, storage near its quota: a save that does not fit is refused with a message and the
/// earlier store stays as it was; a store that cannot be read and cannot be copied aside is not
/// called "kept": it is offered as a download and nothing is written over it.
#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn defect_1_storage_near_its_quota_loses_nothing() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        c.goto(&base).await.unwrap();
        js(&c, "localStorage.clear(); return true;").await;
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        tap(&c, "[data-action=save]").await;
        wait_for(
            &c,
            "document.querySelectorAll('[data-saved]').length === 1",
            "first save",
            10,
        )
        .await;
        let stored = js(&c, "return localStorage.getItem('leeward.saved');").await;
        // Fill the rest of the quota with another key, as another page of the origin might.
        js(&c, "let n = 1 << 22, i = 0; while (n >= 1) { try { localStorage.setItem('f' + i++, 'x'.repeat(n)); } catch (e) { n >>= 1; } } return true;").await;
        tap(&c, "[data-action=save]").await;
        let note = text_of(&c, "[data-saved-note]").await;
        assert!(note.contains("Not saved"), "{note}");
        assert_eq!(
            js(&c, "return localStorage.getItem('leeward.saved');").await,
            stored
        );
        assert_eq!(rows(&c).await, 1);

        // Unreadable and no room for a copy: held, offered, never overwritten.
        js(
            &c,
            "localStorage.setItem('leeward.saved', '{{{ not json'); return true;",
        )
        .await;
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        wait_for(
            &c,
            "document.querySelector('[data-saved-note]').textContent.length > 0",
            "no message",
            10,
        )
        .await;
        let note = text_of(&c, "[data-saved-note]").await;
        let copied = js(
            &c,
            "return localStorage.getItem('leeward.saved.unreadable');",
        )
        .await;
        if copied.is_null() {
            assert!(
                note.contains("no room"),
                "claims a copy it has not made: {note}"
            );
            assert!(
                js(
                    &c,
                    "return !!document.querySelector('[data-action=download-unreadable]');"
                )
                .await
                    == json!(true)
            );
            tap(&c, "[data-action=save]").await;
            assert!(text_of(&c, "[data-saved-note]").await.contains("Not saved"));
            assert_eq!(
                js(&c, "return localStorage.getItem('leeward.saved');").await,
                json!("{{{ not json")
            );
        } else {
            assert_eq!(copied, json!("{{{ not json"));
            assert!(note.contains("kept under"), "{note}");
        }
        js(&c, "localStorage.clear(); return true;").await;
        c.close().await.unwrap();
    });
}

/// Defect 4: 150 typed with D in m (refused), then D's unit switched to mm: the field showed
/// 150 mm while every result still used 60.3 mm. Now the field's text is read again in the new
/// unit and used.
#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn defect_4_a_unit_switch_never_leaves_the_old_value_computing() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        c.goto(&base).await.unwrap();
        wait_rendered(&c).await;
        let unit = "[data-field-box=D] select";
        pick(&c, unit, "m").await;
        paste_into(&c, "D", "150").await;
        assert!(
            !text_of(&c, "[data-msg-for=D]").await.trim().is_empty(),
            "150 m is refused"
        );
        pick(&c, unit, "mm").await;
        assert!(text_of(&c, "[data-msg-for=D]").await.trim().is_empty());
        let mut s = DEMO;
        s.diameter = 0.150;
        let want = expect(&s);
        wait_for(
            &c,
            "document.querySelector('[data-quantity=h]').getAttribute('data-si') !== ''",
            "no result",
            10,
        )
        .await;
        let h = si(&c, "h").await;
        assert!(
            close(h, want.h),
            "page h {h}, engine with D = 150 mm: {}",
            want.h
        );
        c.close().await.unwrap();
    });
}

/// Defect 11: opening with 5,000 saved items made the first result wait for the whole survey
/// (2 s). The page now reads the saved work only after its first result is on screen: the
/// page's own performance marks must come in that order (the time itself is measured by the
/// browser timing harness, never asserted here).
#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn defect_11_the_first_result_does_not_wait_for_the_survey() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        c.goto(&base).await.unwrap();
        wait_rendered(&c).await;
        let many = leeward::engine::store::Store {
            items: (0..5000)
                .map(|i| {
                    leeward::engine::store::Saved::new(
                        &format!("Item {i}"),
                        "",
                        "",
                        &DEMO,
                        leeward::engine::units::System::Si,
                    )
                })
                .collect(),
            unreadable: vec![],
        };
        let text = leeward::engine::store::to_json(&many);
        c.execute(
            "localStorage.setItem('leeward.saved', arguments[0]); return true;",
            vec![json!(text)],
        )
        .await
        .unwrap();
        c.refresh().await.unwrap();
        wait_for(
            &c,
            "document.querySelector('[data-saved-list]').dataset.items === '5000'",
            "the list never showed",
            120,
        )
        .await;
        let v = js(&c, "const at = n => performance.getEntriesByName(n).map(e => e.startTime); return [at('leeward-first-result'), at('leeward-saved-read')];").await;
        let first = v[0][0].as_f64().expect("first-result mark");
        let read = v[1][0].as_f64().expect("saved-read mark");
        assert!(
            first <= read,
            "first result at {first} ms, after the saved work was read at {read} ms"
        );
        js(&c, "localStorage.clear(); return true;").await;
        c.close().await.unwrap();
    });
}

async fn click(c: &Client, css: &str) {
    tap(c, css).await;
}

async fn names(c: &Client) -> Vec<String> {
    serde_json::from_value(
        js(c, "return [...document.querySelectorAll('[data-saved]')].map(e => e.getAttribute('data-saved'));").await,
    )
    .unwrap()
}

/// Every name on the list is distinct and at most 120 characters.
fn assert_distinct(names: &[String]) {
    let set: std::collections::HashSet<&String> = names.iter().collect();
    assert_eq!(set.len(), names.len(), "names repeat: {names:?}");
    assert!(names.iter().all(|n| n.chars().count() <= 120), "{names:?}");
}

/// Defects 2 and 6: a name of 118–120 characters froze the tab on Save, Duplicate, Rename or a CSV
/// import (every candidate "name (n)" clipped back to the same text); a JSON file with two entries
/// of one name kept only the second although its plan listed both. Every path that names an item
/// is walked here with long names.
#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn defect_2_and_6_every_naming_path_gives_distinct_names() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        c.goto(&base).await.unwrap();
        js(&c, "localStorage.clear(); return true;").await;
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        let long = "L".repeat(120);
        paste_into(&c, "save-name", &long).await;
        click(&c, "[data-action=save]").await;
        click(&c, "[data-action=save]").await;
        wait_for(
            &c,
            "document.querySelectorAll('[data-saved]').length === 2",
            "two saves",
            10,
        )
        .await;
        // Duplicate, then Rename to the taken long name.
        click(&c, "[data-saved] .saved-actions button:nth-child(4)").await;
        wait_for(
            &c,
            "document.querySelectorAll('[data-saved]').length === 3",
            "duplicate",
            10,
        )
        .await;
        click(
            &c,
            "[data-saved]:nth-child(3) .saved-actions button:nth-child(3)",
        )
        .await;
        assert_distinct(&names(&c).await);

        // A CSV with two rows of one 130-character name.
        let mut items = vec![];
        for _ in 0..2 {
            items.push(leeward::engine::store::Saved::new(
                &"C".repeat(130),
                "",
                "",
                &DEMO,
                leeward::engine::units::System::Si,
            ));
        }
        // Saved::new clips to 120: write the 130 characters into the file by hand.
        let csv = leeward::engine::survey::to_csv(
            &items,
            leeward::engine::units::System::Si,
            &Default::default(),
        )
        .replace(&"C".repeat(120), &"C".repeat(130));
        choose_file(&c, "import-csv", "long.csv", &csv).await;
        wait_for(
            &c,
            "document.querySelectorAll('[data-saved]').length === 5",
            "CSV rows",
            10,
        )
        .await;
        assert_distinct(&names(&c).await);

        // A saved-work file with two entries of one 150-character name: both arrive.
        let link = scenario::to_fragment(&DEMO, leeward::engine::units::System::Si);
        let n150 = "J".repeat(150);
        let file = format!(
            "{{\"format\":\"leeward-saved-work\",\"version\":1,\"scenarios\":[{{\"name\":\"{n150}\",\"link\":\"{link}\"}},{{\"name\":\"{n150}\",\"link\":\"{link}\"}}]}}"
        );
        choose_file(&c, "import", "twice.json", &file).await;
        wait_for(
            &c,
            "!!document.querySelector('[data-import-plan]')",
            "no plan",
            10,
        )
        .await;
        let plan = text_of(&c, "[data-import-plan]").await;
        assert!(
            plan.contains(" (2)"),
            "the plan shows the final names: {plan}"
        );
        click(&c, "[data-action=confirm-import]").await;
        wait_for(
            &c,
            "document.querySelectorAll('[data-saved]').length === 7",
            "both entries imported",
            10,
        )
        .await;
        // Duplicate the long imported one.
        click(
            &c,
            &format!(
                "[data-saved='{}'] .saved-actions button:nth-child(4)",
                "J".repeat(120)
            ),
        )
        .await;
        wait_for(
            &c,
            "document.querySelectorAll('[data-saved]').length === 8",
            "duplicate of the long entry",
            10,
        )
        .await;
        let all = names(&c).await;
        assert_distinct(&all);
        // And the store reads back the same after a reload.
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        wait_for(
            &c,
            "document.querySelectorAll('[data-saved]').length === 8",
            "reload",
            10,
        )
        .await;
        assert_eq!(names(&c).await, all);
        js(&c, "localStorage.clear(); return true;").await;
        c.close().await.unwrap();
    });
}

/// Defects 3 and 7: a store of the right format but another shape opened empty with no message
/// and the next save overwrote it; a binary file "imported" 765 demo rows and CR-only line endings
/// imported nothing without a reason.
#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn defect_3_and_7_odd_stores_and_files_are_kept_or_refused_with_a_reason() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        c.goto(&base).await.unwrap();
        wait_rendered(&c).await;
        let link = scenario::to_fragment(&DEMO, leeward::engine::units::System::Si);
        let odd = format!("{{\"format\":\"leeward-saved-work\",\"version\":1,\"scenarios\":{{\"a\":{{\"name\":\"Odd\",\"link\":\"{link}\"}}}}}}");
        c.execute(
            "localStorage.setItem('leeward.saved', arguments[0]); return true;",
            vec![json!(odd)],
        )
        .await
        .unwrap();
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        assert!(text_of(&c, "[data-saved-note]")
            .await
            .contains("kept aside"));
        click(&c, "[data-action=save]").await;
        wait_for(
            &c,
            "document.querySelectorAll('[data-saved]').length === 1",
            "save",
            10,
        )
        .await;
        let stored = js(
            &c,
            "return JSON.parse(localStorage.getItem('leeward.saved')).unreadable;",
        )
        .await;
        assert!(
            stored.to_string().contains("Odd"),
            "the odd part was not kept: {stored}"
        );

        // A binary file as CSV: refused whole, nothing added.
        let binary: String = (0..200_000u32)
            .map(|i| char::from_u32((i * 7919) % 256).unwrap_or('?'))
            .collect();
        choose_file(&c, "import-csv", "binary.csv", &binary).await;
        wait_for(&c, "/not text|Nothing imported|not a/.test(document.querySelector('[data-saved-note]').textContent)", "binary file not refused", 10).await;
        assert_eq!(rows(&c).await, 1);
        // CR-only line endings: the rows are read.
        let items = vec![leeward::engine::store::Saved::new(
            "Mac row",
            "",
            "",
            &DEMO,
            leeward::engine::units::System::Si,
        )];
        let csv = leeward::engine::survey::to_csv(
            &items,
            leeward::engine::units::System::Si,
            &Default::default(),
        )
        .replace("\r\n", "\r");
        choose_file(&c, "import-csv", "cr.csv", &csv).await;
        wait_for(
            &c,
            "document.querySelectorAll('[data-saved]').length === 2",
            "CR-only rows not read",
            10,
        )
        .await;
        js(&c, "localStorage.clear(); return true;").await;
        c.close().await.unwrap();
    });
}

/// Defect 8: with the surface worked out, a process temperature equal to the stream's marked the
/// results stale with "fix the marked input" and nothing visible was marked. The message must be
/// beside a field the person can see.
#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn defect_8_every_message_is_beside_a_visible_field() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        let mut s = DEMO;
        s.surface_mode = scenario::SurfaceMode::Solved;
        s.process_temp = s.fluid_temp;
        let root = base.split('#').next().unwrap().to_string();
        c.goto(&format!(
            "{root}#{}",
            scenario::to_fragment(&s, leeward::engine::units::System::Si)
        ))
        .await
        .unwrap();
        wait_for(
            &c,
            "document.querySelector('[data-stale=true]')",
            "results not marked stale",
            10,
        )
        .await;
        let shown = js(&c, "return [...document.querySelectorAll('[data-msg-for]')].filter(p => p.textContent.trim() && p.closest('[data-field-box]') && !p.closest('[data-field-box]').classList.contains('hidden')).map(p => p.dataset.msgFor);").await;
        assert_eq!(
            shown,
            json!(["Tp"]),
            "the message is not beside the visible process temperature"
        );
        c.close().await.unwrap();
    });
}
