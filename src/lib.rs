//! Leeward: heat transfer from bodies in a cross-flow, computed in the browser.
//!
//! [`engine`] is pure computation and always built; [`ui`] is the Leptos page, behind the
//! default `web` feature.

pub mod engine;

#[cfg(feature = "web")]
pub mod ui;
