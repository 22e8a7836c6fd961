//! Two-body encounters: scattering angle, impulse, radiated energy and angular momentum.
pub mod eob;
