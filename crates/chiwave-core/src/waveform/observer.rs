//! Observer scales in physical units and the interferometer antenna pattern.
//!
//! Sources: dimensional analysis of the LO strain (strain unit G² m1 m2/(c⁴ D b), time unit b/c;
//! docs/physics/waveform.md §7) and the characteristic frequency v/(2π b) for v ≪ c (a rule of
//! thumb, common practice, not fitted); constants from [`crate::units`]
//! (CODATA 2018 G, IAU 2015 nominal GM☉, exact c and au). Antenna pattern of an L-shaped
//! interferometer with arms along x and y: Thorne 1987, in *300 Years of Gravitation* (Hawking &
//! Israel eds.), ch. 9 (common practice; equation number not given).

use crate::units::codata2018::C;

/// Physical scales of an encounter (SI).
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct PhysicalScales {
    /// G M/c² in metres (M = m1 + m2).
    pub mass_length_m: f64,
    /// G M/c³ in seconds (the geometric time unit of the u array).
    pub mass_time_s: f64,
    /// b/c in seconds.
    pub b_over_c_s: f64,
    /// G² m1 m2/(c⁴ D b): the strain scale (docs/physics/waveform.md §7), when a distance is given.
    pub strain_unit: Option<f64>,
    /// v/(2π b) in Hz (v ≪ c rule of thumb, common practice).
    pub f_char_hz: f64,
}

impl PhysicalScales {
    /// Scales from G m1/c², G m2/c² (metres), relative speed v (fraction of c), b and D (metres).
    pub fn new(l1_m: f64, l2_m: f64, v: f64, b_m: f64, d_m: Option<f64>) -> Self {
        let l = l1_m + l2_m;
        PhysicalScales {
            mass_length_m: l,
            mass_time_s: l / C,
            b_over_c_s: b_m / C,
            strain_unit: d_m.map(|d| strain_unit(l1_m, l2_m, b_m, d)),
            f_char_hz: characteristic_frequency(v, b_m),
        }
    }
}

/// The strain unit G² m1 m2/(c⁴ D b) from the mass lengths G m_a/c² (metres), b and D (metres).
///
/// # Formula
/// h ≈ H × G² m1 m2/(c⁴ D b), H the dimensionless output (docs/physics/waveform.md §7).
///
/// # Examples
/// ```
/// use chiwave_core::units::{astro::{AU, MPC}, SUN_LENGTH_M};
/// // G² m1 m2/(c⁴ D b) by hand (CODATA 2018 G, IAU 2015 GM☉): 10 M☉ + 10 M☉, b = 1 au, D = 1 Mpc → 4.72e-26.
/// let h = chiwave_core::waveform::strain_unit(10.0 * SUN_LENGTH_M, 10.0 * SUN_LENGTH_M, AU, MPC);
/// assert!((h / 4.72e-26 - 1.0).abs() < 2e-3);
/// ```
pub fn strain_unit(l1_m: f64, l2_m: f64, b_m: f64, d_m: f64) -> f64 {
    l1_m * l2_m / (d_m * b_m)
}

/// Characteristic frequency f ~ v/(2π b) in Hz for relative speed v (fraction of c) and b in
/// metres (common practice; valid for v ≪ c, not fitted numerically; the forward direction is
/// Doppler-raised by about γ/(1 − v cos θ)).
pub fn characteristic_frequency(v: f64, b_m: f64) -> f64 {
    v * C / (2.0 * std::f64::consts::PI * b_m)
}

/// Antenna pattern (F₊, F×) of an interferometer with arms along its x and y axes, for a source
/// at polar angles (θ, φ) in the detector frame and polarisation angle ψ.
///
/// # Formula
/// F₊ = ½(1 + cos²θ) cos 2φ cos 2ψ − cos θ sin 2φ sin 2ψ,
/// F× = ½(1 + cos²θ) cos 2φ sin 2ψ + cos θ sin 2φ cos 2ψ (Thorne 1987; common practice).
/// The detector strain is h = F₊ h₊ + F× h×.
///
/// # Examples
/// ```
/// let (fp, fx) = chiwave_core::waveform::antenna_pattern(0.0, 0.0, 0.0);
/// assert!((fp - 1.0).abs() < 1e-15 && fx.abs() < 1e-15);
/// ```
pub fn antenna_pattern(theta: f64, phi: f64, psi: f64) -> (f64, f64) {
    let ct = theta.cos();
    let a = 0.5 * (1.0 + ct * ct);
    let (s2p, c2p) = (2.0 * phi).sin_cos();
    let (s2s, c2s) = (2.0 * psi).sin_cos();
    (a * c2p * c2s - ct * s2p * s2s, a * c2p * s2s + ct * s2p * c2s)
}

/// Factors that turn a geometric spectrum (ω in c³/(GM), dE/dω with E in M c²) into SI:
/// frequency in Hz and spectral energy density in J/Hz.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct SpectrumSi {
    /// f [Hz] = `hz_per_omega` × ω.
    pub hz_per_omega: f64,
    /// dE/df [J/Hz] = `j_per_hz` × (dE/dω, geometric); the same for dE/(df dΩ) in J/(Hz sr).
    pub j_per_hz: f64,
}

/// The SI factors of a spectrum for a total mass of length L = G M/c² (metres).
///
/// # Formula
/// The geometric units are ω₀ = c/L (rad/s) and E₀ = M c² = L c⁴/G (J), so f = ω ω₀/(2π) and
/// dE/df = 2π dE/dω = 2π (E₀/ω₀) × (dE/dω)_geo = 2π L² c³/G × (dE/dω)_geo (definitions; CODATA
/// 2018 G and exact c). Their product is E₀: ∫dE/df df = ∫dE/dω dω.
///
/// # Examples
/// ```
/// use chiwave_core::units::SUN_LENGTH_M;
/// let s = chiwave_core::waveform::spectrum_si(SUN_LENGTH_M);
/// // G M☉/c³ = 4.925 490 947 µs (IAU 2015 nominal GM☉, common value): ω = 1 is 32.31 kHz.
/// assert!((s.hz_per_omega * 2.0 * std::f64::consts::PI * 4.925_490_947e-6 - 1.0).abs() < 1e-9);
/// ```
pub fn spectrum_si(mass_length_m: f64) -> SpectrumSi {
    let g = crate::units::codata2018::G;
    let two_pi = 2.0 * std::f64::consts::PI;
    SpectrumSi {
        hz_per_omega: C / (two_pi * mass_length_m),
        j_per_hz: two_pi * mass_length_m * mass_length_m * C * C * C / g,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn spectrum_si_factors_keep_the_energy() {
        // ∫ dE/df df = ∫ dE/dω dω: the product of the two factors is M c² in joules
        // (M c² = (GM/c²) c⁴/G, definition), here for 20 M☉ (IAU 2015 GM☉, CODATA 2018 G).
        let l = 20.0 * crate::units::SUN_LENGTH_M;
        let s = spectrum_si(l);
        let mc2 = 20.0 * crate::units::M_SUN_KG * C * C;
        assert!((s.hz_per_omega * s.j_per_hz / mc2 - 1.0).abs() < 1e-14);
    }
}
