//! `schemas/check.schema.json` against the `check --format json` output of
//! every example in `scenarios/`, one file at a time and all together.
//!
//! The validator is a small one written here (not the `jsonschema` crate,
//! whose dependency tree is larger than this check needs): it applies the
//! keywords the schema uses — `type`, `enum`, `required`, `properties`,
//! `items`, `minItems`, `maxItems`, `minimum`, `minLength`, `oneOf` and
//! local `$ref` — and fails on any other keyword, so the schema cannot grow
//! a keyword this test silently skips. By hand, the schema and the examples'
//! output were also checked with Python's `jsonschema` 4.26 (Draft 2020-12)
//! when the schema was written.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use serde_json::Value;
use std::path::{Path, PathBuf};
use std::process::Command;

fn root() -> &'static Path {
    Path::new(env!("CARGO_MANIFEST_DIR"))
}

fn schema() -> Value {
    serde_json::from_str(&std::fs::read_to_string(root().join("schemas/check.schema.json")).expect("schema"))
        .expect("schema is JSON")
}

const KNOWN: &[&str] = &[
    "$schema",
    "$id",
    "$defs",
    "$ref",
    "title",
    "description",
    "type",
    "enum",
    "required",
    "properties",
    "items",
    "minItems",
    "maxItems",
    "minimum",
    "minLength",
    "oneOf",
];

fn type_ok(t: &str, v: &Value) -> bool {
    match t {
        "object" => v.is_object(),
        "array" => v.is_array(),
        "string" => v.is_string(),
        "number" => v.is_number(),
        "integer" => v.is_u64() || v.is_i64(),
        "boolean" => v.is_boolean(),
        "null" => v.is_null(),
        other => panic!("unknown type {other}"),
    }
}

/// Errors of `v` against `s`, each with its JSON pointer.
fn validate(root: &Value, s: &Value, v: &Value, at: &str, errs: &mut Vec<String>) {
    let obj = s.as_object().expect("a schema is an object");
    for k in obj.keys() {
        assert!(KNOWN.contains(&k.as_str()), "the schema uses `{k}`, which this validator does not apply");
    }
    if let Some(r) = obj.get("$ref").and_then(Value::as_str) {
        let name = r.strip_prefix("#/$defs/").expect("local refs only");
        validate(root, &root["$defs"][name], v, at, errs);
    }
    if let Some(t) = obj.get("type") {
        let ok = match t {
            Value::String(t) => type_ok(t, v),
            Value::Array(ts) => ts.iter().any(|t| type_ok(t.as_str().expect("type name"), v)),
            _ => panic!("bad type"),
        };
        if !ok {
            errs.push(format!("{at}: {v} is not of type {t}"));
            return;
        }
    }
    if let Some(e) = obj.get("enum").and_then(Value::as_array)
        && !e.contains(v)
    {
        errs.push(format!("{at}: {v} not one of {e:?}"));
    }
    if let (Some(min), Some(x)) = (obj.get("minimum").and_then(Value::as_f64), v.as_f64())
        && x < min
    {
        errs.push(format!("{at}: {x} < {min}"));
    }
    if let (Some(min), Some(x)) = (obj.get("minLength").and_then(Value::as_u64), v.as_str())
        && (x.chars().count() as u64) < min
    {
        errs.push(format!("{at}: shorter than {min}"));
    }
    if let Some(o) = v.as_object() {
        for r in obj.get("required").and_then(Value::as_array).into_iter().flatten() {
            let r = r.as_str().expect("name");
            if !o.contains_key(r) {
                errs.push(format!("{at}: required field `{r}` missing"));
            }
        }
        // fields not listed are allowed: the output may grow
        for (k, ps) in obj.get("properties").and_then(Value::as_object).into_iter().flatten() {
            if let Some(x) = o.get(k) {
                validate(root, ps, x, &format!("{at}/{k}"), errs);
            }
        }
    }
    if let Some(a) = v.as_array() {
        if let Some(n) = obj.get("minItems").and_then(Value::as_u64)
            && (a.len() as u64) < n
        {
            errs.push(format!("{at}: fewer than {n} items"));
        }
        if let Some(n) = obj.get("maxItems").and_then(Value::as_u64)
            && (a.len() as u64) > n
        {
            errs.push(format!("{at}: more than {n} items"));
        }
        if let Some(items) = obj.get("items") {
            for (i, x) in a.iter().enumerate() {
                validate(root, items, x, &format!("{at}/{i}"), errs);
            }
        }
    }
    if let Some(one) = obj.get("oneOf").and_then(Value::as_array) {
        let mut why = Vec::new();
        let passing = one
            .iter()
            .filter(|s| {
                let mut e = Vec::new();
                validate(root, s, v, at, &mut e);
                why.extend(e.iter().filter(|m| !m.contains("is not of type")).cloned());
                e.is_empty()
            })
            .count();
        if passing != 1 {
            errs.push(format!("{at}: matches {passing} of oneOf, not exactly one"));
            errs.extend(why);
        }
    }
}

fn errors(v: &Value) -> Vec<String> {
    let s = schema();
    let mut errs = Vec::new();
    validate(&s, &s, v, "", &mut errs);
    errs
}

fn examples() -> Vec<PathBuf> {
    let mut v: Vec<PathBuf> = std::fs::read_dir(root().join("scenarios"))
        .expect("scenarios/")
        .map(|e| e.expect("entry").path())
        .filter(|p| p.extension().is_some_and(|e| e == "ron"))
        .collect();
    v.sort();
    v
}

fn check_json(files: &[PathBuf]) -> Value {
    let out = Command::new(env!("CARGO_BIN_EXE_tautspan"))
        .args(["check", "--format", "json"])
        .args(files)
        .output()
        .expect("run tautspan");
    assert!(matches!(out.status.code(), Some(0 | 1)), "{}", String::from_utf8_lossy(&out.stderr));
    serde_json::from_slice(&out.stdout).expect("JSON")
}

#[test]
fn every_example_output_follows_the_schema() {
    let files = examples();
    assert!(files.len() >= 3);
    for f in &files {
        let v = check_json(std::slice::from_ref(f));
        let e = errors(&v);
        assert!(e.is_empty(), "{}: {e:#?}", f.display());
    }
    // several files: an array of the same objects
    let all = check_json(&files);
    assert_eq!(all.as_array().map(Vec::len), Some(files.len()));
    let e = errors(&all);
    assert!(e.is_empty(), "{e:#?}");
}

#[test]
fn the_schema_requires_the_contract_and_allows_growth() {
    let s = schema();
    let req = |def: &str| -> Vec<String> {
        s["$defs"][def]["required"]
            .as_array()
            .expect(def)
            .iter()
            .map(|x| x.as_str().expect("name").to_string())
            .collect()
    };
    // the contracted fields of DESIGN.md and the README are required
    for f in ["file", "title", "caution", "verdict", "scope", "cases"] {
        assert!(req("file").contains(&f.to_string()), "file.{f}");
    }
    for f in ["id", "kind", "converged", "members", "floors", "nodes", "supports", "load_path", "limits", "warnings"] {
        assert!(req("case").contains(&f.to_string()), "case.{f}");
    }
    for f in ["id", "force_n", "allowable_n", "utilisation", "state", "stretch_m"] {
        assert!(req("member").contains(&f.to_string()), "member.{f}");
    }
    // no object closes itself to new fields
    assert!(!serde_json::to_string(&s).expect("text").contains("additionalProperties"));
    let v = check_json(&examples()[..1]);
    // a new field anywhere passes
    let mut grown = v.clone();
    grown["cases"][0]["members"][0]["new_field"] = Value::from(1.0);
    grown["future"] = Value::from("x");
    assert!(errors(&grown).is_empty());
    // a missing contracted field, a wrong type and an unknown state fail: the validator is not blind
    let mut missing = v.clone();
    missing["cases"][0]["members"][0].as_object_mut().expect("member").remove("force_n");
    assert!(errors(&missing).iter().any(|e| e.contains("force_n")), "{:?}", errors(&missing));
    let mut wrong = v.clone();
    wrong["cases"][0]["converged"] = Value::from("yes");
    assert!(!errors(&wrong).is_empty());
    let mut state = v;
    state["cases"][0]["members"][0]["state"] = Value::from("fine");
    assert!(!errors(&state).is_empty());
}
