//! One integration-test binary: engine checks against outside sources, and the browser tests.

mod air_reference;
mod browser;
mod fixture;
mod fluid_reference;
