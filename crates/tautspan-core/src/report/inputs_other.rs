//! The rest of the inputs: floors (spans, thickness, modulus, Poisson's
//! ratio, edges, ratings, pad, deflection limit, point stiffness), masses
//! and nodes (support, drawn and solved position).

use super::escape::escape;
use super::geometry::static_case;
use super::table::{NONE, table, with_note};
use super::unit_system::{UnitSystem, number};
use crate::analysis::Analysis;
use crate::library::Edges;
use crate::model::{Floor, Scenario, Support};

/// The floors table.
pub fn floors(scenario: &Scenario, units: UnitSystem) -> String {
    if scenario.floors.is_empty() {
        return String::new();
    }
    let rows: Vec<Vec<String>> = scenario.floors.iter().map(|f| floor_row(f, units)).collect();
    format!(
        "<h3>Floors</h3>{}",
        table(
            "inputs-floors",
            &[
                "Floor",
                "Panel: spans x × z, place, friction",
                "Thickness",
                "Modulus",
                "Poisson",
                "Edges",
                "Rated loads",
                "Pad",
                "Deflection limit",
                "Point stiffness"
            ],
            &rows
        )
    )
}

fn floor_row(f: &Floor, units: UnitSystem) -> Vec<String> {
    let edges = match f.edges {
        Edges::SimplySupported => "simply supported",
        Edges::Clamped => "clamped",
    };
    let uniform = f
        .rated_uniform
        .map_or_else(|| "uniform: none given".to_string(), |p| format!("uniform {}", units.floor_pressure(p.value)));
    let point = f
        .rated_point
        .map_or_else(|| "point: none given".to_string(), |p| format!("point {}", units.force_input(p.value)));
    let origin = format!(
        "corner ({}, {}){}",
        units.length(f.origin[0].value),
        units.length(f.origin[1].value),
        if f.origin_given { "" } else { ", centred under its feet (no origin given)" }
    );
    vec![
        format!("<b>{}</b>", escape(&f.id)),
        format!(
            "{} × {}<br>{origin}<br>friction limit {} ({})",
            units.length(f.span[0].value),
            units.length(f.span[1].value),
            number(f.friction_limit),
            escape(f.friction_source)
        ),
        units.small_length(f.thickness.value),
        units.modulus(f.modulus.value),
        number(f.poisson),
        edges.to_string(),
        format!("{uniform}<br>{point}"),
        f.pad.map_or_else(
            || NONE.to_string(),
            |p| format!("{} × {}", units.length(p[0].value), units.length(p[1].value)),
        ),
        format!("span / {}", number(f.deflection_limit)),
        with_note(&units.spring(f.stiffness_n_per_m), "centre point load, plate bending"),
    ]
}

/// The masses table.
pub fn masses(scenario: &Scenario, units: UnitSystem) -> String {
    if scenario.masses.is_empty() {
        return "<h3>Masses</h3><p>None.</p>".to_string();
    }
    let rows: Vec<Vec<String>> = scenario
        .masses
        .iter()
        .map(|m| {
            let at = scenario.nodes.get(m.node).map_or_else(String::new, |n| escape(&n.id));
            vec![format!("<b>{}</b>", escape(&m.id)), at, units.mass(m.mass.value)]
        })
        .collect();
    format!("<h3>Masses</h3>{}", table("inputs-masses", &["Mass", "At node", "Mass"], &rows))
}

/// The nodes table, with the static case's solved positions beside the drawn ones.
pub fn nodes(scenario: &Scenario, analysis: &Analysis, units: UnitSystem) -> String {
    let solved = static_case(analysis);
    let pos = |p: [f64; 3]| format!("{}, {}, {}", units.length(p[0]), units.length(p[1]), units.length(p[2]));
    let rows: Vec<Vec<String>> = scenario
        .nodes
        .iter()
        .enumerate()
        .map(|(i, n)| {
            let support = match n.support {
                Support::Joint => "joint".to_string(),
                Support::Anchor => "anchor".to_string(),
                Support::Floor(f) => {
                    format!("on floor {}", scenario.floors.get(f).map_or_else(String::new, |f| escape(&f.id)))
                }
            };
            let s = solved
                .and_then(|c| c.nodes.iter().find(|r| r.id == n.id))
                .map_or_else(|| NONE.to_string(), |r| pos(r.position_m));
            vec![format!("<b>{}</b>", escape(&n.id)), support, pos(scenario.position_m(i)), s]
        })
        .collect();
    let solved_head = match solved {
        Some(c) => format!("Solved x, y, z (case {})", escape(&c.id)),
        None => "Solved x, y, z".to_string(),
    };
    format!("<h3>Nodes</h3>{}", table("inputs-nodes", &["Node", "Support", "Drawn x, y, z", &solved_head], &rows))
}
