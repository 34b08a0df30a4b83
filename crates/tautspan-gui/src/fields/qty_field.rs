//! The unit-aware text field: the user types a quantity with its unit, the
//! core's parser checks it as it is typed, and only text that parses reaches
//! the document — kept exactly as typed ("0.75 in" stays "0.75 in"). Text
//! that does not parse stays in the field with the parser's message under
//! it, and the document keeps its last good value.

use crate::document::command::Command;
use crate::document::derived::Derived;
use egui::{Color32, RichText, Ui};
use std::collections::HashMap;
use tautspan_core::file::{Qty, ScenarioDto};
use tautspan_core::units::{Dimension, Sign, parse_quantity};

/// Text being typed that does not (yet) parse, by field path.
#[derive(Debug, Default, Clone)]
pub struct FieldBuffers(HashMap<String, String>);

impl FieldBuffers {
    /// Forget every unfinished entry (after undo, open, new).
    pub fn clear(&mut self) {
        self.0.clear();
    }

    /// The unfinished text at a path, if any.
    pub fn get(&self, path: &str) -> Option<&str> {
        self.0.get(path).map(String::as_str)
    }

    /// Keep unfinished text at a path.
    pub fn put(&mut self, path: &str, text: &str) {
        self.0.insert(path.to_string(), text.to_string());
    }

    /// Every unfinished entry, (path or rename key, text), sorted by path.
    pub fn entries(&self) -> Vec<(&str, &str)> {
        let mut v: Vec<(&str, &str)> = self.0.iter().map(|(k, t)| (k.as_str(), t.as_str())).collect();
        v.sort_unstable();
        v
    }

    /// Forget the unfinished text at a path.
    pub fn remove(&mut self, path: &str) {
        self.0.remove(path);
    }

    /// Forget the unfinished text at a path and every path under it (a list
    /// whose items move up when one is removed).
    pub fn remove_under(&mut self, path: &str) {
        self.0.retain(|p, _| !(p == path || (p.starts_with(path) && p[path.len()..].starts_with(['.', '[']))));
    }
}

/// The colour of inline errors.
pub const ERROR: Color32 = Color32::from_rgb(0xe0, 0x5a, 0x4a);

/// How a field sets its value in the document.
pub type Setter = Box<dyn FnOnce(&mut ScenarioDto, Option<Qty>)>;

/// One quantity field.
pub struct QtyField<'a> {
    /// Label shown beside the field (and its accessible name).
    pub label: &'a str,
    /// Field path in the file (`members[2].area`), for errors and undo merging.
    pub path: String,
    /// The value in the document.
    pub current: Option<&'a Qty>,
    /// Its dimension.
    pub dimension: Dimension,
    /// Its sign.
    pub sign: Sign,
    /// Empty text clears it (an optional field).
    pub optional: bool,
    /// Shown greyed in an empty optional field.
    pub hint: &'a str,
}

impl QtyField<'_> {
    /// Draw the field in a two-column grid row; push an edit when the text parses.
    pub fn show(self, ui: &mut Ui, bufs: &mut FieldBuffers, derived: &Derived, out: &mut Vec<Command>, set: Setter) {
        let (dimension, sign) = (self.dimension, self.sign);
        let check = move |t: &str| parse_quantity(t, dimension, sign).map(|_| ()).map_err(|e| e.to_string());
        self.show_checked(ui, bufs, derived, out, set, &check);
    }

    /// As [`QtyField::show`], with the core's own check of the text in place
    /// of the parser for `dimension` (a rated load: a force, or a mass as on
    /// the tag).
    pub fn show_checked(
        self,
        ui: &mut Ui,
        bufs: &mut FieldBuffers,
        derived: &Derived,
        out: &mut Vec<Command>,
        set: Setter,
        check: &dyn Fn(&str) -> Result<(), String>,
    ) {
        let label = ui.label(self.label);
        let mut text =
            bufs.get(&self.path).map_or_else(|| self.current.map(|q| q.0.clone()).unwrap_or_default(), str::to_string);
        let before = text.clone();
        ui.vertical(|ui| {
            let resp = ui
                .add(egui::TextEdit::singleline(&mut text).hint_text(self.hint).desired_width(150.0))
                .labelled_by(label.id);
            if resp.changed() && text != before {
                let parsed = if self.optional && text.trim().is_empty() {
                    Ok(None)
                } else {
                    check(&text).map(|()| Some(Qty(text.trim().to_string())))
                };
                match parsed {
                    Ok(q) => {
                        bufs.0.remove(&self.path);
                        out.push(Command::Edit {
                            merge_key: Some(self.path.clone()),
                            apply: Box::new(move |d| {
                                set(d, q);
                                None
                            }),
                        });
                    }
                    Err(_) => {
                        bufs.0.insert(self.path.clone(), text.clone());
                    }
                }
            }
            if resp.lost_focus() {
                out.push(Command::SealUndo);
            }
            let typing = bufs.get(&self.path).map(str::to_string);
            if let Some(t) = typing {
                if let Err(e) = check(&t) {
                    ui.label(RichText::new(e).color(ERROR).small());
                }
            } else {
                for p in derived.problems_at(&self.path) {
                    ui.label(RichText::new(&p.message).color(ERROR).small());
                }
            }
        });
        ui.end_row();
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_list_forgets_its_items_text_and_nothing_else() {
        let mut b = FieldBuffers::default();
        b.put("members[0].fittings[1].wll", "2 tt");
        b.put("members[0].fittings", "x");
        b.put("members[0].fittings_extra", "y");
        b.put("members[1].fittings[0].wll", "z");
        b.remove_under("members[0].fittings");
        assert_eq!(b.get("members[0].fittings[1].wll"), None);
        assert_eq!(b.get("members[0].fittings"), None);
        assert_eq!(b.get("members[0].fittings_extra"), Some("y"));
        assert_eq!(b.get("members[1].fittings[0].wll"), Some("z"));
    }
}
