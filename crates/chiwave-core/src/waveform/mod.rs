//! Leading-order gravitational and electromagnetic waveforms, memory and spectra.
pub mod em;
