//! Reading a scenario file from disk: size cap before reading, UTF-8 with a
//! located error, then the core's parser and validation.

use std::path::Path;
use tautspan_core::file::{FileError, FileErrors, Location, MAX_FILE_BYTES};
use tautspan_core::model::{Loaded, load_scenario};

/// Read and validate one scenario file; errors name the file.
pub fn read_scenario(path: &Path) -> Result<Loaded, FileErrors> {
    let name = path.display().to_string();
    let one = |msg: String| FileErrors(vec![FileError::new(msg).in_file(name.clone())]);
    let meta = std::fs::metadata(path).map_err(|e| one(format!("cannot open: {e}")))?;
    if meta.is_dir() {
        return Err(one("is a directory, not a scenario file".to_string()));
    }
    if meta.len() > MAX_FILE_BYTES {
        return Err(one(format!(
            "file is {:.1} MiB; the cap is {} MiB for a scenario file",
            meta.len() as f64 / 1_048_576.0,
            MAX_FILE_BYTES / 1_048_576
        )));
    }
    let bytes = std::fs::read(path).map_err(|e| one(format!("cannot read: {e}")))?;
    let text = match String::from_utf8(bytes) {
        Ok(t) => t,
        Err(e) => {
            let good = &e.as_bytes()[..e.utf8_error().valid_up_to()];
            let line = good.iter().filter(|&&b| b == b'\n').count() + 1;
            let col = String::from_utf8_lossy(good).rsplit('\n').next().map_or(0, |l| l.chars().count()) + 1;
            let mut err = FileError::new("the file is not UTF-8 text; save it as UTF-8").in_file(name.clone());
            err.location = Some(Location { line, column: col });
            return Err(FileErrors(vec![err]));
        }
    };
    load_scenario(&text).map_err(|e| e.in_file(&name))
}
