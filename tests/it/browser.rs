//! Browser tests: the built page (dist/) in headless Debian Chromium through ChromeDriver.
//!
//! They need `dist/` (built by `./setup.sh build` or `./setup.sh test`), /usr/bin/chromedriver and
//! axe-core, so each is `#[ignore]`d with that reason: a plain `cargo test` lists them as ignored,
//! never as passed. `./setup.sh test` runs them with `--include-ignored`, and then a missing
//! prerequisite is a failure, never a skip.

use std::io::{BufRead, BufReader};
use std::net::TcpListener;
use std::path::PathBuf;
use std::process::{Child, Command, Stdio};
use std::sync::Mutex;
use std::time::{Duration, Instant};

use fantoccini::{Client, ClientBuilder, Locator};
use leeward::engine::scenario::{self, FluidKind, Scenario, Shape, DEMO};
use serde_json::json;

/// One browser at a time: two cores.
static BROWSER: Mutex<()> = Mutex::new(());

const CHROMEDRIVER: &str = "/usr/bin/chromedriver";
const CHROMIUM: &str = "/usr/bin/chromium";

fn dist() -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("dist")
}

/// The prerequisites of a browser test; a test that runs without them fails (it was asked for:
/// the tests are ignored unless included).
fn require_browser() {
    let have = dist().join("leeward.html").is_file()
        && dist().join("index.html").is_file()
        && std::path::Path::new(CHROMEDRIVER).exists();
    assert!(
        have,
        "browser test asked for, but dist/ or {CHROMEDRIVER} is missing: run ./setup.sh build (or ./setup.sh test)"
    );
}

struct Killed(Child);
impl Drop for Killed {
    fn drop(&mut self) {
        let _ = self.0.kill();
        let _ = self.0.wait();
    }
}

fn free_port() -> u16 {
    TcpListener::bind("127.0.0.1:0")
        .unwrap()
        .local_addr()
        .unwrap()
        .port()
}

fn wait_for_port(port: u16) {
    let t0 = Instant::now();
    while std::net::TcpStream::connect(("127.0.0.1", port)).is_err() {
        assert!(
            t0.elapsed() < Duration::from_secs(20),
            "port {port} never opened"
        );
        std::thread::sleep(Duration::from_millis(50));
    }
}

/// Serve dist/ on a loopback port with the project's own server; returns it and its base URL.
fn serve() -> (Killed, String) {
    let mut child = Command::new(env!("CARGO_BIN_EXE_leeward-serve"))
        .arg(dist())
        .arg("127.0.0.1:0")
        .stdout(Stdio::piped())
        .spawn()
        .expect("start leeward-serve");
    let mut line = String::new();
    BufReader::new(child.stdout.take().unwrap())
        .read_line(&mut line)
        .unwrap();
    let url = line
        .trim()
        .strip_prefix("listening on ")
        .expect("server banner")
        .to_string();
    (Killed(child), url)
}

async fn browser() -> (Killed, Client) {
    let port = free_port();
    let driver = Killed(
        Command::new(CHROMEDRIVER)
            .arg(format!("--port={port}"))
            .stdout(Stdio::null())
            .stderr(Stdio::null())
            .spawn()
            .expect("start chromedriver"),
    );
    wait_for_port(port);
    let profile = std::env::temp_dir().join(format!("leeward-chrome-{port}"));
    let caps = json!({
        "goog:chromeOptions": {
            "binary": CHROMIUM,
            "args": [
                "--headless=new", "--no-sandbox", "--disable-gpu", "--disable-quic",
                "--no-first-run", "--disable-background-networking", "--disable-component-update",
                "--disable-sync", "--window-size=768,1024",
                format!("--user-data-dir={}", profile.display()),
            ]
        }
    });
    let caps = caps.as_object().unwrap().clone();
    let client = ClientBuilder::new(hyper_util::client::legacy::connect::HttpConnector::new())
        .capabilities(caps)
        .connect(&format!("http://127.0.0.1:{port}"))
        .await
        .expect("connect to chromedriver");
    (driver, client)
}

async fn js(c: &Client, script: &str) -> serde_json::Value {
    c.execute(script, vec![]).await.expect(script)
}

/// Wait until the app has rendered its results.
async fn wait_rendered(c: &Client) {
    let t0 = Instant::now();
    loop {
        let v = js(c, "const e = document.querySelector('[data-quantity=h]'); return e ? e.getAttribute('data-si') : null;").await;
        if v.as_str().is_some_and(|s| !s.is_empty()) {
            return;
        }
        assert!(
            t0.elapsed() < Duration::from_secs(20),
            "the page never showed a result"
        );
        tokio::time::sleep(Duration::from_millis(50)).await;
    }
}

async fn si(c: &Client, quantity: &str) -> f64 {
    let v = js(
        c,
        &format!(
            "return document.querySelector('[data-quantity={quantity}]').getAttribute('data-si');"
        ),
    )
    .await;
    v.as_str()
        .unwrap()
        .parse()
        .unwrap_or_else(|_| panic!("{quantity}: data-si = {v}"))
}

/// Replace a field's text as a user would: clear it, then type key by key.
async fn type_into(c: &Client, key: &str, text: &str) {
    let el = c.find(Locator::Css(&format!("#in-{key}"))).await.unwrap();
    el.clear().await.unwrap();
    el.send_keys(text).await.unwrap();
}

/// Replace a field's text in one input event, as a paste does (typing key by key would pass
/// through valid prefixes such as the "1" of "1,2,3").
async fn paste_into(c: &Client, key: &str, text: &str) {
    let args = vec![json!(format!("#in-{key}")), json!(text)];
    c.execute(
        "const e = document.querySelector(arguments[0]); e.value = arguments[1]; e.dispatchEvent(new Event('input', {bubbles: true}));",
        args,
    )
    .await
    .unwrap();
}

/// Choose an option of a select as a user would.
async fn pick(c: &Client, css: &str, value: &str) {
    let args = vec![json!(css), json!(value)];
    c.execute(
        "const e = document.querySelector(arguments[0]); e.value = arguments[1]; e.dispatchEvent(new Event('change', {bubbles: true}));",
        args,
    )
    .await
    .unwrap();
}

/// Whether a field's box is hidden.
async fn hidden(c: &Client, key: &str) -> bool {
    js(
        c,
        &format!(
            "return document.querySelector('[data-field-box={key}]').classList.contains('hidden');"
        ),
    )
    .await
    .as_bool()
    .unwrap()
}

async fn text_of(c: &Client, css: &str) -> String {
    let v = js(
        c,
        &format!("const e = document.querySelector('{css}'); return e ? e.textContent : '';"),
    )
    .await;
    v.as_str().unwrap_or_default().to_string()
}

fn close(a: f64, b: f64) -> bool {
    // wasm and native use different maths libraries: agreement to 1e-9 relative.
    (a - b).abs() <= 1e-9 * b.abs()
}

fn expect(s: &Scenario) -> scenario::Outcome {
    scenario::evaluate(s).unwrap()
}

/// Every resource the page loaded came from its own origin (or is inline data).
async fn assert_no_foreign_requests(c: &Client) {
    let v = js(c, "return [location.origin, location.protocol, performance.getEntriesByType('resource').map(e => e.name)];").await;
    let origin = v[0].as_str().unwrap().to_string();
    let protocol = v[1].as_str().unwrap().to_string();
    for name in v[2].as_array().unwrap() {
        let name = name.as_str().unwrap();
        let own = if protocol == "file:" {
            name.starts_with("file://") || name.starts_with("data:")
        } else {
            name.starts_with(&origin)
        };
        assert!(own, "request left the page's origin: {name}");
    }
}

async fn assert_no_nan_shown(c: &Client) {
    let body = text_of(c, "body").await;
    for bad in ["NaN", "Infinity", "inf "] {
        assert!(!body.contains(bad), "page shows {bad}: {body}");
    }
}

/// The checks both forms of the page must pass.
async fn exercise(c: &Client, base: &str) {
    c.goto(base).await.unwrap();
    wait_rendered(c).await;
    assert!(
        close(si(c, "h").await, expect(&DEMO).h),
        "demo h differs from the engine"
    );
    assert!(text_of(c, "[data-demo]").await.contains("Demo"));

    // Typing, with a decimal comma: the result follows the engine.
    type_into(c, "D", "33,4").await;
    let mut s = DEMO;
    s.diameter = 0.0334;
    let want = expect(&s);
    assert!(close(si(c, "h").await, want.h));
    assert!(close(
        si(c, "q_per_length").await,
        want.q_per_length.unwrap()
    ));
    assert!(close(si(c, "q_total").await, want.q_total));
    assert!(close(si(c, "reynolds").await, want.reynolds));

    // Unit switch: shown values convert, the computed state does not move.
    c.find(Locator::Css("[data-system=us]"))
        .await
        .unwrap()
        .click()
        .await
        .unwrap();
    let shown_d = js(c, "return document.querySelector('#in-D').value;").await;
    assert_eq!(shown_d.as_str().unwrap(), "1.31496", "33.4 mm in inches");
    assert!(text_of(c, "[data-quantity=q_per_length] + .unit")
        .await
        .contains("Btu"));
    assert!(
        close(si(c, "h").await, want.h),
        "unit switch changed the result"
    );
    c.find(Locator::Css("[data-system=si]"))
        .await
        .unwrap()
        .click()
        .await
        .unwrap();
    assert_eq!(
        js(c, "return document.querySelector('#in-D').value;")
            .await
            .as_str()
            .unwrap(),
        "33.4"
    );

    // Bad input: a message beside the field, last good result kept and marked stale, no NaN.
    for (key, bad) in [
        ("D", ""),
        ("D", "abc"),
        ("D", "0"),
        ("D", "-5"),
        ("D", "1,2,3"),
        ("D", "NaN"),
        ("Ta", "-300"),
        ("U", "1e999"),
    ] {
        paste_into(c, key, bad).await;
        let msg = text_of(c, &format!("[data-msg-for={key}]")).await;
        assert!(
            !msg.trim().is_empty(),
            "no message beside {key} for {bad:?}"
        );
        assert!(
            !text_of(c, "[data-stale]").await.is_empty(),
            "not marked stale for {key}={bad:?}"
        );
        assert!(
            close(si(c, "h").await, want.h),
            "last good result lost for {key}={bad:?}"
        );
        assert_no_nan_shown(c).await;
        // Put the good value back.
        let good = match key {
            "D" => "33.4",
            "Ta" => "5",
            _ => "7",
        };
        type_into(c, key, good).await;
        assert!(text_of(c, &format!("[data-msg-for={key}]"))
            .await
            .trim()
            .is_empty());
    }
    // Equal temperatures: said beside the surface temperature, no division by zero.
    type_into(c, "Ts", "5").await;
    assert!(text_of(c, "[data-msg-for=Ts]").await.contains("no heat"));
    assert_no_nan_shown(c).await;
    type_into(c, "Ts", "65").await;
    assert!(close(si(c, "h").await, want.h));

    // The fluid choice: liquid water computes with water's properties and hides the humidity.
    pick(c, "#in-fluid", "water").await;
    let mut w = s;
    w.fluid = FluidKind::Water;
    assert!(
        close(si(c, "h").await, expect(&w).h),
        "water h differs from the engine"
    );
    assert!(text_of(c, "[data-props] caption")
        .await
        .contains("liquid water"));
    assert!(hidden(c, "rh").await && hidden(c, "xg").await);
    pick(c, "#in-fluid", "eg").await;
    assert!(
        !hidden(c, "xg").await,
        "glycol content not shown for glycol"
    );
    paste_into(c, "xg", "75").await;
    assert!(text_of(c, "[data-msg-for=xg]").await.contains("60"));
    type_into(c, "xg", "30").await;
    pick(c, "#in-fluid", "humid").await;
    assert!(!hidden(c, "rh").await);
    paste_into(c, "rh", "120").await;
    assert!(text_of(c, "[data-msg-for=rh]").await.contains("100"));
    type_into(c, "rh", "70").await;
    assert!(
        close(si(c, "h").await, want.h),
        "back to the start: {}",
        si(c, "h").await
    );

    // The working shows the engine's numbers: Re and h as the engine formats them.
    let working = text_of(c, ".working").await;
    for v in [want.reynolds, want.h] {
        let shown = leeward::engine::units::format_sig(v, 5);
        assert!(working.contains(&shown), "working lacks {shown}: {working}");
    }
    // A flag appears when an input leaves a method's range (air at a surface above 1000 K), beside the value
    // and in the notes, with the quantity, its value and the range.
    assert_eq!(
        js(
            c,
            "return document.querySelectorAll('[data-flag-mark]').length;"
        )
        .await,
        json!(0)
    );
    type_into(c, "Ts", "800").await;
    let notes = text_of(c, "[data-flags]").await;
    assert!(
        notes.contains("T = ") && notes.contains("1000"),
        "no range flag: {notes}"
    );
    assert!(
        js(
            c,
            "return document.querySelectorAll('[data-flag-mark]').length;"
        )
        .await
        .as_u64()
        .unwrap()
            > 0
    );
    type_into(c, "Ts", "65").await;
    assert!(close(si(c, "h").await, want.h));

    // The correlations side by side: one row per forced correlation, each h from the engine,
    // the recommended one marked; the plot draws a curve per correlation.
    let rows = js(c, "return [...document.querySelectorAll('[data-table=correlations] tbody:first-of-type tr')].map(r => [r.dataset.correlation, r.dataset.h, r.classList.contains('recommended')]);").await;
    let rows = rows.as_array().unwrap();
    assert_eq!(rows.len(), want.analysis.forced.len());
    for (row, e) in rows.iter().zip(&want.analysis.forced) {
        assert_eq!(row[0].as_str().unwrap(), e.id);
        assert!(
            close(row[1].as_str().unwrap().parse().unwrap(), e.h),
            "{} h",
            e.id
        );
    }
    assert_eq!(rows[want.analysis.recommended][2], json!(true));
    assert_eq!(
        js(
            c,
            "return document.querySelectorAll('[data-plot=nu-re] [data-curve]').length;"
        )
        .await,
        json!(want.analysis.forced.len() + usize::from(want.analysis.forced.len() > 1))
    );
    // Where a shape has more than one correlation to choose from, the rule's own curve is drawn
    // too (continuous through its handovers).
    if want.analysis.forced.len() > 1 {
        assert_eq!(
            js(c, "return document.querySelectorAll('[data-plot=nu-re] [data-curve=recommended]').length;").await,
            json!(1)
        );
    }
    assert!(
        js(c, "return document.querySelectorAll('[data-plot=nu-re] path.out').length > 0 && document.querySelectorAll('[data-plot=nu-re] path.in').length > 0;").await == json!(true),
        "the plot should show solid and dashed parts"
    );
    assert_eq!(
        js(
            c,
            "return document.querySelector('[data-separation]').dataset.separation;"
        )
        .await,
        json!("80")
    );
    assert!(
        !text_of(c, "[data-cautions]").await.is_empty(),
        "no hot-surface caution at 65 °C"
    );

    // Another shape: a sphere computes as the engine does and has no per-length figure.
    c.find(Locator::Css("[data-shape=sph]"))
        .await
        .unwrap()
        .click()
        .await
        .unwrap();
    let mut sph = s;
    sph.shape = Shape::Sphere;
    assert!(
        close(si(c, "h").await, expect(&sph).h),
        "sphere h differs from the engine"
    );
    assert!(close(si(c, "q_total").await, expect(&sph).q_total));
    assert!(hidden(c, "L").await, "length shown for a sphere");
    assert_eq!(
        js(
            c,
            "return document.querySelectorAll('[data-plot=front]').length;"
        )
        .await,
        json!(0)
    );
    // Still air is a valid input: the natural-convection answer.
    type_into(c, "U", "0").await;
    let mut still = sph;
    still.speed = 0.0;
    let want_still = expect(&still);
    assert!(close(si(c, "h").await, want_still.h));
    assert!(close(
        want_still.h,
        want_still.analysis.natural.as_ref().unwrap().h
    ));
    assert_no_nan_shown(c).await;
    type_into(c, "U", "7").await;
    c.find(Locator::Css("[data-shape=cyl]"))
        .await
        .unwrap()
        .click()
        .await
        .unwrap();
    assert!(close(si(c, "h").await, want.h));

    // The field job: work the surface out from the process inside, through the demo's layer.
    c.find(Locator::Css(
        "[data-toggle=surface-mode] button:nth-child(2)",
    ))
    .await
    .unwrap()
    .click()
    .await
    .unwrap();
    let mut job = s;
    job.surface_mode = scenario::SurfaceMode::Solved;
    let want_job = expect(&job);
    assert!(
        close(si(c, "q_total").await, want_job.q_total),
        "solved loss differs from the engine"
    );
    assert!(close(
        si(c, "surface_temperature").await,
        want_job.surface_temp
    ));
    assert!(hidden(c, "Ts").await && !hidden(c, "Tp").await && !hidden(c, "t1").await);
    assert_eq!(
        js(
            c,
            "return document.querySelectorAll('[data-verdict=saving]').length;"
        )
        .await,
        json!(1)
    );
    for plot in [
        "loss-thickness",
        "surface-thickness",
        "loss-wind",
        "surface-wind",
    ] {
        assert_eq!(
            js(
                c,
                &format!(
                    "return document.querySelectorAll('[data-plot={plot}] [data-point]').length;"
                )
            )
            .await,
            json!(1),
            "plot {plot} missing or without its operating point"
        );
    }
    // Bare: no layer fields, the loss of the bare line.
    c.find(Locator::Css("[data-layers='0']"))
        .await
        .unwrap()
        .click()
        .await
        .unwrap();
    let mut bare = job;
    bare.layer_count = 0;
    assert!(close(si(c, "q_total").await, expect(&bare).q_total));
    assert!(hidden(c, "t1").await);
    // A wall as thick as the pipe: a message, no NaN.
    paste_into(c, "tw", "40").await;
    assert!(!text_of(c, "[data-stale]").await.is_empty());
    assert!(
        text_of(c, "[data-msg-for=tw]").await.contains("thick"),
        "no message beside the wall thickness"
    );
    assert_no_nan_shown(c).await;
    type_into(c, "tw", "3.91").await;
    c.find(Locator::Css("[data-layers='1']"))
        .await
        .unwrap()
        .click()
        .await
        .unwrap();
    // The inside film worked out from a flow of water: the engine's h_i and loss; water frozen
    // inside is a message beside the process temperature.
    pick(c, "[data-choice=inside]", "water").await;
    assert!(hidden(c, "hi").await && !hidden(c, "mf").await && !hidden(c, "qt").await);
    paste_into(c, "mf", "7200").await; // kg/h, the SI default: 2 kg/s
    let mut flowing = job;
    flowing.inside = scenario::InsideFilm::Water;
    flowing.mass_flow = 2.0;
    let want_flow = expect(&flowing);
    let h_inside = si(c, "h_inside").await;
    assert!(
        close(h_inside, want_flow.inside.as_ref().unwrap().h),
        "h_i {h_inside} on the page, {} from the engine",
        want_flow.inside.as_ref().unwrap().h
    );
    assert!(close(si(c, "q_total").await, want_flow.q_total));
    paste_into(c, "Tp", "-5").await;
    assert!(
        text_of(c, "[data-msg-for=Tp]")
            .await
            .contains("process fluid"),
        "no message beside the process temperature"
    );
    assert_no_nan_shown(c).await;
    paste_into(c, "Tp", "70").await;
    paste_into(c, "mf", "0").await;
    pick(c, "[data-choice=inside]", "typed").await;
    assert!(close(si(c, "q_total").await, want_job.q_total));
    c.find(Locator::Css(
        "[data-toggle=surface-mode] button:nth-child(1)",
    ))
    .await
    .unwrap()
    .click()
    .await
    .unwrap();
    assert!(close(si(c, "h").await, want.h));

    // A typical emissivity from the list sets ε and the radiation follows the engine.
    pick(c, "#in-eps-pick", "8").await;
    assert_eq!(
        js(c, "return document.querySelector('#in-e').value;").await,
        json!("0.05")
    );
    let mut shiny = s;
    shiny.emissivity = 0.05;
    assert!(close(si(c, "q_rad").await, expect(&shiny).q_rad_total));
    pick(c, "#in-eps-pick", "0").await;
    assert!(close(si(c, "h").await, want.h));

    // The link carries the scenario: load it fresh and get the same numbers.
    let url = c.current_url().await.unwrap().to_string();
    assert!(url.contains("D=0.0334"), "link not updated: {url}");
    c.goto("about:blank").await.unwrap();
    c.goto(&url).await.unwrap();
    wait_rendered(c).await;
    assert!(
        close(si(c, "h").await, want.h),
        "link did not reproduce the calculation"
    );

    // A hostile link: message, demo shown, nothing injected.
    let hostile = format!(
        "{}#v=1&D=%3Cimg%20src=x%20onerror=alert(1)%3E",
        base.split('#').next().unwrap()
    );
    c.goto("about:blank").await.unwrap();
    c.goto(&hostile).await.unwrap();
    wait_rendered(c).await;
    assert!(
        !text_of(c, "[data-notice=link]").await.is_empty(),
        "no message for a bad link"
    );
    assert_eq!(
        js(c, "return document.querySelectorAll('img').length;").await,
        json!(0)
    );
    assert!(close(si(c, "h").await, expect(&DEMO).h));

    assert_no_foreign_requests(c).await;
}

fn run(f: impl std::future::Future<Output = ()>) {
    tokio::runtime::Builder::new_current_thread()
        .enable_all()
        .build()
        .unwrap()
        .block_on(f);
}

#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn single_file_page_computes_from_file_url() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    run(async {
        let (_driver, c) = browser().await;
        let url = format!("file://{}", dist().join("leeward.html").display());
        exercise(&c, &url).await;
        c.close().await.unwrap();
    });
}

#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn hosted_page_computes_over_loopback_http() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (_server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        exercise(&c, &base).await;
        c.close().await.unwrap();
    });
}

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
fn pdf_pages(pdf: &[u8]) -> usize {
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
            async move {
                c.find(Locator::Css(css))
                    .await
                    .unwrap()
                    .click()
                    .await
                    .unwrap()
            }
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
        let mut csv = leeward::engine::survey::to_csv(&items, leeward::engine::units::System::Us);
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
            shown.contains(&leeward::engine::units::format_sig(tank.q_total, 4)),
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
        assert_eq!(
            js(
                &c,
                "return document.querySelectorAll('[data-saved]').length;"
            )
            .await,
            json!(1000)
        );
        assert!(text_of(&c, "[data-totals]").await.contains("1000 item"));

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

/// Installable offline: after one visit over loopback the service worker has the whole build, so
/// with the server stopped the page reloads and computes; a saved item survives it.
#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn works_offline_after_the_first_visit() {
    require_browser();
    let _one = BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let (server, base) = serve();
    run(async {
        let (_driver, c) = browser().await;
        c.goto(&base).await.unwrap();
        wait_rendered(&c).await;
        let t0 = Instant::now();
        while js(&c, "return document.documentElement.dataset.offline || '';").await
            != json!("ready")
        {
            assert!(
                t0.elapsed() < Duration::from_secs(20),
                "service worker never ready"
            );
            tokio::time::sleep(Duration::from_millis(100)).await;
        }
        let manifest = js(
            &c,
            "return document.querySelector('link[rel=manifest]').href;",
        )
        .await;
        assert!(manifest.as_str().unwrap().ends_with("manifest.webmanifest"));
        c.find(Locator::Css("[data-action=save]"))
            .await
            .unwrap()
            .click()
            .await
            .unwrap();
        drop(server);
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        assert!(
            close(si(&c, "h").await, expect(&DEMO).h),
            "offline reload did not compute"
        );
        assert_eq!(
            js(
                &c,
                "return document.querySelectorAll('[data-saved]').length;"
            )
            .await,
            json!(1)
        );
        js(&c, "localStorage.clear(); return true;").await;
        c.close().await.unwrap();
    });
}

/// Thirty-odd kinds of bad input across the page, the link, the saved-work file, the CSV file and
/// storage: each gets a clear message, no NaN or ∞ is shown, and the saved item made first is
/// intact at the end.
#[test]
#[ignore = "browser: needs dist/, chromedriver and axe-core; ./setup.sh test runs it"]
fn every_kind_of_bad_input_gets_a_message_and_loses_nothing() {
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
        c.find(Locator::Css("[data-action=save]"))
            .await
            .unwrap()
            .click()
            .await
            .unwrap();
        let stored = js(&c, "return localStorage.getItem('leeward.saved');").await;
        let mut classes = 0;

        // 1. Field text, in the diameter field.
        for bad in [
            "",
            "abc",
            "1,2,3",
            "NaN",
            "Infinity",
            "-Infinity",
            "1e999",
            "0",
            "-5",
            "   ",
            "1.2.3",
            "1e",
            "٣",
            "<b>1</b>",
            "12abc",
        ] {
            paste_into(&c, "D", bad).await;
            let msg = text_of(&c, "[data-msg-for=D]").await;
            assert!(!msg.trim().is_empty(), "no message for D = {bad:?}");
            assert!(!msg.contains('<'), "message echoes markup: {msg}");
            assert_no_nan_shown(&c).await;
            classes += 1;
        }
        type_into(&c, "D", "60.3").await;
        // 2. Out-of-range values in other fields (the message names the limit).
        for (key, bad, want) in [
            ("Ta", "-300", "absolute zero"),
            ("rh", "120", "100"),
            ("e", "2", "1"),
            ("ef", "0", "1"),
        ] {
            paste_into(&c, key, bad).await;
            let msg = text_of(&c, &format!("[data-msg-for={key}]")).await;
            assert!(msg.contains(want), "{key} = {bad}: {msg}");
            assert_no_nan_shown(&c).await;
            classes += 1;
        }
        for (key, good) in [("Ta", "5"), ("rh", "70"), ("e", "0.9"), ("ef", "80")] {
            type_into(&c, key, good).await;
        }
        // Glycol above 60 %, and a wall thicker than the pipe's radius (solved surface).
        pick(&c, "#in-fluid", "eg").await;
        paste_into(&c, "xg", "75").await;
        assert!(text_of(&c, "[data-msg-for=xg]").await.contains("60"));
        classes += 1;
        type_into(&c, "xg", "30").await;
        pick(&c, "#in-fluid", "humid").await;
        c.find(Locator::Css(
            "[data-toggle=surface-mode] button:nth-child(2)",
        ))
        .await
        .unwrap()
        .click()
        .await
        .unwrap();
        paste_into(&c, "tw", "40").await;
        assert!(text_of(&c, "[data-msg-for=tw]").await.contains("thick"));
        assert_no_nan_shown(&c).await;
        classes += 1;
        type_into(&c, "tw", "3.91").await;
        c.find(Locator::Css(
            "[data-toggle=surface-mode] button:nth-child(1)",
        ))
        .await
        .unwrap()
        .click()
        .await
        .unwrap();

        // 3. Links.
        let root = base.split('#').next().unwrap().to_string();
        for frag in [
            "v=1&D=%3Cscript%3Ealert(1)%3C/script%3E".to_string(),
            format!("v=1&D={}", "9".repeat(5000)),
            "v=2&D=0.05".to_string(),
            "D=0.05".to_string(),
            "v=1&f=%3Cb%3E".to_string(),
        ] {
            c.goto("about:blank").await.unwrap();
            c.goto(&format!("{root}#{frag}")).await.unwrap();
            wait_rendered(&c).await;
            let note = text_of(&c, "[data-notice=link]").await;
            assert!(
                !note.is_empty() && !note.contains('<'),
                "link {}: {note}",
                &frag[..frag.len().min(40)]
            );
            assert_eq!(
                js(
                    &c,
                    "return document.querySelectorAll('script:not([src]), img').length;"
                )
                .await,
                json!(0)
            );
            classes += 1;
        }

        // 4. Saved-work files and CSV files that cannot be read.
        c.goto("about:blank").await.unwrap();
        c.goto(&root).await.unwrap();
        wait_rendered(&c).await;
        let dir = std::env::temp_dir();
        for (name, text, input, want) in [
            (
                "bad1.json",
                "this is not json",
                "import",
                "Nothing imported",
            ),
            (
                "bad2.json",
                r#"{"format":"someone-else","version":1}"#,
                "import",
                "Nothing imported",
            ),
            (
                "bad3.json",
                r#"{"format":"leeward-saved-work","version":9}"#,
                "import",
                "later version",
            ),
            ("bad4.csv", "", "import-csv", "line 1"),
            (
                "bad5.csv",
                "name,D [furlongs]\nx,3\n",
                "import-csv",
                "unknown unit",
            ),
        ] {
            let path = dir.join(format!("leeward-{}-{name}", std::process::id()));
            std::fs::write(&path, text).unwrap();
            c.find(Locator::Css(&format!("[data-action={input}]")))
                .await
                .unwrap()
                .send_keys(&path.display().to_string())
                .await
                .unwrap();
            let t0 = Instant::now();
            loop {
                let note = text_of(&c, "[data-saved-note]").await;
                if note.contains(want) {
                    break;
                }
                assert!(
                    t0.elapsed() < Duration::from_secs(10),
                    "{name}: no message ({note})"
                );
                tokio::time::sleep(Duration::from_millis(50)).await;
            }
            let _ = std::fs::remove_file(&path);
            classes += 1;
        }
        // The unknown-unit file imported its row without D: take it out again.
        let rows = js(
            &c,
            "return [...document.querySelectorAll('[data-saved]')].map(e => e.dataset.saved);",
        )
        .await;
        if rows.as_array().unwrap().len() > 1 {
            c.find(Locator::Css(
                "[data-saved='x'] .saved-actions button:nth-child(5)",
            ))
            .await
            .unwrap()
            .click()
            .await
            .unwrap();
        }

        // 5. Corrupt storage (restored afterwards).
        js(
            &c,
            "localStorage.setItem('leeward.saved', '[[[['); return true;",
        )
        .await;
        c.refresh().await.unwrap();
        wait_rendered(&c).await;
        assert!(text_of(&c, "[data-saved-note]")
            .await
            .contains("could not be read"));
        classes += 1;
        let args = vec![stored.clone()];
        c.execute(
            "localStorage.setItem('leeward.saved', arguments[0]); return true;",
            args,
        )
        .await
        .unwrap();
        c.refresh().await.unwrap();
        wait_rendered(&c).await;

        assert!(classes >= 30, "only {classes} kinds of bad input tried");
        assert_eq!(
            js(&c, "return localStorage.getItem('leeward.saved');").await,
            stored,
            "saved work changed"
        );
        assert_eq!(
            js(
                &c,
                "return document.querySelectorAll('[data-saved]').length;"
            )
            .await,
            json!(1)
        );
        js(&c, "localStorage.clear(); return true;").await;
        c.close().await.unwrap();
    });
}
