//! The point-lens request as the page and `chiwave lens` send it (`{"kind": "lens", ...}`) and its
//! evaluation.

use super::results::{Image, LensResult};
use super::{accuracy, einstein_angle, flags, sources, wave, PointLens, REDSHIFT_MAX};
use crate::error::InputError;
use crate::units::codata2018::C;
use crate::units::iau2015::GM_SUN;
use crate::units::{astro::AU, parse_frequency, parse_length, parse_mass, AngleUnit, Length, Mass, Quantity};
use serde::{Deserialize, Serialize};

/// Point-lens request, as the page and `chiwave lens` send it.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct LensRequest {
    /// Lens mass with a unit (e.g. `"0.3Msun"`); a physical mass is required.
    pub mass: Quantity,
    /// Observer–lens distance D_L (e.g. `"4kpc"`; a bare number is in units of GM/c²).
    pub lens_distance: Quantity,
    /// Observer–source distance D_S > D_L.
    pub source_distance: Quantity,
    /// Source position β in units of the Einstein radius, 1e-10 ≤ offset ≤ 1e6.
    pub offset: f64,
    /// Wave frequency (e.g. `"100Hz"`); when present, w and the amplification factor are given.
    #[serde(default)]
    pub frequency: Option<Quantity>,
    /// Lens redshift z_L, 0 ≤ z_L ≤ 1000 (the redshifted mass (1 + z_L) M enters w and the delay).
    #[serde(default)]
    pub lens_redshift: f64,
    /// Relative tolerance of the verdicts, 1e-12 … 0.5 (default 1e-2).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub tolerance: Option<f64>,
}

impl LensRequest {
    /// Evaluates the request.
    ///
    /// # Errors
    /// Validation errors naming the field and its allowed range: `mass` (physical, > 0),
    /// `lens_distance`, `source_distance` (> 0, D_L < D_S), `offset` (1e-10 … 1e6),
    /// `lens_redshift` (0 … 1000), `frequency` (> 0, with finite w).
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::lensing::LensRequest;
    /// let r = LensRequest {
    ///     mass: "0.3Msun".into(), lens_distance: "4kpc".into(), source_distance: "8kpc".into(),
    ///     offset: 0.5, frequency: None, lens_redshift: 0.0, tolerance: None,
    /// };
    /// let out = r.evaluate().unwrap();
    /// // θ_E = √(4GM D_LS/(c² D_L D_S)) (Einstein 1936) with IAU 2015 GM☉ and the IAU parsec,
    /// // evaluated independently: θ_E = 0.552625097039022 mas, R_E = θ_E D_L = 2.21050038815609 au.
    /// assert!((out.einstein_radius_mas / 0.552625097039022 - 1.0).abs() < 1e-12);
    /// assert!((out.einstein_radius_au / 2.21050038815609 - 1.0).abs() < 1e-12);
    /// ```
    pub fn evaluate(&self) -> Result<LensResult, InputError> {
        let tol = crate::validity::tolerance(self.tolerance)?;
        let gm = match parse_mass("mass", &self.mass)? {
            Mass::Physical { gm } => gm,
            Mass::Geometric(_) => {
                return Err(InputError::Inconsistent {
                    field: "mass",
                    reason: "give the lens mass with a unit (kg, g, Msun, Mearth, Mjup), e.g. 0.3Msun; lensing needs a physical mass".into(),
                })
            }
        };
        let mass_length = gm / (C * C);
        let metres = |field: &'static str, q: &Quantity| -> Result<f64, InputError> {
            let v = match parse_length(field, q)? {
                Length::Physical { m } => m,
                Length::Geometric(x) => x * mass_length,
            };
            crate::error::positive(field, v)
        };
        let d_l = metres("lens_distance", &self.lens_distance)?;
        let d_s = metres("source_distance", &self.source_distance)?;
        let lens = PointLens::new(self.offset)?;
        let z_l = self.lens_redshift;
        if !z_l.is_finite() {
            return Err(InputError::NotFinite { field: "lens_redshift", value: z_l });
        }
        if !(0.0..=REDSHIFT_MAX).contains(&z_l) {
            return Err(InputError::OutOfRange {
                field: "lens_redshift",
                value: z_l,
                allowed: format!("0 ≤ lens_redshift ≤ {REDSHIFT_MAX}"),
            });
        }
        let frequency = match &self.frequency {
            Some(q) => Some(parse_frequency("frequency", q)?),
            None => None,
        };
        let theta = einstein_angle(gm, d_l, d_s)?;
        let r_e = theta * d_l;
        let gm_z = (1.0 + z_l) * gm;
        let [x_p, x_m] = lens.image_positions();
        let [mu_p, mu_m] = lens.magnifications();
        let delta_t = lens.time_delay();
        let time_delay_s = 4.0 * gm_z / (C * C * C) * delta_t;

        // Deflection at the Einstein ring, 4GM/(c² R_E): the thin-lens formulas are its first order.
        let alpha_e = 4.0 * gm / (C * C) / r_e;
        let mut flags = flags::point_lens(theta, alpha_e, z_l, lens.offset(), lens.total_magnification(), tol);
        let (sources, citations) = sources::lens(frequency.is_some());

        let mut result = LensResult {
            best: crate::validity::Best::none("total_magnification", "not evaluated", tol),
            tolerance: tol,
            einstein_radius_rad: theta,
            einstein_radius_mas: AngleUnit::Mas.from_rad(theta),
            einstein_radius_au: r_e / AU,
            einstein_radius_m: r_e,
            images: vec![
                Image { position: x_p, magnification: mu_p },
                Image { position: x_m, magnification: mu_m },
            ],
            total_magnification: lens.total_magnification(),
            time_delay_s,
            time_delay_dimensionless: delta_t,
            offset: lens.offset(),
            mass_msun: gm / GM_SUN,
            redshifted_mass_msun: gm_z / GM_SUN,
            frequency_hz: frequency,
            w: None,
            amplification: None,
            amplification_abs: None,
            amplification_phase_rad: None,
            amplification_geometric: None,
            amplification_method: None,
            estimates: crate::validity::Estimates::new(),
            flags: Vec::new(),
            sources,
            citations,
        };

        let mut wave_part = None;
        if let Some(f) = frequency {
            let w = wave::dimensionless_frequency(gm_z, f);
            if !(w.is_finite() && w <= wave::W_MAX) {
                return Err(InputError::OutOfRange {
                    field: "frequency",
                    value: f,
                    allowed: format!(
                        "a frequency giving w = 8πG(1 + z_L)M f/c³ ≤ {:e} (here w = {w:e})",
                        wave::W_MAX
                    ),
                });
            }
            let to_request = |e: InputError| match e {
                InputError::OutOfRange { field: "y", value, allowed } => {
                    InputError::OutOfRange { field: "offset", value, allowed }
                }
                InputError::OutOfRange { field: "w", value, allowed } => {
                    InputError::OutOfRange { field: "frequency", value, allowed }
                }
                other => other,
            };
            let a = wave::amplification(w, lens.offset()).map_err(to_request)?;
            let geo = wave::amplification_geometric(w, lens.offset()).map_err(to_request)?;
            result.w = Some(w);
            result.amplification = Some(a.value.into());
            result.amplification_abs = Some(a.value.norm());
            result.amplification_phase_rad = Some(a.value.arg());
            result.amplification_geometric = Some(geo.into());
            result.amplification_method = Some(match a.method {
                wave::Method::Series => "series",
                wave::Method::Continuation { .. } => "continuation",
                wave::Method::Asymptotic => "asymptotic",
                wave::Method::GeometricOptics => "geometric_optics",
            });
            wave_part = Some(accuracy::Wave { w, f: a.value, geometric: geo, method: a.method });
        }
        let (estimates, best) = accuracy::lens(lens.offset(), alpha_e, lens.total_magnification(), wave_part.as_ref(), tol);
        if let Some(wv) = &wave_part {
            flags.extend(flags::wave_optics(wv.w, delta_t, wv.method, &estimates["amplification_geometric"]));
        }
        result.estimates = estimates;
        result.best = best;
        result.flags = flags;
        Ok(result)
    }
}
