//! Every regime check carries its human label from the core (the page keeps no list of flag
//! names): over a battery of requests of every kind, each flag has a non-empty label, and a key
//! has one label wherever it appears.

use chiwave_core::request::{evaluate, Request};
use std::collections::BTreeMap;

/// Requests that between them raise every flag of every kind (invented cases).
const REQUESTS: &[&str] = &[
    r#"{"kind": "light", "b": 10, "wavelength": 0.01, "beam_width": 0.5, "ppn_gamma": 0.9}"#,
    r#"{"kind": "light", "b": 5.3, "wavelength": 100, "beam_width": 0.1}"#,
    r#"{"kind": "light", "b": 7.5, "spin": 0.83, "wavelength": 1}"#,
    r#"{"kind": "lens", "mass": "0.3Msun", "lens_distance": "4kpc", "source_distance": "8kpc", "offset": 0.5, "frequency": "100Hz"}"#,
    r#"{"kind": "lens", "mass": "30Msun", "lens_distance": "1Gpc", "source_distance": "2Gpc", "offset": 0.005, "frequency": "30Hz", "lens_redshift": 0.5}"#,
    r#"{"kind": "encounter", "m1": "10Msun", "m2": "20Msun", "v": "1000km/s", "b": "1au"}"#,
    r#"{"kind": "encounter", "m1": 1, "m2": 1, "gamma": 50, "b": 30}"#,
    r#"{"kind": "encounter", "m1": 1, "m2": 3, "v": 0.0005, "b": 1e7}"#,
    r#"{"kind": "encounter", "force": "em", "m1": "1.67e-27kg", "m2": "9.1e-31kg", "q1": "1e", "q2": "-1e", "v": "1000km/s", "b": "1e-9m"}"#,
    r#"{"kind": "waveform", "m1": 1, "m2": 1, "gamma": 4, "b": 3, "theta": 1, "phi": 0.3, "u_min": -5, "u_max": 5, "samples": 3}"#,
    r#"{"kind": "waveform", "force": "em", "m1": 1, "m2": 2, "q1": 0.1, "q2": -0.1, "gamma": 150, "b": 10, "theta": 1, "phi": 0.3, "u_min": -2, "u_max": 2, "samples": 3, "energy_flux": false}"#,
];

#[test]
fn every_flag_has_one_label() {
    let mut seen: BTreeMap<String, String> = BTreeMap::new();
    for text in REQUESTS {
        let req: Request = serde_json::from_str(text).unwrap();
        let v = serde_json::to_value(evaluate(&req).unwrap()).unwrap();
        for f in v["flags"].as_array().unwrap() {
            let (key, label) = (f["key"].as_str().unwrap(), f["label"].as_str().unwrap());
            assert!(!label.trim().is_empty(), "{key}: empty label");
            if let Some(prev) = seen.insert(key.to_string(), label.to_string()) {
                assert_eq!(prev, label, "{key} has two labels");
            }
        }
    }
    // The battery reaches the flags of every family (a sample of keys per kind).
    for key in ["weak_field", "geometric_optics", "thin_lens", "pm_parameter", "eob_estimate", "classical_sommerfeld", "pl_parameter", "b_weak_field", "em_beaming", "units"] {
        assert!(seen.contains_key(key), "battery misses {key}");
    }
}
