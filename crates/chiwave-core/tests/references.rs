//! Every source a result shows comes from the reference registry: each result's `citations`
//! has the same keys as its `sources`, every cited id is in the registry, and each human source
//! string contains the short citation of every reference it cites. Checked on a battery of
//! requests covering every family and variant (metrics, wave optics, both forces), read as
//! JSON exactly as the CLI prints and the page receives them.

use chiwave_core::references;
use chiwave_core::request::{evaluate, Request};
use serde_json::{json, Value};

fn battery() -> Vec<Value> {
    vec![
        json!({"kind": "light", "b": 10}),
        json!({"kind": "light", "b": 7.5, "spin": 0.8}),
        json!({"kind": "light", "b": 12, "charge": 0.5}),
        json!({"kind": "light", "mass": "1 Msun", "b": "6.957e8 m"}),
        json!({"kind": "lens", "mass": "0.3 Msun", "lens_distance": "4 kpc", "source_distance": "8 kpc", "offset": 0.5}),
        json!({"kind": "lens", "mass": "0.3 Msun", "lens_distance": "4 kpc", "source_distance": "8 kpc", "offset": 0.5, "frequency": "100 Hz"}),
        json!({"kind": "encounter", "m1": 1, "m2": 3, "gamma": 1.1, "b": 100}),
        json!({"kind": "encounter", "force": "em", "m1": 1, "m2": 2, "q1": 0.1, "q2": 0.2, "gamma": 1.5, "b": 10}),
        json!({"kind": "waveform", "m1": 1, "m2": 1, "gamma": 2, "b": 10, "theta": 1.1, "phi": 0.4, "u_min": -5, "u_max": 5, "samples": 11}),
        json!({"kind": "waveform", "force": "em", "m1": 1, "m2": 1, "q1": 0.1, "q2": -0.1, "gamma": 1.5, "b": 10, "theta": 1.1, "phi": 0.4, "u_min": -5, "u_max": 5, "samples": 11}),
    ]
}

#[test]
fn every_result_cites_the_registry() {
    for req in battery() {
        let r: Request = serde_json::from_value(req.clone()).unwrap();
        let out = serde_json::to_value(evaluate(&r).unwrap()).unwrap();
        let sources = out["sources"].as_object().unwrap_or_else(|| panic!("{req}: no sources"));
        let citations = out["citations"].as_object().unwrap_or_else(|| panic!("{req}: no citations"));
        let mut ks: Vec<&String> = sources.keys().collect();
        let mut kc: Vec<&String> = citations.keys().collect();
        ks.sort();
        kc.sort();
        assert_eq!(ks, kc, "{req}");
        for (key, list) in citations {
            let text = sources[key].as_str().unwrap();
            assert!(!text.contains("unknown reference id"), "{req} {key}: {text}");
            for c in list.as_array().unwrap() {
                let id = c["id"].as_str().unwrap();
                assert!(c["where"].is_string(), "{req} {key}: {c}");
                let r = references::get(id).unwrap_or_else(|| panic!("{req} {key}: unknown id {id}"));
                assert!(text.contains(&r.short()), "{req} {key}: '{text}' lacks '{}'", r.short());
            }
            // A source either cites a reference or points to the project's own derivation.
            assert!(!list.as_array().unwrap().is_empty() || text.contains("docs/physics/"), "{req} {key}: {text}");
        }
    }
}

/// Every registry entry is used: cited by some result, or named in the repository's docs and
/// code comments by its short author-year form (checked in `tests/no_outside_documents.rs`
/// for the comments). Here: the registry's own listing has one entry per id and its BibTeX
/// keys are the ids.
#[test]
fn bibtex_listing_has_every_entry_once() {
    let all = references::bibtex_all();
    for r in references::all() {
        assert_eq!(all.matches(&format!("{{{},\n", r.id)).count(), 1, "{}", r.id);
    }
    assert_eq!(all.matches('@').count(), references::all().len());
}
