//! The members as the scenario gives them: kind, ends, size (diameter and
//! area), material, construction or grade, E·A and how it was found, slack,
//! own weight; then rating, efficiency (with a D/d bend over a pin), the
//! hitch's mode factor where any member has one, design factor with its
//! source and the allowable the analysis derived.

use super::escape::escape;
use super::table::{NONE, table, with_note};
use super::unit_system::{UnitSystem, number};
use crate::analysis::{Analysis, compression, compression_explanation};
use crate::model::{Member, Rating, Scenario};

/// The two member tables: make-up and stiffness; strength.
pub fn members(scenario: &Scenario, analysis: &Analysis, units: UnitSystem) -> String {
    if scenario.members.is_empty() {
        return "<h3>Members</h3><p>None.</p>".to_string();
    }
    let make_up: Vec<Vec<String>> = scenario.members.iter().map(|m| make_up_row(scenario, m, units)).collect();
    let struts = scenario.members.iter().any(|m| m.strut.is_some());
    let hitches = scenario.members.iter().any(|m| m.hitch.is_some());
    let strength: Vec<Vec<String>> = scenario
        .members
        .iter()
        .enumerate()
        .map(|(i, m)| {
            let mut row = strength_row(analysis, m, units);
            if hitches {
                row.insert(
                    3,
                    match &m.hitch {
                        Some(h) => with_note(&number(h.factor), &escape(&h.note)),
                        None => NONE.to_string(),
                    },
                );
            }
            if struts {
                row.push(match m.strut {
                    Some(_) => escape(&compression_explanation(m, &compression(scenario, i))),
                    None => NONE.to_string(),
                });
            }
            row
        })
        .collect();
    let mut strength_head = vec!["Member", "Rating", "Efficiency", "Design factor", "Allowable"];
    if hitches {
        strength_head.insert(3, "Hitch (mode factor)");
    }
    if struts {
        strength_head.push("In compression (buckling)");
    }
    format!(
        "<h3>Members: make-up and stiffness</h3>{}<h3>Members: strength</h3>{}",
        table(
            "inputs-members",
            &["Member", "Size", "Material", "Construction or grade", "E·A", "Slack", "Own weight"],
            &make_up
        ),
        table("inputs-strength", &strength_head, &strength)
    )
}

fn make_up_row(scenario: &Scenario, m: &Member, units: UnitSystem) -> Vec<String> {
    let end = |i: usize| scenario.nodes.get(i).map_or_else(String::new, |n| escape(&n.id));
    let section = m.strut.as_ref().and_then(|s| s.section);
    let size = match (section, m.diameter) {
        (Some(s), _) => with_note(&escape(&s.describe()), &format!("area {}", units.area(m.area.value))),
        (None, Some(d)) => {
            with_note(&format!("⌀&nbsp;{}", units.small_length(d.value)), &format!("area {}", units.area(m.area.value)))
        }
        (None, None) => format!("area {}", units.area(m.area.value)),
    };
    let grade = match (m.construction, m.chain_grade) {
        (Some(c), _) => c.name().to_string(),
        (None, Some(g)) => format!("grade {}", g.name()),
        (None, None) => NONE.to_string(),
    };
    vec![
        with_note(
            &format!("<b>{}</b>", escape(&m.id)),
            &match &m.run {
                None => format!("{}, {} – {}", m.kind.label(), end(m.ends[0]), end(m.ends[1])),
                Some(run) => format!(
                    "{} rope over sheaves, {}; {}",
                    m.kind.label(),
                    m.path().iter().map(|&k| end(k)).collect::<Vec<_>>().join(" – "),
                    escape(&run.note)
                ),
            },
        ),
        size,
        m.material.map_or_else(|| NONE.to_string(), |x| escape(x.name())),
        grade,
        with_note(&units.axial_stiffness(m.axial_stiffness.value), &escape(&m.stiffness_note)),
        slack(m, units),
        weight(m, units),
    ]
}

fn slack(m: &Member, units: UnitSystem) -> String {
    let s = m.slack.value;
    let text = if s == 0.0 {
        "none".to_string()
    } else if s > 0.0 {
        units.small_length(s)
    } else {
        format!("{} (pretension)", units.small_length(s))
    };
    if m.may_go_slack { with_note(&text, "may go slack") } else { text }
}

fn weight(m: &Member, units: UnitSystem) -> String {
    let value =
        if m.linear_mass.value > 0.0 { units.linear_mass(m.linear_mass.value) } else { "not counted".to_string() };
    with_note(&value, &escape(&m.weight_note))
}

fn strength_row(analysis: &Analysis, m: &Member, units: UnitSystem) -> Vec<String> {
    let rating = match m.rating {
        Rating::BreakingStrength(f) => format!("minimum breaking strength {}", units.force_input(f.value)),
        Rating::WorkingLoadLimit(f) => format!("working load limit {}", units.force_input(f.value)),
        Rating::Yield(p) => format!("yield stress {}", units.stress(p.value)),
    };
    let df = &m.design_factor;
    let source = if df.from_file {
        format!(
            "set in the file; the default for {} is {} ({})",
            m.kind.label(),
            number(df.default.value),
            df.default.source
        )
    } else {
        format!("default: {}", df.default.source)
    };
    let factor = match m.rating {
        Rating::WorkingLoadLimit(_) if df.duty_multiplier != 1.0 => with_note(
            &format!("WLL / {}", number(df.duty_multiplier)),
            &escape(&format!("the working load limit divided for the duty: {}", df.default.source)),
        ),
        Rating::WorkingLoadLimit(_) => with_note(NONE, "not applied: the working load limit is the allowable"),
        _ => with_note(&number(df.value), &escape(&source)),
    };
    let allowable = analysis
        .comparison
        .iter()
        .find(|r| r.id == m.id)
        .map_or_else(|| NONE.to_string(), |r| units.force(r.allowable_n));
    vec![
        format!("<b>{}</b>", escape(&m.id)),
        with_note(&rating, &escape(&m.rating_note)),
        with_note(&number(m.efficiency), &escape(&m.efficiency_note)),
        factor,
        allowable,
    ]
}
