//! Conduction through a pipe or vessel wall and its insulation layers, with conductivity that may
//! vary with temperature.
//!
//! Each layer's conductivity is k(θ) = a + b·θ + c·θ², θ the temperature in °C — the form insulation
//! data sheets give against mean temperature. Conduction through a layer with k(T) is exact through
//! the Kirchhoff transform (the integral-mean conductivity, as in ASTM C680): with
//! K(T) = ∫k dθ, the heat flow is q = S·[K(T₁) − K(T₂)], S = 2π/ln(r₂/r₁) per metre for a cylinder
//! and 4π/(1/r₁ − 1/r₂) for a sphere.

use crate::engine::error::EngineError;
use std::f64::consts::PI;

/// Round (per metre) or spherical (whole body) conduction.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Geometry {
    Cylinder,
    Sphere,
}

impl Geometry {
    /// Conduction shape factor between radii r1 < r2: m for a cylinder (per metre), m for a sphere.
    pub fn shape_factor(&self, r1: f64, r2: f64) -> f64 {
        match self {
            Geometry::Cylinder => 2.0 * PI / (r2 / r1).ln(),
            Geometry::Sphere => 4.0 * PI / (1.0 / r1 - 1.0 / r2),
        }
    }
    /// Area at radius r: per metre for a cylinder (m), whole for a sphere (m²).
    pub fn area(&self, r: f64) -> f64 {
        match self {
            Geometry::Cylinder => 2.0 * PI * r,
            Geometry::Sphere => 4.0 * PI * r * r,
        }
    }
}

/// k(θ) = a + b·θ + c·θ² in W/(m·K), θ in °C.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Conductivity {
    pub a: f64,
    pub b: f64,
    pub c: f64,
}

impl Conductivity {
    pub const fn constant(k: f64) -> Self {
        Conductivity {
            a: k,
            b: 0.0,
            c: 0.0,
        }
    }
    pub fn at(&self, t: f64) -> f64 {
        let th = t - 273.15;
        self.a + th * (self.b + th * self.c)
    }
    /// K(T) = ∫₀^θ k dθ, W/m.
    pub fn integral(&self, t: f64) -> f64 {
        let th = t - 273.15;
        th * (self.a + th * (self.b / 2.0 + th * self.c / 3.0))
    }
    /// Integral-mean conductivity between two temperatures.
    pub fn mean(&self, t1: f64, t2: f64) -> f64 {
        if (t1 - t2).abs() < 1e-9 {
            self.at(0.5 * (t1 + t2))
        } else {
            (self.integral(t1) - self.integral(t2)) / (t1 - t2)
        }
    }
    /// Lowest k over [t1, t2] (a quadratic: ends and vertex).
    pub fn min_over(&self, t1: f64, t2: f64) -> f64 {
        let (lo, hi) = (t1.min(t2), t1.max(t2));
        let mut m = self.at(lo).min(self.at(hi));
        if self.c != 0.0 {
            let tv = 273.15 - self.b / (2.0 * self.c);
            if tv > lo && tv < hi {
                m = m.min(self.at(tv));
            }
        }
        m
    }
}

/// One layer: a pipe wall or an insulation layer.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Layer {
    pub thickness: f64,
    pub k: Conductivity,
}

/// The construction from the inside out: inner radius, then layers.
#[derive(Debug, Clone, PartialEq)]
pub struct Construction {
    pub geometry: Geometry,
    /// Inside radius of the first layer (the bore), m.
    pub r_in: f64,
    pub layers: Vec<Layer>,
}

impl Conductivity {
    /// k(θ) through a data sheet's points: `temps` are the mean temperatures A, B and C (K),
    /// `ks` the conductivities there (W/(m·K)); a third point is used when its k is positive and
    /// the three temperatures are distinct (the quadratic through all three, by Newton's divided
    /// differences), otherwise the line through A and B (constant when A = B).
    pub fn through_points(temps: [f64; 3], ks: [f64; 3]) -> Conductivity {
        let (x0, x1, x2) = (temps[0] - 273.15, temps[1] - 273.15, temps[2] - 273.15);
        let (k0, k1, k2) = (ks[0], ks[1], ks[2]);
        let distinct = (x1 - x0).abs() > 1e-9 && (x2 - x0).abs() > 1e-9 && (x2 - x1).abs() > 1e-9;
        if k2 > 0.0 && distinct {
            // Newton's divided differences, expanded to a + b·θ + c·θ².
            let d01 = (k1 - k0) / (x1 - x0);
            let d02 = (k2 - k0) / (x2 - x0);
            let c = (d02 - d01) / (x2 - x1);
            let b = d01 - c * (x0 + x1);
            return Conductivity {
                a: k0 - b * x0 - c * x0 * x0,
                b,
                c,
            };
        }
        let slope = if (x1 - x0).abs() > 1e-9 {
            (k1 - k0) / (x1 - x0)
        } else {
            0.0
        };
        Conductivity {
            a: k0 - slope * x0,
            b: slope,
            c: 0.0,
        }
    }
}

/// Heat capacity per metre of a round wall of outside diameter `d` and thickness `t` (m), of a
/// material with density `rho` (kg/m³) and specific heat `cp` (J/(kg·K)): ρ·cp·π(r₁² − r₀²),
/// J/(m·K).
pub fn wall_heat_capacity(d: f64, t: f64, rho: f64, cp: f64) -> f64 {
    let r1 = d / 2.0;
    let r0 = r1 - t;
    rho * cp * std::f64::consts::PI * (r1 * r1 - r0 * r0)
}

impl Construction {
    /// Outer radius of every layer, in order.
    pub fn radii(&self) -> Vec<f64> {
        let mut r = self.r_in;
        self.layers
            .iter()
            .map(|l| {
                r += l.thickness;
                r
            })
            .collect()
    }
    pub fn r_out(&self) -> f64 {
        self.r_in + self.layers.iter().map(|l| l.thickness).sum::<f64>()
    }

    /// Check the construction can be evaluated at all over [t_lo, t_hi]: positive sizes and
    /// conductivity above zero throughout.
    pub fn check(&self, t_lo: f64, t_hi: f64) -> Result<(), EngineError> {
        if self.r_in.is_nan() || self.r_in <= 0.0 {
            return Err(EngineError::Undefined {
                subject: crate::engine::error::Subject::BoreRadius,
                quantity: "bore radius",
                value: self.r_in,
                unit: "m",
                why: "the wall is as thick as the pipe or thicker",
            });
        }
        for (i, l) in self.layers.iter().enumerate() {
            if !l.thickness.is_finite() || l.thickness < 0.0 {
                return Err(EngineError::Undefined {
                    subject: crate::engine::error::Subject::LayerThickness(i),
                    quantity: "layer thickness",
                    value: l.thickness,
                    unit: "m",
                    why: "a layer cannot be thinner than nothing",
                });
            }
            let kmin = l.k.min_over(t_lo, t_hi);
            if kmin.is_nan() || kmin <= 0.0 {
                return Err(EngineError::Undefined {
                    subject: crate::engine::error::Subject::LayerConductivity(i),
                    quantity: "layer conductivity",
                    value: kmin,
                    unit: "W/(m·K)",
                    why: "the conductivity must stay above zero over the temperatures of the job",
                });
            }
        }
        Ok(())
    }

    /// March from the inner face at `t0` with heat flow `q` (outward, W/m or W) through every layer:
    /// the temperature at each interface, clamped to [t_lo, t_hi]. The clamp keeps trial values of
    /// a solver physical; at the solution no clamp is active.
    pub fn march(&self, t0: f64, q: f64, t_lo: f64, t_hi: f64) -> Vec<f64> {
        let mut out = Vec::with_capacity(self.layers.len());
        let mut t = t0;
        let mut r1 = self.r_in;
        for l in &self.layers {
            let r2 = r1 + l.thickness;
            if l.thickness > 0.0 {
                let target = l.k.integral(t) - q / self.geometry.shape_factor(r1, r2);
                t = invert(&l.k, target, t_lo, t_hi);
            }
            out.push(t);
            r1 = r2;
        }
        out
    }

    /// Thermal resistance of each layer at constant k (for notes and the critical radius), K·m/W or K/W.
    pub fn resistance_const(&self, l: usize, k: f64) -> f64 {
        let radii = self.radii();
        let r1 = if l == 0 { self.r_in } else { radii[l - 1] };
        1.0 / (self.geometry.shape_factor(r1, radii[l]) * k)
    }
}

/// The temperature T in [lo, hi] with K(T) = target (K increases with T where k > 0), clamped.
fn invert(k: &Conductivity, target: f64, lo: f64, hi: f64) -> f64 {
    let (klo, khi) = (k.integral(lo), k.integral(hi));
    if target <= klo {
        return lo;
    }
    if target >= khi {
        return hi;
    }
    if k.b == 0.0 && k.c == 0.0 {
        return 273.15 + target / k.a;
    }
    if k.c == 0.0 {
        // a·θ + (b/2)·θ² = target: the root on the branch where k = a + b·θ > 0, written
        // 2·target/(a + √(a² + 2b·target)) so that it does not cancel when b is small.
        let disc = k.a * k.a + 2.0 * k.b * target;
        let th = 2.0 * target / (k.a + disc.max(0.0).sqrt());
        if th.is_finite() {
            return (273.15 + th).clamp(lo, hi);
        }
    }
    crate::engine::solve::bracketed(
        |t| k.integral(t) - target,
        lo,
        hi,
        1e-13 * target.abs().max(1e-9),
    )
    .map(|r| r.x)
    .unwrap_or(0.5 * (lo + hi))
}

/// Critical insulation radius for constant k and constant outside coefficient h: k/h for a
/// cylinder, 2k/h for a sphere (textbook result).
pub fn critical_radius(g: Geometry, k: f64, h: f64) -> f64 {
    match g {
        Geometry::Cylinder => k / h,
        Geometry::Sphere => 2.0 * k / h,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// With a constant outside coefficient, the loss through one layer of constant k rises and
    /// then falls as the layer thickens; the engine's own march and a bracketed balance put the
    /// peak at r = k/h for a cylinder and 2k/h for a sphere (the textbook critical radius).
    #[test]
    fn loss_peaks_at_the_critical_radius() {
        let (k, h, r_in, t_in, t_inf) = (0.5, 10.0, 0.01, 400.0, 300.0);
        for g in [Geometry::Cylinder, Geometry::Sphere] {
            let loss = |r_out: f64| -> f64 {
                let c = Construction {
                    geometry: g,
                    r_in,
                    layers: vec![Layer {
                        thickness: r_out - r_in,
                        k: Conductivity::constant(k),
                    }],
                };
                let area = g.area(r_out);
                let balance = |q: f64| {
                    let ts = *c.march(t_in, q, t_inf, t_in).last().unwrap();
                    h * area * (ts - t_inf) - q
                };
                crate::engine::solve::bracketed(balance, 0.0, h * area * (t_in - t_inf), 1e-13)
                    .unwrap()
                    .x
            };
            // Golden-section search for the thickest loss over r_out in (r_in, 1 m).
            let phi = (5f64.sqrt() - 1.0) / 2.0;
            let (mut a, mut b) = (r_in * 1.001, 1.0);
            for _ in 0..80 {
                let (x1, x2) = (b - phi * (b - a), a + phi * (b - a));
                if loss(x1) > loss(x2) {
                    b = x2;
                } else {
                    a = x1;
                }
            }
            let peak = 0.5 * (a + b);
            let rc = critical_radius(g, k, h);
            assert!(
                (peak / rc - 1.0).abs() < 1e-3,
                "{g:?}: peak {peak}, k/h rule {rc}"
            );
            // Thicker than that, more insulation loses less.
            assert!(loss(2.0 * rc) < loss(1.5 * rc) && loss(1.5 * rc) < loss(rc));
        }
    }

    #[test]
    fn constant_k_matches_the_log_law() {
        let c = Construction {
            geometry: Geometry::Cylinder,
            r_in: 0.03,
            layers: vec![Layer {
                thickness: 0.05,
                k: Conductivity::constant(0.04),
            }],
        };
        // q' = 2πk(T1 − T2)/ln(r2/r1) = 2π·0.04·100/ln(0.08/0.03).
        let q = 2.0 * PI * 0.04 * 100.0 / (0.08f64 / 0.03).ln();
        let t = c.march(400.0, q, 200.0, 500.0);
        assert!((t[0] - 300.0).abs() < 1e-9, "{}", t[0]);
    }

    #[test]
    fn polynomial_k_uses_the_integral_mean() {
        let k = Conductivity {
            a: 0.035,
            b: 1e-4,
            c: 2e-7,
        };
        // Mean over 20–200 °C by hand: a + b·(θ1+θ2)/2 + c·(θ1²+θ1θ2+θ2²)/3.
        let (t1, t2) = (473.15, 293.15);
        let want = 0.035 + 1e-4 * 110.0 + 2e-7 * (200.0f64 * 200.0 + 200.0 * 20.0 + 400.0) / 3.0;
        assert!((k.mean(t1, t2) - want).abs() < 1e-15);
        let c = Construction {
            geometry: Geometry::Sphere,
            r_in: 0.5,
            layers: vec![Layer { thickness: 0.1, k }],
        };
        let q = Geometry::Sphere.shape_factor(0.5, 0.6) * want * (t1 - t2);
        let t = c.march(t1, q, 250.0, 500.0);
        assert!((t[0] - t2).abs() < 1e-8, "{}", t[0]);
    }

    /// The closed form for a linear k lands where the integral says, for rising and falling k
    /// and for targets on both sides of 0 °C.
    #[test]
    fn linear_k_inverts_exactly() {
        for b in [1.5e-4, -4e-5, 1e-9] {
            let k = Conductivity { a: 0.04, b, c: 0.0 };
            for t in [230.0, 273.15, 300.0, 455.5, 620.0] {
                let back = invert(&k, k.integral(t), 200.0, 700.0);
                assert!((back - t).abs() < 1e-9, "b {b}, {t} → {back}");
            }
        }
    }

    #[test]
    fn bad_constructions_are_refused() {
        let c = Construction {
            geometry: Geometry::Cylinder,
            r_in: -0.01,
            layers: vec![],
        };
        assert!(c.check(280.0, 400.0).is_err());
        let c = Construction {
            geometry: Geometry::Cylinder,
            r_in: 0.01,
            layers: vec![Layer {
                thickness: 0.01,
                k: Conductivity {
                    a: 0.04,
                    b: -1e-3,
                    c: 0.0,
                },
            }],
        };
        // k falls to zero at 40 °C: refused for a job reaching 100 °C.
        assert!(c.check(280.0, 373.15).is_err());
        assert!(c.check(280.0, 300.0).is_ok());
    }
}
