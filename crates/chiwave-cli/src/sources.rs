//! `chiwave sources [--bibtex | --json]`: every publication the tool uses, from the core's
//! reference registry (`chiwave_core::references`). Self-contained: it takes the arguments after
//! the command and returns the text to print, or a one-line error.

use chiwave_core::references;

/// Usage line, also shown by `chiwave help sources`.
pub const HELP: &str = "chiwave sources [--bibtex | --json]
  every reference the tool uses: id, short citation, full reference and what it is used for;
  --bibtex prints all BibTeX entries, --json the registry (with each entry's BibTeX).";

/// The listing for `args` (the arguments after `sources`).
///
/// # Errors
/// A one-line message for an unknown argument or two formats at once.
pub fn run(args: &[String]) -> Result<String, String> {
    let mut format = None;
    for a in args {
        let f = match a.as_str() {
            "--bibtex" => "bibtex",
            "--json" => "json",
            "--table" => "table",
            other => return Err(format!("sources: unknown argument '{other}' (allowed: --bibtex, --json)")),
        };
        if format.is_some_and(|g| g != f) {
            return Err("sources: give one of --bibtex and --json".into());
        }
        format = Some(f);
    }
    Ok(match format.unwrap_or("table") {
        "bibtex" => references::bibtex_all(),
        "json" => serde_json::to_string_pretty(&references::listing()).map_err(|e| format!("internal: {e}"))? + "\n",
        _ => table(),
    })
}

/// One block per reference: `[id] short citation`, the full reference, what it is used for.
fn table() -> String {
    let all = references::all();
    let mut out = format!(
        "chiwave uses {} references (BibTeX: chiwave sources --bibtex; JSON: chiwave sources --json)\n",
        all.len()
    );
    for r in all {
        out.push_str(&format!("\n[{}] {}\n    {}\n    used for: {}\n", r.id, r.short(), r.full(), r.used_for));
    }
    out
}
