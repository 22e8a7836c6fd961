//! No file in the repository and no output of the CLI refers to a document a reader cannot look
//! up: every source is a publication (in the reference registry, `chiwave sources`), an mpmath
//! script in `tests/reference/`, or a note in `docs/physics/`. This test scans every tracked text
//! file (`git ls-files`) and the output of every command and built-in scenario (table, JSON, CSV)
//! for references to internal notes: a named or numbered "sheet", a numbered "pitfall", a
//! "brief" as a citation. The page's visible text and tooltips are scanned by
//! `tests/e2e/sources.test.mjs`.
//!
//! The patterns are assembled from pieces so that this file does not match itself.

use std::path::{Path, PathBuf};
use std::process::Command;

fn repo() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("../..")
}

/// The offending phrase at the first match in `text`, or None. Case-insensitive.
fn forbidden(text: &str) -> Option<String> {
    let low = text.to_lowercase();
    let sheet = ["sh", "eet"].concat();
    let pit = ["pit", "fall"].concat();
    let brief = ["bri", "ef"].concat();
    let snippet = |at: usize| {
        let start = low[..at].char_indices().rev().nth(30).map_or(0, |(i, _)| i);
        let end = low[at..].char_indices().nth(40).map_or(low.len(), |(i, _)| at + i);
        low[start..end].replace('\n', " ")
    };
    for (at, _) in low.match_indices(&sheet) {
        let before = &low[..at];
        let after = &low[at + sheet.len()..];
        let named = ["deflection ", "encounter ", "waveform ", "reference ", "the "].iter().any(|w| before.ends_with(w));
        // followed by a section sign or a number (optionally after "s" and a space), or possessive
        let rest = after.strip_prefix('\'').or_else(|| after.strip_prefix('’')).unwrap_or(after);
        let rest = rest.strip_prefix('s').unwrap_or(rest);
        let rest = rest.strip_prefix(' ').unwrap_or(rest);
        let numbered = rest.starts_with('§') || rest.starts_with(|c: char| c.is_ascii_digit());
        let possessive = after.starts_with("'s") || after.starts_with("’s");
        if named || numbered || possessive {
            return Some(snippet(at));
        }
    }
    for (at, _) in low.match_indices(&pit) {
        let after = &low[at + pit.len()..];
        let rest = after.strip_prefix(' ').unwrap_or(after);
        if rest.starts_with(|c: char| c.is_ascii_digit()) || rest.starts_with('§') || low[..at].ends_with('(') {
            return Some(snippet(at));
        }
    }
    for (at, _) in low.match_indices(&brief) {
        let after = &low[at + brief.len()..];
        if after.starts_with(':') || after.starts_with('/') || low[..at].ends_with('(') {
            return Some(snippet(at));
        }
    }
    None
}

#[test]
fn the_matcher_catches_what_it_should_and_only_that() {
    let s = ["sh", "eet"].concat();
    let p = ["pit", "fall"].concat();
    let b = ["bri", "ef"].concat();
    for bad in [
        format!("see the deflection {s} §1"),
        format!("(encounter {s} §2.1, checked)"),
        format!("from the {s}"),
        format!("{s} §4 worked example"),
        format!("{s} 3 of the notes"),
        format!("the {s}'s table"),
        format!("({p} 8)"),
        format!("{p}8"),
        format!("({p} §8)"),
        format!("({b})"),
        format!("{b}: 1e-12"),
        format!("Waveform {}", s.to_uppercase()),
    ] {
        assert!(forbidden(&bad).is_some(), "not caught: {bad}");
    }
    for fine in ["stylesheet", "a style sheet of CSS", "briefly, the series", "a brief note", "pitfalls of f64 in general"] {
        assert!(forbidden(fine).is_none(), "false alarm: {fine}");
    }
}

#[test]
fn no_tracked_file_cites_an_outside_document() {
    let out = Command::new("git")
        .args(["ls-files", "-z"])
        .current_dir(repo())
        .output()
        .expect("git ls-files (the test needs git and a checkout)");
    assert!(out.status.success(), "git ls-files failed: {}", String::from_utf8_lossy(&out.stderr));
    let files: Vec<String> = out.stdout.split(|&b| b == 0).filter(|p| !p.is_empty()).map(|p| String::from_utf8_lossy(p).into_owned()).collect();
    assert!(files.len() > 100, "only {} tracked files", files.len());
    let mut bad = Vec::new();
    let mut scanned = 0;
    for f in &files {
        let Ok(bytes) = std::fs::read(repo().join(f)) else { continue }; // deleted in the work tree
        if bytes.contains(&0) {
            continue; // binary
        }
        scanned += 1;
        let text = String::from_utf8_lossy(&bytes);
        for (n, line) in text.lines().enumerate() {
            if let Some(m) = forbidden(line) {
                bad.push(format!("{f}:{}: …{m}…", n + 1));
            }
        }
    }
    assert!(scanned > 100, "scanned {scanned} files");
    assert!(bad.is_empty(), "{} lines cite a document outside the repository:\n{}", bad.len(), bad.join("\n"));
}

fn run(args: &[&str]) -> String {
    let out = Command::new(env!("CARGO_BIN_EXE_chiwave")).args(args).output().expect("run chiwave");
    format!("{}{}", String::from_utf8_lossy(&out.stdout), String::from_utf8_lossy(&out.stderr))
}

#[test]
fn no_cli_output_cites_an_outside_document() {
    let mut cases: Vec<Vec<String>> = Vec::new();
    let base: &[&[&str]] = &[
        &["light", "--b", "10"],
        &["light", "--b", "7.5", "--spin", "0.83"],
        &["light", "--b", "12", "--charge", "0.6"],
        &["light", "--b", "5"],
        &["light", "--mass", "1Msun", "--b", "6.957e8m", "--wavelength", "1e-6m"],
        &["lens", "--mass", "0.3Msun", "--lens-distance", "4kpc", "--source-distance", "8kpc", "--offset", "0.5", "--frequency", "100Hz"],
        &["lens", "--mass", "0.3Msun", "--lens-distance", "4kpc", "--source-distance", "8kpc", "--offset", "0.5"],
        &["encounter", "--m1", "1", "--m2", "3", "--gamma", "1.1", "--b", "100"],
        &["encounter", "--m1", "1", "--m2", "1", "--gamma", "1.09", "--b", "10"],
        &["encounter", "--m1", "10Msun", "--m2", "20Msun", "--v", "1000km/s", "--b", "1au"],
        &["encounter", "--force", "em", "--m1", "1", "--m2", "2", "--q1", "0.1", "--q2", "0.2", "--gamma", "1.5", "--b", "10"],
        &["waveform", "--m1", "1", "--m2", "1", "--gamma", "2", "--b", "10", "--theta", "1.1", "--phi", "0.4", "--u-min", "-5", "--u-max", "5", "--samples", "11"],
        &["waveform", "--m1", "10Msun", "--m2", "10Msun", "--v", "300km/s", "--b", "1au", "--distance", "1Mpc", "--theta", "1.1", "--phi", "0.4", "--samples", "11"],
        &["waveform", "--force", "em", "--m1", "1", "--m2", "1", "--q1", "0.1", "--q2", "-0.1", "--gamma", "1.5", "--b", "10", "--theta", "1.1", "--phi", "0.4", "--samples", "11"],
    ];
    for b in base {
        for fmt in ["", "--json", "--csv"] {
            let mut c: Vec<String> = b.iter().map(|s| s.to_string()).collect();
            if !fmt.is_empty() {
                c.push(fmt.into());
            }
            cases.push(c);
        }
    }
    // Every built-in scenario, in every format.
    let list = run(&["scenarios"]);
    let names: Vec<String> = list.lines().filter_map(|l| l.split_whitespace().next()).map(String::from).collect();
    assert!(names.len() >= 8, "{list}");
    for n in &names {
        for fmt in ["", "--json", "--csv"] {
            let mut c = vec!["scenario".to_string(), n.clone()];
            if !fmt.is_empty() {
                c.push(fmt.into());
            }
            cases.push(c);
        }
    }
    for extra in [
        vec!["help"], vec!["scenarios"], vec!["sources"], vec!["sources", "--bibtex"], vec!["sources", "--json"],
        vec!["help", "light"], vec!["help", "lens"], vec!["help", "encounter"], vec!["help", "waveform"], vec!["help", "sources"],
        // Errors name fields and ranges: scan a few messages too.
        vec!["light", "--b", "-1"], vec!["encounter", "--m1", "1", "--m2", "1", "--gamma", "0.5", "--b", "10"],
    ] {
        cases.push(extra.into_iter().map(String::from).collect());
    }
    let mut bad = Vec::new();
    for c in &cases {
        let args: Vec<&str> = c.iter().map(String::as_str).collect();
        let text = run(&args);
        assert!(!text.is_empty(), "{c:?}: no output");
        if let Some(m) = forbidden(&text) {
            bad.push(format!("chiwave {}: …{m}…", c.join(" ")));
        }
    }
    assert!(bad.is_empty(), "CLI output cites a document outside the repository:\n{}", bad.join("\n"));
}
