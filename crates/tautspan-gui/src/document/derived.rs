//! What follows from the document: the validated scenario and its analysis,
//! or the validation problems. A changed revision is sent to the solve
//! worker; until its answer arrives the last results stay on screen, marked
//! as updating. Results older than the ones shown are discarded. Nothing is
//! re-solved on a frame that edited nothing.

use crate::document::Document;
use crate::document::core_bridge::Solved;
use crate::document::solve_worker::{Outcome, SolveWorker, solve_revision};
use std::sync::Arc;
use std::time::{Duration, Instant};
use tautspan_core::analysis::{CaseResult, MemberResult};
use tautspan_core::model::Problem;

/// The derived state of the document.
#[derive(Debug, Default)]
pub struct Derived {
    /// The document revision the results shown are for.
    pub revision: u64,
    /// The analysis, when the scenario validates.
    pub solved: Option<Arc<Solved>>,
    /// Why it does not validate.
    pub problems: Vec<Problem>,
    /// Time of the solve of the results shown, ms (on the worker).
    pub solve_ms: f64,
    /// How many results have been taken in (for tests).
    pub solves: u64,
    /// The newest revision sent to the worker.
    requested: u64,
    /// The worker, started on the first request.
    worker: Option<SolveWorker>,
    /// The context the worker wakes when an answer is ready.
    ctx: Option<egui::Context>,
    /// Answers for revisions before this one belong to a document no longer open.
    first_revision: u64,
}

impl Derived {
    /// Send the document to the worker when its revision is new, and take
    /// in whatever answers have arrived. Returns true when the results shown
    /// changed.
    pub fn refresh(&mut self, doc: &Document, ctx: &egui::Context) -> bool {
        if self.ctx.is_none() {
            self.ctx = Some(ctx.clone());
        }
        self.request(doc);
        self.take_arrived()
    }

    /// Whether the results shown are for the document's current revision.
    pub fn is_current(&self, doc: &Document) -> bool {
        self.revision == doc.revision
    }

    /// Whether a newer revision than the one shown is being solved.
    pub fn is_updating(&self) -> bool {
        self.requested > self.revision
    }

    /// Block until the results for the document's current revision are in,
    /// or `timeout` passes (tests and the benchmark; the UI never waits).
    /// Returns whether they are in.
    pub fn wait_for(&mut self, doc: &Document, timeout: Duration) -> bool {
        let deadline = Instant::now() + timeout;
        self.request(doc);
        let mut took = self.take_arrived();
        while !self.is_current(doc) {
            let left = deadline.saturating_duration_since(Instant::now());
            let Some(w) = &self.worker else { break };
            match w.wait(left) {
                Ok(Some(o)) => took |= self.install(o),
                Ok(None) => break,
                Err(_) => {
                    self.worker = None;
                    self.requested = self.revision;
                    self.request(doc);
                }
            }
        }
        if took && let Some(ctx) = &self.ctx {
            ctx.request_repaint();
        }
        self.is_current(doc)
    }

    /// Send the current revision unless it was sent already. Without a
    /// worker (no context yet, or no thread to be had) it is solved here.
    fn request(&mut self, doc: &Document) {
        if self.requested == doc.revision {
            return;
        }
        self.requested = doc.revision;
        if self.worker.is_none()
            && let Some(ctx) = &self.ctx
        {
            self.worker = SolveWorker::spawn(ctx.clone()).ok();
        }
        if let Some(w) = &self.worker {
            w.request(doc.revision, doc.dto.clone());
        } else {
            let o = solve_revision(doc.revision, doc.dto.clone(), self.solved.as_deref());
            self.install(o);
        }
    }

    /// A new or opened document replaced the old one: its results go at
    /// once, and answers still coming for it are discarded.
    pub fn forget(&mut self, doc: &Document) {
        self.first_revision = doc.revision;
        self.problems.clear();
        if let (Some(old), Some(w)) = (self.solved.take(), &self.worker) {
            w.discard(old);
        }
    }

    /// Before the document is edited: take back the request the worker has
    /// not started, so the scenario it shares with the document is edited
    /// in place rather than copied; the next refresh sends the newest.
    pub fn before_edit(&mut self) {
        if self.worker.as_ref().is_some_and(SolveWorker::withdraw) {
            self.requested = self.revision;
        }
    }

    fn take_arrived(&mut self) -> bool {
        let Some(w) = &self.worker else { return false };
        match w.arrived() {
            Ok(outcomes) => outcomes.into_iter().fold(false, |took, o| self.install(o) | took),
            Err(_) => {
                // the worker ended: start another on the next request
                self.worker = None;
                if self.requested > self.revision {
                    self.requested = self.revision;
                }
                false
            }
        }
    }

    /// Show an outcome unless it is older than what is shown.
    fn install(&mut self, o: Outcome) -> bool {
        if o.revision <= self.revision || o.revision < self.first_revision {
            return false;
        }
        self.revision = o.revision;
        self.solves += 1;
        self.solve_ms = o.solve_ms;
        let old = match o.result {
            Ok(s) => {
                self.problems.clear();
                self.solved.replace(s)
            }
            Err(p) => {
                self.problems = p;
                self.solved.take()
            }
        };
        if let (Some(old), Some(w)) = (old, &self.worker) {
            w.discard(old);
        }
        true
    }

    /// The result of a case by id (or the first case when `id` is `None`).
    pub fn case(&self, id: Option<&str>) -> Option<&CaseResult> {
        let cases = &self.solved.as_ref()?.analysis.cases;
        match id {
            Some(id) => cases.iter().find(|c| c.id == id).or_else(|| cases.first()),
            None => cases.first(),
        }
    }

    /// A member's result in a case.
    pub fn member(&self, case: Option<&str>, member: &str) -> Option<&MemberResult> {
        self.case(case)?.members.iter().find(|m| m.id == member)
    }

    /// Problems at a field path (exact) or under it (`members[2]` covers `members[2].area`).
    pub fn problems_at<'a>(&'a self, path: &'a str) -> impl Iterator<Item = &'a Problem> + 'a {
        self.problems.iter().filter(move |p| {
            p.path == path || (p.path.starts_with(path) && p.path[path.len()..].starts_with(['.', '[']))
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn outcome(revision: u64) -> Outcome {
        Outcome { revision, result: Err(Vec::new()), solve_ms: 0.0 }
    }

    #[test]
    fn an_answer_older_than_the_one_shown_is_discarded() {
        let mut d = Derived::default();
        assert!(d.install(outcome(3)));
        assert!(!d.install(outcome(2)), "older than shown");
        assert!(!d.install(outcome(3)), "already shown");
        assert_eq!(d.revision, 3);
    }

    #[test]
    fn answers_for_a_replaced_document_are_discarded() {
        let mut doc = Document::new(crate::document::blank_scenario(), None);
        let mut d = Derived::default();
        assert!(d.install(outcome(1)));
        doc.replace(crate::document::blank_scenario(), None);
        d.forget(&doc);
        assert!(!d.install(outcome(1)), "of the old document");
        assert!(d.install(outcome(doc.revision)));
    }

    #[test]
    fn the_last_results_stay_until_the_new_ones_arrive() {
        let ctx = egui::Context::default();
        let mut doc = Document::new(crate::document::blank_scenario(), None);
        let mut d = Derived::default();
        d.refresh(&doc, &ctx);
        assert!(d.wait_for(&doc, Duration::from_secs(60)));
        let before = d.solved.clone().map(|s| s.analysis.title.clone());
        doc.edit(None, |s| s.title = "moved".to_string());
        d.request(&doc);
        // nothing taken in yet: the old results are shown, marked as updating
        assert!(d.is_updating() && !d.is_current(&doc));
        assert_eq!(d.solved.as_ref().map(|s| s.analysis.title.clone()), before);
        assert!(d.wait_for(&doc, Duration::from_secs(60)));
        assert!(!d.is_updating());
        assert_eq!(d.solved.as_ref().map(|s| s.analysis.title.as_str()), Some("moved"));
    }

    #[test]
    fn the_newest_revision_wins() {
        let ctx = egui::Context::default();
        let mut doc = Document::new(crate::document::blank_scenario(), None);
        let mut d = Derived::default();
        d.refresh(&doc, &ctx);
        for t in ["a", "b", "c"] {
            doc.edit(None, |s| s.title = t.to_string());
            d.refresh(&doc, &ctx);
        }
        assert!(d.wait_for(&doc, Duration::from_secs(60)));
        assert_eq!(d.revision, doc.revision);
        assert!(!d.is_updating());
        let title = d.solved.as_ref().map(|s| s.analysis.title.clone());
        assert_eq!(title.as_deref(), Some("c"), "the results are of the last edit");
        assert!(d.solves <= 4, "at most one answer per revision taken in");
    }
}
