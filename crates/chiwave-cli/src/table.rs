//! Readable tables and CSV from a result's JSON value.
//!
//! The printers are generic over the JSON shape, so every request type prints without a
//! printer of its own: scalars as aligned `name  value` lines, objects as dotted names,
//! arrays of objects as column tables, long numeric arrays as CSV columns. Regime flags and
//! the sources of every number are printed after the values.

use serde_json::{Map, Value};

/// Formats a number with 10 significant digits, in exponent form when very large or small.
pub fn num(x: f64) -> String {
    if x == 0.0 {
        return "0".into();
    }
    let a = x.abs();
    if (1e-4..1e7).contains(&a) {
        let digits = (9 - a.log10().floor() as i32).clamp(0, 14) as usize;
        let s = format!("{x:.digits$}");
        if s.contains('.') {
            s.trim_end_matches('0').trim_end_matches('.').to_string()
        } else {
            s
        }
    } else {
        format!("{x:.9e}")
    }
}

fn scalar(v: &Value) -> Option<String> {
    match v {
        Value::Null => Some("—".into()),
        Value::Bool(b) => Some(b.to_string()),
        Value::Number(n) => n.as_f64().map(num),
        Value::String(s) => Some(s.clone()),
        _ => None,
    }
}

fn is_numeric_array(v: &Value) -> Option<usize> {
    match v {
        Value::Array(a) if a.len() > 1 && a.iter().all(|x| x.is_number() || x.is_null()) => Some(a.len()),
        _ => None,
    }
}

fn flatten(prefix: &str, v: &Map<String, Value>, out: &mut Vec<(String, String)>) {
    for (k, x) in v {
        let name = if prefix.is_empty() { k.clone() } else { format!("{prefix}.{k}") };
        match x {
            Value::Object(m) => flatten(&name, m, out),
            Value::Array(a) if is_numeric_array(x).is_some() => {
                out.push((name, format!("[{} values; use --csv or --json]", a.len())))
            }
            Value::Array(a) if a.iter().all(|e| scalar(e).is_some()) && a.len() <= 8 => {
                let s: Vec<String> = a.iter().filter_map(scalar).collect();
                out.push((name, s.join(", ")));
            }
            Value::Array(_) => {}
            other => {
                if let Some(s) = scalar(other) {
                    out.push((name, s));
                }
            }
        }
    }
}

/// Columns of an array of objects that the table leaves out: null in every row, or text that is
/// the same in every row (printed once under the table instead, as `name: text`).
fn common_columns(rows: &[Value], cols: &[String]) -> (Vec<String>, Vec<(String, String)>) {
    let mut keep = Vec::new();
    let mut notes = Vec::new();
    for c in cols {
        let vals: Vec<&Value> = rows.iter().map(|r| r.get(c).unwrap_or(&Value::Null)).collect();
        if vals.iter().all(|v| v.is_null()) {
            continue;
        }
        let first = vals[0];
        if rows.len() > 1 && first.is_string() && vals.iter().all(|v| *v == first) {
            notes.push((c.clone(), first.as_str().unwrap_or_default().to_string()));
            continue;
        }
        keep.push(c.clone());
    }
    (keep, notes)
}

fn object_table(title: &str, rows: &[Value]) -> String {
    let mut cols: Vec<String> = Vec::new();
    for r in rows {
        if let Value::Object(m) = r {
            for (k, v) in m {
                if scalar(v).is_some() && !cols.contains(k) {
                    cols.push(k.clone());
                }
            }
        }
    }
    let (cols, notes) = common_columns(rows, &cols);
    if cols.is_empty() {
        return String::new();
    }
    let cells: Vec<Vec<String>> = rows
        .iter()
        .map(|r| cols.iter().map(|c| r.get(c).and_then(scalar).unwrap_or_default()).collect())
        .collect();
    let widths: Vec<usize> = cols
        .iter()
        .enumerate()
        .map(|(i, c)| cells.iter().map(|r| r[i].chars().count()).max().unwrap_or(0).max(c.chars().count()))
        .collect();
    let mut s = format!("\n{title}\n");
    let line = |xs: &[String]| {
        xs.iter().zip(&widths).map(|(x, w)| format!("{x:>w$}", w = *w)).collect::<Vec<_>>().join("  ")
    };
    s.push_str(&line(&cols));
    s.push('\n');
    for r in &cells {
        s.push_str(&line(r));
        s.push('\n');
    }
    for (k, t) in notes {
        s.push_str(&format!("  {k} (every row): {t}\n"));
    }
    s
}

/// The value under a dotted key (`chi.3pm`, `strong_deflection.alpha`) of a result.
fn at<'a>(v: &'a Value, key: &str) -> Option<&'a Value> {
    key.split('.').try_fold(v, |x, k| x.get(k))
}

/// Relative error as shown: two significant digits.
fn rel(x: &Value) -> String {
    x.as_f64().map(|e| format!("{e:.1e}")).unwrap_or_else(|| "—".into())
}

/// The recommended-value line(s): `recommended <label>: key = value ± estimate (verdict)`, then why.
fn best_lines(m: &Map<String, Value>) -> String {
    let mut s = String::new();
    for (name, label) in [("best", ""), ("best_e_rad", " (radiated energy)")] {
        let Some(b) = m.get(name) else { continue };
        let key = b.get("key").and_then(Value::as_str).unwrap_or("?");
        let verdict = b.get("verdict").and_then(Value::as_str).unwrap_or("?");
        let why = b.get("why").and_then(Value::as_str).unwrap_or("");
        match b.get("value").and_then(Value::as_f64) {
            Some(x) => {
                let est = b.get("error_estimate").map(rel).unwrap_or_else(|| "—".into());
                let method = b.get("error_method").and_then(Value::as_str).unwrap_or("");
                s.push_str(&format!("recommended{label}: {key} = {} ± {est} relative [{verdict}]\n", num(x)));
                s.push_str(&format!("  why: {why}\n  estimate: {method}\n"));
            }
            None => s.push_str(&format!("recommended{label}: none [{verdict}] — {why}\n")),
        }
    }
    if let Some(t) = m.get("tolerance").and_then(Value::as_f64) {
        s.push_str(&format!("verdicts at tolerance {}: ok < tolerance ≤ caution < 10 × tolerance ≤ outside\n", num(t)));
    }
    if !s.is_empty() {
        s.push('\n');
    }
    s
}

/// The `estimates` map as a table: key, value, estimate, verdict, method (or why there is none).
fn estimates_table(v: &Value, est: &Map<String, Value>) -> String {
    let mut rows: Vec<[String; 5]> = vec![["".into(), "value".into(), "estimate".into(), "verdict".into(), "method (or why none)".into()]];
    for (k, e) in est {
        let value = at(v, k).and_then(scalar).unwrap_or_else(|| "—".into());
        let how = match e.get("error_reason").and_then(Value::as_str) {
            Some(r) => r.to_string(),
            None => e.get("error_method").and_then(Value::as_str).unwrap_or("").to_string(),
        };
        rows.push([k.clone(), value, e.get("error_estimate").map(rel).unwrap_or_default(), e.get("verdict").and_then(Value::as_str).unwrap_or("").into(), how]);
    }
    let w: Vec<usize> = (0..4).map(|i| rows.iter().map(|r| r[i].chars().count()).max().unwrap_or(0)).collect();
    let mut s = String::from("\nError estimates (relative)\n");
    for r in &rows {
        s.push_str(&format!("  {:<w0$}  {:>w1$}  {:>w2$}  {:<w3$}  {}\n", r[0], r[1], r[2], r[3], r[4], w0 = w[0], w1 = w[1], w2 = w[2], w3 = w[3]));
    }
    s
}

/// A readable report of `v` under `title`.
pub fn table(title: &str, v: &Value, notice: &str) -> String {
    let mut s = format!("{title}\n{}\n", "=".repeat(title.chars().count()));
    let Value::Object(m) = v else {
        return format!("{s}{v}\n");
    };
    s.push_str(&best_lines(m));
    let mut scalars = Map::new();
    let mut tables = Vec::new();
    for (k, x) in m {
        match (k.as_str(), x) {
            ("flags" | "sources" | "citations" | "best" | "best_e_rad" | "estimates" | "tolerance", _) => {}
            (_, Value::Array(a)) if !a.is_empty() && a.iter().all(|e| e.is_object()) => tables.push((k, a)),
            _ => {
                scalars.insert(k.clone(), x.clone());
            }
        }
    }
    let mut rows = Vec::new();
    flatten("", &scalars, &mut rows);
    let w = rows.iter().map(|(k, _)| k.chars().count()).max().unwrap_or(0);
    for (k, x) in rows {
        s.push_str(&format!("{k:<w$}  {x}\n"));
    }
    for (k, a) in tables {
        s.push_str(&object_table(k, a));
    }
    if let Some(Value::Object(est)) = m.get("estimates") {
        if !est.is_empty() {
            s.push_str(&estimates_table(v, est));
        }
    }
    if let Some(Value::Array(flags)) = m.get("flags") {
        s.push_str("\nRegime checks\n");
        for f in flags {
            let level = f.get("level").and_then(Value::as_str).unwrap_or("?");
            let key = f.get("key").and_then(Value::as_str).unwrap_or("?");
            let msg = f.get("message").and_then(Value::as_str).unwrap_or("");
            let val = f.get("value").and_then(Value::as_f64).map(|x| format!(" ({})", num(x))).unwrap_or_default();
            s.push_str(&format!("  [{level:^7}] {key}{val}: {msg}\n"));
        }
    }
    if let Some(Value::Object(src)) = m.get("sources") {
        s.push_str("\nSources\n");
        for (k, x) in src {
            s.push_str(&format!("  {k}: {}\n", x.as_str().unwrap_or("")));
        }
    }
    s.push_str(&format!("\n{notice}\n"));
    s
}

fn csv_cell(v: &Value) -> String {
    let t = scalar(v).unwrap_or_default();
    let t = if t == "—" { String::new() } else { t };
    if t.contains(',') || t.contains('"') {
        format!("\"{}\"", t.replace('"', "\"\""))
    } else {
        t
    }
}

fn full(v: &Value) -> String {
    match v {
        Value::Number(n) if n.is_i64() || n.is_u64() => n.to_string(),
        // Debug prints the shortest round-trip form, with an exponent when very small or large.
        Value::Number(n) => n.as_f64().map(|x| format!("{x:?}")).unwrap_or_default(),
        other => csv_cell(other),
    }
}

/// CSV of the main data of `v`: equal-length numeric arrays as columns if there are any,
/// else the first array of objects, else `name,value` rows. Numbers at full precision.
pub fn csv(v: &Value) -> String {
    let Value::Object(m) = v else {
        return format!("{v}\n");
    };
    let arrays: Vec<(&String, &Vec<Value>)> = m
        .iter()
        .filter_map(|(k, x)| match x {
            Value::Array(a) if is_numeric_array(x).is_some() => Some((k, a)),
            _ => None,
        })
        .collect();
    // The column length: that of the sampling variable when there is one (so that a 3-vector such
    // as p_rad is not taken for a column when there happen to be 3 samples), else the longest.
    let axis = ["u", "omega", "b", "w", "x"].iter().find_map(|k| arrays.iter().find(|(name, _)| name.as_str() == *k));
    if let Some((_, first)) = axis.or_else(|| arrays.iter().max_by_key(|(_, a)| a.len())) {
        let n = first.len();
        let vectors = ["p_rad_flux", "p_rad_closed", "momentum"];
        let cols: Vec<_> = arrays.iter().filter(|(k, a)| a.len() == n && (n > 3 || !vectors.contains(&k.as_str()))).collect();
        let mut s = cols.iter().map(|(k, _)| k.as_str()).collect::<Vec<_>>().join(",");
        s.push('\n');
        for i in 0..n {
            s.push_str(&cols.iter().map(|(_, a)| full(&a[i])).collect::<Vec<_>>().join(","));
            s.push('\n');
        }
        return s;
    }
    for x in m.values() {
        if let Value::Array(a) = x {
            if !a.is_empty() && a.iter().all(|e| e.is_object()) {
                let mut cols: Vec<String> = Vec::new();
                for r in a {
                    if let Value::Object(o) = r {
                        for (k, e) in o {
                            if scalar(e).is_some() && !cols.contains(k) {
                                cols.push(k.clone());
                            }
                        }
                    }
                }
                let mut s = cols.join(",");
                s.push('\n');
                for r in a {
                    s.push_str(&cols.iter().map(|c| r.get(c).map(full).unwrap_or_default()).collect::<Vec<_>>().join(","));
                    s.push('\n');
                }
                return s;
            }
        }
    }
    let mut rows = Vec::new();
    flatten("", m, &mut rows);
    let mut s = String::from("name,value\n");
    for (k, x) in rows {
        s.push_str(&format!("{k},{}\n", csv_cell(&Value::from(x))));
    }
    s
}

#[cfg(test)]
mod tests {
    use super::*;
    use serde_json::json;

    #[test]
    fn numbers() {
        assert_eq!(num(0.0), "0");
        assert_eq!(num(1.5), "1.5");
        assert_eq!(num(0.4098), "0.4098");
        assert_eq!(num(1.2e-9), "1.200000000e-9");
    }

    #[test]
    fn tables_show_values_flags_and_sources() {
        let v = json!({"alpha": 0.5, "captured": false, "series": [{"order": 1, "alpha": 0.4}],
            "flags": [{"key": "weak_field", "level": "ok", "value": 0.1, "message": "fine"}],
            "sources": {"alpha": "Darwin 1959"}});
        let t = table("Light", &v, "note");
        assert!(t.contains("alpha     0.5") || t.contains("alpha  0.5"), "{t}");
        assert!(t.contains("series") && t.contains("weak_field") && t.contains("Darwin 1959"));
        assert!(t.trim_end().ends_with("note"));
    }

    #[test]
    fn best_first_and_estimates_table() {
        let v = json!({"best": {"key": "alpha", "value": 0.5, "error_estimate": 1e-13, "error_method": "closed form", "verdict": "ok", "why": "exact"},
            "tolerance": 0.01, "alpha": 0.5, "ppn": {"alpha_1pm": 0.4},
            "series": [{"order": 1, "alpha": 0.4, "error_estimate": 0.2, "error_method": "vs the exact α", "error_reason": null, "verdict": "outside"},
                       {"order": 2, "alpha": 0.45, "error_estimate": 0.1, "error_method": "vs the exact α", "error_reason": null, "verdict": "outside"}],
            "estimates": {"ppn.alpha_1pm": {"error_estimate": 0.2, "error_method": "vs the exact α", "error_reason": null, "verdict": "outside"}}});
        let t = table("Light", &v, "note");
        let first = t.lines().nth(2).unwrap_or_default();
        assert!(first.starts_with("recommended: alpha = 0.5 ± 1.0e-13 relative [ok]"), "{t}");
        assert!(t.contains("error_method (every row): vs the exact α") && !t.contains("error_reason"), "{t}");
        assert!(t.contains("ppn.alpha_1pm") && t.contains("0.4") && t.contains("2.0e-1"), "{t}");
    }

    #[test]
    fn csv_prefers_columns() {
        let v = json!({"u": [0.0, 1.0], "h_plus": [2.0, 3.0], "frame": "cm"});
        assert_eq!(csv(&v), "u,h_plus\n0.0,2.0\n1.0,3.0\n");
        let w = json!({"series": [{"order": 1, "alpha": 0.5}]});
        assert_eq!(csv(&w), "order,alpha\n1,0.5\n");
    }
}
