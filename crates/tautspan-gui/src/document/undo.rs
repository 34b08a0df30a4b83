//! Undo and redo: stacks of whole-document snapshots. A scenario is small
//! text-like data, so a snapshot per edit is simple and cannot drift out of
//! step with the document the way inverse operations can. Consecutive edits
//! of the same field (typing, one drag) merge into one step.

use tautspan_core::file::ScenarioDto;

/// Most steps kept.
const LIMIT: usize = 200;

/// The undo and redo stacks.
#[derive(Debug, Default, Clone)]
pub struct UndoStack {
    undo: Vec<ScenarioDto>,
    redo: Vec<ScenarioDto>,
    /// The merge key of the last edit, when it may absorb the next one.
    last_key: Option<String>,
}

impl UndoStack {
    /// Record the document as it was before an edit. An edit with the same
    /// `merge_key` as the previous one is folded into it.
    pub fn record(&mut self, before: &ScenarioDto, merge_key: Option<&str>) {
        if !self.merges(merge_key) {
            self.undo.push(before.clone());
            if self.undo.len() > LIMIT {
                self.undo.remove(0);
            }
        }
        self.redo.clear();
        self.last_key = merge_key.map(str::to_string);
    }

    /// Whether an edit with `merge_key` folds into the previous step.
    pub fn merges(&self, merge_key: Option<&str>) -> bool {
        merge_key.is_some() && merge_key == self.last_key.as_deref()
    }

    /// Record an edit folded into the previous step (see [`UndoStack::merges`]).
    pub fn record_merged(&mut self) {
        self.redo.clear();
    }

    /// Stop merging: the next edit starts a new step.
    pub fn seal(&mut self) {
        self.last_key = None;
    }

    /// Step back: returns the document to restore, given the current one.
    pub fn undo(&mut self, current: &ScenarioDto) -> Option<ScenarioDto> {
        let prev = self.undo.pop()?;
        self.redo.push(current.clone());
        self.last_key = None;
        Some(prev)
    }

    /// Step forward again.
    pub fn redo(&mut self, current: &ScenarioDto) -> Option<ScenarioDto> {
        let next = self.redo.pop()?;
        self.undo.push(current.clone());
        self.last_key = None;
        Some(next)
    }

    /// Whether there is something to undo.
    pub fn can_undo(&self) -> bool {
        !self.undo.is_empty()
    }

    /// Whether there is something to redo.
    pub fn can_redo(&self) -> bool {
        !self.redo.is_empty()
    }

    /// Forget everything (a new or opened document).
    pub fn clear(&mut self) {
        *self = UndoStack::default();
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn titled(t: &str) -> ScenarioDto {
        ScenarioDto { title: t.to_string(), ..ScenarioDto::default() }
    }

    #[test]
    fn undo_redo_round_trip() {
        let mut s = UndoStack::default();
        s.record(&titled("a"), None);
        let back = s.undo(&titled("b"));
        assert_eq!(back.map(|d| d.title), Some("a".to_string()));
        assert_eq!(s.redo(&titled("a")).map(|d| d.title), Some("b".to_string()));
    }

    #[test]
    fn same_key_merges() {
        let mut s = UndoStack::default();
        s.record(&titled("a"), Some("x"));
        s.record(&titled("ab"), Some("x"));
        assert_eq!(s.undo(&titled("abc")).map(|d| d.title), Some("a".to_string()));
        assert!(!s.can_undo());
    }
}
