//! The page as a technician uses it on site, at a phone's, a tablet's and a laptop's size: the
//! answer bar stays in view while typing, each verdict badge reaches its card, nothing in the
//! results or the survey is clipped, and a page in US units shows no SI text.

use super::*;

/// An insulated DN 50 steam line in a winter wind with a loss target and a touch limit: every
/// kind of limit card shows (touch, freezing, loss target).
const WINTER_LINE: &str = "#v=1&s=cyl&ax=h&w=h&f=humid&pm=p&hm=rh&sm=x&nl=1&wm=cs&D=0.0603&L=12&U=8&Ta=263.15&Tr=263.15&p=101325&rh=0.8&Tp=423.15&t1=0.03&ka1=0.04&kb1=0.06&Tka=283.15&Tkb=373.15&qt=40&u=si";

const SIZES: [(u32, u32); 3] = [(360, 740), (768, 1024), (1024, 768)];

/// The bar's box against the window: fully inside it.
async fn bar_in_view(c: &Client) -> bool {
    js(
        c,
        "const r = document.querySelector('[data-answer-bar]').getBoundingClientRect(); return r.top >= -1 && r.bottom <= window.innerHeight + 1 && r.height > 20;",
    )
    .await
    .as_bool()
    .unwrap()
}

#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn the_answer_bar_stays_in_view_and_each_badge_reaches_its_card() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        for (w, h) in SIZES {
            c.set_window_size(w, h).await.unwrap();
            c.goto("about:blank").await.unwrap();
            c.goto(&format!("{base}{WINTER_LINE}")).await.unwrap();
            wait_rendered(&c).await;
            // Type into the last input the person can see (the far end of the form).
            let last = js(&c, "const f = [...document.querySelectorAll('[data-field]')].filter(e => e.offsetParent !== null); return f[f.length - 1].dataset.field;").await;
            let last = last.as_str().unwrap().to_string();
            type_into(&c, &last, "0.9").await;
            tokio::time::sleep(Duration::from_millis(300)).await;
            assert!(
                bar_in_view(&c).await,
                "{w}×{h}: the bar is out of view after typing into {last}"
            );
            // The bar's figures are the engine's, as the page rounds them.
            let loss = text_of(&c, "[data-answer=loss]").await;
            assert!(loss.ends_with("W/m") && !loss.contains("NaN"), "{loss}");
            // Every badge takes the person to its card, below the bar, in the window.
            let badges = js(
                &c,
                "return [...document.querySelectorAll('[data-badge]')].map(b => b.dataset.badge);",
            )
            .await;
            let badges: Vec<String> = badges
                .as_array()
                .unwrap()
                .iter()
                .map(|b| b.as_str().unwrap().to_string())
                .collect();
            for want in ["touch", "freeze", "loss"] {
                assert!(
                    badges.iter().any(|b| b == want),
                    "{w}×{h}: no {want} badge in {badges:?}"
                );
            }
            if w < 720 {
                // On a phone the bar's arrow goes to the results, then back to the inputs.
                for (go, heading, then) in [
                    ("results", "results-title", "inputs"),
                    ("inputs", "body-title", "results"),
                ] {
                    // A real click where the arrow lies: nothing may cover the bar.
                    c.find(Locator::Css(&format!("[data-jump={go}]")))
                        .await
                        .unwrap()
                        .click()
                        .await
                        .unwrap();
                    tokio::time::sleep(Duration::from_millis(400)).await;
                    let top = js(&c, &format!("return document.getElementById('{heading}').getBoundingClientRect().top;")).await;
                    let top = top.as_f64().unwrap();
                    assert!(
                        top >= 0.0 && top < f64::from(h) / 2.0,
                        "{w}×{h}: jump to {go}: heading at {top}"
                    );
                    let now = js(
                        &c,
                        "return document.querySelector('[data-jump]').dataset.jump;",
                    )
                    .await;
                    assert_eq!(now.as_str(), Some(then), "{w}×{h}: after the jump to {go}");
                }
            }
            for b in &badges {
                c.goto("about:blank").await.unwrap();
                c.goto(&format!("{base}{WINTER_LINE}")).await.unwrap();
                wait_rendered(&c).await;
                c.find(Locator::Css(&format!("[data-badge={b}]")))
                    .await
                    .unwrap()
                    .click()
                    .await
                    .unwrap();
                tokio::time::sleep(Duration::from_millis(400)).await;
                let seen = js(
                    &c,
                    &format!("const bar = document.querySelector('[data-answer-bar]').getBoundingClientRect(); const r = document.querySelector('[data-verdict={b}]').getBoundingClientRect(); return [r.top, bar.bottom, window.innerHeight];"),
                )
                .await;
                let (top, bar, inner) = (
                    seen[0].as_f64().unwrap(),
                    seen[1].as_f64().unwrap(),
                    seen[2].as_f64().unwrap(),
                );
                assert!(
                    top >= bar - 2.0 && top < inner - 40.0,
                    "{w}×{h}: badge {b}: card top {top}, bar bottom {bar}, window {inner}"
                );
            }
        }
        c.close().await.unwrap();
    });
}

#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn nothing_in_the_results_or_the_survey_is_clipped_and_us_pages_show_no_si_text() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        for (w, h) in SIZES {
            c.set_window_size(w, h).await.unwrap();
            for frag in [WINTER_LINE.to_string(), WINTER_LINE.replace("u=si", "u=us")] {
                c.goto("about:blank").await.unwrap();
                c.goto(&format!("{base}{frag}")).await.unwrap();
                wait_rendered(&c).await;
                // Save the item so the survey has a row.
                tap(&c, "[data-action=save]").await;
                tokio::time::sleep(Duration::from_millis(500)).await;
                let clipped = js(
                    &c,
                    "return [...document.querySelectorAll('.results table, .results .verdict, .results .figures div, [data-panel=saved] table, [data-answer-bar]')].filter(e => e.offsetParent !== null && e.scrollWidth > e.clientWidth + 1).map(e => (e.className || e.tagName) + ' ' + e.scrollWidth + '>' + e.clientWidth);",
                )
                .await;
                assert_eq!(clipped, json!([]), "{w}×{h} {frag}: clipped");
                // Plot text reads at 11 px or more: its font size in the SVG's units times the
                // scale the page draws the SVG at.
                let small = js(
                    &c,
                    "return [...document.querySelectorAll('.plot svg')].filter(s => s.getBoundingClientRect().width > 0).flatMap(s => { const k = s.getBoundingClientRect().width / s.viewBox.baseVal.width; return [...s.querySelectorAll('text')].map(t => [t.textContent, parseFloat(getComputedStyle(t).fontSize) * k]).filter(([, px]) => px < 10.95).map(([t, px]) => t + ' ' + px.toFixed(1)); });",
                )
                .await;
                assert_eq!(small, json!([]), "{w}×{h} {frag}: plot text under 11 px");
                if frag.ends_with("u=us") {
                    // What a person reads: rendered text, without the unit pickers' lists.
                    let text = js(
                        &c,
                        "const sel = [...document.querySelectorAll('select')]; sel.forEach(s => s.style.display = 'none'); const t = document.body.innerText; sel.forEach(s => s.style.display = ''); return t;",
                    )
                    .await;
                    let text = text.as_str().unwrap();
                    let around = |i: usize| {
                        let start = text[..i].char_indices().rev().nth(80).map_or(0, |(j, _)| j);
                        let end = text[i..]
                            .char_indices()
                            .nth(20)
                            .map_or(text.len(), |(j, _)| i + j);
                        &text[start..end]
                    };
                    for si in ["°C", "W/m", " mm", "kPa", "W/(m", "J/(kg", "kg/h", "m/s"] {
                        if let Some(i) = text.find(si) {
                            panic!("{w}×{h}: a US page shows “{si}”: …{}…", around(i));
                        }
                    }
                }
            }
        }
        c.close().await.unwrap();
    });
}
