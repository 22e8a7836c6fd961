//! A heat-map layer for [`crate::Figure`]: values on a rectangular grid of cells, each cell one
//! filled SVG rectangle, coloured with the perceptually uniform scale of
//! [`crate::colour::sequential`] (low values dark, high values bright), with a vertical colour
//! bar right of the plot: the scale, its ticks (decades on a log scale) and its caption, the
//! quantity with its unit. Used for sky maps on a θ–φ rectangle.
//!
//! Cells are drawn in pixel space after the axis ranges are fixed, so the layer works with
//! the same [`crate::PlotFrame`] as the line figures (hover turns a pixel back into (x, y)).

use crate::layout::Bar;
use crate::render::{pitch, Type};
use crate::svg::{Anchor, Stroke, Svg, TextSpec};
use crate::text::{self, Bounds, ASCENT, DESCENT};
use crate::{palette, ticks, Rgb};
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

/// Colour of the scale at t ∈ [0, 1] (clamped; NaN is the low end): the sequential scale of
/// [`crate::colour::sequential`], dark at 0 and bright at 1.
pub fn colour(t: f64) -> Rgb {
    crate::colour::sequential(t)
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

/// Draws the cells. `to_px` maps data (x, y) to pixels. Each cell reaches half a pixel into
/// its right and lower neighbours, which hides the hairline seams anti-aliasing leaves between
/// exactly adjacent rectangles.
pub(crate) fn draw_cells(svg: &mut Svg, heat: &Heat, to_px: &dyn Fn(f64, f64) -> (f64, f64)) {
    let Some(sc) = heat.scale() else { return };
    for (i, row) in heat.values.iter().enumerate() {
        let (Some(&ya), Some(&yb)) = (heat.y_edges.get(i), heat.y_edges.get(i + 1)) else { continue };
        for (j, &v) in row.iter().enumerate() {
            let (Some(&xa), Some(&xb)) = (heat.x_edges.get(j), heat.x_edges.get(j + 1)) else { continue };
            let Some(t) = heat.position(v, sc) else { continue };
            let p = to_px(xa, ya);
            let q = to_px(xb, yb);
            let (l, r) = (p.0.min(q.0), p.0.max(q.0) + 0.5);
            let (t0, b0) = (p.1.min(q.1), p.1.max(q.1) + 0.5);
            svg.rect(l, t0, r - l, b0 - t0, Some((colour(t), 1.0)), None);
        }
    }
}

/// The colour bar's ticks and caption for a bar `len` px tall.
pub(crate) fn bar_layout(heat: &Heat, ty: &Type, len: f64) -> Bar {
    let size = ty.small;
    let ticks = match heat.scale() {
        Some((lo, hi)) => {
            let target = ((len / 55.0).round() as usize).clamp(2, 8);
            let fits = |ts: &[ticks::Tick]| {
                let lab: Vec<&ticks::Tick> = ts.iter().filter(|t| t.major && !t.label.is_empty()).collect();
                lab.windows(2).all(|w| (w[1].at - w[0].at) / (hi - lo) * len >= 1.7 * size)
            };
            ticks::fitted(lo, hi, heat.log, target, &fits)
        }
        None => ticks::TickSet::default(),
    };
    let label_w = ticks.labelled().map(|t| text::width(&t.label, size)).fold(0.0, f64::max);
    let caption = text::wrap(&heat.label, ty.tick, len, 2, false);
    Bar { x: 0.0, width: 0.95 * ty.tick, ticks, caption, label_w }
}

/// Width from the plot's right edge to the end of the colour bar's caption.
pub(crate) fn bar_block_width(bar: &Bar, ty: &Type) -> f64 {
    2.2 * ty.gap + bar.width + 0.7 * ty.tick_len + ty.gap + bar.label_w + 1.6 * ty.gap + bar.caption.len() as f64 * pitch(ty.tick)
}

/// Draws the colour bar beside the plot area `plot`: the scale from low (bottom) to high
/// (top), its ticks and labels, and the caption (quantity and unit) reading upwards.
pub(crate) fn draw_colour_bar(svg: &mut Svg, heat: &Heat, bar: &Bar, ty: &Type, plot: Bounds) {
    let Some((lo, hi)) = heat.scale() else { return };
    let (x, w, top, h) = (bar.x, bar.width, plot.y, plot.h);
    let steps = 128;
    for k in 0..steps {
        let y1 = top + h - k as f64 * h / steps as f64;
        let y0 = top + h - (k + 1) as f64 * h / steps as f64;
        let c = colour((k as f64 + 0.5) / steps as f64);
        // Half a pixel of overlap hides the seams between slices.
        svg.rect(x, y0, w, (y1 - y0) + if k == 0 { 0.0 } else { 0.5 }, Some((c, 1.0)), None);
    }
    let axis = Stroke::solid(palette::AXIS, 1.0);
    svg.rect(x, top, w, h, None, Some(&axis));
    let size = ty.small;
    let at_y = |a: f64| top + h - (a - lo) / (hi - lo) * h;
    let tl = 0.7 * ty.tick_len;
    for t in &bar.ticks.ticks {
        let y = at_y(t.at);
        let len = if t.major { tl } else { 0.55 * tl };
        svg.path(&[(x + w, y), (x + w + len, y)], &axis);
        if t.major && !t.label.is_empty() {
            svg.text(&TextSpec {
                x: x + w + tl + ty.gap,
                y: y + 0.36 * size,
                text: &t.label,
                size,
                anchor: Anchor::Start,
                bold: false,
                rotate: 0.0,
                color: palette::INK,
            });
        }
    }
    if let Some(f) = &bar.ticks.factor {
        svg.text(&TextSpec { x, y: top - ty.gap - DESCENT * size, text: f, size, anchor: Anchor::Start, bold: false, rotate: 0.0, color: palette::INK });
    }
    let cx = x + w + tl + ty.gap + bar.label_w + 1.6 * ty.gap;
    for (k, line) in bar.caption.iter().enumerate() {
        svg.text(&TextSpec {
            x: cx + ASCENT * ty.tick + k as f64 * pitch(ty.tick),
            y: top + 0.5 * h,
            text: line,
            size: ty.tick,
            anchor: Anchor::Middle,
            bold: false,
            rotate: -90.0,
            color: palette::INK,
        });
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn colour_scale_ends_and_monotone_lightness() {
        // The scale runs from dark (low values) to bright (high values): lightness L* of the
        // drawn colours rises along it (CIELAB, CIE 15:2004; see crate::colour for the scale's
        // own tests of uniformity).
        assert_eq!(colour(-3.0), colour(0.0));
        assert_eq!(colour(f64::NAN), colour(0.0));
        assert_eq!(colour(7.0), colour(1.0));
        let mut prev = f64::NEG_INFINITY;
        for k in 0..=50 {
            let l = crate::colour::rgb_to_lab(colour(k as f64 / 50.0))[0];
            assert!(l > prev, "lightness not increasing at {k}");
            prev = l;
        }
        assert!(crate::colour::rgb_to_lab(colour(0.0))[0] < 20.0 && crate::colour::rgb_to_lab(colour(1.0))[0] > 90.0);
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

    #[test]
    fn colour_bar_has_labelled_decades_on_a_log_scale() {
        let h = Heat { x_edges: vec![0.0, 1.0], y_edges: vec![0.0, 1.0], values: vec![vec![3e-9, 2e-5]], label: "dE/dΩ [M]".into(), log: true, decades: 4.0 };
        let ty = Type::for_size(760.0, 440.0);
        let bar = bar_layout(&h, &ty, 300.0);
        let labels: Vec<&str> = bar.ticks.labelled().map(|t| t.label.as_str()).collect();
        assert!(labels.len() >= 2, "{labels:?}");
        assert!(labels.contains(&"10⁻⁶") && labels.contains(&"10⁻⁷"), "{labels:?}");
        assert_eq!(bar.caption, vec!["dE/dΩ [M]".to_string()]);
    }
}
