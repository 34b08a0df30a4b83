//! `tautspan report`: the self-contained HTML report, written atomically.

use crate::EXIT_INPUT;
use crate::read::read_scenario;
use std::io::Write;
use std::path::Path;
use std::process::ExitCode;
use tautspan_core::CAUTION;
use tautspan_core::analysis::analyse;

/// Today's date (UTC) as YYYY-MM-DD, from the system clock.
pub fn today() -> String {
    let secs = std::time::SystemTime::now().duration_since(std::time::UNIX_EPOCH).map_or(0, |d| d.as_secs());
    tautspan_core::report::civil_date(secs)
}

/// Write `text` to `path` atomically: a temporary file beside it, flushed
/// and synced, then renamed over the target.
pub fn write_atomic(path: &Path, text: &str) -> std::io::Result<()> {
    let dir = path.parent().filter(|p| !p.as_os_str().is_empty()).unwrap_or(Path::new("."));
    let name = path.file_name().map_or_else(|| "report".into(), |n| n.to_string_lossy().into_owned());
    let tmp = dir.join(format!(".{name}.tmp-{}", std::process::id()));
    {
        let mut f = std::fs::File::create(&tmp)?;
        f.write_all(text.as_bytes())?;
        f.sync_all()?;
    }
    std::fs::rename(&tmp, path).inspect_err(|_| {
        let _ = std::fs::remove_file(&tmp);
    })
}

/// Run the command.
pub fn run(file: &Path, out: &Path, units: tautspan_core::report::UnitSystem) -> ExitCode {
    if let Err(e) = read_scenario(file) {
        eprintln!("{e}");
        return ExitCode::from(EXIT_INPUT);
    }
    // the digest and the scenario come from one and the same read of the
    // file: read again, hashed, and parsed from those bytes (the first read
    // gave the located errors and applied the caps)
    let bytes = match std::fs::read(file) {
        Ok(b) => b,
        Err(e) => {
            eprintln!("{}: cannot read: {e}", file.display());
            return ExitCode::from(EXIT_INPUT);
        }
    };
    let loaded = match std::str::from_utf8(&bytes).ok().map(tautspan_core::model::load_scenario) {
        Some(Ok(l)) => l,
        _ => {
            eprintln!("{}: the file changed while it was read; run the report again", file.display());
            return ExitCode::from(EXIT_INPUT);
        }
    };
    let source = tautspan_core::report::SourceFile::new(file.display().to_string(), &bytes);
    let a = analyse(&loaded.scenario);
    let html = tautspan_core::report::html_for_file(&loaded.scenario, &a, &today(), units, Some(&source));
    if let Err(e) = write_atomic(out, &html) {
        eprintln!("{}: cannot write the report: {e}", out.display());
        return ExitCode::from(EXIT_INPUT);
    }
    eprintln!("wrote {}", out.display());
    eprintln!("CAUTION: {CAUTION}");
    ExitCode::from(if a.all_within() { 0 } else { 1 })
}
