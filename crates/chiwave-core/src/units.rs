//! Units and constants, one place for the whole program.
//!
//! Constants are grouped by edition; every constant states its unit and its source.
//! Masses are carried as GM (m³ s⁻²) whenever a nominal value exists, because the IAU advises
//! quoting GM rather than M (G is known only to 2.2e-5; IAU 2015 Resolution B3).
//!
//! Text input is a number followed by an optional unit, with or without a space:
//! `"1Msun"`, `"6.957e8 m"`, `"0.5c"`. A bare number is *geometric*: a mass in the problem's
//! mass unit, a length in units of that mass (G = c = 1).
//!
//! Electromagnetism is Gaussian in the core; SI charges (coulomb) are converted here, at the edge.

use crate::error::InputError;
use serde::{Deserialize, Serialize};

/// CODATA 2018 (Tiesinga, Mohr, Newell & Taylor 2021, Rev. Mod. Phys. 93, 025010) and the SI 2019
/// exact defining constants.
pub mod codata2018 {
    /// Speed of light in vacuum, m s⁻¹ (exact, SI definition of the metre).
    pub const C: f64 = 299_792_458.0;
    /// Newtonian constant of gravitation, m³ kg⁻¹ s⁻² (CODATA 2018; relative uncertainty 2.2e-5).
    pub const G: f64 = 6.674_30e-11;
    /// Planck constant, J s (exact, SI 2019).
    pub const H: f64 = 6.626_070_15e-34;
    /// Reduced Planck constant ħ = h/(2π), J s (CODATA 2018: 1.054 571 817... e-34).
    pub const HBAR: f64 = H / (2.0 * std::f64::consts::PI);
    /// Elementary charge, C (exact, SI 2019).
    pub const E_CHARGE: f64 = 1.602_176_634e-19;
    /// Vacuum electric permittivity ε0, F m⁻¹ (CODATA 2018: 8.854 187 8128(13) e-12).
    pub const EPSILON0: f64 = 8.854_187_812_8e-12;
    /// Electron mass, kg (CODATA 2018: 9.109 383 7015(28) e-31).
    pub const M_ELECTRON: f64 = 9.109_383_701_5e-31;
    /// Proton mass, kg (CODATA 2018: 1.672 621 923 69(51) e-27).
    pub const M_PROTON: f64 = 1.672_621_923_69e-27;
}

/// IAU 2015 Resolution B3 nominal solar and planetary conversion constants
/// (Prša et al. 2016, AJ 152, 41; arXiv:1605.09788). These are exact conversion constants.
pub mod iau2015 {
    /// Nominal solar mass parameter (GM)☉^N, m³ s⁻².
    pub const GM_SUN: f64 = 1.327_124_4e20;
    /// Nominal solar radius R☉^N, m.
    pub const R_SUN: f64 = 6.957e8;
    /// Nominal terrestrial mass parameter (GM)⊕^N, m³ s⁻².
    pub const GM_EARTH: f64 = 3.986_004e14;
    /// Nominal terrestrial equatorial radius, m.
    pub const R_EARTH: f64 = 6.378_1e6;
    /// Nominal Jovian mass parameter (GM)♃^N, m³ s⁻².
    pub const GM_JUPITER: f64 = 1.266_865_3e17;
    /// Nominal Jovian equatorial radius, m.
    pub const R_JUPITER: f64 = 7.149_2e7;
}

/// Astronomical length units.
pub mod astro {
    /// Astronomical unit, m (exact; IAU 2012 Resolution B2).
    pub const AU: f64 = 149_597_870_700.0;
    /// Parsec, m: (648000/π) au by definition (IAU 2015 Resolution B2).
    pub const PC: f64 = 648_000.0 / std::f64::consts::PI * AU;
    /// Kiloparsec, m.
    pub const KPC: f64 = 1e3 * PC;
    /// Megaparsec, m.
    pub const MPC: f64 = 1e6 * PC;
    /// Julian year, s (IAU: 365.25 days of 86400 s).
    pub const YEAR: f64 = 365.25 * 86_400.0;
}

use astro::*;
use codata2018::*;
use iau2015::*;

/// Nominal solar mass in kg, (GM)☉^N / G (derived; ≈ 1.98841e30 kg).
pub const M_SUN_KG: f64 = GM_SUN / G;

/// Geometric length of one nominal solar mass, G M☉/c², m (derived; ≈ 1476.625 m).
pub const SUN_LENGTH_M: f64 = GM_SUN / (C * C);

/// Geometric time of one nominal solar mass, G M☉/c³, s (derived; ≈ 4.925491e-6 s).
pub const SUN_TIME_S: f64 = GM_SUN / (C * C * C);

/// A quantity as the page and the CLI send it: a bare number (geometric) or a text with a unit.
///
/// JSON forms accepted: `10`, `"10"`, `"1Msun"`, `"6.957e8 m"`, `{"value": 1, "unit": "Msun"}`.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(untagged)]
pub enum Quantity {
    Number(f64),
    Text(String),
    Parts { value: f64, #[serde(default)] unit: String },
}

impl From<f64> for Quantity {
    fn from(x: f64) -> Self {
        Quantity::Number(x)
    }
}

impl From<&str> for Quantity {
    fn from(s: &str) -> Self {
        Quantity::Text(s.to_string())
    }
}

impl Quantity {
    /// Splits into a finite number and a (possibly empty) unit string.
    ///
    /// # Errors
    /// [`InputError::Parse`] if the text does not start with a number; [`InputError::NotFinite`]
    /// for NaN or ±inf.
    pub fn split(&self, field: &'static str) -> Result<(f64, String), InputError> {
        let (v, u) = match self {
            Quantity::Number(x) => (*x, String::new()),
            Quantity::Parts { value, unit } => (*value, unit.trim().to_string()),
            Quantity::Text(s) => split_number_unit(field, s)?,
        };
        crate::error::finite(field, v)?;
        Ok((v, u))
    }
}

/// Reads the leading number of `text` and returns it with the rest (trimmed) as the unit.
fn split_number_unit(field: &'static str, text: &str) -> Result<(f64, String), InputError> {
    let t = text.trim();
    let b = t.as_bytes();
    let mut i = 0;
    if i < b.len() && (b[i] == b'+' || b[i] == b'-') {
        i += 1;
    }
    let digits_start = i;
    while i < b.len() && (b[i].is_ascii_digit() || b[i] == b'.') {
        i += 1;
    }
    let mut end = i;
    // An exponent only if 'e' is followed by digits (optionally signed): "1e5m" vs "1eV".
    if i < b.len() && (b[i] == b'e' || b[i] == b'E') {
        let mut k = i + 1;
        if k < b.len() && (b[k] == b'+' || b[k] == b'-') {
            k += 1;
        }
        if k < b.len() && b[k].is_ascii_digit() {
            while k < b.len() && b[k].is_ascii_digit() {
                k += 1;
            }
            end = k;
        }
    }
    let num = &t[..end];
    let lower = t.to_ascii_lowercase();
    // Accept the words nan / inf so that they give the "not finite" message, not a parse error.
    for word in ["nan", "+nan", "-nan", "inf", "+inf", "-inf", "infinity", "+infinity", "-infinity"] {
        if lower == word {
            let v: f64 = lower.trim_start_matches('+').parse().unwrap_or(f64::NAN);
            return Ok((v, String::new()));
        }
    }
    if end == digits_start || num == "." || num == "+" || num == "-" {
        return Err(InputError::Parse {
            field,
            text: text.to_string(),
            expected: "a number, optionally followed by a unit (e.g. 1.5Msun)".into(),
        });
    }
    let v: f64 = num.parse().map_err(|_| InputError::Parse {
        field,
        text: text.to_string(),
        expected: "a number, optionally followed by a unit (e.g. 1.5Msun)".into(),
    })?;
    Ok((v, t[end..].trim().to_string()))
}

/// A mass read from input.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Mass {
    /// A physical mass, carried as GM in m³ s⁻².
    Physical { gm: f64 },
    /// A bare number: a mass in the problem's own geometric unit.
    Geometric(f64),
}

impl Mass {
    /// Geometric length G m / c² in metres, if physical.
    pub fn length_m(self) -> Option<f64> {
        match self {
            Mass::Physical { gm } => Some(gm / (C * C)),
            Mass::Geometric(_) => None,
        }
    }
    /// The mass in kg, if physical (GM / G).
    pub fn kg(self) -> Option<f64> {
        match self {
            Mass::Physical { gm } => Some(gm / G),
            Mass::Geometric(_) => None,
        }
    }
    /// The mass in nominal solar masses, if physical.
    pub fn msun(self) -> Option<f64> {
        match self {
            Mass::Physical { gm } => Some(gm / GM_SUN),
            Mass::Geometric(_) => None,
        }
    }
}

/// Mass units accepted on input.
pub const MASS_UNITS: &str = "kg, g, Msun, Mearth, Mjup, or a bare number (geometric)";

/// Parses a mass; it must be > 0.
///
/// # Errors
/// Parse, not-finite, non-positive and unknown-unit errors, each naming `field`.
pub fn parse_mass(field: &'static str, q: &Quantity) -> Result<Mass, InputError> {
    let (v, u) = q.split(field)?;
    crate::error::positive(field, v)?;
    let gm = match u.as_str() {
        "" | "M" | "geometric" => return Ok(Mass::Geometric(v)),
        "kg" => G * v,
        "g" => G * v * 1e-3,
        "Msun" | "msun" | "Msol" | "M_sun" | "M☉" => GM_SUN * v,
        "Mearth" | "mearth" | "M_earth" | "M⊕" => GM_EARTH * v,
        "Mjup" | "mjup" | "M_jup" | "Mjupiter" => GM_JUPITER * v,
        _ => return Err(InputError::UnknownUnit { field, unit: u, allowed: MASS_UNITS.into() }),
    };
    Ok(Mass::Physical { gm })
}

/// A length read from input.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Length {
    /// A physical length in metres.
    Physical { m: f64 },
    /// In units of the problem's geometric mass length (bare number or unit `M`).
    Geometric(f64),
}

/// Length units accepted on input.
pub const LENGTH_UNITS: &str = "m, km, Rsun, Rearth, Rjup, au, pc, kpc, Mpc, M (units of GM/c²) or a bare number (units of GM/c²)";

/// Metres per unit for physical length units.
fn length_factor(u: &str) -> Option<f64> {
    Some(match u {
        "m" => 1.0,
        "cm" => 1e-2,
        "km" => 1e3,
        "Rsun" | "rsun" | "R_sun" | "R☉" => R_SUN,
        "Rearth" | "rearth" | "R_earth" | "R⊕" => R_EARTH,
        "Rjup" | "rjup" | "R_jup" => R_JUPITER,
        "au" | "AU" => AU,
        "pc" => PC,
        "kpc" => KPC,
        "Mpc" => MPC,
        "Gpc" => 1e3 * MPC,
        "ly" => C * YEAR,
        _ => return None,
    })
}

/// Parses a length; it must be > 0.
///
/// # Errors
/// Parse, not-finite, non-positive and unknown-unit errors, each naming `field`.
pub fn parse_length(field: &'static str, q: &Quantity) -> Result<Length, InputError> {
    let (v, u) = q.split(field)?;
    crate::error::positive(field, v)?;
    match u.as_str() {
        "" | "M" | "GM/c2" | "GM/c^2" => Ok(Length::Geometric(v)),
        other => match length_factor(other) {
            Some(f) => Ok(Length::Physical { m: v * f }),
            None => Err(InputError::UnknownUnit { field, unit: u, allowed: LENGTH_UNITS.into() }),
        },
    }
}

impl Length {
    /// The length in units of a geometric mass length `mass_length_m` (metres), or the bare
    /// geometric value.
    ///
    /// # Errors
    /// [`InputError::Inconsistent`] if the length is physical and no physical mass was given.
    pub fn in_units_of(self, field: &'static str, mass_length_m: Option<f64>) -> Result<f64, InputError> {
        match (self, mass_length_m) {
            (Length::Geometric(x), _) => Ok(x),
            (Length::Physical { m }, Some(l)) => Ok(m / l),
            (Length::Physical { .. }, None) => Err(InputError::Inconsistent {
                field,
                reason: "a physical length needs a physical mass (give the mass with a unit, e.g. 1Msun)".into(),
            }),
        }
    }
}

/// Speed units accepted on input.
pub const SPEED_UNITS: &str = "km/s, m/s, c, or a bare number (fraction of c)";

/// Parses a speed as a fraction of c, in the open interval (0, 1).
///
/// # Errors
/// Parse, not-finite, unknown-unit, and out-of-range (needs 0 < v < c) errors naming `field`.
pub fn parse_speed(field: &'static str, q: &Quantity) -> Result<f64, InputError> {
    let (v, u) = q.split(field)?;
    let beta = match u.as_str() {
        "" | "c" => v,
        "km/s" | "kms" => v * 1e3 / C,
        "m/s" => v / C,
        _ => return Err(InputError::UnknownUnit { field, unit: u, allowed: SPEED_UNITS.into() }),
    };
    if beta > 0.0 && beta < 1.0 {
        Ok(beta)
    } else {
        Err(InputError::OutOfRange {
            field,
            value: v,
            allowed: "0 < v < c (299792.458 km/s)".into(),
        })
    }
}

/// Frequency units accepted on input.
pub const FREQUENCY_UNITS: &str = "Hz, mHz, uHz, kHz, MHz, GHz, or a bare number (Hz)";

/// Parses a frequency in Hz; it must be > 0.
///
/// # Errors
/// Parse, not-finite, non-positive and unknown-unit errors naming `field`.
pub fn parse_frequency(field: &'static str, q: &Quantity) -> Result<f64, InputError> {
    let (v, u) = q.split(field)?;
    crate::error::positive(field, v)?;
    let f = match u.as_str() {
        "" | "Hz" | "hz" => 1.0,
        "mHz" => 1e-3,
        "uHz" | "µHz" | "μHz" => 1e-6,
        "kHz" => 1e3,
        "MHz" => 1e6,
        "GHz" => 1e9,
        _ => return Err(InputError::UnknownUnit { field, unit: u, allowed: FREQUENCY_UNITS.into() }),
    };
    Ok(v * f)
}

/// An angle unit for output.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum AngleUnit {
    Rad,
    Deg,
    Arcsec,
    Mas,
    Uas,
}

impl AngleUnit {
    /// Every angle unit, largest first (the order of a unit menu).
    pub const ALL: [AngleUnit; 5] = [AngleUnit::Rad, AngleUnit::Deg, AngleUnit::Arcsec, AngleUnit::Mas, AngleUnit::Uas];

    /// The name used in requests and JSON (`"rad"`, `"deg"`, `"arcsec"`, `"mas"`, `"uas"`).
    pub fn key(self) -> &'static str {
        match self {
            AngleUnit::Rad => "rad",
            AngleUnit::Deg => "deg",
            AngleUnit::Arcsec => "arcsec",
            AngleUnit::Mas => "mas",
            AngleUnit::Uas => "uas",
        }
    }

    /// Radians per unit.
    pub fn radians(self) -> f64 {
        use std::f64::consts::PI;
        match self {
            AngleUnit::Rad => 1.0,
            AngleUnit::Deg => PI / 180.0,
            AngleUnit::Arcsec => PI / 648_000.0,
            AngleUnit::Mas => PI / 648_000.0e3,
            AngleUnit::Uas => PI / 648_000.0e6,
        }
    }
    /// Converts an angle in radians to this unit.
    pub fn from_rad(self, rad: f64) -> f64 {
        rad / self.radians()
    }
    /// Short label for tables and axes.
    pub fn label(self) -> &'static str {
        match self {
            AngleUnit::Rad => "rad",
            AngleUnit::Deg => "deg",
            AngleUnit::Arcsec => "arcsec",
            AngleUnit::Mas => "mas",
            AngleUnit::Uas => "µas",
        }
    }
    /// Parses `rad`, `deg`, `arcsec`, `mas`, `uas`/`µas`.
    ///
    /// # Errors
    /// [`InputError::UnknownUnit`] naming `field`.
    pub fn parse(field: &'static str, s: &str) -> Result<Self, InputError> {
        Ok(match s.trim() {
            "rad" => AngleUnit::Rad,
            "deg" => AngleUnit::Deg,
            "arcsec" | "as" => AngleUnit::Arcsec,
            "mas" => AngleUnit::Mas,
            "uas" | "µas" | "μas" => AngleUnit::Uas,
            other => {
                return Err(InputError::UnknownUnit {
                    field,
                    unit: other.into(),
                    allowed: "rad, deg, arcsec, mas, uas".into(),
                })
            }
        })
    }
}

/// Radians to arcseconds.
pub fn rad_to_arcsec(rad: f64) -> f64 {
    AngleUnit::Arcsec.from_rad(rad)
}

/// Charge units accepted on input.
pub const CHARGE_UNITS: &str = "C (coulomb, SI), statC or esu (Gaussian), e (elementary charges), or a bare number (geometric Gaussian, G = c = 1)";

/// A charge read from input.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Charge {
    /// Gaussian charge in statcoulomb = √(erg·cm) = √(1e-9 J m).
    Gaussian { statc: f64 },
    /// A bare number in the problem's geometric Gaussian units.
    Geometric(f64),
}

/// One statcoulomb in coulombs: 1 C = 10 c statC with c in m/s, so 1 statC = 1/(10 c) C
/// ≈ 3.33564095e-10 C (definition of the Gaussian unit; common practice).
pub const STATC_IN_COULOMB: f64 = 1.0 / (10.0 * C);

/// Parses a charge (any sign, finite).
///
/// # Errors
/// Parse, not-finite and unknown-unit errors naming `field`.
pub fn parse_charge(field: &'static str, q: &Quantity) -> Result<Charge, InputError> {
    let (v, u) = q.split(field)?;
    Ok(match u.as_str() {
        "" | "geometric" => Charge::Geometric(v),
        "C" => Charge::Gaussian { statc: v / STATC_IN_COULOMB },
        "statC" | "esu" | "Fr" => Charge::Gaussian { statc: v },
        "e" => Charge::Gaussian { statc: v * E_CHARGE / STATC_IN_COULOMB },
        _ => return Err(InputError::UnknownUnit { field, unit: u, allowed: CHARGE_UNITS.into() }),
    })
}

impl Charge {
    /// Geometric Gaussian charge in metres: Q_geo = Q_G · √G / c² in SI-compatible form,
    /// i.e. Q_geo = q_SI · √(G/(4π ε0)) / c² (the standard geometrisation, Q² → G Q²/(4π ε0 c⁴);
    /// docs/physics/deflection.md §1).
    pub fn length_m(self) -> Option<f64> {
        match self {
            Charge::Gaussian { statc } => {
                let q_si = statc * STATC_IN_COULOMB;
                Some(q_si * (G / (4.0 * std::f64::consts::PI * EPSILON0)).sqrt() / (C * C))
            }
            Charge::Geometric(_) => None,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn exact_constants() {
        // SI definitions (exact): c, h, e; IAU 2012 B2: au.
        assert_eq!(C, 299_792_458.0);
        assert_eq!(H, 6.626_070_15e-34);
        assert_eq!(E_CHARGE, 1.602_176_634e-19);
        assert_eq!(AU, 149_597_870_700.0);
    }

    #[test]
    fn derived_constants() {
        // IAU 2015 B2 parsec = 30856775814913672.79 m (IAU 2015 Resolution B2 definition, (648000/π) au, evaluated by hand).
        assert!((PC / 30_856_775_814_913_672.79 - 1.0).abs() < 1e-15);
        // GM☉/c² = 1476.625038050 m (IAU 2015 B3 nominal GM☉ over the exact c², by hand).
        assert!((SUN_LENGTH_M - 1_476.625_038_050).abs() < 1e-8);
        // Nominal solar mass 1.98841e30 kg (IAU 2015 B3 with CODATA 2018 G; Prša et al. 2016, arXiv:1605.09788).
        assert!((M_SUN_KG / 1.98841e30 - 1.0).abs() < 1e-5);
        // ħ = 1.054571817e-34 J s (CODATA 2018).
        assert!((HBAR / 1.054_571_817e-34 - 1.0).abs() < 1e-9);
        // 1 statC = 3.335640952e-10 C (definition of the Gaussian unit; common practice).
        assert!((STATC_IN_COULOMB / 3.335_640_952e-10 - 1.0).abs() < 1e-9);
    }

    #[test]
    fn parses_numbers_and_units() {
        let m = parse_mass("mass", &"1Msun".into()).unwrap();
        assert_eq!(m, Mass::Physical { gm: GM_SUN });
        let m = parse_mass("mass", &" 2.5 kg ".into()).unwrap();
        assert_eq!(m, Mass::Physical { gm: 2.5 * G });
        assert_eq!(parse_mass("mass", &3.0.into()).unwrap(), Mass::Geometric(3.0));
        let l = parse_length("b", &"6.957e8m".into()).unwrap();
        assert_eq!(l, Length::Physical { m: 6.957e8 });
        assert_eq!(parse_length("b", &"1e5".into()).unwrap(), Length::Geometric(1e5));
        assert_eq!(parse_length("b", &"2 au".into()).unwrap(), Length::Physical { m: 2.0 * AU });
        let v = parse_speed("v", &"1000km/s".into()).unwrap();
        assert!((v - 1e6 / C).abs() < 1e-18);
        assert_eq!(parse_frequency("f", &"100Hz".into()).unwrap(), 100.0);
        let q: Quantity = serde_json::from_str(r#"{"value": 4, "unit": "kpc"}"#).unwrap();
        assert_eq!(parse_length("d", &q).unwrap(), Length::Physical { m: 4.0 * KPC });
    }

    #[test]
    fn bad_input_names_the_field() {
        for (txt, want) in [("abc", "cannot read"), ("1 parsnip", "unknown unit"), ("-1Msun", "> 0"), ("nan", "not a finite")] {
            let e = parse_mass("m1", &txt.into()).unwrap_err().to_string();
            assert!(e.starts_with("m1:") && e.contains(want), "{txt}: {e}");
        }
        let e = parse_speed("v", &"2c".into()).unwrap_err().to_string();
        assert!(e.contains("0 < v < c"), "{e}");
        let e = parse_length("b", &"1au".into()).unwrap().in_units_of("b", None).unwrap_err();
        assert_eq!(e.field(), "b");
    }

    #[test]
    fn angle_units() {
        // 1 rad = 206264.80624709636 arcsec (common practice: 648000/π).
        assert!((rad_to_arcsec(1.0) - 206_264.806_247_096_36).abs() < 1e-9);
        assert!((AngleUnit::Uas.from_rad(AngleUnit::Mas.radians()) - 1000.0).abs() < 1e-9);
        // The keys are the JSON names and parse back.
        for u in AngleUnit::ALL {
            assert_eq!(serde_json::to_value(u).unwrap(), u.key());
            assert_eq!(AngleUnit::parse("angle_unit", u.key()).unwrap(), u);
        }
    }
}
