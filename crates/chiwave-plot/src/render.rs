//! The one drawing routine: a [`Figure`] into an SVG string with plotters' SVG backend, and the
//! plot frame the page inverts for its hover readout.

use crate::model::*;
use crate::{heatmap, ticks};
use plotters::prelude::*;
use plotters::style::text_anchor::{HPos, Pos, VPos};

pub(crate) fn perr<E: std::fmt::Debug>(e: E) -> PlotError {
    PlotError(format!("{e:?}"))
}

pub(crate) fn rgb(c: Rgb) -> RGBColor {
    RGBColor(c[0], c[1], c[2])
}

// Layout in pixels (fixed; text is never measured).
const MARGIN_LEFT: i32 = 86;
const MARGIN_RIGHT: i32 = 24;
const MARGIN_TOP: i32 = 46;
const MARGIN_BOTTOM: i32 = 62;
pub(crate) const FONT: &str = "sans-serif";

/// plotters' SVG backend writes `font-size = size / 1.24`; this gives `px` on the page.
pub(crate) fn fs(px: f64) -> f64 {
    px * 1.24
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
fn clip(p: (f64, f64), q: (f64, f64), b: (f64, f64, f64, f64)) -> Option<((f64, f64), (f64, f64))> {
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
    Some(((p.0 + t0 * dx, p.1 + t0 * dy), (p.0 + t1 * dx, p.1 + t1 * dy)))
}

/// Splits a series into drawable polylines in axis space, clipped to the box; gaps (None,
/// non-finite or non-positive values on log axes) break the line.
fn polylines(
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
                        if (last.0 - c0.0).abs() > 1e-12 || (last.1 - c0.1).abs() > 1e-12 {
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
fn ranges(fig: &Figure, plot_w: f64, plot_h: f64) -> (f64, f64, f64, f64) {
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

/// Draws a figure: SVG text plus the plot frame.
///
/// # Errors
/// [`PlotError`] only if the SVG backend fails to write (it writes into a `String`).
pub fn render(fig: &Figure) -> Result<(String, PlotFrame), PlotError> {
    let (w, h) = (fig.width.max(200), fig.height.max(160));
    let plot_w = (w as i32 - MARGIN_LEFT - MARGIN_RIGHT) as f64;
    let plot_h = (h as i32 - MARGIN_TOP - MARGIN_BOTTOM) as f64;
    let (x0, x1, y0, y1) = ranges(fig, plot_w, plot_h);
    let mut svg = String::new();
    let frame;
    {
        let root = SVGBackend::with_string(&mut svg, (w, h)).into_drawing_area();
        root.fill(&WHITE).map_err(perr)?;
        let mut chart = ChartBuilder::on(&root)
            .margin_left(MARGIN_LEFT)
            .margin_right(MARGIN_RIGHT)
            .margin_top(MARGIN_TOP)
            .margin_bottom(MARGIN_BOTTOM)
            .build_cartesian_2d(x0..x1, y0..y1)
            .map_err(perr)?;
        let (l, t) = chart.backend_coord(&(x0, y1));
        let (r, b) = chart.backend_coord(&(x1, y0));
        frame = PlotFrame {
            left: l as f64,
            top: t as f64,
            width: (r - l) as f64,
            height: (b - t) as f64,
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
        let xt = ticks::ticks(x0, x1, fig.x.log);
        let yt = ticks::ticks(y0, y1, fig.y.log);
        let grid = rgb(palette::GRID);
        let axis_c = rgb(palette::AXIS);
        let ink = rgb(palette::INK);

        // Bands first (under everything).
        for band in &fig.bands {
            let bx0 = if fig.x.log && band.x0 <= 0.0 { f64::NEG_INFINITY } else if fig.x.log { band.x0.log10() } else { band.x0 };
            let bx1 = if fig.x.log && band.x1 <= 0.0 { f64::NEG_INFINITY } else if fig.x.log { band.x1.log10() } else { band.x1 };
            let (a, b2) = (bx0.max(x0), bx1.min(x1));
            if a < b2 {
                let c = rgb(band.color).mix(band.opacity.clamp(0.0, 1.0));
                chart.draw_series(std::iter::once(Rectangle::new([(a, y0), (b2, y1)], c.filled()))).map_err(perr)?;
            }
        }
        // Heat-map cells (over the bands, under the grid and the series).
        if let Some(heat) = &fig.heat {
            let tx = |v: f64| if fig.x.log { v.log10() } else { v };
            let ty = |v: f64| if fig.y.log { v.log10() } else { v };
            let to_px = |x: f64, y: f64| chart.backend_coord(&(tx(x).clamp(x0, x1), ty(y).clamp(y0, y1)));
            heatmap::draw_cells(&root, heat, &to_px)?;
        }
        // Grid lines at major ticks (light over a heat map).
        let grid = if fig.heat.is_some() { WHITE.mix(0.45) } else { grid.mix(1.0) };
        for t in xt.iter().filter(|t| t.major) {
            chart.draw_series(std::iter::once(PathElement::new(vec![(t.at, y0), (t.at, y1)], grid.stroke_width(1)))).map_err(perr)?;
        }
        for t in yt.iter().filter(|t| t.major) {
            chart.draw_series(std::iter::once(PathElement::new(vec![(x0, t.at), (x1, t.at)], grid.stroke_width(1)))).map_err(perr)?;
        }

        // Series.
        for s in &fig.series {
            let lines = polylines(&s.points, fig.x.log, fig.y.log, bx);
            let c = rgb(s.style.color);
            for line in lines {
                if let Some((fc, op)) = s.style.fill {
                    chart
                        .draw_series(std::iter::once(Polygon::new(line.clone(), rgb(fc).mix(op.clamp(0.0, 1.0)).filled())))
                        .map_err(perr)?;
                }
                let st = c.stroke_width(s.style.width.max(1));
                match s.style.dash {
                    Dash::Solid => {
                        chart.draw_series(LineSeries::new(line, st)).map_err(perr)?;
                    }
                    Dash::Dashed => {
                        chart.draw_series(DashedLineSeries::new(line, 9, 6, st)).map_err(perr)?;
                    }
                    Dash::Dotted => {
                        chart.draw_series(DashedLineSeries::new(line, 2, 5, st)).map_err(perr)?;
                    }
                }
            }
        }

        // Markers and error bars.
        let tx = |v: f64| if fig.x.log { v.log10() } else { v };
        let ty = |v: f64| if fig.y.log { v.log10() } else { v };
        let inside = |x: f64, y: f64| x.is_finite() && y.is_finite() && x >= x0 && x <= x1 && y >= y0 && y <= y1;
        for m in &fig.markers {
            let c = rgb(m.color);
            for e in &m.error_bars {
                let (ex, lo, hi) = (tx(e.x), ty(e.lo), ty(e.hi));
                if let Some((p, q)) = (ex.is_finite() && lo.is_finite() && hi.is_finite()).then(|| clip((ex, lo), (ex, hi), bx)).flatten() {
                    chart.draw_series(std::iter::once(PathElement::new(vec![p, q], c.stroke_width(2)))).map_err(perr)?;
                    for end in [p, q] {
                        let (px, py) = chart.backend_coord(&end);
                        root.draw(&PathElement::new(vec![(px - 5, py), (px + 5, py)], c.stroke_width(2))).map_err(perr)?;
                    }
                }
            }
            for &(x, y) in &m.points {
                let (ax, ay) = (tx(x), ty(y));
                if inside(ax, ay) {
                    chart.draw_series(std::iter::once(Circle::new((ax, ay), m.radius.max(2), WHITE.filled()))).map_err(perr)?;
                    chart.draw_series(std::iter::once(Circle::new((ax, ay), m.radius.max(2), c.stroke_width(2)))).map_err(perr)?;
                }
            }
        }

        // Frame and ticks.
        root.draw(&Rectangle::new([(l, t), (r, b)], axis_c.stroke_width(1))).map_err(perr)?;
        let tick_font = (FONT, fs(13.0)).into_font().color(&ink);
        for tk in &xt {
            let (px, _) = chart.backend_coord(&(tk.at, y0));
            let len = if tk.major { 6 } else { 3 };
            root.draw(&PathElement::new(vec![(px, b), (px, b + len)], axis_c.stroke_width(1))).map_err(perr)?;
            if tk.major && !tk.label.is_empty() {
                root.draw(&Text::new(tk.label.clone(), (px, b + 9), tick_font.pos(Pos::new(HPos::Center, VPos::Top))))
                    .map_err(perr)?;
            }
        }
        for tk in &yt {
            let (_, py) = chart.backend_coord(&(x0, tk.at));
            let len = if tk.major { 6 } else { 3 };
            root.draw(&PathElement::new(vec![(l - len, py), (l, py)], axis_c.stroke_width(1))).map_err(perr)?;
            if tk.major && !tk.label.is_empty() {
                root.draw(&Text::new(tk.label.clone(), (l - 9, py), tick_font.pos(Pos::new(HPos::Right, VPos::Center))))
                    .map_err(perr)?;
            }
        }

        // Axis labels and title.
        let label_font = (FONT, fs(15.0)).into_font().color(&ink);
        root.draw(&Text::new(
            fig.x.label.clone(),
            ((l + r) / 2, h as i32 - 12),
            label_font.pos(Pos::new(HPos::Center, VPos::Bottom)),
        ))
        .map_err(perr)?;
        root.draw(&Text::new(
            fig.y.label.clone(),
            (18, (t + b) / 2),
            label_font.transform(FontTransform::Rotate270).pos(Pos::new(HPos::Center, VPos::Top)),
        ))
        .map_err(perr)?;
        let title_font = (FONT, fs(17.0), FontStyle::Bold).into_font().color(&ink);
        root.draw(&Text::new(fig.title.clone(), (l, 16), title_font.pos(Pos::new(HPos::Left, VPos::Top)))).map_err(perr)?;

        if let Some(heat) = &fig.heat {
            heatmap::draw_colour_bar(&root, heat, r)?;
        }
        draw_legend(&root, fig, (l, t, r, b))?;
        root.present().map_err(perr)?;
    }
    Ok((svg, frame))
}

/// One legend row.
enum Swatch {
    Line(Style),
    Band(Rgb, f64),
    Marker(Rgb),
}

fn draw_legend<DB: DrawingBackend>(
    root: &DrawingArea<DB, plotters::coord::Shift>,
    fig: &Figure,
    (l, t, r, b): (i32, i32, i32, i32),
) -> Result<(), PlotError> {
    let mut rows: Vec<(String, Swatch)> = Vec::new();
    for s in fig.series.iter().filter(|s| !s.label.is_empty()) {
        rows.push((s.label.clone(), Swatch::Line(s.style)));
    }
    for bd in fig.bands.iter().filter(|b| !b.label.is_empty()) {
        rows.push((bd.label.clone(), Swatch::Band(bd.color, bd.opacity)));
    }
    for m in fig.markers.iter().filter(|m| !m.label.is_empty()) {
        rows.push((m.label.clone(), Swatch::Marker(m.color)));
    }
    if rows.is_empty() || fig.legend == LegendAt::None {
        return Ok(());
    }
    let row_h = 19;
    let chars = rows.iter().map(|(s, _)| s.chars().count()).max().unwrap_or(0) as i32;
    // Rough text width (no measuring): 7.2 px per character at 13 px.
    let box_w = 44 + (chars * 72) / 10 + 10;
    let box_h = row_h * rows.len() as i32 + 10;
    let (bx, by) = match fig.legend {
        LegendAt::TopRight | LegendAt::None => (r - box_w - 10, t + 10),
        LegendAt::TopLeft => (l + 10, t + 10),
        LegendAt::BottomLeft => (l + 10, b - box_h - 10),
        LegendAt::BottomRight => (r - box_w - 10, b - box_h - 10),
    };
    root.draw(&Rectangle::new([(bx, by), (bx + box_w, by + box_h)], WHITE.mix(0.92).filled())).map_err(perr)?;
    root.draw(&Rectangle::new([(bx, by), (bx + box_w, by + box_h)], rgb(palette::GRID).stroke_width(1))).map_err(perr)?;
    let font = (FONT, fs(13.0)).into_font().color(&rgb(palette::INK));
    for (i, (label, sw)) in rows.iter().enumerate() {
        let cy = by + 5 + row_h * i as i32 + row_h / 2;
        let (sx0, sx1) = (bx + 10, bx + 36);
        match sw {
            Swatch::Line(st) => {
                if let Some((fc, op)) = st.fill {
                    root.draw(&Rectangle::new([(sx0, cy - 6), (sx1, cy + 6)], rgb(fc).mix(op).filled())).map_err(perr)?;
                }
                let s = rgb(st.color).stroke_width(st.width.max(1));
                match st.dash {
                    Dash::Solid => root.draw(&PathElement::new(vec![(sx0, cy), (sx1, cy)], s)).map_err(perr)?,
                    Dash::Dashed => root
                        .draw(&plotters::element::DashedPathElement::new(vec![(sx0, cy), (sx1, cy)], 7, 4, s))
                        .map_err(perr)?,
                    Dash::Dotted => root
                        .draw(&plotters::element::DashedPathElement::new(vec![(sx0, cy), (sx1, cy)], 2, 4, s))
                        .map_err(perr)?,
                }
            }
            Swatch::Band(c, op) => {
                root.draw(&Rectangle::new([(sx0, cy - 6), (sx1, cy + 6)], rgb(*c).mix(*op).filled())).map_err(perr)?;
            }
            Swatch::Marker(c) => {
                root.draw(&Circle::new(((sx0 + sx1) / 2, cy), 4, rgb(*c).stroke_width(2))).map_err(perr)?;
            }
        }
        root.draw(&Text::new(label.clone(), (bx + 44, cy), font.pos(Pos::new(HPos::Left, VPos::Center)))).map_err(perr)?;
    }
    Ok(())
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
