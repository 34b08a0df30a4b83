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
        // the verdict, and the scope: what is checked and, by name, what is not
        assert!(["within", "not_within", "unchecked"].contains(&f["verdict"].as_str().expect("verdict")));
        assert!(f["scope"]["checked"].as_array().is_some_and(|v| !v.is_empty()));
        assert!(f["scope"]["not_checked"].as_array().is_some_and(|v| !v.is_empty()));
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
                assert!(["ok", "near", "over", "slack", "unchecked"].contains(&m["state"].as_str().expect("state")));
                if c["kind"] == "swing" {
                    assert!(m["peak_at_deg"].is_number(), "swing members say where on the arc they peak: {m}");
                }
            }
            if c["kind"] == "swing" {
                assert!(c["arc"]["angles_deg"].as_array().is_some_and(|a| a.len() >= 9));
            }
            assert!(c["nodes"].as_array().is_some_and(|n| !n.is_empty()));
            assert!(c["supports"].as_array().is_some_and(|n| !n.is_empty()));
            assert!(c["load_path"].as_array().is_some_and(|n| !n.is_empty()));
            // each path: members with their shares (fractions of the mass's weight) above the threshold
            let threshold = c["load_path_threshold"].as_f64().expect("load_path_threshold");
            for p in c["load_path"].as_array().expect("load_path").iter().chain([&c["combined_load_path"]]) {
                let (members, shares) =
                    (p["members"].as_array().expect("members"), p["shares"].as_array().expect("shares"));
                assert_eq!(members.len(), shares.len(), "{p}");
                assert_eq!(p["supports"].as_array().map(Vec::len), p["support_shares"].as_array().map(Vec::len));
                for x in shares.iter().chain(p["support_shares"].as_array().expect("support_shares")) {
                    let x = x.as_f64().expect("share");
                    assert!((0.0..=1.0 + 1e-9).contains(&x), "{p}");
                    if p["mass"] != "all masses" {
                        assert!(x >= threshold - 1e-9, "{p}");
                    }
                }
                assert!(p["below_threshold"].is_u64() && p["not_listed"].is_u64() && p["untraced"].is_number());
            }
            // warnings: one text per kind, and each group with every subject
            let groups = c["warning_groups"].as_array().expect("warning_groups");
            assert_eq!(groups.len(), c["warnings"].as_array().map_or(0, Vec::len));
            for g in groups {
                assert!(g["kind"].is_string() && g["message"].is_string());
                assert!(
                    g["count"].as_u64().is_some_and(|n| n >= g["subjects"].as_array().map_or(0, |v| v.len() as u64))
                );
            }
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
fn rated_parts_name_the_weakest_part() {
    // the roller lift: 1.3 t hung from two 1 t beam clamps. Statics of the
    // symmetric bridle: leg pull W / (2 sin b), tan b = 1.5 / 1, so each
    // clamp carries 1300 x 9.80665 / (2 x 0.83205) = 7661 N plus half its
    // leg's own weight (about 0.15 % more; tolerance 1 %), 78 % of 1 t x g.
    let f = Path::new(env!("CARGO_MANIFEST_DIR")).join("scenarios/roller-two-leg-pick.ron");
    let out = run(&["check", "--format", "json", f.to_str().expect("path")]);
    assert_eq!(out.status.code(), Some(0), "{}", String::from_utf8_lossy(&out.stdout));
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("valid JSON");
    let rows = v["comparison"].as_array().expect("comparison");
    let util = |r: &serde_json::Value| r["utilisation"][0].as_f64().unwrap_or(0.0);
    let weakest = rows.iter().max_by(|a, b| util(a).total_cmp(&util(b))).expect("rows");
    assert!(weakest["id"].as_str().expect("id").ends_with("/beam clamp"), "{weakest}");
    let want = 1300.0 * 9.806_65 / (2.0 * 1.5_f64.atan2(1.0).sin()) / (1000.0 * 9.806_65);
    assert!((util(weakest) - want).abs() / want < 0.01, "{} vs {want}", util(weakest));
    // the master link carries the resultant of the two legs: the hung
    // weight plus the legs' own weight (within 1 %)
    let link = &v["cases"][0]["nodes"].as_array().expect("nodes").iter().find(|n| n["id"] == "link").expect("link")["fittings"]
        [0];
    let w = 1300.0 * 9.806_65;
    assert!((link["force_n"].as_f64().expect("force") - w).abs() / w < 0.01, "{link}");
    // the beams' rated points and every part in the JSON contract
    for s in v["cases"][0]["supports"].as_array().expect("supports") {
        assert_eq!(s["rated_n"], 15_000.0);
        assert_eq!(s["state"], "ok");
    }
    // the text names the parts and the angle convention
    let out = run(&["check", f.to_str().expect("path")]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.contains("beam-north/beam clamp") && text.contains("link/master link"), "{text}");
    assert!(text.contains("sling angle deg from horizontal"));
    // CSV has a row per part
    let out = run(&["check", "--format", "csv", f.to_str().expect("path")]);
    let csv = String::from_utf8_lossy(&out.stdout);
    assert!(csv.lines().any(|l| l.contains(",beam-south/beam clamp,part,")), "{csv}");
    // the legs' sling angle, from the horizontal, in its column: atan(1.5 / 1) = 56.3 deg
    let header = csv.lines().find(|l| l.starts_with("file,")).expect("header");
    let col = header.split(',').position(|h| h == "sling_angle_from_horizontal_deg").expect("sling angle column");
    let leg = csv.lines().find(|l| l.contains(",leg-north,member,")).expect("leg row");
    let angle: f64 = leg.split(',').nth(col).expect("angle").parse().expect("a number");
    assert!((angle - 1.5_f64.atan2(1.0).to_degrees()).abs() < 0.05, "{angle}");
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
    // each file's verdict and scope come first, as comment lines
    let (notes, rows): (Vec<&str>, Vec<&str>) = lines.partition(|l| l.starts_with('#'));
    assert!(notes.iter().any(|l| l.contains("verdict")), "{notes:?}");
    assert!(notes.iter().any(|l| l.contains(": checked: ")) && notes.iter().any(|l| l.contains(": not checked: ")));
    for l in rows {
        assert_eq!(l.split(',').count(), cols, "{l}");
    }
    let out = run(&["check", &f]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.starts_with(&f) && text.matches(CAUTION_WORDS).count() >= 2);
    assert!(text.contains("Verdict: ") && text.contains("Not checked (a competent person must):"));
}

#[test]
fn unknown_case_is_an_input_error() {
    let f = scenarios()[0].display().to_string();
    let out = run(&["check", "--case", "nope", &f]);
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("no such case"));
}

// one sling hung from an anchor, a static and a sudden case (shared with the other CLI tests)
const GOOD: &str = include_str!("fixtures/single-sling.ron");

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
    assert!(v["scope"]["not_checked"].as_array().is_some_and(|a| !a.is_empty()), "simulate carries the scope");
    let members = v["members"].as_array().expect("members");
    assert_eq!(members.len(), 3);
    assert!(members.iter().all(|m| m["peak_force_n"].as_f64().is_some_and(|f| f > 0.0)));
    assert!(v["period_s"].as_f64().is_some_and(|p| p > 0.5), "{v}");
    let out =
        run(&["simulate", gantry.to_str().expect("p"), "--case", "swing-25", "--duration", "0.2 s", "--format", "csv"]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.lines().next().expect("caution").contains(CAUTION_WORDS));
    assert!(text.lines().any(|l| l.starts_with("# not checked: ")), "the scope as comment lines");
    let header = text.lines().find(|l| !l.starts_with('#')).expect("header");
    assert!(header.starts_with("time_s,hoist-west_force_n"), "{header}");
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

/// A jib whose level strut is given without a section: the check cannot
/// cover its buckling, so `check` says unchecked and exits 1, never 0.
#[test]
fn strut_without_section_is_unchecked_and_exits_1() {
    let jib = |strut: &str| {
        format!(
            r#"Scenario(format: 1, title: "jib",
    nodes: [ Node(id: "W0", at: ("0 m", "0 m"), support: Anchor), Node(id: "W1", at: ("0 m", "2.6 m"), support: Anchor),
             Node(id: "T", at: ("2.6 m", "0 m")) ],
    members: [ Member(id: "strut", ends: ("W0", "T"), kind: Rod, {strut}, material: "steel", rating: Yield("235 MPa")),
               Member(id: "tie", ends: ("W1", "T"), kind: WireRope, area: "200 mm^2", modulus: "100 GPa",
                      rating: BreakingStrength("2000 kN"), termination: PouredSocket) ],
    masses: [ Mass(id: "load", at: "T", mass: "200 kg") ],
    cases: [ Static(id: "s") ])"#
        )
    };
    let f = tmp_file("jib-no-section.ron", &jib(r#"area: "453 mm^2""#));
    let out = run(&["check", "--format", "json", f.to_str().expect("path")]);
    assert_eq!(out.status.code(), Some(1), "{}", String::from_utf8_lossy(&out.stderr));
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("json");
    assert_eq!(v["verdict"], "unchecked");
    let strut = &v["cases"][0]["members"][0];
    assert_eq!(strut["state"], "unchecked");
    assert!(strut["reason"].as_str().expect("reason").contains("section unknown"));
    assert!(strut["euler_n"].is_null() && strut["buckling_resistance_n"].is_null());
    // with its section it is checked: CHS 48.3 x 3.2, N_cr 35.52 kN by hand
    // (see struts_and_defaults.rs), within at 200 kg, exit 0
    let f = tmp_file("jib-section.ron", &jib(r#"section: Tube(outer: "48.3 mm", wall: "3.2 mm")"#));
    let out = run(&["check", "--format", "json", f.to_str().expect("path")]);
    assert_eq!(out.status.code(), Some(0));
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("json");
    let n = v["cases"][0]["members"][0]["euler_n"].as_f64().expect("euler_n");
    assert!(((n - 35.52e3) / 35.52e3).abs() < 5e-3, "{n}");
    assert!(v["cases"][0]["members"][0]["buckling_resistance_n"].as_f64().is_some());
}

/// A two-leg choker sling from two anchors 2 m apart to the load 2 m below
/// them: legs atan(2/1) = 63.43 deg from horizontal. By statics each leg
/// carries W / (2 sin 63.43 deg) = 9806.65 / 1.78885 = 5482.1 N for 1000 kg.
/// Each leg: MBS 100 kN x ferrule 0.90 (EN 13414-1, from memory) / 5
/// (ASME B30.9) = 18 kN x choke 0.8 (EN 13414-1 mode factor, from memory)
/// = 14.4 kN; under `rules: ASME` with a 90 deg choke angle x 0.87 (ASME
/// B30.9, from memory) = 12.528 kN. Tolerances: 1e-9 on the allowable
/// (table arithmetic), 1 % on the force (large-displacement solve; the legs
/// stretch 5e-4).
#[test]
fn choker_sling_in_json_carries_its_mode_factor() {
    let rig = |head: &str, hitch: &str| {
        let leg = |id: &str, from: &str| {
            format!(
                r#"Member(id: "{id}", ends: ("{from}", "M"), kind: WireRope, area: "100 mm^2", modulus: "100 GPa",
                      rating: BreakingStrength("100 kN"), termination: FerruleSecured, linear_mass: "0 kg/m", {hitch})"#
            )
        };
        format!(
            r#"Scenario(format: 1, title: "two-leg choker", {head}
    nodes: [ Node(id: "A", at: ("-1 m", "4 m"), support: Anchor), Node(id: "B", at: ("1 m", "4 m"), support: Anchor),
             Node(id: "M", at: ("0 m", "2 m")) ],
    members: [ {}, {} ],
    masses: [ Mass(id: "load", at: "M", mass: "1000 kg") ],
    cases: [ Static(id: "s") ])"#,
            leg("west", "A"),
            leg("east", "B")
        )
    };
    for (head, hitch, allowable, mode) in [
        ("", "hitch: Choker", 14.4e3, 0.8),
        ("rules: ASME,", r#"hitch: Choker, choke_angle: "90 deg""#, 12.528e3, 0.8 * 0.87),
    ] {
        let f = tmp_file("choker.ron", &rig(head, hitch));
        let out = run(&["check", "--format", "json", f.to_str().expect("path")]);
        assert_eq!(out.status.code(), Some(0), "{}", String::from_utf8_lossy(&out.stderr));
        let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("json");
        for m in v["cases"][0]["members"].as_array().expect("members") {
            let a = m["allowable_n"].as_f64().expect("allowable");
            assert!(((a - allowable) / allowable).abs() < 1e-9, "{head} {a}");
            let got = m["mode_factor"].as_f64().expect("mode_factor");
            assert!((got - mode).abs() < 1e-12, "{got}");
            let force = m["force_n"].as_f64().expect("force");
            assert!(((force - 5482.1) / 5482.1).abs() < 1e-2, "{force}");
        }
        assert!(
            v["scope"]["checked"]
                .as_array()
                .expect("checked")
                .iter()
                .any(|c| c.as_str().is_some_and(|s| s.contains("sling hitches"))),
            "{}",
            v["scope"]
        );
    }
    // under ASME a choker without its angle is refused, located, exit 2
    let f = tmp_file("choker-no-angle.ron", &rig("rules: ASME,", "hitch: Choker"));
    let out = run(&["check", "--format", "json", f.to_str().expect("path")]);
    assert_eq!(out.status.code(), Some(2));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains("members[0].choke_angle") && err.contains("choke_angle"), "{err}");
}
