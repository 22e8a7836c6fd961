//! The sky integrals of one gravitational waveform request, advanced a few directions at a time
//! so that a page can keep drawing between steps: the energy-momentum balance (flux integral
//! against Herrmann et al. 2021), a sky map, and the angle-integrated spectrum dE/dω.
//!
//! Nothing new is computed here: each phase is the same sum as its one-shot counterpart
//! ([`SkyIntegrator::run`], [`sky_map`](super::sky_map), [`spectrum_angle_integrated`](super::spectrum_angle_integrated)),
//! cut into steps (tests below check that the results agree exactly).

use super::energy::{check_sky_grid, radiated_closed_form, sky_axes, sky_cell, RadiatedClosed, SkyIntegrator, SkyOptions, SkyQuantity};
use super::frames::{Binary, Frame};
use super::kernel::{DirectionWaveform, DEFAULT_X_NODES};
use super::observer::{spectrum_si, SpectrumSi};
use super::memory::zfl_angle_integrated_closed_form;
use super::gravity::mc2_joules;
use super::grids::SPECTRUM_SKY;
use super::request::WaveformRequest;
use super::spectrum::SkySpectrum;
use super::SkyMap;
use crate::error::InputError;
use serde::Serialize;

/// Which sum a [`WaveformJob`] is working on.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum WaveformPhase {
    /// The energy-momentum flux integral (the balance against the closed form).
    Balance,
    /// The sky map, one θ row at a time.
    SkyMap,
    /// dE/dω over the sphere.
    Spectrum,
    /// Everything done.
    Done,
}

/// Where a [`WaveformJob`] stands, with the partial energy balance (G = c = 1, units of M).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct WaveformSnapshot {
    pub phase: WaveformPhase,
    /// Fraction of all the work done, in [0, 1] (weighted by the number of directions).
    pub fraction: f64,
    /// Fractions of each phase, in [0, 1].
    pub balance_fraction: f64,
    pub map_fraction: f64,
    pub spectrum_fraction: f64,
    pub done: bool,
    /// E_rad/(M c²) from the flux integral over the directions done so far (the full integral once
    /// `balance_fraction` = 1).
    pub e_rad_flux: f64,
    /// E_rad/(M c²), closed form of Herrmann et al. 2021 (arXiv:2101.07255).
    pub e_rad_closed: f64,
    /// |e_rad_flux − e_rad_closed|/e_rad_closed, once the flux integral is complete.
    pub e_rad_rel_diff: Option<f64>,
    /// Radiated momentum P/(M c) so far, from the flux.
    pub p_rad_flux: [f64; 3],
    /// Radiated momentum P/(M c), closed form (∝ u1 + u2, along x).
    pub p_rad_closed: [f64; 3],
    /// |P_flux − P_closed|/E_closed, once complete (the momentum balance; P_closed can vanish in
    /// the CM frame, so the difference is measured against the radiated energy).
    pub p_rad_rel_diff: Option<f64>,
    /// M c² in joules, when the masses are physical (multiplies the geometric energies).
    pub mc2_j: Option<f64>,
    /// e_rad_flux and e_rad_closed in joules, when the masses are physical.
    pub e_rad_flux_j: Option<f64>,
    pub e_rad_closed_j: Option<f64>,
    /// Directions done and in all.
    pub cells_done: usize,
    pub cells_total: usize,
}

/// The progressive sky integrals of one request (gravity only).
///
/// # Examples
/// ```
/// use chiwave_core::waveform::{WaveformJob, SkyQuantity, WaveformRequest};
/// let req: WaveformRequest = serde_json::from_str(
///     r#"{"m1": 1, "m2": 1, "gamma": 1.2, "b": 30, "theta": 1.0, "phi": 0.3, "u_min": -50, "u_max": 50}"#,
/// ).unwrap();
/// let mut job = WaveformJob::new(&req, SkyQuantity::Memory, 4, 8, &[0.001, 0.01]).unwrap();
/// let first = job.step(10).unwrap();
/// assert!(!first.done && first.fraction > 0.0);
/// let last = job.run().unwrap();
/// assert!(last.done && last.e_rad_rel_diff.unwrap() < 1e-8);
/// ```
#[derive(Debug, Clone)]
pub struct WaveformJob {
    sys: Binary,
    frame: Frame,
    observer: (f64, f64),
    mc2_j: Option<f64>,
    /// SI factors of the spectrum, when the masses are physical.
    physical: Option<SpectrumSi>,
    closed: RadiatedClosed,
    balance: SkyIntegrator,
    quantity: SkyQuantity,
    n_theta: usize,
    n_phi: usize,
    /// Sky-map cells done, row by row (row-major).
    map_cells: Vec<f64>,
    spectrum: SkySpectrum,
    direction_spectrum: Vec<f64>,
    zfl_direction: f64,
}

impl WaveformJob {
    /// Sets up the three sums for `req` (its `energy_flux`, `spectrum` and `quadrupole` fields are
    /// not used): the balance on the sky rule [`SkyOptions::for_gamma`], a sky map of `quantity`
    /// on `n_theta` × `n_phi` cells, and dE/dω at `omega` on [`SPECTRUM_SKY`].
    ///
    /// # Errors
    /// The request's validation errors (`force` for em); `n_theta`/`n_phi` (1..=512); `omega`.
    pub fn new(
        req: &WaveformRequest,
        quantity: SkyQuantity,
        n_theta: usize,
        n_phi: usize,
        omega: &[f64],
    ) -> Result<Self, InputError> {
        let g = req.gravity_system()?;
        let (sys, observer, mc2_j) = (g.binary, g.observer, g.mass_length_m.map(mc2_joules));
        let physical = g.mass_length_m.map(spectrum_si);
        check_sky_grid(n_theta, n_phi)?;
        let frame = req.frame;
        let w = DirectionWaveform::new(&sys, frame, observer.0, observer.1, DEFAULT_X_NODES)?;
        let spectrum = SkySpectrum::new(&sys, frame, omega, SPECTRUM_SKY)?;
        Ok(WaveformJob {
            sys,
            frame,
            observer,
            mc2_j,
            physical,
            closed: radiated_closed_form(&sys, frame),
            balance: SkyIntegrator::new(&sys, frame, SkyOptions::for_gamma(sys.gamma))?,
            quantity,
            n_theta,
            n_phi,
            map_cells: Vec::with_capacity(n_theta * n_phi),
            direction_spectrum: omega.iter().map(|&x| w.spectrum(x)).collect(),
            zfl_direction: w.spectrum(0.0),
            spectrum,
        })
    }

    /// The current phase.
    pub fn phase(&self) -> WaveformPhase {
        if !self.balance.progress().done {
            WaveformPhase::Balance
        } else if self.map_cells.len() < self.n_theta * self.n_phi {
            WaveformPhase::SkyMap
        } else if !self.spectrum.done() {
            WaveformPhase::Spectrum
        } else {
            WaveformPhase::Done
        }
    }

    /// Does `work` directions of work (within the current phase) and returns the snapshot.
    ///
    /// # Errors
    /// [`InputError`] from a direction (not expected: every direction comes from a unit vector).
    pub fn step(&mut self, work: usize) -> Result<WaveformSnapshot, InputError> {
        let work = work.max(1);
        match self.phase() {
            WaveformPhase::Balance => {
                self.balance.step(work);
            }
            WaveformPhase::SkyMap => {
                let total = self.n_theta * self.n_phi;
                let end = self.map_cells.len().saturating_add(work).min(total);
                for k in self.map_cells.len()..end {
                    let (i, j) = (k / self.n_phi, k % self.n_phi);
                    let v = sky_cell(&self.sys, self.frame, self.quantity, self.n_theta, self.n_phi, i, j)?;
                    self.map_cells.push(v);
                }
            }
            WaveformPhase::Spectrum => {
                self.spectrum.step(work)?;
            }
            WaveformPhase::Done => {}
        }
        Ok(self.snapshot())
    }

    /// Runs every phase to the end.
    ///
    /// # Errors
    /// As [`WaveformJob::step`].
    pub fn run(&mut self) -> Result<WaveformSnapshot, InputError> {
        while self.phase() != WaveformPhase::Done {
            self.step(usize::MAX / 2)?;
        }
        Ok(self.snapshot())
    }

    /// The snapshot without doing more work.
    pub fn snapshot(&self) -> WaveformSnapshot {
        let b = self.balance.progress();
        let total_map = self.n_theta * self.n_phi;
        let cells_total = self.balance.cells() + total_map + self.spectrum.cells();
        let cells_done = self.balance.cells_done() + self.map_cells.len() + self.spectrum.cells_done();
        let e = self.closed.energy;
        let (rel, prel) = if b.done {
            let dp = (0..3).map(|k| (b.momentum[k] - self.closed.momentum[k]).powi(2)).sum::<f64>().sqrt();
            (Some((b.energy - e).abs() / e), Some(dp / e))
        } else {
            (None, None)
        };
        let phase = self.phase();
        WaveformSnapshot {
            phase,
            fraction: if phase == WaveformPhase::Done { 1.0 } else { cells_done as f64 / cells_total as f64 },
            balance_fraction: b.fraction,
            map_fraction: self.map_cells.len() as f64 / total_map as f64,
            spectrum_fraction: self.spectrum.fraction(),
            done: phase == WaveformPhase::Done,
            e_rad_flux: b.energy,
            e_rad_closed: e,
            e_rad_rel_diff: rel,
            p_rad_flux: b.momentum,
            p_rad_closed: self.closed.momentum,
            p_rad_rel_diff: prel,
            mc2_j: self.mc2_j,
            e_rad_flux_j: self.mc2_j.map(|k| k * b.energy),
            e_rad_closed_j: self.mc2_j.map(|k| k * e),
            cells_done,
            cells_total,
        }
    }

    /// The sky map so far: cells not computed yet are NaN.
    pub fn sky_map(&self) -> SkyMap {
        let (theta, phi) = sky_axes(self.n_theta, self.n_phi);
        let values = (0..self.n_theta)
            .map(|i| (0..self.n_phi).map(|j| self.map_cells.get(i * self.n_phi + j).copied().unwrap_or(f64::NAN)).collect())
            .collect();
        SkyMap { theta, phi, values }
    }

    /// What the sky map shows.
    pub fn quantity(&self) -> SkyQuantity {
        self.quantity
    }

    /// The frame of every result.
    pub fn frame(&self) -> Frame {
        self.frame
    }

    /// M c² in joules, when the masses are physical.
    pub fn mc2_j(&self) -> Option<f64> {
        self.mc2_j
    }

    /// Observer direction (θ, φ) in radians.
    pub fn observer(&self) -> (f64, f64) {
        self.observer
    }

    /// The spectrum: ω, dE/(dω dΩ) at the observer (complete from the start), dE/dω over the
    /// sphere once that phase is done (None before), and the two ω → 0 limits: from the memory
    /// in the observer direction (Smarr 1977) and the closed form over the sphere (Di Vecchia
    /// et al. 2021, arXiv:2101.05772, with the prefactor 2GQ²/π).
    pub fn spectrum(&self) -> SpectrumCurves<'_> {
        SpectrumCurves {
            omega: self.spectrum.omega(),
            de_domega_dsolid: &self.direction_spectrum,
            de_domega: if self.spectrum.done() { Some(self.spectrum.values()) } else { None },
            zfl_direction: self.zfl_direction,
            zfl_closed: zfl_angle_integrated_closed_form(&self.sys),
            physical: self.physical,
        }
    }
}

/// The curves of a spectrum (borrowed; geometric values, G = c = 1, units of M): what
/// [`WaveformJob::spectrum`] returns and what the spectrum figure draws.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpectrumCurves<'a> {
    /// Angular frequency ω, units of c³/(GM).
    pub omega: &'a [f64],
    /// dE/(dω dΩ) in the observer direction (D² absorbed).
    pub de_domega_dsolid: &'a [f64],
    /// dE/dω over the sphere, when computed.
    pub de_domega: Option<&'a [f64]>,
    /// ω → 0 limit in the observer direction (from the memory, Smarr 1977).
    pub zfl_direction: f64,
    /// ω → 0 limit over the sphere (closed form); ≤ 0 for none.
    pub zfl_closed: f64,
    /// SI factors ([`spectrum_si`]), when the masses are physical: the figure then uses Hz and J/Hz.
    pub physical: Option<SpectrumSi>,
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::waveform::{sky_map, spectrum_angle_integrated};

    fn request(frame: &str) -> WaveformRequest {
        serde_json::from_str(&format!(
            r#"{{"m1": 1, "m2": 2, "gamma": 1.4, "b": 40, "theta": 1.2, "phi": -0.7, "u_min": -100, "u_max": 100, "frame": "{frame}"}}"#
        ))
        .unwrap()
    }

    #[test]
    fn steps_reproduce_the_one_shot_sums() {
        // The progressive job must give exactly the one-shot results (same sums, same order).
        for frame in ["rest2", "cm"] {
            let req = request(frame);
            let omega = [0.0005, 0.005, 0.05];
            let mut job = WaveformJob::new(&req, SkyQuantity::EnergyPerSolidAngle, 6, 12, &omega).unwrap();
            let mut last = job.snapshot();
            let mut steps = 0;
            while !last.done {
                let s = job.step(7).unwrap();
                assert!(s.fraction >= last.fraction, "progress must not go back");
                last = s;
                steps += 1;
            }
            assert!(steps > 10, "the work was cut into steps ({steps})");
            let sys = req.gravity_system().unwrap().binary;
            let mut it = SkyIntegrator::new(&sys, req.frame, SkyOptions::for_gamma(sys.gamma)).unwrap();
            let full = it.run();
            assert_eq!(last.e_rad_flux, full.energy);
            assert_eq!(last.p_rad_flux, full.momentum);
            // Energy balance against Herrmann et al. 2021 (arXiv:2101.07255, closed form): the flux
            // integral reaches 1e-10 on this rule (energy.rs tests).
            assert!(last.e_rad_rel_diff.unwrap() < 1e-10, "{:?}", last.e_rad_rel_diff);
            assert!(last.p_rad_rel_diff.unwrap() < 1e-9, "{:?}", last.p_rad_rel_diff);
            let map = sky_map(&sys, req.frame, SkyQuantity::EnergyPerSolidAngle, 6, 12).unwrap();
            assert_eq!(job.sky_map(), map);
            let spec = spectrum_angle_integrated(&sys, req.frame, &omega, SPECTRUM_SKY).unwrap();
            assert_eq!(job.spectrum().de_domega.unwrap(), &spec[..]);
            assert_eq!(last.cells_done, last.cells_total);
        }
    }

    #[test]
    fn partial_map_is_blank_below_the_rows_done() {
        let req = request("rest2");
        let mut job = WaveformJob::new(&req, SkyQuantity::Memory, 8, 10, &[0.01]).unwrap();
        while job.phase() == WaveformPhase::Balance {
            job.step(50).unwrap();
        }
        let s = job.step(13).unwrap();
        assert_eq!(s.phase, WaveformPhase::SkyMap);
        let m = job.sky_map();
        assert!(m.values[0].iter().all(|v| v.is_finite()));
        assert!(m.values[1][..3].iter().all(|v| v.is_finite()) && m.values[1][3..].iter().all(|v| v.is_nan()));
        assert!(m.values[7].iter().all(|v| v.is_nan()));
        assert!(job.spectrum().de_domega.is_none());
        assert!(s.e_rad_rel_diff.is_some() && s.map_fraction > 0.0 && s.map_fraction < 1.0);
    }

    #[test]
    fn refuses_em_and_bad_grids() {
        let mut req = request("rest2");
        assert_eq!(WaveformJob::new(&req, SkyQuantity::Memory, 0, 10, &[0.1]).unwrap_err().field(), "n_theta");
        assert_eq!(WaveformJob::new(&req, SkyQuantity::Memory, 4, 10, &[-1.0]).unwrap_err().field(), "omega");
        req.force = crate::waveform::WaveformForce::Em;
        assert_eq!(WaveformJob::new(&req, SkyQuantity::Memory, 4, 10, &[0.1]).unwrap_err().field(), "force");
    }
}
