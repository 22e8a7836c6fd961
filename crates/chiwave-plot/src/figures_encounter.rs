//! Encounter figures, built from the core's own outputs (no physics here):
//! * [`chi_sweep`]: χ against b or j from `encounter::chi_sweep` (every PM order, Newtonian,
//!   exact test body, strong-field estimate, capture regions shaded);
//! * [`orbits`]: the two bodies in the CM frame from the estimate's relative orbit
//!   (`encounter::eob::orbit`), x₁ = (m₂/M) r, x₂ = −(m₁/M) r;
//! * [`nr_comparison`]: user-supplied numerical-relativity angles with error bars against the
//!   predictions of `encounter::nr::compare`.

use crate::{palette, Axis, Band, Dash, ErrorBar, Figure, LegendAt, Markers, Series, Style};
use chiwave_core::encounter::eob::EobOrbit;
use chiwave_core::encounter::nr::NrComparison;
use chiwave_core::encounter::{ChiSweep, SweepVar};
use chiwave_core::units::AngleUnit;

/// χ against b/(GM) or j, log–log: the PM partial sums, Newtonian, the exact test-body angle,
/// the strong-field estimate; shaded where the test body is captured (x ≤ x_c) and where the
/// estimate predicts capture; the request's own (x, χ) marked.
pub fn chi_sweep(s: &ChiSweep, current: Option<(f64, f64)>, angle: AngleUnit) -> Figure {
    let conv = |a: Option<f64>| a.filter(|v| v.is_finite()).map(|r| angle.from_rad(r));
    let (xlabel, xc, cap_label) = match s.var {
        SweepVar::B => ("impact parameter b [GM/c²]", s.b_critical_test_body, "test body captured (b ≤ b_c)"),
        SweepVar::J => ("reduced angular momentum j = J/(G m₁m₂)", s.j_critical_test_body, "test body captured (j ≤ j_c)"),
    };
    let mut fig = Figure::new(
        format!("Scattering angle, γ = {}, ν = {}", short(s.gamma), short(s.nu)),
        Axis::log(xlabel),
        Axis::log(format!("CM scattering angle χ [{}]", angle.label())),
    );
    let xs: Vec<f64> = s.points.iter().map(|p| p.x).collect();
    if xc.is_finite() && xc > 0.0 {
        fig.bands.push(Band { label: cap_label.into(), x0: 0.0, x1: xc, color: palette::SAND, opacity: 0.8 });
    }
    // The estimate's own capture region: up to the largest captured sample.
    if let Some(xe) = s.points.iter().filter(|p| p.captured).map(|p| p.x).reduce(f64::max) {
        if xe > xc {
            fig.bands.push(Band { label: "estimate predicts capture".into(), x0: xc.max(0.0), x1: xe, color: palette::CORAL, opacity: 0.14 });
        }
    }
    let line = |f: &dyn Fn(&chiwave_core::encounter::SweepPoint) -> Option<f64>| -> Vec<Option<(f64, f64)>> {
        s.points.iter().map(|p| conv(f(p)).map(|y| (p.x, y))).collect()
    };
    fig.series.push(Series { label: "Newtonian".into(), points: line(&|p| Some(p.chi_newtonian)), style: Style::dotted(palette::SLATE, 2) });
    fig.series.push(Series { label: "1PM".into(), points: line(&|p| Some(p.chi.pm1)), style: Style::dashed(palette::INDIGO, 1) });
    fig.series.push(Series { label: "2PM".into(), points: line(&|p| Some(p.chi.pm2)), style: Style::dashed(palette::AMBER, 2) });
    fig.series.push(Series {
        label: "3PM conservative".into(),
        points: line(&|p| Some(p.chi.pm3_conservative)),
        style: Style { color: palette::PLUM, width: 1, dash: Dash::Dotted, fill: None },
    });
    fig.series.push(Series { label: "3PM (with radiation reaction)".into(), points: line(&|p| Some(p.chi.pm3)), style: Style::line(palette::MOSS, 2) });
    fig.series.push(Series { label: "exact test body (ν → 0)".into(), points: line(&|p| p.chi_test_body), style: Style::line(palette::TEAL, 3) });
    fig.series.push(Series { label: "strong-field estimate".into(), points: line(&|p| p.chi_estimate), style: Style::dashed(palette::CORAL, 2) });
    if let Some((x, chi)) = current {
        if x.is_finite() && chi.is_finite() {
            fig.markers.push(Markers { label: "this request (3PM)".into(), points: vec![(x, angle.from_rad(chi))], error_bars: Vec::new(), color: palette::INK, radius: 5 });
        }
    }
    if let (Some(&a), Some(&b)) = (xs.first(), xs.last()) {
        if a > 0.0 && b > a {
            fig.x.range = Some((a, b));
        }
    }
    // y range from the curves that stay finite and positive at strong field (test body,
    // estimate) and the weak-field end of the 3PM curve; the truncated series may blow up.
    let ys: Vec<f64> = s
        .points
        .iter()
        .flat_map(|p| [p.chi_test_body, p.chi_estimate, Some(p.chi.pm1)])
        .flatten()
        .map(|r| angle.from_rad(r))
        .filter(|v| v.is_finite() && *v > 0.0)
        .collect();
    if let (Some(lo), Some(hi)) = (ys.iter().copied().reduce(f64::min), ys.iter().copied().reduce(f64::max)) {
        if hi > lo {
            let hi = hi.min(lo * 1e8);
            let span = (hi / lo).log10();
            fig.y.range = Some((lo / 10f64.powf(0.06 * span), hi * 10f64.powf(0.06 * span)));
        }
    }
    fig.legend = LegendAt::TopRight;
    fig
}

/// Both bodies in the CM frame from the estimate's relative orbit r(φ) (EOB effective radius):
/// x₁ = (m₂/M) r, x₂ = −(m₁/M) r, drawn with equal aspect; `m1`, `m2` are fractions of M.
/// The picture is rotated by π so that body 1 comes in from the left. A captured orbit ends
/// with a marker where the estimate stops (r ≈ 2).
pub fn orbits(o: &EobOrbit, m1: f64, m2: f64, r_min: Option<f64>) -> Figure {
    let title = if o.captured { "Trajectories in the CM frame — estimate predicts capture" } else { "Trajectories in the CM frame (strong-field estimate)" };
    let mut fig = Figure::new(
        title,
        Axis::linear("x [GM/c²]  (from the EOB effective radius: an estimate)"),
        Axis::linear("y [GM/c²]"),
    );
    fig.equal_aspect = true;
    let rel: Vec<(f64, f64)> =
        o.r.iter().zip(&o.phi).filter(|(r, p)| r.is_finite() && p.is_finite()).map(|(&r, &p)| (-r * p.cos(), -r * p.sin())).collect();
    let body = |k: f64| -> Vec<Option<(f64, f64)>> { rel.iter().map(|&(x, y)| Some((k * x, k * y))).collect() };
    let (c1, c2) = (palette::TEAL, palette::INDIGO);
    fig.series.push(Series { label: format!("body 1 (m₁/M = {})", short(m1)), points: body(m2), style: Style::line(c1, 2) });
    fig.series.push(Series { label: format!("body 2 (m₂/M = {})", short(m2)), points: body(-m1), style: Style::line(c2, 2) });
    // View: around the closest approach (scattered) or the start of the inspiral (captured).
    let r_close = o.r.iter().copied().filter(|r| r.is_finite()).fold(f64::INFINITY, f64::min);
    let ext = if o.captured {
        // The captured orbit starts at r = 100 (core); show its last turns.
        let r0 = o.r.first().copied().unwrap_or(100.0);
        (0.45 * r0).clamp(6.0, 200.0)
    } else {
        (3.0 * r_min.unwrap_or(r_close)).clamp(8.0, 1e7)
    };
    fig.x.range = Some((-1.6 * ext, 1.6 * ext));
    fig.y.range = Some((-ext, ext));
    fig.markers.push(Markers { label: "centre of mass".into(), points: vec![(0.0, 0.0)], error_bars: Vec::new(), color: palette::SLATE, radius: 3 });
    if o.captured {
        if let Some(&(x, y)) = rel.last() {
            fig.markers.push(Markers {
                label: "estimate ends: plunge (capture)".into(),
                points: vec![(m2 * x, m2 * y), (-m1 * x, -m1 * y)],
                error_bars: Vec::new(),
                color: palette::CORAL,
                radius: 5,
            });
        }
    } else if let Some(i) = o.r.iter().enumerate().filter(|(_, r)| r.is_finite()).min_by(|a, b| a.1.total_cmp(b.1)).map(|(i, _)| i) {
        if let Some(&(x, y)) = rel.get(i) {
            fig.markers.push(Markers {
                label: format!("closest approach, r = {} GM/c² (effective)", short(o.r[i])),
                points: vec![(m2 * x, m2 * y), (-m1 * x, -m1 * y)],
                error_bars: Vec::new(),
                color: palette::AMBER,
                radius: 4,
            });
        }
    }
    fig.legend = LegendAt::BottomLeft;
    fig
}

/// User-supplied NR angles (with σχ error bars) and every prediction, against J/(G M²).
/// When all rows share E/M and ν the predictions are joined by lines (one sequence); otherwise
/// they are markers only (different encounters must not be joined).
pub fn nr_comparison(rows: &[NrComparison], angle: AngleUnit) -> Figure {
    let mut fig = Figure::new(
        "Your NR angles against the predictions",
        Axis::linear("angular momentum J/(G M²) (as given)"),
        Axis::log(format!("scattering angle χ [{}]", angle.label())),
    );
    let mut order: Vec<&NrComparison> = rows.iter().collect();
    order.sort_by(|a, b| a.input.j_over_m2.total_cmp(&b.input.j_over_m2));
    let same = order.windows(2).all(|w| {
        let (a, b) = (&w[0].input, &w[1].input);
        (a.e_over_m - b.e_over_m).abs() <= 1e-9 * a.e_over_m.abs() && (a.nu - b.nu).abs() <= 1e-9 * a.nu.abs()
    });
    type Pick = fn(&NrComparison) -> Option<f64>;
    let preds: [(&str, crate::Rgb, Pick); 5] = [
        ("1PM", palette::INDIGO, |c| Some(c.chi.pm1)),
        ("2PM", palette::AMBER, |c| Some(c.chi.pm2)),
        ("3PM", palette::MOSS, |c| Some(c.chi.pm3)),
        ("exact test body", palette::TEAL, |c| c.chi_test_body),
        ("strong-field estimate", palette::CORAL, |c| c.chi_estimate),
    ];
    for (label, color, f) in preds {
        let pts: Vec<(f64, f64)> =
            order.iter().filter_map(|c| f(c).filter(|v| v.is_finite() && *v > 0.0).map(|v| (c.input.j_over_m2, angle.from_rad(v)))).collect();
        if same && pts.len() > 1 {
            fig.series.push(Series { label: String::new(), points: pts.iter().map(|&p| Some(p)).collect(), style: Style::dashed(color, 1) });
        }
        fig.markers.push(Markers { label: label.into(), points: pts, error_bars: Vec::new(), color, radius: 3 });
    }
    let nr: Vec<(f64, f64)> = order.iter().map(|c| (c.input.j_over_m2, angle.from_rad(c.input.chi))).collect();
    let bars = order
        .iter()
        .map(|c| {
            let (y, s) = (angle.from_rad(c.input.chi), angle.from_rad(c.input.sigma_chi));
            ErrorBar { x: c.input.j_over_m2, y, lo: y - s, hi: y + s }
        })
        .collect();
    fig.markers.push(Markers { label: "your data ± σχ".into(), points: nr, error_bars: bars, color: palette::INK, radius: 5 });
    let xs: Vec<f64> = order.iter().map(|c| c.input.j_over_m2).collect();
    if let (Some(&a), Some(&b)) = (xs.first(), xs.last()) {
        let pad = if b > a { 0.08 * (b - a) } else { 0.1 * a.abs().max(1e-3) };
        fig.x.range = Some((a - pad, b + pad));
    }
    fig.legend = LegendAt::TopRight;
    fig
}

/// A compact number for titles and legends (4 significant digits).
fn short(v: f64) -> String {
    if v != 0.0 && (v.abs() >= 1e5 || v.abs() < 1e-3) {
        return format!("{v:.3e}");
    }
    let decimals = (3 - v.abs().log10().floor() as i32).clamp(0, 8) as usize;
    let s = format!("{v:.decimals$}");
    if s.contains('.') {
        s.trim_end_matches('0').trim_end_matches('.').to_string()
    } else {
        s
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::render;
    use chiwave_core::encounter::{chi_sweep as sweep, nr, EncounterRequest};

    fn req(nu: f64, gamma: f64) -> EncounterRequest {
        EncounterRequest { nu: Some(nu), gamma: Some(gamma), ..Default::default() }
    }

    #[test]
    fn chi_j_figure_has_every_curve_and_the_capture_band() {
        let r = req(0.25, 1.1);
        let s = sweep(&r, SweepVar::J, 2.0, 2000.0, 120).unwrap();
        let fig = chi_sweep(&s, Some((50.0, 0.1)), AngleUnit::Rad);
        let band = fig.bands.iter().find(|b| b.label.starts_with("test body captured")).expect("capture band");
        // mpmath 1.3, dps 40 (tests/reference/encounter_mpmath.py): jcrit(γ = 1.1) = 4.724555912615340
        assert!((band.x1 - 4.724_555_912_615_34).abs() < 1e-12);
        let (svg, fr) = render(&fig).unwrap();
        assert!(fr.x_log && fr.y_log);
        for label in ["1PM", "2PM", "3PM conservative", "3PM (with radiation reaction)", "exact test body (ν → 0)", "strong-field estimate", "Newtonian", "test body captured (j ≤ j_c)", "this request (3PM)", "reduced angular momentum j", "CM scattering angle χ [rad]"] {
            assert!(svg.contains(label), "missing {label}");
        }
        // the band is drawn: a filled rectangle in the sand colour
        assert!(svg.to_uppercase().contains(&format!("FILL=\"{}\"", crate::hex(palette::SAND).to_uppercase())), "band rectangle");
    }

    #[test]
    fn chi_b_figure_axis_in_gm() {
        let r = req(0.1875, 1.1);
        let s = sweep(&r, SweepVar::B, 5.0, 5000.0, 60).unwrap();
        let fig = chi_sweep(&s, None, AngleUnit::Deg);
        let (svg, _) = render(&fig).unwrap();
        assert!(svg.contains("impact parameter b [GM/c²]") && svg.contains("[deg]") && svg.contains("test body captured (b ≤ b_c)"));
    }

    #[test]
    fn orbit_bodies_keep_the_centre_of_mass_and_the_relative_orbit() {
        let o = EobOrbit { r: vec![50.0, 20.0, 10.0, 20.0, 50.0], phi: vec![0.1, 0.6, 1.8, 3.0, 3.4], captured: false };
        let (m1, m2) = (0.25, 0.75);
        let fig = orbits(&o, m1, m2, Some(10.0));
        let p1: Vec<(f64, f64)> = fig.series[0].points.iter().flatten().copied().collect();
        let p2: Vec<(f64, f64)> = fig.series[1].points.iter().flatten().copied().collect();
        for (k, (a, b)) in p1.iter().zip(&p2).enumerate() {
            // m1 x1 + m2 x2 = 0 (CM) and |x1 − x2| = r (relative orbit); common practice, no source
            assert!((m1 * a.0 + m2 * b.0).abs() < 1e-12 && (m1 * a.1 + m2 * b.1).abs() < 1e-12);
            assert!((((a.0 - b.0).powi(2) + (a.1 - b.1).powi(2)).sqrt() - o.r[k]).abs() < 1e-12);
        }
        let (svg, fr) = render(&fig).unwrap();
        assert!(svg.contains("EOB effective radius") && svg.contains("closest approach") && svg.contains("centre of mass"));
        let ux = (fr.x_max - fr.x_min) / fr.width;
        let uy = (fr.y_max - fr.y_min) / fr.height;
        assert!((ux / uy - 1.0).abs() < 0.02);
        let cap = orbits(&EobOrbit { r: vec![100.0, 10.0, 2.0], phi: vec![0.0, 1.0, 4.0], captured: true }, m1, m2, None);
        let (svg, _) = render(&cap).unwrap();
        assert!(svg.contains("estimate predicts capture") && svg.contains("plunge"));
    }

    #[test]
    fn nr_figure_has_error_bars_and_predictions() {
        // synthetic rows, invented for this test (not NR data)
        let rows = nr::compare(&nr::parse_csv("E/M,J/M2,nu,chi,sigma\n1.02,1.10,0.25,1.00,0.05\n1.02,1.30,0.25,0.70,0.04\n").unwrap()).unwrap();
        let fig = nr_comparison(&rows, AngleUnit::Rad);
        let data = fig.markers.iter().find(|m| m.label.starts_with("your data")).unwrap();
        assert_eq!(data.error_bars.len(), 2);
        assert!((data.error_bars[0].hi - data.error_bars[0].lo - 0.1).abs() < 1e-12);
        let (svg, _) = render(&fig).unwrap();
        for label in ["1PM", "2PM", "3PM", "strong-field estimate", "your data ± σχ", "J/(G M²)"] {
            assert!(svg.contains(label), "missing {label}");
        }
    }
}
