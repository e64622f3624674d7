//! The working, step by step, written from the evaluation's results for a person to check by
//! hand.

use super::*;

pub(crate) struct WorkingInputs<'a> {
    pub(crate) p: f64,
    pub(crate) dew_point: Option<f64>,
    pub(crate) fluid: &'a str,
    pub(crate) ts: f64,
    pub(crate) outer_d: f64,
    pub(crate) q_conv_unit: f64,
    pub(crate) q_rad_unit: f64,
    /// Absorbed sun per metre (W/m) or for a sphere (W); 0 indoors.
    pub(crate) q_solar_unit: f64,
    pub(crate) h_rad: f64,
    pub(crate) q_total: f64,
    pub(crate) job: Option<&'a JobResult>,
    pub(crate) inside: &'a Inside,
    pub(crate) env: &'a Surroundings,
}

/// One property set in words for the working: "`fluid` `at` T K, p Pa: ρ = …".
pub(crate) fn property_text(fluid: &str, at: &str, pr: &Properties) -> String {
    let g = |v: f64| format_sig(v, 5);
    format!(
        "{fluid} {at} {} K, {} Pa: ρ = {} kg/m³, μ = {} Pa·s, k = {} W/(m·K), cp = {} J/(kg·K); ν = μ/ρ = {} m²/s, Pr = {}",
        g(pr.t),
        g(pr.p),
        g(pr.rho),
        g(pr.mu),
        g(pr.k),
        g(pr.cp),
        g(pr.nu),
        g(pr.pr)
    )
}

pub(crate) fn working(s: &Scenario, a: &Analysis, w: &WorkingInputs) -> Vec<Step> {
    let g = |v: f64| format_sig(v, 5);
    let rec = a.recommended();
    let mut out = Vec::new();
    if let Some(pr) = w.inside.props() {
        let props = property_text(
            s.process_fluid().map(|f| f.name()).unwrap_or(""),
            "at the process temperature",
            pr,
        );
        let text = match w.inside {
            Inside::Flowing(f) => {
                let formula = match f.regime {
                    crate::engine::correlations::internal::PipeRegime::Laminar => format!(
                        "VDI Heat Atlas G1, laminar: Gz = Re·Pr·d/L = {}; Nu = [3.66³ + 0.7³ + (1.615·Gz^⅓ − 0.7)³ + ((2/(1 + 22·Pr))^⅙·Gz^½)³]^⅓",
                        g(f.d / f.length * f.re * f.pr)
                    ),
                    crate::engine::correlations::internal::PipeRegime::Transition { weight } => format!(
                        "VDI Heat Atlas G1: interpolated with weight γ = (Re − 2300)/(10⁴ − 2300) = {} between the laminar form at Re = 2300 and the turbulent one at Re = 10⁴",
                        g(weight)
                    ),
                    crate::engine::correlations::internal::PipeRegime::Turbulent => format!(
                        "VDI Heat Atlas G1 (Gnielinski), with Konakov's ξ = (1.8·log₁₀Re − 1.5)⁻² = {}: Nu = (ξ/8)·Re·Pr / (1 + 12.7·√(ξ/8)·(Pr^⅔ − 1)) · (1 + (d/L)^⅔)",
                        g(crate::engine::correlations::internal::konakov(f.re))
                    ),
                };
                format!(
                    "{props}. Bore d = {} m, run L = {} m, flow ṁ = {} kg/s, mean velocity {} m/s; Re = 4ṁ/(π·d·μ) = {}, {}. {} = {}; h_i = Nu·k/d = {} W/(m²·K). Properties at the bulk temperature, no wall-property correction.",
                    g(f.d),
                    g(f.length),
                    g(f.mass_flow),
                    g(f.velocity),
                    g(f.re),
                    f.regime.describe(),
                    formula,
                    g(f.nu),
                    g(f.h)
                )
            }
            _ => format!("{props}. No flow through the bore: the inside film is not worked out; the bore is at the process temperature."),
        };
        out.push(Step {
            title: "Inside film (flow through the bore)",
            text,
        });
    }
    if let Some(j) = w.job {
        let sol = &j.solution;
        let temps = sol
            .interfaces
            .iter()
            .map(|t| format!("{} K", g(*t)))
            .collect::<Vec<_>>()
            .join(" → ");
        out.push(Step {
            title: "Surface temperature (energy balance)",
            text: format!(
                "Process {} K inside; conduction through the wall and {} insulation layer(s) (integral-mean k) equals convection plus radiation outside{}. Solved for the heat flow by bracketed regula falsi (Anderson–Björck) in {} iterations, residual {} W/m (or W); outer diameter {} m. Bore {} K, then {}.",
                g(s.process_temp),
                s.layer_count,
                if w.env.outdoor.is_some() { " less the absorbed sun" } else { "" },
                sol.iterations,
                format_sig(sol.residual, 2),
                g(sol.outer_d),
                g(sol.t_bore),
                temps
            ),
        });
    }
    out.push(Step {
        title: "Temperatures",
        text: format!(
            "Free stream T∞ = {} K, surface Ts = {} K, film Tf = (Ts + T∞)/2 = {} K. Each correlation takes its properties where its authors did: {} at the {}.",
            g(s.fluid_temp),
            g(w.ts),
            g(a.film.t),
            rec.name,
            rec.reference.describe()
        ),
    });
    if s.pressure_input == PressureInput::Elevation {
        out.push(Step {
            title: "Pressure from elevation",
            text: format!(
                "ISO 2533 standard atmosphere at {} m: p = 101325 Pa × (1 − 0.0065 × {} / 288.15)^5.2559 = {} Pa",
                g(s.elevation),
                g(s.elevation),
                g(w.p)
            ),
        });
    }
    if let Some(td) = w.dew_point {
        out.push(Step {
            title: "Moisture",
            text: format!("Dew point of the stream: {} K", g(td)),
        });
    }
    for (title, pr) in [
        ("Properties at Tf", &a.film),
        ("Properties at T∞", &a.free),
        ("Properties at Ts", &a.surface),
    ] {
        out.push(Step {
            title,
            text: property_text(w.fluid, "at", pr),
        });
    }
    let at = if rec.reference == crate::engine::correlations::Reference::Film {
        &a.film
    } else {
        &a.free
    };
    out.push(Step {
        title: "Reynolds and Prandtl numbers",
        text: format!(
            "Re = U·D/ν = {} m/s × {} m / {} m²/s = {}; Pr = {} (at {})",
            g(s.speed * w.env.wind_ratio),
            g(w.outer_d),
            g(at.nu),
            g(rec.groups.re),
            g(rec.groups.pr),
            rec.reference.short()
        ),
    });
    out.push(Step {
        title: "Forced convection (recommended correlation)",
        text: format!(
            "{}: {}{} = {}; h_F = Nu·k/D = {} × {} W/(m·K) / {} m = {} W/(m²·K)",
            rec.name,
            rec.formula,
            rec.detail().map(|d| format!(" ({d})")).unwrap_or_default(),
            g(rec.nu),
            g(rec.nu),
            g(rec.k),
            g(w.outer_d),
            g(rec.h)
        ),
    });
    let shares: Vec<String> = a
        .pick
        .shares()
        .map(|(i, wt)| {
            format!(
                "{} % × {} W/(m²·K) ({})",
                g(100.0 * wt),
                g(a.forced[i].h),
                a.forced[i].name
            )
        })
        .collect();
    out.push(Step {
        title: "Why this correlation",
        text: if shares.len() > 1 {
            format!(
                "{} h_F = {} = {} W/(m²·K).",
                a.reason(),
                shares.join(" + "),
                g(a.h_forced)
            )
        } else {
            a.reason()
        },
    });
    match &a.natural {
        Some(n) => {
            out.push(Step {
                title: "Natural convection",
                text: format!(
                    "Gr = g·β·|Ts − T∞|·L³/ν² = {} on L = {} m, Ra = Gr·Pr = {}; {}: {} = {}; h_N = {} W/(m²·K)",
                    g(n.gr),
                    g(n.length),
                    g(n.ra),
                    n.name,
                    n.formula,
                    g(n.nu),
                    g(n.h)
                ),
            });
            out.push(Step {
                title: "Mixed convection",
                text: format!(
                    "Stream {}; Churchill's blend, n = {}, shared still-fluid limit added back: h = {} W/(m²·K). {}.",
                    a.direction.describe(),
                    g(a.exponent),
                    g(a.h),
                    a.mode()
                ),
            });
        }
        None => out.push(Step {
            title: "Natural convection",
            text: "Not included: the fluid's expansion coefficient β is not given.".into(),
        }),
    }
    out.push(Step {
        title: "Radiation",
        text: format!(
            "q_rad = ε·σ·(Ts⁴ − Tsur⁴) per m² with ε = {}, σ = 5.670374419×10⁻⁸ W/(m²·K⁴), Tsur = {} K; linearised h_rad = εσ(Ts² + Tsur²)(Ts + Tsur) = {} W/(m²·K)",
            g(s.emissivity),
            g(w.env.t_radiant),
            g(w.h_rad)
        ),
    });
    let dt = w.ts - s.fluid_temp;
    let text = match (s.shape.perimeter_over_d(), w.env.outdoor.is_some()) {
        (Some(k), false) => format!(
            "q′ = h·P·(Ts − T∞) + q′_rad = {} × {} m × {} K + {} W/m = {} W/m, P = {}·D; over L = {} m: Q = {} W",
            g(a.h),
            g(k * w.outer_d),
            g(dt),
            g(w.q_rad_unit),
            g(w.q_conv_unit + w.q_rad_unit),
            g(k),
            g(s.length),
            g(w.q_total)
        ),
        (Some(k), true) => format!(
            "q′ = h·P·(Ts − T∞) + q′_rad − q′_sun = {} × {} m × {} K + {} W/m − {} W/m = {} W/m, P = {}·D (the sun a gain); over L = {} m: Q = {} W",
            g(a.h),
            g(k * w.outer_d),
            g(dt),
            g(w.q_rad_unit),
            g(w.q_solar_unit),
            g(w.q_conv_unit + w.q_rad_unit - w.q_solar_unit),
            g(k),
            g(s.length),
            g(w.q_total)
        ),
        (None, false) => format!(
            "Q = h·π·D²·(Ts − T∞) + Q_rad = {} × π × ({} m)² × {} K + {} W = {} W",
            g(a.h),
            g(w.outer_d),
            g(dt),
            g(w.q_rad_unit),
            g(w.q_total)
        ),
        (None, true) => format!(
            "Q = h·π·D²·(Ts − T∞) + Q_rad − Q_sun = {} × π × ({} m)² × {} K + {} W − {} W = {} W (the sun a gain)",
            g(a.h),
            g(w.outer_d),
            g(dt),
            g(w.q_rad_unit),
            g(w.q_solar_unit),
            g(w.q_total)
        ),
    };
    out.push(Step {
        title: "Heat flow",
        text,
    });
    if let Some(o) = &w.env.outdoor {
        let at = out
            .iter()
            .position(|st| st.title == "Temperatures")
            .unwrap_or(out.len());
        let steps = super::outdoor_working::steps(s, o, w);
        out.splice(at..at, steps);
    }
    out
}
