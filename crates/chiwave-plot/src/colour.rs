//! Colours of the figures: the qualitative palette for series (colour-blind safe), the dash
//! patterns that pair with it, and the sequential colour scale of the heat maps.
//!
//! # The series palette
//! The line colours are the eight-colour palette of Okabe & Ito (2008), *Color Universal
//! Design (CUD): how to make figures and presentations that are friendly to colorblind people*
//! (J*FLY, University of Tokyo; reprinted as the palette of Wong 2011, "Points of view: Color
//! blindness", Nature Methods 8, 441, doi:10.1038/nmeth.1618), chosen so that the colours stay
//! apart for protan, deutan and tritan viewers. Their yellow is kept for fills only (too little
//! contrast on white for a line). Colour alone is not enough for everyone (nor in a greyscale
//! print), so every series also gets a dash pattern: in one figure no two labelled series share
//! both colour and dash (the drawing routine enforces it, see [`distinct_styles`]).
//!
//! # The sequential scale
//! [`sequential`] is our own ramp, built in CIELAB (CIE 15:2004, *Colorimetry*, 3rd ed., §8.2.1;
//! D65 white) and shown in sRGB (IEC 61966-2-1:1999): lightness L* rises linearly from dark to
//! light (low values dark, high values bright), the hue turns from blue-violet through red and
//! orange to a pale yellow, and the chroma is as large as the sRGB gamut allows up to a smooth
//! ceiling. The ramp is then re-parametrised by arc length in CIELAB, so that equal steps of
//! the scale are equal colour differences ΔE*ab (CIE 1976): this is what "perceptually uniform"
//! means here, following the design rules of Kovesi 2015, "Good colour maps: how to design
//! them", arXiv:1509.03700 (monotone lightness, uniform perceptual contrast along the map).
//! The construction and its parameters are written out in `docs/figures.md`.

use crate::{Dash, Rgb, Style};
use std::sync::OnceLock;

/// chiwave's named colours. The series colours are the Okabe & Ito (2008) palette; the older
/// role names used by the figure builders (`TEAL`, `CORAL`, …) are kept and point at the
/// Okabe–Ito colour that took their place.
pub mod palette {
    use super::Rgb;

    /// Text and frame ink (near black, not part of the series palette).
    pub const INK: Rgb = [0x1f, 0x24, 0x2e];
    /// Grid lines.
    pub const GRID: Rgb = [0xe3, 0xe6, 0xec];
    /// Axis frame and tick marks.
    pub const AXIS: Rgb = [0x55, 0x5d, 0x6b];
    /// Background.
    pub const WHITE: Rgb = [0xff, 0xff, 0xff];

    // Okabe & Ito (2008), their eight colours (sRGB, as published).
    /// Okabe–Ito black.
    pub const BLACK: Rgb = [0x00, 0x00, 0x00];
    /// Okabe–Ito orange (230, 159, 0).
    pub const ORANGE: Rgb = [0xe6, 0x9f, 0x00];
    /// Okabe–Ito sky blue (86, 180, 233).
    pub const SKY_BLUE: Rgb = [0x56, 0xb4, 0xe9];
    /// Okabe–Ito bluish green (0, 158, 115).
    pub const BLUISH_GREEN: Rgb = [0x00, 0x9e, 0x73];
    /// Okabe–Ito yellow (240, 228, 66): fills only.
    pub const YELLOW: Rgb = [0xf0, 0xe4, 0x42];
    /// Okabe–Ito blue (0, 114, 178).
    pub const BLUE: Rgb = [0x00, 0x72, 0xb2];
    /// Okabe–Ito vermilion (213, 94, 0).
    pub const VERMILION: Rgb = [0xd5, 0x5e, 0x00];
    /// Okabe–Ito reddish purple (204, 121, 167).
    pub const REDDISH_PURPLE: Rgb = [0xcc, 0x79, 0xa7];
    /// A neutral grey (hue-free, so safe for every viewer) for reference curves.
    pub const GREY: Rgb = [0x6b, 0x72, 0x80];

    // Role names used by the figure builders.
    /// The main curve of a figure (exact result): bluish green.
    pub const TEAL: Rgb = BLUISH_GREEN;
    /// A second main curve or a warning: vermilion.
    pub const CORAL: Rgb = VERMILION;
    /// Orange.
    pub const AMBER: Rgb = ORANGE;
    /// Blue.
    pub const INDIGO: Rgb = BLUE;
    /// Sky blue.
    pub const MOSS: Rgb = SKY_BLUE;
    /// Reddish purple.
    pub const PLUM: Rgb = REDDISH_PURPLE;
    /// Neutral grey.
    pub const SLATE: Rgb = GREY;
    /// Fill of excluded regions (capture): a pale tint of the Okabe–Ito yellow.
    pub const SAND: Rgb = [0xf6, 0xee, 0xc4];

    /// Colours for a family of series (the partial sums of an expansion), in order. Seven
    /// entries: a builder that alternates two dash patterns gets 14 distinct looks; with the
    /// four patterns of [`super::series_style`] it gets 28.
    pub const CYCLE: [Rgb; 7] = [BLUE, ORANGE, SKY_BLUE, REDDISH_PURPLE, GREY, VERMILION, BLACK];
}

/// The dash patterns in the order the drawing routine tries them when two series would look
/// alike.
pub const DASHES: [Dash; 6] = [Dash::Solid, Dash::Dashed, Dash::Dotted, Dash::DashDot, Dash::LongDash, Dash::DashDotDot];

/// The style of member `i` of a family of series (partial sums, orders): colour `i mod 7` of
/// [`palette::CYCLE`] and dash `i mod 4` of dashed, dotted, dash-dot, long dash. 7 and 4 are
/// coprime, so the first 28 members all differ, and neighbours differ in both colour and dash.
pub fn series_style(i: usize, width: u32) -> Style {
    const FAMILY_DASHES: [Dash; 4] = [Dash::Dashed, Dash::Dotted, Dash::DashDot, Dash::LongDash];
    Style { color: palette::CYCLE[i % palette::CYCLE.len()], width, dash: FAMILY_DASHES[i % FAMILY_DASHES.len()], fill: None }
}

/// The styles a figure's series are drawn with: the builders' styles, except that a labelled
/// series whose colour and dash both repeat an earlier labelled series gets the first dash
/// pattern of [`DASHES`] not yet used with its colour (or, if all are, the next colour of the
/// cycle). Unlabelled series (continuations, such as the second and later rays of one kind)
/// and legend notes (no points) keep their style.
pub fn distinct_styles(series: &[crate::Series]) -> Vec<Style> {
    let mut used: Vec<(Rgb, Dash)> = Vec::new();
    series
        .iter()
        .map(|s| {
            let mut st = s.style;
            if s.label.is_empty() || s.points.is_empty() {
                return st;
            }
            if used.contains(&(st.color, st.dash)) {
                match DASHES.iter().find(|d| !used.contains(&(st.color, **d))) {
                    Some(&d) => st.dash = d,
                    None => {
                        // Every pattern is taken in this colour: move to a colour not yet used.
                        if let Some(&c) = palette::CYCLE.iter().find(|c| !used.iter().any(|u| u.0 == **c)) {
                            st.color = c;
                        }
                    }
                }
            }
            used.push((st.color, st.dash));
            st
        })
        .collect()
}

// ---------------------------------------------------------------------------------------------
// CIELAB ↔ sRGB

/// D65 reference white (CIE 15:2004, Table T.3, 2° observer), Y normalised to 1.
const WHITE_D65: [f64; 3] = [0.950_47, 1.0, 1.088_83];

/// CIELAB (L*, a*, b*) → CIE XYZ (D65, Y of white = 1).
///
/// # Formula
/// CIE 15:2004, §8.2.1, inverted: f_y = (L* + 16)/116, f_x = f_y + a*/500, f_z = f_y − b*/200;
/// X/X_n = f⁻¹(f_x) with f⁻¹(t) = t³ for t > 6/29, else 3 (6/29)² (t − 4/29); same for Y, Z.
pub fn lab_to_xyz(l: f64, a: f64, b: f64) -> [f64; 3] {
    let fy = (l + 16.0) / 116.0;
    let fx = fy + a / 500.0;
    let fz = fy - b / 200.0;
    let d = 6.0 / 29.0;
    let finv = |t: f64| if t > d { t * t * t } else { 3.0 * d * d * (t - 4.0 / 29.0) };
    [WHITE_D65[0] * finv(fx), WHITE_D65[1] * finv(fy), WHITE_D65[2] * finv(fz)]
}

/// CIE XYZ (D65) → CIELAB, the forward transform of CIE 15:2004, §8.2.1.
pub fn xyz_to_lab(xyz: [f64; 3]) -> [f64; 3] {
    let d = 6.0f64 / 29.0;
    let f = |t: f64| if t > d * d * d { t.cbrt() } else { t / (3.0 * d * d) + 4.0 / 29.0 };
    let (fx, fy, fz) = (f(xyz[0] / WHITE_D65[0]), f(xyz[1] / WHITE_D65[1]), f(xyz[2] / WHITE_D65[2]));
    [116.0 * fy - 16.0, 500.0 * (fx - fy), 200.0 * (fy - fz)]
}

/// CIE XYZ (D65) → linear sRGB, the matrix of IEC 61966-2-1:1999, eq. (6).
fn xyz_to_linear_srgb(x: [f64; 3]) -> [f64; 3] {
    [
        3.2406 * x[0] - 1.5372 * x[1] - 0.4986 * x[2],
        -0.9689 * x[0] + 1.8758 * x[1] + 0.0415 * x[2],
        0.0557 * x[0] - 0.2040 * x[1] + 1.0570 * x[2],
    ]
}

/// Linear sRGB → CIE XYZ (D65), the inverse matrix of IEC 61966-2-1:1999, eq. (9).
fn linear_srgb_to_xyz(c: [f64; 3]) -> [f64; 3] {
    [
        0.4124 * c[0] + 0.3576 * c[1] + 0.1805 * c[2],
        0.2126 * c[0] + 0.7152 * c[1] + 0.0722 * c[2],
        0.0193 * c[0] + 0.1192 * c[1] + 0.9505 * c[2],
    ]
}

/// sRGB transfer function (IEC 61966-2-1:1999, eq. (8)): linear → encoded, both in [0, 1].
fn encode(c: f64) -> f64 {
    if c <= 0.003_130_8 {
        12.92 * c
    } else {
        1.055 * c.powf(1.0 / 2.4) - 0.055
    }
}

/// Inverse sRGB transfer function (IEC 61966-2-1:1999, eq. (5)).
fn decode(c: f64) -> f64 {
    if c <= 0.040_45 {
        c / 12.92
    } else {
        ((c + 0.055) / 1.055).powf(2.4)
    }
}

/// An 8-bit sRGB colour → CIELAB (D65).
pub fn rgb_to_lab(c: Rgb) -> [f64; 3] {
    let lin = [decode(c[0] as f64 / 255.0), decode(c[1] as f64 / 255.0), decode(c[2] as f64 / 255.0)];
    xyz_to_lab(linear_srgb_to_xyz(lin))
}

/// CIELAB → linear sRGB (may fall outside [0, 1] when the colour is out of gamut).
fn lab_to_linear(l: f64, a: f64, b: f64) -> [f64; 3] {
    xyz_to_linear_srgb(lab_to_xyz(l, a, b))
}

fn in_gamut(lin: [f64; 3]) -> bool {
    lin.iter().all(|v| (-1e-9..=1.0 + 1e-9).contains(v))
}

fn to_rgb8(lin: [f64; 3]) -> Rgb {
    let q = |v: f64| (encode(v.clamp(0.0, 1.0)) * 255.0).round().clamp(0.0, 255.0) as u8;
    [q(lin[0]), q(lin[1]), q(lin[2])]
}

// ---------------------------------------------------------------------------------------------
// The sequential ramp

/// Lightness L* at the dark end of the scale.
pub const SCALE_L_DARK: f64 = 14.0;
/// Lightness L* at the bright end of the scale.
pub const SCALE_L_BRIGHT: f64 = 96.0;
/// Hue angle h_ab (degrees) at the dark end: blue-violet.
const SCALE_HUE_DARK: f64 = 295.0;
/// Hue turned through (degrees) to the bright end: 295° + 165° = 100°, a yellow.
const SCALE_HUE_TURN: f64 = 165.0;
/// Largest chroma C*ab asked for, reached mid-scale. With 62 the smooth ceiling stays inside
/// the sRGB gamut along the whole ramp (the gamut allows 62.5 at s = 0.65, its tightest point
/// under the ceiling), so the ramp has no kink from gamut clipping.
const SCALE_CHROMA_PEAK: f64 = 62.0;
/// Samples of the construction and of the lookup table.
const SCALE_SAMPLES: usize = 256;

/// The ramp before re-parametrisation, at s ∈ [0, 1]: CIELAB (L*, a*, b*), in the sRGB gamut.
fn ramp_lab(s: f64) -> [f64; 3] {
    let l = SCALE_L_DARK + (SCALE_L_BRIGHT - SCALE_L_DARK) * s;
    let h = (SCALE_HUE_DARK + SCALE_HUE_TURN * s).to_radians();
    // A smooth chroma ceiling: zero at both ends is not wanted (the ends would be grey), so
    // the ceiling is 0.35 + 0.65 sin(π s) of the peak; the gamut then cuts it where it must.
    let ceiling = SCALE_CHROMA_PEAK * (0.35 + 0.65 * (std::f64::consts::PI * s).sin());
    let at = |c: f64| lab_to_linear(l, c * h.cos(), c * h.sin());
    let c = if in_gamut(at(ceiling)) {
        ceiling
    } else {
        // Largest in-gamut chroma below the ceiling (bisection; chroma 0 is always in gamut),
        // less half a unit so that interpolating between table entries stays in gamut.
        let (mut lo, mut hi) = (0.0, ceiling);
        for _ in 0..40 {
            let mid = 0.5 * (lo + hi);
            if in_gamut(at(mid)) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        (lo - 0.5).max(0.0)
    };
    [l, c * h.cos(), c * h.sin()]
}

/// The lookup table: SCALE_SAMPLES colours equally spaced in ΔE*ab along the ramp.
fn table() -> &'static [[f64; 3]] {
    static TABLE: OnceLock<Vec<[f64; 3]>> = OnceLock::new();
    TABLE.get_or_init(|| {
        // Fine samples of the ramp and their cumulative arc length in CIELAB.
        let n = 4096;
        let pts: Vec<[f64; 3]> = (0..=n).map(|k| ramp_lab(k as f64 / n as f64)).collect();
        let mut arc = vec![0.0; pts.len()];
        for k in 1..pts.len() {
            arc[k] = arc[k - 1] + delta_e(pts[k - 1], pts[k]);
        }
        let total = arc[n];
        let mut out = Vec::with_capacity(SCALE_SAMPLES);
        let mut k = 0;
        for i in 0..SCALE_SAMPLES {
            let target = total * i as f64 / (SCALE_SAMPLES - 1) as f64;
            while k + 1 < n && arc[k + 1] < target {
                k += 1;
            }
            let seg = arc[k + 1] - arc[k];
            let f = if seg > 0.0 { ((target - arc[k]) / seg).clamp(0.0, 1.0) } else { 0.0 };
            let (p, q) = (pts[k], pts[k + 1]);
            out.push([p[0] + f * (q[0] - p[0]), p[1] + f * (q[1] - p[1]), p[2] + f * (q[2] - p[2])]);
        }
        out
    })
}

/// CIE 1976 colour difference ΔE*ab: the Euclidean distance in CIELAB.
pub fn delta_e(p: [f64; 3], q: [f64; 3]) -> f64 {
    ((p[0] - q[0]).powi(2) + (p[1] - q[1]).powi(2) + (p[2] - q[2]).powi(2)).sqrt()
}

/// The scale's CIELAB colour at t ∈ [0, 1] (clamped; NaN is the low end): linear
/// interpolation in the equal-ΔE table.
pub fn sequential_lab(t: f64) -> [f64; 3] {
    let tab = table();
    let t = if t.is_finite() { t.clamp(0.0, 1.0) } else { 0.0 };
    let x = t * (tab.len() - 1) as f64;
    let i = (x.floor() as usize).min(tab.len() - 2);
    let f = x - i as f64;
    let (p, q) = (tab[i], tab[i + 1]);
    [p[0] + f * (q[0] - p[0]), p[1] + f * (q[1] - p[1]), p[2] + f * (q[2] - p[2])]
}

/// The sequential colour scale at t ∈ [0, 1]: low = dark blue-violet, high = pale yellow.
/// See the module documentation for its construction.
pub fn sequential(t: f64) -> Rgb {
    let [l, a, b] = sequential_lab(t);
    to_rgb8(lab_to_linear(l, a, b))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn lab_round_trip_and_white_point() {
        // CIE 15:2004: the reference white has L* = 100, a* = b* = 0; sRGB white maps to it
        // (IEC 61966-2-1 primaries sum to D65), to the 4-digit precision of the matrices.
        let w = rgb_to_lab([255, 255, 255]);
        assert!((w[0] - 100.0).abs() < 0.05 && w[1].abs() < 0.1 && w[2].abs() < 0.1, "{w:?}");
        let k = rgb_to_lab([0, 0, 0]);
        assert!(k[0].abs() < 1e-9);
        // sRGB mid grey 119 has L* ≈ 50 (common practice, recalled from memory: 50.0 ± 0.2).
        assert!((rgb_to_lab([119, 119, 119])[0] - 50.0).abs() < 0.3);
        for lab in [[30.0, 20.0, -40.0], [70.0, -30.0, 50.0], [5.0, 1.0, 1.0]] {
            let back = xyz_to_lab(lab_to_xyz(lab[0], lab[1], lab[2]));
            assert!(delta_e(lab, back) < 1e-9, "{lab:?} → {back:?}");
        }
    }

    #[test]
    fn scale_lightness_rises_monotonically_from_dark_to_bright() {
        // Measured on the 8-bit colours actually drawn, converted back to CIELAB.
        let mut prev = f64::NEG_INFINITY;
        for k in 0..=200 {
            let l = rgb_to_lab(sequential(k as f64 / 200.0))[0];
            assert!(l > prev, "L* not rising at step {k}: {l} after {prev}");
            prev = l;
        }
        let (lo, hi) = (rgb_to_lab(sequential(0.0))[0], rgb_to_lab(sequential(1.0))[0]);
        assert!((lo - SCALE_L_DARK).abs() < 1.0 && (hi - SCALE_L_BRIGHT).abs() < 1.0, "{lo} {hi}");
    }

    #[test]
    fn scale_steps_are_equal_colour_differences() {
        // Equal steps of t are equal ΔE*ab (the arc-length construction), within 2 % between
        // the Lab values, and within the 8-bit quantisation once drawn.
        let n = 50;
        let steps: Vec<f64> = (0..n).map(|k| delta_e(sequential_lab(k as f64 / n as f64), sequential_lab((k + 1) as f64 / n as f64))).collect();
        let mean = steps.iter().sum::<f64>() / n as f64;
        for (k, s) in steps.iter().enumerate() {
            assert!((s / mean - 1.0).abs() < 0.02, "step {k}: {s} vs mean {mean}");
        }
        let drawn: Vec<f64> =
            (0..n).map(|k| delta_e(rgb_to_lab(sequential(k as f64 / n as f64)), rgb_to_lab(sequential((k + 1) as f64 / n as f64)))).collect();
        for (k, s) in drawn.iter().enumerate() {
            // One 8-bit step is at most ≈ 1 ΔE*ab here; the mean step is ≈ 3.
            assert!((s - mean).abs() < 1.2, "drawn step {k}: {s} vs {mean}");
        }
    }

    #[test]
    fn scale_clamps_and_is_in_gamut() {
        assert_eq!(sequential(-1.0), sequential(0.0));
        assert_eq!(sequential(2.0), sequential(1.0));
        assert_eq!(sequential(f64::NAN), sequential(0.0));
        for k in 0..=64 {
            let [l, a, b] = sequential_lab(k as f64 / 64.0);
            assert!(in_gamut(lab_to_linear(l, a, b)), "out of gamut at {k}");
        }
    }

    #[test]
    fn series_palette_is_okabe_ito() {
        // Okabe & Ito 2008 (as reprinted by Wong 2011, Nature Methods 8, 441): sRGB triples.
        assert_eq!(palette::ORANGE, [230, 159, 0]);
        assert_eq!(palette::SKY_BLUE, [86, 180, 233]);
        assert_eq!(palette::BLUISH_GREEN, [0, 158, 115]);
        assert_eq!(palette::YELLOW, [240, 228, 66]);
        assert_eq!(palette::BLUE, [0, 114, 178]);
        assert_eq!(palette::VERMILION, [213, 94, 0]);
        assert_eq!(palette::REDDISH_PURPLE, [204, 121, 167]);
    }

    #[test]
    fn family_styles_are_distinct_for_28_members() {
        let st: Vec<Style> = (0..28).map(|i| series_style(i, 1)).collect();
        for i in 0..st.len() {
            for j in 0..i {
                assert!(!(st[i].color == st[j].color && st[i].dash == st[j].dash), "{i} and {j} look alike");
            }
            if i > 0 {
                assert!(st[i].color != st[i - 1].color && st[i].dash != st[i - 1].dash, "neighbours {i}");
            }
        }
    }

    #[test]
    fn distinct_styles_breaks_ties_by_dash() {
        use crate::Series;
        let s = |label: &str, style: Style| Series { label: label.into(), points: vec![Some((0.0, 0.0))], style };
        let series = vec![
            s("a", Style::dashed(palette::BLUE, 1)),
            s("b", Style::dashed(palette::BLUE, 1)),
            s("", Style::dashed(palette::BLUE, 1)),
            s("c", Style::dashed(palette::BLUE, 2)),
        ];
        let out = distinct_styles(&series);
        assert_eq!(out[0].dash, Dash::Dashed);
        assert_eq!(out[1].dash, Dash::Solid);
        assert_eq!(out[2].dash, Dash::Dashed, "unlabelled continuation keeps its style");
        assert_eq!(out[3].dash, Dash::Dotted);
    }
}
