//! Embeds the invented demo scenarios of `scenarios/*.json` into the binary, so that
//! `chiwave scenario NAME` works from anywhere.
use std::{env, fs, path::Path};

fn main() {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("../../scenarios");
    println!("cargo:rerun-if-changed={}", dir.display());
    let mut names: Vec<_> = fs::read_dir(&dir)
        .map(|rd| {
            rd.filter_map(|e| e.ok())
                .map(|e| e.path())
                .filter(|p| p.extension().is_some_and(|x| x == "json"))
                .collect()
        })
        .unwrap_or_default();
    names.sort();
    let mut out = String::from("/// (file stem, JSON text) of every built-in scenario.\npub const SCENARIOS: &[(&str, &str)] = &[\n");
    for p in &names {
        println!("cargo:rerun-if-changed={}", p.display());
        let stem = p.file_stem().and_then(|s| s.to_str()).unwrap_or("scenario");
        let abs = fs::canonicalize(p).unwrap_or_else(|_| p.clone());
        out.push_str(&format!("    ({stem:?}, include_str!({:?})),\n", abs.display().to_string()));
    }
    out.push_str("];\n");
    let dest = Path::new(&env::var("OUT_DIR").unwrap_or_else(|_| ".".into())).join("scenarios.rs");
    fs::write(dest, out).unwrap_or_else(|e| panic!("cannot write scenarios.rs: {e}"));
}
