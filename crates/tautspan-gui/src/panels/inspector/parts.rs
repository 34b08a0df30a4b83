//! Editing rated parts in the inspectors: the fittings in series with a
//! member or at a node (add, edit each one's working load limit, name, an
//! eye bolt's axis and shoulder, a hoist's side-pull limit, remove), and an
//! anchor's rated load. A WLL is typed as on the tag, a force or a mass,
//! and checked as it is typed by the core's own reading of rated loads. A
//! new part has no WLL until one is typed: a rating is read off the part,
//! never made up, and the core's message says so meanwhile.

use super::input::{InspectorInput, item_problems};
use crate::document::command::Command;
use crate::fields::qty_field::{ERROR, FieldBuffers, QtyField};
use crate::fields::units_display::UnitSystem;
use egui::{RichText, Ui};
use tautspan_core::file::{FittingDto, Qty, ScenarioDto};
use tautspan_core::units::{Dimension, Sign, parse_rated_load};

/// Where a list of fittings is.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Host {
    /// `members[i]`.
    Member(usize),
    /// `nodes[i]`.
    Node(usize),
    /// `ropes[i]`.
    Rope(usize),
}

impl Host {
    /// The field path of the list (`members[2].fittings`).
    pub fn path(self) -> String {
        match self {
            Host::Member(i) => format!("members[{i}].fittings"),
            Host::Node(i) => format!("nodes[{i}].fittings"),
            Host::Rope(i) => format!("ropes[{i}].fittings"),
        }
    }

    /// The list in a scenario.
    pub fn list(self, d: &ScenarioDto) -> Option<&Vec<FittingDto>> {
        match self {
            Host::Member(i) => d.members.get(i).map(|m| &m.fittings),
            Host::Node(i) => d.nodes.get(i).map(|n| &n.fittings),
            Host::Rope(i) => d.ropes.get(i).map(|r| &r.fittings),
        }
    }

    /// The list in a scenario, to edit.
    pub fn list_mut(self, d: &mut ScenarioDto) -> Option<&mut Vec<FittingDto>> {
        match self {
            Host::Member(i) => d.members.get_mut(i).map(|m| &mut m.fittings),
            Host::Node(i) => d.nodes.get_mut(i).map(|n| &mut n.fittings),
            Host::Rope(i) => d.ropes.get_mut(i).map(|r| &mut r.fittings),
        }
    }
}

/// The kinds of part that can be added.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum PartKind {
    /// A shackle.
    Shackle,
    /// A hook.
    Hook,
    /// A master link.
    MasterLink,
    /// An eye bolt.
    EyeBolt,
    /// A hoist (members only).
    Hoist,
    /// Any other part, named.
    Named,
}

impl PartKind {
    /// Every kind, in the order offered.
    pub const ALL: [PartKind; 6] =
        [PartKind::Shackle, PartKind::Hook, PartKind::MasterLink, PartKind::EyeBolt, PartKind::Hoist, PartKind::Named];

    /// Plain name.
    pub fn label(self) -> &'static str {
        match self {
            PartKind::Shackle => "shackle",
            PartKind::Hook => "hook",
            PartKind::MasterLink => "master link",
            PartKind::EyeBolt => "eye bolt",
            PartKind::Hoist => "hoist",
            PartKind::Named => "named part",
        }
    }

    /// The kind of a part as written.
    pub fn of(f: &FittingDto) -> PartKind {
        match f {
            FittingDto::Shackle { .. } => PartKind::Shackle,
            FittingDto::Hook { .. } => PartKind::Hook,
            FittingDto::MasterLink { .. } => PartKind::MasterLink,
            FittingDto::EyeBolt { .. } => PartKind::EyeBolt,
            FittingDto::Hoist { .. } => PartKind::Hoist,
            FittingDto::Fitting { .. } => PartKind::Named,
        }
    }

    /// A new part of this kind, its WLL still to be typed. An eye bolt's
    /// axis starts unset (zero), for the same reason: the core assumes none.
    pub fn new_part(self) -> FittingDto {
        let wll = Qty(String::new());
        match self {
            PartKind::Shackle => FittingDto::Shackle { wll, name: None },
            PartKind::Hook => FittingDto::Hook { wll, name: None },
            PartKind::MasterLink => FittingDto::MasterLink { wll, name: None },
            PartKind::EyeBolt => FittingDto::EyeBolt { wll, axis: (0.0, 0.0, 0.0), shoulder: false, name: None },
            PartKind::Hoist => FittingDto::Hoist { wll, max_off_plumb: None, name: None },
            PartKind::Named => FittingDto::Fitting { name: String::new(), wll },
        }
    }
}

/// A part's WLL as written.
pub fn wll(f: &FittingDto) -> &Qty {
    match f {
        FittingDto::Shackle { wll, .. }
        | FittingDto::Hook { wll, .. }
        | FittingDto::MasterLink { wll, .. }
        | FittingDto::EyeBolt { wll, .. }
        | FittingDto::Hoist { wll, .. }
        | FittingDto::Fitting { wll, .. } => wll,
    }
}

fn wll_mut(f: &mut FittingDto) -> &mut Qty {
    match f {
        FittingDto::Shackle { wll, .. }
        | FittingDto::Hook { wll, .. }
        | FittingDto::MasterLink { wll, .. }
        | FittingDto::EyeBolt { wll, .. }
        | FittingDto::Hoist { wll, .. }
        | FittingDto::Fitting { wll, .. } => wll,
    }
}

/// A part's name as written (a named part's is required, the others' optional).
pub fn name(f: &FittingDto) -> Option<&str> {
    match f {
        FittingDto::Shackle { name, .. }
        | FittingDto::Hook { name, .. }
        | FittingDto::MasterLink { name, .. }
        | FittingDto::EyeBolt { name, .. }
        | FittingDto::Hoist { name, .. } => name.as_deref(),
        FittingDto::Fitting { name, .. } => Some(name),
    }
}

fn set_name(f: &mut FittingDto, text: &str) {
    let given = (!text.trim().is_empty()).then(|| text.to_string());
    match f {
        FittingDto::Shackle { name, .. }
        | FittingDto::Hook { name, .. }
        | FittingDto::MasterLink { name, .. }
        | FittingDto::EyeBolt { name, .. }
        | FittingDto::Hoist { name, .. } => *name = given,
        // a named part keeps even an empty name: the core asks for one
        FittingDto::Fitting { name, .. } => *name = text.to_string(),
    }
}

/// One line naming a part as written: its name or kind, and its WLL.
pub fn describe(f: &FittingDto) -> String {
    let what = name(f).filter(|n| !n.trim().is_empty()).unwrap_or(PartKind::of(f).label());
    let w = wll(f).0.trim();
    if w.is_empty() { format!("{what} (no WLL yet)") } else { format!("{what}, WLL {w}") }
}

/// The core's check of a rated load as typed: a force, or a mass as on the tag.
pub fn check_rated_load(text: &str) -> Result<(), String> {
    parse_rated_load(text, Sign::Positive)
        .map(|_| ())
        .map_err(|e| format!("{e}; a rated load is a force (\"10 kN\") or a mass as on the tag (\"1 t\")"))
}

fn wll_hint(units: UnitSystem) -> &'static str {
    if units == UnitSystem::UsCustomary { "from the tag, e.g. 6500 lb" } else { "from the tag, e.g. 3.25 t" }
}

/// Edit one part of a list in place.
fn edit_part(host: Host, k: usize, f: impl FnOnce(&mut FittingDto) + 'static) -> impl FnOnce(&mut ScenarioDto) {
    move |d| {
        if let Some(p) = host.list_mut(d).and_then(|l| l.get_mut(k)) {
            f(p);
        }
    }
}

/// Draw the fittings of a member or node, with a picker to add one.
pub fn fittings(ui: &mut Ui, input: &InspectorInput<'_>, host: Host, bufs: &mut FieldBuffers, out: &mut Vec<Command>) {
    let Some(list) = host.list(&input.doc.dto) else { return };
    ui.separator();
    ui.label(RichText::new("Fittings").strong());
    for (k, f) in list.iter().enumerate() {
        part(ui, input, host, k, f, bufs, out);
    }
    let l = ui.label("Add a part");
    let mut picked: Option<PartKind> = None;
    egui::ComboBox::from_id_salt(format!("add-part-{}", host.path()))
        .selected_text("choose…")
        .show_ui(ui, |ui| {
            for kind in PartKind::ALL {
                // a hoist hangs in a member, never at a node
                if kind == PartKind::Hoist && matches!(host, Host::Node(_)) {
                    continue;
                }
                ui.selectable_value(&mut picked, Some(kind), kind.label());
            }
        })
        .response
        .labelled_by(l.id);
    if let Some(kind) = picked {
        out.push(Command::edit(move |d| {
            if let Some(l) = host.list_mut(d) {
                l.push(kind.new_part());
            }
        }));
    }
}

fn part(
    ui: &mut Ui,
    input: &InspectorInput<'_>,
    host: Host,
    k: usize,
    f: &FittingDto,
    bufs: &mut FieldBuffers,
    out: &mut Vec<Command>,
) {
    let at = format!("{}[{k}]", host.path());
    let n = k + 1;
    ui.horizontal(|ui| {
        ui.label(RichText::new(format!("Part {n}: {}", PartKind::of(f).label())).strong());
        if ui.button(format!("Remove part {n}")).clicked() {
            // text half typed in this list belongs to places that move up
            bufs.remove_under(&host.path());
            out.push(Command::edit(move |d| {
                if let Some(l) = host.list_mut(d)
                    && k < l.len()
                {
                    l.remove(k);
                }
            }));
        }
    });
    item_problems(ui, input.derived, &at);
    egui::Grid::new(format!("part-{at}")).num_columns(2).show(ui, |ui| {
        let wll_label = format!("Part {n} WLL");
        QtyField {
            label: &wll_label,
            path: format!("{at}.wll"),
            current: Some(wll(f)).filter(|q| !q.0.trim().is_empty()),
            dimension: Dimension::Force,
            sign: Sign::Positive,
            optional: false,
            hint: wll_hint(input.units),
        }
        .show_checked(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let Some(q) = q {
                    edit_part(host, k, move |p| *wll_mut(p) = q)(d);
                }
            }),
            &check_rated_load,
        );
        name_field(ui, input, host, k, f, out);
        match f {
            FittingDto::EyeBolt { axis, shoulder, .. } => {
                axis_field(ui, input, host, k, *axis, out);
                let l = ui.label(format!("Part {n} shoulder eye bolt"));
                let mut s = *shoulder;
                if ui.checkbox(&mut s, "derated by angle").labelled_by(l.id).changed() {
                    out.push(Command::edit(edit_part(host, k, move |p| {
                        if let FittingDto::EyeBolt { shoulder, .. } = p {
                            *shoulder = s;
                        }
                    })));
                }
                ui.end_row();
            }
            FittingDto::Hoist { max_off_plumb, .. } => {
                let label = format!("Part {n} side-pull limit");
                QtyField {
                    label: &label,
                    path: format!("{at}.max_off_plumb"),
                    current: max_off_plumb.as_ref(),
                    dimension: Dimension::Angle,
                    sign: Sign::NonNegative,
                    optional: true,
                    hint: "the maker's, e.g. 3 deg",
                }
                .show(
                    ui,
                    bufs,
                    input.derived,
                    out,
                    Box::new(move |d, q| {
                        edit_part(host, k, move |p| {
                            if let FittingDto::Hoist { max_off_plumb, .. } = p {
                                *max_off_plumb = q;
                            }
                        })(d)
                    }),
                );
            }
            _ => {}
        }
    });
}

fn name_field(ui: &mut Ui, input: &InspectorInput<'_>, host: Host, k: usize, f: &FittingDto, out: &mut Vec<Command>) {
    let at = format!("{}[{k}].name", host.path());
    let l = ui.label(format!("Part {} name", k + 1));
    let mut text = name(f).unwrap_or_default().to_string();
    let hint = if PartKind::of(f) == PartKind::Named { "what it is, e.g. beam clamp" } else { "optional" };
    ui.vertical(|ui| {
        let r = ui.add(egui::TextEdit::singleline(&mut text).hint_text(hint).desired_width(150.0)).labelled_by(l.id);
        if r.changed() {
            out.push(Command::edit_merged(at.clone(), edit_part(host, k, move |p| set_name(p, &text))));
        }
        if r.lost_focus() {
            out.push(Command::SealUndo);
        }
        for p in input.derived.problems_at(&at) {
            ui.label(RichText::new(&p.message).color(ERROR).small());
        }
    });
    ui.end_row();
}

fn axis_field(
    ui: &mut Ui,
    input: &InspectorInput<'_>,
    host: Host,
    k: usize,
    axis: (f64, f64, f64),
    out: &mut Vec<Command>,
) {
    let at = format!("{}[{k}].axis", host.path());
    let l = ui.label(format!("Part {} axis (x, y, z)", k + 1));
    ui.vertical(|ui| {
        ui.horizontal(|ui| {
            let mut v = [axis.0, axis.1, axis.2];
            let mut changed = false;
            let mut done = false;
            for c in &mut v {
                let r = ui.add(egui::DragValue::new(c).speed(0.05).max_decimals(3)).labelled_by(l.id);
                changed |= r.changed();
                done |= r.drag_stopped() || r.lost_focus();
            }
            // the common case in one click: a bolt pulled along its own vertical axis
            if ui.button("plumb").on_hover_text("axis (0, 1, 0): the bolt stands vertical").clicked() {
                v = [0.0, 1.0, 0.0];
                changed = true;
                done = true;
            }
            if changed {
                let a = (v[0], v[1], v[2]);
                out.push(Command::edit_merged(
                    at.clone(),
                    edit_part(host, k, move |p| {
                        if let FittingDto::EyeBolt { axis, .. } = p {
                            *axis = a;
                        }
                    }),
                ));
            }
            if done {
                out.push(Command::SealUndo);
            }
        });
        for p in input.derived.problems_at(&at) {
            ui.label(RichText::new(&p.message).color(ERROR).small());
        }
    });
    ui.end_row();
}

/// An anchor's rated load: typed as a force or a mass; empty clears it.
/// Shown on anchors, and on any node that has one (the core's refusal then
/// shows under it).
pub fn anchor_rating(
    ui: &mut Ui,
    input: &InspectorInput<'_>,
    i: usize,
    bufs: &mut FieldBuffers,
    out: &mut Vec<Command>,
) {
    let n = &input.doc.dto.nodes[i];
    if n.support != tautspan_core::file::SupportDto::Anchor && n.rated.is_none() {
        return;
    }
    QtyField {
        label: "Rated load",
        path: format!("nodes[{i}].rated"),
        current: n.rated.as_ref(),
        dimension: Dimension::Force,
        sign: Sign::Positive,
        optional: true,
        hint: "none: only the reaction",
    }
    .show_checked(
        ui,
        bufs,
        input.derived,
        out,
        Box::new(move |d, q| {
            if let Some(n) = d.nodes.get_mut(i) {
                n.rated = q
            }
        }),
        &check_rated_load,
    );
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_part_is_described_by_its_name_or_kind_and_its_wll() {
        assert_eq!(describe(&PartKind::Shackle.new_part()), "shackle (no WLL yet)");
        let f = FittingDto::Fitting { name: "beam clamp".into(), wll: Qty::from("3 t") };
        assert_eq!(describe(&f), "beam clamp, WLL 3 t");
        let f = FittingDto::Hook { wll: Qty::from("20 kN"), name: Some("top hook".into()) };
        assert_eq!(describe(&f), "top hook, WLL 20 kN");
    }

    #[test]
    fn names_are_optional_except_on_a_named_part() {
        let mut f = FittingDto::Hook { wll: Qty::from("20 kN"), name: Some("top".into()) };
        set_name(&mut f, " ");
        assert_eq!(name(&f), None);
        let mut f = PartKind::Named.new_part();
        set_name(&mut f, "");
        assert_eq!(name(&f), Some(""), "kept empty for the core to ask for one");
    }

    #[test]
    fn rated_loads_are_read_as_the_core_reads_them() {
        assert!(check_rated_load("3.25 t").is_ok());
        assert!(check_rated_load("32 kN").is_ok());
        assert!(check_rated_load("6500 lb").is_ok());
        assert!(check_rated_load("3 m").is_err());
        assert!(check_rated_load("").is_err());
    }
}
