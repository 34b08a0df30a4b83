//! The rows of the results grid, apart from their drawing: every member,
//! rated part (fittings, anchor ratings), floor, floor foot and unrated
//! anchor reaction in every case; the filters ("over / near / unchecked
//! only", "worst case per item"), the sort, and the CSV of exactly the rows
//! shown. The numbers are the core's, taken over as they are.

use crate::fields::units_display::{Shown, UnitSystem};
use std::borrow::Cow;
use std::collections::HashMap;
use tautspan_core::analysis::{Analysis, FittingResult, FloorResult, FootResult, State};
use tautspan_core::units::format_number;

/// The column the table is sorted by.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Column {
    /// Item in file order (members, parts, floors, feet, reactions), then case.
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

/// Which rows are shown.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub struct Filter {
    /// Only items over, near their limit or unchecked.
    pub problems_only: bool,
    /// One row per item: the case where it is worst.
    pub worst_per_item: bool,
}

/// What a row is.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum RowKind {
    /// A member or a rope over sheaves.
    Member,
    /// A rated part: a fitting on a member or at a node, an anchor's rating.
    Part,
    /// A floor slab (all its feet together).
    Floor,
    /// One foot on a floor.
    Foot,
    /// An anchor's reaction where the anchor has no rating (shown, not checked).
    Reaction,
}

impl RowKind {
    /// In words, for the CSV.
    pub fn word(self) -> &'static str {
        match self {
            RowKind::Member => "member",
            RowKind::Part => "rated part",
            RowKind::Floor => "floor",
            RowKind::Foot => "floor foot",
            RowKind::Reaction => "anchor reaction",
        }
    }
}

/// One row: an item in one case.
#[derive(Debug, Clone)]
pub struct Row<'a> {
    /// Case index.
    pub case: usize,
    /// Place of the item in the case's list (members, parts, floors, feet, reactions).
    pub order: usize,
    /// What it is.
    pub kind: RowKind,
    /// Shown id (`leg-1`, `leg-1/shackle`, `slab-1/P1`, `A1 reaction`);
    /// a member's borrowed (no copy of every id every frame on a large rig).
    pub id: Cow<'a, str>,
    /// The member, node or floor the row selects.
    pub owner: Cow<'a, str>,
    /// Force carried, N (a floor's and a foot's normal force, a reaction's magnitude).
    pub force_n: f64,
    /// Allowable or WLL, N, where the item is checked on a force.
    pub allowable_n: Option<f64>,
    /// Utilisation, where checked.
    pub utilisation: Option<f64>,
    /// State, where checked.
    pub state: Option<State>,
    /// The part, for a part's row.
    pub part: Option<&'a FittingResult>,
    /// The floor and foot, for a foot's row.
    pub foot: Option<(&'a FloorResult, &'a FootResult)>,
}

/// Rank of a state for sorting: over, unchecked, near, slack, ok, none.
fn state_rank(s: Option<State>) -> u8 {
    match s {
        Some(State::Over) => 5,
        Some(State::Unchecked) => 4,
        Some(State::Near) => 3,
        Some(State::Slack) => 2,
        Some(State::Ok) => 1,
        None => 0,
    }
}

/// How bad a row is, for "worst case per item": over, then unchecked, then
/// utilisation (as the verdict's worst item is found).
fn badness(r: &Row<'_>) -> (u8, f64) {
    let u = r.utilisation.filter(|u| u.is_finite()).unwrap_or(0.0);
    match r.state {
        Some(State::Over) => (2, u),
        Some(State::Unchecked) => (1, u),
        _ => (0, u),
    }
}

/// Every row of an analysis: each case's members, rated parts, floors,
/// floor feet and unrated anchor reactions, in that order.
pub fn all_rows(a: &Analysis) -> Vec<Row<'_>> {
    let mut rows = Vec::new();
    for (c, cr) in a.cases.iter().enumerate() {
        let mut order = 0;
        let mut next = || {
            order += 1;
            order
        };
        for m in &cr.members {
            rows.push(Row {
                case: c,
                order: next(),
                kind: RowKind::Member,
                id: Cow::Borrowed(m.id.as_str()),
                owner: Cow::Borrowed(m.id.as_str()),
                force_n: m.force_n,
                allowable_n: Some(m.allowable_n),
                utilisation: Some(m.utilisation),
                state: Some(m.state),
                part: None,
                foot: None,
            });
        }
        for (id, p) in cr.part_ids().into_iter().zip(cr.parts()) {
            rows.push(Row {
                case: c,
                order: next(),
                kind: RowKind::Part,
                owner: Cow::Owned(id.split('/').next().unwrap_or_default().to_string()),
                id: Cow::Owned(id),
                force_n: p.force_n,
                allowable_n: Some(p.wll_n),
                utilisation: Some(p.utilisation),
                state: Some(p.state),
                part: Some(p),
                foot: None,
            });
        }
        for f in &cr.floors {
            rows.push(Row {
                case: c,
                order: next(),
                kind: RowKind::Floor,
                id: Cow::Borrowed(f.id.as_str()),
                owner: Cow::Borrowed(f.id.as_str()),
                force_n: f.normal_force_n,
                allowable_n: Some(f.allowable_n).filter(|a| a.is_finite() && *a > 0.0),
                utilisation: Some(f.utilisation),
                state: Some(f.state),
                part: None,
                foot: None,
            });
        }
        for f in &cr.floors {
            for x in &f.feet {
                rows.push(Row {
                    case: c,
                    order: next(),
                    kind: RowKind::Foot,
                    id: Cow::Owned(format!("{}/{}", f.id, x.node)),
                    owner: Cow::Borrowed(f.id.as_str()),
                    force_n: x.normal_force_n,
                    // the rated concentrated load per foot, where the foot is checked on it
                    allowable_n: x.utilisation.map(|_| f.allowable_n),
                    utilisation: x.utilisation,
                    state: Some(x.state),
                    part: None,
                    foot: Some((f, x)),
                });
            }
        }
        for s in cr.supports.iter().filter(|s| s.rated.is_none()) {
            let [x, y, z] = s.reaction_n;
            rows.push(Row {
                case: c,
                order: next(),
                kind: RowKind::Reaction,
                id: Cow::Owned(format!("{} reaction", s.node)),
                owner: Cow::Borrowed(s.node.as_str()),
                force_n: (x * x + y * y + z * z).sqrt(),
                allowable_n: None,
                utilisation: None,
                state: None,
                part: None,
                foot: None,
            });
        }
    }
    rows
}

/// The rows shown: filtered, then sorted.
pub fn rows(a: &Analysis, filter: Filter, sort: Sort) -> Vec<Row<'_>> {
    let all = all_rows(a);
    let order = shown_order(&all, filter, sort);
    let mut all: Vec<Option<Row<'_>>> = all.into_iter().map(Some).collect();
    order.into_iter().filter_map(|i| all.get_mut(i).and_then(Option::take)).collect()
}

/// Which of `all` (every row of an analysis, in [`all_rows`]' order) are
/// shown, in the order shown: the app keeps this while the results, the
/// filter and the sort stay the same, so a frame does not sort every row.
pub fn shown_order(all: &[Row<'_>], filter: Filter, sort: Sort) -> Vec<usize> {
    let mut rows: Vec<(usize, &Row<'_>)> = all.iter().enumerate().collect();
    if filter.worst_per_item {
        let mut worst: HashMap<(RowKind, &str), usize> = HashMap::new();
        for (i, (_, r)) in rows.iter().enumerate() {
            let slot = worst.entry((r.kind, r.id.as_ref())).or_insert(i);
            if badness(r) > badness(rows[*slot].1) {
                *slot = i;
            }
        }
        let mut keep = vec![false; rows.len()];
        for i in worst.into_values() {
            keep[i] = true;
        }
        let mut k = keep.into_iter();
        rows.retain(|_| k.next().unwrap_or(false));
    }
    if filter.problems_only {
        rows.retain(|(_, r)| matches!(r.state, Some(State::Over | State::Near | State::Unchecked)));
    }
    let num = |v: Option<f64>| v.unwrap_or(f64::NEG_INFINITY);
    rows.sort_by(|(_, rx), (_, ry)| {
        let o = match sort.column {
            Column::Member => rx.order.cmp(&ry.order).then(rx.case.cmp(&ry.case)),
            Column::Case => rx.case.cmp(&ry.case).then(rx.order.cmp(&ry.order)),
            Column::Force => rx.force_n.total_cmp(&ry.force_n),
            Column::Allowable => num(rx.allowable_n).total_cmp(&num(ry.allowable_n)),
            Column::Utilisation => num(rx.utilisation).total_cmp(&num(ry.utilisation)),
            Column::State => state_rank(rx.state)
                .cmp(&state_rank(ry.state))
                .then(num(rx.utilisation).total_cmp(&num(ry.utilisation))),
        };
        if sort.descending { o.reverse() } else { o }
    });
    rows.into_iter().map(|(i, _)| i).collect()
}

/// A CSV field, quoted where it holds a comma, quote or line break.
fn field(text: &str) -> Cow<'_, str> {
    if text.contains([',', '"', '\n', '\r']) {
        Cow::Owned(format!("\"{}\"", text.replace('"', "\"\"")))
    } else {
        Cow::Borrowed(text)
    }
}

/// The rows shown as CSV, forces in the display unit, utilisation in
/// percent; an item not checked on a force leaves those fields empty.
pub fn csv(a: &Analysis, rows: &[Row<'_>], units: UnitSystem) -> String {
    let unit = units.unit(Shown::Force);
    let number = |si: f64| format_number(units.value(si, Shown::Force), 6);
    let mut out = format!("item,what,case,force ({unit}),allowable ({unit}),utilisation (%),state\n");
    for r in rows {
        let case = a.cases.get(r.case).map_or("", |c| c.id.as_str());
        let allowable = r.allowable_n.map(number).unwrap_or_default();
        let util = r.utilisation.filter(|u| u.is_finite()).map(|u| format_number(u * 100.0, 6)).unwrap_or_default();
        let state = r.state.map_or("not checked", State::as_str);
        out.push_str(&format!(
            "{},{},{},{},{allowable},{util},{state}\n",
            field(&r.id),
            r.kind.word(),
            field(case),
            number(r.force_n)
        ));
    }
    out
}
