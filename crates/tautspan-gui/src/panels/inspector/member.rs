//! The inspector for a member: kind, size, library pickers (material, rope
//! construction, rope grade, chain grade), rating, design factor with the
//! kind's default and its source beside it, slack; its rigging
//! (`hitch`) and fittings (`parts`); then its result in
//! the case shown, with the explanation on hover.

use super::input::{InspectorInput, item_problems};
use super::line::Line;
use crate::document::command::Command;
use crate::fields::qty_field::{FieldBuffers, QtyField};
use crate::fields::units_display::{Shown, UnitSystem, fmt_utilisation};
use egui::{RichText, Ui};
use tautspan_core::file::{MemberDto, Qty, RatingDto, SectionDto};
use tautspan_core::library::{ChainGrade, Construction, Material, MemberKind, ROPE_GRADES};
use tautspan_core::units::{Dimension, Sign, format_quantity, parse_quantity};

/// A grid row under a field: what it holds in the unit system shown.
fn equivalent(ui: &mut Ui, text: String) {
    ui.label("");
    ui.label(RichText::new(text).small().weak());
    ui.end_row();
}

/// A size as typed, also in the unit system shown ("12 mm" → "= 0.4724 in"
/// in US customary, "0.5 in" → "= 12.7 mm" in SI); `None` when it is written
/// in that unit already or does not parse.
pub fn size_in(units: UnitSystem, typed: &str) -> Option<String> {
    let si = parse_quantity(typed, Dimension::Length, Sign::Positive).ok()?;
    let shown = units.fmt(si, Shown::SmallLength);
    let unit = shown.rsplit(' ').next().unwrap_or_default();
    (!typed.trim().ends_with(unit)).then(|| format!("= {shown}"))
}

/// A rope grade (N/mm², as the library lists it) in ksi for US customary.
pub fn grade_in(units: UnitSystem, grade: &str) -> Option<String> {
    let n_per_mm2: f64 = grade.trim().parse().ok()?;
    (units == UnitSystem::UsCustomary)
        .then(|| format!("= {}", format_quantity(n_per_mm2 * 1e6, Dimension::Pressure, "ksi", 4)))
}

fn picker(
    ui: &mut Ui,
    label: &str,
    id: &str,
    current: Option<&str>,
    choices: &[&str],
    none: &str,
) -> Option<Option<String>> {
    let l = ui.label(label);
    let mut chosen: Option<String> = current.map(str::to_string);
    egui::ComboBox::from_id_salt(id)
        .selected_text(current.unwrap_or(none))
        .show_ui(ui, |ui| {
            ui.selectable_value(&mut chosen, None, none);
            for c in choices {
                ui.selectable_value(&mut chosen, Some((*c).to_string()), *c);
            }
        })
        .response
        .labelled_by(l.id);
    ui.end_row();
    (chosen.as_deref() != current).then_some(chosen)
}

/// Draw the member inspector for `members[i]`.
pub fn ui(ui: &mut Ui, input: &InspectorInput<'_>, i: usize, bufs: &mut FieldBuffers, out: &mut Vec<Command>) {
    let m = &input.doc.dto.members[i];
    let line = Line::Member(i);
    ui.label(RichText::new(format!("Member {} ({} – {})", m.id, m.ends.0, m.ends.1)).strong());
    item_problems(ui, input.derived, &format!("members[{i}]"));
    item_problems(ui, input.derived, &format!("members[{i}].ends"));
    let p = |s: &str| format!("members[{i}].{s}");
    egui::Grid::new("member-fields").num_columns(2).show(ui, |ui| {
        crate::fields::id_field::show(
            ui,
            "Id",
            bufs,
            &input.doc.dto,
            crate::document::rename::IdKind::Member,
            &m.id,
            out,
        );
        if let Some(kind) = kind_picker(ui, m.kind, &MemberKind::ALL) {
            let units = input.units;
            // a new kind takes that kind's defaults, keeping id and ends
            out.push(Command::edit(move |d| {
                if let Some(m) = d.members.get_mut(i) {
                    let fresh = crate::document::edits::default_member(m.id.clone(), &m.ends.0, &m.ends.1, kind, units);
                    *m = fresh;
                }
            }));
        }
        size_fields(ui, input, line, m, bufs, out);
        if m.kind == MemberKind::Rod {
            section_fields(ui, input, i, bufs, out);
        }
        library_fields(ui, input, line, m, bufs, out);
        QtyField {
            label: "Slack",
            path: p("slack"),
            current: m.slack.as_ref(),
            dimension: Dimension::Length,
            sign: Sign::Any,
            optional: true,
            hint: "0 (drawn length)",
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let Some(m) = d.members.get_mut(i) {
                    m.slack = q
                }
            }),
        );
        let l = ui.label("May go slack");
        let mut may = m.may_go_slack;
        if ui.checkbox(&mut may, "").labelled_by(l.id).changed() {
            out.push(Command::edit(move |d| {
                if let Some(m) = d.members.get_mut(i) {
                    m.may_go_slack = may
                }
            }));
        }
        ui.end_row();
    });
    crate::panels::inspector::hitch::ui(ui, input, i, bufs, out);
    crate::panels::inspector::parts::fittings(ui, input, crate::panels::inspector::parts::Host::Member(i), bufs, out);
    result(ui, input, &m.id);
}

/// The kind picker in a grid row; the kind chosen when it changed.
pub fn kind_picker(ui: &mut Ui, current: MemberKind, kinds: &[MemberKind]) -> Option<MemberKind> {
    let l = ui.label("Kind");
    let mut kind = current;
    egui::ComboBox::from_id_salt("kind")
        .selected_text(kind.label())
        .show_ui(ui, |ui| {
            for &k in kinds {
                ui.selectable_value(&mut kind, k, k.label());
            }
        })
        .response
        .labelled_by(l.id);
    ui.end_row();
    (kind != current).then_some(kind)
}

/// Diameter and area of a member or rope (`m` its fields as written; a
/// rope's through `RopeDto::as_member`).
pub fn size_fields(
    ui: &mut Ui,
    input: &InspectorInput<'_>,
    line: Line,
    m: &MemberDto,
    bufs: &mut FieldBuffers,
    out: &mut Vec<Command>,
) {
    QtyField {
        label: "Diameter",
        path: line.path("diameter"),
        current: m.diameter.as_ref(),
        dimension: Dimension::Length,
        sign: Sign::Positive,
        optional: true,
        hint: input.units.unit(Shown::SmallLength),
    }
    .show(ui, bufs, input.derived, out, Box::new(move |d, q| line.edit(d, |m| *m.diameter = q)));
    if let Some(text) = m.diameter.as_ref().and_then(|d| size_in(input.units, &d.0)) {
        equivalent(ui, text);
    }
    QtyField {
        label: "Area",
        path: line.path("area"),
        current: m.area.as_ref(),
        dimension: Dimension::Area,
        sign: Sign::Positive,
        optional: true,
        hint: "from the diameter",
    }
    .show(ui, bufs, input.derived, out, Box::new(move |d, q| line.edit(d, |m| *m.area = q)));
}

/// The library pickers (rope construction and grade, chain grade,
/// material), modulus, rating and design factor of a member or rope.
pub fn library_fields(
    ui: &mut Ui,
    input: &InspectorInput<'_>,
    line: Line,
    m: &MemberDto,
    bufs: &mut FieldBuffers,
    out: &mut Vec<Command>,
) {
    if matches!(m.kind, MemberKind::WireRope | MemberKind::Cable) {
        let names: Vec<&str> = Construction::ALL.iter().map(|c| c.name()).collect();
        if let Some(c) = picker(ui, "Construction", "construction", m.construction.as_deref(), &names, "none") {
            out.push(Command::edit(move |d| line.edit(d, |m| *m.construction = c)));
        }
        let grades: Vec<String> = ROPE_GRADES.iter().map(|g| format!("{g:.0}")).collect();
        let grades: Vec<&str> = grades.iter().map(String::as_str).collect();
        if let Some(g) = picker(ui, "Rope grade (N/mm²)", "rope-grade", m.grade.as_deref(), &grades, "none") {
            out.push(Command::edit(move |d| line.edit(d, |m| *m.grade = g)));
        }
        if let Some(text) = m.grade.as_deref().and_then(|g| grade_in(input.units, g)) {
            equivalent(ui, text);
        }
    }
    if m.kind == MemberKind::Chain {
        let grades = [ChainGrade::Grade80.name(), ChainGrade::Grade100.name()];
        if let Some(g) = picker(ui, "Chain grade", "chain-grade", m.grade.as_deref(), &grades, "none") {
            out.push(Command::edit(move |d| line.edit(d, |m| *m.grade = g)));
        }
    }
    let names: Vec<&str> = Material::ALL.iter().map(|m| m.name()).collect();
    if let Some(mat) = picker(ui, "Material", "material", m.material.as_deref(), &names, "none") {
        out.push(Command::edit(move |d| line.edit(d, |m| *m.material = mat)));
    }
    QtyField {
        label: "Modulus",
        path: line.path("modulus"),
        current: m.modulus.as_ref(),
        dimension: Dimension::Pressure,
        sign: Sign::Positive,
        optional: true,
        hint: "from the library",
    }
    .show(ui, bufs, input.derived, out, Box::new(move |d, q| line.edit(d, |m| *m.modulus = q)));
    rating(ui, input, line, m, bufs, out);
    design_factor(ui, input, line, m, out);
}

fn rating(
    ui: &mut Ui,
    input: &InspectorInput<'_>,
    line: Line,
    m: &MemberDto,
    bufs: &mut FieldBuffers,
    out: &mut Vec<Command>,
) {
    let l = ui.label("Rating");
    let kinds = ["from the library", "minimum breaking strength", "working load limit", "yield stress"];
    let current = match &m.rating {
        None => 0,
        Some(RatingDto::BreakingStrength(_)) => 1,
        Some(RatingDto::WorkingLoadLimit(_)) => 2,
        Some(RatingDto::Yield(_)) => 3,
    };
    let mut chosen = current;
    egui::ComboBox::from_id_salt("rating-kind")
        .selected_text(kinds[current])
        .show_ui(ui, |ui| {
            for (k, name) in kinds.iter().enumerate() {
                ui.selectable_value(&mut chosen, k, *name);
            }
        })
        .response
        .labelled_by(l.id);
    ui.end_row();
    if chosen != current {
        let us = input.units == crate::fields::units_display::UnitSystem::UsCustomary;
        let f = Qty::from(if us { "4000 lbf" } else { "20 kN" });
        let r = match chosen {
            1 => Some(RatingDto::BreakingStrength(Qty::from(if us { "20000 lbf" } else { "90 kN" }))),
            2 => Some(RatingDto::WorkingLoadLimit(f)),
            3 => Some(RatingDto::Yield(Qty::from(if us { "36 ksi" } else { "235 MPa" }))),
            _ => None,
        };
        out.push(Command::edit(move |d| line.edit(d, |m| *m.rating = r)));
    }
    let (q, dim) = match &m.rating {
        Some(RatingDto::BreakingStrength(q) | RatingDto::WorkingLoadLimit(q)) => (q, Dimension::Force),
        Some(RatingDto::Yield(q)) => (q, Dimension::Pressure),
        None => return,
    };
    let label = if dim == Dimension::Force { "Rated force" } else { "Yield stress" };
    QtyField {
        label,
        path: line.path("rating"),
        current: Some(q),
        dimension: dim,
        sign: Sign::Positive,
        optional: false,
        hint: "",
    }
    .show(
        ui,
        bufs,
        input.derived,
        out,
        Box::new(move |d, q| {
            line.edit(d, |m| {
                if let Some(q) = q {
                    *m.rating = match m.rating.take() {
                        Some(RatingDto::WorkingLoadLimit(_)) => Some(RatingDto::WorkingLoadLimit(q)),
                        Some(RatingDto::Yield(_)) => Some(RatingDto::Yield(q)),
                        _ => Some(RatingDto::BreakingStrength(q)),
                    };
                }
            })
        }),
    );
}

/// A rod's section: outside diameter and wall (no wall: a solid round), for
/// the buckling check in compression.
fn section_fields(ui: &mut Ui, input: &InspectorInput<'_>, i: usize, bufs: &mut FieldBuffers, out: &mut Vec<Command>) {
    let m = &input.doc.dto.members[i];
    let (outer, wall) = match &m.section {
        Some(SectionDto::Tube { outer, wall }) => (Some(outer), Some(wall)),
        Some(SectionDto::SolidRound { diameter }) => (Some(diameter), None),
        None => (None, None),
    };
    let p = |s: &str| format!("members[{i}].{s}");
    let u = input.units;
    QtyField {
        label: "Section outside diameter",
        path: p("section.outer"),
        current: outer,
        dimension: Dimension::Length,
        sign: Sign::Positive,
        optional: true,
        hint: "for the buckling check",
    }
    .show(
        ui,
        bufs,
        input.derived,
        out,
        Box::new(move |d, q| {
            if let Some(m) = d.members.get_mut(i) {
                let wall = match m.section.take() {
                    Some(SectionDto::Tube { wall, .. }) => Some(wall),
                    _ => None,
                };
                m.section = match (q, wall) {
                    (Some(outer), Some(wall)) => Some(SectionDto::Tube { outer, wall }),
                    (Some(diameter), None) => Some(SectionDto::SolidRound { diameter }),
                    (None, _) => None,
                };
            }
        }),
    );
    QtyField {
        label: "Section wall",
        path: p("section.wall"),
        current: wall,
        dimension: Dimension::Length,
        sign: Sign::Positive,
        optional: true,
        hint: u.unit(Shown::SmallLength),
    }
    .show(
        ui,
        bufs,
        input.derived,
        out,
        Box::new(move |d, q| {
            if let Some(m) = d.members.get_mut(i) {
                let outer = match m.section.take() {
                    Some(SectionDto::Tube { outer, .. }) => Some(outer),
                    Some(SectionDto::SolidRound { diameter }) => Some(diameter),
                    None => None,
                };
                m.section = match (outer, q) {
                    (Some(outer), Some(wall)) => Some(SectionDto::Tube { outer, wall }),
                    (Some(diameter), None) => Some(SectionDto::SolidRound { diameter }),
                    (None, _) => None,
                };
            }
        }),
    );
}

fn design_factor(ui: &mut Ui, input: &InspectorInput<'_>, line: Line, m: &MemberDto, out: &mut Vec<Command>) {
    // the default the core found (the sling standard's, raised for the duty) when solved; else the kind's
    let default = input
        .derived
        .solved
        .as_ref()
        .and_then(|s| s.scenario.members.iter().find(|x| x.id == m.id))
        .map_or_else(|| m.kind.default_design_factor(), |x| x.design_factor.default.clone());
    let l = ui.label("Design factor");
    ui.vertical(|ui| {
        ui.horizontal(|ui| {
            let mut own = m.design_factor.is_some();
            if ui.checkbox(&mut own, "set my own").labelled_by(l.id).changed() {
                let v = if own { Some(default.value) } else { None };
                out.push(Command::edit(move |d| line.edit(d, |m| *m.design_factor = v)));
            }
            if let Some(mut v) = m.design_factor {
                let r = ui
                    .add(egui::DragValue::new(&mut v).range(1.0..=100.0).speed(0.05).max_decimals(2))
                    .labelled_by(l.id);
                if r.changed() {
                    out.push(Command::edit_merged(line.path("design_factor"), move |d| {
                        line.edit(d, |m| *m.design_factor = Some(v))
                    }));
                }
                if r.drag_stopped() || r.lost_focus() {
                    out.push(Command::SealUndo);
                }
            }
        });
        let below = m.design_factor.is_some_and(|v| v < default.value);
        let text = RichText::new(format!("default {} — {}", default.value, default.source)).small();
        ui.label(if below { text.color(crate::fields::qty_field::ERROR) } else { text.weak() });
        if below {
            ui.label(RichText::new("below the default").small().color(crate::fields::qty_field::ERROR));
        }
    });
    ui.end_row();
}

pub fn result(ui: &mut Ui, input: &InspectorInput<'_>, member_id: &str) {
    let Some(solved) = input.derived.solved.as_ref() else { return };
    let Some(case) = input.derived.case(input.case) else { return };
    let Some(r) = case.members.iter().find(|r| r.id == member_id) else { return };
    let u = input.units;
    ui.separator();
    ui.label(RichText::new(format!("In case {}", case.id)).strong());
    let resp = ui.label(format!(
        "Force {} of allowable {} — utilisation {} ({})",
        u.fmt(r.force_n, Shown::Force),
        u.fmt(r.allowable_n, Shown::Force),
        fmt_utilisation(r.utilisation),
        r.state.as_str()
    ));
    resp.on_hover_text(crate::panels::explain::member_result(solved, &case.id, member_id, u));
    ui.label(format!(
        "Stretch {}, sling angle {:.1}° from horizontal",
        u.fmt(r.stretch_m, Shown::SmallLength),
        r.sling_angle_deg
    ));
    if let Some(at) = r.peak_at_deg {
        ui.label(format!("Peaks at {at:.1}° of the swing's arc (each member at its own peak)"));
    }
    if let Some(reason) = &r.reason {
        ui.label(RichText::new(format!("Unchecked: {reason}")).color(crate::fields::qty_field::ERROR));
    }
    crate::panels::parts_view::fittings(ui, &r.fittings, u);
    let model = solved.scenario.members.iter().find(|m| m.id == member_id);
    if let Some(f) = r.mode_factor {
        let note = model.and_then(|m| m.hitch.as_ref()).map_or_else(String::new, |h| h.note.clone());
        ui.label(format!("Hitch mode factor {f:.3} on the allowable")).on_hover_text(note);
    }
    if let Some(e) = r.bend_efficiency {
        let note = model.and_then(|m| m.bend.as_ref()).map_or_else(String::new, |b| b.note.clone());
        ui.label(format!("Bent over a pin: D/d efficiency {e:.3}")).on_hover_text(note);
    }
    if let (Some(e), Some(b)) = (r.euler_n, r.buckling_resistance_n) {
        ui.label(format!(
            "Euler load {}, buckling resistance χ·A·f_y {}",
            u.fmt(e, Shown::Force),
            u.fmt(b, Shown::Force)
        ))
        .on_hover_text(crate::panels::explain::member_result(solved, &case.id, member_id, u));
    }
    if let Some(row) = solved.analysis.comparison.iter().find(|c| c.id == member_id) {
        if let Some(deg) = row.limits.release_deg {
            ui.label(format!("Largest release angle inside the allowable: {deg:.1}°"));
        }
        if let Some(h) = row.limits.drop_height_m {
            ui.label(format!("Largest drop height inside the allowable: {}", u.fmt(h, Shown::SmallLength)));
        }
    }
}
