//! The CLI's stable contract: the JSON keys other tools script against, and one-line errors
//! with exit status 2 that name the option. Expected numbers name their source.

use serde_json::Value;
use std::process::Command;

fn run(args: &[&str]) -> (i32, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_chiwave")).args(args).output().expect("run chiwave");
    (out.status.code().unwrap_or(-1), String::from_utf8_lossy(&out.stdout).into(), String::from_utf8_lossy(&out.stderr).into())
}

fn json(args: &[&str]) -> Value {
    let (code, out, err) = run(args);
    assert_eq!(code, 0, "{args:?}: {err}");
    serde_json::from_str(&out).expect("JSON output")
}

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}

#[test]
fn light_keys_and_values() {
    let v = json(&["light", "--b", "10", "--json"]);
    for k in ["alpha", "captured", "critical_b", "closest_approach", "series"] {
        assert!(v.get(k).is_some(), "missing {k}");
    }
    // b_c = 3√3 M (Darwin 1959).
    assert!(rel(v["critical_b"].as_f64().unwrap(), 27f64.sqrt()) < 1e-15);
    assert_eq!(v["series"].as_array().unwrap().len(), 8);
    // First-order term 4M/b = 0.4 (Einstein 1915; common practice).
    assert!(rel(v["series"][0]["alpha"].as_f64().unwrap(), 0.4) < 1e-15);
    assert_eq!(v["series"][1]["order"], 2);
    // Captured ray: a result, not an error.
    let c = json(&["light", "--b", "5", "--json"]);
    assert_eq!(c["captured"], true);
    assert!(c["alpha"].is_null() && c["closest_approach"].is_null());
    // Solar limb, 4GM☉/(c²R☉) = 1.75119032555998 arcsec (IAU 2015 nominal; mpmath 1.3, tests/reference/deflection_mpmath.py).
    let s = json(&["light", "--mass", "1Msun", "--b", "6.957e8m", "--orders", "1", "--json"]);
    let first_arcsec = s["series"][0]["alpha"].as_f64().unwrap() * 648000.0 / std::f64::consts::PI;
    assert!(rel(first_arcsec, 1.751_190_325_559_98) < 1e-12, "{first_arcsec}");
    assert!(s["alpha_arcsec"].is_f64());
}

#[test]
fn lens_keys_and_worked_example() {
    let v = json(&["lens", "--mass", "0.3Msun", "--lens-distance", "4kpc", "--source-distance", "8kpc", "--offset", "0.5", "--frequency", "100Hz", "--json"]);
    for k in ["einstein_radius_rad", "images", "total_magnification", "time_delay_s", "w", "amplification"] {
        assert!(v.get(k).is_some(), "missing {k}");
    }
    // θ_E = 2.67920207569003e-9 rad; μ_tot(0.5) = 2.182820625327 (mpmath 1.3, tests/reference/lensing_mpmath.py, worked example).
    assert!(rel(v["einstein_radius_rad"].as_f64().unwrap(), 2.679_202_075_690_03e-9) < 1e-12);
    assert!(rel(v["total_magnification"].as_f64().unwrap(), 2.182_820_625_327) < 1e-11);
    assert!(v["amplification"]["re"].is_f64() && v["amplification"]["im"].is_f64());
    assert_eq!(v["images"].as_array().unwrap().len(), 2);
}

#[test]
fn encounter_keys() {
    let v = json(&["encounter", "--m1", "1", "--m2", "3", "--gamma", "1.1", "--b", "100", "--json"]);
    for k in ["gamma", "nu", "j", "b_over_gm", "chi", "chi_newtonian", "chi_test_body", "chi_estimate", "captured", "e_rad", "j_rad", "impulse"] {
        assert!(v.get(k).is_some(), "missing {k}");
    }
    for k in ["1pm", "2pm", "3pm_conservative", "3pm"] {
        assert!(v["chi"][k].is_f64(), "chi.{k}");
    }
    for f in ["cm", "rest2"] {
        for c in ["transverse", "longitudinal", "energy"] {
            assert!(v["impulse"][f][c].is_f64(), "impulse.{f}.{c}");
        }
    }
    // ν = 1·3/4² (arithmetic); 1PM: χ = 2(2γ²−1)/(p∞ j) (Damour 2016, arXiv:1609.00354).
    assert!(rel(v["nu"].as_f64().unwrap(), 3.0 / 16.0) < 1e-15);
    let (g, j) = (1.1f64, v["j"].as_f64().unwrap());
    assert!(rel(v["chi"]["1pm"].as_f64().unwrap(), 2.0 * (2.0 * g * g - 1.0) / ((g * g - 1.0).sqrt() * j)) < 1e-14);
    // Attraction: transverse impulse of body 1 along b̂ is negative (sign convention: docs/physics/encounter.md §1).
    assert!(v["impulse"]["cm"]["transverse"].as_f64().unwrap() < 0.0);
    let e = json(&["encounter", "--force", "em", "--m1", "1", "--m2", "2", "--q1", "0.1", "--q2", "0.2", "--gamma", "1.5", "--b", "10", "--json"]);
    for k in ["1pl", "2pl", "3pl"] {
        // Like charges repel: negative angles (sign convention: docs/physics/encounter.md §6).
        assert!(e["chi"][k].as_f64().unwrap() < 0.0, "chi.{k}");
    }
    assert!(e["chi_test_exact"].is_f64() && e["e_rad"].is_f64() && e["impulse"]["cm"]["transverse"].is_f64());
}

#[test]
fn waveform_keys() {
    let v = json(&["waveform", "--m1", "1", "--m2", "1", "--gamma", "2", "--b", "1", "--theta", "1.1", "--phi", "0.4", "--frame", "rest2", "--u-min", "-5", "--u-max", "5", "--samples", "101", "--json"]);
    for k in ["u", "h_plus", "h_cross", "memory", "e_rad_flux", "e_rad_closed"] {
        assert!(v.get(k).is_some(), "missing {k}");
    }
    let u = v["u"].as_array().unwrap();
    assert_eq!(u.len(), 101);
    assert_eq!(u[0].as_f64(), Some(-5.0));
    assert_eq!(u[100].as_f64(), Some(5.0));
    // Energy balance: flux integral vs Herrmann et al. 2021 closed form (arXiv:2101.07255).
    assert!(rel(v["e_rad_flux"].as_f64().unwrap(), v["e_rad_closed"].as_f64().unwrap()) < 1e-8);
    assert!(v["memory"]["plus"].is_f64() && v["memory"]["cross"].is_f64());
    let (code, out, _) = run(&["waveform", "--m1", "1", "--m2", "1", "--gamma", "2", "--b", "10", "--theta", "1", "--phi", "0", "--samples", "4", "--u-min", "-1", "--u-max", "1", "--csv"]);
    assert_eq!(code, 0);
    assert_eq!(out.lines().next(), Some("u,h_plus,h_cross"));
    assert_eq!(out.lines().count(), 5);
}

#[test]
fn bad_input_is_one_line_naming_the_option() {
    for (args, needle) in [
        (vec!["light", "--b", "-1"], "--b:"),
        (vec!["light", "--b", "nan"], "--b:"),
        (vec!["light", "--b", "10", "--spin", "1.2"], "--spin:"),
        (vec!["light", "--b", "10", "--charge", "inf"], "--charge:"),
        (vec!["light", "--b", "10parsecs"], "--b:"),
        (vec!["light", "--b", "10", "--colour", "red"], "--colour:"),
        (vec!["lens", "--mass", "1Msun", "--lens-distance", "8kpc", "--source-distance", "4kpc", "--offset", "0.5"], "--lens-distance:"),
        (vec!["encounter", "--m1", "1", "--m2", "1", "--gamma", "0.5", "--b", "10"], "--gamma:"),
        (vec!["light"], "--b:"),
    ] {
        let (code, out, err) = run(&args);
        assert_eq!(code, 2, "{args:?}");
        assert!(out.is_empty(), "{args:?}");
        assert_eq!(err.trim_end().lines().count(), 1, "{args:?}: {err}");
        assert!(err.contains(needle), "{args:?}: {err}");
    }
}

#[test]
fn scenarios_and_svg() {
    let (code, out, _) = run(&["scenarios"]);
    assert_eq!(code, 0);
    assert!(out.lines().count() >= 3);
    let first = out.split_whitespace().next().unwrap().to_string();
    let (code, out, err) = run(&["scenario", &first, "--json"]);
    assert_eq!(code, 0, "{err}");
    assert!(serde_json::from_str::<Value>(&out).is_ok());
    let path = std::env::temp_dir().join(format!("chiwave-test-{}.svg", std::process::id()));
    let p = path.to_string_lossy().to_string();
    let (code, _, err) = run(&["light", "--b", "10", "--svg", &p, "--figure", "alpha_b"]);
    assert_eq!(code, 0, "{err}");
    let svg = std::fs::read_to_string(&path).unwrap();
    assert!(svg.starts_with("<svg") && svg.contains("impact parameter"));
    let _ = std::fs::remove_file(&path);
}

#[test]
fn waveform_window_units_projection_and_em_figure() {
    // --u-unit b_over_v: u in GM/c³ is the window times b/v (definition of the option).
    let v = json(&["waveform", "--m1", "1", "--m2", "1", "--gamma", "1.25", "--b", "30", "--theta", "1", "--phi", "0", "--u-min", "-2",
        "--u-max", "2", "--u-unit", "b_over_v", "--samples", "3", "--energy-flux", "false", "--json"]);
    let b_over_v = 30.0 / 0.6; // γ = 1.25 ⇒ v = 0.6 exactly
    assert!(rel(v["u"][0].as_f64().unwrap(), -2.0 * b_over_v) < 1e-14);
    assert!(v["peak_abs_h"].as_f64().unwrap() > 0.0);
    let (code, _, err) = run(&["waveform", "--m1", "1", "--m2", "1", "--gamma", "1.25", "--b", "30", "--theta", "1", "--phi", "0",
        "--u-min", "-1", "--u-max", "1", "--u-unit", "s"]);
    assert_eq!(code, 2);
    assert!(err.contains("--u-unit") && err.contains("physical masses"), "{err}");
    let base = ["waveform", "--m1", "1", "--m2", "1", "--gamma", "1.25", "--b", "30", "--theta", "1", "--phi", "0", "--u-min", "-100", "--u-max", "100", "--energy-flux", "false"];
    let path = std::env::temp_dir().join(format!("chiwave-test-sky-{}.svg", std::process::id()));
    let p = path.to_string_lossy().to_string();
    let mut a: Vec<&str> = base.to_vec();
    a.extend(["--svg", &p, "--figure", "sky_memory", "--projection", "equal_area"]);
    let (code, _, err) = run(&a);
    assert_eq!(code, 0, "{err}");
    assert!(std::fs::read_to_string(&path).unwrap().contains("cos θ"));
    let mut a: Vec<&str> = base.to_vec();
    a.extend(["--svg", &p, "--figure", "sky", "--projection", "mollweide"]);
    let (code, _, err) = run(&a);
    assert_eq!(code, 2);
    assert!(err.contains("--projection"), "{err}");
    let mut a: Vec<&str> = base.to_vec();
    a.extend(["--force", "em", "--q1", "0.1", "--q2", "-0.1", "--svg", &p, "--figure", "em_field"]);
    let (code, _, err) = run(&a);
    assert_eq!(code, 0, "{err}");
    assert!(std::fs::read_to_string(&path).unwrap().contains("D·E_θ"));
    let _ = std::fs::remove_file(&path);
}

/// `chiwave sources`: the registry as a listing, as BibTeX and as JSON; every id a result cites
/// is listed; a wrong argument is refused with status 2.
#[test]
fn sources_command() {
    let (code, out, _) = run(&["sources"]);
    assert_eq!(code, 0);
    assert!(out.contains("[herrmann2021] Herrmann, Parra-Martinez, Ruf & Zeng 2021, arXiv:2101.07255"), "{out}");
    let (code, bib, _) = run(&["sources", "--bibtex"]);
    assert_eq!(code, 0);
    assert!(bib.is_ascii() && bib.contains("@article{damour2018,\n") && bib.contains("eprint = {1710.10599}"));
    let reg = json(&["sources", "--json"]);
    let list = reg.as_array().unwrap();
    assert_eq!(bib.matches("\n@").count() + 1, list.len());
    for e in list {
        for k in ["id", "kind", "authors", "year", "title", "arxiv", "doi", "used_for", "checked", "short", "bibtex"] {
            assert!(e.get(k).is_some(), "{k} missing in {e}");
        }
    }
    let ids: Vec<&str> = list.iter().map(|e| e["id"].as_str().unwrap()).collect();
    let w = json(&["encounter", "--m1", "1", "--m2", "3", "--gamma", "1.1", "--b", "100", "--json"]);
    for (key, cites) in w["citations"].as_object().unwrap() {
        for c in cites.as_array().unwrap() {
            assert!(ids.contains(&c["id"].as_str().unwrap()), "{key}: {c}");
        }
    }
    let (code, _, err) = run(&["sources", "--bibtex", "--json"]);
    assert_eq!(code, 2, "{err}");
    let (code, _, err) = run(&["sources", "--yaml"]);
    assert!(code == 2 && err.contains("--yaml"), "{err}");
}
