//! Radiation figures (waveform request): strain against time, the sky map, the spectrum and
//! the slow-motion comparison. Built from plain arrays of the core's `WaveformResult` and
//! `SkyMap`; no physics here.

use crate::heatmap::Heat;
use chiwave_core::error::InputError;
use crate::{palette, Axis, Dash, Figure, LegendAt, Markers, Series, Style};

fn line(label: impl Into<String>, xs: &[f64], ys: &[f64], style: Style) -> Series {
    Series { label: label.into(), points: xs.iter().zip(ys).map(|(&x, &y)| Some((x, y))).collect(), style }
}

/// A horizontal line across `[x0, x1]`.
fn level(label: impl Into<String>, x0: f64, x1: f64, y: f64, style: Style) -> Series {
    Series { label: label.into(), points: vec![Some((x0, y)), Some((x1, y))], style }
}

/// A legend-only entry (a note; no points are drawn).
fn note(label: impl Into<String>) -> Series {
    Series { label: label.into(), points: Vec::new(), style: Style { color: [0xff, 0xff, 0xff], width: 1, dash: Dash::Solid, fill: None } }
}

/// Puts the legend in the corner with the fewest drawn points under it; if even that corner is
/// crowded and the y axis is linear, widens the y range on that side so that the curves
/// occupy the other two thirds of the plot and the legend covers nothing.
fn place_legend(fig: &mut Figure) {
    let ax = |v: f64, log: bool| if log { if v > 0.0 { v.log10() } else { f64::NAN } } else { v };
    let pts: Vec<(f64, f64)> = fig
        .series
        .iter()
        .flat_map(|s| s.points.iter().flatten().copied())
        .map(|(x, y)| (ax(x, fig.x.log), ax(y, fig.y.log)))
        .filter(|(x, y)| x.is_finite() && y.is_finite())
        .collect();
    let (x0, x1) = extent(&pts.iter().map(|p| p.0).collect::<Vec<_>>());
    let (y0, y1) = extent(&pts.iter().map(|p| p.1).collect::<Vec<_>>());
    if !(x1 > x0 && y1 > y0) {
        return;
    }
    // The legend box is wide (long labels): count the outer 70 % × 40 % of each corner.
    let count = |left: bool, top: bool| {
        pts.iter()
            .filter(|(x, y)| {
                let fx = (x - x0) / (x1 - x0);
                let fy = (y - y0) / (y1 - y0);
                (if left { fx < 0.7 } else { fx > 0.3 }) && (if top { fy > 0.6 } else { fy < 0.4 })
            })
            .count()
    };
    let options = [
        (LegendAt::TopRight, count(false, true)),
        (LegendAt::TopLeft, count(true, true)),
        (LegendAt::BottomRight, count(false, false)),
        (LegendAt::BottomLeft, count(true, false)),
    ];
    let (at, n) = options.iter().min_by_key(|o| o.1).copied().unwrap_or((LegendAt::TopRight, 0));
    fig.legend = at;
    if n > 0 && !fig.y.log && fig.y.range.is_none() {
        let span = (y1 - y0) / 0.62;
        fig.y.range = Some(match at {
            LegendAt::TopRight | LegendAt::TopLeft => (y0 - 0.04 * span, y0 + span),
            _ => (y1 - span, y1 + 0.04 * span),
        });
    }
}

fn extent(xs: &[f64]) -> (f64, f64) {
    let lo = xs.iter().copied().filter(|x| x.is_finite()).fold(f64::INFINITY, f64::min);
    let hi = xs.iter().copied().filter(|x| x.is_finite()).fold(f64::NEG_INFINITY, f64::max);
    (lo, hi)
}

fn g(v: f64) -> String {
    if v == 0.0 {
        "0".into()
    } else if (1e-3..1e5).contains(&v.abs()) {
        format!("{}", (v * 1e4).round() / 1e4)
    } else {
        format!("{v:.3e}")
    }
}

/// Inputs of the strain figure.
#[derive(Debug, Clone, PartialEq)]
pub struct StrainData<'a> {
    /// Time axis values (geometric u or seconds).
    pub t: &'a [f64],
    pub t_label: &'a str,
    pub h_plus: &'a [f64],
    pub h_cross: &'a [f64],
    /// Axis label of the strain, with its unit.
    pub h_label: &'a str,
    /// Late-minus-early strain (same scale as h); the early value of the O(G²) strain is 0.
    pub memory: (f64, f64),
    /// The u-independent O(G) piece (same scale as h), noted in the legend, not plotted.
    pub constant: (f64, f64),
    /// Detector response F₊h₊ + F×h×, if asked.
    pub detector: Option<&'a [f64]>,
    /// Frame name for the title ("rest frame of body 2", "centre of mass").
    pub frame: &'a str,
}

/// h₊ and h× against time, the memory levels (dotted) and a legend note with the constant O(G)
/// piece, which is kept out of the curves (it is not Lorentz-covariant; docs/physics/waveform.md §1).
pub fn strain(d: &StrainData) -> Figure {
    let mut fig = Figure::new(format!("Strain, {}", d.frame), Axis::linear(d.t_label), Axis::linear(d.h_label));
    let (x0, x1) = extent(d.t);
    fig.series.push(line("h₊", d.t, d.h_plus, Style::line(palette::TEAL, 2)));
    fig.series.push(line("h×", d.t, d.h_cross, Style::line(palette::CORAL, 2)));
    if let Some(h) = d.detector {
        fig.series.push(line("detector F₊h₊ + F×h×", d.t, h, Style::dashed(palette::INDIGO, 2)));
    }
    if x0 < x1 {
        fig.series.push(level(format!("memory Δh₊ = {}", g(d.memory.0)), x0, x1, d.memory.0, Style::dotted(palette::TEAL, 2)));
        fig.series.push(level(format!("memory Δh× = {}", g(d.memory.1)), x0, x1, d.memory.1, Style::dotted(palette::CORAL, 2)));
    }
    fig.series.push(note(format!("not plotted: constant O(G) piece h₊ = {}, h× = {}", g(d.constant.0), g(d.constant.1))));
    place_legend(&mut fig);
    fig
}

/// What a sky map shows.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum SkyKind {
    /// dE/dΩ, units of M (G = c = 1, D² absorbed).
    Energy,
    /// |D Δh| in units of GM/c².
    Memory,
}

/// Map projection of a sky figure.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Projection {
    /// Plate carrée: x = φ, y = 90° − θ (elevation above the orbital plane), both in degrees.
    #[default]
    Cylindrical,
    /// Lambert cylindrical equal-area: x = φ, y = cos θ = sin(elevation), so equal areas of
    /// the map are equal solid angles (Lambert 1772; common cartographic practice).
    EqualArea,
}

impl Projection {
    /// Reads `"cylindrical"` or `"equal_area"` (also `"equal-area"`).
    ///
    /// # Errors
    /// [`InputError`] naming `field` with the allowed values.
    pub fn parse(field: &'static str, s: &str) -> Result<Self, InputError> {
        match s.trim() {
            "cylindrical" => Ok(Projection::Cylindrical),
            "equal_area" | "equal-area" => Ok(Projection::EqualArea),
            other => Err(InputError::Inconsistent {
                field,
                reason: format!("unknown projection '{other}'; use cylindrical or equal_area"),
            }),
        }
    }

    /// Map y of a polar angle θ (rad).
    fn y(self, theta: f64) -> f64 {
        match self {
            Projection::Cylindrical => 90.0 - theta.to_degrees(),
            Projection::EqualArea => theta.cos(),
        }
    }

    fn y_axis(self) -> Axis {
        match self {
            Projection::Cylindrical => Axis { label: "elevation 90° − θ [deg]".into(), log: false, range: Some((-90.0, 90.0)) },
            Projection::EqualArea => {
                Axis { label: "cos θ = sin(elevation) (equal-area)".into(), log: false, range: Some((-1.0, 1.0)) }
            }
        }
    }
}

/// Inputs of the sky map.
#[derive(Debug, Clone, PartialEq)]
pub struct SkyData<'a> {
    /// Cell-centre polar angles θ (rad), evenly spaced over (0, π).
    pub theta: &'a [f64],
    /// Cell-centre azimuths φ (rad), evenly spaced over (−π, π).
    pub phi: &'a [f64],
    /// `values[i][j]` at (theta[i], phi[j]); NaN for cells not computed yet (left blank).
    pub values: &'a [Vec<f64>],
    pub kind: SkyKind,
    /// The observer direction (θ, φ) in rad, marked.
    pub observer: Option<(f64, f64)>,
    pub frame: &'a str,
    pub projection: Projection,
    /// M c² in joules (from the core) when the masses are physical: dE/dΩ is then drawn in J/sr.
    pub mc2_j: Option<f64>,
}

/// Cell edges from evenly spaced centres over [lo, hi].
fn edges(n: usize, lo: f64, hi: f64) -> Vec<f64> {
    (0..=n).map(|k| lo + (hi - lo) * k as f64 / n.max(1) as f64).collect()
}

/// Wraps an azimuth into (−180°, 180°].
fn wrap_deg(phi: f64) -> f64 {
    let mut p = phi.to_degrees() % 360.0;
    if p > 180.0 {
        p -= 360.0;
    }
    if p <= -180.0 {
        p += 360.0;
    }
    p
}

/// The sky on a θ–φ rectangle in the chosen [`Projection`] (the orbital normal θ = 0 at the top,
/// body 1's incoming direction φ = 0 in the middle), colour scale and colour bar; the observer
/// direction marked.
pub fn sky(d: &SkyData) -> Figure {
    let (title, label, log, k) = match (d.kind, d.mc2_j) {
        (SkyKind::Energy, None) => (format!("Energy per solid angle, {}", d.frame), "dE/dΩ [M]", true, 1.0),
        (SkyKind::Energy, Some(k)) => (format!("Energy per solid angle, {}", d.frame), "dE/dΩ [J sr⁻¹]", true, k),
        (SkyKind::Memory, _) => (format!("Memory over the sky, {}", d.frame), "|DΔh| [GM/c²]", false, 1.0),
    };
    let mut fig = Figure::new(
        title,
        Axis { label: "azimuth φ [deg] (body 1 moves along φ = 0)".into(), log: false, range: Some((-180.0, 180.0)) },
        d.projection.y_axis(),
    );
    let pi = std::f64::consts::PI;
    let ye: Vec<f64> = edges(d.theta.len(), 0.0, pi).into_iter().map(|t| d.projection.y(t)).collect();
    fig.heat = Some(Heat {
        x_edges: edges(d.phi.len(), -180.0, 180.0),
        y_edges: ye,
        values: d.values.iter().map(|row| row.iter().map(|v| v * k).collect()).collect(),
        label: label.into(),
        log,
        decades: 4.0,
    });
    if let Some((th, ph)) = d.observer {
        fig.markers.push(Markers {
            label: "observer direction".into(),
            points: vec![(wrap_deg(ph), d.projection.y(th))],
            error_bars: Vec::new(),
            color: palette::TEAL,
            radius: 6,
        });
    }
    // The orbital plane θ = 90°.
    fig.series.push(level("orbital plane", -180.0, 180.0, 0.0, Style::dashed(palette::SLATE, 1)));
    fig.legend = LegendAt::BottomRight;
    fig.width = 760;
    fig.height = 440;
    fig
}

/// Inputs of the spectrum figure: the core's curves (geometric; `physical` converts them for the plot).
pub type SpectrumData<'a> = chiwave_core::waveform::SpectrumCurves<'a>;

/// dE/(dω dΩ) and dE/dω against ω on log axes (or dE/(df dΩ), dE/df against f in SI), with the
/// zero-frequency limits marked as dotted levels.
pub fn spectrum(d: &SpectrumData) -> Figure {
    let (kx, ky, x_label, y_label, dir, sph) = match d.physical {
        Some(s) => (
            s.hz_per_omega,
            s.j_per_hz,
            "frequency f [Hz]",
            "dE/(df dΩ) [J Hz⁻¹ sr⁻¹], dE/df [J Hz⁻¹]",
            "dE/(df dΩ), observer direction (D² absorbed)",
            "dE/df, over the sphere",
        ),
        None => (
            1.0,
            1.0,
            "angular frequency ω [c³/(GM)]",
            "dE/(dω dΩ), dE/dω [M²] (E in Mc², ω in c³/GM)",
            "dE/(dω dΩ), observer direction",
            "dE/dω, over the sphere",
        ),
    };
    let x: Vec<f64> = d.omega.iter().map(|w| w * kx).collect();
    let ys = |v: &[f64]| -> Vec<f64> { v.iter().map(|y| y * ky).collect() };
    let dir_y = ys(d.de_domega_dsolid);
    let sph_y = d.de_domega.map(ys);
    let (zfl_dir, zfl_sph) = (d.zfl_direction * ky, d.zfl_closed * ky);
    let mut fig = Figure::new("Spectrum", Axis::log(x_label), Axis::log(y_label));
    let (x0, x1) = extent(&x);
    fig.series.push(line(dir, &x, &dir_y, Style::line(palette::TEAL, 2)));
    if let Some(s) = &sph_y {
        fig.series.push(line(sph, &x, s, Style::line(palette::INDIGO, 2)));
    }
    if x0 < x1 {
        if zfl_dir > 0.0 {
            fig.series.push(level("ω → 0 limit from the memory (direction)", x0, x1, zfl_dir, Style::dotted(palette::TEAL, 2)));
        }
        if sph_y.is_some() && zfl_sph > 0.0 {
            fig.series.push(level("ω → 0 limit, closed form (sphere)", x0, x1, zfl_sph, Style::dotted(palette::INDIGO, 2)));
        }
    }
    // Keep the plot from being dominated by the exponential tail: at most 8 decades below the top.
    let top = dir_y
        .iter()
        .chain(sph_y.as_deref().unwrap_or(&[]))
        .chain([zfl_dir, zfl_sph].iter())
        .copied()
        .filter(|v| v.is_finite() && *v > 0.0)
        .fold(0.0, f64::max);
    if top > 0.0 && x0 > 0.0 && x0 < x1 {
        fig.x.range = Some((x0, x1));
        fig.y.range = Some((top * 1e-8, top * 3.0));
    }
    place_legend(&mut fig);
    fig
}

/// The slow-motion comparison: the leading-order PM strain beside the quadrupole waveform of
/// the Newtonian hyperbola, same time axis.
pub fn slow_motion(t: &[f64], t_label: &str, pm: (&[f64], &[f64]), quad: (&[f64], &[f64]), h_label: &str) -> Figure {
    let mut fig = Figure::new("Slow-motion check: PM strain and quadrupole hyperbola", Axis::linear(t_label), Axis::linear(h_label));
    fig.series.push(line("h₊, leading-order PM", t, pm.0, Style::line(palette::TEAL, 2)));
    fig.series.push(line("h₊, quadrupole hyperbola", t, quad.0, Style::dashed(palette::AMBER, 2)));
    fig.series.push(line("h×, leading-order PM", t, pm.1, Style::line(palette::CORAL, 2)));
    fig.series.push(line("h×, quadrupole hyperbola", t, quad.1, Style::dashed(palette::PLUM, 2)));
    fig.series.push(note("differences grow like v (v²: CM frame, equal masses)"));
    fig.series.push(note("and like the deflection χ, up to ≈ 2.3χ: LO PM is first order in χ"));
    place_legend(&mut fig);
    fig
}

/// The electromagnetic radiation field D·E along e_θ and e_φ against time, with the memory
/// ∫du D·E = −DΔA⊥ noted in the legend (it is a time integral, not a level of the curves).
pub fn em_field(t: &[f64], t_label: &str, e_theta: &[f64], e_phi: &[f64], memory: (f64, f64)) -> Figure {
    let mut fig = Figure::new(
        "Radiation field, rest frame of body 2",
        Axis::linear(t_label),
        Axis::linear("D·E [c²/√G]"),
    );
    fig.series.push(line("D·E_θ", t, e_theta, Style::line(palette::TEAL, 2)));
    fig.series.push(line("D·E_φ", t, e_phi, Style::line(palette::CORAL, 2)));
    fig.series.push(note(format!("memory ∫du D·E = −DΔA⊥: θ {}, φ {}", g(memory.0), g(memory.1))));
    place_legend(&mut fig);
    fig
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::scene;
    use chiwave_core::request::Request;

    fn waveform_request() -> Request {
        serde_json::from_str(
            r#"{"kind": "waveform", "m1": 1, "m2": 1, "gamma": 1.3, "b": 60, "theta": 0.9, "phi": 0.5,
                "u_min": -600, "u_max": 600, "samples": 301}"#,
        )
        .unwrap()
    }

    fn labels(f: &Figure) -> Vec<&str> {
        f.series.iter().map(|s| s.label.as_str()).collect()
    }

    #[test]
    fn strain_figure_shows_both_polarisations_and_the_memory() {
        let f = scene::figure(&waveform_request(), "strain", &scene::Options::default()).unwrap();
        let l = labels(&f);
        assert!(l[..2] == ["h₊", "h×"], "{l:?}");
        assert!(l.iter().any(|s| s.starts_with("memory Δh₊")) && l.iter().any(|s| s.starts_with("memory Δh×")));
        assert!(l.iter().any(|s| s.starts_with("not plotted: constant O(G) piece")));
        // The memory level equals the late value of the curve (the O(G²) strain starts at 0
        // early; at u = 600 ≈ 10 b the residual is small): same number, drawn from the result.
        let hp = &f.series[0].points;
        let mem = f.series.iter().find(|s| s.label.starts_with("memory Δh₊")).unwrap().points[0].unwrap().1;
        let late = hp.last().unwrap().unwrap().1;
        assert!((late - mem).abs() < 0.05 * mem.abs().max(1e-30), "late {late} vs memory {mem}");
        let (svg, _) = crate::render(&f).unwrap();
        assert!(svg.contains("Strain, rest frame of body 2"));
    }

    #[test]
    fn equal_area_rows_are_equal_solid_angles() {
        let req = waveform_request();
        for (p, top, bottom) in [("cylindrical", 90.0, -90.0), ("equal_area", 1.0, -1.0)] {
            let opts = scene::Options { projection: Some(p.into()), ..Default::default() };
            let f = scene::figure(&req, "sky_memory", &opts).unwrap();
            let heat = f.heat.as_ref().unwrap();
            let ye = &heat.y_edges;
            assert_eq!(ye.len(), chiwave_core::waveform::grids::SKY_N_THETA + 1);
            assert!((ye[0] - top).abs() < 1e-12 && (ye[ye.len() - 1] - bottom).abs() < 1e-12);
            // Row i covers θ ∈ [iπ/n, (i+1)π/n]; its solid angle per unit azimuth is
            // cos θ_i − cos θ_{i+1} (elementary spherical geometry, common practice).
            let n = chiwave_core::waveform::grids::SKY_N_THETA as f64;
            for i in 0..chiwave_core::waveform::grids::SKY_N_THETA {
                let (t0, t1) = (i as f64 * std::f64::consts::PI / n, (i + 1) as f64 * std::f64::consts::PI / n);
                let h = ye[i] - ye[i + 1];
                if p == "equal_area" {
                    assert!((h - (t0.cos() - t1.cos())).abs() < 1e-12, "row {i}");
                } else {
                    assert!((h - 180.0 / n).abs() < 1e-9, "row {i}");
                }
            }
            // The observer marker sits at the request's direction in the projection.
            let m = &f.markers[0].points[0];
            let want = if p == "equal_area" { 0.9f64.cos() } else { 90.0 - 0.9f64.to_degrees() };
            assert!((m.0 - 0.5f64.to_degrees()).abs() < 1e-9 && (m.1 - want).abs() < 1e-9);
        }
        let bad = scene::Options { projection: Some("mercator".into()), ..Default::default() };
        assert_eq!(scene::figure(&req, "sky", &bad).unwrap_err().field(), "projection");
    }

    #[test]
    fn spectrum_figure_has_both_curves_and_limits_on_log_axes() {
        let f = scene::figure(&waveform_request(), "spectrum", &scene::Options::default()).unwrap();
        assert!(f.x.log && f.y.log);
        let l = labels(&f);
        for want in ["dE/(dω dΩ), observer direction", "dE/dω, over the sphere", "ω → 0 limit from the memory (direction)", "ω → 0 limit, closed form (sphere)"] {
            assert!(l.contains(&want), "{want} missing from {l:?}");
        }
        // The low-frequency end of the direction spectrum approaches its memory limit (Smarr
        // 1977 ZFL; the first ω is 1/100 of v/b, so within a few per cent).
        let first = f.series[0].points[0].unwrap().1;
        let zfl = f.series.iter().find(|s| s.label.starts_with("ω → 0 limit from the memory")).unwrap().points[0].unwrap().1;
        assert!((first / zfl - 1.0).abs() < 0.05, "{first} vs {zfl}");
    }

    #[test]
    fn physical_spectrum_in_hertz_and_sky_in_joules_per_steradian() {
        let mut req = waveform_request();
        if let Request::Waveform(r) = &mut req {
            r.m1 = Some(serde_json::from_str(r#""10 Msun""#).unwrap());
            r.m2 = Some(serde_json::from_str(r#""10 Msun""#).unwrap());
        }
        let geo = scene::figure(&waveform_request(), "spectrum", &scene::Options::default()).unwrap();
        let si = scene::figure(&req, "spectrum", &scene::Options::default()).unwrap();
        assert!(si.x.label.contains("[Hz]") && si.y.label.contains("J Hz⁻¹"));
        assert!(labels(&si).contains(&"dE/df, over the sphere"));
        // Same curve, rescaled by the core's factors (checked in waveform::observer).
        let s = chiwave_core::waveform::spectrum_si(20.0 * chiwave_core::units::SUN_LENGTH_M);
        let (g0, s0) = (geo.series[0].points[5].unwrap(), si.series[0].points[5].unwrap());
        assert!((s0.0 / (g0.0 * s.hz_per_omega) - 1.0).abs() < 1e-12);
        assert!((s0.1 / (g0.1 * s.j_per_hz) - 1.0).abs() < 1e-12);
        // The sky map of dE/dΩ in J/sr: the geometric map times M c² (20 M☉, IAU 2015 GM☉).
        let (g, p) = (scene::figure(&waveform_request(), "sky", &scene::Options::default()).unwrap(), scene::figure(&req, "sky", &scene::Options::default()).unwrap());
        let (gh, ph) = (g.heat.unwrap(), p.heat.unwrap());
        assert_eq!(ph.label, "dE/dΩ [J sr⁻¹]");
        let mc2 = 20.0 * chiwave_core::units::M_SUN_KG * 299_792_458f64.powi(2);
        assert!((ph.values[3][7] / (gh.values[3][7] * mc2) - 1.0).abs() < 1e-12);
    }

    #[test]
    fn slow_motion_figure_pairs_pm_and_quadrupole() {
        let f = scene::figure(&waveform_request(), "slow_motion", &scene::Options::default()).unwrap();
        let l = labels(&f);
        assert_eq!(&l[..4], ["h₊, leading-order PM", "h₊, quadrupole hyperbola", "h×, leading-order PM", "h×, quadrupole hyperbola"]);
        // The note says what the difference scales with: v and the deflection χ (tested in
        // chiwave-core tests/waveform_accuracy.rs).
        assert!(l.iter().any(|x| x.contains("like v")) && l.iter().any(|x| x.contains("deflection χ")), "{l:?}");
        assert_eq!(f.series[0].points.len(), f.series[1].points.len());
    }

    #[test]
    fn em_requests_get_a_named_error() {
        let req: Request = serde_json::from_str(
            r#"{"kind": "waveform", "force": "em", "q1": 0.1, "q2": -0.1, "m1": 1, "m2": 1, "gamma": 1.3, "b": 60,
                "theta": 0.9, "phi": 0.5, "u_min": -600, "u_max": 600}"#,
        )
        .unwrap();
        for name in ["strain", "sky", "spectrum"] {
            assert_eq!(scene::figure(&req, name, &scene::Options::default()).unwrap_err().field(), "force");
        }
        // The em field figure has its own name, and gravity requests are refused there.
        let f = scene::figure(&req, "em_field", &scene::Options::default()).unwrap();
        assert_eq!(&labels(&f)[..2], ["D·E_θ", "D·E_φ"]);
        assert!(labels(&f)[2].starts_with("memory ∫du D·E"));
        assert_eq!(scene::figure(&waveform_request(), "em_field", &scene::Options::default()).unwrap_err().field(), "force");
        // The closed-form Bessel spectrum: its low-frequency end approaches the soft-photon limit
        // |DΔA⊥|²/(4π²) from the memory (classical zero-frequency limit, docs/physics/waveform.md §5).
        let f = scene::figure(&req, "em_spectrum", &scene::Options::default()).unwrap();
        assert!(f.x.log && f.y.log && labels(&f).contains(&"dE/dω, over the sphere"));
        let first = f.series[0].points[0].unwrap().1;
        let zfl = f.series.iter().find(|s| s.label.starts_with("ω → 0 limit from the memory")).unwrap().points[0].unwrap().1;
        assert!((first / zfl - 1.0).abs() < 0.05, "{first} vs {zfl}");
    }
}
