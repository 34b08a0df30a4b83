//! Rated parts in the report: the inputs table (each part with its rating
//! and where the rating came from) and, per case, each part's force against
//! its working load limit with its state and governing angle.

use super::comparison::state_word;
use super::escape::escape;
use super::table::{NONE, table, with_note};
use super::unit_system::{UnitSystem, degrees, number, percent};
use crate::analysis::CaseResult;
use crate::model::{Fitting, FittingKind, Scenario};

fn detail(f: &Fitting) -> String {
    match &f.kind {
        FittingKind::EyeBolt { axis, shoulder } => format!(
            "{} eye bolt, axis ({}, {}, {}); {}",
            if *shoulder { "shoulder" } else { "plain" },
            number(axis[0]),
            number(axis[1]),
            number(axis[2]),
            if *shoulder { "derated by the angle from its axis" } else { "in-line pull only" }
        ),
        FittingKind::Hoist { max_off_plumb: Some(a) } => {
            format!("side-pull limit {} off plumb (maker's)", degrees(a.value.to_degrees()))
        }
        FittingKind::Hoist { max_off_plumb: None } => "no side-pull limit entered".to_string(),
        FittingKind::MasterLink | FittingKind::Shackle | FittingKind::Hook | FittingKind::Other => String::new(),
    }
}

/// The inputs table of rated parts, or nothing when there are none.
pub fn parts_inputs(scenario: &Scenario, units: UnitSystem) -> String {
    let mut rows: Vec<Vec<String>> = Vec::new();
    let mut push = |owner: &str, where_: &str, f: &Fitting, kind: &str| {
        rows.push(vec![
            with_note(&format!("<b>{}/{}</b>", escape(owner), escape(&f.name)), where_),
            escape(kind),
            with_note(&units.force(f.wll.value), &escape(&f.wll_note)),
            {
                let d = detail(f);
                if d.is_empty() { NONE.to_string() } else { escape(&d) }
            },
        ]);
    };
    for m in &scenario.members {
        for f in &m.fittings {
            push(&m.id, "in series with the member: carries its force", f, f.kind.word());
        }
    }
    for n in &scenario.nodes {
        for f in &n.fittings {
            push(
                &n.id,
                "at the node: carries the resultant of the members above it (at a support, the reaction)",
                f,
                f.kind.word(),
            );
        }
        if let Some(f) = &n.rated {
            push(&n.id, "the anchor's rated load: checked on the reaction's magnitude", f, "anchor");
        }
    }
    if rows.is_empty() {
        return String::new();
    }
    format!(
        "<h3>Rated parts</h3>{}",
        table("inputs-parts", &["Part", "Kind", "Working load limit", "Angle rule"], &rows)
    )
}

/// One case's rated parts, or nothing when there are none.
pub fn case_parts(c: &CaseResult, units: UnitSystem) -> String {
    let rows: Vec<Vec<String>> = c
        .part_ids()
        .into_iter()
        .zip(c.parts())
        .map(|(id, p)| {
            let wll = if (p.wll_n - p.rated_wll_n).abs() > 1e-9 * p.rated_wll_n {
                with_note(&units.force(p.wll_n), &format!("of {} rated in line", units.force(p.rated_wll_n)))
            } else {
                units.force(p.wll_n)
            };
            let state = match &p.reason {
                Some(r) => with_note(&state_word(p.state), &escape(r)),
                None => state_word(p.state),
            };
            vec![
                with_note(&format!("<b>{}</b>", escape(&id)), &escape(&p.source)),
                units.force(p.force_n),
                wll,
                if p.utilisation.is_finite() { percent(p.utilisation) } else { NONE.to_string() },
                state,
                p.angle_deg.map_or_else(|| NONE.to_string(), degrees),
            ]
        })
        .collect();
    if rows.is_empty() {
        return String::new();
    }
    table(
        "case-parts",
        &[
            "Rated part",
            "Force",
            "WLL used",
            "Utilisation",
            "State",
            "Angle (eye bolt: from its axis; hoist: from plumb)",
        ],
        &rows,
    )
}
