//! `tautspan report`: the self-contained HTML report, written atomically
//! (`atomic_write.rs`), naming the scenario file with its SHA-256.

use crate::EXIT_INPUT;
use crate::atomic_write::{check_target, write_atomic};
use crate::read::read_scenario_text;
use std::path::Path;
use std::process::ExitCode;
use tautspan_core::CAUTION;
use tautspan_core::analysis::analyse;

/// Today's date (UTC) as YYYY-MM-DD, from the system clock.
pub fn today() -> String {
    let secs = std::time::SystemTime::now().duration_since(std::time::UNIX_EPOCH).map_or(0, |d| d.as_secs());
    tautspan_core::report::civil_date(secs)
}

/// Run the command.
pub fn run(file: &Path, out: &Path, units: tautspan_core::report::UnitSystem) -> ExitCode {
    // refused before the work: the input itself, a device, a missing folder
    if let Err(e) = check_target(out, Some(file)) {
        eprintln!("{}: cannot write the report: {e}", out.display());
        return ExitCode::from(EXIT_INPUT);
    }
    // one read of the file gives both the digest and the scenario
    let text = match read_scenario_text(file) {
        Ok(t) => t,
        Err(e) => {
            crate::read::print_errors(&e);
            return ExitCode::from(EXIT_INPUT);
        }
    };
    let loaded = match tautspan_core::model::load_scenario(&text) {
        Ok(l) => l,
        Err(e) => {
            crate::read::print_errors(&e.in_file(&file.display().to_string()));
            return ExitCode::from(EXIT_INPUT);
        }
    };
    let source = tautspan_core::report::SourceFile::new(file.display().to_string(), text.as_bytes());
    let a = analyse(&loaded.scenario);
    let html = tautspan_core::report::html_for_file(&loaded.scenario, &a, &today(), units, Some(&source));
    if let Err(e) = write_atomic(out, Some(file), html.as_bytes()) {
        eprintln!("{}: cannot write the report: {e}", out.display());
        return ExitCode::from(EXIT_INPUT);
    }
    eprintln!("wrote {}", out.display());
    eprintln!("CAUTION: {CAUTION}");
    ExitCode::from(if a.all_within() { 0 } else { 1 })
}
