//! The widgets over the canvas: the view switch (elevation, plan, side,
//! 3-D; keys 1 to 4) with the multi-leg sling helper's button, the chooser
//! that opens when a click lands on several items, the cursor readout (the
//! view's two coordinates in the display unit, and the coordinate new
//! nodes keep), and the legend's fold switch. They are widgets, not paint,
//! so they can be read out and clicked.

use crate::canvas::CanvasState;
use crate::canvas::input::CanvasInput;
use crate::canvas::view::{View, ViewKind};
use crate::document::command::Command;
use crate::document::selection::Selection;
use crate::fields::units_display::Shown;
use egui::{Align2, Color32, Pos2, RichText, Stroke, Ui, vec2};

/// Height the view switch takes at the top of the canvas, pt.
pub const SWITCH_HEIGHT: f32 = 34.0;

/// Keys 1 to 4 switch the view (outside text fields).
pub fn view_keys(ui: &Ui, view: &mut View) {
    if ui.ctx().egui_wants_keyboard_input() {
        return;
    }
    for kind in ViewKind::ALL {
        if ui.input_mut(|i| i.consume_key(egui::Modifiers::NONE, kind.key())) {
            switch(view, kind);
        }
    }
}

/// Show another view, fitted to the drawing.
pub fn switch(view: &mut View, kind: ViewKind) {
    if view.kind != kind {
        view.kind = kind;
        view.fit_pending = true;
    }
}

/// How an item is named in the chooser.
pub fn item_label(s: &Selection) -> String {
    match s {
        Selection::None => "nothing".to_string(),
        Selection::Node(id) => format!("Node {id}"),
        Selection::Member(id) => format!("Member {id}"),
        Selection::Mass(id) => format!("Mass {id}"),
        Selection::Floor(id) => format!("Floor {id}"),
        Selection::Rope(id) => format!("Rope {id}"),
    }
}

fn area(ui: &Ui, id: &str, at: Pos2, pivot: Align2) -> egui::Area {
    egui::Area::new(ui.scope_id().with(id)).fixed_pos(at).pivot(pivot).order(egui::Order::Foreground).constrain(false)
}

/// Narrower than this (points), the view switch uses the short names.
const NARROW_CANVAS: f32 = 640.0;

/// Whether the canvas has room for the legend beside the rig: the legend
/// is 190 × 112 points, a quarter of a canvas of at least 520 × 320.
pub fn legend_fits(rect: egui::Rect) -> bool {
    rect.width() >= 520.0 && rect.height() >= 320.0
}

/// Draw the widgets over the canvas and act on them.
#[allow(clippy::too_many_arguments, reason = "the canvas's pieces, passed apart to keep the borrows short")]
pub fn ui(
    ui: &mut Ui,
    state: &mut CanvasState,
    view: &mut View,
    response: &egui::Response,
    input: &CanvasInput<'_>,
    keep: [f64; 3],
    placing: bool,
    out: &mut Vec<Command>,
) {
    let rect = view.rect;
    // the view switch, top left
    area(ui, "view-switch", rect.left_top() + vec2(8.0, 6.0), Align2::LEFT_TOP).show(ui.ctx(), |ui| {
        egui::Frame::new().fill(ui.visuals().window_fill).corner_radius(4.0).inner_margin(3.0).show(ui, |ui| {
            // a narrow canvas gets the short names, so the row never runs
            // under the legend's switch
            let narrow = rect.width() < NARROW_CANVAS;
            ui.horizontal(|ui| {
                for kind in ViewKind::ALL {
                    let key = format!(
                        "{}, key {}",
                        kind.label(),
                        ViewKind::ALL.iter().position(|k| *k == kind).unwrap_or(0) + 1
                    );
                    let name = if narrow { kind.short_label() } else { kind.label() };
                    if ui.selectable_label(view.kind == kind, name).on_hover_text(key).clicked() {
                        switch(view, kind);
                    }
                }
                ui.separator();
                let sling =
                    egui::Button::selectable(state.sling.open, if narrow { "Sling…" } else { "Multi-leg sling…" });
                if ui.add(sling).on_hover_text("Pick a hook point and 2 to 4 pick points to place the legs").clicked() {
                    state.sling.toggle();
                }
            });
        });
    });

    // the legend's fold switch, top right; a canvas too small for the
    // legend beside the rig shows neither rather than cover the drawing
    let legend_text = if state.legend_hidden { "Show legend" } else { "Hide legend" };
    area(ui, "legend-switch", rect.right_top() + vec2(-14.0, 6.0), Align2::RIGHT_TOP).show(ui.ctx(), |ui| {
        if legend_fits(rect) && ui.small_button(legend_text).clicked() {
            state.legend_hidden = !state.legend_hidden;
        }
    });

    // the cursor readout, bottom right
    let units = input.units;
    let readout = match (view.kind.axes(), response.hover_pos()) {
        (Some([a, b]), Some(p)) => {
            let [u, v] = view.to_world(p);
            // plan shows −z upwards on screen; the readout says z itself
            let v = if view.kind == ViewKind::Plan { -v } else { v };
            let mut text = format!("{a} {}   {b} {}", units.fmt(u, Shown::Length), units.fmt(v, Shown::Length));
            if placing {
                let hidden = match view.kind {
                    ViewKind::Elevation => ("z", keep[2]),
                    ViewKind::Plan => ("y", keep[1]),
                    _ => ("x", keep[0]),
                };
                let from =
                    if matches!(input.selection, Selection::Node(_)) { "the selected node's" } else { "none selected" };
                text.push_str(&format!(
                    "   · new nodes at {} {} ({from})",
                    hidden.0,
                    units.fmt(hidden.1, Shown::Length)
                ));
            }
            Some(text)
        }
        (None, _) if placing || state.dragging.is_some() => {
            Some("3-D is for looking and picking: use plan, elevation or side to place".to_string())
        }
        (None, _) => Some("drag to turn, right or middle drag to pan, scroll to zoom".to_string()),
        _ => None,
    };
    if let Some(text) = readout {
        area(ui, "readout", rect.right_bottom() + vec2(-10.0, -8.0), Align2::RIGHT_BOTTOM).show(ui.ctx(), |ui| {
            egui::Frame::new().fill(ui.visuals().window_fill).corner_radius(3.0).inner_margin(4.0).show(ui, |ui| {
                ui.add(egui::Label::new(RichText::new(text).monospace().size(12.0)).extend());
            });
        });
    }

    // the chooser, where the click landed
    if let Some((at, items)) = state.chooser.clone() {
        let mut picked: Option<Selection> = None;
        let shown = area(ui, "chooser", at + vec2(12.0, 4.0), Align2::LEFT_TOP).show(ui.ctx(), |ui| {
            egui::Frame::popup(ui.style()).stroke(Stroke::new(1.5, Color32::from_rgb(0x1f, 0x5f, 0xd6))).show(
                ui,
                |ui| {
                    ui.label(RichText::new("Several items here:").small());
                    for s in &items {
                        if ui.button(item_label(s)).clicked() {
                            picked = Some(s.clone());
                        }
                    }
                },
            );
        });
        let clicked_elsewhere = ui.input(|i| i.pointer.primary_clicked())
            && ui.input(|i| i.pointer.interact_pos()).is_some_and(|p| !shown.response.rect.contains(p))
            && !response.clicked();
        if let Some(s) = picked {
            out.push(Command::Select(s));
            state.chooser = None;
        } else if clicked_elsewhere || ui.input(|i| i.key_pressed(egui::Key::Escape)) {
            state.chooser = None;
        }
    }
}
