//! Text extents without fonts: the drawing routine never loads a font (it runs in wasm and
//! writes SVG `<text>`), so it estimates each label's width from per-character advance widths
//! and lays the figure out with those boxes, leaving a gap that absorbs the estimate's error.
//!
//! The widths are those of a wide sans-serif face (DejaVu Sans, the fallback of most Linux
//! systems; approximate values, recalled from memory, rounded up): Helvetica, Arial, Liberation
//! Sans and Nimbus Sans, which come first in [`FONT_STACK`], are narrower, so the estimate errs
//! on the wide side and labels placed with it do not touch.

/// The font stack of every text element: faces present on every common system (Helvetica on
/// macOS, Arial on Windows, Liberation Sans or Nimbus Sans — metric twins of Arial/Helvetica —
/// or DejaVu Sans on Linux), then the generic family.
pub const FONT_STACK: &str = "Helvetica, Arial, 'Liberation Sans', 'Nimbus Sans', 'DejaVu Sans', sans-serif";

/// Ascent and descent of a line, as fractions of the font size (generous: accents and
/// superscripts fit).
pub const ASCENT: f64 = 0.80;
pub const DESCENT: f64 = 0.22;

/// Advance width of one character in em.
pub fn advance(c: char) -> f64 {
    match c {
        ' ' => 0.32,
        '0'..='9' => 0.64,
        '.' | ',' | ':' | ';' | '·' | '\'' | '|' | '!' => 0.34,
        '(' | ')' | '[' | ']' | '{' | '}' => 0.40,
        '/' | '\\' => 0.34,
        '-' | '_' => 0.40,
        '+' | '=' | '×' | '−' | '<' | '>' | '≤' | '≥' | '≪' | '≫' | '→' | '←' | '±' | '~' | '≈' | '∝' => 0.84,
        '*' | '"' => 0.50,
        '%' => 0.95,
        '&' | '@' => 0.90,
        '#' | '$' => 0.64,
        'i' | 'j' | 'l' => 0.28,
        'f' | 't' => 0.40,
        'r' => 0.42,
        'm' => 0.98,
        'w' => 0.82,
        'a'..='z' => 0.64,
        'I' | 'J' => 0.30,
        'M' => 0.87,
        'W' => 0.99,
        'A'..='Z' => 0.78,
        // Superscript and subscript digits and signs.
        '⁰' | '¹' | '²' | '³' | '⁴' | '⁵' | '⁶' | '⁷' | '⁸' | '⁹' | '⁻' | '⁺' | '₀' | '₁' | '₂' | '₃' | '₄' | '₅' | '₆' | '₇' | '₈'
        | '₉' | '₊' | '₋' | 'ᵉ' => 0.42,
        'Ω' | 'Δ' | 'Φ' | 'Θ' | 'Σ' | 'Γ' | 'Λ' | 'Π' | 'Ψ' => 0.80,
        'ω' => 0.86,
        'α'..='ψ' => 0.68,
        '∫' | '√' | '∂' | '∞' | '⊥' => 0.86,
        '…' => 1.0,
        _ => 0.9,
    }
}

/// Average advance below which no estimate goes (em per character): a margin for faces and
/// fallback fonts wider than the table in running lower-case text.
pub const MIN_AVERAGE: f64 = 0.6;

/// Estimated width of `s` at font size `size` (px): the sum of the advances, but never less
/// than [`MIN_AVERAGE`] em per character.
pub fn width(s: &str, size: f64) -> f64 {
    let (sum, n) = s.chars().fold((0.0, 0usize), |(a, n), c| (a + advance(c), n + 1));
    sum.max(MIN_AVERAGE * n as f64) * size
}

/// Estimated width of `s` in bold (about 10 % wider).
pub fn width_bold(s: &str, size: f64) -> f64 {
    1.1 * width(s, size)
}

/// Breaks `s` into lines no wider than `max_w` (estimated) at spaces, at most `max_lines`
/// lines, as even in length as the breaks allow (no lone last word); a last line that still
/// does not fit ends in "…". A single word longer than the line is cut with "…" too. `bold`
/// selects the bold estimate.
pub fn wrap(s: &str, size: f64, max_w: f64, max_lines: usize, bold: bool) -> Vec<String> {
    let w = |t: &str| if bold { width_bold(t, size) } else { width(t, size) };
    if w(s) <= max_w || max_lines == 0 {
        return vec![s.to_string()];
    }
    let lines = greedy(s, &w, max_w);
    if lines.len() > max_lines || lines.len() < 2 {
        return finish(lines, max_lines, max_w, size, bold);
    }
    // Balance: the narrowest width that still gives the same number of lines.
    let n = lines.len();
    let (mut lo, mut hi) = (max_w / n as f64, max_w);
    for _ in 0..30 {
        let mid = 0.5 * (lo + hi);
        if greedy(s, &w, mid).len() <= n {
            hi = mid;
        } else {
            lo = mid;
        }
    }
    finish(greedy(s, &w, hi), max_lines, max_w, size, bold)
}

/// Greedy line breaking at spaces (a word longer than the line gets a line of its own).
fn greedy(s: &str, w: &dyn Fn(&str) -> f64, max_w: f64) -> Vec<String> {
    let mut lines: Vec<String> = Vec::new();
    let mut cur = String::new();
    for word in s.split(' ').filter(|x| !x.is_empty()) {
        let cand = if cur.is_empty() { word.to_string() } else { format!("{cur} {word}") };
        if w(&cand) <= max_w || cur.is_empty() {
            cur = cand;
        } else {
            lines.push(std::mem::take(&mut cur));
            cur = word.to_string();
        }
    }
    if !cur.is_empty() {
        lines.push(cur);
    }
    lines
}

/// At most `max_lines` lines (the rest joined into the last), each cut to `max_w` with "…".
fn finish(mut lines: Vec<String>, max_lines: usize, max_w: f64, size: f64, bold: bool) -> Vec<String> {
    let w = |t: &str| if bold { width_bold(t, size) } else { width(t, size) };
    if lines.len() > max_lines {
        let rest = lines[max_lines - 1..].join(" ");
        lines.truncate(max_lines - 1);
        lines.push(rest);
    }
    for l in lines.iter_mut() {
        if w(l) > max_w {
            *l = ellipsis(l, size, max_w, bold);
        }
    }
    lines
}

/// `s` cut so that it fits `max_w` with a trailing "…".
pub fn ellipsis(s: &str, size: f64, max_w: f64, bold: bool) -> String {
    let w = |t: &str| if bold { width_bold(t, size) } else { width(t, size) };
    let mut out = String::new();
    for c in s.chars() {
        let mut cand = out.clone();
        cand.push(c);
        if w(&format!("{cand}…")) > max_w {
            break;
        }
        out = cand;
    }
    let out = out.trim_end().to_string();
    format!("{out}…")
}

/// An axis-aligned box: x, y of the top-left corner, width, height (px).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Bounds {
    pub x: f64,
    pub y: f64,
    pub w: f64,
    pub h: f64,
}

impl Bounds {
    pub fn new(x: f64, y: f64, w: f64, h: f64) -> Self {
        Bounds { x, y, w, h }
    }
    /// True when the boxes share interior area.
    pub fn overlaps(&self, o: &Bounds) -> bool {
        self.x < o.x + o.w && o.x < self.x + self.w && self.y < o.y + o.h && o.y < self.y + self.h
    }
    /// The box grown by `d` on every side.
    pub fn grow(&self, d: f64) -> Bounds {
        Bounds { x: self.x - d, y: self.y - d, w: self.w + 2.0 * d, h: self.h + 2.0 * d }
    }
    pub fn right(&self) -> f64 {
        self.x + self.w
    }
    pub fn bottom(&self) -> f64 {
        self.y + self.h
    }
    pub fn contains(&self, x: f64, y: f64) -> bool {
        x >= self.x && x <= self.x + self.w && y >= self.y && y <= self.y + self.h
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn widths_add_up_and_digits_are_uniform() {
        // Tabular digits: every digit has the same advance (common practice in text faces).
        assert!((width("0123456789", 10.0) - 10.0 * width("0", 10.0)).abs() < 1e-9);
        assert!(width("M", 12.0) > width("i", 12.0));
        assert!((width("mw", 10.0) - width("m", 10.0) - width("w", 10.0)).abs() < 1e-12);
        assert!((width("ill", 10.0) - 3.0 * MIN_AVERAGE * 10.0).abs() < 1e-12, "narrow text gets the minimum average");
    }

    #[test]
    fn wrap_respects_the_width_and_the_line_count() {
        let s = "dE/(df dΩ) [J Hz⁻¹ sr⁻¹], dE/df [J Hz⁻¹]";
        let lines = wrap(s, 13.0, 160.0, 2, false);
        assert_eq!(lines.len(), 2, "{lines:?}");
        assert!(lines.iter().all(|l| width(l, 13.0) <= 160.0), "{lines:?}");
        // Balanced: two lines of similar length rather than a lone last word.
        let t = wrap("Electromagnetic spectrum (closed-form Bessel K0/K1), rest frame of body 2", 15.0, 600.0, 2, true);
        assert_eq!(t.len(), 2);
        assert!(t[1].split(' ').count() > 2, "{t:?}");
        let one = wrap("short", 13.0, 160.0, 2, false);
        assert_eq!(one, vec!["short".to_string()]);
        let cut = wrap("averyveryverylongwordwithoutspaces", 13.0, 80.0, 1, false);
        assert!(cut[0].ends_with('…') && width(&cut[0], 13.0) <= 80.0);
    }

    #[test]
    fn bounds_overlap() {
        let a = Bounds::new(0.0, 0.0, 10.0, 10.0);
        assert!(a.overlaps(&Bounds::new(5.0, 5.0, 10.0, 10.0)));
        assert!(!a.overlaps(&Bounds::new(10.0, 0.0, 5.0, 5.0)), "touching edges do not overlap");
    }
}
