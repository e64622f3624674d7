//! The plots as markup: each figure written once as one SVG string from the chart frames, which
//! the page sets as the figure's content in one step (the browser parses it natively, instead of
//! one call across the wasm boundary per element and attribute, and the wasm carries one small
//! writer instead of a view per element).
//!
//! Only numbers and this module's own labels go in, and every text passes through [`esc`], so no
//! text can become markup.

use std::fmt::Write;

use super::{front_profile, line_chart, nice_ceiling, nu_re, Frame};
use crate::engine::body::{Analysis, Shape};
use crate::engine::correlations::local;
use crate::engine::units::{format_sig, show, Unit};

/// `s` with `&`, `<`, `>`, `"` and `'` written as character references: safe in text and in a
/// quoted attribute.
pub fn esc(s: &str) -> String {
    let mut out = String::with_capacity(s.len());
    for c in s.chars() {
        match c {
            '&' => out.push_str("&amp;"),
            '<' => out.push_str("&lt;"),
            '>' => out.push_str("&gt;"),
            '"' => out.push_str("&quot;"),
            '\'' => out.push_str("&#39;"),
            c => out.push(c),
        }
    }
    out
}

/// An SVG being written: coordinates to 0.1 unit (a tenth of a pixel at most on screen).
struct Svg(String);

impl Svg {
    fn new(w: f64, h: f64, class: &str, label: &str) -> Self {
        let mut s = String::with_capacity(4096);
        let _ = write!(
            s,
            r#"<svg viewBox="0 0 {w} {h}"{} role="img" aria-label="{}">"#,
            if class.is_empty() {
                String::new()
            } else {
                format!(r#" class="{class}""#)
            },
            esc(label)
        );
        Svg(s)
    }
    fn line(&mut self, (x1, y1): (f64, f64), (x2, y2): (f64, f64), class: &str) {
        let _ = write!(
            self.0,
            r#"<line x1="{x1:.1}" y1="{y1:.1}" x2="{x2:.1}" y2="{y2:.1}" class="{class}"/>"#
        );
    }
    /// Text at (x, y); `anchor` "start", "middle" or "end".
    fn text(&mut self, (x, y): (f64, f64), class: &str, anchor: &str, t: &str) {
        let a = if anchor == "start" {
            String::new()
        } else {
            format!(r#" text-anchor="{anchor}""#)
        };
        let _ = write!(
            self.0,
            r#"<text x="{x:.1}" y="{y:.1}" class="{class}"{a}>{}</text>"#,
            esc(t)
        );
    }
    fn rect(&mut self, (x, y): (f64, f64), (w, h): (f64, f64), class: &str) {
        let _ = write!(
            self.0,
            r#"<rect x="{x:.1}" y="{y:.1}" width="{w:.1}" height="{h:.1}" class="{class}"/>"#
        );
    }
    fn path(&mut self, d: &str, class: &str) {
        let _ = write!(self.0, r#"<path d="{}" class="{class}"/>"#, esc(d));
    }
    /// A circle; `extra` is further attributes written by this module (never user text).
    fn circle(&mut self, (cx, cy): (f64, f64), r: f64, class: &str, extra: &str) {
        let _ = write!(
            self.0,
            r#"<circle cx="{cx:.1}" cy="{cy:.1}" r="{r}" class="{class}"{extra}/>"#
        );
    }
    fn raw(&mut self, s: &str) {
        self.0.push_str(s);
    }
    /// The frame with its grid and tick labels (x ticks under the frame, y ticks to its left).
    fn frame(&mut self, f: &Frame, xt: &[(f64, String)], yt: &[(f64, String)], x_grid: bool) {
        let (l, r, t, b) = f.margin;
        let (w, h) = (f.width, f.height);
        for (x, s) in xt {
            if x_grid {
                self.line((*x, t), (*x, h - b), "grid");
            }
            self.text((*x, h - b + 16.0), "tick", "middle", s);
        }
        for (y, s) in yt {
            self.line((l, *y), (w - r, *y), "grid");
            self.text((l - 4.0, y + 4.0), "tick", "end", s);
        }
        self.rect((l, t), (w - l - r, h - t - b), "frame");
    }
    /// The axis titles: x under the ticks, y above the frame's top left.
    fn titles(&mut self, f: &Frame, x: &str, y: &str) {
        let (l, r, _, _) = f.margin;
        self.text(
            ((l + f.width - r) / 2.0, f.height - 2.0),
            "axis",
            "middle",
            x,
        );
        self.text((6.0, 14.0), "axis", "start", y);
    }
    fn finish(mut self) -> String {
        self.0.push_str("</svg>");
        self.0
    }
}

/// One series against a swept input, all in SI: what [`sweep_figure`] draws.
pub struct Sweep<'a> {
    /// The plot's id (`data-point` of its operating point).
    pub id: &'static str,
    pub title: &'a str,
    pub x_label: &'a str,
    pub x_unit: &'static Unit,
    pub y_label: &'a str,
    pub y_unit: &'static Unit,
    pub xs: &'a [f64],
    pub ys: &'a [f64],
    /// This operating point.
    pub point: Option<(f64, f64)>,
    /// Limit lines across the plot, with their words.
    pub targets: &'a [(&'static str, f64)],
    /// Drawing width in SVG units (narrower on a phone, so the text stays legible).
    pub width: f64,
}

/// A sweep plot's content: the SVG (frame rounded to ticks, the curve, limit lines, the operating
/// point), its caption, and the numbers as a table for screen readers, in the units given.
pub fn sweep_figure(s: &Sweep) -> String {
    let (xu, yu) = (s.x_unit, s.y_unit);
    let xv: Vec<f64> = s.xs.iter().map(|v| xu.from_si(*v)).collect();
    let yv: Vec<f64> = s.ys.iter().map(|v| yu.from_si(*v)).collect();
    let tv: Vec<(&str, f64)> = s
        .targets
        .iter()
        .map(|(l, v)| (*l, yu.from_si(*v)))
        .collect();
    let also: Vec<f64> = tv.iter().map(|t| t.1).collect();
    let (w, h) = (s.width, 240.0);
    let chart = line_chart(&xv, &yv, &also, w, h);
    let f = &chart.frame;
    let (l, r, _, _) = f.margin;
    let mut g = Svg::new(w, h, "", s.title);
    g.frame(f, &f.x_ticks(chart.x_step), &f.y_ticks(chart.y_step), true);
    // A limit line's words go where the curve leaves them most room: at either end of the line,
    // above or below it (a surface falling with thickness runs through the left end of a high
    // limit and along the top of a low one), never past the frame's top.
    let pts: Vec<(f64, f64)> = xv
        .iter()
        .zip(&yv)
        .filter(|(x, y)| x.is_finite() && y.is_finite())
        .map(|(x, y)| f.to_svg(*x, *y))
        .collect();
    let top = f.margin.2;
    let span = w - l - r;
    for (label, v) in &tv {
        let (_, y) = f.to_svg(f.x.0, *v);
        g.line((l, y), (w - r, y), "target");
        // candidate boxes: (x0, x1) of the words, and their text baseline above or below
        let room = |x0: f64, x1: f64, y0: f64, y1: f64| {
            pts.iter()
                .filter(|p| p.0 >= x0 - 6.0 && p.0 <= x1 + 6.0)
                .map(|p| {
                    if p.1 < y0 {
                        y0 - p.1
                    } else if p.1 > y1 {
                        p.1 - y1
                    } else {
                        0.0
                    }
                })
                .fold(f64::INFINITY, f64::min)
        };
        let wide = span * 0.4;
        let mut best = (f64::NEG_INFINITY, (w - r - 4.0, y - 4.0), "end");
        for (x0, x1, tx, anchor) in [
            (w - r - wide, w - r, w - r - 4.0, "end"),
            (l, l + wide, l + 4.0, "start"),
        ] {
            for (ty, y0, y1) in [(y - 4.0, y - 15.0, y), (y + 14.0, y, y + 17.0)] {
                if y0 < top {
                    continue;
                }
                let r = room(x0, x1, y0, y1);
                if r > best.0 + 0.5 {
                    best = (r, (tx, ty), anchor);
                }
            }
        }
        g.text(best.1, "tick", best.2, label);
    }
    g.path(&chart.path, "in sweep");
    if let Some((px, py)) = s.point {
        let at = f.to_svg(xu.from_si(px), yu.from_si(py));
        g.circle(at, 5.0, "op here", &format!(r#" data-point="{}""#, s.id));
    }
    let (xt, yt) = (
        format!("{} ({})", s.x_label, xu.symbol),
        format!("{} ({})", s.y_label, yu.symbol),
    );
    g.titles(f, &xt, &yt);
    let mut out = g.finish();
    let _ = write!(
        out,
        r#"<figcaption>{} The dot is this operating point.</figcaption><div class="sr-only"><table><caption>{}</caption><thead><tr><th scope="col">{}</th><th scope="col">{}</th></tr></thead><tbody>"#,
        esc(s.title),
        esc(s.title),
        esc(&xt),
        esc(&yt)
    );
    for (x, y) in xv.iter().zip(&yv) {
        let _ = write!(
            out,
            "<tr><td>{}</td><td>{}</td></tr>",
            format_sig(*x, 4),
            format_sig(*y, 4)
        );
    }
    out.push_str("</tbody></table></div>");
    out
}

/// The Nu–Re plot of every correlation of the shape (solid inside its ranges, dashed outside),
/// each operating point marked, the rule's own curve, and the legend in the caption.
pub fn nu_re_figure(shape: Shape, a: &Analysis, width: f64) -> String {
    let h = 300.0;
    let (f, curves) = nu_re(shape, a, width, h);
    let mut g = Svg::new(
        width,
        h,
        "",
        "Nusselt number against Reynolds number for each correlation, log–log",
    );
    g.frame(&f, &f.x_ticks(1.0), &f.y_ticks(1.0), true);
    for (i, cv) in curves.iter().enumerate() {
        g.raw(&format!(
            r#"<g class="curve c{i}{}" data-curve="{}">"#,
            if cv.recommended { " rec" } else { "" },
            cv.id
        ));
        for sg in &cv.segments {
            g.path(&sg.path, if sg.inside { "in" } else { "out" });
        }
        g.circle(cv.point, if cv.recommended { 5.0 } else { 3.5 }, "op", "");
        g.raw("</g>");
    }
    g.titles(&f, "Re", "Nu");
    let mut out = g.finish();
    out.push_str(r#"<figcaption><ul class="legend">"#);
    for (i, cv) in curves.iter().enumerate() {
        let _ = write!(
            out,
            r#"<li class="c{i}"><span class="swatch"></span>{}{}</li>"#,
            esc(cv.name),
            if cv.recommended { " ★" } else { "" }
        );
    }
    out.push_str("</ul>Solid: inside the correlation's published range; dashed: outside it. Dots: this operating point (each at its own reference temperature).</figcaption>");
    out
}

/// The local Nu over the front of a cylinder (θ 0–180°, the wake shaded and not drawn), with
/// the separation point; `None` in still fluid (no front stagnation flow to draw).
pub fn front_figure(re: f64, pr: f64, width: f64) -> Option<String> {
    if re.is_nan() || re <= 0.0 {
        return None;
    }
    let h = 220.0;
    let (f, path, sep) = front_profile(re, pr, width, h);
    let (l, r, t, b) = f.margin;
    let (angle, words) = local::separation(re);
    let mut g = Svg::new(
        width,
        h,
        "",
        "Local Nusselt number over the front of the cylinder",
    );
    let xt: Vec<(f64, String)> = f
        .x_ticks(30.0)
        .into_iter()
        .map(|(x, s)| (x, format!("{s}°")))
        .collect();
    let step = nice_ceiling(f.y.1) / 4.0;
    g.frame(&f, &xt, &f.y_ticks(step), false);
    let rear_x = f.to_svg(angle, 0.0).0;
    g.rect((rear_x, t), (width - r - rear_x, h - t - b), "rear");
    g.text(
        ((rear_x + width - r) / 2.0, t + 40.0),
        "tick",
        "middle",
        "wake: not drawn",
    );
    g.path(&path, "in local");
    g.raw(&format!(
        r#"<line x1="{sep:.1}" y1="{t:.1}" x2="{sep:.1}" y2="{:.1}" class="sep" data-separation="{angle}"/>"#,
        h - b
    ));
    g.text(
        (sep + 3.0, t + 14.0),
        "tick",
        "start",
        &format!("separation ≈ {angle}°"),
    );
    g.titles(&f, "θ from the front stagnation point", "Nu_θ");
    let mut out = g.finish();
    let _ = write!(
        out,
        "<figcaption>{}</figcaption>",
        esc(&format!(
            "{}: Nu_θ = 1.14·Re^½·Pr^0.4·[1 − (θ/90°)³], valid 0–80°, film properties, Re = {}. Here: {}. {}",
            local::FRONT,
            format_sig(re, 3),
            words,
            local::REAR_NOTE
        ))
    );
    if let Some(fl) = local::front(0.0, re, pr).flags.first() {
        let _ = write!(out, r#"<p class="flag">⚠ {}</p>"#, esc(&fl.message()));
    }
    let _ = l;
    Some(out)
}

/// A cross-section of a round wall and its layers to scale (each ring at least 3 px, so a thin
/// wall stays visible), with each face's temperature in `t_unit`: `faces` are the radii from the
/// bore out (m), `temps` the temperatures at them (K).
pub fn section_svg(faces: &[f64], temps: &[f64], t_unit: &'static Unit) -> String {
    let r_out = faces.last().copied().unwrap_or(1.0).max(1e-9);
    let scale = 70.0 / r_out;
    let mut px: Vec<f64> = faces.iter().map(|r| r * scale).collect();
    for i in 1..px.len() {
        if px[i] - px[i - 1] < 3.0 {
            px[i] = px[i - 1] + 3.0;
        }
    }
    let mut g = Svg::new(
        360.0,
        180.0,
        "section",
        "Cross-section of the wall and insulation with the temperature at each face",
    );
    let n = px.len().saturating_sub(1);
    for i in (0..n).rev() {
        let class = if i == 0 { "ring wall" } else { "ring ins" };
        g.circle((80.0, 90.0), (px[i + 1] * 10.0).round() / 10.0, class, "");
    }
    if let Some(p0) = px.first() {
        g.circle((80.0, 90.0), (p0 * 10.0).round() / 10.0, "ring bore", "");
    }
    // Each face's temperature to the right, tied to its ring by a leader line from the ring's
    // right-hand edge; the list beside the drawing names each face in full.
    let rows = temps.len().max(1) as f64;
    for (i, t) in temps.iter().enumerate() {
        let y = 90.0 + (i as f64 - (rows - 1.0) / 2.0) * 30.0;
        let x_ring = 80.0 + px.get(i).copied().unwrap_or(0.0);
        g.line((x_ring, 90.0), (200.0, y - 7.0), "lead");
        g.circle((x_ring, 90.0), 2.5, "dot", "");
        g.text((204.0, y), "tick", "start", &show(*t, t_unit));
    }
    let _ = n;
    g.finish()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::engine::units::unit;

    #[test]
    fn text_never_becomes_markup() {
        assert_eq!(
            esc(r#"<img src=x onerror="a">&'"#),
            "&lt;img src=x onerror=&quot;a&quot;&gt;&amp;&#39;"
        );
    }

    /// The elements of a figure counted by hand: what a browser would build from the string.
    #[test]
    fn a_sweep_figure_is_well_formed_and_holds_its_numbers() {
        let (k, w) = (unit("C").unwrap(), unit("W").unwrap());
        let xs = [0.0, 10.0, 20.0];
        let ys = [100.0, 50.0, 40.0];
        let s = Sweep {
            id: "loss-wind",
            title: "Heat loss against stream speed, 0–20 m/s.",
            x_label: "stream speed",
            x_unit: unit("m/s").unwrap(),
            y_label: "heat loss",
            y_unit: w,
            xs: &xs,
            ys: &ys,
            point: Some((10.0, 50.0)),
            targets: &[("limit <60>", 60.0)],
            width: 480.0,
        };
        let m = sweep_figure(&s);
        assert_eq!(m.matches("<svg").count(), 1);
        assert_eq!(m.matches("</svg>").count(), 1);
        assert_eq!(m.matches(r#"data-point="loss-wind""#).count(), 1);
        // three rows of numbers for a screen reader
        assert_eq!(m.matches("<tr><td>").count(), 3);
        assert!(m.contains("limit &lt;60&gt;") && !m.contains("<60>"));
        assert!(!m.contains("NaN") && !m.contains("inf"));
        let _ = k;
    }

    #[test]
    fn a_section_names_each_face_in_the_unit_shown() {
        let m = section_svg(
            &[0.026, 0.030, 0.080],
            &[423.15, 423.0, 300.0],
            unit("F").unwrap(),
        );
        assert!(m.contains(">302.0 °F<"), "{m}");
        // two rings, the bore, and a dot where each of the three faces' leader starts
        assert_eq!(m.matches("<circle").count(), 6);
        assert_eq!(m.matches(r#"class="lead""#).count(), 3);
    }

    /// Regression (phone walk): the surface curve ran through "dew point + margin" and a high
    /// limit's words. A surface falling steeply with thickness: the high limit's words go to the
    /// right, the low limit's below its line (the curve runs just above it).
    #[test]
    fn limit_words_keep_clear_of_the_curve() {
        let c = unit("C").unwrap();
        let xs: Vec<f64> = (0..=12).map(|i| i as f64 * 0.1 / 12.0).collect();
        let ys: Vec<f64> = xs
            .iter()
            .map(|x| 263.15 + 3.0 + 150.0 * (-x / 0.004).exp())
            .collect();
        let m = sweep_figure(&Sweep {
            id: "surface-thickness",
            title: "Surface",
            x_label: "outer layer thickness",
            x_unit: unit("mm").unwrap(),
            y_label: "surface",
            y_unit: c,
            xs: &xs,
            ys: &ys,
            point: None,
            targets: &[("touch limit", 333.15), ("dew point + margin", 263.15)],
            width: 480.0,
        });
        let at = |w: &str| {
            let i = m.find(&format!(">{w}</text>")).unwrap();
            let open = m[..i].rfind("<text").unwrap();
            m[open..i].to_string()
        };
        assert!(at("touch limit").contains(r#"text-anchor="end""#), "{m}");
        let line_y = |v: f64| -> f64 {
            let f = line_chart(
                &xs.iter().map(|x| x * 1000.0).collect::<Vec<_>>(),
                &ys.iter().map(|y| y - 273.15).collect::<Vec<_>>(),
                &[60.0, -10.0],
                480.0,
                240.0,
            )
            .frame;
            f.to_svg(f.x.0, v).1
        };
        let dew = at("dew point + margin");
        let y: f64 = dew
            .split("y=\"")
            .nth(1)
            .unwrap()
            .split('"')
            .next()
            .unwrap()
            .parse()
            .unwrap();
        assert!(y > line_y(-10.0), "below its line: {dew}");
    }
}
