//! Tick positions and tick labels for linear and base-10 logarithmic axes.
//!
//! Positions are returned in *axis space*: the data value for a linear axis, log10 of the data
//! value for a logarithmic one (that is the space the chart is drawn in).

/// A tick: position in axis space and its label.
#[derive(Debug, Clone, PartialEq)]
pub struct Tick {
    pub at: f64,
    pub label: String,
    /// Major ticks get a label and a grid line; minor ticks only a short mark.
    pub major: bool,
}

/// Ticks for an axis spanning `[lo, hi]` in axis space.
pub fn ticks(lo: f64, hi: f64, log: bool) -> Vec<Tick> {
    if !(lo.is_finite() && hi.is_finite()) || hi <= lo {
        return Vec::new();
    }
    if log {
        log_ticks(lo, hi)
    } else {
        linear_ticks(lo, hi, 6)
            .into_iter()
            .map(|(at, label)| Tick { at, label, major: true })
            .collect()
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

fn linear_ticks(lo: f64, hi: f64, target: usize) -> Vec<(f64, String)> {
    let step = nice_step(hi - lo, target);
    if !(step.is_finite() && step > 0.0) {
        return Vec::new();
    }
    let first = (lo / step - 1e-9).ceil() as i64;
    let last = (hi / step + 1e-9).floor() as i64;
    if last < first || last - first > 50 {
        return Vec::new();
    }
    (first..=last)
        .map(|k| {
            let v = k as f64 * step;
            // Snap to exact zero so that "-0" never appears.
            let v = if (v / step).abs() < 1e-9 { 0.0 } else { v };
            (v, format_tick(v, step))
        })
        .collect()
}

fn log_ticks(lo: f64, hi: f64) -> Vec<Tick> {
    let d0 = lo.floor() as i64;
    let d1 = hi.ceil() as i64;
    let decades = (hi - lo).max(0.0);
    let mut out = Vec::new();
    if decades < 1.2 {
        // Less than about a decade: linear-style ticks of the data value, placed in log space.
        let (a, b) = (10f64.powf(lo), 10f64.powf(hi));
        for (v, label) in linear_ticks(a, b, 5) {
            if v > 0.0 {
                out.push(Tick { at: v.log10(), label, major: true });
            }
        }
        return out;
    }
    // Label every decade, or every 2nd/3rd... when there are many.
    let every = ((decades / 7.0).ceil() as i64).max(1);
    for d in d0..=d1 {
        let at = d as f64;
        if at >= lo - 1e-9 && at <= hi + 1e-9 {
            let major = d.rem_euclid(every) == 0;
            out.push(Tick { at, label: if major { decade_label(d) } else { String::new() }, major });
        }
        if decades <= 6.0 {
            for m in 2..=9 {
                let at = d as f64 + (m as f64).log10();
                if at > lo && at < hi {
                    out.push(Tick { at, label: String::new(), major: false });
                }
            }
        }
    }
    out
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

/// Formats a tick value given the tick step (enough decimals to tell ticks apart).
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
        return format!("{ms}×10{}", superscript(e));
    }
    let decimals = (-step.log10().floor()).max(0.0) as usize;
    format!("{:.*}", decimals.min(8), v)
}

#[cfg(test)]
mod tests {
    use super::*;

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
}
