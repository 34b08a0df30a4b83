//! `assets/tautspan.desktop` parses as a desktop entry (Desktop Entry
//! Specification 1.5: a `[Desktop Entry]` group of `Key=Value` lines) with
//! the keys a launcher needs, and its icon is in `assets/`.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "tests fail loudly")]

use std::collections::HashMap;
use std::path::Path;

fn entry() -> HashMap<String, String> {
    let text = std::fs::read_to_string(Path::new(env!("CARGO_MANIFEST_DIR")).join("assets/tautspan.desktop"))
        .expect("assets/tautspan.desktop");
    let mut group = None;
    let mut keys = HashMap::new();
    for (n, line) in text.lines().enumerate() {
        let line = line.trim_end();
        if line.is_empty() || line.starts_with('#') {
            continue;
        }
        if let Some(g) = line.strip_prefix('[').and_then(|l| l.strip_suffix(']')) {
            group = Some(g.to_string());
            continue;
        }
        let (k, v) = line.split_once('=').unwrap_or_else(|| panic!("line {}: not Key=Value: {line}", n + 1));
        assert!(
            k.chars().all(|c| c.is_ascii_alphanumeric() || c == '-'),
            "line {}: key `{k}` has characters the specification does not allow",
            n + 1
        );
        assert_eq!(group.as_deref(), Some("Desktop Entry"), "line {}: key outside [Desktop Entry]", n + 1);
        assert!(keys.insert(k.to_string(), v.to_string()).is_none(), "key {k} given twice");
    }
    keys
}

#[test]
fn desktop_entry_has_the_required_keys() {
    let e = entry();
    assert_eq!(e["Type"], "Application");
    assert_eq!(e["Name"], "Tautspan");
    // Exec runs the installed binary with at most one file (%f)
    let exec: Vec<&str> = e["Exec"].split_whitespace().collect();
    assert_eq!(exec[0], env!("CARGO_PKG_NAME"));
    assert!(exec[1..].iter().all(|a| *a == "%f"), "{exec:?}");
    assert_eq!(e["Terminal"], "false");
    // the icon is named without extension and shipped beside the entry
    assert_eq!(e["Icon"], "tautspan");
    let svg = std::fs::read_to_string(Path::new(env!("CARGO_MANIFEST_DIR")).join("assets/tautspan.svg")).expect("icon");
    assert!(svg.starts_with("<svg") && svg.contains("viewBox=\"0 0 64 64\"") && svg.trim_end().ends_with("</svg>"));
    // categories end with ';' as the specification's lists do
    assert!(e["Categories"].ends_with(';'));
}
