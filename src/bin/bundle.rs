//! Build step after `trunk build`: `leeward-bundle DIST`.
//!
//! 1. Moves Trunk's inline loader script out of `DIST/index.html` into `DIST/boot-<hash>.js`, so
//!    the hosted page runs under a Content-Security-Policy with `script-src 'self'` (no inline
//!    script at all).
//! 2. Writes `DIST/leeward.html`: one self-contained file (CSS, JS glue and the wasm as base64
//!    inlined) that runs opened from disk (`file://`), where browsers refuse module scripts and
//!    fetches. Its CSP allows exactly its own inline script and style by SHA-256 hash, WebAssembly
//!    compilation, and no network connection of any kind.
//!
//! SHA-256 and base64 come from the `sha2` and `base64` crates (native only: the page's wasm
//! carries neither); the standards' vectors below check how they are called.

use std::fs;
use std::path::{Path, PathBuf};

fn main() {
    let dist = std::env::args().nth(1).unwrap_or_else(|| "dist".into());
    if let Err(e) = run(Path::new(&dist)) {
        eprintln!("leeward-bundle: {e}");
        std::process::exit(1);
    }
}

fn run(dist: &Path) -> Result<(), String> {
    let index_path = dist.join("index.html");
    let index = read(&index_path)?;
    let (js_name, wasm_name) = asset_names(&index)?;
    let css_name = find_attr_value(&index, "rel=\"stylesheet\"", "href")
        .ok_or("no stylesheet link in index.html")?;

    // 1. The hosted page: loader out of line, with the service-worker registration appended.
    let hosted = externalise_loader(&index)?;
    let mut boot = None;
    let hosted = hosted
        .map(|(html, boot_name, boot_js)| -> Result<String, String> {
            let js = format!("{boot_js}{REGISTER_JS}");
            let name = format!("boot-{}.js", &hex(&sha256(js.as_bytes()))[..16]);
            write(&dist.join(&name), &js)?;
            boot = Some(name.clone());
            Ok(html.replace(&boot_name, &name))
        })
        .transpose()?;

    // 2. The single file (no service worker or manifest: browsers allow neither on file://).
    let glue = read(&dist.join(strip_dot(&js_name)))?;
    let wasm = fs::read(dist.join(strip_dot(&wasm_name)))
        .map_err(|e| format!("reading {wasm_name}: {e}"))?;
    let css = read(&dist.join(strip_dot(&css_name)))?;
    let single = single_file(hosted.as_deref().unwrap_or(&index), &glue, &wasm, &css)?;
    write(&dist.join("leeward.html"), &single)?;

    // 3. Installable offline: manifest, icon, and a service worker that precaches every file of
    //    this build under a cache named by the build's hash.
    if let Some(html) = &hosted {
        write(&dist.join("icon.svg"), ICON_SVG)?;
        write(&dist.join("manifest.webmanifest"), MANIFEST)?;
        let mut files = vec![
            "./".to_string(),
            "./index.html".into(),
            "./manifest.webmanifest".into(),
            "./icon.svg".into(),
            format!("./{}", strip_dot(&js_name)),
            format!("./{}", strip_dot(&wasm_name)),
            format!("./{}", strip_dot(&css_name)),
        ];
        files.extend(boot.iter().map(|b| format!("./{b}")));
        let version = &hex(&sha256(files.join(",").as_bytes()))[..16];
        let list = files
            .iter()
            .map(|f| format!("{f:?}"))
            .collect::<Vec<_>>()
            .join(",");
        write(
            &dist.join("sw.js"),
            &SW_JS
                .replace("__VERSION__", version)
                .replace("__FILES__", &list),
        )?;
        let with_manifest = html.replace(
            "</head>",
            "<link rel=\"manifest\" href=\"./manifest.webmanifest\"><link rel=\"icon\" href=\"./icon.svg\"></head>",
        );
        write(&index_path, &with_manifest)?;
    }
    println!(
        "leeward-bundle: {} ({} bytes), index.html loader in its own file",
        dist.join("leeward.html").display(),
        single.len()
    );
    Ok(())
}

/// Registers the service worker on http(s) and offers an update when a new build is waiting; the
/// update is explicit (a button) and saved work, in localStorage, is never touched by it.
const REGISTER_JS: &str = r#"
if ('serviceWorker' in navigator && location.protocol.startsWith('http')) {
  let updating = false;
  const offer = (w) => {
    if (document.querySelector('[data-update]')) return;
    const b = document.createElement('button');
    b.type = 'button';
    b.className = 'update-ready';
    b.dataset.update = '';
    b.textContent = 'A new version of Leeward is ready: reload to use it (saved work is kept)';
    b.onclick = () => { updating = true; w.postMessage('activate'); };
    document.body.prepend(b);
  };
  navigator.serviceWorker.addEventListener('controllerchange', () => { if (updating) location.reload(); });
  navigator.serviceWorker.register('./sw.js').then((reg) => {
    if (reg.waiting && navigator.serviceWorker.controller) offer(reg.waiting);
    reg.addEventListener('updatefound', () => {
      const w = reg.installing;
      if (w) w.addEventListener('statechange', () => {
        if (w.state === 'installed' && navigator.serviceWorker.controller) offer(w);
      });
    });
    return navigator.serviceWorker.ready;
  }).then(() => { document.documentElement.dataset.offline = 'ready'; })
    .catch(() => { document.documentElement.dataset.offline = 'unavailable'; });
}
"#;

/// The service worker: precache this build, serve same-origin GETs cache-first, drop older
/// builds' caches when activated; a new build waits until the page asks it to take over.
const SW_JS: &str = r#"const VERSION = 'leeward-__VERSION__';
const FILES = [__FILES__];
self.addEventListener('install', (e) => {
  e.waitUntil(caches.open(VERSION).then((c) => c.addAll(FILES)).then(() => {
    if (!self.registration.active) return self.skipWaiting();
  }));
});
self.addEventListener('activate', (e) => {
  e.waitUntil(caches.keys()
    .then((ks) => Promise.all(ks.filter((k) => k.startsWith('leeward-') && k !== VERSION).map((k) => caches.delete(k))))
    .then(() => self.clients.claim()));
});
self.addEventListener('message', (e) => { if (e.data === 'activate') self.skipWaiting(); });
self.addEventListener('fetch', (e) => {
  const url = new URL(e.request.url);
  if (e.request.method !== 'GET' || url.origin !== self.location.origin) return;
  e.respondWith(caches.open(VERSION).then((c) => c.match(e.request, { ignoreSearch: true })
    .then((r) => r || (e.request.mode === 'navigate' ? c.match('./index.html') : undefined))
    .then((r) => r || fetch(e.request))));
});
"#;

const MANIFEST: &str = r##"{
  "name": "Leeward — heat loss in a cross-flow",
  "short_name": "Leeward",
  "start_url": "./",
  "scope": "./",
  "display": "standalone",
  "background_color": "#ffffff",
  "theme_color": "#004f9e",
  "icons": [{ "src": "icon.svg", "sizes": "any", "type": "image/svg+xml", "purpose": "any" }]
}
"##;

const ICON_SVG: &str = r##"<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 64 64"><rect width="64" height="64" rx="12" fill="#004f9e"/><g stroke="#fff" stroke-width="4" stroke-linecap="round"><line x1="8" y1="20" x2="22" y2="20"/><line x1="8" y1="32" x2="22" y2="32"/><line x1="8" y1="44" x2="22" y2="44"/></g><circle cx="40" cy="32" r="14" fill="#fff"/></svg>
"##;

fn read(p: &Path) -> Result<String, String> {
    fs::read_to_string(p).map_err(|e| format!("reading {}: {e}", p.display()))
}

fn write(p: &PathBuf, s: &str) -> Result<(), String> {
    fs::write(p, s).map_err(|e| format!("writing {}: {e}", p.display()))
}

fn strip_dot(name: &str) -> &str {
    name.trim_start_matches("./").trim_start_matches('/')
}

/// The glue JS and wasm file names Trunk linked (from the modulepreload / preload links).
fn asset_names(index: &str) -> Result<(String, String), String> {
    let js = find_attr_value(index, "rel=\"modulepreload\"", "href")
        .ok_or("no modulepreload link for the JS glue in index.html")?;
    let wasm = find_attr_value(index, "type=\"application/wasm\"", "href")
        .ok_or("no preload link for the wasm in index.html")?;
    Ok((js, wasm))
}

/// The value of `attr` in the first tag that contains `marker`.
fn find_attr_value(html: &str, marker: &str, attr: &str) -> Option<String> {
    let at = html.find(marker)?;
    let start = html[..at].rfind('<')?;
    let end = at + html[at..].find('>')?;
    let tag = &html[start..end];
    let key = format!("{attr}=\"");
    let v0 = tag.find(&key)? + key.len();
    let v1 = v0 + tag[v0..].find('"')?;
    Some(tag[v0..v1].to_string())
}

/// The first inline `<script type="module">…</script>` (no src): (start, end, body).
fn inline_module(html: &str) -> Option<(usize, usize, &str)> {
    let mut from = 0;
    while let Some(rel) = html[from..].find("<script") {
        let start = from + rel;
        let open_end = start + html[start..].find('>')?;
        let open = &html[start..open_end];
        let close = open_end + html[open_end..].find("</script>")?;
        if open.contains("type=\"module\"") && !open.contains("src=") {
            return Some((start, close + "</script>".len(), &html[open_end + 1..close]));
        }
        from = close;
    }
    None
}

/// Move the inline loader into `boot-<hash>.js`. `None` when there is none (already moved).
fn externalise_loader(index: &str) -> Result<Option<(String, String, String)>, String> {
    let Some((a, b, body)) = inline_module(index) else {
        return Ok(None);
    };
    let name = format!("boot-{}.js", &hex(&sha256(body.as_bytes()))[..16]);
    let tag = format!("<script type=\"module\" src=\"./{name}\"></script>");
    let html = format!("{}{}{}", &index[..a], tag, &index[b..]);
    Ok(Some((html, name, body.trim().to_string() + "\n")))
}

/// Remove every tag (and for scripts, its element) matching `pred` on its opening text.
fn remove_tags(html: &str, tag: &str, pred: impl Fn(&str) -> bool) -> String {
    let mut out = String::with_capacity(html.len());
    let mut rest = html;
    let open = format!("<{tag}");
    while let Some(i) = rest.find(&open) {
        let Some(j) = rest[i..].find('>') else { break };
        let mut end = i + j + 1;
        if pred(&rest[i..end]) {
            if tag == "script" {
                if let Some(k) = rest[end..].find("</script>") {
                    end += k + "</script>".len();
                }
            }
            out.push_str(&rest[..i]);
        } else {
            out.push_str(&rest[..end]);
        }
        rest = &rest[end..];
    }
    out.push_str(rest);
    out
}

/// wasm-bindgen `--target web` glue as a classic part of one inline module: drop its exports.
fn glue_inline(glue: &str) -> String {
    let mut out = String::with_capacity(glue.len());
    for line in glue.lines() {
        let t = line.trim_start();
        if t.starts_with("export {") || t.starts_with("export default") {
            continue;
        }
        if let Some(rest) = t.strip_prefix("export ") {
            out.push_str(rest);
        } else {
            out.push_str(line);
        }
        out.push('\n');
    }
    out
}

/// The single file's wasm, from its base64 text to bytes: the browser's own decoder where it has one
/// (`Uint8Array.fromBase64`), else one plain loop over `atob`'s characters. (`Uint8Array.from` with a
/// mapping function took 160 ms for this wasm in headless Chromium 156, the loop 7 ms, the native
/// decoder 1 ms: most of the single file's cold start.)
const DECODE: &str =
    "const leewardWasmBytes = Uint8Array.fromBase64 ? Uint8Array.fromBase64(leewardWasmText) : \
(() => { const s = atob(leewardWasmText), b = new Uint8Array(s.length); \
for (let i = 0; i < s.length; i++) b[i] = s.charCodeAt(i); return b; })();";

fn single_file(index: &str, glue: &str, wasm: &[u8], css: &str) -> Result<String, String> {
    let mut html = remove_tags(index, "link", |t| {
        t.contains("modulepreload") || t.contains("rel=\"preload\"") || t.contains("stylesheet")
    });
    html = remove_tags(&html, "script", |t| t.contains("type=\"module\""));
    html = remove_tags(&html, "meta", |t| t.contains("Content-Security-Policy"));

    let script = format!(
        "{}\nconst leewardWasmText = \"{}\";\n\
         {DECODE}\n\
         await __wbg_init({{ module_or_path: leewardWasmBytes }});\n",
        glue_inline(glue),
        base64(wasm)
    );
    let csp = format!(
        "default-src 'none'; script-src 'sha256-{}' 'wasm-unsafe-eval'; style-src 'sha256-{}'; \
         img-src data:; connect-src 'none'; base-uri 'none'; form-action 'none'",
        base64(&sha256(script.as_bytes())),
        base64(&sha256(css.as_bytes()))
    );
    let head = format!(
        "<meta http-equiv=\"Content-Security-Policy\" content=\"{csp}\">\n<style>{css}</style>\n"
    );
    let at = html
        .find("<meta charset")
        .ok_or("index.html has no <meta charset>")?;
    let at = at + html[at..].find('>').ok_or("unclosed meta")? + 1;
    html.insert_str(at, &format!("\n{head}"));
    let body_end = html.rfind("</body>").ok_or("index.html has no </body>")?;
    html.insert_str(
        body_end,
        &format!("<script type=\"module\">{script}</script>\n"),
    );
    Ok(html)
}

// ---- SHA-256 (FIPS 180-4) and base64 (RFC 4648), from the sha2 and base64 crates -----------

fn sha256(data: &[u8]) -> [u8; 32] {
    use sha2::Digest;
    sha2::Sha256::digest(data).into()
}

fn base64(data: &[u8]) -> String {
    use base64::Engine;
    base64::engine::general_purpose::STANDARD.encode(data)
}

fn hex(b: &[u8]) -> String {
    b.iter().map(|x| format!("{x:02x}")).collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn sha256_fips_180_2_vectors() {
        // FIPS 180-2 Appendix B.1 and B.2.
        assert_eq!(
            hex(&sha256(b"abc")),
            "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"
        );
        assert_eq!(
            hex(&sha256(
                b"abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq"
            )),
            "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1"
        );
        assert_eq!(
            hex(&sha256(b"")),
            "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855"
        );
    }

    #[test]
    fn base64_rfc_4648_vectors() {
        // RFC 4648 section 10.
        for (i, o) in [
            ("", ""),
            ("f", "Zg=="),
            ("fo", "Zm8="),
            ("foo", "Zm9v"),
            ("foob", "Zm9vYg=="),
            ("fooba", "Zm9vYmE="),
            ("foobar", "Zm9vYmFy"),
        ] {
            assert_eq!(base64(i.as_bytes()), o);
        }
    }

    #[test]
    fn glue_loses_its_exports_only() {
        let g = "export function f() {}\nexport class C {}\nfunction g() {}\nexport { initSync, __wbg_init as default };\n";
        assert_eq!(
            glue_inline(g),
            "function f() {}\nclass C {}\nfunction g() {}\n"
        );
    }

    /// The decoder the single file runs, run by Node (installed with the tools: binaryen comes from
    /// npm) on every byte value, once through the plain loop (Node 20 has no `Uint8Array.fromBase64`)
    /// and once through a stand-in for the browser's own decoder; Node's `Buffer` is the reference.
    #[test]
    fn the_single_files_decoder_gives_the_wasm_bytes_back() {
        let bytes: Vec<u8> = (0..=255u8)
            .chain((0..700).map(|i| (i * 37 % 256) as u8))
            .collect();
        let text = base64(&bytes);
        let check = "const want = Buffer.from(leewardWasmText, 'base64'); \
            if (leewardWasmBytes.length !== want.length || !leewardWasmBytes.every((b, i) => b === want[i])) \
            { console.log('different'); process.exit(1); } console.log(leewardWasmBytes.length);";
        for (name, setup) in [
            ("the loop", "delete Uint8Array.fromBase64;"),
            (
                "the browser's decoder",
                "Uint8Array.fromBase64 = (t) => new Uint8Array(Buffer.from(t, 'base64'));",
            ),
        ] {
            let js = format!("{setup}\nconst leewardWasmText = \"{text}\";\n{DECODE}\n{check}");
            let out = std::process::Command::new("node")
                .args(["-e", &js])
                .output()
                .expect("node (installed by setup.sh with npm) runs");
            assert!(
                out.status.success(),
                "{name}: {}",
                String::from_utf8_lossy(&out.stdout)
            );
            assert_eq!(
                String::from_utf8_lossy(&out.stdout).trim(),
                bytes.len().to_string(),
                "{name}"
            );
        }
    }

    #[test]
    fn loader_moves_out_of_line() {
        let html = "<head><script type=\"module\">import x from './a.js';</script></head>";
        let (out, name, js) = externalise_loader(html).unwrap().unwrap();
        assert!(out.contains(&format!("src=\"./{name}\"")));
        assert!(!out.contains("import x"));
        assert_eq!(js, "import x from './a.js';\n");
        assert!(externalise_loader(&out).unwrap().is_none());
    }
}
