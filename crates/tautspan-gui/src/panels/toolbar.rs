//! The top of the window: the File and Edit menus, the canvas tools with
//! the member kind to place, fit-to-view and snap, the units switch, and the
//! caution line that is always in view.

use crate::canvas::view::View;
use crate::document::command::Command;
use crate::document::selection::Tool;
use crate::fields::units_display::UnitSystem;
use crate::files::prefs::Prefs;
use egui::{Color32, RichText, Ui};
use std::path::PathBuf;
use tautspan_core::library::MemberKind;

/// The state the toolbar reads and may change in place (view settings and
/// preferences are not part of the document, so they are not commands).
pub struct ToolbarInput<'a> {
    /// Active tool.
    pub tool: Tool,
    /// Kind the member tool places.
    pub member_kind: &'a mut MemberKind,
    /// Preferences (units, recent files).
    pub prefs: &'a mut Prefs,
    /// Canvas view (snap).
    pub view: &'a mut View,
    /// Undo possible.
    pub can_undo: bool,
    /// Redo possible.
    pub can_redo: bool,
}

/// Draw the menus and tools.
pub fn ui(ui: &mut Ui, input: ToolbarInput<'_>, out: &mut Vec<Command>) {
    egui::MenuBar::new().ui(ui, |ui| {
        ui.menu_button("File", |ui| {
            if ui.button("New  (Ctrl+N)").clicked() {
                out.push(Command::New);
            }
            if ui.button("Open…  (Ctrl+O)").clicked() {
                out.push(Command::Open);
            }
            let recent: Vec<PathBuf> = input.prefs.recent.clone();
            ui.menu_button("Open recent", |ui| {
                if recent.is_empty() {
                    ui.label("none yet");
                }
                for p in recent {
                    if ui.button(p.display().to_string()).clicked() {
                        out.push(Command::OpenPath(p));
                    }
                }
            });
            if ui.button("Save  (Ctrl+S)").clicked() {
                out.push(Command::Save);
            }
            if ui.button("Save as…  (Ctrl+Shift+S)").clicked() {
                out.push(Command::SaveAs);
            }
            ui.separator();
            if ui.button("Export report…").clicked() {
                out.push(Command::ExportReport);
            }
            ui.separator();
            if ui.button("Quit").clicked() {
                out.push(Command::Quit);
            }
        });
        ui.menu_button("Edit", |ui| {
            if ui.add_enabled(input.can_undo, egui::Button::new("Undo  (Ctrl+Z)")).clicked() {
                out.push(Command::Undo);
            }
            if ui.add_enabled(input.can_redo, egui::Button::new("Redo  (Ctrl+Shift+Z)")).clicked() {
                out.push(Command::Redo);
            }
            if ui.button("Delete selection  (Del)").clicked() {
                out.push(Command::DeleteSelection);
            }
        });
        ui.separator();
        ui.label("Units");
        for u in [UnitSystem::Si, UnitSystem::UsCustomary] {
            ui.radio_value(&mut input.prefs.units, u, u.label());
        }
        ui.separator();
        ui.checkbox(&mut input.prefs.hide_labels, "Hide force labels");
        ui.checkbox(&mut input.prefs.worst_case_colours, "Worst case colours")
            .on_hover_text("Colour each member by its largest utilisation over all cases, not the case shown");
    });
    // wraps in a narrow window, so the caution below keeps the full width
    ui.horizontal_wrapped(|ui| {
        for t in [
            Tool::Select,
            Tool::Anchor,
            Tool::Joint,
            Tool::Member(*input.member_kind),
            Tool::Rope,
            Tool::Mass,
            Tool::FloorNode,
        ] {
            let on = std::mem::discriminant(&input.tool) == std::mem::discriminant(&t);
            if ui.add(egui::Button::selectable(on, t.label())).on_hover_text(t.hint()).clicked() {
                out.push(Command::SetTool(t));
            }
        }
        let l = ui.label("Member kind");
        let before = *input.member_kind;
        egui::ComboBox::from_id_salt("member-kind")
            .selected_text(input.member_kind.label())
            .show_ui(ui, |ui| {
                for k in MemberKind::ALL {
                    ui.selectable_value(input.member_kind, k, k.label());
                }
            })
            .response
            .labelled_by(l.id);
        if *input.member_kind != before {
            out.push(Command::SetTool(Tool::Member(*input.member_kind)));
        }
        ui.separator();
        if ui.button("Fit view").clicked() {
            out.push(Command::FitView);
        }
        ui.checkbox(&mut input.view.snap, "Snap to grid");
        ui.separator();
        ui.checkbox(&mut input.view.deflected, "Deflected shape")
            .on_hover_text("Draw the solved positions of the shown case, displacements magnified");
        let l = ui.label("Magnification");
        ui.add_enabled_ui(input.view.deflected, |ui| {
            egui::ComboBox::from_id_salt("magnification")
                .selected_text(format!("×{}", input.view.magnification))
                .show_ui(ui, |ui| {
                    for m in crate::canvas::deflected::MAGNIFICATIONS {
                        ui.selectable_value(&mut input.view.magnification, m, format!("×{m}"));
                    }
                })
                .response
                .labelled_by(l.id);
        });
    });
    ui.add(
        egui::Label::new(
            RichText::new(format!("Caution: {}", tautspan_core::CAUTION)).color(Color32::from_rgb(0xe8, 0xb0, 0x3a)),
        )
        .wrap(),
    );
}
