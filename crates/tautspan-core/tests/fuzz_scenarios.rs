//! Structure-aware fuzzing of the whole pipeline a file goes through:
//! text → parse → validate → analyse → text, JSON, CSV and the HTML report.
//!
//! Each case starts from one of the valid examples in `scenarios/` and
//! applies one to four mutations that know the scenario grammar: the number
//! or the unit of a quantity string, an id, a bare number, an enum variant,
//! a list element duplicated (many times) or dropped, a field dropped, a
//! value nested deep in brackets, a span cut out. A bug is
//!
//! - a panic anywhere in the pipeline;
//! - a non-finite number in the output of a file that was accepted: a
//!   solved case's member forces, stretches, node positions, reactions and
//!   residual, and the words `NaN` / `inf` in the text, CSV or report (JSON
//!   writes `null`, and must parse);
//! - a run over [`TIME_LIMIT`] for one case (the examples are small files).
//!   The limit holds in release builds; an unoptimised build gets
//!   [`DEBUG_SLACK`] times it, since only the speed of the code differs.
//!
//! `cargo test` runs [`CI_CASES`] cases from a fixed seed (proptest shrinks
//! a failure to a minimal mutation list). The big run is by hand:
//! `TAUTSPAN_FUZZ_CASES=1000000 TAUTSPAN_FUZZ_THREADS=2 cargo test --release
//! -p tautspan-core --test fuzz_scenarios -- --nocapture`; it does not stop at
//! the first finding but writes every distinct one (kind and first line of
//! the message) with its input to `target/fuzz-findings/`.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "a test harness fails loudly")]

use proptest::prelude::*;
use proptest::strategy::ValueTree;
use proptest::test_runner::{Config, RngAlgorithm, TestCaseError, TestRng, TestRunner};
use std::collections::BTreeMap;
use std::panic::{AssertUnwindSafe, catch_unwind};
use std::path::PathBuf;
use std::sync::atomic::{AtomicU64, Ordering};
use std::sync::{Arc, Mutex};
use std::time::{Duration, Instant};
use tautspan_core::analysis::{Analysis, analyse};
use tautspan_core::model::load_scenario;
use tautspan_core::output::{check_text, write_check_json, write_csv_rows};
use tautspan_core::report::{UnitSystem, html_with_units};

/// Cases of the seeded run every `cargo test` makes.
const CI_CASES: u32 = 300;
/// The fixed seed of that run (any 32 bytes; kept so a failure repeats).
const SEED: [u8; 32] = *b"tautspan fuzz: seeded, repeated.";
/// The longest one case may take in a release build.
const TIME_LIMIT: Duration = Duration::from_secs(1);
/// An unoptimised build (the core at opt-level 0) runs the same work this
/// many times slower; measured on the examples at about 10x, doubled.
const DEBUG_SLACK: u32 = 20;

fn time_limit() -> Duration {
    if cfg!(debug_assertions) { TIME_LIMIT * DEBUG_SLACK } else { TIME_LIMIT }
}

fn examples() -> Vec<(String, String)> {
    let dir = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("../../scenarios");
    let mut v: Vec<(String, String)> = std::fs::read_dir(&dir)
        .expect("scenarios/")
        .map(|e| e.expect("entry").path())
        .filter(|p| p.extension().is_some_and(|e| e == "ron"))
        .map(|p| {
            let name = p.file_name().expect("name").to_string_lossy().into_owned();
            (name, std::fs::read_to_string(&p).expect("read example"))
        })
        .collect();
    v.sort();
    assert!(v.len() >= 3, "the examples are the fuzzer's seeds");
    v
}

// ---------------------------------------------------------------- lexing

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Tok {
    /// A string literal, quotes included.
    Str,
    /// A bare number.
    Num,
    /// An identifier (field name, struct or enum variant).
    Ident,
    /// `[`, `]`, `(`, `)`, `,`, `:`.
    Punct(u8),
}

/// The tokens of RON text with their byte spans; comments and blanks skipped.
fn lex(text: &str) -> Vec<(Tok, usize, usize)> {
    let b = text.as_bytes();
    let mut out = Vec::new();
    let mut i = 0;
    while i < b.len() {
        let c = b[i];
        if c == b'/' && b.get(i + 1) == Some(&b'/') {
            while i < b.len() && b[i] != b'\n' {
                i += 1;
            }
        } else if c == b'"' {
            let s = i;
            i += 1;
            while i < b.len() && b[i] != b'"' {
                i += if b[i] == b'\\' { 2 } else { 1 };
            }
            i = (i + 1).min(b.len());
            out.push((Tok::Str, s, i));
        } else if c.is_ascii_digit() || (c == b'-' && b.get(i + 1).is_some_and(u8::is_ascii_digit)) {
            let s = i;
            i += 1;
            while i < b.len() && (b[i].is_ascii_alphanumeric() || matches!(b[i], b'.' | b'_' | b'+' | b'-')) {
                i += 1;
            }
            out.push((Tok::Num, s, i));
        } else if c.is_ascii_alphabetic() || c == b'_' {
            let s = i;
            while i < b.len() && (b[i].is_ascii_alphanumeric() || b[i] == b'_') {
                i += 1;
            }
            out.push((Tok::Ident, s, i));
        } else if b"[](),:".contains(&c) {
            out.push((Tok::Punct(c), i, i + 1));
            i += 1;
        } else {
            i += 1;
        }
    }
    out
}

/// The number of a quantity string (`"12 mm"` → span of `12`), if it is one.
fn quantity_parts(text: &str, s: usize, e: usize) -> Option<((usize, usize), (usize, usize))> {
    let inner = text.get(s + 1..e.checked_sub(1)?)?;
    let n = inner.find(' ')?;
    inner[..n].parse::<f64>().ok()?;
    let unit = inner[n + 1..].trim();
    (!unit.is_empty() && !unit.contains(' ')).then_some(((s + 1, s + 1 + n), (s + 2 + n, e - 1)))
}

/// The matching close of the bracket token at `open`.
fn close_of(toks: &[(Tok, usize, usize)], open: usize) -> Option<usize> {
    let mut depth = 0i32;
    for (k, t) in toks.iter().enumerate().skip(open) {
        match t.0 {
            Tok::Punct(b'[' | b'(') => depth += 1,
            Tok::Punct(b']' | b')') => {
                depth -= 1;
                if depth == 0 {
                    return Some(k);
                }
            }
            _ => {}
        }
    }
    None
}

/// The elements of the list or tuple opened at token `open`, as byte spans
/// (each up to, not including, its separating comma).
fn elements(text: &str, toks: &[(Tok, usize, usize)], open: usize) -> Vec<(usize, usize)> {
    let Some(close) = close_of(toks, open) else { return Vec::new() };
    let mut out = Vec::new();
    let mut depth = 0i32;
    let mut start = toks[open].2;
    for t in &toks[open + 1..close] {
        match t.0 {
            Tok::Punct(b'[' | b'(') => depth += 1,
            Tok::Punct(b']' | b')') => depth -= 1,
            Tok::Punct(b',') if depth == 0 => {
                out.push((start, t.1));
                start = t.2;
            }
            _ => {}
        }
    }
    if !text[start..toks[close].1].trim().is_empty() {
        out.push((start, toks[close].1));
    }
    out
}

// ------------------------------------------------------------- mutations

/// Numbers put where a number was: zero, signs, extremes, subnormals, the
/// non-finite words, and number shapes a reader may choke on.
const NUMBERS: &[&str] = &[
    "0",
    "-0",
    "-1",
    "1",
    "0.5",
    "2",
    "1e-300",
    "4.9e-324",
    "2.2e-308",
    "1e-9",
    "1e9",
    "1e300",
    "1.7976931348623157e308",
    "1e309",
    "-1e300",
    "NaN",
    "nan",
    "inf",
    "-inf",
    "1e",
    "1.",
    ".5",
    "0x10",
    "1_000",
    "99999999999999999999999999999999999999",
];

/// Units put in a quantity: every dimension (mostly the wrong one) and nonsense.
const UNITS: &[&str] = &[
    "m", "mm", "km", "in", "ft", "m^2", "mm^2", "in^2", "kg", "t", "lb", "N", "kN", "MN", "lbf", "kip", "tf", "Pa",
    "MPa", "GPa", "psi", "psf", "deg", "rad", "m/s^2", "s", "ms", "kg/m", "lb/ft", "", "furlong", "M", "KN", "mm2",
];

/// Words put where an enum variant or a field name was.
const WORDS: &[&str] = &[
    "Anchor",
    "Floor",
    "WireRope",
    "FibreRope",
    "Chain",
    "Rod",
    "Cable",
    "Static",
    "Swing",
    "Drop",
    "Sudden",
    "Choker",
    "Basket",
    "Straight",
    "Clamped",
    "SimplySupported",
    "Yield",
    "BreakingStrength",
    "WorkingLoadLimit",
    "Tube",
    "SolidRound",
    "Sheave",
    "None",
    "Some",
    "true",
    "false",
    "id",
    "at",
    "ends",
    "mass",
    "nodes",
    "members",
    "cases",
    "revision",
];

/// One mutation, its choices drawn as plain numbers so that proptest can
/// shrink them.
#[derive(Debug, Clone)]
struct Mutation {
    what: u8,
    pick: usize,
    choice: usize,
    count: usize,
}

fn mutation() -> impl Strategy<Value = Mutation> {
    (0u8..13, any::<usize>(), any::<usize>(), 1usize..2000).prop_map(|(what, pick, choice, count)| Mutation {
        what,
        pick,
        choice,
        count,
    })
}

/// Replace byte span `s..e` of `text` by `by`.
fn splice(text: &str, s: usize, e: usize, by: &str) -> String {
    let mut out = String::with_capacity(text.len() + by.len());
    out.push_str(&text[..s]);
    out.push_str(by);
    out.push_str(&text[e..]);
    out
}

/// Apply one mutation; the text unchanged when nothing fits.
fn apply(text: &str, m: &Mutation) -> String {
    let toks = lex(text);
    let of = |kind: fn(&Tok) -> bool| -> Vec<(usize, usize)> {
        toks.iter().filter(|t| kind(&t.0)).map(|t| (t.1, t.2)).collect()
    };
    let pick = |v: &[(usize, usize)]| -> Option<(usize, usize)> { (!v.is_empty()).then(|| v[m.pick % v.len()]) };
    let strs = of(|t| *t == Tok::Str);
    let quantities: Vec<_> = strs.iter().filter_map(|&(s, e)| quantity_parts(text, s, e)).collect();
    match m.what {
        // the number of a quantity
        0 | 1 => match quantities.get(m.pick % quantities.len().max(1)) {
            Some(&((s, e), _)) => splice(text, s, e, NUMBERS[m.choice % NUMBERS.len()]),
            None => text.to_string(),
        },
        // the unit of a quantity
        2 => match quantities.get(m.pick % quantities.len().max(1)) {
            Some(&(_, (s, e))) => splice(text, s, e, UNITS[m.choice % UNITS.len()]),
            None => text.to_string(),
        },
        // a string (an id or a reference) becomes another string of the file,
        // an empty one, a long one or an unknown one
        3 => match pick(&strs) {
            Some((s, e)) => {
                let by = match m.choice % 4 {
                    0 => text[strs[m.choice / 4 % strs.len()].0..strs[m.choice / 4 % strs.len()].1].to_string(),
                    1 => "\"\"".to_string(),
                    2 => format!("\"{}\"", "x".repeat(m.count * 8)),
                    _ => "\"nowhere\"".to_string(),
                };
                splice(text, s, e, &by)
            }
            None => text.to_string(),
        },
        // a bare number (format, factors, axes)
        4 => match pick(&of(|t| *t == Tok::Num)) {
            Some((s, e)) => splice(text, s, e, NUMBERS[m.choice % NUMBERS.len()]),
            None => text.to_string(),
        },
        // an identifier: enum variant, struct or field name
        5 => match pick(&of(|t| *t == Tok::Ident)) {
            Some((s, e)) => splice(text, s, e, WORDS[m.choice % WORDS.len()]),
            None => text.to_string(),
        },
        // a list element duplicated `count` times (sizes; clashing ids)
        6 | 7 => {
            let lists: Vec<usize> =
                toks.iter().enumerate().filter(|(_, t)| t.0 == Tok::Punct(b'[')).map(|(k, _)| k).collect();
            let Some(&open) = lists.get(m.pick % lists.len().max(1)) else { return text.to_string() };
            let els = elements(text, &toks, open);
            let Some(&(s, e)) = els.get(m.choice % els.len().max(1)) else { return text.to_string() };
            let n = if m.what == 6 { m.count.min(200) } else { 1 };
            let item = format!(",{}", &text[s..e]);
            splice(text, e, e, &item.repeat(n))
        }
        // an element of a list or tuple dropped
        8 => {
            let opens: Vec<usize> = toks
                .iter()
                .enumerate()
                .filter(|(_, t)| matches!(t.0, Tok::Punct(b'[' | b'(')))
                .map(|(k, _)| k)
                .collect();
            let Some(&open) = opens.get(m.pick % opens.len().max(1)) else { return text.to_string() };
            let els = elements(text, &toks, open);
            let Some(&(s, e)) = els.get(m.choice % els.len().max(1)) else { return text.to_string() };
            // take the comma after it too, when there is one
            let e = if text[e..].starts_with(',') { e + 1 } else { e };
            splice(text, s, e, "")
        }
        // a value nested in brackets, shallow or very deep
        9 => match pick(&strs) {
            Some((s, e)) => {
                let depth = if m.choice.is_multiple_of(2) { 1 + m.count % 4 } else { m.count * 5 };
                let (o, c) = if m.choice.is_multiple_of(3) { ("(", ")") } else { ("[", "]") };
                splice(text, s, e, &format!("{}{}{}", o.repeat(depth), &text[s..e], c.repeat(depth)))
            }
            None => text.to_string(),
        },
        // a span of tokens cut out
        10 => {
            if toks.is_empty() {
                return text.to_string();
            }
            let a = m.pick % toks.len();
            let b = (a + 1 + m.choice % 6).min(toks.len() - 1);
            splice(text, toks[a].1, toks[b].1.max(toks[a].1), "")
        }
        // a quantity string given a second unit or a fraction or blank
        11 => match quantities.get(m.pick % quantities.len().max(1)) {
            Some(&(_, (_, e))) => {
                let by = [" m", "/2", " ", "\u{a0}", "^2", "e5"][m.choice % 6];
                splice(text, e, e, by)
            }
            None => text.to_string(),
        },
        // the text truncated or a byte inserted (the plain, unaware mutation)
        _ => {
            let at = m.pick % (text.len() + 1);
            let at = (0..=at).rev().find(|&k| text.is_char_boundary(k)).unwrap_or(0);
            if m.choice.is_multiple_of(2) {
                text[..at].to_string()
            } else {
                splice(text, at, at, ["\"", "(", "]", ",", "\u{0}", "é", "//"][m.choice % 7])
            }
        }
    }
}

// ----------------------------------------------------------------- checks

/// Every number of a solved case must be finite.
fn check_finite(a: &Analysis) -> Result<(), String> {
    for c in &a.cases {
        if c.error.is_some() {
            continue;
        }
        let bad = |what: &str, id: &str, v: f64| -> Result<(), String> {
            if v.is_finite() { Ok(()) } else { Err(format!("non-finite {what} {v} of {id} in case {}", c.id)) }
        };
        bad("residual", "the case", c.residual_n)?;
        for m in &c.members {
            bad("force_n", &m.id, m.force_n)?;
            bad("stretch_m", &m.id, m.stretch_m)?;
            bad("length_m", &m.id, m.length_m)?;
            if m.utilisation.is_nan() {
                return Err(format!("NaN utilisation of {} in case {}", m.id, c.id));
            }
        }
        for n in &c.nodes {
            for v in n.position_m {
                bad("position_m", &n.id, v)?;
            }
        }
        for s in &c.supports {
            for v in s.reaction_n {
                bad("reaction_n", &s.node, v)?;
            }
        }
        for f in &c.floors {
            bad("normal_force_n", &f.id, f.normal_force_n)?;
            bad("deflection_m", &f.id, f.deflection_m)?;
        }
    }
    Ok(())
}

/// The words a non-finite float prints as, standing alone in `out`.
fn non_finite_word(out: &str) -> Option<String> {
    out.lines().find_map(|line| {
        let w = line
            .split(|c: char| !(c.is_ascii_alphanumeric() || c == '.'))
            .find(|w| matches!(*w, "NaN" | "inf" | "Infinity" | "infinity"))?;
        // the word with the words before it on its line, so findings of
        // different causes are kept apart (the big run keys on the message)
        let at = line.find(w).unwrap_or(0);
        let before: String = line[..at].chars().rev().take(60).collect::<Vec<_>>().into_iter().rev().collect();
        Some(format!("{w}` after \"{}", before.trim()))
    })
}

/// The whole pipeline on one text; `Err` names the bug.
fn pipeline(text: &str) -> Result<(), String> {
    let Ok(loaded) = load_scenario(text) else { return Ok(()) };
    let a = analyse(&loaded.scenario);
    check_finite(&a)?;
    // a word the file's own ids hold (a case called "-inf t") is the
    // user's text, not a number gone wrong
    let ids: Vec<&str> = text.split("id: \"").skip(1).filter_map(|rest| rest.split('"').next()).collect();
    let own = |w: &String| {
        let word = w.split('`').next().unwrap_or_default();
        !ids.iter().any(|id| id.split(|c: char| !(c.is_ascii_alphanumeric() || c == '.')).any(|t| t == word))
    };
    let non_finite_word = |out: &str| non_finite_word(out).filter(own);
    let txt = check_text("fuzz.ron", &a);
    if let Some(w) = non_finite_word(&txt) {
        return Err(format!("`{w}\" in the text output"));
    }
    let mut json = Vec::new();
    write_check_json(&mut json, "fuzz.ron", &a).map_err(|e| format!("JSON write: {e}"))?;
    serde_json::from_slice::<serde_json::Value>(&json).map_err(|e| format!("JSON output does not parse: {e}"))?;
    let mut csv = Vec::new();
    write_csv_rows(&mut csv, "fuzz.ron", &a).map_err(|e| format!("CSV write: {e}"))?;
    if let Some(w) = non_finite_word(&String::from_utf8_lossy(&csv)) {
        return Err(format!("`{w}\" in the CSV output"));
    }
    // the report in one system or the other, by the text's length (half the cost of both)
    let units = if text.len().is_multiple_of(2) { UnitSystem::Si } else { UnitSystem::UsCustomary };
    let html = html_with_units(&loaded.scenario, &a, "2026-01-01", units);
    if let Some(w) = non_finite_word(&html) {
        return Err(format!("`{w}\" in the report ({})", units.name()));
    }
    Ok(())
}

/// A small file has the time limit as it is; a file the mutations made
/// large (deep nesting, lists duplicated) gets it per [`SMALL_FILE`] bytes.
const SMALL_FILE: usize = 64 * 1024;

/// Whether the text holds a quantity or bare number far outside anything a
/// rig has (|x| ≥ 1e15 or 0 < |x| ≤ 1e-15): the file's range checks should
/// refuse it (the plausible ranges and the magnitude guard of the model
/// do). The seeded run fails on every finding; with
/// `TAUTSPAN_FUZZ_STRICT=0` a non-finite or slow result from such a file is
/// only reported (panics always fail); the big run records all.
fn extreme_input(text: &str) -> bool {
    lex(text).iter().any(|&(t, s, e)| {
        let n = match t {
            Tok::Num => text[s..e].parse::<f64>().ok(),
            Tok::Str => quantity_parts(text, s, e).and_then(|((a, b), _)| text[a..b].parse::<f64>().ok()),
            _ => None,
        };
        n.is_some_and(|x| x.abs() >= 1e15 || (x != 0.0 && x.abs() <= 1e-15) || !x.is_finite())
    })
}

/// One case: the pipeline under a panic guard and a stopwatch.
fn run_case(text: &str) -> Result<(), String> {
    let t0 = Instant::now();
    let r = catch_unwind(AssertUnwindSafe(|| pipeline(text)));
    let took = t0.elapsed();
    match r {
        Err(p) => {
            let msg = p
                .downcast_ref::<String>()
                .cloned()
                .or_else(|| p.downcast_ref::<&str>().map(|s| (*s).to_string()))
                .unwrap_or_default();
            Err(format!("panic: {msg}"))
        }
        Ok(Err(e)) => Err(e),
        Ok(Ok(())) if took > time_limit() * (text.len() / SMALL_FILE + 1) as u32 => {
            Err(format!("slow: {took:?} (limit {:?} per {SMALL_FILE} bytes, {} bytes)", time_limit(), text.len()))
        }
        Ok(Ok(())) => Ok(()),
    }
}

fn mutated(bases: &[(String, String)], base: usize, muts: &[Mutation]) -> (String, String) {
    let (name, text) = &bases[base % bases.len()];
    let mut t = text.clone();
    for m in muts {
        t = apply(&t, m);
    }
    (name.clone(), t)
}

fn strategy() -> impl Strategy<Value = (usize, Vec<Mutation>)> {
    (any::<usize>(), proptest::collection::vec(mutation(), 1..=4))
}

/// The seeded run of every `cargo test`: a finding fails the test, shrunk.
#[test]
fn mutated_examples_never_panic_hang_or_print_non_finite() {
    if std::env::var("TAUTSPAN_FUZZ_CASES").is_ok() {
        return big_run();
    }
    let bases = examples();
    let config = Config { cases: CI_CASES, failure_persistence: None, ..Config::default() };
    let mut runner = TestRunner::new_with_rng(config, TestRng::from_seed(RngAlgorithm::ChaCha, &SEED));
    // panics are caught and reported as findings; keep their noise off the log
    let hook = std::panic::take_hook();
    std::panic::set_hook(Box::new(|_| {}));
    // every finding fails now that the range checks refuse out-of-range
    // input; `TAUTSPAN_FUZZ_STRICT=0` only reports those on extreme input
    let strict = !std::env::var("TAUTSPAN_FUZZ_STRICT").is_ok_and(|v| v == "0");
    let known = Mutex::new(Vec::new());
    let result = runner.run(&strategy(), |(base, muts)| {
        let (name, text) = mutated(&bases, base, &muts);
        match run_case(&text) {
            Err(e) if !strict && !e.starts_with("panic") && extreme_input(&text) => {
                known.lock().expect("lock").push(e);
                Ok(())
            }
            r => r.map_err(|e| TestCaseError::fail(format!("{e}\nfrom {name}, input:\n{text}"))),
        }
    });
    std::panic::set_hook(hook);
    let known = known.into_inner().expect("lock");
    if !known.is_empty() {
        eprintln!("{} known findings on out-of-range input (range checks pending; fuzz_regressions/):", known.len());
        for e in &known {
            eprintln!("  {e}");
        }
    }
    if let Err(e) = result {
        panic!("{e}");
    }
}

/// The big run by hand: `TAUTSPAN_FUZZ_CASES` cases over
/// `TAUTSPAN_FUZZ_THREADS` threads (default 1), each thread its own seed
/// (changed by `TAUTSPAN_FUZZ_SALT`, 0 to 255, for cases not run before);
/// every distinct finding is written to `target/fuzz-findings/`.
fn big_run() {
    let cases: u64 = std::env::var("TAUTSPAN_FUZZ_CASES").ok().and_then(|v| v.parse().ok()).unwrap_or(0);
    let threads: u64 = std::env::var("TAUTSPAN_FUZZ_THREADS").ok().and_then(|v| v.parse().ok()).unwrap_or(1).max(1);
    // a run of new cases rather than a repeat of the last: `TAUTSPAN_FUZZ_SALT`
    let salt: u8 = std::env::var("TAUTSPAN_FUZZ_SALT").ok().and_then(|v| v.parse().ok()).unwrap_or(0);
    let bases = Arc::new(examples());
    let out_dir = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("../../target/fuzz-findings");
    std::fs::create_dir_all(&out_dir).expect("findings folder");
    let findings: Arc<Mutex<BTreeMap<String, usize>>> = Arc::default();
    let done = Arc::new(AtomicU64::new(0));
    let slowest = Arc::new(Mutex::new(Duration::ZERO));
    std::panic::set_hook(Box::new(|_| {}));
    let t0 = Instant::now();
    let handles: Vec<_> = (0..threads)
        .map(|k| {
            let (bases, findings, done, slowest, out_dir) =
                (bases.clone(), findings.clone(), done.clone(), slowest.clone(), out_dir.clone());
            std::thread::spawn(move || {
                let mut seed = SEED;
                seed[0] ^= k as u8 + 1;
                seed[1] ^= salt;
                let mut runner =
                    TestRunner::new_with_rng(Config::default(), TestRng::from_seed(RngAlgorithm::ChaCha, &seed));
                let strat = strategy();
                let share = cases / threads + u64::from(k < cases % threads);
                for _ in 0..share {
                    let (base, muts) = strat.new_tree(&mut runner).expect("value").current();
                    let (name, text) = mutated(&bases, base, &muts);
                    let t = Instant::now();
                    let r = run_case(&text);
                    let took = t.elapsed();
                    {
                        let mut s = slowest.lock().expect("lock");
                        *s = (*s).max(took);
                    }
                    if let Err(e) = r {
                        // one finding per kind and message, the digits (timings, values) left out
                        let key: String =
                            e.lines().next().unwrap_or("").chars().filter(|c| !c.is_ascii_digit()).take(120).collect();
                        let mut f = findings.lock().expect("lock");
                        let n = f.len();
                        let count = f.entry(key.clone()).or_insert(0);
                        if *count == 0 {
                            let file = out_dir.join(format!("finding-{n:03}.ron"));
                            let why = e.replace('\n', "\n// ");
                            let body = format!("// {why}\n// from {name}, mutations {muts:?}\n{text}");
                            std::fs::write(file, body).expect("write finding");
                        }
                        *count += 1;
                    }
                    let d = done.fetch_add(1, Ordering::Relaxed) + 1;
                    if d % 50_000 == 0 {
                        eprintln!("{d} cases, {:?}", t0.elapsed());
                    }
                }
            })
        })
        .collect();
    for h in handles {
        h.join().expect("fuzz thread");
    }
    let f = findings.lock().expect("lock");
    eprintln!(
        "fuzz: {} cases in {:?} on {threads} threads, slowest case {:?}, {} distinct findings",
        done.load(Ordering::Relaxed),
        t0.elapsed(),
        slowest.lock().expect("lock"),
        f.len()
    );
    for (k, n) in f.iter() {
        eprintln!("  {n:>8} x {k}");
    }
    assert!(f.is_empty(), "findings in {}", out_dir.display());
}

/// The mutator itself: each kind changes the text and keeps it UTF-8, and
/// the lexer finds the examples' quantities.
#[test]
fn the_mutator_reaches_every_part_of_the_grammar() {
    let bases = examples();
    let text = &bases[0].1;
    let toks = lex(text);
    let quantities = toks.iter().filter(|t| t.0 == Tok::Str && quantity_parts(text, t.1, t.2).is_some()).count();
    assert!(quantities >= 5, "quantities found: {quantities}");
    for what in 0..13u8 {
        let changed = (0..20).any(|k| {
            let m = Mutation { what, pick: k * 7 + 3, choice: k * 5 + 1, count: 3 };
            apply(text, &m) != *text
        });
        assert!(changed, "mutation {what} never changed the text");
    }
    // a duplicated list element: one more node with the same id, refused, not a panic
    let m = Mutation { what: 7, pick: 0, choice: 0, count: 1 };
    let t = apply(text, &m);
    assert!(t.len() > text.len());
    assert!(run_case(&t).is_ok());
}
