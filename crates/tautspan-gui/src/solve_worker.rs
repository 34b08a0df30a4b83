//! The re-solve off the UI thread. One worker thread takes the latest
//! document revision it has been sent, validates and analyses it (starting
//! the static solve from its previous answer), and sends the outcome back,
//! waking the UI. Requests overtaken before the worker gets to them are
//! skipped: only the newest revision waiting is solved.

use crate::core_bridge::{Solved, analyse_model, validate};
use std::sync::Arc;
use std::sync::mpsc::{Receiver, RecvTimeoutError, Sender, channel};
use std::time::{Duration, Instant};
use tautspan_core::file::ScenarioDto;
use tautspan_core::model::Problem;

/// What the worker is asked to do.
enum Request {
    /// Solve the scenario of one document revision.
    Solve {
        /// The revision.
        revision: u64,
        /// Its scenario, shared with the document.
        dto: Arc<ScenarioDto>,
    },
    /// Drop results the UI no longer shows (freeing a large analysis takes
    /// time better spent off the UI thread).
    Discard(Arc<Solved>),
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

/// The worker thread and its two channels.
#[derive(Debug)]
pub struct SolveWorker {
    tx: Sender<Request>,
    rx: Receiver<Outcome>,
}

impl SolveWorker {
    /// Start the worker; it wakes `ctx` when an outcome is ready.
    ///
    /// # Errors
    /// When the system refuses a new thread.
    pub fn spawn(ctx: egui::Context) -> std::io::Result<SolveWorker> {
        let (tx, requests) = channel::<Request>();
        let (done, rx) = channel::<Outcome>();
        std::thread::Builder::new().name("tautspan-solve".to_string()).spawn(move || {
            let mut prior: Option<Arc<Solved>> = None;
            let mut waiting: Option<(u64, Arc<ScenarioDto>)> = None;
            loop {
                if waiting.is_none() {
                    match requests.recv() {
                        Ok(Request::Solve { revision, dto }) => waiting = Some((revision, dto)),
                        Ok(Request::Discard(old)) => {
                            drop(old);
                            continue;
                        }
                        Err(_) => break,
                    }
                }
                // latest revision wins: skip every request already overtaken
                while let Ok(r) = requests.try_recv() {
                    match r {
                        Request::Solve { revision, dto } => waiting = Some((revision, dto)),
                        Request::Discard(old) => drop(old),
                    }
                }
                let Some((revision, dto)) = waiting.take() else { continue };
                let outcome = solve_revision(revision, dto, prior.as_deref());
                if let Ok(s) = &outcome.result {
                    prior = Some(s.clone());
                }
                if done.send(outcome).is_err() {
                    break;
                }
                ctx.request_repaint();
            }
        })?;
        Ok(SolveWorker { tx, rx })
    }

    /// Ask for a revision to be solved. False when the worker has stopped.
    pub fn request(&self, revision: u64, dto: Arc<ScenarioDto>) -> bool {
        self.tx.send(Request::Solve { revision, dto }).is_ok()
    }

    /// Hand back results no longer shown, to be freed on the worker. When
    /// the worker has stopped they are returned to be freed here.
    pub fn discard(&self, old: Arc<Solved>) {
        let _ = self.tx.send(Request::Discard(old));
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
