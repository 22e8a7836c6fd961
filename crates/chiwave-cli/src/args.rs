//! Command-line parsing: `chiwave COMMAND [--option VALUE]... [--json | --csv] [--svg FILE]`.
//!
//! Options map one-to-one onto the fields of the core's request types: `--ppn-gamma 1.2`
//! becomes the field `ppn_gamma`. Values that read as plain numbers are sent as numbers,
//! everything else (e.g. `1Msun`, `6.957e8m`, `rest2`) as text, so the core's own unit parsing
//! and validation apply exactly as they do for the page.

use serde_json::{Map, Value};

/// How results are printed.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Format {
    Table,
    Json,
    Csv,
}

/// A parsed command line.
#[derive(Debug, Clone, PartialEq)]
pub struct Parsed {
    pub command: String,
    pub fields: Map<String, Value>,
    /// Option spelling for each field, to name it in error messages.
    pub spelled: Vec<(String, String)>,
    pub format: Format,
    pub svg: Option<String>,
    /// Which figure `--svg` draws (default: the first figure of the command).
    pub figure: Option<String>,
    /// Angle unit of the figure's axis (`--plot-angle-unit`).
    pub plot_angle_unit: Option<String>,
    /// Sky-map projection of the figure (`--projection cylindrical|equal_area`).
    pub projection: Option<String>,
    /// Positional arguments after the command (e.g. a scenario file).
    pub positional: Vec<String>,
}

/// Converts one option value to JSON: integers and floats become numbers, `true`/`false`
/// booleans, anything else text.
fn value_of(text: &str) -> Value {
    if let Ok(i) = text.parse::<i64>() {
        return Value::from(i);
    }
    if let Ok(x) = text.parse::<f64>() {
        if x.is_finite() {
            return Value::from(x);
        }
        // NaN and ±inf are not JSON numbers: send them as text so the core names the field.
        return Value::from(text);
    }
    match text {
        "true" => Value::Bool(true),
        "false" => Value::Bool(false),
        _ => Value::from(text),
    }
}

/// Parses `args` (without the program name).
///
/// # Errors
/// A one-line message for a missing value, a repeated option or a stray argument.
pub fn parse(args: &[String]) -> Result<Parsed, String> {
    let mut it = args.iter().peekable();
    let command = match it.next() {
        Some(c) => c.clone(),
        None => "help".to_string(),
    };
    let mut p = Parsed {
        command,
        fields: Map::new(),
        spelled: Vec::new(),
        format: Format::Table,
        svg: None,
        figure: None,
        plot_angle_unit: None,
        projection: None,
        positional: Vec::new(),
    };
    while let Some(a) = it.next() {
        match a.as_str() {
            "--json" => p.format = Format::Json,
            "--csv" => p.format = Format::Csv,
            "--table" => p.format = Format::Table,
            "--help" | "-h" => {
                p.positional.insert(0, p.command.clone());
                p.command = "help".into();
            }
            "--svg" => match it.next() {
                Some(f) => p.svg = Some(f.clone()),
                None => return Err("--svg: missing file name".into()),
            },
            "--figure" => match it.next() {
                Some(f) => p.figure = Some(f.clone()),
                None => return Err("--figure: missing figure name".into()),
            },
            "--plot-angle-unit" => match it.next() {
                Some(f) => p.plot_angle_unit = Some(f.clone()),
                None => return Err("--plot-angle-unit: missing unit (rad, deg, arcsec, mas, uas)".into()),
            },
            "--projection" => match it.next() {
                Some(f) => p.projection = Some(f.clone()),
                None => return Err("--projection: missing projection (cylindrical, equal_area)".into()),
            },
            opt if opt.starts_with("--") => {
                let (name, inline) = match opt.split_once('=') {
                    Some((n, v)) => (n.to_string(), Some(v.to_string())),
                    None => (opt.to_string(), None),
                };
                let value = match inline {
                    Some(v) => v,
                    None => match it.next() {
                        Some(v) => v.clone(),
                        None => return Err(format!("{name}: missing value")),
                    },
                };
                let field = name.trim_start_matches("--").replace('-', "_");
                if p.fields.contains_key(&field) {
                    return Err(format!("{name}: given twice"));
                }
                p.fields.insert(field.clone(), value_of(&value));
                p.spelled.push((field, name));
            }
            other => p.positional.push(other.to_string()),
        }
    }
    Ok(p)
}

impl Parsed {
    /// The option spelling (`--ppn-gamma`) for a request field (`ppn_gamma`).
    pub fn option_for(&self, field: &str) -> String {
        self.spelled
            .iter()
            .find(|(f, _)| f == field)
            .map(|(_, s)| s.clone())
            .unwrap_or_else(|| format!("--{}", field.replace('_', "-")))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn v(xs: &[&str]) -> Vec<String> {
        xs.iter().map(|s| s.to_string()).collect()
    }

    #[test]
    fn options_become_fields() {
        let p = parse(&v(&["light", "--b", "10", "--ppn-gamma", "1.5", "--mass", "1Msun", "--json"])).unwrap();
        assert_eq!(p.command, "light");
        assert_eq!(p.format, Format::Json);
        assert_eq!(p.fields["b"], Value::from(10));
        assert_eq!(p.fields["ppn_gamma"], Value::from(1.5));
        assert_eq!(p.fields["mass"], Value::from("1Msun"));
        assert_eq!(p.option_for("ppn_gamma"), "--ppn-gamma");
    }

    #[test]
    fn non_finite_numbers_stay_text() {
        let p = parse(&v(&["light", "--b", "nan", "--spin=inf"])).unwrap();
        assert_eq!(p.fields["b"], Value::from("nan"));
        assert_eq!(p.fields["spin"], Value::from("inf"));
    }

    #[test]
    fn errors_are_one_line() {
        assert_eq!(parse(&v(&["light", "--b"])).unwrap_err(), "--b: missing value");
        assert!(parse(&v(&["light", "--b", "1", "--b", "2"])).unwrap_err().contains("twice"));
    }
}
