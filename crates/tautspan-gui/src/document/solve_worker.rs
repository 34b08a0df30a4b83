//! The re-solve off the UI thread. One worker thread takes the latest
//! document revision it has been sent, validates and analyses it (starting
//! the static solve from its previous answer), and sends the outcome back,
//! waking the UI. Requests overtaken before the worker gets to them are
//! skipped: only the newest revision waiting is solved.

use crate::document::core_bridge::{Solved, analyse_model, validate};
use std::sync::Arc;
use std::sync::mpsc::{Receiver, RecvTimeoutError, channel};
use std::sync::{Condvar, Mutex};
use std::time::{Duration, Instant};
use tautspan_core::file::ScenarioDto;
use tautspan_core::model::Problem;

/// What waits for the worker: the newest revision to solve (one slot, so
/// a newer request replaces an older one not yet started) and results the
/// UI no longer shows, to be freed here (freeing a large analysis takes
/// time better spent off the UI thread).
#[derive(Default)]
struct Inbox {
    solve: Option<(u64, Arc<ScenarioDto>)>,
    trash: Vec<Arc<Solved>>,
    closed: bool,
}

/// The inbox and the signal that something is in it.
#[derive(Default)]
struct Shared {
    inbox: Mutex<Inbox>,
    ready: Condvar,
}

impl Shared {
    fn with<R>(&self, f: impl FnOnce(&mut Inbox) -> R) -> R {
        // a poisoned lock only means a panic elsewhere mid-update; the inbox stays usable
        let mut inbox = self.inbox.lock().unwrap_or_else(std::sync::PoisonError::into_inner);
        let r = f(&mut inbox);
        self.ready.notify_one();
        r
    }
}

/// What the worker found for one revision.
#[derive(Debug, Clone)]
pub struct Outcome {
    /// The document revision it is for.
    pub revision: u64,
    /// The analysis, or why the scenario does not validate.
    pub result: Result<Arc<Solved>, Vec<Problem>>,
    /// Wall time of validation and analysis on the worker, ms.
    pub solve_ms: f64,
}

/// Validate and analyse one revision, warm-started from `prior`. The
/// scenario is let go as soon as it is validated, so the document's next
/// edit need not copy it. A panic in the core (a bug, never expected)
/// becomes a problem the user can read instead of a dead worker.
pub fn solve_revision(revision: u64, dto: Arc<ScenarioDto>, prior: Option<&Solved>) -> Outcome {
    let start = Instant::now();
    let result = std::panic::catch_unwind(std::panic::AssertUnwindSafe(move || {
        let built = validate(&dto);
        drop(dto);
        built.map(|scenario| analyse_model(scenario, prior, start))
    }))
    .unwrap_or_else(|panic| {
        let what = panic
            .downcast_ref::<&str>()
            .map(|s| (*s).to_string())
            .or_else(|| panic.downcast_ref::<String>().cloned())
            .unwrap_or_else(|| "no message".to_string());
        Err(vec![Problem {
            path: String::new(),
            message: format!("the solver failed on this scenario ({what}); please report it with the file"),
        }])
    })
    .map(Arc::new);
    Outcome { revision, result, solve_ms: start.elapsed().as_secs_f64() * 1e3 }
}

/// The worker has stopped (its thread ended); the app starts another.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Stopped;

/// The worker thread, its inbox and the channel of its answers.
pub struct SolveWorker {
    shared: Arc<Shared>,
    rx: Receiver<Outcome>,
}

impl std::fmt::Debug for SolveWorker {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("SolveWorker").finish_non_exhaustive()
    }
}

impl SolveWorker {
    /// Start the worker; it wakes `ctx` when an outcome is ready.
    ///
    /// # Errors
    /// When the system refuses a new thread.
    pub fn spawn(ctx: egui::Context) -> std::io::Result<SolveWorker> {
        let shared = Arc::new(Shared::default());
        let (done, rx) = channel::<Outcome>();
        let inbox = shared.clone();
        std::thread::Builder::new().name("tautspan-solve".to_string()).spawn(move || {
            // the analysis shares its load paths among the cores; leave one
            // for the interface thread, so a frame is never queued behind them
            let cores = std::thread::available_parallelism().map_or(1, std::num::NonZero::get);
            tautspan_core::analysis::set_thread_limit(cores.saturating_sub(1));
            let mut prior: Option<Arc<Solved>> = None;
            loop {
                let (job, trash) = {
                    let mut guard = inbox.inbox.lock().unwrap_or_else(std::sync::PoisonError::into_inner);
                    while guard.solve.is_none() && guard.trash.is_empty() && !guard.closed {
                        guard = inbox.ready.wait(guard).unwrap_or_else(std::sync::PoisonError::into_inner);
                    }
                    if guard.closed {
                        return;
                    }
                    (guard.solve.take(), std::mem::take(&mut guard.trash))
                };
                drop(trash);
                let Some((revision, dto)) = job else { continue };
                let outcome = solve_revision(revision, dto, prior.as_deref());
                if let Ok(s) = &outcome.result {
                    prior = Some(s.clone());
                }
                if done.send(outcome).is_err() {
                    return;
                }
                ctx.request_repaint();
            }
        })?;
        Ok(SolveWorker { shared, rx })
    }

    /// Ask for a revision to be solved, replacing a request not yet started.
    pub fn request(&self, revision: u64, dto: Arc<ScenarioDto>) {
        self.shared.with(|i| i.solve = Some((revision, dto)));
    }

    /// Take back the request not yet started, if there is one, so that the
    /// document it shares can be edited without a copy. Returns whether
    /// there was one.
    pub fn withdraw(&self) -> bool {
        self.shared.with(|i| i.solve.take()).is_some()
    }

    /// Hand back results no longer shown, to be freed on the worker.
    pub fn discard(&self, old: Arc<Solved>) {
        self.shared.with(|i| i.trash.push(old));
    }

    /// Every outcome that has arrived, oldest first, without waiting.
    /// `Err` when the worker has stopped.
    pub fn arrived(&self) -> Result<Vec<Outcome>, Stopped> {
        let mut out = Vec::new();
        loop {
            match self.rx.try_recv() {
                Ok(o) => out.push(o),
                Err(std::sync::mpsc::TryRecvError::Empty) => return Ok(out),
                Err(std::sync::mpsc::TryRecvError::Disconnected) => {
                    return if out.is_empty() { Err(Stopped) } else { Ok(out) };
                }
            }
        }
    }

    /// Wait up to `timeout` for the next outcome. `Ok(None)` on timeout,
    /// `Err` when the worker has stopped.
    pub fn wait(&self, timeout: Duration) -> Result<Option<Outcome>, Stopped> {
        match self.rx.recv_timeout(timeout) {
            Ok(o) => Ok(Some(o)),
            Err(RecvTimeoutError::Timeout) => Ok(None),
            Err(RecvTimeoutError::Disconnected) => Err(Stopped),
        }
    }
}

impl Drop for SolveWorker {
    fn drop(&mut self) {
        // the thread finishes the solve in hand, if any, and ends
        self.shared.with(|i| i.closed = true);
    }
}
