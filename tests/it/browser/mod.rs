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
        // The result, and the saved work read (it is read just after the first result).
        let v = js(c, "const e = document.querySelector('[data-quantity=h]'); const p = document.querySelector('[data-panel=saved]'); const r = !p || p.getAttribute('data-saved-ready') === 'true'; return e && r ? e.getAttribute('data-si') : null;").await;
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

/// Tap an element as a person would: brought to the middle of the window first (a person scrolls
/// it clear of the answer bar stuck to the top; WebDriver would click it where it lies, under the
/// bar), then a real click.
async fn tap(c: &Client, css: &str) {
    let el = c.find(Locator::Css(css)).await.unwrap();
    c.execute(
        // A button in a closed menu: the menu is opened first, as a person taps it open.
        "const d = arguments[0].closest('details'); if (d && !d.open) d.open = true; arguments[0].scrollIntoView({block: 'center'}); return true;",
        vec![serde_json::to_value(&el).unwrap()],
    )
    .await
    .unwrap();
    el.click().await.unwrap();
}

/// Open every fold (the working, the correlations, the Nu–Re plots), as a person taps each one:
/// their content is built only while open.
async fn open_folds(c: &Client) {
    js(c, "document.querySelectorAll('details.fold, details.working').forEach(d => d.open = true); return true;").await;
    let t0 = Instant::now();
    while js(
        c,
        "return document.querySelectorAll('[data-table=correlations]').length;",
    )
    .await
        == json!(0)
    {
        assert!(
            t0.elapsed() < Duration::from_secs(5),
            "the folds did not open"
        );
        tokio::time::sleep(Duration::from_millis(20)).await;
    }
}

/// Replace a field's text as a user would: clear it, then type key by key.
async fn type_into(c: &Client, key: &str, text: &str) {
    let el = c.find(Locator::Css(&format!("#in-{key}"))).await.unwrap();
    c.execute(
        "arguments[0].scrollIntoView({block: 'center'}); return true;",
        vec![serde_json::to_value(&el).unwrap()],
    )
    .await
    .unwrap();
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

fn run(f: impl std::future::Future<Output = ()>) {
    tokio::runtime::Builder::new_current_thread()
        .enable_all()
        .build()
        .unwrap()
        .block_on(f);
}

mod bad_input;
mod defects;
mod field;
mod forms;
mod inspection;
mod made;
mod saved;
mod sun;
