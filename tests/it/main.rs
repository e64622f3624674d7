//! One integration-test binary: engine checks against outside sources, and the browser tests.

mod air_reference;
mod browser;
mod correlation_reference;
mod entry;
mod fixture;
mod fluid_reference;
mod infrared;
mod property_laws;
mod recommendation;
mod round_trip;
mod snapshot;
mod store_fuzz;
mod worked_examples;
