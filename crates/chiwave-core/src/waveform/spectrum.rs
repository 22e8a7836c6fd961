//! Frequency-domain waveform: dE/(dω dΩ) per direction and dE/dω over the sphere.
//!
//! # Method
//! ḣ̃(ω) = ∫ du e^{iωu} ḣ(u). The worldline part transforms in closed form with
//! ∫ e^{iWt} dt/r = (2/v) K0(Wb/v) and ∫ e^{iWt} b² dt/r³ = 2 (Wb/v) K1(Wb/v)/v, W = ω(1 − n_x v)
//! (Gradshteyn & Ryzhik 3.754.2; docs/physics/waveform.md §2). For the field-stress part each Feynman-parameter slice
//! has S² quadratic in u, so it transforms to K0, K1 with a phase e^{−iωβ/α} (the Bessel-function
//! structure Mougiakakos, Riva & Vernizzi 2021, arXiv:2102.08339, describe; chiwave's own
//! evaluation, checked
//! against the time domain by Parseval's theorem and against the memory at ω → 0, see tests).
//! dE/(dω dΩ) = D²(|ḣ̃₊|² + |ḣ̃×|²)/(16π²) (Parseval with the flux of docs/physics/waveform.md §1). In a boosted frame,
//! dE'/(dω' dΩ') = δ² |ḣ̃_A(ω'/δ)|²/(16π²).
//!
//! Sources: the two Fourier integrals are Gradshteyn & Ryzhik 3.754.2 and its b-derivative
//! (recalled); the ω → 0 limit is Smarr 1977 (PRD 15, 2069); the angle-integrated ZFL closed form
//! is Di Vecchia, Heissenberg, Russo & Veneziano 2021, arXiv:2101.05772 (docs/physics/waveform.md §3).

// Index loops are kept where the indices are tensor indices (clearer than iterator chains).
#![allow(clippy::needless_range_loop)]

use super::energy::SkyIntegrator;
use super::frames::{Binary, Frame};
use super::kernel::{DirectionWaveform, RestKernel};
use super::memory::memory_braginsky_thorne;
use super::SkyOptions;
use crate::error::InputError;
use crate::bessel::{bessel_k0_scaled, bessel_k1_scaled};
use num_complex::Complex64;

impl RestKernel {
    /// ḣ̃(ω) in frame A for both polarisations, ω > 0.
    pub(crate) fn rate_transform(&self, omega: f64) -> [Complex64; 2] {
        let v = self.v;
        let b = self.b;
        let w = omega * self.one_m_nxv;
        let z = w * b / v;
        let (k0s, k1s) = (bessel_k0_scaled(z), bessel_k1_scaled(z));
        let ez = (-z).exp();
        let (k0, k1) = (k0s * ez, k1s * ez);
        let ph = Complex64::from_polar(1.0, -omega * self.ny_b);
        let mut out = [Complex64::new(0.0, 0.0); 2];
        for p in 0..2 {
            let wl = Complex64::new(2.0 * self.c_y[p] * z * k1, -2.0 * self.c_r[p] * w * k0 / v);
            out[p] = ph * wl;
        }
        // Field part: h̃_F, then ḣ̃_F = −iω h̃_F.
        let mut hf = [Complex64::new(0.0, 0.0); 2];
        for nd in &self.nodes {
            let al = nd.s2;
            let be = 0.5 * nd.s1;
            let c = -be / al;
            let d2 = nd.s0 / al - c * c;
            if d2 <= 0.0 {
                continue;
            }
            let d = d2.sqrt();
            let x = omega * d;
            let (a0, a1) = (bessel_k0_scaled(x), bessel_k1_scaled(x));
            let ex = (-x).exp();
            let (k0, k1) = (a0 * ex, a1 * ex);
            let sa = al.sqrt();
            let sa3 = sa * sa * sa;
            let phase = Complex64::from_polar(nd.weight, omega * c);
            for p in 0..2 {
                // P(u) with u = s + c: q2 s² + q1 s + q0.
                let q2 = nd.p2[p];
                let q1 = nd.p1[p] + 2.0 * nd.p2[p] * c;
                let q0 = (nd.p2[p] * c + nd.p1[p]) * c + nd.p0[p];
                let re = 2.0 * nd.c0[p] * k0 / sa - (q2 * (2.0 * k0 - 2.0 * x * k1) + q0 * 2.0 * omega * k1 / d) / sa3;
                let im = -(q1 * 2.0 * omega * k0) / sa3;
                hf[p] += phase * Complex64::new(re, im);
            }
        }
        let mi = Complex64::new(0.0, -omega);
        [out[0] + mi * hf[0], out[1] + mi * hf[1]]
    }
}

impl DirectionWaveform {
    /// dE/(dω dΩ) at angular frequency ω ≥ 0 (D² absorbed, G = 1) in this waveform's frame.
    /// At ω = 0 it is the zero-frequency limit |D Δh|²/(16π²) from the memory (Smarr 1977).
    ///
    /// # Formula
    /// D²(|ḣ̃₊|² + |ḣ̃×|²)/(16π²) (docs/physics/waveform.md §1); δ²|ḣ̃_A(ω/δ)|²/(16π²) in a boosted frame.
    pub fn spectrum(&self, omega: f64) -> f64 {
        let pi2 = std::f64::consts::PI * std::f64::consts::PI;
        if omega.is_nan() || omega <= 0.0 {
            let m = self.memory();
            return (m[0] * m[0] + m[1] * m[1]) / (16.0 * pi2);
        }
        let d = self.map.delta;
        let t = self.kernel.rate_transform(omega / d);
        d * d * (t[0].norm_sqr() + t[1].norm_sqr()) / (16.0 * pi2)
    }
}

/// dE/dω over the sphere at each ω (G = 1), using the sky cells of [`SkyIntegrator`].
///
/// # Errors
/// [`InputError`] naming `omega` (each finite, ≥ 0) or a sky option.
pub fn spectrum_angle_integrated(
    sys: &Binary,
    frame: Frame,
    omega: &[f64],
    opts: SkyOptions,
) -> Result<Vec<f64>, InputError> {
    let mut it = SkySpectrum::new(sys, frame, omega, opts)?;
    it.run()?;
    Ok(it.values().to_vec())
}

/// dE/dω over the sphere, accumulated a few sky cells at a time (so a page can advance it
/// between frames); the same sum as [`spectrum_angle_integrated`].
///
/// # Formula
/// dE/dω = Σ_cells w_cell dE/(dω dΩ)(n_cell) on the sky rule of [`SkyIntegrator`].
///
/// # Examples
/// ```
/// use chiwave_core::waveform::{Binary, Frame, SkyOptions, SkySpectrum};
/// let s = Binary::new(0.5, 0.5, 1.2, 1.0).unwrap();
/// let opts = SkyOptions { n_polar: 6, n_azimuth: 8, n_u: 16, n_x: 16 };
/// let mut it = SkySpectrum::new(&s, Frame::Cm, &[0.01, 20.0], opts).unwrap();
/// assert!(it.step(4).unwrap() < 1.0);
/// it.run().unwrap();
/// assert!(it.values()[0] > 0.0 && it.values()[1] < 1e-6 * it.values()[0]); // exponential fall-off above v/b
/// ```
#[derive(Debug, Clone)]
pub struct SkySpectrum {
    sys: Binary,
    frame: Frame,
    n_x: usize,
    omega: Vec<f64>,
    cells: Vec<(f64, f64, f64, [f64; 3])>,
    next: usize,
    values: Vec<f64>,
}

impl SkySpectrum {
    /// Sets up the sum on the sky cells of `opts`.
    ///
    /// # Errors
    /// [`InputError`] naming `omega` (each finite, ≥ 0) or a sky option.
    pub fn new(sys: &Binary, frame: Frame, omega: &[f64], opts: SkyOptions) -> Result<Self, InputError> {
        for &w in omega {
            crate::error::finite("omega", w)?;
            if w < 0.0 {
                return Err(InputError::OutOfRange { field: "omega", value: w, allowed: "omega ≥ 0".into() });
            }
        }
        let sky = SkyIntegrator::new(sys, frame, opts)?;
        Ok(SkySpectrum {
            sys: *sys,
            frame,
            n_x: opts.n_x,
            omega: omega.to_vec(),
            cells: sky.cell_list().to_vec(),
            next: 0,
            values: vec![0.0; omega.len()],
        })
    }

    /// Adds up to `max_cells` more sky cells; returns the fraction of cells done.
    ///
    /// # Errors
    /// [`InputError`] from a direction (cannot happen for cells built from unit vectors).
    pub fn step(&mut self, max_cells: usize) -> Result<f64, InputError> {
        let end = self.next.saturating_add(max_cells).min(self.cells.len());
        for &(th, ph, wt, _) in &self.cells[self.next..end] {
            let w = DirectionWaveform::new(&self.sys, self.frame, th, ph, self.n_x)?;
            for (o, &om) in self.values.iter_mut().zip(&self.omega) {
                *o += wt * w.spectrum(om);
            }
        }
        self.next = end;
        Ok(self.fraction())
    }

    /// Runs to the end.
    ///
    /// # Errors
    /// As [`SkySpectrum::step`].
    pub fn run(&mut self) -> Result<(), InputError> {
        self.step(usize::MAX).map(|_| ())
    }

    /// Number of sky cells in all.
    pub fn cells(&self) -> usize {
        self.cells.len()
    }

    /// Number of sky cells added so far.
    pub fn cells_done(&self) -> usize {
        self.next
    }

    /// Fraction of the sky cells done, in [0, 1].
    pub fn fraction(&self) -> f64 {
        if self.cells.is_empty() {
            1.0
        } else {
            self.next as f64 / self.cells.len() as f64
        }
    }

    /// True when every cell is done.
    pub fn done(&self) -> bool {
        self.next >= self.cells.len()
    }

    /// The angular frequencies.
    pub fn omega(&self) -> &[f64] {
        &self.omega
    }

    /// dE/dω so far (the full sum once [`SkySpectrum::done`]).
    pub fn values(&self) -> &[f64] {
        &self.values
    }
}

/// The zero-frequency limit dE/dω(0) over the sphere from the Braginsky–Thorne memory
/// (Smarr 1977 ZFL, docs/physics/waveform.md §3): ∫ dΩ |D Δh|²/(16π²), on the sky cells of `opts`.
///
/// # Errors
/// [`InputError`] naming a sky option.
pub fn zfl_from_memory(sys: &Binary, frame: Frame, opts: SkyOptions) -> Result<f64, InputError> {
    let sky = SkyIntegrator::new(sys, frame, opts)?;
    let pi2 = std::f64::consts::PI * std::f64::consts::PI;
    let mut s = 0.0;
    for &(th, ph, wt, _) in sky.cell_list() {
        let m = memory_braginsky_thorne(sys, frame, th, ph)?;
        s += wt * (m[0] * m[0] + m[1] * m[1]) / (16.0 * pi2);
    }
    Ok(s)
}
