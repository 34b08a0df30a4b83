//! The app: one struct holding the document, the derived results and the
//! UI state. Each frame draws the panels, which return commands; the
//! commands are applied after the frame. A changed document goes to the
//! solve worker (`derived`, `solve_worker`); the frame never waits for it.
//! File handling is in `files::app_files`.

use crate::canvas::view::View;
use crate::canvas::{self, CanvasInput, CanvasState};
use crate::document::command::Command;
use crate::document::derived::Derived;
use crate::document::edits;
use crate::document::selection::{Selection, Tool};
use crate::document::{Document, blank_scenario};
use crate::fields::qty_field::{ERROR, FieldBuffers};
use crate::files::Files;
use crate::files::prefs::{LowerTab, Prefs};
use crate::panels::inspector::{self, InspectorInput};
use crate::panels::plots::Plots;
use crate::panels::results_table::{self, ResultsView};
use crate::panels::toolbar::{self, ToolbarInput};
use crate::panels::{cases, warnings};
use egui::{Key, KeyboardShortcut, Modifiers, RichText, Ui};
use std::path::PathBuf;
use tautspan_core::library::MemberKind;

/// A message for the user, shown under the caution until dismissed.
#[derive(Debug, Clone, PartialEq)]
pub enum Message {
    /// Something worked.
    Info(String),
    /// Something failed; the text says where and why.
    Error(String),
}

/// An action waiting for the user to decide about unsaved changes.
#[derive(Debug, Clone, PartialEq)]
pub enum Pending {
    /// Start a new scenario.
    New,
    /// Open through the dialog.
    Open,
    /// Open a given file.
    OpenPath(PathBuf),
    /// Close the app.
    Quit,
}

/// The whole app.
pub struct TautspanApp {
    /// The open scenario.
    pub doc: Document,
    /// Preferences kept between runs.
    pub prefs: Prefs,
    /// Validation and analysis of the document.
    pub derived: Derived,
    /// The canvas's pan and zoom.
    pub view: View,
    /// What is selected.
    pub selection: Selection,
    /// The canvas tool.
    pub tool: Tool,
    /// The kind the member tool places.
    pub member_kind: MemberKind,
    /// The case the canvas shows (the first when `None`).
    pub shown_case: Option<String>,
    /// The canvas's state between frames.
    pub canvas: CanvasState,
    /// Unfinished text in quantity fields.
    pub fields: FieldBuffers,
    /// File dialogs and the path field.
    pub files: Files,
    /// Plots and their worker jobs.
    pub plots: Plots,
    /// The results grid's sort and filters.
    pub results: ResultsView,
    /// The message shown under the caution.
    pub message: Option<Message>,
    /// An action waiting on unsaved changes.
    pub pending: Option<Pending>,
    /// A deletion waiting for the user's yes: the item and what goes with it.
    pub confirm_delete: Option<(Selection, Vec<String>)>,
    /// The report waiting for a path.
    pub(crate) report_html: Option<String>,
    /// The CSV waiting for a path.
    pub(crate) csv_text: Option<String>,
    /// The report waits for the results of the current revision.
    pub(crate) export_waiting: bool,
    /// Unsaved work kept for crash recovery, and work found at start.
    pub recovery: crate::files::recovery::Recovery,
    /// The user chose to close without saving.
    pub(crate) quit_allowed: bool,
    /// Set when the app asked the window to close.
    pub close_requested: bool,
    last_title: String,
}

impl TautspanApp {
    /// The app on a scenario document.
    pub fn with_document(doc: Document, prefs: Prefs) -> TautspanApp {
        TautspanApp {
            doc,
            prefs,
            derived: Derived::default(),
            view: View::default(),
            selection: Selection::None,
            tool: Tool::Select,
            member_kind: MemberKind::WireRope,
            shown_case: None,
            canvas: CanvasState::default(),
            fields: FieldBuffers::default(),
            files: Files::default(),
            plots: Plots::default(),
            results: ResultsView::default(),
            message: None,
            pending: None,
            confirm_delete: None,
            recovery: crate::files::recovery::Recovery::default(),
            report_html: None,
            csv_text: None,
            export_waiting: false,
            quit_allowed: false,
            close_requested: false,
            last_title: String::new(),
        }
    }

    /// The app on the built-in demo.
    pub fn demo(prefs: Prefs) -> TautspanApp {
        match tautspan_core::model::load_scenario(crate::DEMO_SCENARIO) {
            Ok(l) => TautspanApp::with_document(Document::new(l.dto, None), prefs),
            Err(e) => {
                let mut app = TautspanApp::with_document(Document::new(blank_scenario(), None), prefs);
                app.message = Some(Message::Error(format!("the built-in demo does not load: {e}")));
                app
            }
        }
    }

    /// The app on a file, or on the demo when `None`. A file that does not
    /// load leaves a new scenario open and says why. Unsaved work is kept in
    /// the platform's state folder, and work left there by a session that
    /// ended unexpectedly is offered back.
    pub fn start(file: Option<PathBuf>, prefs: Prefs) -> TautspanApp {
        TautspanApp::start_with_recovery(file, prefs, crate::files::recovery::default_file())
    }

    /// As [`TautspanApp::start`], with the recovery file given (`None`: no recovery).
    pub fn start_with_recovery(file: Option<PathBuf>, prefs: Prefs, recovery: Option<PathBuf>) -> TautspanApp {
        let mut app = TautspanApp::open_at_start(file, prefs);
        app.recovery = crate::files::recovery::Recovery::at(recovery);
        app
    }

    fn open_at_start(file: Option<PathBuf>, prefs: Prefs) -> TautspanApp {
        match file {
            None => TautspanApp::demo(prefs),
            Some(p) => match crate::files::read_scenario(&p) {
                Ok(dto) => {
                    let mut app = TautspanApp::with_document(Document::new(dto, Some(p.clone())), prefs);
                    app.prefs.remember(&p);
                    app
                }
                Err(e) => {
                    let mut app = TautspanApp::with_document(Document::new(blank_scenario(), None), prefs);
                    app.message = Some(Message::Error(e));
                    app
                }
            },
        }
    }

    /// Queue a command as if a panel had returned it (used by tests and the bench).
    pub fn apply(&mut self, ctx: &egui::Context, commands: Vec<Command>) {
        if !commands.is_empty() {
            self.derived.before_edit();
        }
        for c in commands {
            self.apply_one(ctx, c);
        }
        self.derived.refresh(&self.doc, ctx);
        if self.export_waiting && self.derived.is_current(&self.doc) {
            self.export_waiting = false;
            self.file_command(ctx, Command::ExportReport);
        }
    }

    /// Block until the results for the current revision are in (tests and
    /// the benchmark; the app itself never waits on the solver). Returns
    /// whether they arrived within a minute.
    pub fn wait_for_results(&mut self) -> bool {
        self.derived.wait_for(&self.doc, std::time::Duration::from_secs(60))
    }

    fn apply_one(&mut self, ctx: &egui::Context, c: Command) {
        match c {
            Command::Edit { merge_key, apply } => {
                let mut picked = None;
                self.doc.edit(merge_key.as_deref(), |d| picked = apply(d));
                if let Some(s) = picked {
                    self.selection = s;
                }
            }
            Command::SealUndo => self.doc.undo.seal(),
            Command::Select(s) => self.selection = s,
            Command::SetTool(t) => {
                self.tool = t;
                self.canvas.member_start = None;
                self.canvas.rope_path.clear();
                if let Tool::Member(k) = t {
                    self.member_kind = k;
                }
            }
            Command::Undo | Command::Redo => {
                let stepped = if matches!(c, Command::Undo) { self.doc.undo() } else { self.doc.redo() };
                if stepped {
                    self.fields.clear();
                    // an undone placement or rename leaves nothing behind the selection
                    if !self.selection.is_in(&self.doc.dto) {
                        self.selection = Selection::None;
                    }
                }
            }
            Command::DeleteSelection => {
                let goes_with = edits::dependents(&self.doc.dto, &self.selection);
                if goes_with.is_empty() {
                    let sel = std::mem::take(&mut self.selection);
                    self.doc.edit(None, |d| edits::delete(d, &sel));
                } else {
                    self.confirm_delete = Some((self.selection.clone(), goes_with));
                }
            }
            Command::ConfirmDelete(sel) => {
                self.confirm_delete = None;
                if self.selection == sel {
                    self.selection = Selection::None;
                }
                self.doc.edit(None, |d| edits::delete(d, &sel));
            }
            Command::FinishRope => {
                if let Some(place) = crate::canvas::finish_rope(&mut self.canvas, self.prefs.units) {
                    self.apply_one(ctx, place);
                }
            }
            Command::Escape => {
                // a rope routed part way is dropped whole
                let routing = !std::mem::take(&mut self.canvas.rope_path).is_empty();
                if self.canvas.member_start.take().is_none() && !routing {
                    if self.tool != Tool::Select {
                        self.tool = Tool::Select;
                    } else {
                        self.selection = Selection::None;
                    }
                }
            }
            Command::ShowCase(id) => self.shown_case = Some(id),
            Command::FitView => self.view.fit_pending = true,
            Command::New | Command::Open | Command::OpenPath(_) | Command::Quit => self.guarded(ctx, c),
            Command::Save | Command::SaveAs | Command::SaveTo(_) | Command::ExportReport | Command::ExportCsv(_) => {
                self.file_command(ctx, c)
            }
        }
    }

    /// New/Open/Quit: ask first when there are unsaved changes.
    fn guarded(&mut self, ctx: &egui::Context, c: Command) {
        let pending = match c {
            Command::New => Pending::New,
            Command::Open => Pending::Open,
            Command::OpenPath(p) => Pending::OpenPath(p),
            _ => Pending::Quit,
        };
        if self.doc.dirty {
            self.pending = Some(pending);
        } else {
            self.proceed(ctx, pending);
        }
    }

    /// Carry out an action that was waiting on unsaved changes.
    pub(crate) fn proceed(&mut self, ctx: &egui::Context, p: Pending) {
        self.pending = None;
        match p {
            Pending::New => {
                self.doc.replace(blank_scenario(), None);
                self.after_replace();
            }
            Pending::Open => self.files.ask(crate::files::Purpose::Open, ctx, self.doc.path.as_deref()),
            Pending::OpenPath(path) => self.open_path(&path),
            Pending::Quit => {
                // closed by choice: the unsaved work is not kept for recovery
                self.recovery.clear();
                self.quit_allowed = true;
                self.close_requested = true;
                ctx.send_viewport_cmd(egui::ViewportCommand::Close);
            }
        }
    }

    pub(crate) fn after_replace(&mut self) {
        self.selection = Selection::None;
        self.shown_case = None;
        self.fields.clear();
        self.canvas = CanvasState::default();
        self.view.fit_pending = true;
        self.derived.forget(&self.doc);
    }

    fn shortcuts(&mut self, ui: &Ui, out: &mut Vec<Command>) {
        let typing = ui.ctx().egui_wants_keyboard_input();
        let cmd_shift = Modifiers::COMMAND | Modifiers::SHIFT;
        ui.input_mut(|i| {
            if i.consume_shortcut(&KeyboardShortcut::new(cmd_shift, Key::Z)) {
                out.push(Command::Redo);
            }
            if i.consume_shortcut(&KeyboardShortcut::new(cmd_shift, Key::S)) {
                out.push(Command::SaveAs);
            }
            if !typing && i.consume_shortcut(&KeyboardShortcut::new(Modifiers::COMMAND, Key::Z)) {
                out.push(Command::Undo);
            }
            if i.consume_shortcut(&KeyboardShortcut::new(Modifiers::COMMAND, Key::Y)) {
                out.push(Command::Redo);
            }
            if i.consume_shortcut(&KeyboardShortcut::new(Modifiers::COMMAND, Key::S)) {
                out.push(Command::Save);
            }
            if i.consume_shortcut(&KeyboardShortcut::new(Modifiers::COMMAND, Key::O)) {
                out.push(Command::Open);
            }
            if i.consume_shortcut(&KeyboardShortcut::new(Modifiers::COMMAND, Key::N)) {
                out.push(Command::New);
            }
            if !typing && (i.key_pressed(Key::Delete) || i.key_pressed(Key::Backspace)) {
                out.push(Command::DeleteSelection);
            }
            if !typing && i.key_pressed(Key::Enter) {
                out.push(Command::FinishRope);
            }
            if !typing && i.key_pressed(Key::Escape) {
                out.push(Command::Escape);
            }
        });
    }

    /// One frame of the whole app inside `ui`.
    pub fn frame(&mut self, ui: &mut Ui) {
        self.derived.refresh(&self.doc, ui.ctx());
        match self.recovery.tick(&self.doc) {
            Ok(Some(due)) => ui.ctx().request_repaint_after(due),
            Ok(None) => {}
            Err(e) => {
                self.message = Some(Message::Error(format!("Unsaved work could not be kept for recovery: {e}")));
                self.recovery.file = None;
            }
        }
        self.poll_files(ui.ctx());
        let mut out: Vec<Command> = Vec::new();
        self.shortcuts(ui, &mut out);

        egui::Panel::top("toolbar").show(ui, |ui| {
            let input = ToolbarInput {
                tool: self.tool,
                member_kind: &mut self.member_kind,
                prefs: &mut self.prefs,
                view: &mut self.view,
                can_undo: self.doc.undo.can_undo(),
                can_redo: self.doc.undo.can_redo(),
            };
            toolbar::ui(ui, input, &mut out);
            self.message_ui(ui);
        });
        egui::Panel::top("verdict").show(ui, |ui| {
            crate::panels::verdict_bar::ui(ui, &self.derived, &mut out);
            let bad = crate::fields::invalid::invalid_fields(&self.fields, &self.doc.dto);
            if !bad.is_empty() {
                ui.label(
                    RichText::new(format!(
                        "Results STALE: {} not a valid value; the results are of the last valid one.",
                        bad.join("; ") + if bad.len() == 1 { " is" } else { " are" }
                    ))
                    .color(ERROR)
                    .strong(),
                );
            }
        });
        egui::Panel::bottom("status").show(ui, |ui| self.status_ui(ui));
        // a third of the window at first; the grip on its top edge shows it can be dragged
        let lower_default = (ui.max_rect().height() / 3.0).max(200.0);
        egui::Panel::bottom("lower").resizable(true).default_size(lower_default).show(ui, |ui| {
            split_grip(ui);
            // the panel keeps its size while its content is short (no results yet)
            ui.set_min_height(ui.available_height());
            ui.horizontal(|ui| {
                ui.selectable_value(&mut self.prefs.lower_tab, LowerTab::Results, "Results");
                ui.selectable_value(&mut self.prefs.lower_tab, LowerTab::Plots, "Plots");
            });
            ui.separator();
            match self.prefs.lower_tab {
                LowerTab::Results => {
                    results_table::ui(ui, &self.derived, &self.selection, &mut self.results, self.prefs.units, &mut out)
                }
                LowerTab::Plots => {
                    self.plots.ui(
                        ui,
                        &self.doc,
                        &self.derived,
                        &self.selection,
                        self.shown_case.as_deref(),
                        self.prefs.units,
                    );
                }
            }
        });
        egui::Panel::left("cases").resizable(true).default_size(270.0).show(ui, |ui| {
            egui::ScrollArea::vertical().show(ui, |ui| {
                cases::ui(
                    ui,
                    &self.doc,
                    &self.derived,
                    self.shown_case.as_deref(),
                    self.prefs.units,
                    &mut self.fields,
                    &mut out,
                );
                ui.separator();
                warnings::ui(ui, &self.doc, &self.derived, &mut out);
            });
        });
        egui::Panel::right("inspector").resizable(true).default_size(330.0).show(ui, |ui| {
            egui::ScrollArea::vertical().show(ui, |ui| {
                let input = InspectorInput {
                    doc: &self.doc,
                    derived: &self.derived,
                    selection: &self.selection,
                    case: self.shown_case.as_deref(),
                    units: self.prefs.units,
                };
                inspector::ui(ui, &input, &mut self.fields, &mut out);
            });
        });
        egui::CentralPanel::default().frame(egui::Frame::NONE).show(ui, |ui| {
            let input = CanvasInput {
                doc: &self.doc,
                derived: &self.derived,
                case: self.shown_case.as_deref(),
                selection: &self.selection,
                tool: self.tool,
                units: self.prefs.units,
                labels: !self.prefs.hide_labels,
                worst_case: self.prefs.worst_case_colours,
            };
            canvas::ui(ui, &mut self.canvas, &mut self.view, &input, &mut out);
        });
        self.dialogs_ui(ui.ctx(), &mut out);
        crate::panels::confirm_delete::ui(ui.ctx(), &mut self.confirm_delete, &mut out);
        self.recovery_ui(ui.ctx());
        let ctx = ui.ctx().clone();
        self.apply(&ctx, out);
    }

    fn message_ui(&mut self, ui: &mut Ui) {
        let Some(m) = self.message.clone() else { return };
        ui.horizontal(|ui| {
            let text = match &m {
                Message::Info(t) => RichText::new(t),
                Message::Error(t) => RichText::new(t).color(ERROR),
            };
            ui.label(text);
            if ui.small_button("Dismiss").clicked() {
                self.message = None;
            }
        });
    }

    fn status_ui(&self, ui: &mut Ui) {
        ui.horizontal(|ui| {
            ui.label(self.tool.hint());
            ui.separator();
            if self.derived.is_updating() {
                ui.spinner();
                ui.label("updating results…");
                ui.separator();
            }
            match &self.derived.solved {
                Some(s) => {
                    let n = s.analysis.cases.len();
                    let ok = s.analysis.cases.iter().filter(|c| c.converged && c.error.is_none()).count();
                    let text = format!("solved in {:.1} ms · {ok} of {n} cases converged", self.derived.solve_ms);
                    ui.label(if ok == n { RichText::new(text) } else { RichText::new(text).color(ERROR) });
                }
                None if self.derived.problems.is_empty() => {}
                None => {
                    ui.label(
                        RichText::new(format!(
                            "not solved: {} problem(s) in the scenario",
                            self.derived.problems.len()
                        ))
                        .color(ERROR),
                    );
                }
            }
            if self.files.in_flight.is_some() {
                ui.separator();
                ui.spinner();
                ui.label("waiting for the file dialog…");
            }
        });
    }
}

/// A grip drawn on the lower panel's top edge, where it is dragged to resize.
fn split_grip(ui: &Ui) {
    let r = ui.max_rect();
    let centre = egui::pos2(r.center().x, r.top() - 3.0);
    let colour = ui.visuals().widgets.noninteractive.fg_stroke.color.gamma_multiply(0.6);
    for dy in [-1.5, 1.5] {
        ui.painter().line_segment(
            [centre + egui::vec2(-22.0, dy), centre + egui::vec2(22.0, dy)],
            egui::Stroke::new(1.0, colour),
        );
    }
}

impl eframe::App for TautspanApp {
    fn ui(&mut self, ui: &mut Ui, _frame: &mut eframe::Frame) {
        let title = self.doc.title();
        if title != self.last_title {
            ui.ctx().send_viewport_cmd(egui::ViewportCommand::Title(title.clone()));
            self.last_title = title;
        }
        if ui.ctx().input(|i| i.viewport().close_requested()) && self.doc.dirty && !self.quit_allowed {
            ui.ctx().send_viewport_cmd(egui::ViewportCommand::CancelClose);
            self.pending = Some(Pending::Quit);
        }
        self.frame(ui);
    }

    fn save(&mut self, storage: &mut dyn eframe::Storage) {
        eframe::set_value(storage, crate::files::prefs::STORAGE_KEY, &self.prefs);
    }
}
