//! Writing an output file without losing the old one: refused over the
//! input scenario and over anything that is not a regular file; written to
//! a temporary file beside the target, synced, then renamed over it. On
//! every failure the temporary file is removed and the old file is left as
//! it was.

use std::io::Write;
use std::path::{Path, PathBuf};

/// Why an output file was not written.
#[derive(Debug)]
pub enum WriteRefusal {
    /// The output is the input file (same file after resolving links and `..`).
    IsInput(PathBuf),
    /// Something is at the path that is not a regular file (a device, a
    /// folder, a link, a pipe).
    NotRegular(&'static str),
    /// The folder to write in does not exist.
    NoFolder(PathBuf),
    /// The temporary file could not be made, written or renamed.
    Io { step: &'static str, error: std::io::Error },
}

impl std::fmt::Display for WriteRefusal {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            WriteRefusal::IsInput(p) => write!(
                f,
                "this is the input scenario ({}); refusing to write the report over it, give another --out",
                p.display()
            ),
            WriteRefusal::NotRegular(what) => {
                write!(f, "it is {what}, not a regular file; refusing to write over it, give a file name")
            }
            WriteRefusal::NoFolder(d) => write!(f, "the folder {} does not exist", d.display()),
            WriteRefusal::Io { step, error } => write!(f, "cannot {step}: {error}; any old file there is unchanged"),
        }
    }
}

/// The folder a path sits in (`.` for a bare name).
fn folder_of(path: &Path) -> &Path {
    path.parent().filter(|p| !p.as_os_str().is_empty()).unwrap_or(Path::new("."))
}

/// Where `path` leads once links and `..` are resolved, also when the file
/// itself does not exist yet (its folder resolved, its name kept).
fn resolved(path: &Path) -> Option<PathBuf> {
    if let Ok(p) = std::fs::canonicalize(path) {
        return Some(p);
    }
    let dir = std::fs::canonicalize(folder_of(path)).ok()?;
    Some(dir.join(path.file_name()?))
}

/// Refuse an output path that is `input` or is not a regular file.
pub fn check_target(out: &Path, input: Option<&Path>) -> Result<(), WriteRefusal> {
    if let Some(input) = input
        && let (Some(a), Some(b)) = (resolved(out), std::fs::canonicalize(input).ok())
        && a == b
    {
        return Err(WriteRefusal::IsInput(b));
    }
    match std::fs::symlink_metadata(out) {
        Ok(meta) => {
            let t = meta.file_type();
            if t.is_file() {
                Ok(())
            } else if t.is_dir() {
                Err(WriteRefusal::NotRegular("a folder"))
            } else if t.is_symlink() {
                Err(WriteRefusal::NotRegular("a symbolic link"))
            } else {
                Err(WriteRefusal::NotRegular("a device, pipe or socket"))
            }
        }
        Err(_) => {
            let dir = folder_of(out);
            if dir.is_dir() { Ok(()) } else { Err(WriteRefusal::NoFolder(dir.to_path_buf())) }
        }
    }
}

/// The temporary file, removed when dropped unless it was renamed into place.
struct Temp {
    path: PathBuf,
    keep: bool,
}

impl Drop for Temp {
    fn drop(&mut self) {
        if !self.keep {
            let _ = std::fs::remove_file(&self.path);
        }
    }
}

/// Write `bytes` to `out` atomically (see the module doc), refusing the
/// paths [`check_target`] refuses.
pub fn write_atomic(out: &Path, input: Option<&Path>, bytes: &[u8]) -> Result<(), WriteRefusal> {
    write_atomic_through(out, input, bytes, |f| f)
}

/// [`write_atomic`] with the temporary file's writer wrapped by `wrap`
/// (tests put a writer there that fails part way).
pub fn write_atomic_through<W: Write>(
    out: &Path,
    input: Option<&Path>,
    bytes: &[u8],
    wrap: impl FnOnce(std::fs::File) -> W,
) -> Result<(), WriteRefusal> {
    check_target(out, input)?;
    let name = out.file_name().map_or_else(|| "output".into(), |n| n.to_string_lossy().into_owned());
    let tmp_path = folder_of(out).join(format!(".{name}.tmp-{}", std::process::id()));
    let file = std::fs::OpenOptions::new()
        .write(true)
        .create_new(true)
        .open(&tmp_path)
        .or_else(|e| {
            // a temporary file left by an earlier run of the same id
            if e.kind() == std::io::ErrorKind::AlreadyExists && std::fs::remove_file(&tmp_path).is_ok() {
                std::fs::OpenOptions::new().write(true).create_new(true).open(&tmp_path)
            } else {
                Err(e)
            }
        })
        .map_err(|error| WriteRefusal::Io { step: "create a temporary file beside it", error })?;
    let mut temp = Temp { path: tmp_path, keep: false };
    let mut w = wrap(file);
    w.write_all(bytes).map_err(|error| WriteRefusal::Io { step: "write", error })?;
    w.flush().map_err(|error| WriteRefusal::Io { step: "write", error })?;
    drop(w);
    // sync through a fresh handle: the wrapped writer owned the first one
    std::fs::File::open(&temp.path)
        .and_then(|f| f.sync_all())
        .map_err(|error| WriteRefusal::Io { step: "sync to disk", error })?;
    std::fs::rename(&temp.path, out).map_err(|error| WriteRefusal::Io { step: "put it in place", error })?;
    temp.keep = true;
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A writer that fails once `left` bytes have gone through.
    struct FailsAfter {
        inner: std::fs::File,
        left: usize,
    }

    impl Write for FailsAfter {
        fn write(&mut self, buf: &[u8]) -> std::io::Result<usize> {
            if self.left == 0 {
                return Err(std::io::Error::other("injected fault: the disk is full"));
            }
            let n = buf.len().min(self.left);
            self.left -= n;
            self.inner.write(&buf[..n])
        }
        fn flush(&mut self) -> std::io::Result<()> {
            self.inner.flush()
        }
    }

    fn dir(name: &str) -> PathBuf {
        let d = std::env::temp_dir().join(format!("tautspan-atomic-{name}-{}", std::process::id()));
        let _ = std::fs::remove_dir_all(&d);
        std::fs::create_dir_all(&d).unwrap_or_else(|e| panic!("{e}"));
        d
    }

    fn names(d: &Path) -> Vec<String> {
        let mut v: Vec<String> = std::fs::read_dir(d)
            .map(|r| r.filter_map(Result::ok).map(|e| e.file_name().to_string_lossy().into_owned()).collect())
            .unwrap_or_default();
        v.sort();
        v
    }

    #[test]
    fn a_fault_mid_save_keeps_the_old_file_and_leaves_no_temporary() {
        let d = dir("fault");
        let out = d.join("r.html");
        std::fs::write(&out, "old report").unwrap_or_else(|e| panic!("{e}"));
        let big = vec![b'x'; 100_000];
        let r = write_atomic_through(&out, None, &big, |inner| FailsAfter { inner, left: 40_000 });
        assert!(matches!(r, Err(WriteRefusal::Io { step: "write", .. })), "{r:?}");
        assert_eq!(std::fs::read_to_string(&out).ok().as_deref(), Some("old report"));
        assert_eq!(names(&d), vec!["r.html".to_string()], "no temporary file left");
        // and without the fault the new text replaces the old
        write_atomic(&out, None, b"new report").unwrap_or_else(|e| panic!("{e}"));
        assert_eq!(std::fs::read_to_string(&out).ok().as_deref(), Some("new report"));
        assert_eq!(names(&d), vec!["r.html".to_string()]);
    }

    #[test]
    fn the_input_a_folder_a_device_and_a_missing_folder_are_refused() {
        let d = dir("refuse");
        let input = d.join("same.ron");
        std::fs::write(&input, "Scenario()").unwrap_or_else(|e| panic!("{e}"));
        // the same file by another spelling
        let other = d.join(".").join("same.ron");
        assert!(matches!(check_target(&other, Some(&input)), Err(WriteRefusal::IsInput(_))));
        assert!(matches!(check_target(&d, None), Err(WriteRefusal::NotRegular("a folder"))));
        assert!(matches!(check_target(Path::new("/dev/null"), None), Err(WriteRefusal::NotRegular(_))));
        let missing = d.join("no-such-folder").join("r.html");
        let r = write_atomic(&missing, None, b"x");
        assert!(matches!(r, Err(WriteRefusal::NoFolder(_))), "{r:?}");
        assert_eq!(std::fs::read_to_string(&input).ok().as_deref(), Some("Scenario()"));
    }
}
