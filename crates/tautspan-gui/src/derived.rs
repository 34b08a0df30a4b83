//! What follows from the document: the validated scenario and its analysis,
//! or the validation problems. Recomputed only when the document's revision
//! changes, never on a frame that edited nothing.

use crate::core_bridge::{Solved, solve};
use crate::document::Document;
use tautspan_core::analysis::{CaseResult, MemberResult};
use tautspan_core::model::Problem;

/// The derived state of the document.
#[derive(Debug, Default)]
pub struct Derived {
    /// The document revision these results are for.
    pub revision: u64,
    /// The analysis, when the scenario validates.
    pub solved: Option<Solved>,
    /// Why it does not validate.
    pub problems: Vec<Problem>,
    /// Time of the last solve, ms.
    pub solve_ms: f64,
    /// How many solves have run (for the status bar and tests).
    pub solves: u64,
}

impl Derived {
    /// Bring the results up to the document's revision. Returns true when it re-solved.
    pub fn refresh(&mut self, doc: &Document) -> bool {
        if self.revision == doc.revision {
            return false;
        }
        self.revision = doc.revision;
        self.solves += 1;
        let start = std::time::Instant::now();
        match solve(&doc.dto) {
            Ok(s) => {
                self.solved = Some(s);
                self.problems.clear();
            }
            Err(p) => {
                self.solved = None;
                self.problems = p;
            }
        }
        self.solve_ms = start.elapsed().as_secs_f64() * 1e3;
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
