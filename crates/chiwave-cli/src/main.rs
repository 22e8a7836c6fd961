//! `chiwave`: the command line face of chiwave-core.
//!
//! Every command builds one of the core's request types from its options (see [`args`]),
//! evaluates it, and prints a table (default), JSON (`--json`) or CSV (`--csv`). Bad input
//! exits with status 2 and one line on stderr naming the option and the allowed range.

mod args;
mod sources;
mod table;

use args::{Format, Parsed};
use chiwave_core::request::{evaluate, Request, Scenario};
use chiwave_core::validity::ESTIMATE_NOTICE;
use chiwave_plot::scene;
use serde_json::{Map, Value};
use std::process::ExitCode;

include!(concat!(env!("OUT_DIR"), "/scenarios.rs"));

const HELP: &str = "chiwave — gravitational and electromagnetic scattering, on the command line

usage: chiwave COMMAND [--option VALUE]... [--json | --csv] [--svg FILE [--figure NAME] [--projection P]]

commands
  light       deflection of light by a mass (exact, PM series, strong field, spin, charge, PPN)
  lens        point-mass lens: Einstein radius, images, magnifications, delay, wave optics
  encounter   two-body scattering angle, impulse, radiated energy and angular momentum
  waveform    leading-order gravitational or electromagnetic waveform at a detector
  scenario    evaluate a scenario: chiwave scenario NAME|FILE.json
  scenarios   list the built-in demo scenarios
  sources     every reference the tool uses (--bibtex: all BibTeX entries, --json: the registry)
  help        this text, or `chiwave help COMMAND`

Quantities take a unit suffix (1Msun, 6.957e8m, 4kpc, 1000km/s, 100Hz); a bare number is
geometric (G = c = 1, lengths in units of the mass). Every command takes --tolerance T (relative
error, 1e-12 … 0.5, default 0.01): each value's estimated error is judged ok below T, caution
below 10 T, outside beyond; the recommended value is printed first. Full option lists: README.md.";

fn command_help(cmd: &str) -> Option<&'static str> {
    Some(match cmd {
        "light" => "chiwave light --b B [--mass M] [--spin A] [--charge Q] [--ppn-gamma G] [--orders N]
             [--wavelength L] [--beam-width W] [--elongation-deg E] [--json|--csv] [--svg FILE]
  b in units of M (bare) or with a length unit (needs --mass with a unit); spin a/M signed (+ prograde);
  charge Q/M; ppn-gamma scales the first series term; orders of the weak-field series (default 8).",
        "lens" => "chiwave lens --mass M --lens-distance DL --source-distance DS --offset BETA
             [--frequency F] [--lens-redshift Z] [--json|--csv]
  offset = source position in units of the Einstein radius; with a frequency, the wave-optics
  amplification F(w, y).",
        "encounter" => "chiwave encounter --m1 M1 --m2 M2 (--gamma G | --v V) (--b B | --j J) [--force gravity|em]
             [--nu NU] [--q1 Q1 --q2 Q2] [--json|--csv]
  geometric mode: masses and b bare (b in GM/c², M = m1 + m2); physical: 10Msun, 1000km/s, 1au.",
        "waveform" => "chiwave waveform --m1 M1 --m2 M2 (--gamma G | --v V) --b B --theta TH --phi PH
             [--frame rest2|cm] [--u-min U0 --u-max U1 [--u-unit gm|b_over_v|s] --samples N] [--distance D]
             [--force em --q1 Q1 --q2 Q2] [--json|--csv]
             [--svg FILE --figure strain|sky|sky_memory|spectrum|slow_motion [--projection cylindrical|equal_area]]",
        "scenario" => "chiwave scenario NAME|FILE.json [--json|--csv]   (see `chiwave scenarios`)",
        "sources" => sources::HELP,
        _ => return None,
    })
}

/// An error that ends the program: a one-line message and an exit status.
struct Failure {
    message: String,
    status: u8,
}

fn input_failure(message: String) -> Failure {
    Failure { message, status: 2 }
}

/// Rewrites a request-field name in a core message into the option spelling.
fn with_option(p: &Parsed, field: &str, message: &str) -> String {
    if field == "computation" {
        return message.to_string();
    }
    let opt = p.option_for(field);
    match message.strip_prefix(&format!("{field}:")) {
        Some(rest) => format!("{opt}:{rest}"),
        None => format!("{opt}: {message}"),
    }
}

fn request_from(p: &Parsed) -> Result<Request, Failure> {
    let mut obj: Map<String, Value> = p.fields.clone();
    obj.insert("kind".into(), Value::from(p.command.as_str()));
    let de = Value::Object(obj);
    serde_path_to_error::deserialize::<_, Request>(de).map_err(|e| {
        let path = e.path().to_string();
        let inner = e.into_inner().to_string();
        if path == "." || path.is_empty() {
            // Unknown or missing fields: name them as options.
            if let Some(rest) = inner.strip_prefix("unknown field `") {
                let name = rest.split('`').next().unwrap_or("");
                return input_failure(format!("--{}: unknown option for `{}`; see `chiwave help {}`", name.replace('_', "-"), p.command, p.command));
            }
            if let Some(rest) = inner.strip_prefix("missing field `") {
                let name = rest.split('`').next().unwrap_or("");
                return input_failure(format!("--{}: required for `{}`", name.replace('_', "-"), p.command));
            }
            // A type error inside the tagged request loses its path: find the option by its value.
            let quoted = inner.split('"').nth(1).unwrap_or("");
            match p.fields.iter().find(|(_, v)| v.as_str() == Some(quoted)) {
                Some((f, _)) if !quoted.is_empty() => return type_failure(p, f, &inner),
                _ => return input_failure(format!("{}: {inner}", p.command)),
            }
        }
        let field = path.split('.').next().unwrap_or(&path).to_string();
        type_failure(p, &field, &inner)
    })
}

/// The one-line message for a value of the wrong type given to the option of `field`.
fn type_failure(p: &Parsed, field: &str, inner: &str) -> Failure {
    {
        let field = field.to_string();
        let given = p.fields.get(&field).map(|v| v.to_string()).unwrap_or_default();
        let lower = given.trim_matches('"').to_ascii_lowercase();
        if ["nan", "inf", "-inf", "+inf", "infinity", "-infinity"].contains(&lower.as_str()) {
            return input_failure(format!("{}: got {}, which is not a finite number", p.option_for(&field), given.trim_matches('"')));
        }
        let expected = if inner.contains("expected f64") || inner.contains("expected usize") { "; expected a number".to_string() } else { format!(": {inner}") };
        input_failure(format!("{}: cannot use {given}{expected}", p.option_for(&field)))
    }
}

fn title_of(req: &Request) -> &'static str {
    match req {
        Request::Light(_) => "chiwave light — deflection of a massless wave",
        Request::Lens(_) => "chiwave lens — point-mass lens",
        Request::Encounter(_) => "chiwave encounter — two-body scattering",
        Request::Waveform(_) => "chiwave waveform — leading-order radiation at a detector",
        #[allow(unreachable_patterns)]
        _ => "chiwave",
    }
}

/// Writes the figure of `req` chosen by `--figure` (default: the kind's first) to `path` as SVG.
fn write_svg(p: &Parsed, req: &Request, path: &str) -> Result<(), Failure> {
    let kind = match req {
        Request::Light(_) => "light",
        Request::Lens(_) => "lens",
        Request::Encounter(_) => "encounter",
        #[allow(unreachable_patterns)]
        _ => "waveform",
    };
    let name = match &p.figure {
        Some(n) => n.clone(),
        None => scene::names(kind)
            .first()
            .map(|s| s.to_string())
            .ok_or_else(|| input_failure(format!("--svg: no figure for `{kind}` yet")))?,
    };
    let opts = scene::Options {
        angle_unit: p.plot_angle_unit.clone(),
        projection: p.projection.clone(),
        ..Default::default()
    };
    let fig = scene::figure(req, &name, &opts).map_err(|e| input_failure(with_option(p, e.field(), &e.to_string())))?;
    let (svg, _) = chiwave_plot::render(&fig).map_err(|e| Failure { message: format!("--svg: {e}"), status: 1 })?;
    std::fs::write(path, svg).map_err(|e| Failure { message: format!("--svg: cannot write {path}: {e}"), status: 1 })?;
    eprintln!("chiwave: wrote figure '{name}' to {path}");
    Ok(())
}

fn run_request(p: &Parsed, req: &Request) -> Result<String, Failure> {
    if let Some(path) = &p.svg {
        write_svg(p, req, path)?;
    }
    let resp = evaluate(req).map_err(|e| input_failure(with_option(p, e.field(), &e.to_string())))?;
    let v = serde_json::to_value(&resp).map_err(|e| Failure { message: format!("internal: {e}"), status: 1 })?;
    Ok(match p.format {
        Format::Json => serde_json::to_string_pretty(&v).unwrap_or_default() + "\n",
        Format::Csv => table::csv(&v),
        Format::Table => table::table(title_of(req), &v, ESTIMATE_NOTICE),
    })
}

fn load_scenario(name: &str) -> Result<Scenario, Failure> {
    let text = match SCENARIOS.iter().find(|(stem, _)| *stem == name) {
        Some((_, t)) => t.to_string(),
        None => std::fs::read_to_string(name).map_err(|e| {
            input_failure(format!("scenario: '{name}' is neither a built-in scenario (see `chiwave scenarios`) nor a readable file: {e}"))
        })?,
    };
    serde_json::from_str(&text).map_err(|e| input_failure(format!("scenario: '{name}' is not a valid scenario: {e}")))
}

fn run(argv: &[String]) -> Result<String, Failure> {
    if argv.first().map(String::as_str) == Some("sources") {
        return sources::run(&argv[1..]).map_err(input_failure);
    }
    let p = args::parse(argv).map_err(input_failure)?;
    match p.command.as_str() {
        "help" | "--help" | "-h" => Ok(match p.positional.first().and_then(|c| command_help(c)) {
            Some(h) => format!("{h}\n"),
            None => format!("{HELP}\n"),
        }),
        "--version" | "version" => Ok(format!("chiwave {}\n", env!("CARGO_PKG_VERSION"))),
        "scenarios" => Ok(SCENARIOS
            .iter()
            .map(|(stem, text)| {
                let d = serde_json::from_str::<Scenario>(text).map(|s| s.description).unwrap_or_else(|e| format!("(invalid: {e})"));
                format!("{stem:<28} {d}\n")
            })
            .collect()),
        "scenario" => {
            let name = p.positional.first().ok_or_else(|| input_failure("scenario: give a NAME or FILE.json (see `chiwave scenarios`)".into()))?;
            let s = load_scenario(name)?;
            run_request(&p, &s.request)
        }
        "light" | "lens" | "encounter" | "waveform" => {
            if !p.positional.is_empty() {
                return Err(input_failure(format!("{}: unexpected argument '{}'", p.command, p.positional[0])));
            }
            let req = request_from(&p)?;
            run_request(&p, &req)
        }
        other => Err(input_failure(format!("unknown command '{other}'; see `chiwave help`"))),
    }
}

fn main() -> ExitCode {
    let argv: Vec<String> = std::env::args().skip(1).collect();
    match run(&argv) {
        Ok(out) => {
            print!("{out}");
            ExitCode::SUCCESS
        }
        Err(f) => {
            eprintln!("chiwave: {}", f.message.replace('\n', " "));
            ExitCode::from(f.status)
        }
    }
}
