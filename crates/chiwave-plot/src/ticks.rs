//! Tick positions and tick labels for linear and base-10 logarithmic axes.
//!
//! Positions are returned in *axis space*: the data value for a linear axis, log10 of the data
//! value for a logarithmic one (that is the space the chart is drawn in).
//!
//! Every axis gets at least two labelled ticks whenever its range is not degenerate:
//! * linear axes: steps of 1, 2 or 5 × 10^k, as many as fit; values that need an exponent
//!   share it as one factor written at the end of the axis ("×10⁻²¹"), so the labels stay short;
//! * log axes: the decades (every one, or every 2nd, 3rd … when they would crowd), with
//!   minor ticks at 2 … 9; a range that holds fewer than two decades is labelled at 1, 2 and 5
//!   of each decade, then at every integer multiple, and a range narrower than that gets
//!   linear-style ticks of the value itself.
//!
//! Negative numbers use the minus sign U+2212, as typeset mathematics does.

/// A tick: position in axis space and its label.
#[derive(Debug, Clone, PartialEq)]
pub struct Tick {
    pub at: f64,
    pub label: String,
    /// Major ticks get a label and a grid line; minor ticks only a short mark.
    pub major: bool,
}

/// The ticks of one axis and the common factor of their labels, if any (`"×10⁻²¹"`).
#[derive(Debug, Clone, PartialEq, Default)]
pub struct TickSet {
    pub ticks: Vec<Tick>,
    pub factor: Option<String>,
}

impl TickSet {
    /// The labelled ticks.
    pub fn labelled(&self) -> impl Iterator<Item = &Tick> {
        self.ticks.iter().filter(|t| t.major && !t.label.is_empty())
    }
}

/// Ticks for an axis spanning `[lo, hi]` in axis space, at the default density (about six
/// labels on a linear axis), labels written out in full (no common factor).
pub fn ticks(lo: f64, hi: f64, log: bool) -> Vec<Tick> {
    if !(lo.is_finite() && hi.is_finite()) || hi <= lo {
        return Vec::new();
    }
    if log {
        fitted(lo, hi, true, 6, &|_| true).ticks
    } else {
        let step = nice_step(hi - lo, 6);
        linear_values(lo, hi, step).into_iter().map(|v| Tick { at: v, label: format_tick(v, step), major: true }).collect()
    }
}

/// Ticks for `[lo, hi]` (axis space) with about `target` labels on a linear axis, thinned
/// until `fits` accepts them (the caller checks that the labels do not overlap at the axis
/// length it has). At least two labelled ticks are kept even if they never fit.
pub fn fitted(lo: f64, hi: f64, log: bool, target: usize, fits: &dyn Fn(&[Tick]) -> bool) -> TickSet {
    if !(lo.is_finite() && hi.is_finite()) || hi <= lo {
        return TickSet::default();
    }
    if log {
        log_fitted(lo, hi, fits)
    } else {
        linear_fitted(lo, hi, target, fits)
    }
}

/// A "nice" step (1, 2 or 5 × 10^k) giving about `target` intervals over `span`.
fn nice_step(span: f64, target: usize) -> f64 {
    let raw = span / target.max(1) as f64;
    let mag = 10f64.powf(raw.log10().floor());
    let r = raw / mag;
    let m = if r < 1.5 {
        1.0
    } else if r < 3.5 {
        2.0
    } else if r < 7.5 {
        5.0
    } else {
        10.0
    };
    m * mag
}

/// The next larger (`up`) or smaller 1-2-5 step.
fn step_next(step: f64, up: bool) -> f64 {
    let mag = 10f64.powf(step.log10().floor());
    let m = (step / mag).round();
    match (m as i64, up) {
        (1, true) => 2.0 * mag,
        (2, true) => 5.0 * mag,
        (_, true) => 10.0 * mag,
        (1, false) => 0.5 * mag,
        (2, false) => mag,
        (5, false) => 2.0 * mag,
        (_, false) => 5.0 * mag,
    }
}

/// Multiples of `step` inside [lo, hi] (zero exact, never "−0").
fn linear_values(lo: f64, hi: f64, step: f64) -> Vec<f64> {
    if !(step.is_finite() && step > 0.0) {
        return Vec::new();
    }
    let first = (lo / step - 1e-9).ceil();
    let last = (hi / step + 1e-9).floor();
    if !(first.is_finite() && last.is_finite()) || last < first || last - first > 200.0 {
        return Vec::new();
    }
    let (first, last) = (first as i64, last as i64);
    (first..=last).map(|k| if k == 0 { 0.0 } else { k as f64 * step }).collect()
}

/// Labels for the values `vs` (multiples of `step`), with a common power-of-ten factor when
/// the values need an exponent.
fn linear_labels(vs: &[f64], step: f64) -> (Vec<String>, Option<String>) {
    let big = vs.iter().fold(0.0f64, |m, v| m.max(v.abs())).max(step);
    if !(1e-3..1e5).contains(&big) {
        let e = big.log10().floor() as i32;
        let scale = 10f64.powi(e);
        let decimals = decimals_for(step / scale);
        let labels = vs.iter().map(|v| minus(&format!("{:.*}", decimals, v / scale))).collect();
        (labels, Some(format!("×10{}", superscript(e as i64))))
    } else {
        let decimals = decimals_for(step);
        (vs.iter().map(|v| minus(&format!("{:.*}", decimals, v))).collect(), None)
    }
}

/// Decimals needed to tell apart multiples of `step`.
fn decimals_for(step: f64) -> usize {
    let d = -(step.log10() + 1e-9).floor();
    (d.max(0.0) as usize).min(10)
}

/// Replaces a leading hyphen by the minus sign; "−0" (from rounding) becomes "0".
fn minus(s: &str) -> String {
    match s.strip_prefix('-') {
        Some(rest) if rest.chars().all(|c| c == '0' || c == '.') => rest.to_string(),
        Some(rest) => format!("−{rest}"),
        None => s.to_string(),
    }
}

fn linear_set(lo: f64, hi: f64, step: f64) -> TickSet {
    let vs = linear_values(lo, hi, step);
    let (labels, factor) = linear_labels(&vs, step);
    TickSet { ticks: vs.into_iter().zip(labels).map(|(at, label)| Tick { at, label, major: true }).collect(), factor }
}

fn linear_fitted(lo: f64, hi: f64, target: usize, fits: &dyn Fn(&[Tick]) -> bool) -> TickSet {
    let mut step = nice_step(hi - lo, target.max(2));
    // At least two ticks: make the step smaller while it leaves fewer.
    let mut guard = 0;
    while linear_values(lo, hi, step).len() < 2 && guard < 8 {
        step = step_next(step, false);
        guard += 1;
    }
    let mut best = linear_set(lo, hi, step);
    for _ in 0..12 {
        let set = linear_set(lo, hi, step);
        if set.ticks.len() < 2 {
            break;
        }
        if fits(&set.ticks) {
            return set;
        }
        best = set;
        step = step_next(step, true);
    }
    // Nothing fits: the sparsest set that still has two ticks.
    best
}

/// Label of the value m × 10^d (m = 1 … 9) on a log axis.
fn log_label(m: u32, d: i64) -> String {
    if m == 1 {
        return decade_label(d);
    }
    let v = m as f64 * 10f64.powi(d as i32);
    if (0.01..1e4).contains(&v) {
        let decimals = (-d).max(0) as usize;
        format!("{:.*}", decimals, v)
    } else {
        format!("{m}×10{}", superscript(d))
    }
}

/// Log ticks where the multiples `labelled` (of 1 … 9) of every decade `d` with
/// `d % stride == 0` (or every decade for multiples other than 1) are labelled.
fn log_set(lo: f64, hi: f64, stride: i64, labelled: &[u32]) -> TickSet {
    let d0 = lo.floor() as i64;
    let d1 = hi.ceil() as i64;
    let decades = hi - lo;
    let mut out = Vec::new();
    for d in d0..=d1 {
        for m in 1..=9u32 {
            let at = d as f64 + (m as f64).log10();
            if at < lo - 1e-9 || at > hi + 1e-9 {
                continue;
            }
            let is_label = if m == 1 { labelled.contains(&1) && d.rem_euclid(stride) == 0 } else { labelled.contains(&m) };
            if is_label {
                out.push(Tick { at, label: log_label(m, d), major: true });
            } else if m == 1 || decades <= 6.0 {
                out.push(Tick { at, label: String::new(), major: false });
            }
        }
    }
    TickSet { ticks: out, factor: None }
}

fn log_fitted(lo: f64, hi: f64, fits: &dyn Fn(&[Tick]) -> bool) -> TickSet {
    let count = |s: &TickSet| s.ticks.iter().filter(|t| t.major).count();
    // Decades, thinned by a growing stride.
    let decades = (hi - lo).max(0.0);
    let mut fallback: Option<TickSet> = None;
    for stride in [1i64, 2, 3, 4, 5, 6, 8, 10, 15, 20, 25, 30, 40, 50, 75, 100] {
        let set = log_set(lo, hi, stride, &[1]);
        if count(&set) < 2 {
            break;
        }
        if fits(&set.ticks) {
            return set;
        }
        fallback = Some(set);
        if stride as f64 > decades {
            break;
        }
    }
    if let Some(f) = fallback {
        return f;
    }
    // Fewer than two decades: 1-2-5, then every multiple.
    for labelled in [&[1u32, 2, 5][..], &[1, 2, 3, 4, 5, 6, 7, 8, 9][..]] {
        let set = log_set(lo, hi, 1, labelled);
        if count(&set) >= 2 && fits(&set.ticks) {
            return set;
        }
        if count(&set) >= 2 && fallback.is_none() {
            fallback = Some(set);
        }
    }
    // A narrow range: linear-style ticks of the value, placed in log space.
    let (a, b) = (10f64.powf(lo), 10f64.powf(hi));
    let lin = linear_fitted(a, b, 5, &|ts: &[Tick]| {
        let moved: Vec<Tick> = ts.iter().filter(|t| t.at > 0.0).map(|t| Tick { at: t.at.log10(), ..t.clone() }).collect();
        fits(&moved)
    });
    let moved = TickSet {
        ticks: lin.ticks.into_iter().filter(|t| t.at > 0.0).map(|t| Tick { at: t.at.log10(), ..t }).collect(),
        factor: lin.factor,
    };
    if moved.ticks.len() >= 2 || fallback.is_none() {
        moved
    } else {
        fallback.unwrap_or_default()
    }
}

/// "10⁻³"-style label for a decade; plain numbers for 0.01 … 1000.
pub fn decade_label(d: i64) -> String {
    match d {
        -2 => "0.01".into(),
        -1 => "0.1".into(),
        0 => "1".into(),
        1 => "10".into(),
        2 => "100".into(),
        3 => "1000".into(),
        _ => format!("10{}", superscript(d)),
    }
}

/// Unicode superscript digits for an integer exponent.
pub fn superscript(n: i64) -> String {
    const DIGITS: [char; 10] = ['⁰', '¹', '²', '³', '⁴', '⁵', '⁶', '⁷', '⁸', '⁹'];
    let mut s = String::new();
    if n < 0 {
        s.push('⁻');
    }
    for c in n.unsigned_abs().to_string().chars() {
        let i = c.to_digit(10).unwrap_or(0) as usize;
        s.push(DIGITS[i]);
    }
    s
}

/// Formats a tick value given the tick step (enough decimals to tell ticks apart), written in
/// full ("1.5×10⁻²¹" when an exponent is needed).
pub fn format_tick(v: f64, step: f64) -> String {
    if v == 0.0 {
        return "0".into();
    }
    let big = v.abs().max(step.abs());
    if big >= 1e5 || step.abs() < 1e-4 {
        let e = v.abs().log10().floor() as i64;
        let m = v / 10f64.powi(e as i32);
        let digits = (-(step / 10f64.powi(e as i32)).log10().floor().min(0.0)) as usize;
        let ms = format!("{:.*}", digits.min(6), m);
        return format!("{}×10{}", minus(&ms), superscript(e));
    }
    minus(&format!("{:.*}", decimals_for(step), v))
}

#[cfg(test)]
mod tests {
    use super::*;

    fn labels(ts: &TickSet) -> Vec<&str> {
        ts.labelled().map(|t| t.label.as_str()).collect()
    }

    #[test]
    fn linear_ticks_are_nice_and_inside() {
        // common practice, no source: 1-2-5 steps covering the range
        let t = ticks(0.0, 10.0, false);
        let at: Vec<f64> = t.iter().map(|t| t.at).collect();
        assert_eq!(at, vec![0.0, 2.0, 4.0, 6.0, 8.0, 10.0]);
        assert_eq!(t[1].label, "2");
        let t = ticks(-0.03, 0.07, false);
        assert!(t.iter().any(|t| t.label == "0"));
        assert!(t.iter().all(|t| t.at >= -0.03 - 1e-12 && t.at <= 0.07 + 1e-12));
        assert!(t.iter().any(|t| t.label == "−0.02"), "minus sign U+2212: {t:?}");
    }

    #[test]
    fn log_ticks_label_decades() {
        let t = ticks(0.0, 4.0, true);
        let labels: Vec<&str> = t.iter().filter(|t| t.major).map(|t| t.label.as_str()).collect();
        assert_eq!(labels, vec!["1", "10", "100", "1000", "10⁴"]);
        assert_eq!(decade_label(-7), "10⁻⁷");
    }

    #[test]
    fn empty_for_degenerate_range() {
        assert!(ticks(1.0, 1.0, false).is_empty());
        assert!(ticks(f64::NAN, 1.0, true).is_empty());
    }

    #[test]
    fn common_factor_for_tiny_and_huge_values() {
        let s = fitted(-3.2e-21, 2.7e-21, false, 6, &|_| true);
        assert_eq!(s.factor.as_deref(), Some("×10⁻²¹"));
        assert!(labels(&s).contains(&"−2") && labels(&s).contains(&"2"), "{:?}", labels(&s));
        let s = fitted(-1.05e7, 1.05e7, false, 5, &|_| true);
        assert_eq!(s.factor.as_deref(), Some("×10⁷"));
        let s = fitted(0.0, 7.0, false, 5, &|_| true);
        assert_eq!(s.factor, None);
    }

    #[test]
    fn at_least_two_labels_on_every_log_range() {
        // Ranges from a hundredth of a decade to 300 decades, at every offset: two labels or
        // more, each inside the range, strictly increasing.
        for &span in &[0.01, 0.05, 0.2, 0.5, 0.9, 1.0, 1.1, 1.3, 1.9, 2.5, 6.0, 15.0, 40.0, 300.0] {
            for k in 0..20 {
                let lo = -30.0 + 3.7 * k as f64 + 0.013 * k as f64;
                let s = fitted(lo, lo + span, true, 6, &|_| true);
                let lab: Vec<&Tick> = s.labelled().collect();
                assert!(lab.len() >= 2, "span {span} at {lo}: {:?}", s.ticks);
                assert!(lab.iter().all(|t| t.at >= lo - 1e-9 && t.at <= lo + span + 1e-9));
                assert!(lab.windows(2).all(|w| w[1].at > w[0].at));
            }
        }
    }

    #[test]
    fn log_fallbacks_use_one_two_five() {
        // 1.26 … 31.6: one decade inside, so 2, 5, 10, 20 are labelled.
        let s = fitted(0.1, 1.5, true, 6, &|_| true);
        assert_eq!(labels(&s), vec!["2", "5", "10", "20"]);
        // 6 … 9.5: no 1-2-5 value inside but 6, 7, 8, 9.
        let s = fitted(6f64.log10() - 0.001, 9.5f64.log10(), true, 6, &|_| true);
        assert_eq!(labels(&s), vec!["6", "7", "8", "9"]);
        // Labels that do not fit make the stride grow.
        let crowded = fitted(-20.0, 20.0, true, 6, &|ts: &[Tick]| ts.iter().filter(|t| t.major).count() <= 6);
        assert!(crowded.labelled().count() <= 6 && crowded.labelled().count() >= 2);
    }

    #[test]
    fn linear_thins_until_it_fits_and_keeps_two() {
        let s = fitted(0.0, 100.0, false, 10, &|ts: &[Tick]| ts.len() <= 3);
        assert!(s.ticks.len() <= 3 && s.ticks.len() >= 2, "{:?}", s.ticks);
        let s = fitted(0.0, 100.0, false, 10, &|_| false);
        assert!(s.ticks.len() >= 2);
        // A narrow range far from zero still tells its ticks apart.
        let s = fitted(1.000_001, 1.000_002, false, 5, &|_| true);
        let l = labels(&s);
        assert!(l.len() >= 2 && l.windows(2).all(|w| w[0] != w[1]), "{l:?}");
    }
}
