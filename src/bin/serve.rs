//! A small static file server for loopback: `leeward-serve DIR [ADDR]` (default 127.0.0.1:8080;
//! port 0 picks a free one). Prints `listening on http://ADDR/` once it accepts connections.
//! GET and HEAD only, no directory listing, nothing outside DIR. Used by `./setup.sh serve` and by
//! the browser tests; plain std, no dependencies.

use std::io::{BufRead, BufReader, Write};
use std::net::{TcpListener, TcpStream};
use std::path::{Component, Path, PathBuf};
use std::sync::Arc;

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
    for stream in listener.incoming().flatten() {
        let dir = Arc::clone(&dir);
        std::thread::spawn(move || {
            let _ = handle(stream, &dir);
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

fn handle(mut stream: TcpStream, root: &Path) -> std::io::Result<()> {
    let mut reader = BufReader::new(stream.try_clone()?);
    let mut line = String::new();
    reader.read_line(&mut line)?;
    // Drain the headers.
    let mut h = String::new();
    while reader.read_line(&mut h)? > 2 {
        h.clear();
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
