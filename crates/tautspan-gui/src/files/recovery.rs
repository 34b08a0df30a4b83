//! Crash recovery: while the document has unsaved changes, a copy is written
//! every few seconds to a recovery file in the platform's state folder
//! (`$XDG_STATE_HOME/tautspan` on Linux, found with the `directories`
//! crate). Writing happens on a thread of its own, so a large rig never
//! holds up a frame. The copy goes when the changes are saved, undone or
//! discarded; if the app dies instead, the next start finds it and offers it
//! back.
//!
//! The file is an ordinary scenario file with one comment line on top that
//! names the file the work belonged to.

use std::path::{Path, PathBuf};
use std::sync::Arc;
use std::sync::mpsc::{Sender, channel};
use std::time::{Duration, Instant, SystemTime};
use tautspan_core::file::{ScenarioDto, write_scenario_text};

/// The recovery file's name inside the state folder.
pub const FILE_NAME: &str = "unsaved-work.ron";

/// How often unsaved work is written while it keeps changing.
pub const INTERVAL: Duration = Duration::from_secs(3);

/// The first line of a recovery file; the original path (or `untitled`)
/// follows it.
const HEADER: &str = "// Tautspan recovery of unsaved work from: ";

/// The environment variable that moves the state folder (tests, or a
/// machine whose home is read-only).
pub const STATE_DIR_VAR: &str = "TAUTSPAN_STATE_DIR";

/// The platform's state folder for the app: `TAUTSPAN_STATE_DIR` when set,
/// else the `directories` crate's state folder (Linux), else its local data
/// folder (other platforms).
pub fn state_dir() -> Option<PathBuf> {
    if let Some(d) = std::env::var_os(STATE_DIR_VAR).filter(|d| !d.is_empty()) {
        return Some(PathBuf::from(d));
    }
    let dirs = directories::ProjectDirs::from("", "", "Tautspan")?;
    Some(dirs.state_dir().unwrap_or_else(|| dirs.data_local_dir()).to_path_buf())
}

/// Unsaved work found at start.
#[derive(Debug, Clone)]
pub struct Found {
    /// The file the work belonged to (`None`: never saved).
    pub original: Option<PathBuf>,
    /// The scenario as it was last written.
    pub dto: ScenarioDto,
    /// When it was written.
    pub written: Option<SystemTime>,
    /// The recovery file itself.
    pub file: PathBuf,
}

/// Look for unsaved work in `dir`. A recovery file that no longer reads is
/// reported as an error with its path (never silently dropped).
pub fn find(dir: &Path) -> Result<Option<Found>, String> {
    let file = dir.join(FILE_NAME);
    let text = match std::fs::read_to_string(&file) {
        Ok(t) => t,
        Err(e) if e.kind() == std::io::ErrorKind::NotFound => return Ok(None),
        Err(e) => return Err(format!("{}: cannot read the recovery file: {e}", file.display())),
    };
    let original = text
        .lines()
        .next()
        .and_then(|l| l.strip_prefix(HEADER))
        .map(str::trim)
        .filter(|p| !p.is_empty() && *p != "untitled")
        .map(PathBuf::from);
    let dto = tautspan_core::file::parse_scenario_text(&text)
        .map(|(d, _)| d)
        .map_err(|e| format!("{}: the recovery file does not read: {e}", file.display()))?;
    let written = std::fs::metadata(&file).and_then(|m| m.modified()).ok();
    Ok(Some(Found { original, dto, written, file }))
}

/// The recovery file's text for a scenario.
pub fn text_of(original: Option<&Path>, dto: &ScenarioDto) -> Result<String, String> {
    let body = write_scenario_text(dto).map_err(|e| format!("cannot write the recovery copy: {e}"))?;
    let from = original.map_or_else(|| "untitled".to_string(), |p| p.display().to_string());
    Ok(format!("{HEADER}{from}\n{body}"))
}

enum Job {
    Write { original: Option<PathBuf>, dto: Arc<ScenarioDto> },
    Remove,
}

/// The recovery writer of one app.
pub struct Recovery {
    dir: Option<PathBuf>,
    /// How often a changing document is written.
    pub interval: Duration,
    written: Option<(u64, Instant)>,
    exists: bool,
    jobs: Option<Sender<Job>>,
}

impl Default for Recovery {
    /// No recovery (tests and the bench drive the app without one).
    fn default() -> Recovery {
        Recovery { dir: None, interval: INTERVAL, written: None, exists: false, jobs: None }
    }
}

impl Recovery {
    /// Recovery into `dir`.
    pub fn into_dir(dir: PathBuf) -> Recovery {
        Recovery { dir: Some(dir), ..Recovery::default() }
    }

    /// The folder written to, if any.
    pub fn dir(&self) -> Option<&Path> {
        self.dir.as_deref()
    }

    fn send(&mut self, job: Job) {
        let Some(dir) = self.dir.clone() else { return };
        if self.jobs.is_none() {
            let (tx, rx) = channel::<Job>();
            let spawned = std::thread::Builder::new().name("tautspan-recovery".into()).spawn(move || {
                let file = dir.join(FILE_NAME);
                for job in rx {
                    match job {
                        Job::Write { original, dto } => {
                            if let Ok(text) = text_of(original.as_deref(), &dto) {
                                let _ = std::fs::create_dir_all(&dir);
                                let _ = super::write_atomic(&file, &text);
                            }
                        }
                        Job::Remove => {
                            let _ = std::fs::remove_file(&file);
                        }
                    }
                }
            });
            if spawned.is_err() {
                return;
            }
            self.jobs = Some(tx);
        }
        if let Some(tx) = &self.jobs {
            let _ = tx.send(job);
        }
    }

    /// Called every frame: write the document when it has unsaved changes
    /// that are not yet in the recovery file and the interval has passed;
    /// remove the file once nothing is unsaved.
    pub fn tick(&mut self, dirty: bool, revision: u64, original: Option<&Path>, dto: &Arc<ScenarioDto>) {
        if self.dir.is_none() {
            return;
        }
        if !dirty {
            if self.exists {
                self.send(Job::Remove);
                self.exists = false;
                self.written = None;
            }
            return;
        }
        let due = match self.written {
            None => true,
            Some((rev, at)) => rev != revision && at.elapsed() >= self.interval,
        };
        if due {
            self.send(Job::Write { original: original.map(Path::to_path_buf), dto: dto.clone() });
            self.written = Some((revision, Instant::now()));
            self.exists = true;
        }
    }

    /// The work is saved elsewhere or deliberately dropped: remove the file.
    pub fn discard(&mut self) {
        if let Some(dir) = &self.dir {
            let _ = std::fs::remove_file(dir.join(FILE_NAME));
        }
        self.exists = false;
        self.written = None;
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn scratch(name: &str) -> PathBuf {
        let d = std::env::temp_dir().join(format!("tautspan-recovery-{name}-{}", std::process::id()));
        let _ = std::fs::remove_dir_all(&d);
        d
    }

    #[test]
    fn text_round_trips_with_its_original_path() {
        let dto = tautspan_core::file::parse_scenario_text(crate::DEMO_SCENARIO).map(|(d, _)| d).unwrap_or_default();
        let dir = scratch("round");
        let _ = std::fs::create_dir_all(&dir);
        let text = text_of(Some(Path::new("/jobs/yard/hoist.ron")), &dto).unwrap_or_default();
        assert!(super::super::write_atomic(&dir.join(FILE_NAME), &text).is_ok());
        let found = find(&dir).ok().flatten();
        assert!(found.is_some());
        if let Some(f) = found {
            assert_eq!(f.original.as_deref(), Some(Path::new("/jobs/yard/hoist.ron")));
            assert_eq!(f.dto, dto);
        }
        let _ = std::fs::remove_dir_all(&dir);
    }

    #[test]
    fn nothing_found_is_none_and_a_broken_file_is_an_error_naming_it() {
        let dir = scratch("broken");
        assert!(matches!(find(&dir), Ok(None)));
        let _ = std::fs::create_dir_all(&dir);
        let _ = std::fs::write(dir.join(FILE_NAME), "Scenario(format: ");
        let e = find(&dir).err().unwrap_or_default();
        assert!(e.contains(FILE_NAME) && e.contains("does not read"), "{e}");
        let _ = std::fs::remove_dir_all(&dir);
    }
}
