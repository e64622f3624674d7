//! Plot data: curves of each correlation over a Reynolds range and the mapping of log–log and
//! linear axes to SVG coordinates. Pure numbers and path strings; the page only draws them.

pub mod svg;

use crate::engine::body::{Analysis, Shape};
use crate::engine::correlations::{local, Groups};
use crate::engine::validity::FlagKind;

/// A run of points drawn in one style.
#[derive(Debug, Clone, PartialEq)]
pub struct Segment {
    /// Inside every published range of the correlation (drawn solid) or not (dashed).
    pub inside: bool,
    /// SVG path data in the plot's coordinates.
    pub path: String,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Curve {
    pub id: &'static str,
    pub name: &'static str,
    pub recommended: bool,
    pub segments: Vec<Segment>,
    /// The operating point of this correlation, in plot coordinates.
    pub point: (f64, f64),
}

/// A plot frame: data ranges, pixel size, and the tick labels.
#[derive(Debug, Clone, PartialEq)]
pub struct Frame {
    pub width: f64,
    pub height: f64,
    /// Margins: left, right, top, bottom.
    pub margin: (f64, f64, f64, f64),
    pub x: (f64, f64),
    pub y: (f64, f64),
    pub log_x: bool,
    pub log_y: bool,
}

impl Frame {
    fn map(v: f64, (lo, hi): (f64, f64), log: bool) -> f64 {
        if log {
            (v.max(1e-300).log10() - lo.log10()) / (hi.log10() - lo.log10())
        } else {
            (v - lo) / (hi - lo)
        }
    }
    /// Data → SVG coordinates (y grows downward).
    pub fn to_svg(&self, x: f64, y: f64) -> (f64, f64) {
        let (l, r, t, b) = self.margin;
        let fx = Self::map(x, self.x, self.log_x);
        let fy = Self::map(y, self.y, self.log_y);
        (
            l + fx * (self.width - l - r),
            self.height - b - fy * (self.height - t - b),
        )
    }
    /// Ticks on x: (position, label). Decades for a log axis, `step` for a linear one.
    pub fn x_ticks(&self, step: f64) -> Vec<(f64, String)> {
        ticks(self.x, self.log_x, step)
            .into_iter()
            .map(|(v, s)| (self.to_svg(v, self.y.0).0, s))
            .collect()
    }
    pub fn y_ticks(&self, step: f64) -> Vec<(f64, String)> {
        ticks(self.y, self.log_y, step)
            .into_iter()
            .map(|(v, s)| (self.to_svg(self.x.0, v).1, s))
            .collect()
    }
}

fn ticks((lo, hi): (f64, f64), log: bool, step: f64) -> Vec<(f64, String)> {
    let mut out = Vec::new();
    if log {
        let (a, b) = (lo.log10().round() as i32, hi.log10().round() as i32);
        for e in a..=b {
            out.push((10f64.powi(e), decade_label(e)));
        }
    } else {
        let mut v = (lo / step).ceil() * step;
        while v <= hi + 1e-9 {
            out.push((v, crate::engine::units::format_sig(v, 3)));
            v += step;
        }
    }
    out
}

/// "10⁻¹", "1", "10", "10³" …
pub fn decade_label(e: i32) -> String {
    match e {
        0 => "1".into(),
        1 => "10".into(),
        _ => {
            const SUP: [char; 10] = ['⁰', '¹', '²', '³', '⁴', '⁵', '⁶', '⁷', '⁸', '⁹'];
            let digits: String = e
                .unsigned_abs()
                .to_string()
                .chars()
                .map(|c| SUP[c.to_digit(10).unwrap_or(0) as usize])
                .collect();
            format!("10{}{digits}", if e < 0 { "⁻" } else { "" })
        }
    }
}

/// Reynolds range of the Nu–Re plot.
pub const RE_RANGE: (f64, f64) = (1.0, 1e6);
const SAMPLES: usize = 241;

/// The Nu–Re plot for the chosen shape: each correlation over 1–10⁶ at the operating point's other
/// groups (Pr, Pr_s, μ/μs), solid inside its ranges and dashed outside, with its operating point.
pub fn nu_re(shape: Shape, a: &Analysis, width: f64, height: f64) -> (Frame, Vec<Curve>) {
    let forced = shape.forced();
    let mut data: Vec<Vec<(f64, f64, bool)>> = Vec::new();
    let (mut ymin, mut ymax) = (f64::INFINITY, 0.0f64);
    for (c, e) in forced.iter().zip(&a.forced) {
        let pts: Vec<(f64, f64, bool)> = (0..SAMPLES)
            .map(|i| {
                let re = 10f64.powf(6.0 * i as f64 / (SAMPLES - 1) as f64);
                let g = Groups { re, ..e.groups };
                let nu = (c.nu)(&g);
                let inside = nu.flags.iter().all(|f| f.kind != FlagKind::Outside);
                (re, nu.value, inside)
            })
            .filter(|p| p.1.is_finite() && p.1 > 0.0)
            .collect();
        for p in &pts {
            ymin = ymin.min(p.1);
            ymax = ymax.max(p.1);
        }
        data.push(pts);
    }
    if !ymin.is_finite() {
        ymin = 0.1;
        ymax = 1000.0;
    }
    let frame = Frame {
        width,
        height,
        margin: (46.0, 12.0, 22.0, 34.0),
        x: RE_RANGE,
        y: (
            10f64.powf(ymin.log10().floor()),
            10f64.powf(ymax.log10().ceil()),
        ),
        log_x: true,
        log_y: true,
    };
    let mut curves: Vec<Curve> = forced
        .iter()
        .zip(&a.forced)
        .zip(data)
        .enumerate()
        .map(|(i, ((c, e), pts))| Curve {
            id: c.id,
            name: c.name,
            recommended: i == a.recommended,
            segments: segments(&frame, &pts),
            point: frame.to_svg(
                e.groups.re.clamp(RE_RANGE.0, RE_RANGE.1),
                e.nu.max(frame.y.0),
            ),
        })
        .collect();
    if forced.len() > 1 {
        let pts = recommended_points(shape, a);
        let main = a.recommended();
        let nu_here = a
            .pick
            .shares()
            .map(|(i, w)| w * a.forced[i].nu)
            .sum::<f64>();
        curves.push(Curve {
            id: "recommended",
            name: "Recommended (the rule, with its handovers)",
            recommended: false,
            segments: segments(&frame, &pts),
            point: frame.to_svg(
                main.groups.re.clamp(RE_RANGE.0, RE_RANGE.1),
                nu_here.max(frame.y.0),
            ),
        });
    }
    (frame, curves)
}

/// The recommended Nu over the plot's Reynolds range: at each Re the rule of
/// [`crate::engine::pick`] over the correlations' flags there, and Σ share × Nu. Continuous by
/// construction, where each correlation's own curve may end or jump; solid where the main share
/// is inside its ranges.
pub fn recommended_points(shape: Shape, a: &Analysis) -> Vec<(f64, f64, bool)> {
    let forced = shape.forced();
    (0..SAMPLES)
        .filter_map(|i| {
            let re = 10f64.powf(6.0 * i as f64 / (SAMPLES - 1) as f64);
            let at: Vec<_> = forced
                .iter()
                .zip(&a.forced)
                .map(|(c, e)| (c.nu)(&Groups { re, ..e.groups }))
                .collect();
            let pick = crate::engine::pick::pick(at.len(), &mut |j| Some(at[j].decades_outside()));
            let nu: f64 = pick.shares().map(|(j, w)| w * at[j].value).sum();
            let inside = at[pick.main()]
                .flags
                .iter()
                .all(|f| f.kind != FlagKind::Outside);
            (nu.is_finite() && nu > 0.0).then_some((re, nu, inside))
        })
        .collect()
}

fn segments(frame: &Frame, pts: &[(f64, f64, bool)]) -> Vec<Segment> {
    let mut out: Vec<Segment> = Vec::new();
    let mut last: Option<(f64, f64, bool)> = None;
    for &p in pts {
        let (x, y) = frame.to_svg(p.0, p.1);
        match (out.last_mut(), last) {
            (Some(seg), Some(prev)) if prev.2 == p.2 => {
                seg.path.push_str(&format!(" L{x:.1},{y:.1}"));
            }
            _ => {
                // A new style starts where the last one ended, so the line stays unbroken.
                let start = last.map(|q| frame.to_svg(q.0, q.1)).unwrap_or((x, y));
                out.push(Segment {
                    inside: p.2,
                    path: format!("M{:.1},{:.1} L{x:.1},{y:.1}", start.0, start.1),
                });
            }
        }
        last = Some(p);
    }
    out
}

/// The local Nu over the front of a cylinder: the path, the separation angle's x position, and
/// the frame (θ 0–180° on x so the rear's extent shows, Nu_θ linear on y).
pub fn front_profile(re: f64, pr: f64, width: f64, height: f64) -> (Frame, String, f64) {
    let pts = local::profile(re, pr);
    let top = pts.iter().map(|p| p.1).fold(0.0f64, f64::max).max(1e-9);
    let frame = Frame {
        width,
        height,
        margin: (46.0, 12.0, 22.0, 34.0),
        x: (0.0, 180.0),
        y: (0.0, nice_ceiling(top)),
        log_x: false,
        log_y: false,
    };
    let path = pts
        .iter()
        .enumerate()
        .map(|(i, &(th, nu))| {
            let (x, y) = frame.to_svg(th, nu);
            format!("{}{x:.1},{y:.1}", if i == 0 { "M" } else { " L" })
        })
        .collect::<String>();
    let sep = frame.to_svg(local::separation(re).0, 0.0).0;
    (frame, path, sep)
}

/// The next 1, 2 or 5 × 10ⁿ at or above v.
pub fn nice_ceiling(v: f64) -> f64 {
    let e = 10f64.powf(v.log10().floor());
    for m in [1.0, 2.0, 5.0, 10.0] {
        if m * e >= v {
            return m * e;
        }
    }
    10.0 * e
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::engine::body::{analyse, Axis, Body, Wind};
    use crate::engine::props::Fluid;

    fn analysis(shape: Shape) -> Analysis {
        analyse(&Body {
            shape,
            axis: Axis::Horizontal,
            wind: Wind::Horizontal,
            d: 0.05,
            length: 1.0,
            speed: 3.0,
            t_inf: 283.15,
            t_s: 333.15,
            p: 101_325.0,
            fluid: Fluid::DryAir,
            yaw: 1.0,
        })
        .unwrap()
    }

    #[test]
    fn frame_maps_corners() {
        let f = Frame {
            width: 300.0,
            height: 200.0,
            margin: (40.0, 10.0, 10.0, 30.0),
            x: (1.0, 1e6),
            y: (0.1, 1e4),
            log_x: true,
            log_y: true,
        };
        assert_eq!(f.to_svg(1.0, 0.1), (40.0, 170.0));
        assert_eq!(f.to_svg(1e6, 1e4), (290.0, 10.0));
        assert_eq!(f.x_ticks(1.0).len(), 7);
        assert_eq!(decade_label(-1), "10⁻¹");
        assert_eq!(decade_label(6), "10⁶");
    }

    #[test]
    fn every_correlation_has_a_curve_with_both_styles_where_ranges_end() {
        let a = analysis(Shape::Cylinder);
        let (_, curves) = nu_re(Shape::Cylinder, &a, 480.0, 300.0);
        assert_eq!(curves.len(), 5);
        assert_eq!(curves[4].id, "recommended");
        // Hilpert's table ends at 4×10⁵: its curve has a dashed part at high Re.
        let h = curves.iter().find(|c| c.id == "hilpert").unwrap();
        assert!(h.segments.iter().any(|s| s.inside) && h.segments.iter().any(|s| !s.inside));
        assert!(curves[0].recommended);
        for c in &curves {
            assert!(!c
                .segments
                .iter()
                .any(|s| s.path.contains("NaN") || s.path.contains("inf")));
        }
    }

    /// The recommended curve moves smoothly where the rule hands over (a sphere at Whitaker's and
    /// Achenbach's upper limits): no step between samples beyond what a power law and a
    /// linear handover make.
    #[test]
    fn the_recommended_curve_has_no_jump() {
        for shape in [Shape::Sphere, Shape::Cylinder] {
            let a = analysis(shape);
            let pts = recommended_points(shape, &a);
            assert_eq!(pts.len(), SAMPLES);
            // Samples are 0.025 decade apart: Nu ∝ Re^0.8 at most moves 4.7 % per step, and a
            // handover across a 60 % gap (a sphere's critical regime) adds 0.025/0.3 × 60 % = 5 %;
            // one between two forms that nearly agree may dip by a fraction of a per cent. A jump
            // (a correlation ending at its range) would be far more.
            for w in pts.windows(2) {
                let r = w[1].1 / w[0].1;
                assert!(
                    r > 0.99 && r < 1.11,
                    "{shape:?} at Re {}: {} → {}",
                    w[1].0,
                    w[0].1,
                    w[1].1
                );
            }
        }
    }

    #[test]
    fn front_profile_marks_separation() {
        let (f, path, sep) = front_profile(1e4, 0.7, 400.0, 200.0);
        assert!(path.starts_with('M'));
        assert_eq!(sep, f.to_svg(80.0, 0.0).0);
        assert_eq!(nice_ceiling(98.8), 100.0);
        assert_eq!(nice_ceiling(101.0), 200.0);
    }
}

/// A linear x–y chart of one series: its frame with rounded bounds, the path, and tick steps.
#[derive(Debug, Clone, PartialEq)]
pub struct LineChart {
    pub frame: Frame,
    pub path: String,
    pub x_step: f64,
    pub y_step: f64,
}

/// A step of 1, 2 or 5 × 10ⁿ giving about four to eight ticks over `span`.
pub fn nice_step(span: f64) -> f64 {
    if span.is_nan() || span <= 0.0 || span.is_infinite() {
        return 1.0;
    }
    let raw = span / 5.0;
    let e = 10f64.powf(raw.log10().floor());
    // A span converted between units carries rounding noise (0.1 m is 100.00000000000001 mm):
    // it must not push the step to the next size.
    for m in [1.0, 2.0, 5.0] {
        if m * e >= raw * (1.0 - 1e-9) {
            return m * e;
        }
    }
    10.0 * e
}

/// `v` rounded down (up) to a multiple of `step`, a value within rounding noise of a multiple
/// taken as that multiple (so the axis ends at the data, not a step beyond it).
fn snap_down(v: f64, step: f64) -> f64 {
    (v / step + 1e-9).floor() * step
}
fn snap_up(v: f64, step: f64) -> f64 {
    (v / step - 1e-9).ceil() * step
}

/// Frame `xs`, `ys` (already in the units shown) with bounds rounded to ticks; `also` are y values
/// the frame must include (targets drawn as lines).
pub fn line_chart(xs: &[f64], ys: &[f64], also: &[f64], width: f64, height: f64) -> LineChart {
    let finite = |v: &&f64| v.is_finite();
    let (x0, x1) = (
        xs.iter()
            .filter(finite)
            .cloned()
            .fold(f64::INFINITY, f64::min),
        xs.iter()
            .filter(finite)
            .cloned()
            .fold(f64::NEG_INFINITY, f64::max),
    );
    let ys_all = ys.iter().chain(also.iter());
    let (mut y0, mut y1) = ys_all
        .clone()
        .filter(finite)
        .fold((f64::INFINITY, f64::NEG_INFINITY), |(a, b), &v| {
            (a.min(v), b.max(v))
        });
    if !(y0.is_finite() && y1.is_finite()) {
        (y0, y1) = (0.0, 1.0);
    }
    if y1 - y0 < 1e-9 * y1.abs().max(1.0) {
        y0 -= 1.0;
        y1 += 1.0;
    }
    let (x0, x1) = if x0.is_finite() && x1 > x0 {
        (x0, x1)
    } else {
        (0.0, 1.0)
    };
    let mut x_step = nice_step(x1 - x0);
    // A span the nice step does not divide but one and a half of it does (0–90°: 30, not 20)
    // keeps the axis at the data's own ends.
    let n = (x1 - x0) / (1.5 * x_step);
    if (x1 - x0) % x_step > 1e-9 * x_step && (n - n.round()).abs() < 1e-9 && n.round() >= 3.0 {
        x_step *= 1.5;
    }
    let y_step = nice_step(y1 - y0);
    let frame = Frame {
        width,
        height,
        margin: (52.0, 12.0, 22.0, 34.0),
        x: (snap_down(x0, x_step), snap_up(x1, x_step)),
        y: (snap_down(y0, y_step), snap_up(y1, y_step)),
        log_x: false,
        log_y: false,
    };
    let path = xs
        .iter()
        .zip(ys)
        .filter(|(x, y)| x.is_finite() && y.is_finite())
        .enumerate()
        .map(|(i, (&x, &y))| {
            let (sx, sy) = frame.to_svg(x, y);
            format!("{}{sx:.1},{sy:.1}", if i == 0 { "M" } else { " L" })
        })
        .collect();
    LineChart {
        frame,
        path,
        x_step,
        y_step,
    }
}

#[cfg(test)]
mod line_tests {
    use super::*;

    #[test]
    fn line_chart_frames_with_round_bounds() {
        let c = line_chart(&[0.0, 0.05, 0.1], &[30.0, 12.0, 7.0], &[60.0], 400.0, 200.0);
        assert_eq!(c.frame.x, (0.0, 0.1));
        assert_eq!(c.frame.y, (0.0, 60.0));
        assert_eq!(c.x_step, 0.02);
        assert!(c.path.starts_with('M') && !c.path.contains("NaN"));
        assert_eq!(nice_step(0.0), 1.0);
    }

    /// Regression: a 0–0.1 m sweep shown in mm (0.1 / 0.001 = 100.00000000000001) drew its
    /// axis to 150 mm, a third of the plot empty.
    #[test]
    fn an_axis_ends_at_its_data_despite_conversion_noise() {
        let to_mm = |v: f64| v / 0.001;
        let xs = [to_mm(0.0), to_mm(0.05), to_mm(0.1)];
        let c = line_chart(&xs, &[3.0, 2.0, 1.0], &[], 480.0, 240.0);
        assert_eq!(c.x_step, 20.0);
        assert_eq!(c.frame.x, (0.0, 100.0));
    }

    /// An angle from 0 to 90°: ticks every 30°, the axis ending at 90 (it ran to 100, a tenth of
    /// the plot empty); a span the nice step divides keeps it (0–20 m/s by 5).
    #[test]
    fn a_quarter_turn_is_ticked_by_thirties() {
        let c = line_chart(&[0.0, 45.0, 90.0], &[1.0, 2.0, 3.0], &[], 320.0, 240.0);
        assert_eq!((c.x_step, c.frame.x), (30.0, (0.0, 90.0)));
        let c = line_chart(&[0.0, 10.0, 20.0], &[1.0, 2.0, 3.0], &[], 320.0, 240.0);
        assert_eq!((c.x_step, c.frame.x), (5.0, (0.0, 20.0)));
    }
}
