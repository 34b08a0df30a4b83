//! The results table: every member and rated part (fittings, anchor
//! ratings) in every case — force, allowable or WLL, utilisation, state and the limits (largest release angle,
//! largest drop height) — sortable by any column; a click on a member
//! selects it, hovering a row explains the numbers. Above it, folded, the
//! floors' feet in every case.

use crate::document::command::Command;
use crate::document::derived::Derived;
use crate::document::selection::Selection;
use crate::fields::units_display::{Shown, UnitSystem, fmt_utilisation};
use egui::{RichText, Ui};
use std::borrow::Cow;
use tautspan_core::analysis::{FittingResult, State};

/// The column the table is sorted by.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Column {
    /// Member id, then file order of cases.
    #[default]
    Member,
    /// Case id.
    Case,
    /// Force.
    Force,
    /// Allowable.
    Allowable,
    /// Utilisation.
    Utilisation,
    /// State.
    State,
}

/// Sorting of the table.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub struct Sort {
    /// Column.
    pub column: Column,
    /// Descending.
    pub descending: bool,
}

const COLUMNS: [(&str, Column, f32); 6] = [
    ("Member or part", Column::Member, 150.0),
    ("Case", Column::Case, 90.0),
    ("Force", Column::Force, 100.0),
    ("Allowable", Column::Allowable, 100.0),
    ("Utilisation", Column::Utilisation, 90.0),
    ("State", Column::State, 70.0),
];

/// One row: a member or a rated part in one case.
struct Row<'a> {
    /// Case index.
    case: usize,
    /// Members in file order, then parts in the analysis's order.
    order: usize,
    /// Shown id (`leg-1`, `leg-1/shackle`); a member's borrowed (no copy
    /// of every id every frame on a large rig).
    id: Cow<'a, str>,
    /// The member or node the row belongs to.
    owner: Cow<'a, str>,
    force_n: f64,
    allowable_n: f64,
    utilisation: f64,
    state: State,
    /// The part, for a part's row.
    part: Option<&'a FittingResult>,
}

fn state_rank(s: State) -> u8 {
    match s {
        State::Over => 4,
        State::Unchecked => 3,
        State::Near => 2,
        State::Slack => 1,
        State::Ok => 0,
    }
}

/// Draw the table.
pub fn ui(
    ui: &mut Ui,
    derived: &Derived,
    selection: &Selection,
    sort: &mut Sort,
    units: UnitSystem,
    out: &mut Vec<Command>,
) {
    let Some(solved) = derived.solved.as_ref() else {
        ui.label("No results: the scenario has problems (listed beside the fields and in the warnings).");
        return;
    };
    let a = &solved.analysis;
    // every member, then every rated part (`leg-1/shackle`), in every case
    let mut rows: Vec<Row<'_>> = a
        .cases
        .iter()
        .enumerate()
        .flat_map(|(c, cr)| {
            let members = cr.members.iter().enumerate().map(move |(k, m)| Row {
                case: c,
                order: k,
                id: Cow::Borrowed(m.id.as_str()),
                owner: Cow::Borrowed(m.id.as_str()),
                force_n: m.force_n,
                allowable_n: m.allowable_n,
                utilisation: m.utilisation,
                state: m.state,
                part: None,
            });
            let n = cr.members.len();
            let parts = cr.part_ids().into_iter().zip(cr.parts()).enumerate().map(move |(k, (id, p))| Row {
                case: c,
                order: n + k,
                owner: Cow::Owned(id.split('/').next().unwrap_or_default().to_string()),
                id: Cow::Owned(id),
                force_n: p.force_n,
                allowable_n: p.wll_n,
                utilisation: p.utilisation,
                state: p.state,
                part: Some(p),
            });
            members.chain(parts)
        })
        .collect();
    rows.sort_by(|rx, ry| {
        let o = match sort.column {
            Column::Member => rx.order.cmp(&ry.order).then(rx.case.cmp(&ry.case)),
            Column::Case => rx.case.cmp(&ry.case).then(rx.order.cmp(&ry.order)),
            Column::Force => rx.force_n.total_cmp(&ry.force_n),
            Column::Allowable => rx.allowable_n.total_cmp(&ry.allowable_n),
            Column::Utilisation => rx.utilisation.total_cmp(&ry.utilisation),
            Column::State => {
                state_rank(rx.state).cmp(&state_rank(ry.state)).then(rx.utilisation.total_cmp(&ry.utilisation))
            }
        };
        if sort.descending { o.reverse() } else { o }
    });
    feet(ui, a, units, out);
    ui.horizontal(|ui| {
        for (name, col, w) in COLUMNS {
            let arrow = if sort.column == col { if sort.descending { " v" } else { " ^" } } else { "" };
            let b = ui.add_sized([w, 20.0], egui::Button::new(RichText::new(format!("{name}{arrow}")).strong()));
            if b.on_hover_text(format!("Sort by {}", name.to_lowercase())).clicked() {
                if sort.column == col {
                    sort.descending = !sort.descending;
                } else {
                    *sort = Sort {
                        column: col,
                        descending: matches!(col, Column::Force | Column::Utilisation | Column::State),
                    };
                }
            }
        }
        ui.add_sized([160.0, 20.0], egui::Label::new(RichText::new("Limits").strong()));
    });
    ui.separator();
    let row_h = 18.0;
    egui::ScrollArea::vertical().auto_shrink([false, false]).show_rows(ui, row_h, rows.len(), |ui, range| {
        for r in &rows[range] {
            let case = &a.cases[r.case];
            let resp = ui.horizontal(|ui| {
                // a part selects what it belongs to: its member, else its node
                let target = if case.members.iter().any(|m| m.id == *r.owner) {
                    // ropes are among the members' results
                    Selection::of_member_result(&solved.scenario, &r.owner)
                } else {
                    Selection::Node(r.owner.to_string())
                };
                let picked = r.part.is_none() && *selection == target;
                if ui.add_sized([COLUMNS[0].2, row_h], egui::Button::selectable(picked, r.id.as_ref())).clicked() {
                    out.push(Command::Select(target));
                    out.push(Command::ShowCase(case.id.clone()));
                }
                ui.add_sized([COLUMNS[1].2, row_h], egui::Label::new(case.id.as_str()));
                ui.add_sized([COLUMNS[2].2, row_h], egui::Label::new(units.fmt(r.force_n, Shown::Force)));
                ui.add_sized([COLUMNS[3].2, row_h], egui::Label::new(units.fmt(r.allowable_n, Shown::Force)));
                let util = if r.utilisation.is_finite() { fmt_utilisation(r.utilisation) } else { "-".to_string() };
                ui.add_sized([COLUMNS[4].2, row_h], egui::Label::new(util));
                let st = RichText::new(r.state.as_str());
                let st = if matches!(r.state, State::Over | State::Unchecked) {
                    st.strong().color(crate::fields::qty_field::ERROR)
                } else {
                    st
                };
                ui.add_sized([COLUMNS[5].2, row_h], egui::Label::new(st));
                let limits = a.comparison.iter().find(|row| row.id == *r.id).map(|row| &row.limits);
                let text = limits
                    .map(|l| {
                        let mut parts = Vec::new();
                        if case.kind == "swing"
                            && let Some(d) = l.release_deg
                        {
                            parts.push(format!("release ≤ {d:.1}°"));
                        }
                        if (case.kind == "drop" || case.kind == "sudden")
                            && let Some(h) = l.drop_height_m
                        {
                            parts.push(format!("drop ≤ {}", units.fmt(h, Shown::SmallLength)));
                        }
                        parts.join(", ")
                    })
                    .unwrap_or_default();
                ui.add_sized([160.0, row_h], egui::Label::new(text));
            });
            resp.response.on_hover_ui(|ui| {
                ui.set_max_width(520.0);
                match r.part {
                    Some(p) => crate::panels::parts_view::part(ui, p, units),
                    None => {
                        ui.label(crate::panels::explain::member_result(solved, &case.id, &r.id, units));
                    }
                }
            });
        }
    });
}

/// The floors' feet in every case: normal force, the friction each needs
/// against the floor's limit, utilisation against the rated point load and
/// state; a click on a row selects its floor.
fn feet(ui: &mut Ui, a: &tautspan_core::analysis::Analysis, units: UnitSystem, out: &mut Vec<Command>) {
    let n: usize = a.cases.iter().map(|c| c.floors.iter().map(|f| f.feet.len()).sum::<usize>()).sum();
    if n == 0 {
        return;
    }
    egui::CollapsingHeader::new(format!("Floor feet ({n})")).default_open(false).show(ui, |ui| {
        egui::Grid::new("results-feet").num_columns(7).striped(true).show(ui, |ui| {
            for h in ["Floor", "Foot", "Case", "Normal", "Friction (limit)", "Utilisation", "State"] {
                ui.label(RichText::new(h).strong());
            }
            ui.end_row();
            for case in &a.cases {
                for f in &case.floors {
                    for x in &f.feet {
                        if ui.button(f.id.as_str()).clicked() {
                            out.push(Command::Select(Selection::Floor(f.id.clone())));
                            out.push(Command::ShowCase(case.id.clone()));
                        }
                        ui.label(x.node.as_str());
                        ui.label(case.id.as_str());
                        ui.label(units.fmt(x.normal_force_n, Shown::Force));
                        let mu = x.friction_required.map_or_else(|| "-".to_string(), |m| format!("{m:.3}"));
                        ui.label(format!("{mu} ({:.2})", f.friction_limit));
                        ui.label(x.utilisation.map_or_else(|| "-".to_string(), fmt_utilisation));
                        let st = RichText::new(x.state.as_str());
                        let st = if matches!(x.state, State::Over | State::Unchecked) {
                            st.strong().color(crate::fields::qty_field::ERROR)
                        } else {
                            st
                        };
                        let resp = ui.label(st);
                        if let Some(why) = &x.reason {
                            resp.on_hover_text(why);
                        }
                        ui.end_row();
                    }
                }
            }
        });
    });
}
