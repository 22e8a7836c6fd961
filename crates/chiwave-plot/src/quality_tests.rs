//! Checks of the drawn figures as a reader sees them, over every figure of every kind, several
//! requests per kind and every size the page and the CLI produce:
//! * the SVG parses as XML (roxmltree, an independent parser) and its curves have fractional
//!   coordinates (no whole-pixel stair steps);
//! * no two text boxes overlap, and every text box lies inside the figure (boxes estimated
//!   independently of the layout's own estimate: 0.6 em per character, 1 em tall);
//! * no two labelled series look alike (same colour and same dash), and each is drawn with
//!   the style the legend shows;
//! * a legend inside the plot covers no drawn data at the page's sizes;
//! * every axis has at least two labelled ticks.

use crate::layout::place;
use crate::render::{marker_shapes, stroke_of, Type};
use crate::{colour, figures_encounter, render, scene, Figure};
use chiwave_core::encounter::nr;
use chiwave_core::request::Request;
use chiwave_core::units::AngleUnit;

/// Requests covering each kind (invented inputs, chosen to span the regimes the page shows:
/// weak and strong field, capture, physical and geometric units, both forces).
fn requests() -> Vec<Request> {
    let texts = [
        r#"{"kind": "light", "b": 10, "orders": 12}"#,
        r#"{"kind": "light", "b": 3}"#,
        r#"{"kind": "light", "b": 1e5, "orders": 3}"#,
        r#"{"kind": "light", "b": 4.2, "spin": 0.9}"#,
        r#"{"kind": "light", "b": 7, "charge": 0.8}"#,
        r#"{"kind": "lens", "mass": "0.3 Msun", "lens_distance": "4 kpc", "source_distance": "8 kpc", "offset": 0.5, "frequency": "100 Hz"}"#,
        r#"{"kind": "lens", "mass": "30 Msun", "lens_distance": "1 Gpc", "source_distance": "2 Gpc", "offset": 0.02, "frequency": "1 kHz"}"#,
        r#"{"kind": "lens", "mass": "1 Msun", "lens_distance": "4 kpc", "source_distance": "8 kpc", "offset": 3}"#,
        r#"{"kind": "encounter", "m1": 1, "m2": 3, "gamma": 1.1, "b": 100}"#,
        r#"{"kind": "encounter", "m1": 1, "m2": 1, "gamma": 1.1, "b": 8}"#,
        r#"{"kind": "encounter", "m1": 1, "m2": 1, "gamma": 3, "b": 40}"#,
        r#"{"kind": "encounter", "m1": "10 Msun", "m2": "20 Msun", "v": "1000 km/s", "b": "1 au"}"#,
        r#"{"kind": "waveform", "m1": 1, "m2": 1, "gamma": 1.3, "b": 60, "theta": 0.9, "phi": 0.5, "u_min": -600, "u_max": 600, "samples": 301}"#,
        r#"{"kind": "waveform", "m1": 1, "m2": 4, "gamma": 5, "b": 200, "theta": 1.4, "phi": -2.0, "frame": "cm", "u_min": -300, "u_max": 300, "samples": 301}"#,
        r#"{"kind": "waveform", "m1": "1.2 Msun", "m2": "1.2 Msun", "v": "300 km/s", "b": "2 au", "theta": 10, "phi": 0, "angle_unit": "deg",
            "frame": "cm", "distance": "8 kpc", "u_min": -10, "u_max": 10, "u_unit": "b_over_v", "samples": 400,
            "detector": {"theta": 50, "phi": 20, "psi": 15}}"#,
        r#"{"kind": "waveform", "force": "em", "q1": 0.1, "q2": -0.1, "m1": 1, "m2": 1, "gamma": 1.3, "b": 60, "theta": 0.9, "phi": 0.5,
            "u_min": -600, "u_max": 600, "samples": 301}"#,
    ];
    texts.iter().map(|t| serde_json::from_str(t).unwrap_or_else(|e| panic!("{t}: {e}"))).collect()
}

fn kind(r: &Request) -> &'static str {
    match r {
        Request::Light(_) => "light",
        Request::Lens(_) => "lens",
        Request::Encounter(_) => "encounter",
        Request::Waveform(_) => "waveform",
        #[allow(unreachable_patterns)]
        _ => "other",
    }
}

/// Every figure of every request (names that belong to the other force are skipped), plus the
/// NR comparison figure for two invented tables; built once for all the tests.
fn all_figures() -> Vec<(String, Figure)> {
    static ALL: std::sync::OnceLock<Vec<(String, Figure)>> = std::sync::OnceLock::new();
    ALL.get_or_init(build_figures).clone()
}

fn build_figures() -> Vec<(String, Figure)> {
    let mut out = Vec::new();
    for (i, req) in requests().iter().enumerate() {
        let k = kind(req);
        for name in scene::names(k) {
            match scene::figure(req, name, &scene::Options::default()) {
                Ok(f) => out.push((format!("{k}#{i}/{name}"), f)),
                // The names of the other force (em figures of a gravity request and back).
                Err(e) if matches!(e.field(), "force" | "quadrupole") => {}
                Err(e) => panic!("{k}#{i}/{name}: {e}"),
            }
        }
        if k == "waveform" {
            let opts = scene::Options { projection: Some("equal_area".into()), ..Default::default() };
            if let Ok(f) = scene::figure(req, "sky", &opts) {
                out.push((format!("{k}#{i}/sky equal_area"), f));
            }
        }
    }
    // Invented rows (not NR data): one sequence, and rows of different encounters.
    for (j, csv) in ["E/M,J/M2,nu,chi,sigma\n1.02,1.10,0.25,1.00,0.05\n1.02,1.30,0.25,0.70,0.04\n1.02,1.60,0.25,0.45,0.02\n",
        "E/M,J/M2,nu,chi,sigma\n1.01,1.2,0.25,0.9,0.1\n1.05,1.25,0.2,0.8,0.05\n"]
    .iter()
    .enumerate()
    {
        let rows = nr::compare(&nr::parse_csv(csv).unwrap()).unwrap();
        out.push((format!("nr#{j}"), figures_encounter::nr_comparison(&rows, AngleUnit::Rad)));
    }
    out
}

/// The sizes drawn: the builder's own (the page and the CLI), a large export, and the small
/// sizes a narrow window asks for (down to the smallest the page's options allow).
const SIZES: [Option<(u32, u32)>; 5] = [None, Some((1200, 740)), Some((560, 360)), Some((400, 280)), Some((320, 240))];

fn sized(f: &Figure, s: Option<(u32, u32)>) -> Figure {
    let mut g = f.clone();
    if let Some((w, h)) = s {
        g.width = w;
        g.height = h;
    }
    g
}

/// A text element's estimated box: 0.6 em per character, from 0.8 em above to 0.2 em below the
/// baseline; rotation by −90° about the anchor point handled.
#[derive(Debug, Clone)]
struct TextBox {
    text: String,
    x0: f64,
    x1: f64,
    y0: f64,
    y1: f64,
}

fn attr(n: &roxmltree::Node, k: &str) -> f64 {
    n.attribute(k).and_then(|v| v.parse().ok()).unwrap_or(f64::NAN)
}

fn text_boxes(doc: &roxmltree::Document) -> Vec<TextBox> {
    let mut out = Vec::new();
    for n in doc.descendants().filter(|n| n.has_tag_name("text")) {
        let text = n.text().unwrap_or("").trim().to_string();
        let (x, y, size) = (attr(&n, "x"), attr(&n, "y"), attr(&n, "font-size"));
        let w = 0.6 * size * text.chars().count() as f64;
        let left = match n.attribute("text-anchor") {
            Some("middle") => x - 0.5 * w,
            Some("end") => x - w,
            _ => x,
        };
        let rotated = n.attribute("transform").is_some_and(|t| t.starts_with("rotate(-90"));
        let b = if rotated {
            // (px, py) ↦ (x + (py − y), y − (px − x))
            TextBox { text, x0: x - 0.8 * size, x1: x + 0.2 * size, y0: y - (left + w - x), y1: y - (left - x) }
        } else {
            TextBox { text, x0: left, x1: left + w, y0: y - 0.8 * size, y1: y + 0.2 * size }
        };
        out.push(b);
    }
    out
}

/// All numbers of all `d` attributes of the paths.
fn path_numbers(doc: &roxmltree::Document) -> Vec<f64> {
    doc.descendants()
        .filter(|n| n.has_tag_name("path"))
        .filter_map(|n| n.attribute("d"))
        .flat_map(|d| d.split([' ', 'M', 'L']).filter(|s| !s.is_empty()).map(|s| s.parse::<f64>().unwrap_or(f64::NAN)).collect::<Vec<_>>())
        .collect()
}

#[test]
fn svg_parses_and_curves_have_fractional_coordinates() {
    for (name, fig) in all_figures() {
        let (svg, frame) = render(&fig).unwrap();
        let doc = roxmltree::Document::parse(&svg).unwrap_or_else(|e| panic!("{name}: SVG does not parse: {e}"));
        let root = doc.root_element();
        assert!(root.has_tag_name(("http://www.w3.org/2000/svg", "svg")), "{name}");
        assert_eq!(root.attribute("viewBox"), Some(format!("0 0 {} {}", frame.svg_width, frame.svg_height).as_str()), "{name}");
        let nums = path_numbers(&doc);
        assert!(nums.iter().all(|v| v.is_finite()), "{name}: a path has a malformed number");
        // Curves, grid lines at data ticks and the frame's pixel-centre edges: almost every
        // distinct coordinate has a fractional part (whole numbers occur only by chance, or
        // where a level such as y = 0 happens to fall on a whole pixel).
        let mut distinct: Vec<f64> = nums.clone();
        distinct.sort_by(f64::total_cmp);
        distinct.dedup();
        let fractional = distinct.iter().filter(|v| v.fract() != 0.0).count();
        assert!(fractional as f64 > 0.9 * distinct.len() as f64, "{name}: {fractional} of {} distinct path coordinates are fractional", distinct.len());
        assert!(fig.series.iter().map(|s| s.points.len()).sum::<usize>() < 50 || fractional > 100, "{name}: curves drawn with fractional coordinates");
    }
}

#[test]
fn no_text_overlaps_at_any_size() {
    let mut checked = 0;
    for (name, fig) in all_figures() {
        for s in SIZES {
            let g = sized(&fig, s);
            let (svg, fr) = render(&g).unwrap();
            let doc = roxmltree::Document::parse(&svg).unwrap();
            let boxes = text_boxes(&doc);
            let (w, h) = (fr.svg_width as f64, fr.svg_height as f64);
            for b in &boxes {
                assert!(b.x0 >= -0.5 && b.x1 <= w + 0.5 && b.y0 >= -0.5 && b.y1 <= h + 0.5, "{name} at {w}×{h}: '{}' leaves the figure: {b:?}", b.text);
            }
            for i in 0..boxes.len() {
                for j in 0..i {
                    let (a, b) = (&boxes[i], &boxes[j]);
                    // Half a pixel of tolerance: touching boxes are fine.
                    let ov = a.x0 < b.x1 - 0.5 && b.x0 < a.x1 - 0.5 && a.y0 < b.y1 - 0.5 && b.y0 < a.y1 - 0.5;
                    assert!(!ov, "{name} at {w}×{h}: '{}' overlaps '{}'\n{a:?}\n{b:?}", a.text, b.text);
                }
            }
            checked += 1;
        }
    }
    assert!(checked > 150, "{checked} renderings checked");
}

#[test]
fn no_two_series_look_alike_and_each_is_drawn_in_its_style() {
    for (name, fig) in all_figures() {
        let styles = colour::distinct_styles(&fig.series);
        let labelled: Vec<(usize, &crate::Style)> =
            styles.iter().enumerate().filter(|(i, _)| !fig.series[*i].label.is_empty() && !fig.series[*i].points.is_empty()).collect();
        for (a, (i, sa)) in labelled.iter().enumerate() {
            for (j, sb) in labelled.iter().take(a) {
                assert!(!(sa.color == sb.color && sa.dash == sb.dash), "{name}: '{}' and '{}' look alike", fig.series[*i].label, fig.series[*j].label);
            }
        }
        // The SVG has a path in each labelled series' colour and dash (its legend swatch at least).
        let (svg, _) = render(&fig).unwrap();
        let doc = roxmltree::Document::parse(&svg).unwrap();
        for (i, st) in &labelled {
            let sk = stroke_of(st);
            let dash = sk.dash.iter().map(|v| crate::svg::num(*v)).collect::<Vec<_>>().join(" ");
            let colour = crate::hex(st.color);
            let found = doc.descendants().filter(|n| n.has_tag_name("path")).any(|n| {
                n.attribute("stroke") == Some(colour.as_str()) && n.attribute("stroke-dasharray").unwrap_or("") == dash
            });
            assert!(found, "{name}: no path drawn in the style of '{}'", fig.series[*i].label);
        }
        // Marker sets without error bars get distinct shapes.
        let shapes = marker_shapes(&fig);
        let plain: Vec<_> = fig.markers.iter().zip(&shapes).filter(|(m, _)| m.error_bars.is_empty()).map(|(_, s)| *s).collect();
        for a in 0..plain.len().min(5) {
            for b in 0..a {
                assert_ne!(plain[a], plain[b], "{name}: marker sets {a} and {b} share a shape");
            }
        }
    }
}

#[test]
fn twelve_series_orders_are_distinct() {
    // The α(b) figure with all 12 orders: partial sums 1 and 7 (and every other pair) differ.
    let req: Request = serde_json::from_str(r#"{"kind": "light", "b": 10, "orders": 12}"#).unwrap();
    let fig = scene::figure(&req, "alpha_b", &scene::Options::default()).unwrap();
    let styles = colour::distinct_styles(&fig.series);
    let orders: Vec<&crate::Style> = fig.series.iter().zip(&styles).filter(|(s, _)| s.label.starts_with("series to order")).map(|(_, st)| st).collect();
    assert_eq!(orders.len(), 12);
    assert!(orders[0].color != orders[6].color || orders[0].dash != orders[6].dash);
}

#[test]
fn legends_cover_no_data_at_the_page_sizes() {
    for (name, fig) in all_figures() {
        for s in [None, Some((1200, 740))] {
            let g = sized(&fig, s);
            let ty = Type::for_size(g.width as f64, g.height as f64);
            let entries = crate::layout::legend_entries(&g, &colour::distinct_styles(&g.series), &marker_shapes(&g));
            let (lay, inside) = place(&g, ty, &entries);
            if let Some((b, _)) = inside {
                let covered = crate::layout::covered_by(&g, &lay, &b);
                assert_eq!(covered, 0, "{name} at {}×{}: the legend covers {covered} pieces of data", g.width, g.height);
            }
        }
    }
}

#[test]
fn every_axis_has_two_labelled_ticks() {
    for (name, fig) in all_figures() {
        for s in SIZES {
            let g = sized(&fig, s);
            let ty = Type::for_size(g.width as f64, g.height as f64);
            let entries = crate::layout::legend_entries(&g, &colour::distinct_styles(&g.series), &marker_shapes(&g));
            let (lay, _) = place(&g, ty, &entries);
            for (axis, ts, log) in [("x", &lay.xt, g.x.log), ("y", &lay.yt, g.y.log)] {
                let n = ts.labelled().count();
                assert!(n >= 2, "{name} at {}×{}: {axis} axis ({}) has {n} labelled ticks: {:?}", g.width, g.height, if log { "log" } else { "linear" }, ts.ticks);
            }
            if let Some(bar) = &lay.bar {
                assert!(bar.ticks.labelled().count() >= 2, "{name}: colour bar ticks {:?}", bar.ticks.ticks);
            }
        }
    }
}

#[test]
fn y_axis_title_clears_the_tick_labels() {
    // The strain and slow-motion figures (long tick labels): the rotated title's box ends left of
    // the widest tick label's box, by the layout's own estimate too.
    let req: Request = serde_json::from_str(
        r#"{"kind": "waveform", "m1": "1.2 Msun", "m2": "1.2 Msun", "v": "300 km/s", "b": "2 au", "theta": 10, "phi": 0, "angle_unit": "deg",
            "frame": "cm", "distance": "8 kpc", "u_min": -10, "u_max": 10, "u_unit": "b_over_v", "samples": 200}"#,
    )
    .unwrap();
    for name in ["strain", "slow_motion"] {
        let fig = scene::figure(&req, name, &scene::Options::default()).unwrap();
        let (svg, fr) = render(&fig).unwrap();
        let doc = roxmltree::Document::parse(&svg).unwrap();
        let boxes = text_boxes(&doc);
        // The title may wrap into several lines (a short plot area): every line's box counts.
        let title_lines: Vec<_> = boxes.iter().filter(|b| !b.text.is_empty() && fig.y.label.contains(b.text.as_str()) && b.x1 <= fr.left).collect();
        let joined: String = title_lines.iter().map(|b| b.text.as_str()).collect::<Vec<_>>().join(" ");
        assert_eq!(joined, fig.y.label, "{name}: y title lines {joined:?}");
        let title_x1 = title_lines.iter().map(|b| b.x1).fold(f64::NEG_INFINITY, f64::max);
        let leftmost_tick = boxes.iter().filter(|b| b.x1 <= fr.left && b.y0 >= fr.top - 10.0 && !title_lines.iter().any(|t| t.text == b.text)).map(|b| b.x0).fold(f64::INFINITY, f64::min);
        assert!(title_x1 < leftmost_tick, "{name}: title ends at {title_x1} but a tick label starts at {leftmost_tick}");
    }
}
