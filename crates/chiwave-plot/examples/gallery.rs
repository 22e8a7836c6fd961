//! Writes every figure of a few invented requests as SVG, at the default size and at a few
//! other sizes, into a directory, for looking at the figures by eye:
//!
//! ```sh
//! cargo run --release -p chiwave-plot --example gallery -- /tmp/gallery [WxH ...]
//! ```

use chiwave_core::encounter::nr;
use chiwave_core::request::Request;
use chiwave_core::units::AngleUnit;
use chiwave_plot::{figures_encounter, render, scene, Figure};

const REQUESTS: [(&str, &str); 6] = [
    ("light", r#"{"kind": "light", "b": 10, "orders": 12}"#),
    ("lens", r#"{"kind": "lens", "mass": "0.3 Msun", "lens_distance": "4 kpc", "source_distance": "8 kpc", "offset": 0.5, "frequency": "100 Hz"}"#),
    ("encounter", r#"{"kind": "encounter", "m1": 1, "m2": 3, "gamma": 1.1, "b": 100}"#),
    ("waveform", r#"{"kind": "waveform", "m1": 1, "m2": 1, "gamma": 1.3, "b": 60, "theta": 0.9, "phi": 0.5, "u_min": -600, "u_max": 600, "samples": 601}"#),
    (
        "waveform-physical",
        r#"{"kind": "waveform", "m1": "1.2 Msun", "m2": "1.2 Msun", "v": "300 km/s", "b": "2 au", "theta": 10, "phi": 0, "angle_unit": "deg",
            "frame": "cm", "distance": "8 kpc", "u_min": -10, "u_max": 10, "u_unit": "b_over_v", "samples": 800,
            "detector": {"theta": 50, "phi": 20, "psi": 15}}"#,
    ),
    ("waveform-em", r#"{"kind": "waveform", "force": "em", "q1": 0.1, "q2": -0.1, "m1": 1, "m2": 1, "gamma": 1.3, "b": 60, "theta": 0.9, "phi": 0.5, "u_min": -600, "u_max": 600}"#),
];

fn main() -> Result<(), Box<dyn std::error::Error>> {
    let mut args = std::env::args().skip(1);
    let dir = args.next().unwrap_or_else(|| "gallery".into());
    let mut sizes: Vec<Option<(u32, u32)>> = vec![None];
    for a in args {
        let (w, h) = a.split_once('x').ok_or("sizes are WxH")?;
        sizes.push(Some((w.parse()?, h.parse()?)));
    }
    std::fs::create_dir_all(&dir)?;
    let mut figs: Vec<(String, Figure)> = Vec::new();
    for (stem, text) in REQUESTS {
        let req: Request = serde_json::from_str(text)?;
        let kind = stem.split('-').next().unwrap_or(stem);
        for name in scene::names(kind) {
            if let Ok(f) = scene::figure(&req, name, &scene::Options::default()) {
                figs.push((format!("{stem}-{name}"), f));
            }
        }
    }
    // Invented rows (not NR data).
    let rows = nr::compare(&nr::parse_csv("E/M,J/M2,nu,chi,sigma\n1.02,1.10,0.25,1.00,0.05\n1.02,1.30,0.25,0.70,0.04\n1.02,1.60,0.25,0.45,0.02\n")?)?;
    figs.push(("encounter-nr".into(), figures_encounter::nr_comparison(&rows, AngleUnit::Rad)));
    for (stem, fig) in figs {
        for s in &sizes {
            let mut g = fig.clone();
            let suffix = match s {
                Some((w, h)) => {
                    g.width = *w;
                    g.height = *h;
                    format!("-{w}x{h}")
                }
                None => String::new(),
            };
            let (svg, _) = render(&g)?;
            std::fs::write(format!("{dir}/{stem}{suffix}.svg"), svg)?;
        }
    }
    Ok(())
}
