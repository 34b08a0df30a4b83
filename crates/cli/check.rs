//! `tautspan check`: analyse every file and print text, JSON or CSV.

use crate::read::read_scenario;
use crate::{CheckFormat, EXIT_INPUT};
use std::path::PathBuf;
use std::process::ExitCode;
use tautspan_core::CAUTION;
use tautspan_core::analysis::analyse;
use tautspan_core::output::{CSV_HEADER, check_csv_rows, check_json, check_text, csv_caution_line};

/// Run the command; the exit code follows the contract (0, 1, 2).
pub fn run(files: &[PathBuf], format: CheckFormat, case: Option<&str>) -> ExitCode {
    let mut worst = 0u8;
    let mut json = Vec::new();
    let mut out = String::new();
    if matches!(format, CheckFormat::Csv) {
        out.push_str(&csv_caution_line());
        out.push('\n');
        out.push_str(CSV_HEADER);
        out.push('\n');
    }
    for path in files {
        let name = path.display().to_string();
        let mut loaded = match read_scenario(path) {
            Ok(l) => l,
            Err(e) => {
                eprintln!("{e}");
                worst = worst.max(EXIT_INPUT);
                continue;
            }
        };
        if let Some(id) = case {
            match loaded.scenario.case_index(id) {
                Some(i) => loaded.scenario.cases = vec![loaded.scenario.cases[i].clone()],
                None => {
                    let ids: Vec<String> = loaded.scenario.cases.iter().map(|c| format!("\"{}\"", c.id())).collect();
                    eprintln!("{name}: --case {id}: no such case; the file's cases are {}", ids.join(", "));
                    worst = worst.max(EXIT_INPUT);
                    continue;
                }
            }
        }
        let a = analyse(&loaded.scenario);
        if !a.all_within() {
            worst = worst.max(1);
        }
        match format {
            CheckFormat::Text => out.push_str(&check_text(&name, &a)),
            CheckFormat::Json => json.push(check_json(&name, &a)),
            CheckFormat::Csv => out.push_str(&check_csv_rows(&name, &a)),
        }
    }
    match format {
        CheckFormat::Json => {
            let v = if json.len() == 1 { json.remove(0) } else { serde_json::Value::Array(json) };
            match serde_json::to_string_pretty(&v) {
                Ok(s) => println!("{s}"),
                Err(e) => {
                    eprintln!("tautspan: cannot write JSON: {e}");
                    return ExitCode::from(EXIT_INPUT);
                }
            }
        }
        CheckFormat::Text if out.is_empty() => eprintln!("CAUTION: {CAUTION}"),
        _ => print!("{out}"),
    }
    ExitCode::from(worst)
}
