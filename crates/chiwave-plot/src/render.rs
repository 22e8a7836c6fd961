//! The one drawing routine: a [`Figure`] into an SVG string (see [`crate::svg`]: fractional
//! coordinates, standard fonts), and the plot frame the page inverts for its hover readout.
//!
//! # Layout
//! Nothing is placed at a fixed offset: the routine wraps the title to the width, chooses the
//! ticks so that their labels do not touch (estimated extents, [`crate::text`]), sets the left
//! margin from the widest y tick label plus the y-axis title (so the title never overprints
//! the labels), the bottom margin from the x tick labels and title, and the right margin from
//! the last x label, the colour bar and an outside legend. Type sizes follow the figure size
//! gently (×0.8 … ×1.3 of the sizes at 760 × 460 px).
//!
//! # Series, markers, legend
//! Series keep their builders' colours (the Okabe–Ito palette, [`crate::colour`]); a labelled
//! series that would look like an earlier one gets another dash pattern
//! ([`crate::colour::distinct_styles`]). Marker sets get distinct shapes in order (circle,
//! square, diamond, triangles). The legend goes to the corner of the plot that covers no drawn
//! data — the builder's corner first — and, when every corner covers data, outside the plot
//! (below it, or to its right), measured on the drawn pixel geometry ([`crate::layout`]).

use crate::colour::{self, palette};
use crate::heatmap;
use crate::model::*;
use crate::svg::{Anchor, Stroke, Svg, TextSpec};
use crate::text::{ASCENT, DESCENT};
use crate::layout::{legend_entries, draw_legend, place};

/// Type sizes and spacings (px) for one figure size.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Type {
    pub title: f64,
    pub label: f64,
    pub tick: f64,
    pub legend: f64,
    pub small: f64,
    pub pad: f64,
    pub gap: f64,
    pub tick_len: f64,
}

impl Type {
    /// Sizes for a `w` × `h` px figure: 15.5/13.5/12 px (title/axis titles/ticks and legend)
    /// at 760 × 460, scaled by the square root of the smaller size ratio, within ×0.8 … ×1.3.
    pub(crate) fn for_size(w: f64, h: f64) -> Type {
        let k = (w / 760.0).min(h / 460.0).sqrt().clamp(0.8, 1.3);
        Type {
            title: 15.5 * k,
            label: 13.5 * k,
            tick: 12.0 * k,
            legend: 12.0 * k,
            small: 11.0 * k,
            pad: 10.0 * k,
            gap: 5.0 * k,
            tick_len: 6.0 * k,
        }
    }
}

/// Line pitch of text of size `s`.
pub(crate) fn pitch(s: f64) -> f64 {
    1.25 * s
}

/// Height of one line of text (ascent + descent).
pub(crate) fn text_h(s: f64) -> f64 {
    (ASCENT + DESCENT) * s
}

/// Baseline offset that centres a line of digits on a point (half a digit's height ≈ 0.36 em).
pub(crate) fn centre_baseline(s: f64) -> f64 {
    0.36 * s
}

/// The stroke of a series style (dash lengths scale gently with the width).
pub(crate) fn stroke_of(st: &Style) -> Stroke {
    let w = st.width.max(1) as f64;
    let k = (w / 2.0).sqrt().max(0.8);
    let (dash, round): (Vec<f64>, bool) = match st.dash {
        Dash::Solid => (Vec::new(), false),
        Dash::Dashed => (vec![7.0 * k, 4.0 * k], false),
        // Round-capped dots at least 1.6 px long, so thin dotted lines stay visible.
        Dash::Dotted => (vec![(1.6 - w).max(0.01), 3.2 * k + w], true),
        Dash::DashDot => (vec![8.0 * k, 3.0 * k + w, 0.01, 3.0 * k + w], true),
        Dash::LongDash => (vec![15.0 * k, 5.0 * k], false),
        Dash::DashDotDot => (vec![8.0 * k, 3.0 * k + w, 0.01, 2.5 * k + w, 0.01, 3.0 * k + w], true),
    };
    Stroke { color: st.color, width: w, opacity: 1.0, dash, round_cap: round }
}

/// Marker shapes, given to a figure's marker sets in order.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum Shape {
    Circle,
    Square,
    Diamond,
    TriangleUp,
    TriangleDown,
}

const SHAPES: [Shape; 5] = [Shape::Circle, Shape::Square, Shape::Diamond, Shape::TriangleUp, Shape::TriangleDown];

/// The shape of each marker set: distinct shapes in order when a figure has several labelled
/// sets; a set with error bars (measured data) is always a circle.
pub(crate) fn marker_shapes(fig: &Figure) -> Vec<Shape> {
    let mut k = 0;
    fig.markers
        .iter()
        .map(|m| {
            if !m.error_bars.is_empty() {
                return Shape::Circle;
            }
            let s = SHAPES[k % SHAPES.len()];
            k += 1;
            s
        })
        .collect()
}

pub(crate) fn draw_marker(svg: &mut Svg, shape: Shape, x: f64, y: f64, r: f64, color: Rgb) {
    let st = Stroke::solid(color, 2.0);
    let fill = Some((palette::WHITE, 1.0));
    match shape {
        Shape::Circle => svg.circle(x, y, r, fill, Some(&st)),
        Shape::Square => {
            let a = 0.9 * r;
            svg.rect(x - a, y - a, 2.0 * a, 2.0 * a, fill, Some(&st));
        }
        Shape::Diamond => {
            let a = 1.25 * r;
            svg.polygon(&[(x, y - a), (x + a, y), (x, y + a), (x - a, y)], (palette::WHITE, 1.0), Some(&st));
        }
        Shape::TriangleUp => {
            let a = 1.3 * r;
            svg.polygon(&[(x, y - a), (x + 0.87 * a, y + 0.5 * a), (x - 0.87 * a, y + 0.5 * a)], (palette::WHITE, 1.0), Some(&st));
        }
        Shape::TriangleDown => {
            let a = 1.3 * r;
            svg.polygon(&[(x, y + a), (x + 0.87 * a, y - 0.5 * a), (x - 0.87 * a, y - 0.5 * a)], (palette::WHITE, 1.0), Some(&st));
        }
    }
}

/// Range of the finite values in axis space (log10 for log axes, positives only).
fn data_extent(values: impl Iterator<Item = f64>, log: bool) -> Option<(f64, f64)> {
    let mut lo = f64::INFINITY;
    let mut hi = f64::NEG_INFINITY;
    for v in values {
        if !v.is_finite() || (log && v <= 0.0) {
            continue;
        }
        let a = if log { v.log10() } else { v };
        lo = lo.min(a);
        hi = hi.max(a);
    }
    (lo <= hi).then_some((lo, hi))
}

/// Axis-space range for an axis: the fixed range, or the data extent with a little padding.
fn axis_range(axis: &Axis, values: Vec<f64>) -> (f64, f64) {
    if let Some((a, b)) = axis.range {
        let ok = a.is_finite() && b.is_finite() && b > a && (!axis.log || a > 0.0);
        if ok {
            return if axis.log { (a.log10(), b.log10()) } else { (a, b) };
        }
    }
    match data_extent(values.into_iter(), axis.log) {
        Some((lo, hi)) if hi > lo => {
            if axis.log {
                // Pad to a little beyond the data (5% of the span in log space).
                let pad = 0.03 * (hi - lo);
                (lo - pad, hi + pad)
            } else {
                let pad = 0.05 * (hi - lo);
                (lo - pad, hi + pad)
            }
        }
        Some((lo, _)) => {
            let w = if axis.log { 0.5 } else if lo == 0.0 { 1.0 } else { 0.1 * lo.abs() };
            (lo - w, lo + w)
        }
        // No data: one decade (log) or [0, 1] (linear).
        None => (0.0, 1.0),
    }
}

/// Clips the segment p–q (axis space) to the box; Liang–Barsky.
pub(crate) fn clip(p: (f64, f64), q: (f64, f64), b: (f64, f64, f64, f64)) -> Option<((f64, f64), (f64, f64))> {
    let (x0, x1, y0, y1) = b;
    let (dx, dy) = (q.0 - p.0, q.1 - p.1);
    let mut t0 = 0.0f64;
    let mut t1 = 1.0f64;
    for (pk, qk) in [(-dx, p.0 - x0), (dx, x1 - p.0), (-dy, p.1 - y0), (dy, y1 - p.1)] {
        if pk == 0.0 {
            if qk < 0.0 {
                return None;
            }
        } else {
            let r = qk / pk;
            if pk < 0.0 {
                t0 = t0.max(r);
            } else {
                t1 = t1.min(r);
            }
            if t0 > t1 {
                return None;
            }
        }
    }
    // Unclipped ends are returned exactly (p + 1·(q − p) can differ from q in the last bit,
    // which would break a polyline in two at every sample).
    let a = if t0 == 0.0 { p } else { (p.0 + t0 * dx, p.1 + t0 * dy) };
    let b = if t1 == 1.0 { q } else { (p.0 + t1 * dx, p.1 + t1 * dy) };
    Some((a, b))
}

/// Splits a series into drawable polylines in axis space, clipped to the box; gaps (None,
/// non-finite or non-positive values on log axes) break the line.
pub(crate) fn polylines(
    pts: &[Option<(f64, f64)>],
    xlog: bool,
    ylog: bool,
    bx: (f64, f64, f64, f64),
) -> Vec<Vec<(f64, f64)>> {
    let tr = |p: Option<(f64, f64)>| -> Option<(f64, f64)> {
        let (x, y) = p?;
        if !x.is_finite() || !y.is_finite() || (xlog && x <= 0.0) || (ylog && y <= 0.0) {
            return None;
        }
        Some((if xlog { x.log10() } else { x }, if ylog { y.log10() } else { y }))
    };
    let mut out: Vec<Vec<(f64, f64)>> = Vec::new();
    let mut cur: Vec<(f64, f64)> = Vec::new();
    let mut prev: Option<(f64, f64)> = None;
    for &p in pts {
        let a = tr(p);
        match (prev, a) {
            (Some(p0), Some(p1)) => match clip(p0, p1, bx) {
                Some((c0, c1)) => {
                    if cur.is_empty() {
                        cur.push(c0);
                    } else if let Some(&last) = cur.last() {
                        if last != c0 {
                            out.push(std::mem::take(&mut cur));
                            cur.push(c0);
                        }
                    }
                    cur.push(c1);
                }
                None => {
                    if cur.len() > 1 {
                        out.push(std::mem::take(&mut cur));
                    }
                    cur.clear();
                }
            },
            (None, Some(p1)) => {
                if cur.len() > 1 {
                    out.push(std::mem::take(&mut cur));
                }
                cur.clear();
                // A lone point inside the box starts a line.
                if p1.0 >= bx.0 && p1.0 <= bx.1 && p1.1 >= bx.2 && p1.1 <= bx.3 {
                    cur.push(p1);
                }
            }
            (_, None) => {
                if cur.len() > 1 {
                    out.push(std::mem::take(&mut cur));
                }
                cur.clear();
            }
        }
        prev = a;
    }
    if cur.len() > 1 {
        out.push(cur);
    }
    out
}

/// The ranges the figure will show, in axis space: (x0, x1, y0, y1).
pub(crate) fn ranges(fig: &Figure, plot_w: f64, plot_h: f64) -> (f64, f64, f64, f64) {
    let mut xs = Vec::new();
    let mut ys = Vec::new();
    for s in &fig.series {
        for (x, y) in s.points.iter().flatten() {
            xs.push(*x);
            ys.push(*y);
        }
    }
    for m in &fig.markers {
        for (x, y) in &m.points {
            xs.push(*x);
            ys.push(*y);
        }
        for e in &m.error_bars {
            ys.push(e.lo);
            ys.push(e.hi);
        }
    }
    let (mut x0, mut x1) = axis_range(&fig.x, xs);
    let (mut y0, mut y1) = axis_range(&fig.y, ys);
    if fig.equal_aspect && !fig.x.log && !fig.y.log {
        // Widen the axis with fewer data units per pixel.
        let ux = (x1 - x0) / plot_w;
        let uy = (y1 - y0) / plot_h;
        if ux > uy {
            let c = 0.5 * (y0 + y1);
            let h = 0.5 * ux * plot_h;
            y0 = c - h;
            y1 = c + h;
        } else {
            let c = 0.5 * (x0 + x1);
            let h = 0.5 * uy * plot_w;
            x0 = c - h;
            x1 = c + h;
        }
    }
    (x0, x1, y0, y1)
}

// ---------------------------------------------------------------------------------------------
// Drawing

/// Draws a figure: SVG text plus the plot frame.
///
/// # Errors
/// None in practice ([`PlotError`] is kept in the signature for callers; the SVG is written
/// into a `String`).
pub fn render(fig: &Figure) -> Result<(String, PlotFrame), PlotError> {
    let (w, h) = (fig.width.max(200), fig.height.max(160));
    let ty = Type::for_size(w as f64, h as f64);
    let styles = colour::distinct_styles(&fig.series);
    let shapes = marker_shapes(fig);
    let entries = legend_entries(fig, &styles, &shapes);
    let (lay, inside_legend) = place(fig, ty, &entries);
    let (x0, x1, y0, y1) = lay.r;
    let p = lay.plot;
    let frame = PlotFrame {
        left: p.x,
        top: p.y,
        width: p.w,
        height: p.h,
        x_min: if fig.x.log { 10f64.powf(x0) } else { x0 },
        x_max: if fig.x.log { 10f64.powf(x1) } else { x1 },
        y_min: if fig.y.log { 10f64.powf(y0) } else { y0 },
        y_max: if fig.y.log { 10f64.powf(y1) } else { y1 },
        x_log: fig.x.log,
        y_log: fig.y.log,
        svg_width: w,
        svg_height: h,
    };
    let bx = (x0, x1, y0, y1);
    let tx = |v: f64| if fig.x.log { v.log10() } else { v };
    let tyf = |v: f64| if fig.y.log { v.log10() } else { v };
    let mut svg = Svg::new(w, h);
    svg.rect(0.0, 0.0, w as f64, h as f64, Some((palette::WHITE, 1.0)), None);

    // Bands first (under everything).
    for band in &fig.bands {
        let bx0 = if fig.x.log && band.x0 <= 0.0 { f64::NEG_INFINITY } else { tx(band.x0) };
        let bx1 = if fig.x.log && band.x1 <= 0.0 { f64::NEG_INFINITY } else { tx(band.x1) };
        let (a, b2) = (bx0.max(x0), bx1.min(x1));
        if a < b2 {
            let (pa, pb) = (lay.px(a), lay.px(b2));
            svg.rect(pa, p.y, pb - pa, p.h, Some((band.color, band.opacity.clamp(0.0, 1.0))), None);
        }
    }
    // Heat-map cells (over the bands, under the grid and the series).
    if let Some(heat) = &fig.heat {
        let to_px = |x: f64, y: f64| lay.to_px((tx(x).clamp(x0, x1), tyf(y).clamp(y0, y1)));
        heatmap::draw_cells(&mut svg, heat, &to_px);
    }
    // Grid lines at major ticks (light over a heat map).
    let grid = if fig.heat.is_some() {
        Stroke { color: palette::WHITE, width: 0.8, opacity: 0.45, dash: Vec::new(), round_cap: false }
    } else {
        Stroke::solid(palette::GRID, 0.8)
    };
    for t in lay.xt.ticks.iter().filter(|t| t.major) {
        let x = lay.px(t.at);
        svg.path(&[(x, p.y), (x, p.bottom())], &grid);
    }
    for t in lay.yt.ticks.iter().filter(|t| t.major) {
        let y = lay.py(t.at);
        svg.path(&[(p.x, y), (p.right(), y)], &grid);
    }

    // Series: fills, then strokes.
    for (s, st) in fig.series.iter().zip(&styles) {
        let stroke = stroke_of(st);
        for line in polylines(&s.points, fig.x.log, fig.y.log, bx) {
            let px: Vec<(f64, f64)> = line.iter().map(|q| lay.to_px(*q)).collect();
            if let Some((fc, op)) = st.fill {
                svg.polygon(&px, (fc, op.clamp(0.0, 1.0)), None);
            }
            svg.path(&px, &stroke);
        }
    }

    // Markers and error bars.
    let inside = |x: f64, y: f64| x.is_finite() && y.is_finite() && x >= x0 && x <= x1 && y >= y0 && y <= y1;
    for (m, sh) in fig.markers.iter().zip(&shapes) {
        let st = Stroke::solid(m.color, 1.6);
        for e in &m.error_bars {
            let (ex, lo, hi) = (tx(e.x), tyf(e.lo), tyf(e.hi));
            if let Some((a, b)) = (ex.is_finite() && lo.is_finite() && hi.is_finite()).then(|| clip((ex, lo), (ex, hi), bx)).flatten() {
                let (pa, pb) = (lay.to_px(a), lay.to_px(b));
                svg.path(&[pa, pb], &st);
                for end in [pa, pb] {
                    svg.path(&[(end.0 - 4.5, end.1), (end.0 + 4.5, end.1)], &st);
                }
            }
        }
        for &(x, y) in &m.points {
            let (ax, ay) = (tx(x), tyf(y));
            if inside(ax, ay) {
                let (px, py) = lay.to_px((ax, ay));
                draw_marker(&mut svg, *sh, px, py, m.radius.max(2) as f64, m.color);
            }
        }
    }

    // Frame, ticks, tick labels.
    let axis = Stroke::solid(palette::AXIS, 1.0);
    svg.rect(p.x, p.y, p.w, p.h, None, Some(&axis));
    let tick_text = |svg: &mut Svg, x: f64, y: f64, s: &str, anchor: Anchor| {
        svg.text(&TextSpec { x, y, text: s, size: ty.tick, anchor, bold: false, rotate: 0.0, color: palette::INK });
    };
    for tk in &lay.xt.ticks {
        let x = lay.px(tk.at);
        let len = if tk.major { ty.tick_len } else { 0.55 * ty.tick_len };
        svg.path(&[(x, p.bottom()), (x, p.bottom() + len)], &axis);
        if tk.major && !tk.label.is_empty() {
            tick_text(&mut svg, x, lay.xtick_base(), &tk.label, Anchor::Middle);
        }
    }
    for tk in &lay.yt.ticks {
        let y = lay.py(tk.at);
        let len = if tk.major { ty.tick_len } else { 0.55 * ty.tick_len };
        svg.path(&[(p.x - len, y), (p.x, y)], &axis);
        if tk.major && !tk.label.is_empty() {
            tick_text(&mut svg, p.x - ty.tick_len - ty.gap, y + centre_baseline(ty.tick), &tk.label, Anchor::End);
        }
    }
    if let Some(f) = &lay.xt.factor {
        tick_text(&mut svg, p.right(), lay.xlab_base(), f, Anchor::End);
    }
    if let Some(f) = &lay.yt.factor {
        tick_text(&mut svg, p.x, p.y - ty.gap - DESCENT * ty.tick, f, Anchor::Start);
    }

    // Axis titles and the figure title.
    let xl_centre = 0.5 * (p.x + lay.xlab_right());
    for (k, line) in lay.xlab.iter().enumerate() {
        svg.text(&TextSpec {
            x: xl_centre,
            y: lay.xlab_base() + k as f64 * pitch(ty.label),
            text: line,
            size: ty.label,
            anchor: Anchor::Middle,
            bold: false,
            rotate: 0.0,
            color: palette::INK,
        });
    }
    let yc = p.y + 0.5 * p.h;
    for (k, line) in lay.ylab.iter().enumerate() {
        svg.text(&TextSpec {
            x: ty.pad + ASCENT * ty.label + k as f64 * pitch(ty.label),
            y: yc,
            text: line,
            size: ty.label,
            anchor: Anchor::Middle,
            bold: false,
            rotate: -90.0,
            color: palette::INK,
        });
    }
    for (k, line) in lay.title.iter().enumerate() {
        svg.text(&TextSpec {
            x: ty.pad,
            y: ty.pad + ASCENT * ty.title + k as f64 * pitch(ty.title),
            text: line,
            size: ty.title,
            anchor: Anchor::Start,
            bold: true,
            rotate: 0.0,
            color: palette::INK,
        });
    }

    if let (Some(heat), Some(bar)) = (&fig.heat, &lay.bar) {
        heatmap::draw_colour_bar(&mut svg, heat, bar, &ty, p);
    }
    if let Some((b, a)) = &inside_legend {
        draw_legend(&mut svg, &lay.ty, b, a, true);
    }
    if let Some((b, a)) = &lay.outside {
        // The layout's type: a long legend on a small figure may use a smaller legend size.
        draw_legend(&mut svg, &lay.ty, b, a, false);
    }
    Ok((svg.finish(), frame))
}

/// Draws a figure and collects the hover data of its labelled series.
///
/// # Errors
/// As [`render`].
pub fn render_for_page(fig: &Figure) -> Result<Rendered, PlotError> {
    let (svg, frame) = render(fig)?;
    let series = fig
        .series
        .iter()
        .filter(|s| !s.label.is_empty())
        .map(|s| HoverSeries {
            label: s.label.clone(),
            color: hex(s.style.color),
            x: s.points.iter().map(|p| p.map(|p| p.0)).collect(),
            y: s.points.iter().map(|p| p.map(|p| p.1)).collect(),
        })
        .collect();
    Ok(Rendered {
        title: fig.title.clone(),
        x_label: fig.x.label.clone(),
        y_label: fig.y.label.clone(),
        svg,
        frame,
        series,
        heat: fig.heat.clone(),
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn sample(xlog: bool, ylog: bool) -> Figure {
        let mut f = Figure::new(
            "Test figure",
            Axis { label: "impact parameter b [M]".into(), log: xlog, range: Some((1.0, 1000.0)) },
            Axis { label: "deflection α [rad]".into(), log: ylog, range: Some((1e-3, 10.0)) },
        );
        f.series.push(Series {
            label: "exact".into(),
            points: vec![Some((2.0, 2.0)), Some((10.0, 0.5)), None, Some((100.0, 0.04)), Some((900.0, 0.0044))],
            style: Style::line(palette::TEAL, 2),
        });
        f.bands.push(Band { label: "captured".into(), x0: 0.0, x1: 5.196, color: palette::SAND, opacity: 0.8 });
        f.markers.push(Markers {
            label: "this request".into(),
            points: vec![(10.0, 0.5)],
            error_bars: vec![ErrorBar { x: 10.0, y: 0.5, lo: 0.4, hi: 0.6 }],
            color: palette::CORAL,
            radius: 4,
        });
        f
    }

    /// Extracts the attributes of the first `<rect>` drawn with the frame stroke colour.
    fn frame_rect(svg: &str) -> (f64, f64, f64, f64) {
        let stroke = format!("stroke=\"{}\"", hex(palette::AXIS).to_uppercase());
        for tag in svg.split('<').filter(|t| t.starts_with("rect")) {
            if tag.to_uppercase().contains(&stroke.to_uppercase()) && tag.contains("fill=\"none\"") {
                let get = |k: &str| -> f64 {
                    let key = format!(" {k}=\"");
                    let i = tag.find(&key).map(|i| i + key.len()).unwrap_or(0);
                    tag[i..].split('"').next().and_then(|s| s.parse().ok()).unwrap_or(f64::NAN)
                };
                return (get("x"), get("y"), get("width"), get("height"));
            }
        }
        panic!("no frame rect in svg");
    }

    #[test]
    fn svg_has_labels_title_and_legend() {
        let (svg, _) = render(&sample(true, true)).unwrap();
        assert!(svg.starts_with("<svg"));
        for needle in ["Test figure", "impact parameter b [M]", "deflection α [rad]", "exact", "captured", "this request"] {
            assert!(svg.contains(needle), "missing {needle}");
        }
        // decade labels on the log axes
        assert!(svg.contains(">\n100\n</text>") && svg.contains(">\n0.01\n</text>"), "decade tick labels");
    }

    #[test]
    fn frame_maps_corners_and_matches_drawn_rectangle() {
        for (xl, yl) in [(false, false), (true, true), (true, false)] {
            let fig = sample(xl, yl);
            let (svg, fr) = render(&fig).unwrap();
            // corners of the data range ↔ corners of the plot area
            let (px, py) = fr.to_pixel(1.0, 10.0);
            assert!((px - fr.left).abs() < 1e-9 && (py - fr.top).abs() < 1e-9);
            let (px, py) = fr.to_pixel(1000.0, 1e-3);
            assert!((px - fr.left - fr.width).abs() < 1e-9 && (py - fr.top - fr.height).abs() < 1e-9);
            let (x, y) = fr.to_data(fr.left + fr.width, fr.top);
            assert!((x - 1000.0).abs() < 1e-9 * 1000.0 && (y - 10.0).abs() < 1e-9 * 10.0);
            // independent check: the frame rectangle that was actually drawn in the SVG
            let (rx, ry, rw, rh) = frame_rect(&svg);
            assert!((rx - fr.left).abs() <= 1.0 && (ry - fr.top).abs() <= 1.0, "{rx},{ry} vs {fr:?}");
            assert!((rw - fr.width).abs() <= 1.0 && (rh - fr.height).abs() <= 1.0, "{rw},{rh} vs {fr:?}");
        }
    }

    #[test]
    fn log_midpoint_inverts_to_geometric_mean() {
        let (_, fr) = render(&sample(true, true)).unwrap();
        let (x, _) = fr.to_data(fr.left + fr.width / 2.0, fr.top);
        // geometric mean of 1 and 1000, common practice, no source
        assert!((x - 1000f64.sqrt()).abs() < 1e-9 * 31.6);
    }

    #[test]
    fn a_curve_far_from_the_origin_stays_one_path() {
        // x ~ 1e7 (seconds), y ~ 1e-25 (strain): p + (q − p) ≠ q in floating point, yet
        // consecutive unclipped segments must join into one polyline.
        let pts: Vec<Option<(f64, f64)>> = (0..800).map(|k| Some((-1.0e7 + 2.5e4 * k as f64 + 0.1, 1e-25 * (k as f64 * 0.01).sin()))).collect();
        let lines = polylines(&pts, false, false, (-2e7, 2e7, -1e-24, 1e-24));
        assert_eq!(lines.len(), 1);
        assert_eq!(lines[0].len(), 800);
    }

    #[test]
    fn gaps_and_clipping() {
        let pts = vec![Some((0.0, 0.0)), Some((2.0, 2.0)), None, Some((0.5, 0.5)), Some((0.6, 0.6))];
        let lines = polylines(&pts, false, false, (0.0, 1.0, 0.0, 1.0));
        assert_eq!(lines.len(), 2);
        assert_eq!(lines[0], vec![(0.0, 0.0), (1.0, 1.0)]);
        assert_eq!(lines[1], vec![(0.5, 0.5), (0.6, 0.6)]);
        // non-positive values are gaps on a log axis
        let lines = polylines(&[Some((1.0, 1.0)), Some((2.0, -1.0)), Some((3.0, 1.0))], true, true, (-1.0, 1.0, -1.0, 1.0));
        assert!(lines.is_empty());
    }

    #[test]
    fn equal_aspect_has_equal_units_per_pixel() {
        let mut f = Figure::new("rays", Axis::linear("x [M]"), Axis::linear("y [M]"));
        f.series.push(Series { label: String::new(), points: vec![Some((-20.0, -2.0)), Some((20.0, 2.0))], style: Style::line(palette::TEAL, 1) });
        f.equal_aspect = true;
        let (_, fr) = render(&f).unwrap();
        let ux = (fr.x_max - fr.x_min) / fr.width;
        let uy = (fr.y_max - fr.y_min) / fr.height;
        assert!((ux / uy - 1.0).abs() < 0.02, "{ux} {uy}");
    }

    #[test]
    fn empty_and_degenerate_figures_still_render() {
        let f = Figure::new("empty", Axis::log("x"), Axis::linear("y"));
        let (svg, fr) = render(&f).unwrap();
        assert!(svg.contains("empty") && fr.width > 0.0);
        let mut g = Figure::new("nan", Axis::linear("x"), Axis::linear("y"));
        g.series.push(Series { label: "s".into(), points: vec![Some((f64::NAN, 1.0)), Some((1.0, 1.0))], style: Style::line(palette::INK, 1) });
        assert!(render(&g).is_ok());
    }
}
