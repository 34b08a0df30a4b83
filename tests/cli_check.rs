//! End-to-end tests of the `tautspan` binary: run it on the example
//! scenarios and on broken files, read stdout, stderr and the exit code.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use std::path::{Path, PathBuf};
use std::process::{Command, Output};

fn bin() -> Command {
    Command::new(env!("CARGO_BIN_EXE_tautspan"))
}

fn scenarios() -> Vec<PathBuf> {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("scenarios");
    let mut v: Vec<PathBuf> = std::fs::read_dir(dir)
        .expect("scenarios/")
        .map(|e| e.expect("entry").path())
        .filter(|p| p.extension().is_some_and(|e| e == "ron"))
        .collect();
    v.sort();
    v
}

fn run(args: &[&str]) -> Output {
    bin().args(args).output().expect("run tautspan")
}

fn tmp_file(name: &str, text: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("tautspan-e2e-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("tmp dir");
    let p = dir.join(name);
    std::fs::write(&p, text).expect("write");
    p
}

const CAUTION_WORDS: &str = "competent person";

#[test]
fn json_for_every_example_follows_the_contract() {
    let files = scenarios();
    assert!(files.len() >= 3);
    let mut args = vec!["check", "--format", "json"];
    let names: Vec<String> = files.iter().map(|p| p.display().to_string()).collect();
    args.extend(names.iter().map(String::as_str));
    let out = run(&args);
    let code = out.status.code().expect("exit code");
    assert!(code == 0 || code == 1, "exit {code}: {}", String::from_utf8_lossy(&out.stderr));
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("valid JSON");
    let arr = v.as_array().expect("an array for several files");
    assert_eq!(arr.len(), files.len());
    for f in arr {
        assert!(f["caution"].as_str().expect("caution").contains(CAUTION_WORDS));
        assert!(f["title"].is_string() && f["file"].is_string());
        let cases = f["cases"].as_array().expect("cases");
        assert!(cases.len() >= 2, "static and dynamic cases in every example");
        assert!(cases.iter().any(|c| c["kind"] == "static"));
        assert!(cases.iter().any(|c| c["kind"] != "static"));
        for c in cases {
            assert_eq!(c["converged"], true, "{}", c["id"]);
            for m in c["members"].as_array().expect("members") {
                for key in ["force_n", "allowable_n", "utilisation", "stretch_m"] {
                    assert!(m[key].as_f64().is_some_and(f64::is_finite), "{key} in {m}");
                }
                assert!(["ok", "near", "over", "slack"].contains(&m["state"].as_str().expect("state")));
            }
            assert!(c["nodes"].as_array().is_some_and(|n| !n.is_empty()));
            assert!(c["supports"].as_array().is_some_and(|n| !n.is_empty()));
            assert!(c["load_path"].as_array().is_some_and(|n| !n.is_empty()));
            assert!(c["limits"].is_object());
            assert!(c["warnings"].is_array());
            if c["kind"] != "static" {
                assert!(
                    c["limits"]["release_deg"].is_number() || c["limits"]["drop_height_m"].is_number(),
                    "{}",
                    c["id"]
                );
            }
        }
    }
}

#[test]
fn exit_code_reports_over_allowable() {
    // the gantry's 20 mm snatch puts the drop line over its allowable
    let gantry = Path::new(env!("CARGO_MANIFEST_DIR")).join("scenarios/gantry-swing.ron");
    let out = run(&["check", gantry.to_str().expect("path")]);
    assert_eq!(out.status.code(), Some(1));
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.contains("over its allowable"), "{text}");
    // the static case alone is within allowable
    let out = run(&["check", "--case", "hanging", gantry.to_str().expect("path")]);
    assert_eq!(out.status.code(), Some(0), "{}", String::from_utf8_lossy(&out.stdout));
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.contains(CAUTION_WORDS) && text.contains("Case hanging") && !text.contains("Case sudden"));
}

#[test]
fn csv_and_text_carry_the_caution() {
    let f = scenarios()[0].display().to_string();
    let out = run(&["check", "--format", "csv", &f]);
    let text = String::from_utf8_lossy(&out.stdout);
    let mut lines = text.lines();
    assert!(lines.next().expect("caution line").contains(CAUTION_WORDS));
    let header = lines.next().expect("header");
    assert!(header.starts_with("file,case,kind,item"));
    let cols = header.split(',').count();
    // the verdict and scope lines are `#` comments
    for l in lines.filter(|l| !l.starts_with('#')) {
        assert_eq!(l.split(',').count(), cols, "{l}");
    }
    let out = run(&["check", &f]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.starts_with(&f) && text.matches(CAUTION_WORDS).count() >= 2);
}

#[test]
fn unknown_case_is_an_input_error() {
    let f = scenarios()[0].display().to_string();
    let out = run(&["check", "--case", "nope", &f]);
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("no such case"));
}

const GOOD: &str = r#"Scenario(
    format: 1,
    title: "e2e",
    nodes: [
        Node(id: "A1", at: ("0 m", "6 m"), support: Anchor),
        Node(id: "J1", at: ("0 m", "2 m")),
    ],
    members: [
        Member(id: "sling", ends: ("A1", "J1"), kind: WireRope, area: "64.7 mm^2", modulus: "100 GPa", rating: BreakingStrength("90.7 kN")),
    ],
    masses: [ Mass(id: "load", at: "J1", mass: "250 kg") ],
    cases: [ Static(id: "hanging"), Sudden(id: "sudden", mass: "load") ],
)
"#;

#[test]
fn broken_files_give_located_errors_and_exit_2() {
    let table: &[(&str, &str, &str, &str)] = &[
        ("syntax", r#"title: "e2e","#, r#"title: "e2e" ]"#, ":3:"),
        ("unknown-field", "kind: WireRope,", "kind: WireRope, hue: 3,", "members[0].hue"),
        ("duplicate-id", r#"Node(id: "J1""#, r#"Node(id: "A1""#, "nodes[1].id"),
        ("dangling", r#"at: "J1", mass"#, r#"at: "J9", mass"#, "masses[0].at"),
        ("bare-number", r#"mass: "250 kg""#, "mass: 250", ":11:"),
        ("format", "format: 1,", "format: 9,", "reads format 1"),
        ("dimension", r#"area: "64.7 mm^2""#, r#"area: "64.7 kg""#, "members[0].area"),
    ];
    for (name, from, to, needle) in table {
        assert!(GOOD.contains(from), "{name}");
        let p = tmp_file(&format!("{name}.ron"), &GOOD.replacen(from, to, 1));
        let out = run(&["check", p.to_str().expect("path")]);
        assert_eq!(out.status.code(), Some(2), "{name}");
        let err = String::from_utf8_lossy(&out.stderr);
        assert!(err.contains(&format!("{}:", p.display())), "{name}: {err}");
        assert!(err.contains(needle), "{name}: {err}");
        assert!(!err.contains("panicked"), "{name}: {err}");
    }
    // not UTF-8, a directory, a missing file
    let p = tmp_file("binary.ron", "");
    std::fs::write(&p, b"Scenario(\n  title: \"\xff\xfe\"").expect("write");
    let out = run(&["check", p.to_str().expect("path")]);
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains(":2:"), "{}", String::from_utf8_lossy(&out.stderr));
    let out = run(&["check", "/nonexistent/x.ron"]);
    assert_eq!(out.status.code(), Some(2));
    // a good file still runs beside a broken one, and the worst exit wins
    let good = tmp_file("good.ron", GOOD);
    let bad = tmp_file("bad2.ron", &GOOD.replacen("format: 1,", "format: 2,", 1));
    let out = run(&["check", good.to_str().expect("p"), bad.to_str().expect("p")]);
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stdout).contains("Case hanging"));
}

#[test]
fn oversize_file_is_refused_with_the_cap() {
    let p = tmp_file("huge.ron", "");
    let f = std::fs::File::create(&p).expect("create");
    f.set_len(17 * 1024 * 1024).expect("grow");
    let out = run(&["check", p.to_str().expect("path")]);
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("the cap is 16 MiB"));
}

#[test]
fn report_writes_html() {
    let f = scenarios()[0].display().to_string();
    let out_path = std::env::temp_dir().join(format!("tautspan-report-{}.html", std::process::id()));
    let out = run(&["report", &f, "--out", out_path.to_str().expect("path")]);
    assert!(matches!(out.status.code(), Some(0 | 1)), "{}", String::from_utf8_lossy(&out.stderr));
    let html = std::fs::read_to_string(&out_path).expect("report written");
    assert!(html.contains("<svg") && html.contains(CAUTION_WORDS));
}

#[test]
fn simulate_json_summary() {
    let gantry = Path::new(env!("CARGO_MANIFEST_DIR")).join("scenarios/gantry-swing.ron");
    let out =
        run(&["simulate", gantry.to_str().expect("p"), "--case", "swing-25", "--duration", "8 s", "--format", "json"]);
    assert_eq!(out.status.code(), Some(0), "{}", String::from_utf8_lossy(&out.stderr));
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("json");
    assert!(v["caution"].as_str().expect("caution").contains(CAUTION_WORDS));
    let members = v["members"].as_array().expect("members");
    assert_eq!(members.len(), 3);
    assert!(members.iter().all(|m| m["peak_force_n"].as_f64().is_some_and(|f| f > 0.0)));
    assert!(v["period_s"].as_f64().is_some_and(|p| p > 0.5), "{v}");
    let out =
        run(&["simulate", gantry.to_str().expect("p"), "--case", "swing-25", "--duration", "0.2 s", "--format", "csv"]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.lines().next().expect("caution").contains(CAUTION_WORDS));
    assert!(text.lines().nth(1).expect("header").starts_with("time_s,hoist-west_force_n"));
    let out = run(&["simulate", gantry.to_str().expect("p"), "--case", "nope"]);
    assert_eq!(out.status.code(), Some(2));
}

#[test]
fn help_explains_the_commands() {
    let out = run(&["--help"]);
    let text = String::from_utf8_lossy(&out.stdout);
    for word in ["check", "simulate", "report", "competent person"] {
        assert!(text.contains(word), "{word}: {text}");
    }
    let out = run(&["check", "--help"]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.contains("--format") && text.contains("--case") && text.contains("Exit code"));
}
