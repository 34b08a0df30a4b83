//! The files folder: reading and saving scenarios (this file), the app's
//! file commands and dialogs (`app_files`), the preferences kept between
//! runs (`prefs`), and unsaved work kept for crash recovery (`recovery`) and
//! offered back at start (`recovery_offer`).
//!
//! Files: native dialogs on a worker thread (an unanswered desktop portal
//! can block forever, so the UI never waits on one), the in-app path field
//! used when a dialog gives nothing, reading a scenario with located errors,
//! and atomic saves (temporary file in the same directory, flushed and
//! synced, then renamed over the target).

pub(crate) mod app_files;
pub(crate) mod prefs;
pub mod recovery;
mod recovery_offer;

use std::io::Write;
use std::path::{Path, PathBuf};
use std::sync::mpsc::{Receiver, Sender, channel};
use tautspan_core::file::{ScenarioDto, write_scenario_text};
use tautspan_core::model::load_scenario;

/// What a path is wanted for.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Purpose {
    /// Open a scenario.
    Open,
    /// Save the scenario under a new name.
    SaveAs,
    /// Export the report.
    ExportReport,
    /// Export the results grid as CSV.
    ExportCsv,
}

impl Purpose {
    /// The verb on the path field's button.
    pub fn verb(self) -> &'static str {
        match self {
            Purpose::Open => "Open",
            Purpose::SaveAs => "Save",
            Purpose::ExportReport | Purpose::ExportCsv => "Export",
        }
    }

    /// The extension a path typed without one gets (none for opening).
    pub fn extension(self) -> Option<&'static str> {
        match self {
            Purpose::Open => None,
            Purpose::SaveAs => Some("ron"),
            Purpose::ExportReport => Some("html"),
            Purpose::ExportCsv => Some("csv"),
        }
    }
}

/// What the path field starts with: for opening, the folder of the file
/// open (a separator at the end, ready for a name); for saving and
/// exporting, the suggested file in that folder.
fn start_text(purpose: Purpose, near: Option<&Path>) -> String {
    let Some(near) = near else { return String::new() };
    match purpose {
        Purpose::Open => near
            .parent()
            .filter(|d| !d.as_os_str().is_empty())
            .map(|d| format!("{}{}", d.display(), std::path::MAIN_SEPARATOR))
            .unwrap_or_default(),
        _ => near.display().to_string(),
    }
}

/// A dialog's answer.
#[derive(Debug)]
pub struct Answer {
    /// What it was for.
    pub purpose: Purpose,
    /// The path chosen, if any.
    pub path: Option<PathBuf>,
}

/// The in-app path field, shown when a dialog gave nothing.
#[derive(Debug, Clone)]
pub struct PathPrompt {
    /// What the path is for.
    pub purpose: Purpose,
    /// The path being typed.
    pub text: String,
    /// Why the field is shown.
    pub reason: String,
    /// The field has had the focus once (it takes it when it opens).
    pub focused: bool,
}

/// Dialogs in flight and the fallback field.
#[derive(Debug)]
pub struct Files {
    tx: Sender<Answer>,
    rx: Receiver<Answer>,
    /// A dialog is open on the worker thread.
    pub in_flight: Option<Purpose>,
    /// The in-app path field.
    pub prompt: Option<PathPrompt>,
    /// Use native dialogs (off in tests and when they have failed before).
    pub native: bool,
    /// What the path field starts with should the dialog in flight give nothing.
    last_near: String,
}

impl Default for Files {
    fn default() -> Self {
        let (tx, rx) = channel();
        Files { tx, rx, in_flight: None, prompt: None, native: true, last_near: String::new() }
    }
}

impl Files {
    /// Ask for a path: a native dialog on a worker thread, or the in-app field.
    pub fn ask(&mut self, purpose: Purpose, ctx: &egui::Context, near: Option<&Path>) {
        if self.in_flight.is_some() {
            return;
        }
        if !self.native {
            self.prompt = Some(PathPrompt {
                purpose,
                text: start_text(purpose, near),
                reason: "Type the file's path.".to_string(),
                focused: false,
            });
            return;
        }
        self.in_flight = Some(purpose);
        self.last_near = start_text(purpose, near);
        let tx = self.tx.clone();
        let ctx = ctx.clone();
        let dir = near.and_then(Path::parent).map(Path::to_path_buf);
        let name = near.and_then(Path::file_name).map(|n| n.to_string_lossy().into_owned());
        let spawned = std::thread::Builder::new().name("file-dialog".to_string()).spawn(move || {
            let mut d = rfd::FileDialog::new();
            d = match purpose {
                Purpose::ExportReport => d.add_filter("HTML report", &["html"]),
                Purpose::ExportCsv => d.add_filter("CSV table", &["csv"]),
                _ => d.add_filter("Tautspan scenario", &["ron"]),
            };
            if let Some(dir) = dir {
                d = d.set_directory(dir);
            }
            if let Some(name) = name {
                d = d.set_file_name(name);
            }
            let path = match purpose {
                Purpose::Open => d.pick_file(),
                Purpose::SaveAs | Purpose::ExportReport | Purpose::ExportCsv => d.save_file(),
            };
            let _ = tx.send(Answer { purpose, path });
            ctx.request_repaint();
        });
        if let Err(e) = spawned {
            self.in_flight = None;
            self.prompt = Some(PathPrompt {
                purpose,
                text: start_text(purpose, near),
                reason: format!("The file dialog could not start ({e}); type the path instead."),
                focused: false,
            });
        }
    }

    /// A dialog's answer, when one has come back.
    pub fn poll(&mut self) -> Option<Answer> {
        let a = self.rx.try_recv().ok()?;
        self.in_flight = None;
        if a.path.is_none() {
            self.prompt = Some(PathPrompt {
                purpose: a.purpose,
                text: self.last_near.clone(),
                focused: false,
                reason: "The file dialog closed without a file (cancelled, or no desktop file dialog is available here). Type the path instead, or close this.".to_string(),
            });
        }
        Some(a)
    }
}

/// Read and validate a scenario file. The error names the file, line,
/// column and field.
pub fn read_scenario(path: &Path) -> Result<ScenarioDto, String> {
    let name = path.display().to_string();
    let text = read_capped(path).map_err(|e| format!("{name}: {e}"))?;
    load_scenario(&text).map(|l| l.dto).map_err(|e| e.in_file(&name).to_string())
}

/// A file's text, with the size cap for scenario files applied while
/// reading (a device or a pipe stops at the cap instead of filling memory).
fn read_capped(path: &Path) -> Result<String, String> {
    use std::io::Read;
    let cap = tautspan_core::file::MAX_FILE_BYTES;
    let file = std::fs::File::open(path).map_err(|e| format!("cannot read: {e}"))?;
    let mut bytes = Vec::new();
    file.take(cap + 1).read_to_end(&mut bytes).map_err(|e| format!("cannot read: {e}"))?;
    if bytes.len() as u64 > cap {
        return Err(format!(
            "the file is larger than the cap of {} MiB for a scenario file (reading stopped there)",
            cap / 1_048_576
        ));
    }
    String::from_utf8(bytes).map_err(|_| "the file is not UTF-8 text; save it as UTF-8".to_string())
}

/// Write text to `path` atomically: a temporary file beside it, flushed and
/// synced to disk, then renamed over the target, so a failed save never
/// leaves a half-written file where the colleague's copy was.
pub fn write_atomic(path: &Path, text: &str) -> std::io::Result<()> {
    // never replace a device, a folder or a link with a file
    if let Ok(meta) = std::fs::symlink_metadata(path)
        && !meta.file_type().is_file()
    {
        return Err(std::io::Error::other("not a regular file; choose a file name"));
    }
    let dir = match path.parent() {
        Some(d) if !d.as_os_str().is_empty() => d.to_path_buf(),
        _ => PathBuf::from("."),
    };
    let name = path.file_name().map_or_else(|| "scenario".to_string(), |n| n.to_string_lossy().into_owned());
    let tmp = dir.join(format!(".{name}.{}.tmp", std::process::id()));
    let result = (|| {
        let mut f = std::fs::File::create(&tmp)?;
        f.write_all(text.as_bytes())?;
        f.flush()?;
        f.sync_all()?;
        drop(f);
        std::fs::rename(&tmp, path)?;
        // make the rename itself durable where the platform allows it
        if let Ok(d) = std::fs::File::open(&dir) {
            let _ = d.sync_all();
        }
        Ok(())
    })();
    if result.is_err() {
        let _ = std::fs::remove_file(&tmp);
    }
    result
}

/// Save a scenario to `path` atomically.
pub fn save_scenario(path: &Path, dto: &ScenarioDto) -> Result<(), String> {
    let text = write_scenario_text(dto).map_err(|e| format!("cannot write the scenario: {e}"))?;
    write_atomic(path, &text).map_err(|e| format!("{}: cannot save: {e}", path.display()))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn atomic_write_replaces_and_leaves_no_temp() {
        let dir = std::env::temp_dir().join(format!("tautspan-gui-files-{}", std::process::id()));
        let _ = std::fs::create_dir_all(&dir);
        let p = dir.join("a.ron");
        assert!(write_atomic(&p, "one").is_ok());
        assert!(write_atomic(&p, "two").is_ok());
        assert_eq!(std::fs::read_to_string(&p).ok().as_deref(), Some("two"));
        let leftovers = std::fs::read_dir(&dir)
            .map(|r| r.filter_map(Result::ok).filter(|e| e.file_name().to_string_lossy().ends_with(".tmp")).count());
        assert_eq!(leftovers.ok(), Some(0));
        // a folder in the way is refused and left as it is
        let sub = dir.join("folder.ron");
        let _ = std::fs::create_dir_all(&sub);
        assert!(write_atomic(&sub, "three").is_err());
        assert!(sub.is_dir());
        // a file over the cap is refused while reading
        let big = dir.join("big.ron");
        let _ = std::fs::write(&big, vec![b' '; (tautspan_core::file::MAX_FILE_BYTES + 10) as usize]);
        let e = read_scenario(&big).err().unwrap_or_default();
        assert!(e.contains("larger than the cap of 16 MiB"), "{e}");
        let _ = std::fs::remove_dir_all(&dir);
    }
}
