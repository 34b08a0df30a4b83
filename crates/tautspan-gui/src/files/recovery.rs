//! Crash recovery: while the scenario has unsaved changes, it is written
//! every few seconds to a recovery file in the platform's state folder
//! (`directories`; `$XDG_STATE_HOME/tautspan` on Linux), atomically, with
//! the file it came from named in a comment, on a thread of its own (a
//! large rig takes longer to write than a frame). Saving, or closing after the
//! question about unsaved changes, removes it. When the app starts and finds
//! one, it offers the work back (restore or discard).

use crate::document::Document;
use crate::files::write_atomic;
use std::path::{Path, PathBuf};
use std::sync::Arc;
use std::sync::mpsc::{Receiver, Sender, channel};
use std::time::{Duration, Instant};
use tautspan_core::file::{ScenarioDto, write_scenario_text};

/// Environment variable naming another folder for the recovery file.
pub const STATE_DIR_ENV: &str = "TAUTSPAN_STATE_DIR";

/// How often unsaved work is written, at most.
pub const INTERVAL: Duration = Duration::from_secs(3);

/// The recovery file's name.
const FILE_NAME: &str = "unsaved-scenario.ron";

/// The comment line naming the file the work came from.
const ORIGIN: &str = "// recovered from: ";

/// Where the recovery file lives: `$TAUTSPAN_STATE_DIR`, else the
/// platform's state folder for the app (its local data folder where the
/// platform has no state folder).
pub fn default_file() -> Option<PathBuf> {
    if let Some(d) = std::env::var_os(STATE_DIR_ENV).filter(|d| !d.is_empty()) {
        return Some(PathBuf::from(d).join(FILE_NAME));
    }
    let dirs = directories::ProjectDirs::from("", "", "Tautspan")?;
    let dir = dirs.state_dir().unwrap_or_else(|| dirs.data_local_dir());
    Some(dir.join(FILE_NAME))
}

/// Work found in a recovery file.
#[derive(Debug, Clone, PartialEq)]
pub struct Recovered {
    /// The scenario as it was last written.
    pub dto: ScenarioDto,
    /// The file it came from, if it had one.
    pub origin: Option<PathBuf>,
}

/// The recovery file's text: a header, the origin, the scenario.
pub fn text_of(dto: &ScenarioDto, origin: Option<&Path>) -> Result<String, String> {
    let body = write_scenario_text(dto).map_err(|e| e.to_string())?;
    let origin = origin.map_or_else(|| "(not saved yet)".to_string(), |p| p.display().to_string());
    Ok(format!("// Tautspan: unsaved work, kept in case the app stops unexpectedly\n{ORIGIN}{origin}\n{body}"))
}

/// Read a recovery file: `None` when there is none; an error in words when
/// it cannot be read back.
pub fn read(file: &Path) -> Option<Result<Recovered, String>> {
    let text = std::fs::read_to_string(file).ok()?;
    let origin = text.lines().find_map(|l| l.strip_prefix(ORIGIN)).filter(|o| !o.starts_with('(')).map(PathBuf::from);
    Some(
        tautspan_core::model::load_scenario(&text)
            .map(|l| Recovered { dto: l.dto, origin })
            .map_err(|e| format!("the unsaved work found in {} cannot be read back: {e}", file.display())),
    )
}

/// A job for the writer thread. One thread does them in order, so a
/// removal is never overtaken by an earlier write.
enum Job {
    Write { file: PathBuf, dto: Arc<ScenarioDto>, origin: Option<PathBuf> },
    Remove(PathBuf),
}

/// The writer thread: serialising and syncing a large rig takes longer than
/// a frame, so it is done off the UI thread.
struct Writer {
    jobs: Sender<Job>,
    done: Receiver<Result<(), String>>,
    pending: usize,
}

impl Writer {
    fn start() -> Option<Writer> {
        let (jobs, rx) = channel::<Job>();
        let (tx, done) = channel();
        std::thread::Builder::new()
            .name("tautspan-recovery".into())
            .spawn(move || {
                for job in rx {
                    let result = match job {
                        Job::Write { file, dto, origin } => write_copy(&file, &dto, origin.as_deref()),
                        Job::Remove(file) => {
                            let _ = std::fs::remove_file(file);
                            Ok(())
                        }
                    };
                    if tx.send(result).is_err() {
                        break;
                    }
                }
            })
            .ok()?;
        Some(Writer { jobs, done, pending: 0 })
    }

    fn send(&mut self, job: Job) {
        if self.jobs.send(job).is_ok() {
            self.pending += 1;
        }
    }

    /// The first error among the jobs finished so far.
    fn finished(&mut self) -> Result<(), String> {
        let mut first = Ok(());
        while let Ok(r) = self.done.try_recv() {
            self.pending = self.pending.saturating_sub(1);
            if first.is_ok() {
                first = r;
            }
        }
        first
    }

    /// Wait until every job sent is done.
    fn idle(&mut self) -> Result<(), String> {
        let mut first = Ok(());
        while self.pending > 0 {
            let Ok(r) = self.done.recv() else { break };
            self.pending -= 1;
            if first.is_ok() {
                first = r;
            }
        }
        first
    }
}

fn write_copy(file: &Path, dto: &ScenarioDto, origin: Option<&Path>) -> Result<(), String> {
    let text = text_of(dto, origin)?;
    if let Some(dir) = file.parent() {
        std::fs::create_dir_all(dir).map_err(|e| format!("{}: {e}", dir.display()))?;
    }
    write_atomic(file, &text).map_err(|e| format!("{}: {e}", file.display()))
}

/// The recovery copy of one app: what was written last and when.
#[derive(Default)]
pub struct Recovery {
    /// The recovery file; `None`: recovery off (tests, no state folder).
    pub file: Option<PathBuf>,
    /// Work found at start, offered back until restored or discarded.
    pub offer: Option<Result<Recovered, String>>,
    written: Option<u64>,
    last_write: Option<Instant>,
    writer: Option<Writer>,
}

impl std::fmt::Debug for Recovery {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("Recovery").field("file", &self.file).field("written", &self.written).finish_non_exhaustive()
    }
}

impl Recovery {
    /// Recovery into `file`, with whatever work it holds offered back.
    pub fn at(file: Option<PathBuf>) -> Recovery {
        let offer = file.as_deref().and_then(read);
        Recovery { file, offer, ..Recovery::default() }
    }

    fn send(&mut self, job: Job) {
        if self.writer.is_none() {
            self.writer = Writer::start();
        }
        match &mut self.writer {
            Some(w) => w.send(job),
            // no thread to be had: do it here
            None => match job {
                Job::Write { file, dto, origin } => {
                    let _ = write_copy(&file, &dto, origin.as_deref());
                }
                Job::Remove(file) => {
                    let _ = std::fs::remove_file(file);
                }
            },
        }
    }

    /// Called every frame: have the document written when it has unsaved
    /// changes not yet written and the last write is `INTERVAL` old; have
    /// the file removed once the document is clean. Returns how long until
    /// a write is due (for a repaint then), or an error in words when an
    /// earlier write failed.
    pub fn tick(&mut self, doc: &Document) -> Result<Option<Duration>, String> {
        if let Some(w) = &mut self.writer {
            w.finished()?;
        }
        // while work is offered back, its file is left as it is
        let (Some(file), None) = (self.file.clone(), &self.offer) else { return Ok(None) };
        if !doc.dirty {
            if self.written.take().is_some() {
                self.send(Job::Remove(file));
            }
            return Ok(None);
        }
        if self.written == Some(doc.revision) {
            return Ok(None);
        }
        if let Some(t) = self.last_write {
            let age = t.elapsed();
            if age < INTERVAL {
                return Ok(Some(INTERVAL - age));
            }
        }
        self.last_write = Some(Instant::now());
        self.written = Some(doc.revision);
        self.send(Job::Write { file, dto: doc.dto.clone(), origin: doc.path.clone() });
        Ok(None)
    }

    /// Wait for the writes asked for so far; their first error.
    pub fn flush(&mut self) -> Result<(), String> {
        self.writer.as_mut().map_or(Ok(()), Writer::idle)
    }

    /// Remove the recovery file (work saved, discarded, or the app closed by
    /// choice), after any write still under way.
    pub fn clear(&mut self) {
        let _ = self.flush();
        self.offer = None;
        self.written = None;
        if let Some(f) = &self.file {
            let _ = std::fs::remove_file(f);
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_text_reads_back_with_its_origin() {
        let loaded = tautspan_core::model::load_scenario(crate::DEMO_SCENARIO).unwrap_or_else(|e| panic!("{e}"));
        let dir = std::env::temp_dir().join(format!("tautspan-recovery-unit-{}", std::process::id()));
        std::fs::create_dir_all(&dir).unwrap_or_else(|e| panic!("{e}"));
        let file = dir.join(FILE_NAME);
        let origin = Path::new("/jobs/gantry.ron");
        std::fs::write(&file, text_of(&loaded.dto, Some(origin)).unwrap_or_default()).unwrap_or_else(|e| panic!("{e}"));
        let back = read(&file).unwrap_or_else(|| panic!("found")).unwrap_or_else(|e| panic!("{e}"));
        assert_eq!(back.dto, loaded.dto);
        assert_eq!(back.origin.as_deref(), Some(origin));
        std::fs::write(&file, text_of(&loaded.dto, None).unwrap_or_default()).unwrap_or_else(|e| panic!("{e}"));
        assert_eq!(read(&file).and_then(Result::ok).and_then(|r| r.origin), None, "not saved yet: no origin");
        let _ = std::fs::remove_dir_all(&dir);
    }

    #[test]
    fn unsaved_work_is_written_then_removed_once_saved() {
        let dir = std::env::temp_dir().join(format!("tautspan-recovery-tick-{}", std::process::id()));
        let file = dir.join(FILE_NAME);
        let _ = std::fs::remove_dir_all(&dir);
        let mut r = Recovery::at(Some(file.clone()));
        assert!(r.offer.is_none());
        let mut doc = Document::new(crate::document::blank_scenario(), None);
        assert_eq!(r.tick(&doc), Ok(None));
        assert!(!file.exists(), "nothing unsaved, nothing written");
        doc.edit(None, |d| d.title = "edited".to_string());
        assert_eq!(r.tick(&doc), Ok(None));
        assert_eq!(r.flush(), Ok(()), "written on the writer thread");
        let back = read(&file).and_then(Result::ok).map(|r| r.dto.title);
        assert_eq!(back.as_deref(), Some("edited"));
        doc.edit(None, |d| d.title = "again".to_string());
        assert!(matches!(r.tick(&doc), Ok(Some(_))), "the next write waits for the interval");
        doc.dirty = false;
        assert_eq!(r.tick(&doc), Ok(None));
        assert_eq!(r.flush(), Ok(()));
        assert!(!file.exists(), "clean again: removed");
        let _ = std::fs::remove_dir_all(&dir);
    }
}
