//! The chiwave figures, built from plain arrays so that the page (through the web crate) and
//! the CLI draw exactly the same picture from the same core data.

use crate::{palette, Axis, Band, Dash, Figure, LegendAt, Markers, Series, Style};
use chiwave_core::units::AngleUnit;

/// One partial sum of a series (e.g. the weak-field expansion to order n).
#[derive(Debug, Clone, PartialEq)]
pub struct Partial {
    pub label: String,
    /// Values in radians, aligned with the sweep's b values; `None` where undefined.
    pub values: Vec<Option<f64>>,
}

/// Inputs of the α-against-b figure.
#[derive(Debug, Clone, PartialEq)]
pub struct DeflectionSweep<'a> {
    /// Impact parameters (in the unit named by `b_unit`).
    pub b: &'a [f64],
    /// Exact deflection in radians (`None` where the ray is captured).
    pub exact: &'a [Option<f64>],
    /// Partial sums, lowest order first.
    pub partials: &'a [Partial],
    /// Strong-deflection-limit curve, if available (radians).
    pub strong: Option<&'a [Option<f64>]>,
    /// Critical impact parameter (same unit as `b`): b ≤ b_c is captured.
    pub critical_b: Option<f64>,
    /// The request's own (b, α in radians), marked on the curve.
    pub current: Option<(f64, f64)>,
    pub b_unit: &'a str,
    pub angle: AngleUnit,
}

/// α against b, log–log: exact curve, each partial sum, the strong-deflection curve, the
/// capture region shaded and the current request marked.
pub fn deflection_vs_b(d: &DeflectionSweep) -> Figure {
    let unit = d.angle;
    let conv = |a: Option<f64>| a.map(|r| unit.from_rad(r));
    let mut fig = Figure::new(
        "Deflection angle against impact parameter",
        Axis::log(format!("impact parameter b [{}]", d.b_unit)),
        Axis::log(format!("deflection angle α [{}]", unit.label())),
    );
    if let Some(bc) = d.critical_b {
        if bc.is_finite() && bc > 0.0 {
            fig.bands.push(Band {
                label: "captured (b ≤ b_c)".into(),
                x0: 0.0,
                x1: bc,
                color: palette::SAND,
                opacity: 0.75,
            });
        }
    }
    for (i, p) in d.partials.iter().enumerate() {
        let c = palette::CYCLE[i % palette::CYCLE.len()];
        fig.series.push(Series {
            label: p.label.clone(),
            points: d.b.iter().zip(&p.values).map(|(&b, &a)| conv(a).map(|a| (b, a))).collect(),
            style: Style { color: c, width: 1, dash: if i % 2 == 0 { Dash::Dashed } else { Dash::Dotted }, fill: None },
        });
    }
    if let Some(s) = d.strong {
        fig.series.push(Series {
            label: "strong-deflection limit".into(),
            points: d.b.iter().zip(s).map(|(&b, &a)| conv(a).map(|a| (b, a))).collect(),
            style: Style::dashed(palette::CORAL, 2),
        });
    }
    fig.series.push(Series {
        label: "exact".into(),
        points: d.b.iter().zip(d.exact).map(|(&b, &a)| conv(a).map(|a| (b, a))).collect(),
        style: Style::line(palette::TEAL, 3),
    });
    if let Some((b, a)) = d.current {
        fig.markers.push(Markers {
            label: "this request".into(),
            points: vec![(b, unit.from_rad(a))],
            error_bars: Vec::new(),
            color: palette::INK,
            radius: 5,
        });
    }
    // The range follows the sweep in b, and the exact curve in α (partial sums can blow up).
    if let (Some(&b0), Some(&b1)) = (d.b.first(), d.b.last()) {
        if b0 > 0.0 && b1 > b0 {
            fig.x.range = Some((b0, b1));
        }
    }
    let ys: Vec<f64> = d.exact.iter().flatten().map(|&a| unit.from_rad(a)).filter(|a| *a > 0.0 && a.is_finite()).collect();
    if let (Some(lo), Some(hi)) = (ys.iter().cloned().reduce(f64::min), ys.iter().cloned().reduce(f64::max)) {
        if hi > lo {
            let span = (hi / lo).log10();
            fig.y.range = Some((lo / 10f64.powf(0.08 * span), hi * 10f64.powf(0.08 * span)));
        }
    }
    fig.legend = LegendAt::TopRight;
    fig
}

/// One ray in the lens plane (units of M, lens at the origin).
#[derive(Debug, Clone, PartialEq)]
pub struct RayPath {
    pub x: Vec<f64>,
    pub y: Vec<f64>,
    pub captured: bool,
}

/// Rays in the lens plane, equal aspect: escaping and captured rays in two colours, captured
/// rays end on the horizon, the horizon filled and the photon sphere dashed.
pub fn rays(rays: &[RayPath], horizon_r: Option<f64>, photon_sphere_r: Option<f64>, extent: f64) -> Figure {
    let mut fig = Figure::new("Rays in the lens plane", Axis::linear("x [M]"), Axis::linear("y [M]"));
    let ext = if extent.is_finite() && extent > 0.0 { extent } else { 20.0 };
    fig.x.range = Some((-ext, ext));
    fig.y.range = Some((-0.62 * ext, 0.62 * ext));
    fig.equal_aspect = true;
    let circle = |r: f64| -> Vec<Option<(f64, f64)>> {
        (0..=180).map(|k| {
            let t = k as f64 / 180.0 * std::f64::consts::TAU;
            Some((r * t.cos(), r * t.sin()))
        }).collect()
    };
    if let Some(rh) = horizon_r.filter(|r| r.is_finite() && *r > 0.0) {
        fig.series.push(Series {
            label: format!("horizon r = {}M", trim(rh)),
            points: circle(rh),
            style: Style { color: palette::INK, width: 1, dash: Dash::Solid, fill: Some((palette::INK, 0.88)) },
        });
    }
    if let Some(rp) = photon_sphere_r.filter(|r| r.is_finite() && *r > 0.0) {
        fig.series.push(Series {
            label: format!("photon orbit r = {}M", trim(rp)),
            points: circle(rp),
            style: Style::dashed(palette::AMBER, 2),
        });
    }
    let (mut seen_esc, mut seen_cap) = (false, false);
    let mut ends = Vec::new();
    for r in rays {
        let (label, color) = if r.captured {
            let l = if seen_cap { String::new() } else { "captured ray".into() };
            seen_cap = true;
            (l, palette::CORAL)
        } else {
            let l = if seen_esc { String::new() } else { "escaping ray".into() };
            seen_esc = true;
            (l, palette::TEAL)
        };
        if r.captured {
            if let (Some(&x), Some(&y)) = (r.x.last(), r.y.last()) {
                ends.push((x, y));
            }
        }
        fig.series.push(Series {
            label,
            points: r.x.iter().zip(&r.y).map(|(&x, &y)| Some((x, y))).collect(),
            style: Style::line(color, 2),
        });
    }
    if !ends.is_empty() {
        fig.markers.push(Markers { label: "end on horizon".into(), points: ends, error_bars: Vec::new(), color: palette::CORAL, radius: 3 });
    }
    fig.legend = LegendAt::BottomLeft;
    fig
}

/// |F| against w (log x): the wave-optics amplification of a point lens, with the
/// geometric-optics value if given.
pub fn amplification(w: &[f64], abs_f: &[Option<f64>], geometric: Option<&[Option<f64>]>, current_w: Option<f64>) -> Figure {
    let mut fig = Figure::new(
        "Wave-optics amplification",
        Axis::log("dimensionless frequency w = 8πGM(1+z)f/c³"),
        Axis::linear("amplification |F|"),
    );
    if let Some(g) = geometric {
        fig.series.push(Series {
            label: "geometric optics".into(),
            points: w.iter().zip(g).map(|(&w, &f)| f.map(|f| (w, f))).collect(),
            style: Style::dashed(palette::INDIGO, 2),
        });
    }
    fig.series.push(Series {
        label: "|F| wave optics".into(),
        points: w.iter().zip(abs_f).map(|(&w, &f)| f.map(|f| (w, f))).collect(),
        style: Style::line(palette::TEAL, 3),
    });
    if let Some(cw) = current_w {
        // Mark the request's w on the wave curve (nearest sample).
        let near = w
            .iter()
            .zip(abs_f)
            .filter_map(|(&x, f)| f.map(|f| (x, f)))
            .min_by(|a, b| ((a.0 / cw).ln().abs()).total_cmp(&(b.0 / cw).ln().abs()));
        if let Some(p) = near {
            fig.markers.push(Markers { label: "this request".into(), points: vec![p], error_bars: Vec::new(), color: palette::INK, radius: 5 });
        }
    }
    if let (Some(&a), Some(&b)) = (w.first(), w.last()) {
        if a > 0.0 && b > a {
            fig.x.range = Some((a, b));
        }
    }
    fig.legend = LegendAt::TopLeft;
    fig
}

/// Ray-optics magnification against the source offset u = β/θ_E (log y): total and the two
/// images' |μ|, with the request's offset marked.
pub fn magnification(u: &[f64], total: &[f64], plus: &[f64], minus: &[f64], current: Option<(f64, f64)>) -> Figure {
    let mut fig = Figure::new(
        "Point-lens magnification",
        Axis::linear("source offset u = β/θ_E [Einstein radii]"),
        Axis::log("magnification |μ|"),
    );
    let line = |v: &[f64]| -> Vec<Option<(f64, f64)>> { u.iter().zip(v).map(|(&x, &m)| Some((x, m.abs()))).collect() };
    fig.series.push(Series { label: "|μ₊| minimum image".into(), points: line(plus), style: Style::dashed(palette::INDIGO, 2) });
    fig.series.push(Series { label: "|μ₋| saddle image".into(), points: line(minus), style: Style::dotted(palette::AMBER, 2) });
    fig.series.push(Series { label: "total |μ₊| + |μ₋|".into(), points: line(total), style: Style::line(palette::TEAL, 3) });
    if let Some((x, m)) = current {
        fig.markers.push(Markers { label: "this request".into(), points: vec![(x, m)], error_bars: Vec::new(), color: palette::INK, radius: 5 });
    }
    if let (Some(&a), Some(&b)) = (u.first(), u.last()) {
        if b > a {
            fig.x.range = Some((a, b));
        }
    }
    fig.legend = LegendAt::TopRight;
    fig
}

fn trim(v: f64) -> String {
    let s = format!("{v:.3}");
    s.trim_end_matches('0').trim_end_matches('.').to_string()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::render;

    #[test]
    fn deflection_figure_has_all_curves() {
        let b: Vec<f64> = (0..50).map(|i| 1.0 * 10f64.powf(i as f64 / 10.0)).collect();
        let exact: Vec<Option<f64>> = b.iter().map(|&b| (b > 5.2).then(|| 4.0 / b)).collect();
        let partials = vec![Partial { label: "order 1".into(), values: b.iter().map(|&b| Some(4.0 / b)).collect() }];
        let fig = deflection_vs_b(&DeflectionSweep {
            b: &b,
            exact: &exact,
            partials: &partials,
            strong: None,
            critical_b: Some(5.196),
            current: Some((10.0, 0.4)),
            b_unit: "M",
            angle: AngleUnit::Arcsec,
        });
        let (svg, fr) = render(&fig).unwrap();
        assert!(fr.x_log && fr.y_log);
        for s in ["exact", "order 1", "captured (b ≤ b_c)", "this request", "deflection angle α [arcsec]", "impact parameter b [M]"] {
            assert!(svg.contains(s), "{s}");
        }
    }

    #[test]
    fn rays_figure_shows_horizon_and_photon_orbit() {
        let r = vec![
            RayPath { x: vec![-20.0, 0.0, 20.0], y: vec![8.0, 8.0, 7.0], captured: false },
            RayPath { x: vec![-20.0, -1.5], y: vec![3.0, 1.2], captured: true },
        ];
        let fig = rays(&r, Some(2.0), Some(3.0), 20.0);
        let (svg, fr) = render(&fig).unwrap();
        assert!(svg.contains("horizon r = 2M") && svg.contains("photon orbit r = 3M"));
        assert!(svg.contains("captured ray") && svg.contains("escaping ray"));
        let ux = (fr.x_max - fr.x_min) / fr.width;
        let uy = (fr.y_max - fr.y_min) / fr.height;
        assert!((ux / uy - 1.0).abs() < 0.02);
    }

    #[test]
    fn magnification_figure_labels() {
        let u = [0.1, 0.5, 1.0];
        let (svg, fr) = render(&magnification(&u, &[10.0, 2.2, 1.34], &[5.5, 1.6, 1.17], &[-4.5, -0.6, -0.17], Some((0.5, 2.2)))).unwrap();
        assert!(fr.y_log && !fr.x_log);
        assert!(svg.contains("magnification |μ|") && svg.contains("saddle image"));
    }

    #[test]
    fn amplification_figure_labels() {
        let w: Vec<f64> = (0..20).map(|i| 0.01 * 10f64.powf(i as f64 / 5.0)).collect();
        let f: Vec<Option<f64>> = w.iter().map(|_| Some(1.5)).collect();
        let (svg, _) = render(&amplification(&w, &f, Some(&f), Some(1.0))).unwrap();
        assert!(svg.contains("amplification |F|") && svg.contains("geometric optics"));
    }
}
