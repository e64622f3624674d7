//! External-flow correlations: dimensionless functions Nu(Re, Pr, …), each with its published
//! range as data. Properties are the caller's business: each correlation declares the reference
//! temperature its properties must be taken at.

pub mod cylinder;

/// The temperature a correlation's properties are evaluated at.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Reference {
    /// Mean of surface and free stream, (Ts + T∞)/2.
    Film,
    /// The approaching stream, T∞.
    FreeStream,
}

impl Reference {
    pub fn describe(&self) -> &'static str {
        match self {
            Reference::Film => "film temperature (Ts + T∞)/2",
            Reference::FreeStream => "free-stream temperature T∞",
        }
    }
}
