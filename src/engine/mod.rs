//! The engine: pure computation. Properties, correlations, solvers, units and validity checks.
//!
//! Nothing in here touches the browser, the network, files or the clock: it builds and tests with
//! `--no-default-features`, so the compiler keeps the boundary. Everything is SI `f64` inside;
//! only [`units`] converts.

pub mod atmosphere;
pub mod body;
pub mod catalogue;
pub mod chart;
pub mod correlations;
pub mod error;
pub mod heatloss;
pub mod inspect;
pub mod job;
pub mod layers;
pub mod outdoors;
pub mod pick;
pub mod props;
pub mod scenario;
pub mod shape;
pub mod solve;
pub mod store;
pub mod survey;
pub mod units;
pub mod validity;
pub mod value;

pub use error::EngineError;
pub use validity::{Flag, Flagged};
