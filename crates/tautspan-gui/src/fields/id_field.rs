//! The id field of the inspector and the cases panel. The new id is taken
//! when the field is left (Enter or a click elsewhere), as one undoable
//! edit that renames every reference; until then, and when it is refused,
//! the text stays in the field with the reason under it.

use crate::document::command::Command;
use crate::document::rename::{self, IdKind};
use crate::fields::qty_field::{ERROR, FieldBuffers};
use egui::{RichText, Ui};
use tautspan_core::file::ScenarioDto;

/// Draw the id field of an item in a two-column grid row. Returns the new
/// id when a rename was asked for this frame.
pub fn show(
    ui: &mut Ui,
    label: &str,
    bufs: &mut FieldBuffers,
    dto: &ScenarioDto,
    kind: IdKind,
    current: &str,
    out: &mut Vec<Command>,
) -> Option<String> {
    let key = format!("rename:{}:{current}", kind.noun());
    let l = ui.label(label);
    let mut text = bufs.get(&key).map_or_else(|| current.to_string(), str::to_string);
    let mut renamed = None;
    ui.vertical(|ui| {
        let resp = ui.add(egui::TextEdit::singleline(&mut text).desired_width(150.0)).labelled_by(l.id);
        if resp.changed() {
            bufs.put(&key, &text);
        }
        let refused = rename::refusal(dto, kind, current, &text);
        if resp.lost_focus() && refused.is_none() {
            bufs.remove(&key);
            let new = text.trim().to_string();
            if new != current {
                let old = current.to_string();
                let to = new.clone();
                out.push(Command::Edit {
                    merge_key: None,
                    apply: Box::new(move |d| rename::rename(d, kind, &old, &to)),
                });
                out.push(Command::SealUndo);
                renamed = Some(new);
            }
        }
        if let Some(r) = refused {
            ui.label(RichText::new(r).color(ERROR).small());
        }
    });
    ui.end_row();
    renamed
}
