//! Where everything goes: the layout of a figure (margins from the estimated extents of the
//! tick labels and titles, ticks that fit, the colour bar) and the legend (its entries, its
//! arrangement in rows and columns, and its place: an empty corner of the plot, measured on
//! the drawn pixel geometry, or outside the plot). Used by [`crate::render`].

use crate::colour::palette;
use crate::heatmap;
use crate::model::*;
use crate::render::{centre_baseline, clip, draw_marker, pitch, polylines, ranges, stroke_of, text_h, Shape, Type};
use crate::svg::{Anchor, Stroke, Svg, TextSpec};
use crate::text::{self, Bounds, ASCENT, DESCENT};
use crate::ticks::{self, Tick, TickSet};


/// What a legend row shows left of its text.
#[derive(Debug, Clone, PartialEq)]
pub(crate) enum Swatch {
    Line(Style),
    Band(Rgb, f64),
    Marker(Rgb, Shape),
    /// A note: text only.
    Note,
}

#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Entry {
    label: String,
    swatch: Swatch,
}

pub(crate) fn legend_entries(fig: &Figure, styles: &[Style], shapes: &[Shape]) -> Vec<Entry> {
    let mut rows = Vec::new();
    for (s, st) in fig.series.iter().zip(styles) {
        if s.label.is_empty() {
            continue;
        }
        let swatch = if s.points.is_empty() { Swatch::Note } else { Swatch::Line(*st) };
        rows.push(Entry { label: s.label.clone(), swatch });
    }
    for b in fig.bands.iter().filter(|b| !b.label.is_empty()) {
        rows.push(Entry { label: b.label.clone(), swatch: Swatch::Band(b.color, b.opacity) });
    }
    for (m, sh) in fig.markers.iter().zip(shapes) {
        if !m.label.is_empty() {
            rows.push(Entry { label: m.label.clone(), swatch: Swatch::Marker(m.color, *sh) });
        }
    }
    rows
}

/// One legend item placed relative to the legend box's top-left corner.
#[derive(Debug, Clone, PartialEq)]
struct Item {
    dx: f64,
    dy: f64,
    lines: Vec<String>,
    swatch: Swatch,
}

/// A legend laid out: its size and items.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Arranged {
    w: f64,
    h: f64,
    items: Vec<Item>,
}

struct LegendMetrics {
    size: f64,
    swatch: f64,
    gap: f64,
    pad: f64,
    row: f64,
    col_gap: f64,
}

impl LegendMetrics {
    fn new(ty: &Type) -> Self {
        let s = ty.legend;
        LegendMetrics { size: s, swatch: 2.3 * s, gap: 0.55 * s, pad: 0.6 * s, row: 1.4 * s, col_gap: 1.4 * s }
    }
}

/// Lays the entries out in as many columns as fit `avail_w` (one column if `multi` is false),
/// wrapping labels that are wider than a column can be.
fn arrange(entries: &[Entry], ty: &Type, avail_w: f64, multi: bool) -> Arranged {
    let m = LegendMetrics::new(ty);
    let indent = m.swatch + m.gap;
    let natural = entries.iter().map(|e| text::width(&e.label, m.size)).fold(0.0, f64::max);
    let inner = (avail_w - 2.0 * m.pad).max(4.0 * m.size);
    let max_text = (inner - indent).max(3.0 * m.size);
    let col_text = natural.min(max_text);
    let col_w = indent + col_text;
    let ncols = if multi { (((inner + m.col_gap) / (col_w + m.col_gap)).floor() as usize).clamp(1, entries.len().max(1)) } else { 1 };
    let lines: Vec<Vec<String>> = entries.iter().map(|e| text::wrap(&e.label, m.size, col_text, 3, false)).collect();
    let nrows = entries.len().div_ceil(ncols);
    let mut items = Vec::with_capacity(entries.len());
    let mut y = m.pad;
    for r in 0..nrows {
        let mut tallest = 1;
        for c in 0..ncols {
            let i = r * ncols + c;
            if let Some(e) = entries.get(i) {
                tallest = tallest.max(lines[i].len());
                items.push(Item { dx: m.pad + c as f64 * (col_w + m.col_gap), dy: y, lines: lines[i].clone(), swatch: e.swatch.clone() });
            }
        }
        y += tallest as f64 * m.row;
    }
    let w = 2.0 * m.pad + ncols as f64 * col_w + (ncols.saturating_sub(1)) as f64 * m.col_gap;
    Arranged { w, h: y + m.pad - (m.row - text_h(m.size)) * 0.5, items }
}

pub(crate) fn draw_legend(svg: &mut Svg, ty: &Type, at: &Bounds, a: &Arranged, boxed: bool) {
    let m = LegendMetrics::new(ty);
    if boxed {
        svg.rect(at.x, at.y, at.w, at.h, Some((palette::WHITE, 0.92)), Some(&Stroke::solid(palette::GRID, 1.0)));
    }
    for it in &a.items {
        let x0 = at.x + it.dx;
        let cy = at.y + it.dy + 0.5 * m.row;
        let (sx0, sx1) = (x0, x0 + m.swatch);
        match &it.swatch {
            Swatch::Line(st) => {
                if let Some((fc, op)) = st.fill {
                    svg.rect(sx0, cy - 0.45 * m.size, m.swatch, 0.9 * m.size, Some((fc, op)), None);
                }
                svg.path(&[(sx0, cy), (sx1, cy)], &stroke_of(st));
            }
            Swatch::Band(c, op) => svg.rect(sx0, cy - 0.45 * m.size, m.swatch, 0.9 * m.size, Some((*c, *op)), None),
            Swatch::Marker(c, sh) => draw_marker(svg, *sh, 0.5 * (sx0 + sx1), cy, 0.33 * m.size, *c),
            Swatch::Note => {}
        }
        for (k, line) in it.lines.iter().enumerate() {
            svg.text(&TextSpec {
                x: x0 + m.swatch + m.gap,
                y: cy + centre_baseline(m.size) + k as f64 * m.row,
                text: line,
                size: m.size,
                anchor: Anchor::Start,
                bold: false,
                rotate: 0.0,
                color: palette::INK,
            });
        }
    }
}

// ---------------------------------------------------------------------------------------------
// Layout

/// Where the legend goes.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum LegendMode {
    Inside,
    Below,
    Right,
}

/// The colour bar of a heat map: bar position, ticks, caption.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Bar {
    pub x: f64,
    pub width: f64,
    pub ticks: TickSet,
    pub caption: Vec<String>,
    pub label_w: f64,
}

/// Everything placed, in pixels.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Layout {
    pub(crate) ty: Type,
    pub(crate) w: f64,
    pub(crate) h: f64,
    pub(crate) title: Vec<String>,
    pub(crate) plot: Bounds,
    /// Axis-space ranges (x0, x1, y0, y1).
    pub(crate) r: (f64, f64, f64, f64),
    pub(crate) xt: TickSet,
    pub(crate) yt: TickSet,
    pub(crate) xlab: Vec<String>,
    pub(crate) ylab: Vec<String>,
    pub(crate) ytick_w: f64,
    pub(crate) bar: Option<Bar>,
    /// A legend outside the plot (below or right), with its box.
    pub(crate) outside: Option<(Bounds, Arranged)>,
}

impl Layout {
    pub(crate) fn px(&self, ax: f64) -> f64 {
        let (x0, x1, _, _) = self.r;
        self.plot.x + (ax - x0) / (x1 - x0) * self.plot.w
    }
    pub(crate) fn py(&self, ay: f64) -> f64 {
        let (_, _, y0, y1) = self.r;
        self.plot.y + (y1 - ay) / (y1 - y0) * self.plot.h
    }
    /// Axis space → pixels.
    pub(crate) fn to_px(&self, p: (f64, f64)) -> (f64, f64) {
        (self.px(p.0), self.py(p.1))
    }
    /// Baseline y of the x tick labels.
    pub(crate) fn xtick_base(&self) -> f64 {
        self.plot.bottom() + self.ty.tick_len + self.ty.gap + ASCENT * self.ty.tick
    }
    /// Baseline y of the first line of the x-axis title.
    pub(crate) fn xlab_base(&self) -> f64 {
        self.xtick_base() + DESCENT * self.ty.tick + 1.6 * self.ty.gap + ASCENT * self.ty.label
    }
    /// Bottom of the x-axis title block.
    pub(crate) fn xlab_bottom(&self) -> f64 {
        self.xlab_base() + (self.xlab.len().max(1) - 1) as f64 * pitch(self.ty.label) + DESCENT * self.ty.label
    }
    /// Right end of the x-axis title's space (left of the axis factor, if any).
    pub(crate) fn xlab_right(&self) -> f64 {
        match &self.xt.factor {
            Some(f) => self.plot.right() - text::width(f, self.ty.tick) - 2.0 * self.ty.gap,
            None => self.plot.right(),
        }
    }
}

/// Largest label width of a tick set.
fn label_w(ts: &TickSet, size: f64) -> f64 {
    ts.labelled().map(|t| text::width(&t.label, size)).fold(0.0, f64::max)
}

/// Ticks for a horizontal axis of `len` px starting at pixel `x_px`: labels must keep a gap
/// of 0.8 em between them.
fn fit_x(lo: f64, hi: f64, log: bool, len: f64, size: f64) -> TickSet {
    let target = ((len / 95.0).round() as usize).clamp(2, 9);
    let fits = |ts: &[Tick]| {
        let lab: Vec<&Tick> = ts.iter().filter(|t| t.major && !t.label.is_empty()).collect();
        lab.windows(2).all(|w| {
            let d = (w[1].at - w[0].at) / (hi - lo) * len;
            d >= 0.5 * (text::width(&w[0].label, size) + text::width(&w[1].label, size)) + 0.8 * size
        })
    };
    ticks::fitted(lo, hi, log, target, &fits)
}

/// Ticks for a vertical axis of `len` px: labels at least 1.7 line heights apart.
fn fit_y(lo: f64, hi: f64, log: bool, len: f64, size: f64) -> TickSet {
    let target = ((len / 60.0).round() as usize).clamp(2, 9);
    let fits = |ts: &[Tick]| {
        let lab: Vec<&Tick> = ts.iter().filter(|t| t.major && !t.label.is_empty()).collect();
        lab.windows(2).all(|w| (w[1].at - w[0].at) / (hi - lo) * len >= 1.7 * size)
    };
    ticks::fitted(lo, hi, log, target, &fits)
}

/// Snaps a frame edge to a pixel centre (crisp 1 px lines at 1×; any zoom is exact anyway).
fn snap(v: f64) -> f64 {
    v.floor() + 0.5
}

fn layout(fig: &Figure, ty: Type, entries: &[Entry], mode: LegendMode) -> Layout {
    let (w, h) = (fig.width.max(200) as f64, fig.height.max(160) as f64);
    let pad = ty.pad;
    let title = if fig.title.is_empty() { Vec::new() } else { text::wrap(&fig.title, ty.title, w - 2.0 * pad, 2, true) };
    let top0 = pad + title.len() as f64 * pitch(ty.title) + if title.is_empty() { 0.0 } else { ty.gap };
    let (mut l, mut r, mut t, mut b) = (pad + 60.0, w - pad - 10.0, top0 + 0.6 * ty.tick, h - 60.0);
    let mut lay = Layout {
        ty,
        w,
        h,
        title,
        plot: Bounds::new(l, t, r - l, b - t),
        r: (0.0, 1.0, 0.0, 1.0),
        xt: TickSet::default(),
        yt: TickSet::default(),
        xlab: Vec::new(),
        ylab: Vec::new(),
        ytick_w: 0.0,
        bar: None,
        outside: None,
    };
    for _ in 0..5 {
        let (pw, ph) = ((r - l).max(40.0), (b - t).max(30.0));
        lay.plot = Bounds::new(l, t, pw, ph);
        lay.r = ranges(fig, pw, ph);
        let (x0, x1, y0, y1) = lay.r;
        lay.yt = fit_y(y0, y1, fig.y.log, ph, ty.tick);
        lay.xt = fit_x(x0, x1, fig.x.log, pw, ty.tick);
        lay.ytick_w = label_w(&lay.yt, ty.tick);
        lay.ylab = text::wrap(&fig.y.label, ty.label, ph, 2, false);
        let xfactor_w = lay.xt.factor.as_ref().map(|f| text::width(f, ty.tick) + 2.0 * ty.gap).unwrap_or(0.0);
        lay.xlab = text::wrap(&fig.x.label, ty.label, (pw - xfactor_w).max(40.0), 2, false);
        lay.bar = fig.heat.as_ref().map(|heat| heatmap::bar_layout(heat, &ty, ph));
        let bar_block = lay.bar.as_ref().map(|bar| heatmap::bar_block_width(bar, &ty)).unwrap_or(0.0);
        // An outside legend.
        lay.outside = match mode {
            LegendMode::Inside => None,
            LegendMode::Below => Some((Bounds::new(0.0, 0.0, 0.0, 0.0), arrange(entries, &ty, w - 2.0 * pad, true))),
            LegendMode::Right => Some((Bounds::new(0.0, 0.0, 0.0, 0.0), arrange(entries, &ty, 0.34 * w, false))),
        };
        let below_block = match (mode, &lay.outside) {
            (LegendMode::Below, Some((_, a))) => a.h + ty.gap * 2.0,
            _ => 0.0,
        };
        let right_block = match (mode, &lay.outside) {
            (LegendMode::Right, Some((_, a))) => a.w + 2.0 * ty.gap,
            _ => 0.0,
        };
        // Left: y title lines, gap, tick labels, gap, tick marks.
        let first_x_half = lay.xt.labelled().next().map(|t| 0.5 * text::width(&t.label, ty.tick)).unwrap_or(0.0);
        let nl = pad + lay.ylab.len() as f64 * pitch(ty.label) + 1.6 * ty.gap + lay.ytick_w + ty.gap + ty.tick_len;
        let nl = nl.max(pad + first_x_half);
        // Right: overhang of the last x label, the colour bar, a right legend.
        let last_x_half = lay.xt.labelled().last().map(|t| 0.5 * text::width(&t.label, ty.tick)).unwrap_or(0.0);
        let nr = w - pad - (right_block + bar_block).max(if bar_block > 0.0 { 0.0 } else { last_x_half.max(0.5 * pad) });
        // Top: room for the top y label's upper half, or the y-axis factor.
        let yfactor = if lay.yt.factor.is_some() { text_h(ty.tick) + ty.gap } else { 0.6 * ty.tick };
        let nt = top0 + yfactor;
        // Bottom: tick marks, labels, x title, an outside legend.
        let below_plot = ty.tick_len + ty.gap + text_h(ty.tick) + 1.6 * ty.gap + text_h(ty.label) + (lay.xlab.len().max(1) - 1) as f64 * pitch(ty.label);
        let nb = h - pad - below_block - below_plot;
        let (sl, sr, st, sb) = (snap(nl), snap(nr), snap(nt), snap(nb));
        if (sl, sr, st, sb) == (l, r, t, b) {
            break;
        }
        (l, r, t, b) = (sl, sr, st, sb);
    }
    // Final geometry with the settled margins.
    let (pw, ph) = ((r - l).max(40.0), (b - t).max(30.0));
    lay.plot = Bounds::new(l, t, pw, ph);
    if let Some(bar) = lay.bar.as_mut() {
        bar.x = lay.plot.right() + 2.2 * ty.gap;
    }
    let below_y = lay.xlab_bottom() + 2.0 * ty.gap;
    let right_x = lay.bar.as_ref().map(|bar| bar.x + heatmap::bar_block_width(bar, &ty) - 2.2 * ty.gap).unwrap_or(lay.plot.right()) + 2.0 * ty.gap;
    let plot = lay.plot;
    if let Some((bx, a)) = lay.outside.as_mut() {
        *bx = match mode {
            // Centred under the plot, but never past the figure's left edge.
            LegendMode::Below => Bounds::new((plot.x + 0.5 * (plot.w - a.w)).min(w - pad - a.w).max(pad), below_y, a.w, a.h),
            _ => Bounds::new(right_x.min(w - pad - a.w), plot.y, a.w, a.h),
        };
    }
    lay
}

// ---------------------------------------------------------------------------------------------
// What is drawn where (for the legend's placement)

/// The drawn data in pixels: line segments, marker boxes, the heat-map area.
struct Geometry {
    segs: Vec<((f64, f64), (f64, f64))>,
    blobs: Vec<Bounds>,
    heat: Option<Bounds>,
}

fn geometry(fig: &Figure, lay: &Layout) -> Geometry {
    let (x0, x1, y0, y1) = lay.r;
    let bx = (x0, x1, y0, y1);
    let mut segs = Vec::new();
    for s in &fig.series {
        for line in polylines(&s.points, fig.x.log, fig.y.log, bx) {
            let px: Vec<(f64, f64)> = line.iter().map(|p| lay.to_px(*p)).collect();
            for w in px.windows(2) {
                segs.push((w[0], w[1]));
            }
        }
    }
    let tx = |v: f64| if fig.x.log { v.log10() } else { v };
    let ty = |v: f64| if fig.y.log { v.log10() } else { v };
    let mut blobs = Vec::new();
    for m in &fig.markers {
        let r = m.radius.max(2) as f64 + 2.0;
        for &(x, y) in &m.points {
            let (ax, ay) = (tx(x), ty(y));
            if ax.is_finite() && ay.is_finite() && ax >= x0 && ax <= x1 && ay >= y0 && ay <= y1 {
                let (px, py) = lay.to_px((ax, ay));
                blobs.push(Bounds::new(px - r, py - r, 2.0 * r, 2.0 * r));
            }
        }
        for e in &m.error_bars {
            let (ex, lo, hi) = (tx(e.x), ty(e.lo), ty(e.hi));
            if let Some((p, q)) = (ex.is_finite() && lo.is_finite() && hi.is_finite()).then(|| clip((ex, lo), (ex, hi), bx)).flatten() {
                segs.push((lay.to_px(p), lay.to_px(q)));
            }
        }
    }
    let heat = fig.heat.as_ref().and_then(|h| h.extent()).map(|((hx0, hx1), (hy0, hy1))| {
        let (a, b) = (lay.to_px((tx(hx0).max(x0), ty(hy1).min(y1))), lay.to_px((tx(hx1).min(x1), ty(hy0).max(y0))));
        Bounds::new(a.0.min(b.0), a.1.min(b.1), (b.0 - a.0).abs(), (b.1 - a.1).abs())
    });
    Geometry { segs, blobs, heat }
}

/// How much drawn data a box at `b` would cover: segments crossing it, markers under it, and
/// a heat map (counted as a thousand).
fn covered(g: &Geometry, b: &Bounds) -> usize {
    let bb = b.grow(3.0);
    let boxq = (bb.x, bb.right(), bb.y, bb.bottom());
    let mut n = g.segs.iter().filter(|(p, q)| clip(*p, *q, boxq).is_some()).count();
    n += g.blobs.iter().filter(|m| m.overlaps(&bb)).count();
    if g.heat.is_some_and(|hb| hb.overlaps(b)) {
        n += 1000;
    }
    n
}

/// How much drawn data a box at `b` covers in the layout `lay` (for the tests).
#[cfg(test)]
pub(crate) fn covered_by(fig: &Figure, lay: &Layout, b: &Bounds) -> usize {
    covered(&geometry(fig, lay), b)
}

/// Candidate positions of an inside legend of size (w, h), the builder's corner first.
fn inside_candidates(lay: &Layout, pref: LegendAt, w: f64, h: f64) -> Vec<Bounds> {
    let p = lay.plot;
    let inset = 0.7 * lay.ty.pad;
    let (xl, xr, xc) = (p.x + inset, p.right() - inset - w, p.x + 0.5 * (p.w - w));
    let (yt, yb, yc) = (p.y + inset, p.bottom() - inset - h, p.y + 0.5 * (p.h - h));
    let corner = |c: LegendAt| match c {
        LegendAt::TopLeft => Bounds::new(xl, yt, w, h),
        LegendAt::BottomLeft => Bounds::new(xl, yb, w, h),
        LegendAt::BottomRight => Bounds::new(xr, yb, w, h),
        _ => Bounds::new(xr, yt, w, h),
    };
    let mut out = vec![corner(pref)];
    for c in [LegendAt::TopRight, LegendAt::TopLeft, LegendAt::BottomRight, LegendAt::BottomLeft] {
        let b = corner(c);
        if !out.contains(&b) {
            out.push(b);
        }
    }
    out.extend([Bounds::new(xc, yt, w, h), Bounds::new(xc, yb, w, h), Bounds::new(xl, yc, w, h), Bounds::new(xr, yc, w, h)]);
    out
}

/// Where the legend goes: (layout, inside box or None when it is outside or absent).
pub(crate) fn place(fig: &Figure, ty: Type, entries: &[Entry]) -> (Layout, Option<(Bounds, Arranged)>) {
    let inside = layout(fig, ty, entries, LegendMode::Inside);
    if entries.is_empty() || fig.legend == LegendAt::None {
        return (inside, None);
    }
    let a = arrange(entries, &ty, 0.62 * inside.plot.w, false);
    let fits = a.w <= inside.plot.w - 1.4 * ty.pad && a.h <= inside.plot.h - 1.4 * ty.pad;
    let g = geometry(fig, &inside);
    let cands = inside_candidates(&inside, fig.legend, a.w, a.h);
    if fits {
        if let Some(b) = cands.iter().find(|b| covered(&g, b) == 0) {
            return (inside, Some((*b, a)));
        }
    }
    // Every corner covers data (or the legend is too big for the plot): outside, below or to
    // the right, if the plot keeps enough room — generous room first, then less.
    let outside = |ty: Type, mode: LegendMode, share: f64| -> Option<Layout> {
        let lay = layout(fig, ty, entries, mode);
        let room = if mode == LegendMode::Below { lay.plot.h / lay.h } else { lay.plot.w / lay.w };
        let inside_figure = lay.outside.as_ref().is_some_and(|(b, _)| b.bottom() <= lay.h - 0.5 * ty.pad && b.right() <= lay.w);
        (room >= share && inside_figure).then_some(lay)
    };
    for (mode, share) in [(LegendMode::Below, 0.45), (LegendMode::Right, 0.5), (LegendMode::Below, 0.3), (LegendMode::Right, 0.4)] {
        if let Some(lay) = outside(ty, mode, share) {
            return (lay, None);
        }
    }
    // No room outside either (a small figure): the inside position covering the least, if the
    // legend fits in the plot.
    if fits {
        let best = cands.into_iter().min_by_key(|b| covered(&g, b)).unwrap_or(inside.plot);
        return (inside, Some((best, a)));
    }
    // A long legend on a small figure: smaller legend type (down to 80 %) below or right.
    for k in [0.9, 0.8] {
        let small = Type { legend: k * ty.legend, ..ty };
        for (mode, share) in [(LegendMode::Below, 0.25), (LegendMode::Right, 0.35)] {
            if let Some(lay) = outside(small, mode, share) {
                return (lay, None);
            }
        }
    }
    (layout(fig, Type { legend: 0.8 * ty.legend, ..ty }, entries, LegendMode::Below), None)
}

