//! Root finding: a bracketed solver that always converges or says why.
//!
//! The method is regula falsi with the Anderson–Björck modification (N. Anderson and Å. Björck,
//! "A new high order method of regula falsi type for computing a root of an equation", BIT 13
//! (1973) 253–264), falling back to bisection whenever two steps have not halved the bracket. The bracket always holds a sign
//! change, so the solver cannot leave it and stops in a bounded number of steps.

/// Why a root could not be found.
#[derive(Debug, Clone, PartialEq)]
pub enum SolveError {
    /// f has the same sign at both ends: no root is bracketed.
    NotBracketed { fa: f64, fb: f64 },
    /// f returned a non-finite value at x.
    NonFinite { x: f64 },
}

/// A root with the evidence: iterations used and the residual there.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Root {
    pub x: f64,
    pub residual: f64,
    pub iterations: u32,
}

/// Most steps the solver takes (bisection alone halves a bracket 200 times: far below f64
/// resolution for any bracket).
pub const MAX_ITER: u32 = 200;

/// Find x in [a, b] with f(x) = 0. Stops when |f(x)| ≤ `ftol`, or when the bracket is as narrow as
/// f64 allows (then the end with the smaller |f| is returned).
pub fn bracketed(f: impl FnMut(f64) -> f64, a: f64, b: f64, ftol: f64) -> Result<Root, SolveError> {
    bracketed_until(f, a, b, |_, fx| fx.abs() <= ftol)
}

/// As [`bracketed`], stopping when |f(x)| ≤ `rtol`·|x| (a residual relative to the root itself).
pub fn bracketed_rel(
    f: impl FnMut(f64) -> f64,
    a: f64,
    b: f64,
    rtol: f64,
) -> Result<Root, SolveError> {
    bracketed_until(f, a, b, |x, fx| fx.abs() <= rtol * x.abs())
}

/// As [`bracketed`], for a caller that already has f at either end (`Some(f(a))`, `Some(f(b))`):
/// those values are used, not evaluated again.
pub fn bracketed_known_ends(
    f: impl FnMut(f64) -> f64,
    (a, fa): (f64, Option<f64>),
    (b, fb): (f64, Option<f64>),
    ftol: f64,
) -> Result<Root, SolveError> {
    bracketed_known(f, (a, fa), (b, fb), |_, fx| fx.abs() <= ftol)
}

/// As [`bracketed_rel`], for a caller that already has f at either end (`Some(f(a))`,
/// `Some(f(b))`): those values are used, not evaluated again.
pub fn bracketed_rel_known(
    f: impl FnMut(f64) -> f64,
    (a, fa): (f64, Option<f64>),
    (b, fb): (f64, Option<f64>),
    rtol: f64,
) -> Result<Root, SolveError> {
    bracketed_known(f, (a, fa), (b, fb), |x, fx| fx.abs() <= rtol * x.abs())
}

fn bracketed_until(
    f: impl FnMut(f64) -> f64,
    a: f64,
    b: f64,
    done: impl Fn(f64, f64) -> bool,
) -> Result<Root, SolveError> {
    bracketed_known(f, (a, None), (b, None), done)
}

fn bracketed_known(
    mut f: impl FnMut(f64) -> f64,
    (a, fa): (f64, Option<f64>),
    (b, fb): (f64, Option<f64>),
    done: impl Fn(f64, f64) -> bool,
) -> Result<Root, SolveError> {
    let ((mut a, fa), (mut b, fb)) = if a <= b {
        ((a, fa), (b, fb))
    } else {
        ((b, fb), (a, fa))
    };
    let mut fa = fa.unwrap_or_else(|| f(a));
    let mut fb = fb.unwrap_or_else(|| f(b));
    for (x, v) in [(a, fa), (b, fb)] {
        if !v.is_finite() {
            return Err(SolveError::NonFinite { x });
        }
    }
    let mut iterations = 0;
    if done(a, fa) {
        return Ok(Root {
            x: a,
            residual: fa,
            iterations,
        });
    }
    if done(b, fb) {
        return Ok(Root {
            x: b,
            residual: fb,
            iterations,
        });
    }
    if fa.signum() == fb.signum() {
        return Err(SolveError::NotBracketed { fa, fb });
    }
    let mut side = 0i8;
    let mut width = b - a;
    while iterations < MAX_ITER {
        iterations += 1;
        let mut x = (a * fb - b * fa) / (fb - fa);
        // Every other step must halve the bracket; otherwise bisect.
        if !(x > a && x < b) || (iterations % 2 == 0 && (b - a) > 0.5 * width) {
            x = 0.5 * (a + b);
        }
        if iterations % 2 == 0 {
            width = b - a;
        }
        let fx = f(x);
        if !fx.is_finite() {
            return Err(SolveError::NonFinite { x });
        }
        if done(x, fx) || x <= a || x >= b {
            return Ok(Root {
                x,
                residual: fx,
                iterations,
            });
        }
        if fx.signum() == fb.signum() {
            // x replaces b; if b was replaced last time too, damp fa (Anderson–Björck).
            if side == 1 {
                let m = 1.0 - fx / fb;
                fa *= if m > 0.0 { m } else { 0.5 };
            }
            b = x;
            fb = fx;
            side = 1;
        } else {
            if side == -1 {
                let m = 1.0 - fx / fa;
                fb *= if m > 0.0 { m } else { 0.5 };
            }
            a = x;
            fa = fx;
            side = -1;
        }
        if b - a <= 4.0 * f64::EPSILON * a.abs().max(b.abs()).max(f64::MIN_POSITIVE) {
            break;
        }
    }
    let (x, residual) = if fa.abs() < fb.abs() {
        (a, fa)
    } else {
        (b, fb)
    };
    Ok(Root {
        x,
        residual,
        iterations,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn finds_simple_roots_quickly() {
        let r = bracketed(|x| x * x - 2.0, 0.0, 2.0, 1e-15).unwrap();
        assert!((r.x - 2f64.sqrt()).abs() < 1e-15);
        assert!(r.iterations < 20, "{}", r.iterations);
        let r = bracketed(|x| x.exp() - 10.0, -5.0, 5.0, 1e-13).unwrap();
        assert!((r.x - 10f64.ln()).abs() < 1e-12);
    }

    #[test]
    fn hard_functions_stay_bounded() {
        // Very flat then steep: pure regula falsi stalls here, the safeguard does not.
        let r = bracketed(|x| x.powi(9) - 1e-9, 0.0, 10.0, 0.0).unwrap();
        assert!((r.x - 0.1).abs() < 1e-12, "{}", r.x);
        assert!(r.iterations <= MAX_ITER);
        // A step function: converges to the jump.
        let r = bracketed(|x| if x < 0.3 { -1.0 } else { 1.0 }, 0.0, 1.0, 0.0).unwrap();
        assert!((r.x - 0.3).abs() < 1e-12);
    }

    #[test]
    fn known_ends_are_not_evaluated_again() {
        let mut calls = Vec::new();
        let r = bracketed_rel_known(
            |x| {
                calls.push(x);
                x * x - 2.0
            },
            (2.0, Some(2.0)),
            (0.0, Some(-2.0)),
            1e-15,
        )
        .unwrap();
        assert!((r.x - 2f64.sqrt()).abs() < 1e-15);
        assert!(!calls.contains(&0.0) && !calls.contains(&2.0), "{calls:?}");
        // The same root as when the solver evaluates the ends itself.
        let plain = bracketed_rel(|x| x * x - 2.0, 0.0, 2.0, 1e-15).unwrap();
        assert_eq!(plain, r);
    }

    #[test]
    fn says_why_when_it_cannot() {
        assert!(matches!(
            bracketed(|x| x * x + 1.0, -1.0, 1.0, 1e-12),
            Err(SolveError::NotBracketed { .. })
        ));
        assert!(matches!(
            bracketed(|x| if x > 0.5 { f64::NAN } else { -1.0 }, 0.0, 1.0, 1e-12),
            Err(SolveError::NonFinite { .. })
        ));
    }
}
