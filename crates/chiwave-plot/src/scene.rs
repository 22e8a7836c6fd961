//! Figure dispatch, shared by the page and the CLI: request + figure name → the core's plot data
//! → one builder of [`crate::figures`]. No physics here: every number comes from a core function.

use crate::{figures, figures_encounter, figures_waveform, Figure};
use chiwave_core::encounter::EncounterRequest;
use chiwave_core::waveform::grids::{self, SKY_N_PHI, SKY_N_THETA};
use chiwave_core::waveform::{spectrum_si, sky_map, Binary, Frame, SkyQuantity, SpectrumOptions, WaveformRequest, WaveformResult, GravityWaveformResult};
use chiwave_core::deflection::{self, LightRequest};
use chiwave_core::error::InputError;
use chiwave_core::lensing::{self, LensRequest};
use chiwave_core::request::Request;
use chiwave_core::units::AngleUnit;
use serde::Deserialize;

/// Drawing options (sent by the page as JSON; set by the CLI from its options).
#[derive(Debug, Clone, Default, Deserialize)]
#[serde(default, deny_unknown_fields)]
pub struct Options {
    pub angle_unit: Option<String>,
    pub width: Option<u32>,
    pub height: Option<u32>,
    /// Sky-map projection: "cylindrical" (default) or "equal_area".
    pub projection: Option<String>,
}

impl Options {
    fn angle(&self) -> Result<AngleUnit, InputError> {
        match &self.angle_unit {
            None => Ok(AngleUnit::Rad),
            Some(s) => AngleUnit::parse("angle_unit", s),
        }
    }

    /// The sky-map projection.
    ///
    /// # Errors
    /// [`InputError`] naming `projection`.
    pub fn projection(&self) -> Result<figures_waveform::Projection, InputError> {
        match &self.projection {
            None => Ok(figures_waveform::Projection::default()),
            Some(s) => figures_waveform::Projection::parse("projection", s),
        }
    }
}

/// Figure names per request kind.
pub fn names(kind: &str) -> &'static [&'static str] {
    match kind {
        "light" => &["alpha_b", "rays"],
        "lens" => &["amplification", "magnification"],
        "encounter" => &["chi_b", "chi_j", "orbits"],
        "waveform" => &["strain", "sky", "sky_memory", "spectrum", "slow_motion", "em_field", "em_spectrum"],
        _ => &[],
    }
}

fn unknown(kind: &str, name: &str) -> InputError {
    let allowed = names(kind).join(", ");
    let allowed = if allowed.is_empty() { "none yet".to_string() } else { allowed };
    InputError::Inconsistent { field: "figure", reason: format!("no figure '{name}' for kind '{kind}'; available: {allowed}") }
}

fn sized(mut fig: Figure, opts: &Options) -> Figure {
    if let Some(w) = opts.width {
        fig.width = w.clamp(320, 2400);
    }
    if let Some(h) = opts.height {
        fig.height = h.clamp(240, 1800);
    }
    fig
}

/// Samples of the |F|(w) figure: enough for the oscillations on a 760 px wide plot.
const AMPLIFICATION_SAMPLES: usize = 240;
/// Samples of the μ(u) figure.
const MAGNIFICATION_SAMPLES: usize = 300;

/// Points of the α(b) sweep (log-spaced).
const SWEEP_SAMPLES: usize = 400;
/// Points per ray path.
const RAY_POINTS: usize = 400;

fn light_figure(r: &LightRequest, name: &str, opts: &Options) -> Result<Figure, InputError> {
    let res = r.evaluate()?;
    let b = res.b_over_m;
    let bc = res.critical_b;
    match name {
        "alpha_b" => {
            // From inside the capture region to well into the weak field, always containing b.
            let b_min = (0.5 * bc).min(0.5 * b).max(1e-3);
            let b_max = (1e4f64).max(30.0 * b).min(1e12);
            let s = deflection::sweep(r, b_min, b_max, SWEEP_SAMPLES)?;
            let partials: Vec<figures::Partial> = s
                .series
                .iter()
                .map(|p| figures::Partial { label: format!("series to order {}", p.order), values: p.alpha.iter().map(|&a| Some(a)).collect() })
                .collect();
            Ok(figures::deflection_vs_b(&figures::DeflectionSweep {
                b: &s.b,
                exact: &s.alpha,
                partials: &partials,
                strong: s.strong_deflection.as_deref(),
                critical_b: Some(s.critical_b),
                current: res.alpha.map(|a| (b, a)),
                b_unit: "M",
                angle: opts.angle()?,
            }))
        }
        "rays" => {
            // A fan around the critical impact parameter plus the request's own ray.
            let mut bs: Vec<f64> = [0.55, 0.85, 1.02, 1.15, 1.45, 2.0, 3.0].iter().map(|k| k * bc).collect();
            let extent = (4.0 * bc).max(1.25 * b).min(1e5);
            if b < 1.5 * extent {
                bs.push(b);
            }
            bs.sort_by(f64::total_cmp);
            bs.dedup_by(|a, b| (*a - *b).abs() < 1e-9 * b.abs());
            let largest = bs.last().copied().unwrap_or(b);
            let r_max = (1.5 * largest).max(1.6 * extent).min(1e6);
            let fan = deflection::rays(r, &bs, r_max, RAY_POINTS)?;
            let paths: Vec<figures::RayPath> =
                fan.rays.iter().map(|ray| figures::RayPath { x: ray.x.clone(), y: ray.y.clone(), captured: ray.captured }).collect();
            let horizon = (fan.horizon_radius > 0.0).then_some(fan.horizon_radius);
            Ok(figures::rays(&paths, horizon, Some(fan.photon_orbit_radius), extent))
        }
        _ => Err(unknown("light", name)),
    }
}

fn lens_figure(r: &LensRequest, name: &str) -> Result<Figure, InputError> {
    let res = r.evaluate()?;
    match name {
        "amplification" => {
            // The w range spans the diffraction (w ≲ 1) and geometric (w ≫ 1) regimes and
            // includes the request's own w when one is given.
            let (w_min, w_max) = match res.w {
                Some(w) if w.is_finite() && w > 0.0 => ((w / 30.0).min(0.01), (w * 30.0).clamp(100.0, 1e4)),
                _ => (0.01, 100.0),
            };
            let c = lensing::wave::amplification_curve(r.offset, w_min, w_max, AMPLIFICATION_SAMPLES)
                ?;
            let abs: Vec<Option<f64>> = c.abs.iter().map(|&v| Some(v)).collect();
            let geo: Option<Vec<Option<f64>>> = c.abs_geometric.as_ref().map(|g| g.iter().map(|&v| Some(v)).collect());
            Ok(figures::amplification(&c.w, &abs, geo.as_deref(), res.w))
        }
        "magnification" => {
            let u_max = (3.0 * r.offset).clamp(2.0, 1e6);
            let u_min = (u_max / MAGNIFICATION_SAMPLES as f64).min(0.5 * r.offset).max(1e-10);
            let c = lensing::magnification_curve(u_min, u_max, MAGNIFICATION_SAMPLES)?;
            Ok(figures::magnification(&c.offset, &c.total, &c.plus, &c.minus, Some((res.offset, res.total_magnification))))
        }
        _ => Err(unknown("lens", name)),
    }
}

/// Points of the χ(b) / χ(j) sweep (log-spaced; ≈1 ms natively for 500).
const CHI_SWEEP_SAMPLES: usize = 300;
/// Points of the estimate's relative orbit.
const ORBIT_SAMPLES: usize = 700;

fn encounter_figure(r: &EncounterRequest, name: &str, opts: &Options) -> Result<Figure, InputError> {
    use chiwave_core::encounter::{self as enc, EncounterResult, SweepVar};
    let res = r.evaluate()?;
    let g = match res {
        EncounterResult::Gravity(g) => g,
        EncounterResult::Em(_) => {
            return Err(InputError::Inconsistent { field: "force", reason: format!("figure '{name}' is available for force \"gravity\" only") })
        }
    };
    match name {
        "chi_b" | "chi_j" => {
            let (var, x, xc) = if name == "chi_b" { (SweepVar::B, g.b_over_gm, g.b_critical_test_body) } else { (SweepVar::J, g.j, g.j_critical_test_body) };
            // From inside the capture region to deep in the weak field, always containing x.
            let lo = (0.5 * xc).min(0.5 * x).max(2e-6);
            let hi = (30.0 * x).max(300.0 * xc).min(1e55).max(4.0 * lo);
            let s = enc::chi_sweep(r, var, lo, hi, CHI_SWEEP_SAMPLES)?;
            Ok(figures_encounter::chi_sweep(&s, Some((x, g.chi.pm3)), opts.angle()?))
        }
        "orbits" => {
            let c = &g.coefficients;
            let o = enc::eob::orbit(g.gamma, g.nu, g.j, &[c.chi1, c.chi2, c.chi3], ORBIT_SAMPLES)?;
            let r_min = match g.estimate {
                Some(enc::eob::Estimate::Scattered { r_min, .. }) => Some(r_min),
                _ => None,
            };
            Ok(figures_encounter::orbits(&o, g.kinematics.m1, g.kinematics.m2, r_min))
        }
        _ => Err(unknown("encounter", name)),
    }
}

fn kind_of(req: &Request) -> &'static str {
    match req {
        Request::Light(_) => "light",
        Request::Lens(_) => "lens",
        Request::Encounter(_) => "encounter",
        Request::Waveform(_) => "waveform",
        #[allow(unreachable_patterns)]
        _ => "this kind",
    }
}

/// The figure `name` for `req`, sized by `opts`.
///
/// # Errors
/// The request's own validation errors, or an error on `figure` for an unknown name.
pub fn figure(req: &Request, name: &str, opts: &Options) -> Result<Figure, InputError> {
    let fig = match req {
        Request::Light(r) => light_figure(r, name, opts),
        Request::Lens(r) => lens_figure(r, name),
        Request::Encounter(r) => encounter_figure(r, name, opts),
        Request::Waveform(r) => waveform_figure(r, name, opts),
        // Kinds without figures yet: say which kind, so the page can show it next to the plot.
        #[allow(unreachable_patterns)]
        other => Err(unknown(kind_of(other), name)),
    }?;
    Ok(sized(fig, opts))
}

/// The waveform request evaluated without the sky integral (the figures never need it; the
/// page runs that integral progressively), plus the validated system and observer direction.
///
/// # Errors
/// The request's own validation errors.
pub fn waveform_system(r: &WaveformRequest) -> Result<(GravityWaveformResult, Binary, (f64, f64)), InputError> {
    let mut q = r.clone();
    q.energy_flux = false;
    let res = match q.evaluate()? {
        WaveformResult::Gravity(g) => *g,
        WaveformResult::Em(_) => {
            return Err(InputError::Inconsistent {
                field: "force",
                reason: "figures are drawn for the gravitational waveform only; use the table or --csv for the electromagnetic field".into(),
            })
        }
    };
    // The request's own validated system and direction (no second reading of the angles here).
    let g = r.gravity_system()?;
    Ok((res, g.binary, g.observer))
}

/// Frame caption for figure titles.
pub fn frame_caption(f: Frame) -> &'static str {
    match f {
        Frame::Rest2 => "rest frame of body 2",
        Frame::Cm => "centre-of-mass frame",
    }
}

/// Time axis and strain scale of a waveform result: seconds and the dimensionless strain at the
/// observer when the result has physical values (and a distance), geometric units otherwise.
struct Axes {
    t: Vec<f64>,
    t_label: &'static str,
    /// Multiplies a geometric D·h/(GM/c²) into the plotted strain.
    h_scale: f64,
    h_label: &'static str,
}

fn waveform_axes(res: &GravityWaveformResult) -> Axes {
    match &res.physical {
        Some(p) => {
            let (h_scale, h_label) = match p.distance_m {
                Some(d) if d > 0.0 => (p.scales.mass_length_m / d, "strain h at the observer [dimensionless]"),
                _ => (1.0, "D·h/(GM/c²) [dimensionless]"),
            };
            Axes { t: p.u_s.clone(), t_label: "retarded time u [s]", h_scale, h_label }
        }
        None => Axes { t: res.u.clone(), t_label: "retarded time u [GM/c³]", h_scale: 1.0, h_label: "D·h/(GM/c²) [dimensionless]" },
    }
}

fn scale(v: &[f64], k: f64) -> Vec<f64> {
    v.iter().map(|x| x * k).collect()
}

fn waveform_figure(r: &WaveformRequest, name: &str, opts: &Options) -> Result<Figure, InputError> {
    match name {
        "strain" => {
            let (res, _, _) = waveform_system(r)?;
            let a = waveform_axes(&res);
            let hp = scale(&res.h_plus, a.h_scale);
            let hc = scale(&res.h_cross, a.h_scale);
            let det = res.detector.as_ref().map(|d| scale(&d.h, a.h_scale));
            Ok(figures_waveform::strain(&figures_waveform::StrainData {
                t: &a.t,
                t_label: a.t_label,
                h_plus: &hp,
                h_cross: &hc,
                h_label: a.h_label,
                memory: (res.memory.plus * a.h_scale, res.memory.cross * a.h_scale),
                constant: (res.constant_piece.plus * a.h_scale, res.constant_piece.cross * a.h_scale),
                detector: det.as_deref(),
                frame: frame_caption(res.frame),
            }))
        }
        "sky" | "sky_memory" => {
            let projection = opts.projection()?;
            let (res, sys, obs) = waveform_system(r)?;
            let (kind, q) = if name == "sky" {
                (figures_waveform::SkyKind::Energy, SkyQuantity::EnergyPerSolidAngle)
            } else {
                (figures_waveform::SkyKind::Memory, SkyQuantity::Memory)
            };
            let map = sky_map(&sys, res.frame, q, SKY_N_THETA, SKY_N_PHI)?;
            Ok(figures_waveform::sky(&figures_waveform::SkyData {
                theta: &map.theta,
                phi: &map.phi,
                values: &map.values,
                kind,
                observer: Some(obs),
                frame: frame_caption(res.frame),
                projection,
                mc2_j: res.physical.as_ref().map(|p| p.mc2_j),
            }))
        }
        "spectrum" => {
            let mut q = r.clone();
            let sys = r.gravity_system()?.binary;
            q.spectrum = Some(grids::figure_spectrum(sys.v(), sys.b, sys.gamma, true));
            q.samples = 2;
            let (res, _, _) = waveform_system(&q)?;
            let s = res.spectrum.ok_or(InputError::Inconsistent { field: "spectrum", reason: "no spectrum in the result".into() })?;
            Ok(figures_waveform::spectrum(&figures_waveform::SpectrumData {
                omega: &s.omega,
                de_domega_dsolid: &s.de_domega_dsolid,
                de_domega: s.de_domega.as_deref(),
                zfl_direction: s.zfl_direction,
                zfl_closed: s.zfl_closed,
                physical: res.physical.as_ref().map(|p| spectrum_si(p.scales.mass_length_m)),
            }))
        }
        "slow_motion" => {
            let mut q = r.clone();
            q.quadrupole = true;
            let (res, _, _) = waveform_system(&q)?;
            let a = waveform_axes(&res);
            let quad = res.quadrupole.as_ref().ok_or(InputError::Inconsistent { field: "quadrupole", reason: "no quadrupole waveform in the result".into() })?;
            let (hp, hc) = (scale(&res.h_plus, a.h_scale), scale(&res.h_cross, a.h_scale));
            let (qp, qc) = (scale(&quad.h_plus, a.h_scale), scale(&quad.h_cross, a.h_scale));
            Ok(figures_waveform::slow_motion(&a.t, a.t_label, (&hp, &hc), (&qp, &qc), a.h_label))
        }
        "em_field" => {
            let res = em_result(r, name, None)?;
            let (t, t_label) = match &res.physical {
                Some(p) => (p.u_s.clone(), "retarded time u [s]"),
                None => (res.u.clone(), "retarded time u [GM/c³]"),
            };
            Ok(figures_waveform::em_field(&t, t_label, &res.e_theta, &res.e_phi, (res.memory.theta, res.memory.phi)))
        }
        "em_spectrum" => {
            let mut q = r.clone();
            q.samples = 2;
            let res0 = em_result(&q, name, None)?;
            let opts = grids::figure_spectrum(res0.v, res0.b_over_gm, res0.gamma, true);
            let res = em_result(r, name, Some(opts))?;
            let s = res.spectrum.ok_or(InputError::Inconsistent { field: "spectrum", reason: "no spectrum in the result".into() })?;
            let mut fig = figures_waveform::spectrum(&figures_waveform::SpectrumData {
                omega: &s.omega,
                de_domega_dsolid: &s.de_domega_dsolid,
                de_domega: s.de_domega.as_deref(),
                zfl_direction: s.zfl_direction,
                zfl_closed: 0.0,
                physical: None,
            });
            fig.title = "Electromagnetic spectrum (closed-form Bessel K0/K1), rest frame of body 2".into();
            Ok(fig)
        }
        _ => Err(unknown("waveform", name)),
    }
}

/// The electromagnetic result of a waveform request for figure `name` (no flux integral),
/// with the spectrum options `spectrum` if given.
fn em_result(
    r: &WaveformRequest,
    name: &str,
    spectrum: Option<SpectrumOptions>,
) -> Result<Box<chiwave_core::waveform::EmWaveformResult>, InputError> {
    let mut q = r.clone();
    q.energy_flux = false;
    if spectrum.is_some() {
        q.spectrum = spectrum;
        q.samples = 2; // the spectrum needs no time samples
    }
    match q.evaluate()? {
        WaveformResult::Em(e) => Ok(e),
        WaveformResult::Gravity(_) => Err(InputError::Inconsistent {
            field: "force",
            reason: format!("figure '{name}' is for force \"em\"; use 'strain' or 'spectrum' for gravity"),
        }),
    }
}
