//! End-to-end tests of the outputs others use: `--units us` in text, CSV
//! and the report checked against hand conversions; the report's file
//! name, SHA-256 and revision; JSON staying SI.
//!
//! The fixture `tests/fixtures/hung-1000-lb.ron` hangs 1000 lb on one cable
//! (area 0.1 in², E = 29 000 ksi, 10 ft long, breaking strength 20 kip,
//! design factor 5), so by hand: the force is 1000 lbf (1 lbf is the weight
//! of 1 lb at standard gravity, NIST SP 811, 2008, B.8), the allowable
//! 20 000 / 5 = 4000 lbf, the stretch F L / (E A) = 1000 × 120 in /
//! (29 000 000 psi × 0.1 in²) = 0.041 379 in (Hooke's law).

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use std::path::{Path, PathBuf};
use std::process::{Command, Output};

fn run(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_tautspan")).args(args).output().expect("run tautspan")
}

fn fixture() -> String {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/fixtures/hung-1000-lb.ron").display().to_string()
}

/// 1 lbf in newtons, 1 in and 1 ft in metres: exact (NIST SP 811, 2008, B.8).
const LBF_N: f64 = 4.448_221_615_260_5;
const IN_M: f64 = 0.0254;
const FT_M: f64 = 0.3048;

fn close(got: f64, want: f64, rel: f64, what: &str) {
    assert!((got - want).abs() <= rel * want.abs().max(1e-300), "{what}: {got} against {want} (rel {rel})");
}

/// The CSV's data rows as maps from column name to text.
fn csv_rows(out: &[u8]) -> Vec<std::collections::HashMap<String, String>> {
    let text = String::from_utf8_lossy(out);
    let mut lines = text.lines().filter(|l| !l.starts_with('#'));
    let header: Vec<String> = lines.next().expect("header").split(',').map(str::to_string).collect();
    lines.map(|l| header.iter().cloned().zip(l.split(',').map(str::to_string)).collect()).collect()
}

#[test]
fn csv_in_us_units_against_hand_conversions() {
    let f = fixture();
    let us = run(&["check", "--format", "csv", "--units", "us", &f]);
    assert_eq!(us.status.code(), Some(1), "the drop case is over: {}", String::from_utf8_lossy(&us.stderr));
    let si = run(&["check", "--format", "csv", &f]);
    let (us_rows, si_rows) = (csv_rows(&us.stdout), csv_rows(&si.stdout));
    assert_eq!(us_rows.len(), si_rows.len());
    let num = |r: &std::collections::HashMap<String, String>, k: &str| -> f64 {
        r.get(k).unwrap_or_else(|| panic!("column {k}")).parse().unwrap_or_else(|e| panic!("{k}: {e}"))
    };
    let hanging = us_rows.iter().find(|r| r["case"] == "hanging").expect("static row");
    // by hand; the solver's tolerance is 1e-9 of the load, so 1e-6 is loose
    close(num(hanging, "force_lbf"), 1000.0, 1e-6, "force");
    close(num(hanging, "allowable_lbf"), 4000.0, 1e-12, "allowable");
    close(num(hanging, "stretch_in"), 1000.0 * 120.0 / (29.0e6 * 0.1), 1e-6, "stretch");
    // every row: US = SI / the exact factor (CSV writes full precision; 1e-12 for the division's rounding)
    for (u, s) in us_rows.iter().zip(&si_rows) {
        close(num(u, "force_lbf"), num(s, "force_n") / LBF_N, 1e-12, "force_lbf");
        close(num(u, "allowable_lbf"), num(s, "allowable_n") / LBF_N, 1e-12, "allowable_lbf");
        close(num(u, "stretch_in"), num(s, "stretch_m") / IN_M, 1e-12, "stretch_in");
        if !s["drop_limit_m"].is_empty() {
            close(num(u, "drop_limit_ft"), num(s, "drop_limit_m") / FT_M, 1e-12, "drop_limit_ft");
        }
    }
    assert!(!String::from_utf8_lossy(&us.stdout).contains("force_n"), "US CSV names its columns in lbf");
}

#[test]
fn text_in_us_units_prints_kip_and_inches() {
    let out = run(&["check", "--units", "us", &fixture()]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.contains("Units: US customary"), "{text}");
    assert!(text.contains("force kip") && text.contains("stretch in") && text.contains("max drop ft"), "{text}");
    // the static row: 1 kip (1000 lbf), allowable 4 kip, stretch 0.04138 in (4 significant digits)
    let row = text.lines().find(|l| l.trim_start().starts_with("cable ")).expect("cable row");
    let cells: Vec<&str> = row.split_whitespace().collect();
    assert_eq!(&cells[1..3], ["1", "4"], "{row}");
    assert_eq!(cells[5], "0.04138", "{row}");
    let si = String::from_utf8_lossy(&run(&["check", &fixture()]).stdout).into_owned();
    // 1000 lbf = 4.448 kN, 0.041 379 in = 1.051 mm (by the exact factors)
    let row = si.lines().find(|l| l.trim_start().starts_with("cable ")).expect("cable row");
    let cells: Vec<&str> = row.split_whitespace().collect();
    assert_eq!(&cells[1..3], ["4.448", "17.79"], "{row}");
    assert_eq!(cells[5], "1.051", "{row}");
}

#[test]
fn json_stays_si_whatever_the_units() {
    let f = fixture();
    let si = run(&["check", "--format", "json", &f]);
    let us = run(&["check", "--format", "json", "--units", "us", &f]);
    assert_eq!(si.stdout, us.stdout, "JSON is SI with the unit in each field name");
    let v: serde_json::Value = serde_json::from_slice(&si.stdout).expect("json");
    close(v["cases"][0]["members"][0]["force_n"].as_f64().expect("force_n"), 1000.0 * LBF_N, 1e-6, "force_n");
}

fn report(args: &[&str], name: &str) -> String {
    let out_path: PathBuf = std::env::temp_dir().join(format!("tautspan-outputs-{}-{name}.html", std::process::id()));
    let mut all = vec!["report", "--out", out_path.to_str().expect("path")];
    all.extend_from_slice(args);
    let out = run(&all);
    assert!(matches!(out.status.code(), Some(0 | 1)), "{}", String::from_utf8_lossy(&out.stderr));
    let html = std::fs::read_to_string(&out_path).expect("report written");
    let _ = std::fs::remove_file(&out_path);
    html
}

#[test]
fn report_names_the_file_its_sha256_and_revision() {
    let f = fixture();
    let html = report(&[&f], "sha");
    // `sha256sum tests/fixtures/hung-1000-lb.ron`, run by hand when the fixture was written
    let digest = "e7566883f8eb51f28db596680d1d08cb672fa94c07e9c51f4224d9bcea00858a";
    assert!(html.contains(&format!("<code class=\"sha256\">{digest}</code>")), "SHA-256 missing");
    assert!(html.contains(&format!("<dd class=\"file\">{f}</dd>")), "file name missing");
    assert!(html.contains("<span class=\"revision\">B</span>"), "revision missing");
}

#[test]
fn report_in_us_units() {
    let html = report(&["--units", "us", &fixture()], "us");
    assert!(html.contains("<dd>US customary</dd>"));
    // the mass as typed: 1000 lb (under one short ton); the static force 1000 lbf (3 digits)
    assert!(html.contains("1000\u{a0}lb<") || html.contains("1000\u{a0}lb "), "mass in lb");
    assert!(html.contains("1000\u{a0}lbf"), "force in lbf");
    // the drawing's dimensions in the solved shape: 8 ft wide (anchors at 0 and 8 ft), and high
    // 10 ft plus the cable's stretch: 120 in + 0.041 379 in = 3.049 051 m, "10 ft" at 4 digits
    assert!(html.contains("data-dimension=\"width\"") && html.contains(">8\u{a0}ft</text>"), "width dimension");
    assert!(html.contains("data-dimension=\"height\"") && html.contains(">10\u{a0}ft</text>"), "height dimension");
    let value = |dim: &str| -> f64 {
        let at = html.find(&format!("data-dimension=\"{dim}\" data-value-m=\"")).expect(dim);
        let rest = &html[at..];
        let start = rest.find("data-value-m=\"").expect("value") + 14;
        rest[start..start + rest[start..].find('"').expect("end")].parse().expect("number")
    };
    close(value("width"), 8.0 * FT_M, 1e-12, "width");
    close(value("height"), (120.0 + 1000.0 * 120.0 / (29.0e6 * 0.1)) * IN_M, 1e-6, "height");
}

/// Rope sizes in inches: the bridle example's 12 mm wire rope reads
/// 12 / 25.4 = 0.4724 in (4 digits); its 650 kg truss 650 / 0.453 592 37 =
/// 1433 lb (NIST SP 811 B.8), under one short ton.
#[test]
fn report_in_us_units_gives_rope_sizes_in_inches() {
    let f = Path::new(env!("CARGO_MANIFEST_DIR")).join("scenarios/bridle-unequal.ron").display().to_string();
    let html = report(&["--units", "us", &f], "rope");
    assert!(html.contains("⌀&nbsp;0.4724\u{a0}in"), "rope diameter in inches");
    assert!(html.contains("1433\u{a0}lb<"), "mass in lb");
}
