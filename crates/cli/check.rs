//! `tautspan check`: analyse every file and print text, JSON or CSV. JSON
//! and CSV go to stdout as they are written (one member, node or row at a
//! time), never built whole in memory first.

use crate::read::read_scenario;
use crate::{CheckFormat, EXIT_INPUT};
use std::io::{BufWriter, Write};
use std::path::PathBuf;
use std::process::ExitCode;
use tautspan_core::CAUTION;
use tautspan_core::analysis::analyse;
use tautspan_core::file::{FileError, FileErrors};
use tautspan_core::output::{check_text_in, csv_caution_line, csv_header_in, write_check_json, write_csv_rows_in};
use tautspan_core::report::UnitSystem;

/// Run the command; the exit code follows the contract (0, 1, 2).
pub fn run(files: &[PathBuf], format: CheckFormat, case: Option<&str>, units: UnitSystem) -> ExitCode {
    let stdout = std::io::stdout();
    let mut out = BufWriter::with_capacity(1 << 16, stdout.lock());
    match write_all(&mut out, files, format, case, units).and_then(|worst| out.flush().map(|()| worst)) {
        Ok(worst) => ExitCode::from(worst),
        Err(e) => {
            eprintln!("tautspan: cannot write the output: {e}");
            ExitCode::from(EXIT_INPUT)
        }
    }
}

/// A file that could not be read, as one entry of the JSON output: its
/// name, the caution, `verdict` "input_error" and each error located.
fn write_error_json<W: Write>(out: &mut W, name: &str, errors: &FileErrors) -> std::io::Result<()> {
    let list: Vec<serde_json::Value> = errors
        .0
        .iter()
        .map(|e| {
            serde_json::json!({
                "line": e.location.map(|l| l.line),
                "column": e.location.map(|l| l.column),
                "field": e.field,
                "message": e.message,
            })
        })
        .collect();
    let v = serde_json::json!({ "file": name, "caution": CAUTION, "verdict": "input_error", "errors": list });
    serde_json::to_writer(&mut *out, &v).map_err(std::io::Error::other)
}

fn write_all<W: Write>(
    out: &mut W,
    files: &[PathBuf],
    format: CheckFormat,
    case: Option<&str>,
    units: UnitSystem,
) -> std::io::Result<u8> {
    let mut worst = 0u8;
    // several files make a JSON array (one object per file), one file an object
    let array = files.len() > 1;
    let mut written = 0usize;
    let mut any_text = false;
    match format {
        CheckFormat::Csv => writeln!(out, "{}\n{}", csv_caution_line(), csv_header_in(units))?,
        CheckFormat::Json if array => out.write_all(b"[")?,
        _ => {}
    }
    for path in files {
        let name = path.display().to_string();
        // a file that cannot be read still takes its place in a JSON array
        let mut input_error = |out: &mut W, errors: &FileErrors| -> std::io::Result<()> {
            crate::read::print_errors(errors);
            if let CheckFormat::Json = format {
                if array {
                    out.write_all(if written == 0 { b"\n" } else { b",\n" })?;
                }
                write_error_json(out, &name, errors)?;
                written += 1;
            }
            Ok(())
        };
        let mut loaded = match read_scenario(path) {
            Ok(l) => l,
            Err(e) => {
                input_error(out, &e)?;
                worst = worst.max(EXIT_INPUT);
                continue;
            }
        };
        if let Some(id) = case {
            match loaded.scenario.case_index(id) {
                Some(i) => loaded.scenario.cases = vec![loaded.scenario.cases[i].clone()],
                None => {
                    let ids: Vec<String> = loaded.scenario.cases.iter().map(|c| format!("\"{}\"", c.id())).collect();
                    let msg = format!("--case {id}: no such case; the file's cases are {}", ids.join(", "));
                    input_error(out, &FileErrors(vec![FileError::new(msg).in_file(name.clone())]))?;
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
            CheckFormat::Text => {
                out.write_all(check_text_in(&name, &a, units).as_bytes())?;
                any_text = true;
            }
            CheckFormat::Json => {
                if array {
                    out.write_all(if written == 0 { b"\n" } else { b",\n" })?;
                }
                write_check_json(out, &name, &a)?;
            }
            CheckFormat::Csv => write_csv_rows_in(out, &name, &a, units)?,
        }
        written += 1;
        // a large rig's analysis is dropped here, before the next file is read
        drop(a);
    }
    match format {
        CheckFormat::Json if array => out.write_all(b"\n]\n")?,
        CheckFormat::Json if written > 0 => out.write_all(b"\n")?,
        CheckFormat::Json => out.write_all(b"[]\n")?,
        CheckFormat::Text if !any_text => eprintln!("CAUTION: {CAUTION}"),
        _ => {}
    }
    Ok(worst)
}
