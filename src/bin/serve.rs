//! A small static file server for loopback: `leeward-serve DIR [ADDR]` (default 127.0.0.1:8080;
//! port 0 picks a free one). Prints `listening on http://ADDR/` once it accepts connections.
//! GET and HEAD only, no directory listing, nothing outside DIR. Used by `./setup.sh serve` and by
//! the browser tests; plain std, no dependencies.
//!
//! Bounded: a request's head (request line and headers) may be at most [`MAX_HEAD`] bytes, a
//! connection that sends nothing for [`IDLE`] is closed, and at most [`MAX_CONNECTIONS`] are
//! served at once (the rest get 503 at once).

use std::io::{BufRead, BufReader, Read, Write};
use std::net::{TcpListener, TcpStream};
use std::path::{Component, Path, PathBuf};
use std::sync::atomic::{AtomicUsize, Ordering};
use std::sync::Arc;
use std::time::Duration;

/// The most bytes a request's line and headers may take.
const MAX_HEAD: u64 = 8 * 1024;
/// How long a connection may stay silent.
const IDLE: Duration = Duration::from_secs(10);
/// The most connections served at once.
const MAX_CONNECTIONS: usize = 64;
static ACTIVE: AtomicUsize = AtomicUsize::new(0);

fn main() {
    let mut args = std::env::args().skip(1);
    let dir = PathBuf::from(args.next().unwrap_or_else(|| "dist".into()));
    let addr = args.next().unwrap_or_else(|| "127.0.0.1:8080".into());
    let listener = match TcpListener::bind(&addr) {
        Ok(l) => l,
        Err(e) => {
            eprintln!("leeward-serve: cannot listen on {addr}: {e}");
            std::process::exit(1);
        }
    };
    let local = listener.local_addr().expect("bound socket has an address");
    println!("listening on http://{local}/");
    let dir = Arc::new(dir);
    for mut stream in listener.incoming().flatten() {
        if ACTIVE.load(Ordering::SeqCst) >= MAX_CONNECTIONS {
            let _ = stream.write_all(
                b"HTTP/1.1 503 Service Unavailable\r\nContent-Length: 0\r\nConnection: close\r\n\r\n",
            );
            continue;
        }
        ACTIVE.fetch_add(1, Ordering::SeqCst);
        let dir = Arc::clone(&dir);
        std::thread::spawn(move || {
            let _ = handle(stream, &dir, IDLE);
            ACTIVE.fetch_sub(1, Ordering::SeqCst);
        });
    }
}

fn mime(path: &Path) -> &'static str {
    match path.extension().and_then(|e| e.to_str()).unwrap_or("") {
        "html" => "text/html; charset=utf-8",
        "js" => "text/javascript; charset=utf-8",
        "css" => "text/css; charset=utf-8",
        "wasm" => "application/wasm",
        "json" | "webmanifest" => "application/manifest+json",
        "svg" => "image/svg+xml",
        "png" => "image/png",
        _ => "application/octet-stream",
    }
}

/// Map a request path to a file under `root`, refusing anything that climbs out.
fn resolve(root: &Path, target: &str) -> Option<PathBuf> {
    let path = target.split(['?', '#']).next().unwrap_or("/");
    let mut out = root.to_path_buf();
    for c in Path::new(path.trim_start_matches('/')).components() {
        match c {
            Component::Normal(p) => out.push(p),
            Component::CurDir => {}
            _ => return None,
        }
    }
    if out.is_dir() {
        out.push("index.html");
    }
    Some(out)
}

fn handle(mut stream: TcpStream, root: &Path, idle: Duration) -> std::io::Result<()> {
    stream.set_read_timeout(Some(idle))?;
    stream.set_write_timeout(Some(idle))?;
    // The head is read through a window of MAX_HEAD bytes: a longer one ends the window early.
    let mut reader = BufReader::new(stream.try_clone()?.take(MAX_HEAD));
    let mut line = String::new();
    reader.read_line(&mut line)?;
    // Drain the headers, to the blank line.
    let mut h = String::new();
    let mut complete = line.ends_with('\n');
    while complete {
        h.clear();
        if reader.read_line(&mut h)? == 0 || !h.ends_with('\n') {
            complete = false;
        } else if h.len() <= 2 {
            break;
        }
    }
    if !complete {
        let _ = stream.write_all(
            b"HTTP/1.1 431 Request Header Fields Too Large\r\nContent-Length: 0\r\nConnection: close\r\n\r\n",
        );
        return Ok(());
    }
    let mut parts = line.split_whitespace();
    let (method, target) = (parts.next().unwrap_or(""), parts.next().unwrap_or("/"));
    let reply = |stream: &mut TcpStream, status: &str, ctype: &str, body: &[u8], head: bool| {
        let hdr = format!(
            "HTTP/1.1 {status}\r\nContent-Type: {ctype}\r\nContent-Length: {}\r\nCache-Control: no-cache\r\nX-Content-Type-Options: nosniff\r\nConnection: close\r\n\r\n",
            body.len()
        );
        stream.write_all(hdr.as_bytes())?;
        if !head {
            stream.write_all(body)?;
        }
        stream.flush()
    };
    if method != "GET" && method != "HEAD" {
        return reply(
            &mut stream,
            "405 Method Not Allowed",
            "text/plain",
            b"GET only\n",
            false,
        );
    }
    match resolve(root, target).and_then(|p| std::fs::read(&p).ok().map(|b| (p, b))) {
        Some((p, body)) => reply(&mut stream, "200 OK", mime(&p), &body, method == "HEAD"),
        None => reply(
            &mut stream,
            "404 Not Found",
            "text/plain",
            b"not found\n",
            method == "HEAD",
        ),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use std::time::Instant;

    /// Serve one connection on loopback with a short idle time; what the client gets back.
    fn exchange(send: &[u8], idle: Duration) -> (String, Duration) {
        let listener = TcpListener::bind("127.0.0.1:0").unwrap();
        let addr = listener.local_addr().unwrap();
        let server = std::thread::spawn(move || {
            let (s, _) = listener.accept().unwrap();
            let t0 = Instant::now();
            let _ = handle(s, Path::new("/nonexistent-leeward-root"), idle);
            t0.elapsed()
        });
        let mut c = TcpStream::connect(addr).unwrap();
        c.set_read_timeout(Some(Duration::from_secs(5))).unwrap();
        let _ = c.write_all(send);
        let mut got = Vec::new();
        let _ = c.read_to_end(&mut got);
        (
            String::from_utf8_lossy(&got).into_owned(),
            server.join().unwrap(),
        )
    }

    /// Regression: a 50 MB request line with no newline grew memory without bound. The head is
    /// read through an 8 KiB window: 64 KiB of request line gets 431, not a growing buffer.
    #[test]
    fn an_endless_request_line_is_cut_off() {
        let (reply, _) = exchange(&vec![b'a'; 64 * 1024], Duration::from_secs(2));
        assert!(reply.starts_with("HTTP/1.1 431"), "{reply}");
    }

    /// Regression: idle connections were held forever (1,000 held 1,001 threads). A silent one
    /// is closed after the idle time (here 200 ms; 10 s in service).
    #[test]
    fn an_idle_connection_is_closed() {
        let (reply, held) = exchange(b"", Duration::from_millis(200));
        assert!(reply.is_empty(), "{reply}");
        assert!(held < Duration::from_secs(3), "{held:?}");
    }

    #[test]
    fn a_plain_request_is_answered() {
        let (reply, _) = exchange(
            b"GET /x HTTP/1.1\r\nHost: a\r\n\r\n",
            Duration::from_secs(2),
        );
        assert!(reply.starts_with("HTTP/1.1 404"), "{reply}");
    }

    #[test]
    fn paths_cannot_climb_out() {
        let root = Path::new("/srv/x");
        assert_eq!(
            resolve(root, "/a/b.js?x=1"),
            Some(PathBuf::from("/srv/x/a/b.js"))
        );
        assert_eq!(resolve(root, "/../etc/passwd"), None);
        assert_eq!(resolve(root, "/a/../../b"), None);
    }
}
