//! The inspector folder: the fields of the selected item. This file holds
//! nodes, masses, floors and the scenario itself; `input` what the
//! inspector is given, `member` members, `hitch` a member's hitch and
//! termination, `rope` ropes over sheaves, `parts` rated fittings.
//!
//! The inspector: the fields of whatever is selected, unit-aware, with the
//! validation problems of each field shown beside it. Nodes, masses and
//! floor slabs are here (an anchor's rated load and a node's fittings through
//! `parts`); members, with their library pickers, are in
//! `member`, ropes over sheaves and a node's sheave in
//! `rope`. With nothing selected: the scenario's title, notes and
//! the rule set for hitches (EN or ASME).

pub(crate) mod hitch;
pub(crate) mod input;
pub(crate) mod line;
pub(crate) mod member;
pub(crate) mod parts;
pub(crate) mod rope;

use crate::document::command::Command;
use crate::document::rename::IdKind;
use crate::document::selection::Selection;
use crate::fields::qty_field::{FieldBuffers, QtyField};
use crate::fields::units_display::Shown;
use egui::{RichText, Ui};
pub use input::{InspectorInput, item_problems};
use tautspan_core::file::{Qty, SupportDto};
use tautspan_core::library::{Edges, Rules};
use tautspan_core::units::{Dimension, Sign};

/// Draw the inspector.
pub fn ui(ui: &mut Ui, input: &InspectorInput<'_>, bufs: &mut FieldBuffers, out: &mut Vec<Command>) {
    ui.heading("Inspector");
    let dto = &input.doc.dto;
    match input.selection {
        Selection::None => {
            ui.label("Select an anchor, joint, member, rope, mass or slab on the canvas, or a row of the results.");
            scenario_fields(ui, input, out);
        }
        Selection::Node(id) => match dto.nodes.iter().position(|n| &n.id == id) {
            Some(i) => node(ui, input, i, bufs, out),
            None => {
                ui.label("The selected node no longer exists.");
            }
        },
        Selection::Member(id) => match dto.members.iter().position(|m| &m.id == id) {
            Some(i) => crate::panels::inspector::member::ui(ui, input, i, bufs, out),
            None => {
                ui.label("The selected member no longer exists.");
            }
        },
        Selection::Rope(id) => match dto.ropes.iter().position(|r| &r.id == id) {
            Some(i) => crate::panels::inspector::rope::ui(ui, input, i, bufs, out),
            None => {
                ui.label("The selected rope no longer exists.");
            }
        },
        Selection::Mass(id) => match dto.masses.iter().position(|m| &m.id == id) {
            Some(i) => mass(ui, input, i, bufs, out),
            None => {
                ui.label("The selected mass no longer exists.");
            }
        },
        Selection::Floor(id) => match dto.floors.iter().position(|f| &f.id == id) {
            Some(i) => floor(ui, input, i, bufs, out),
            None => {
                ui.label("The selected slab no longer exists.");
            }
        },
    }
}

fn scenario_fields(ui: &mut Ui, input: &InspectorInput<'_>, out: &mut Vec<Command>) {
    ui.separator();
    let label = ui.label("Title");
    let mut title = input.doc.dto.title.clone();
    if ui.text_edit_singleline(&mut title).labelled_by(label.id).changed() {
        out.push(Command::edit_merged("title", move |d| d.title = title));
    }
    egui::Grid::new("scenario-fields").num_columns(2).show(ui, |ui| {
        // not stated reads as EN; a choice is written out
        let current = input.doc.dto.rules.unwrap_or_default();
        let options = [(Rules::En, "EN"), (Rules::Asme, "ASME")];
        if let Some(r) = crate::panels::inspector::hitch::choice(ui, "Rules for hitches", "rules", current, &options) {
            out.push(Command::edit(move |d| d.rules = Some(r)));
        }
    });
    ui.label(RichText::new(input.doc.dto.rules.unwrap_or_default().label()).small().weak());
    let label = ui.label("Notes");
    let mut notes = input.doc.dto.notes.clone();
    if ui.add(egui::TextEdit::multiline(&mut notes).desired_rows(3)).labelled_by(label.id).changed() {
        out.push(Command::edit_merged("notes", move |d| d.notes = notes));
    }
}

fn node(ui: &mut Ui, input: &InspectorInput<'_>, i: usize, bufs: &mut FieldBuffers, out: &mut Vec<Command>) {
    let n = &input.doc.dto.nodes[i];
    let kind = match n.support {
        SupportDto::Anchor => "Anchor",
        SupportDto::Joint => "Joint",
        SupportDto::Floor(_) => "Floor node",
    };
    ui.label(RichText::new(format!("{kind} {}", n.id)).strong());
    item_problems(ui, input.derived, &format!("nodes[{i}]"));
    egui::Grid::new("node-fields").num_columns(2).show(ui, |ui| {
        crate::fields::id_field::show(ui, "Id", bufs, &input.doc.dto, IdKind::Node, &n.id, out);
        let p = format!("nodes[{i}].at");
        let hint = input.units.unit(Shown::Length);
        QtyField {
            label: "x",
            path: format!("{p}.0"),
            current: Some(&n.at.x),
            dimension: Dimension::Length,
            sign: Sign::Any,
            optional: false,
            hint,
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let (Some(n), Some(q)) = (d.nodes.get_mut(i), q) {
                    n.at.x = q
                }
            }),
        );
        QtyField {
            label: "y",
            path: format!("{p}.1"),
            current: Some(&n.at.y),
            dimension: Dimension::Length,
            sign: Sign::Any,
            optional: false,
            hint,
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let (Some(n), Some(q)) = (d.nodes.get_mut(i), q) {
                    n.at.y = q
                }
            }),
        );
        QtyField {
            label: "z",
            path: format!("{p}.2"),
            current: n.at.z.as_ref(),
            dimension: Dimension::Length,
            sign: Sign::Any,
            optional: true,
            hint: "0 (in the elevation)",
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let Some(n) = d.nodes.get_mut(i) {
                    n.at.z = q
                }
            }),
        );
        let label = ui.label("Held by");
        let current = n.support.clone();
        let mut chosen = current.clone();
        let text = |s: &SupportDto| match s {
            SupportDto::Joint => "free joint".to_string(),
            SupportDto::Anchor => "anchor (fixed)".to_string(),
            SupportDto::Floor(f) => format!("floor {f}"),
        };
        egui::ComboBox::from_id_salt("support")
            .selected_text(text(&current))
            .show_ui(ui, |ui| {
                ui.selectable_value(&mut chosen, SupportDto::Joint, text(&SupportDto::Joint));
                ui.selectable_value(&mut chosen, SupportDto::Anchor, text(&SupportDto::Anchor));
                for f in &input.doc.dto.floors {
                    let s = SupportDto::Floor(f.id.clone());
                    let t = text(&s);
                    ui.selectable_value(&mut chosen, s, t);
                }
            })
            .response
            .labelled_by(label.id);
        if chosen != current {
            out.push(Command::edit(move |d| {
                if let Some(n) = d.nodes.get_mut(i) {
                    n.support = chosen
                }
            }));
        }
        ui.end_row();
        crate::panels::inspector::parts::anchor_rating(ui, input, i, bufs, out);
    });
    crate::panels::inspector::rope::sheave(ui, input, i, bufs, out);
    crate::panels::inspector::parts::fittings(ui, input, crate::panels::inspector::parts::Host::Node(i), bufs, out);
    if let Some(r) = input.derived.case(input.case).and_then(|c| c.nodes.iter().find(|r| r.id == n.id)) {
        ui.separator();
        ui.label(format!(
            "Solved position: x {}, y {}, z {}",
            input.units.fmt(r.position_m[0], Shown::Length),
            input.units.fmt(r.position_m[1], Shown::Length),
            input.units.fmt(r.position_m[2], Shown::Length)
        ));
        crate::panels::parts_view::fittings(ui, &r.fittings, input.units);
    }
    if let Some(r) = input.derived.case(input.case).and_then(|c| c.supports.iter().find(|r| r.node == n.id)) {
        ui.label(format!(
            "Reaction: {} up, {} sideways",
            input.units.fmt(r.reaction_n[1], Shown::Force),
            input.units.fmt(r.reaction_n[0], Shown::Force)
        ));
        match &r.rated {
            Some(p) => crate::panels::parts_view::part(ui, p, input.units),
            None if n.support == SupportDto::Anchor => {
                ui.label(RichText::new("No rated load entered for this anchor: only its reaction is shown.").weak());
            }
            None => {}
        }
    }
}

fn mass(ui: &mut Ui, input: &InspectorInput<'_>, i: usize, bufs: &mut FieldBuffers, out: &mut Vec<Command>) {
    let m = &input.doc.dto.masses[i];
    ui.label(RichText::new(format!("Mass {} at {}", m.id, m.at)).strong());
    egui::Grid::new("mass-fields").num_columns(2).show(ui, |ui| {
        crate::fields::id_field::show(ui, "Id", bufs, &input.doc.dto, IdKind::Mass, &m.id, out);
        QtyField {
            label: "Mass",
            path: format!("masses[{i}].mass"),
            current: Some(&m.mass),
            dimension: Dimension::Mass,
            sign: Sign::Positive,
            optional: false,
            hint: input.units.unit(Shown::Mass),
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let (Some(m), Some(q)) = (d.masses.get_mut(i), q) {
                    m.mass = q
                }
            }),
        );
    });
    if let Some(p) = input.derived.case(input.case).and_then(|c| c.load_path.iter().find(|p| p.mass == m.id)) {
        ui.separator();
        let listed = |ids: &[String], shares: &[f64]| {
            let named: Vec<String> = ids.iter().zip(shares).map(|(id, f)| format!("{id} {:.0} %", f * 100.0)).collect();
            tautspan_core::analysis::first_few(&named, PATH_NAMED)
        };
        ui.label(format!(
            "Load path (members carrying at least {:.0} % of its weight): {}",
            tautspan_core::analysis::LOAD_PATH_THRESHOLD * 100.0,
            listed(&p.members, &p.shares)
        ));
        if p.below_threshold > 0 {
            ui.label(RichText::new(format!("{} more members carry less each", p.below_threshold)).weak());
        }
        ui.label(format!("Reaches: {}", listed(&p.supports, &p.support_shares)));
        if p.untraced_worth_saying() {
            ui.label(
                RichText::new(format!(
                    "{:.0} % of its weight is not traced to a support ({})",
                    p.untraced * 100.0,
                    tautspan_core::analysis::LoadPathResult::UNTRACED_REASON
                ))
                .weak(),
            );
        }
    }
}

/// Members (and supports) of a load path named in the inspector; "and N more".
const PATH_NAMED: usize = 6;

fn floor(ui: &mut Ui, input: &InspectorInput<'_>, i: usize, bufs: &mut FieldBuffers, out: &mut Vec<Command>) {
    let f = &input.doc.dto.floors[i];
    let u = input.units;
    ui.label(RichText::new(format!("Floor slab {}", f.id)).strong());
    item_problems(ui, input.derived, &format!("floors[{i}]"));
    let p = |s: &str| format!("floors[{i}].{s}");
    egui::Grid::new("floor-fields").num_columns(2).show(ui, |ui| {
        crate::fields::id_field::show(ui, "Id", bufs, &input.doc.dto, IdKind::Floor, &f.id, out);
        let hint = u.unit(Shown::Length);
        QtyField {
            label: "Span x",
            path: p("span.0"),
            current: Some(&f.span.0),
            dimension: Dimension::Length,
            sign: Sign::Positive,
            optional: false,
            hint,
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let (Some(f), Some(q)) = (d.floors.get_mut(i), q) {
                    f.span.0 = q
                }
            }),
        );
        QtyField {
            label: "Span z",
            path: p("span.1"),
            current: Some(&f.span.1),
            dimension: Dimension::Length,
            sign: Sign::Positive,
            optional: false,
            hint,
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let (Some(f), Some(q)) = (d.floors.get_mut(i), q) {
                    f.span.1 = q
                }
            }),
        );
        QtyField {
            label: "Thickness",
            path: p("thickness"),
            current: Some(&f.thickness),
            dimension: Dimension::Length,
            sign: Sign::Positive,
            optional: false,
            hint: u.unit(Shown::SmallLength),
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let (Some(f), Some(q)) = (d.floors.get_mut(i), q) {
                    f.thickness = q
                }
            }),
        );
        QtyField {
            label: "Modulus",
            path: p("modulus"),
            current: f.modulus.as_ref(),
            dimension: Dimension::Pressure,
            sign: Sign::Positive,
            optional: true,
            hint: "from the material",
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let Some(f) = d.floors.get_mut(i) {
                    f.modulus = q
                }
            }),
        );
        QtyField {
            label: "Rated uniform load",
            path: p("rated_uniform"),
            current: f.rated_uniform.as_ref(),
            dimension: Dimension::Pressure,
            sign: Sign::Positive,
            optional: true,
            hint: "e.g. 2.4 kPa",
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let Some(f) = d.floors.get_mut(i) {
                    f.rated_uniform = q
                }
            }),
        );
        QtyField {
            label: "Rated point load",
            path: p("rated_point"),
            current: f.rated_point.as_ref(),
            dimension: Dimension::Force,
            sign: Sign::Positive,
            optional: true,
            hint: "e.g. 8.9 kN",
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let Some(f) = d.floors.get_mut(i) {
                    f.rated_point = q
                }
            }),
        );
        for (axis, label) in [(0usize, "Origin x (corner)"), (1, "Origin z (corner)")] {
            let current = f.origin.as_ref().map(|o| if axis == 0 { &o.0 } else { &o.1 });
            QtyField {
                label,
                path: p(if axis == 0 { "origin.0" } else { "origin.1" }),
                current,
                dimension: Dimension::Length,
                sign: Sign::Any,
                optional: true,
                hint: "centred under the feet",
            }
            .show(
                ui,
                bufs,
                input.derived,
                out,
                Box::new(move |d, q| {
                    if let Some(f) = d.floors.get_mut(i) {
                        f.origin = match (q, f.origin.take()) {
                            // the other corner coordinate stays; a new one starts at 0
                            (Some(q), Some((x, z))) => Some(if axis == 0 { (q, z) } else { (x, q) }),
                            (Some(q), None) => {
                                let zero = Qty::from("0 m");
                                Some(if axis == 0 { (q, zero) } else { (zero, q) })
                            }
                            (None, _) => None,
                        }
                    }
                }),
            );
        }
        let label = ui.label("Edges");
        let mut edges = f.edges;
        egui::ComboBox::from_id_salt("edges")
            .selected_text(if edges == Edges::Clamped { "clamped" } else { "simply supported" })
            .show_ui(ui, |ui| {
                ui.selectable_value(&mut edges, Edges::SimplySupported, "simply supported");
                ui.selectable_value(&mut edges, Edges::Clamped, "clamped");
            })
            .response
            .labelled_by(label.id);
        if edges != f.edges {
            out.push(Command::edit(move |d| {
                if let Some(f) = d.floors.get_mut(i) {
                    f.edges = edges
                }
            }));
        }
        ui.end_row();
    });
    if let Some(r) = input.derived.case(input.case).and_then(|c| c.floors.iter().find(|r| r.id == f.id)) {
        ui.separator();
        ui.label(format!(
            "Normal force {} of allowable {}",
            u.fmt(r.normal_force_n, Shown::Force),
            u.fmt(r.allowable_n, Shown::Force)
        ));
        ui.label(format!(
            "Deflection {} of limit {}",
            u.fmt(r.deflection_m, Shown::SmallLength),
            u.fmt(r.deflection_limit_m, Shown::SmallLength)
        ));
        ui.label(format!(
            "Utilisation {} ({})",
            crate::fields::units_display::fmt_utilisation(r.utilisation),
            r.state.as_str()
        ));
        if let Some(reason) = &r.reason {
            ui.label(RichText::new(reason).italics());
        }
        if !r.feet.is_empty() {
            ui.label(RichText::new(format!("Feet (friction limit {:.2})", r.friction_limit)).strong());
            egui::Grid::new("floor-feet").num_columns(5).striped(true).show(ui, |ui| {
                for h in ["Foot", "Normal", "Friction", "Utilisation", "State"] {
                    ui.label(RichText::new(h).strong());
                }
                ui.end_row();
                for x in &r.feet {
                    ui.label(&x.node);
                    ui.label(u.fmt(x.normal_force_n, Shown::Force));
                    ui.label(x.friction_required.map_or_else(|| "-".to_string(), |m| format!("{m:.3}")));
                    ui.label(
                        x.utilisation.map_or_else(|| "-".to_string(), crate::fields::units_display::fmt_utilisation),
                    );
                    ui.label(x.state.as_str());
                    ui.end_row();
                }
            });
            for x in r.feet.iter().filter_map(|x| x.reason.as_ref()) {
                ui.label(RichText::new(x).italics());
            }
        }
    }
}
