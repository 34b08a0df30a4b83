//! Reading a scenario file from disk: the size cap applied while reading
//! (so `/dev/zero` or an endless pipe stops at the cap), UTF-8 with a
//! located error, then the core's parser and validation.

use std::io::Read;
use std::path::Path;
use tautspan_core::file::{FileError, FileErrors, Location, MAX_FILE_BYTES};
use tautspan_core::model::{Loaded, load_scenario};

/// Why a file's bytes could not be read as scenario text.
#[derive(Debug)]
pub enum ReadProblem {
    /// More than [`MAX_FILE_BYTES`] bytes (reading stopped one byte past the cap).
    TooLarge,
    /// The reader failed.
    Io(std::io::Error),
    /// Not UTF-8: where the first bad byte is.
    NotUtf8(Location),
}

impl ReadProblem {
    fn message(&self) -> String {
        match self {
            ReadProblem::TooLarge => format!(
                "the file is larger than the cap of {} MiB for a scenario file (reading stopped there)",
                MAX_FILE_BYTES / 1_048_576
            ),
            ReadProblem::Io(e) => format!("cannot read: {e}"),
            ReadProblem::NotUtf8(_) => "the file is not UTF-8 text; save it as UTF-8".to_string(),
        }
    }
}

/// Read at most `cap` bytes of text from `reader`: one byte more than the
/// cap is asked for, so a longer input is refused without reading the rest.
pub fn read_text_capped<R: Read>(reader: R, cap: u64) -> Result<String, ReadProblem> {
    let mut bytes = Vec::new();
    reader.take(cap.saturating_add(1)).read_to_end(&mut bytes).map_err(ReadProblem::Io)?;
    if bytes.len() as u64 > cap {
        return Err(ReadProblem::TooLarge);
    }
    String::from_utf8(bytes).map_err(|e| {
        let good = &e.as_bytes()[..e.utf8_error().valid_up_to()];
        let line = good.iter().filter(|&&b| b == b'\n').count() + 1;
        let column = String::from_utf8_lossy(good).rsplit('\n').next().map_or(0, |l| l.chars().count()) + 1;
        ReadProblem::NotUtf8(Location { line, column })
    })
}

/// Problems printed for one file at most; the rest are counted.
pub const MAX_SHOWN: usize = 100;

/// Print a file's problems to stderr, buffered (one write, not one a
/// piece), the first [`MAX_SHOWN`] of them and a count of the rest.
pub fn print_errors(errors: &FileErrors) {
    use std::io::Write;
    let mut err = std::io::BufWriter::new(std::io::stderr().lock());
    for e in errors.0.iter().take(MAX_SHOWN) {
        let _ = writeln!(err, "{e}");
    }
    if errors.0.len() > MAX_SHOWN {
        let file = errors.0[0].file.as_deref().unwrap_or("the file");
        let _ = writeln!(
            err,
            "{file}: and {} more problems (the first {MAX_SHOWN} are shown)",
            tautspan_core::units::grouped((errors.0.len() - MAX_SHOWN) as u64)
        );
    }
    let _ = err.flush();
}

/// Read and validate one scenario file; errors name the file.
pub fn read_scenario(path: &Path) -> Result<Loaded, FileErrors> {
    let text = read_scenario_text(path)?;
    load_scenario(&text).map_err(|e| e.in_file(&path.display().to_string()))
}

/// A scenario file's text, with the size cap applied while reading and the
/// errors located (not yet parsed).
pub fn read_scenario_text(path: &Path) -> Result<String, FileErrors> {
    let name = path.display().to_string();
    let one = |msg: String| FileErrors(vec![FileError::new(msg).in_file(name.clone())]);
    let meta = std::fs::metadata(path).map_err(|e| one(format!("cannot open: {e}")))?;
    if meta.is_dir() {
        return Err(one("is a directory, not a scenario file".to_string()));
    }
    // the length on disk refuses a large regular file at once; devices and
    // pipes report none, and the cap while reading stops them
    if meta.is_file() && meta.len() > MAX_FILE_BYTES {
        return Err(one(format!(
            "file is {:.1} MiB; the cap is {} MiB for a scenario file",
            meta.len() as f64 / 1_048_576.0,
            MAX_FILE_BYTES / 1_048_576
        )));
    }
    let file = std::fs::File::open(path).map_err(|e| one(format!("cannot open: {e}")))?;
    let text = read_text_capped(file, MAX_FILE_BYTES).map_err(|p| {
        let mut err = FileError::new(p.message()).in_file(name.clone());
        if let ReadProblem::NotUtf8(at) = p {
            err.location = Some(at);
        }
        FileErrors(vec![err])
    })?;
    Ok(text)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A reader that yields `[` without end and counts what it handed out.
    struct Endless {
        given: u64,
    }

    impl Read for Endless {
        fn read(&mut self, buf: &mut [u8]) -> std::io::Result<usize> {
            buf.fill(b'[');
            self.given += buf.len() as u64;
            Ok(buf.len())
        }
    }

    #[test]
    fn an_endless_reader_stops_one_byte_past_the_cap() {
        let mut r = Endless { given: 0 };
        let cap = 1 << 20;
        let got = read_text_capped(&mut r, cap);
        assert!(matches!(got, Err(ReadProblem::TooLarge)), "{got:?}");
        // the take hands the reader buffers no longer than what is left of cap + 1
        assert_eq!(r.given, cap + 1, "bytes read for a cap of {cap}");
    }

    #[test]
    fn text_at_the_cap_is_read_and_bad_utf8_is_located() {
        let text = "ab\ncd";
        assert_eq!(read_text_capped(text.as_bytes(), 5).ok().as_deref(), Some(text));
        assert!(matches!(read_text_capped(text.as_bytes(), 4), Err(ReadProblem::TooLarge)));
        let bad = b"ab\nc\xffd";
        match read_text_capped(&bad[..], 100) {
            Err(ReadProblem::NotUtf8(at)) => assert_eq!(at, Location { line: 2, column: 2 }),
            other => panic!("{other:?}"),
        }
    }
}
