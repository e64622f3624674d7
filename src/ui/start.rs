//! How the page starts: the scenario from the link (or the demo, keeping a refused link's text),
//! and the named marks on the page's performance timeline.

use leptos::prelude::*;

use crate::engine::scenario::{self, Scenario};
use crate::engine::units::System;

/// At most `n` characters of `t`, with an ellipsis when cut.
fn clip_text(t: &str, n: usize) -> String {
    match t.char_indices().nth(n) {
        Some((i, _)) => format!("{}…", &t[..i]),
        None => t.to_string(),
    }
}

/// Read the scenario from the page's URL fragment, or the demo with a message.
pub(super) fn initial() -> (Scenario, System, Option<String>) {
    let hash = window().location().hash().unwrap_or_default();
    if hash.len() <= 1 {
        return (scenario::DEMO, System::Si, None);
    }
    match scenario::from_fragment(&hash) {
        Ok((s, sys)) => (s, sys, None),
        Err(e) => (
            scenario::DEMO,
            System::Si,
            Some(format!(
                "This link could not be read ({e}). The demo is shown instead; the link stays in the address bar until you change an input. As given: {}",
                clip_text(hash.trim_start_matches('#'), 300)
            )),
        ),
    }
}

/// A named point on the page's performance timeline (the browser harness and tests read them).
pub(crate) fn mark(name: &str) {
    if let Some(p) = window().performance() {
        let _ = p.mark(name);
    }
}
