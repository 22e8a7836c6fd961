//! A heat-map layer for [`crate::Figure`]: values on a rectangular grid of cells, each cell one
//! filled SVG rectangle, with chiwave's own colour scale and a horizontal colour bar in the
//! title row. Used for sky maps on a θ–φ rectangle (plate carrée).
//!
//! Cells are drawn in pixel space after the axis ranges are fixed, so the layer works with
//! the same [`crate::PlotFrame`] as the line figures (hover turns a pixel back into (x, y)).

use crate::render::{fs, perr, rgb, FONT};
use crate::{PlotError, Rgb};
use plotters::prelude::*;
use plotters::style::text_anchor::{HPos, Pos, VPos};
use serde::{Deserialize, Serialize};

/// Values on cells: `values[i][j]` fills `y_edges[i]..y_edges[i+1]` × `x_edges[j]..x_edges[j+1]`.
/// Non-finite values (for example rows not computed yet) are left blank.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Heat {
    pub x_edges: Vec<f64>,
    pub y_edges: Vec<f64>,
    pub values: Vec<Vec<f64>>,
    /// Colour-bar caption including the unit.
    pub label: String,
    /// Logarithmic colour scale (positive values only; the bottom `decades` decades below the
    /// maximum are shown).
    pub log: bool,
    /// Decades shown on a log scale (ignored when linear).
    pub decades: f64,
}

/// chiwave's sequential colour scale: pale sand → amber → coral → plum → deep indigo
/// (our own stops; perceptually ordered by lightness).
const STOPS: [(f64, Rgb); 6] = [
    (0.0, [0xf7, 0xf3, 0xe8]),
    (0.2, [0xf1, 0xd3, 0x8a]),
    (0.42, [0xe3, 0x93, 0x4e]),
    (0.62, [0xc4, 0x4f, 0x5a]),
    (0.82, [0x7c, 0x34, 0x74]),
    (1.0, [0x2a, 0x1f, 0x5c]),
];

/// Colour of the scale at t ∈ [0, 1] (clamped); linear interpolation between the stops.
pub fn colour(t: f64) -> Rgb {
    let t = if t.is_finite() { t.clamp(0.0, 1.0) } else { 0.0 };
    for w in STOPS.windows(2) {
        let ((t0, c0), (t1, c1)) = (w[0], w[1]);
        if t <= t1 {
            let s = if t1 > t0 { (t - t0) / (t1 - t0) } else { 0.0 };
            let mix = |a: u8, b: u8| (a as f64 + s * (b as f64 - a as f64)).round().clamp(0.0, 255.0) as u8;
            return [mix(c0[0], c1[0]), mix(c0[1], c1[1]), mix(c0[2], c1[2])];
        }
    }
    STOPS[STOPS.len() - 1].1
}

impl Heat {
    /// (lo, hi) of the colour scale in scale space (log10 for a log scale), from the finite data.
    pub fn scale(&self) -> Option<(f64, f64)> {
        let mut hi = f64::NEG_INFINITY;
        let mut lo = f64::INFINITY;
        for v in self.values.iter().flatten() {
            if !v.is_finite() || (self.log && *v <= 0.0) {
                continue;
            }
            let a = if self.log { v.log10() } else { *v };
            hi = hi.max(a);
            lo = lo.min(a);
        }
        if lo > hi {
            return None;
        }
        if self.log {
            let d = if self.decades.is_finite() && self.decades > 0.0 { self.decades } else { 4.0 };
            lo = lo.max(hi - d);
        }
        if hi <= lo {
            hi = lo + if lo == 0.0 { 1.0 } else { 1e-9 * lo.abs().max(1e-300) };
        }
        Some((lo, hi))
    }

    /// Position of a value on the scale, in [0, 1]; None for blank cells.
    pub fn position(&self, v: f64, (lo, hi): (f64, f64)) -> Option<f64> {
        if !v.is_finite() {
            return None;
        }
        let a = if self.log {
            if v <= 0.0 {
                return Some(0.0);
            }
            v.log10()
        } else {
            v
        };
        Some(((a - lo) / (hi - lo)).clamp(0.0, 1.0))
    }

    /// The x and y extent of the grid.
    pub fn extent(&self) -> Option<((f64, f64), (f64, f64))> {
        let (x0, x1) = (self.x_edges.first()?, self.x_edges.last()?);
        let (y0, y1) = (self.y_edges.first()?, self.y_edges.last()?);
        Some(((x0.min(*x1), x0.max(*x1)), (y0.min(*y1), y0.max(*y1))))
    }
}

/// Draws the cells. `to_px` maps data (x, y) to backend pixels.
pub(crate) fn draw_cells<DB: DrawingBackend>(
    root: &DrawingArea<DB, plotters::coord::Shift>,
    heat: &Heat,
    to_px: &dyn Fn(f64, f64) -> (i32, i32),
) -> Result<(), PlotError> {
    let Some(sc) = heat.scale() else { return Ok(()) };
    for (i, row) in heat.values.iter().enumerate() {
        let (Some(&ya), Some(&yb)) = (heat.y_edges.get(i), heat.y_edges.get(i + 1)) else { continue };
        for (j, &v) in row.iter().enumerate() {
            let (Some(&xa), Some(&xb)) = (heat.x_edges.get(j), heat.x_edges.get(j + 1)) else { continue };
            let Some(t) = heat.position(v, sc) else { continue };
            let p = to_px(xa, ya);
            let q = to_px(xb, yb);
            // One pixel of overlap hides the hairline seams between neighbouring cells.
            let (l, r) = (p.0.min(q.0), p.0.max(q.0) + 1);
            let (t0, b0) = (p.1.min(q.1), p.1.max(q.1) + 1);
            root.draw(&Rectangle::new([(l, t0), (r, b0)], rgb(colour(t)).filled())).map_err(perr)?;
        }
    }
    Ok(())
}

/// Number formatting for the colour-bar ends (3 significant digits).
fn short(v: f64) -> String {
    if v == 0.0 {
        return "0".into();
    }
    let a = v.abs();
    if (1e-2..1e4).contains(&a) {
        let s = format!("{:.3}", v);
        let s = s.trim_end_matches('0').trim_end_matches('.');
        s.to_string()
    } else {
        format!("{:.2e}", v)
    }
}

/// Draws the colour bar (with its caption and end values) right-aligned in the title row,
/// ending at pixel column `right`.
pub(crate) fn draw_colour_bar<DB: DrawingBackend>(
    root: &DrawingArea<DB, plotters::coord::Shift>,
    heat: &Heat,
    right: i32,
) -> Result<(), PlotError> {
    let Some((lo, hi)) = heat.scale() else { return Ok(()) };
    let (w, h, top) = (200, 10, 8);
    let left = right - w;
    let steps = 40;
    for k in 0..steps {
        let x0 = left + k * w / steps;
        let x1 = left + (k + 1) * w / steps + 1;
        let c = colour((k as f64 + 0.5) / steps as f64);
        root.draw(&Rectangle::new([(x0, top), (x1, top + h)], rgb(c).filled())).map_err(perr)?;
    }
    root.draw(&Rectangle::new([(left, top), (left + w, top + h)], rgb(crate::palette::AXIS).stroke_width(1))).map_err(perr)?;
    let ink = rgb(crate::palette::INK);
    let font = (FONT, fs(11.0)).into_font().color(&ink);
    let (a, b) = if heat.log { (10f64.powf(lo), 10f64.powf(hi)) } else { (lo, hi) };
    let below = top + h + 3;
    root.draw(&Text::new(short(a), (left, below), font.pos(Pos::new(HPos::Left, VPos::Top)))).map_err(perr)?;
    root.draw(&Text::new(short(b), (left + w, below), font.pos(Pos::new(HPos::Right, VPos::Top)))).map_err(perr)?;
    let cap = if heat.log { format!("{}, log", heat.label) } else { heat.label.clone() };
    root.draw(&Text::new(cap, (left + w / 2, below), font.pos(Pos::new(HPos::Center, VPos::Top)))).map_err(perr)?;
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn colour_scale_ends_and_monotone_lightness() {
        assert_eq!(colour(0.0), STOPS[0].1);
        assert_eq!(colour(1.0), STOPS[5].1);
        assert_eq!(colour(-3.0), STOPS[0].1);
        assert_eq!(colour(f64::NAN), STOPS[0].1);
        // Relative luminance (Rec. 709 weights, common practice, no source) falls along the scale.
        let lum = |c: Rgb| 0.2126 * c[0] as f64 + 0.7152 * c[1] as f64 + 0.0722 * c[2] as f64;
        let mut prev = f64::INFINITY;
        for k in 0..=50 {
            let l = lum(colour(k as f64 / 50.0));
            assert!(l < prev, "lightness not decreasing at {k}");
            prev = l;
        }
    }

    #[test]
    fn log_scale_keeps_the_top_decades() {
        let h = Heat {
            x_edges: vec![0.0, 1.0, 2.0],
            y_edges: vec![0.0, 1.0],
            values: vec![vec![1e-9, 10.0]],
            label: "x".into(),
            log: true,
            decades: 3.0,
        };
        let (lo, hi) = h.scale().unwrap();
        assert!((hi - 1.0).abs() < 1e-12 && (lo + 2.0).abs() < 1e-12);
        assert_eq!(h.position(1e-9, (lo, hi)), Some(0.0));
        assert_eq!(h.position(f64::NAN, (lo, hi)), None);
        // log10(1) = 0 is two thirds of the way from −2 to 1 (arithmetic, no source).
        assert!((h.position(1.0, (lo, hi)).unwrap() - 2.0 / 3.0).abs() < 1e-12);
    }
}
