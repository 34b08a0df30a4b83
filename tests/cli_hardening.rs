//! End-to-end tests of the binary against hostile input and failing
//! writes: caps, devices and pipes, writing over the input, cancelled and
//! coarse simulations, located messages.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use std::path::{Path, PathBuf};
use std::process::{Command, Output};

fn bin() -> Command {
    Command::new(env!("CARGO_BIN_EXE_tautspan"))
}

fn run(args: &[&str]) -> Output {
    bin().args(args).output().expect("run tautspan")
}

fn dir(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("tautspan-hard-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).expect("tmp dir");
    d
}

fn stderr(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

fn names(d: &Path) -> Vec<String> {
    let mut v: Vec<String> = std::fs::read_dir(d)
        .expect("dir")
        .map(|e| e.expect("entry").file_name().to_string_lossy().into_owned())
        .collect();
    v.sort();
    v
}

// one sling hung from an anchor, a static and a sudden case (shared with the other CLI tests)
const GOOD: &str = include_str!("fixtures/single-sling.ron");

#[test]
fn dev_zero_stops_at_the_cap_while_reading() {
    let out = run(&["check", "/dev/zero"]);
    assert_eq!(out.status.code(), Some(2), "{}", stderr(&out));
    assert!(stderr(&out).contains("cap of 16 MiB"), "{}", stderr(&out));
}

#[test]
fn a_pipe_is_read_under_the_cap() {
    use std::io::Write;
    let mut child = bin()
        .args(["check", "/dev/stdin"])
        .stdin(std::process::Stdio::piped())
        .stdout(std::process::Stdio::piped())
        .stderr(std::process::Stdio::piped())
        .spawn()
        .expect("spawn");
    let mut stdin = child.stdin.take().expect("stdin");
    // 17 MiB offered; the reader stops after 16 MiB + 1 and closes the pipe
    let writer = std::thread::spawn(move || {
        let chunk = vec![b' '; 1 << 20];
        for _ in 0..17 {
            if stdin.write_all(&chunk).is_err() {
                break;
            }
        }
    });
    let out = child.wait_with_output().expect("wait");
    writer.join().expect("writer");
    assert_eq!(out.status.code(), Some(2), "{}", stderr(&out));
    assert!(stderr(&out).contains("cap of 16 MiB"), "{}", stderr(&out));
}

#[test]
fn report_refuses_the_input_a_device_and_a_missing_folder() {
    let d = dir("report");
    let input = d.join("same.ron");
    std::fs::write(&input, GOOD).expect("write");
    let i = input.to_str().expect("p");
    // the same file, also by another spelling
    for out_name in [i.to_string(), d.join(".").join("same.ron").display().to_string()] {
        let out = run(&["report", i, "--out", &out_name]);
        assert_eq!(out.status.code(), Some(2), "{}", stderr(&out));
        assert!(stderr(&out).contains("input scenario"), "{}", stderr(&out));
        assert_eq!(std::fs::read_to_string(&input).expect("input"), GOOD, "the scenario is untouched");
    }
    // a device node is not replaced
    let out = run(&["report", i, "--out", "/dev/full"]);
    assert_eq!(out.status.code(), Some(2), "{}", stderr(&out));
    assert!(stderr(&out).contains("not a regular file"), "{}", stderr(&out));
    assert!(!Path::new("/dev/full").is_file(), "/dev/full is still a device");
    // a missing folder is named
    let missing = d.join("nowhere").join("r.html");
    let out = run(&["report", i, "--out", missing.to_str().expect("p")]);
    assert_eq!(out.status.code(), Some(2));
    assert!(stderr(&out).contains("does not exist"), "{}", stderr(&out));
    assert_eq!(names(&d), vec!["same.ron".to_string()], "nothing left behind");
}

#[test]
fn report_into_a_read_only_folder_keeps_the_old_file() {
    use std::os::unix::fs::PermissionsExt;
    let d = dir("readonly");
    let input = d.join("rig.ron");
    std::fs::write(&input, GOOD).expect("write");
    let ro = d.join("ro");
    std::fs::create_dir(&ro).expect("mkdir");
    let old = ro.join("r.html");
    std::fs::write(&old, "old report").expect("write");
    std::fs::set_permissions(&ro, std::fs::Permissions::from_mode(0o555)).expect("chmod");
    // root writes anywhere: then the folder is not read-only to this test
    let probe = ro.join("probe");
    let root = std::fs::write(&probe, "").is_ok();
    let _ = std::fs::remove_file(&probe);
    let out = run(&["report", input.to_str().expect("p"), "--out", old.to_str().expect("p")]);
    std::fs::set_permissions(&ro, std::fs::Permissions::from_mode(0o755)).expect("chmod back");
    if root {
        eprintln!("running as root: a read-only folder cannot be made; the in-process fault test covers the failure");
        assert!(matches!(out.status.code(), Some(0 | 1)), "{}", stderr(&out));
        return;
    }
    assert_eq!(out.status.code(), Some(2), "{}", stderr(&out));
    assert!(stderr(&out).contains("cannot create a temporary file"), "{}", stderr(&out));
    assert_eq!(std::fs::read_to_string(&old).expect("old"), "old report");
    assert_eq!(names(&ro), vec!["r.html".to_string()]);
}

fn gantry() -> String {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("scenarios/gantry-swing.ron").display().to_string()
}

#[test]
fn simulate_refuses_a_negative_step_and_a_billion_steps_with_messages() {
    let g = gantry();
    let out = run(&["simulate", &g, "--case", "swing-25", "--step", "-1 ms"]);
    assert_eq!(out.status.code(), Some(2), "{}", stderr(&out));
    assert!(stderr(&out).contains("--step \"-1 ms\": must be positive"), "{}", stderr(&out));
    let out = run(&["simulate", &g, "--case", "swing-25", "--duration", "-2 s"]);
    assert_eq!(out.status.code(), Some(2));
    assert!(stderr(&out).contains("must be positive"), "{}", stderr(&out));
    // 10⁹ steps: refused at once, nothing allocated per step (the old run aborted out of memory)
    let out = run(&["simulate", &g, "--case", "swing-25", "--duration", "1 s", "--step", "1e-9 s"]);
    assert_eq!(out.status.code(), Some(2), "{}", stderr(&out));
    assert!(stderr(&out).contains("1,000,000,000 steps; the cap is 10,000,000 steps"), "{}", stderr(&out));
    assert!(out.stdout.is_empty());
}

#[test]
fn simulate_notes_a_coarse_step_in_json_and_csv() {
    let g = gantry();
    let out = run(&["simulate", &g, "--case", "swing-25", "--duration", "3 s", "--step", "0.5 s"]);
    assert_eq!(out.status.code(), Some(0), "{}", stderr(&out));
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("json");
    let w = v["warnings"].as_array().expect("warnings");
    assert!(w.len() == 1 && w[0].as_str().expect("text").contains("coarser than a tenth"), "{v}");
    assert!(v["shortest_period_s"].as_f64().is_some_and(|t| t > 0.0 && t < 0.5 * 10.0));
    let out = run(&["simulate", &g, "--case", "swing-25", "--duration", "3 s", "--step", "0.5 s", "--format", "csv"]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.lines().any(|l| l.starts_with("# warning: the time step 0.5 s is coarser")), "{text}");
    // the default step is not noted, and the CSV has one row a step (0 to 6 × 0.5 s)
    let rows = text.lines().filter(|l| !l.starts_with('#')).count();
    assert_eq!(rows, 1 + 7, "header and 7 rows");
    let out = run(&["simulate", &g, "--case", "swing-25", "--duration", "1 s"]);
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("json");
    assert_eq!(v["warnings"].as_array().map(Vec::len), Some(0), "{v}");
}

#[test]
fn simulate_stopped_by_ctrl_c_exits_130_with_the_run_so_far() {
    use std::io::Read;
    let g = gantry();
    // a million steps: far longer than the test waits
    let mut child = bin()
        .args(["simulate", &g, "--case", "swing-25", "--duration", "10 s", "--step", "0.01 ms"])
        .stdout(std::process::Stdio::piped())
        .stderr(std::process::Stdio::piped())
        .spawn()
        .expect("spawn");
    let mut err = child.stderr.take().expect("stderr");
    // wait until the run reports progress, then interrupt it
    let mut seen = Vec::new();
    let mut buf = [0u8; 256];
    while !String::from_utf8_lossy(&seen).contains("simulating") {
        let n = err.read(&mut buf).expect("read stderr");
        assert!(n > 0, "stderr closed before progress: {}", String::from_utf8_lossy(&seen));
        seen.extend_from_slice(&buf[..n]);
    }
    let status = Command::new("kill").args(["-INT", &child.id().to_string()]).status().expect("kill");
    assert!(status.success());
    let mut rest = String::new();
    err.read_to_string(&mut rest).expect("stderr");
    let out = child.wait_with_output().expect("wait");
    assert_eq!(out.status.code(), Some(130), "{rest}");
    assert!(rest.contains("interrupted"), "{rest}");
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("json");
    assert_eq!(v["cancelled"], true);
    assert!(v["steps"].as_u64().is_some_and(|s| s < 1_000_000), "{v}");
}

fn check_text(name: &str, text: &str, extra: &[&str]) -> Output {
    let d = dir(name);
    let p = d.join(format!("{name}.ron"));
    std::fs::write(&p, text).expect("write");
    let mut args = vec!["check"];
    args.extend_from_slice(extra);
    let ps = p.display().to_string();
    args.push(&ps);
    run(&args)
}

#[test]
fn messages_name_the_place_and_the_bound() {
    let floor = GOOD.replace(
        "    masses:",
        r#"    floors: [ Floor(id: "slab", span: ("4 m", "4 m"), thickness: "150 mm", modulus: "30 GPa", poisson: 0.5, edges: SimplySupported, rated_point: "9 kN") ],
    masses:"#,
    );
    let table: &[(&str, String, &str)] = &[
        // a missing title at the Scenario's opening (line 1), not at another field
        ("no-title", GOOD.replace("    title: \"e2e\",\n", ""), ":1:1: title: missing field `title` in Scenario"),
        ("no-format", GOOD.replace("    format: 1,\n", ""), ":1:1: format: missing field `format` in Scenario"),
        ("no-id", GOOD.replace(r#"Node(id: "J1", "#, "Node("), ":6:9: nodes[1].id: missing field `id` in Node"),
        ("poisson", floor, "Poisson's ratio ν must satisfy 0 ≤ ν < 0.5"),
        (
            "diameter",
            GOOD.replace(r#"area: "64.7 mm^2""#, r#"diameter: "10 m", construction: "6x19 IWRC""#),
            "members[0].diameter: a wire rope of 10000 mm diameter is outside the plausible 0.5–200 mm",
        ),
        (
            "id-clash",
            GOOD.replace(r#"Member(id: "sling""#, r#"Member(id: "J1""#),
            "members[0].id: member id \"J1\" is already the id of a node (nodes[1])",
        ),
        (
            "nesting",
            GOOD.replace("title: \"e2e\",", &format!("title: \"e2e\", notes: {}", "[".repeat(100_000))),
            "brackets nested more than 32 deep",
        ),
    ];
    for (name, text, needle) in table {
        let out = check_text(name, text, &[]);
        assert_eq!(out.status.code(), Some(2), "{name}: {}", stderr(&out));
        assert!(stderr(&out).contains(needle), "{name}: {}", stderr(&out));
        assert!(!stderr(&out).contains("panicked"), "{name}");
    }
}

#[test]
fn caps_are_named_with_the_count() {
    // the case cap (1,000) is the cheapest to pass; every cap shares the check and its wording
    let mut cases = String::new();
    for i in 0..1_001 {
        cases.push_str(&format!("Static(id: \"c{i}\"),"));
    }
    let text = GOOD.replace(
        r#"cases: [ Static(id: "hanging"), Sudden(id: "sudden", mass: "load") ],"#,
        &format!("cases: [{cases}],"),
    );
    let out = check_text("caps", &text, &[]);
    assert_eq!(out.status.code(), Some(2), "{}", stderr(&out));
    assert!(stderr(&out).contains(":12:5: cases: 1,001 cases; the cap is 1,000 cases a scenario"), "{}", stderr(&out));
}

#[test]
fn json_of_several_files_stays_an_array_with_an_entry_for_the_bad_one() {
    let d = dir("array");
    let good = d.join("good.ron");
    let bad = d.join("bad.ron");
    std::fs::write(&good, GOOD).expect("write");
    std::fs::write(&bad, GOOD.replace(r#"at: "J1", mass"#, r#"at: "J9", mass"#)).expect("write");
    let (g, b) = (good.display().to_string(), bad.display().to_string());
    for files in [vec![g.as_str(), b.as_str()], vec![b.as_str(), g.as_str()]] {
        let mut args = vec!["check", "--format", "json"];
        args.extend(&files);
        let out = run(&args);
        assert_eq!(out.status.code(), Some(2));
        let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("valid JSON");
        let arr = v.as_array().expect("an array for several files");
        assert_eq!(arr.len(), 2);
        let e = arr.iter().find(|f| f["file"] == b.as_str()).expect("the bad file's entry");
        assert_eq!(e["verdict"], "input_error");
        assert_eq!(e["errors"][0]["field"], "masses[0].at");
        assert_eq!(e["errors"][0]["line"], 11);
        assert!(e["caution"].is_string());
        assert!(arr.iter().any(|f| f["file"] == g.as_str() && f["cases"].is_array()));
    }
    // one bad file alone: one object, the same entry
    let out = run(&["check", "--format", "json", &b]);
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("valid JSON");
    assert_eq!(v["verdict"], "input_error");
}
