//! A small SVG writer with fractional coordinates.
//!
//! Every coordinate is written with two decimals (1/100 px, trailing zeros dropped), so a
//! curve keeps its true shape at any zoom: no stair steps from rounding to whole pixels. The
//! document is plain SVG 1.1 (paths, rectangles, circles, polygons, text; no ids, scripts,
//! filters or CSS), which browsers, vector editors and PDF converters all read.

use crate::text::FONT_STACK;
use crate::Rgb;
use std::fmt::Write;

/// A number for an attribute: two decimals, trailing zeros and "-0" removed.
pub fn num(v: f64) -> String {
    if !v.is_finite() {
        return "0".into();
    }
    let s = format!("{:.2}", v);
    let s = if s.contains('.') { s.trim_end_matches('0').trim_end_matches('.').to_string() } else { s };
    if s == "-0" {
        "0".into()
    } else {
        s
    }
}

/// `#rrggbb`.
fn hex(c: Rgb) -> String {
    format!("#{:02x}{:02x}{:02x}", c[0], c[1], c[2])
}

/// Text with `&`, `<`, `>`, `"` escaped for XML.
pub fn escape(s: &str) -> String {
    let mut out = String::with_capacity(s.len());
    for c in s.chars() {
        match c {
            '&' => out.push_str("&amp;"),
            '<' => out.push_str("&lt;"),
            '>' => out.push_str("&gt;"),
            '"' => out.push_str("&quot;"),
            // Control characters are not allowed in XML 1.0 text.
            c if (c as u32) < 0x20 && c != '\t' && c != '\n' => out.push(' '),
            c => out.push(c),
        }
    }
    out
}

/// Horizontal text anchor.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Anchor {
    Start,
    Middle,
    End,
}

/// How a path is stroked.
#[derive(Debug, Clone, PartialEq)]
pub struct Stroke {
    pub color: Rgb,
    pub width: f64,
    pub opacity: f64,
    /// Dash lengths in px (empty = solid).
    pub dash: Vec<f64>,
    /// Round caps (dots) instead of butt caps.
    pub round_cap: bool,
}

impl Stroke {
    pub fn solid(color: Rgb, width: f64) -> Self {
        Stroke { color, width, opacity: 1.0, dash: Vec::new(), round_cap: false }
    }
}

/// One text element: `(x, y)` is the baseline point at the anchor; `rotate` in degrees
/// (−90: reads bottom to top) about that point.
#[derive(Debug, Clone, PartialEq)]
pub struct TextSpec<'a> {
    pub x: f64,
    pub y: f64,
    pub text: &'a str,
    pub size: f64,
    pub anchor: Anchor,
    pub bold: bool,
    pub rotate: f64,
    pub color: Rgb,
}

/// An SVG document being written.
pub struct Svg {
    out: String,
}

impl Svg {
    /// Opens a document of `w` × `h` px (the viewBox has the same size).
    pub fn new(w: u32, h: u32) -> Self {
        let mut out = String::with_capacity(16 * 1024);
        let _ = write!(
            out,
            r#"<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="{w}" height="{h}" viewBox="0 0 {w} {h}" font-family="{}">"#,
            escape(FONT_STACK)
        );
        out.push('\n');
        Svg { out }
    }

    /// A rectangle, filled (colour, opacity) and/or stroked.
    pub fn rect(&mut self, x: f64, y: f64, w: f64, h: f64, fill: Option<(Rgb, f64)>, stroke: Option<&Stroke>) {
        let _ = write!(self.out, r#"<rect x="{}" y="{}" width="{}" height="{}""#, num(x), num(y), num(w.max(0.0)), num(h.max(0.0)));
        self.paint(fill, stroke);
        self.out.push_str("/>\n");
    }

    /// A polyline as a path (`M x y L x y …`).
    pub fn path(&mut self, pts: &[(f64, f64)], stroke: &Stroke) {
        if pts.len() < 2 {
            return;
        }
        self.out.push_str(r#"<path d=""#);
        for (i, (x, y)) in pts.iter().enumerate() {
            let _ = write!(self.out, "{}{} {}", if i == 0 { "M" } else { " L" }, num(*x), num(*y));
        }
        self.out.push('"');
        self.paint(None, Some(stroke));
        self.out.push_str(r#" stroke-linejoin="round"/>"#);
        self.out.push('\n');
    }

    /// A closed filled polygon.
    pub fn polygon(&mut self, pts: &[(f64, f64)], fill: (Rgb, f64), stroke: Option<&Stroke>) {
        if pts.len() < 3 {
            return;
        }
        self.out.push_str(r#"<polygon points=""#);
        for (i, (x, y)) in pts.iter().enumerate() {
            let _ = write!(self.out, "{}{},{}", if i == 0 { "" } else { " " }, num(*x), num(*y));
        }
        self.out.push('"');
        self.paint(Some(fill), stroke);
        self.out.push_str("/>\n");
    }

    /// A circle.
    pub fn circle(&mut self, cx: f64, cy: f64, r: f64, fill: Option<(Rgb, f64)>, stroke: Option<&Stroke>) {
        let _ = write!(self.out, r#"<circle cx="{}" cy="{}" r="{}""#, num(cx), num(cy), num(r));
        self.paint(fill, stroke);
        self.out.push_str("/>\n");
    }

    /// A text element. The text sits on its own line between the tags (whitespace around it is
    /// collapsed by every SVG reader).
    pub fn text(&mut self, t: &TextSpec) {
        let anchor = match t.anchor {
            Anchor::Start => "start",
            Anchor::Middle => "middle",
            Anchor::End => "end",
        };
        let _ = write!(
            self.out,
            r#"<text x="{}" y="{}" font-size="{}" text-anchor="{anchor}" fill="{}""#,
            num(t.x),
            num(t.y),
            num(t.size),
            hex(t.color)
        );
        if t.bold {
            self.out.push_str(r#" font-weight="bold""#);
        }
        if t.rotate != 0.0 {
            let _ = write!(self.out, r#" transform="rotate({} {} {})""#, num(t.rotate), num(t.x), num(t.y));
        }
        let _ = write!(self.out, ">\n{}\n</text>\n", escape(t.text));
    }

    fn paint(&mut self, fill: Option<(Rgb, f64)>, stroke: Option<&Stroke>) {
        match fill {
            Some((c, op)) => {
                let _ = write!(self.out, r#" fill="{}""#, hex(c));
                if op < 1.0 {
                    let _ = write!(self.out, r#" fill-opacity="{}""#, num3(op.clamp(0.0, 1.0)));
                }
            }
            None => self.out.push_str(r#" fill="none""#),
        }
        if let Some(s) = stroke {
            let _ = write!(self.out, r#" stroke="{}" stroke-width="{}""#, hex(s.color), num(s.width));
            if s.opacity < 1.0 {
                let _ = write!(self.out, r#" stroke-opacity="{}""#, num3(s.opacity.clamp(0.0, 1.0)));
            }
            if !s.dash.is_empty() {
                let d: Vec<String> = s.dash.iter().map(|v| num(*v)).collect();
                let _ = write!(self.out, r#" stroke-dasharray="{}""#, d.join(" "));
            }
            if s.round_cap {
                self.out.push_str(r#" stroke-linecap="round""#);
            }
        }
    }

    /// Closes the document.
    pub fn finish(mut self) -> String {
        self.out.push_str("</svg>\n");
        self.out
    }
}

/// Three decimals for opacities.
fn num3(v: f64) -> String {
    let s = format!("{:.3}", v);
    s.trim_end_matches('0').trim_end_matches('.').to_string()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn numbers_keep_two_decimals() {
        assert_eq!(num(12.345), "12.35");
        assert_eq!(num(12.3), "12.3");
        assert_eq!(num(12.0), "12");
        assert_eq!(num(-0.001), "0");
        assert_eq!(num(f64::NAN), "0");
    }

    #[test]
    fn text_is_escaped() {
        let mut s = Svg::new(10, 10);
        s.text(&TextSpec { x: 1.0, y: 2.0, text: "a < b & \"c\"", size: 12.0, anchor: Anchor::Start, bold: false, rotate: 0.0, color: [0, 0, 0] });
        let out = s.finish();
        assert!(out.contains("a &lt; b &amp; &quot;c&quot;"), "{out}");
    }
}
