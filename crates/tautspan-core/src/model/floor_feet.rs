//! Placing each floor's feet on its panel in plan: the panel's corner is
//! its `origin` (x, z), or, where the file gives none, the panel is centred
//! under its feet's centroid (an old file reads as before, and the output's
//! assumptions say so). Every foot must lie on the panel, clear of its
//! supported edges; then the plate with its feet is built.

use super::scenario::{Floor, Node, Support};
use crate::library::{PlatePanel, flexural_rigidity};
use uom::si::f64::Length;
use uom::si::length::meter;

/// How far inside the panel's edges a foot must stand, m. On the edge the
/// slab's own support carries it (no plate flexibility there); a foot that
/// close belongs on an anchor.
pub const EDGE_CLEARANCE_M: f64 = 1e-3;

/// Fills each floor's feet, origin and plate; returns located problems
/// (path, message).
pub(super) fn place_feet(floors: &mut [Floor], nodes: &[Node]) -> Vec<(String, String)> {
    let mut problems = Vec::new();
    for (k, floor) in floors.iter_mut().enumerate() {
        floor.feet = nodes.iter().enumerate().filter(|(_, n)| n.support == Support::Floor(k)).map(|(i, _)| i).collect();
        if floor.feet.is_empty() {
            problems.push((
                format!("floors[{k}].id"),
                format!(
                    "no node stands on floor \"{}\": it carries nothing and nothing on it is checked; give a node `support: Floor(\"{}\")` or remove the floor",
                    floor.id, floor.id
                ),
            ));
            continue;
        }
        let [sx, sz] = [floor.span[0].value, floor.span[1].value];
        if !floor.origin_given {
            let n = floor.feet.len() as f64;
            let cx = floor.feet.iter().map(|&i| nodes[i].position[0].value).sum::<f64>() / n;
            let cz = floor.feet.iter().map(|&i| nodes[i].position[2].value).sum::<f64>() / n;
            floor.origin = [Length::new::<meter>(cx - 0.5 * sx), Length::new::<meter>(cz - 0.5 * sz)];
        }
        let [ox, oz] = [floor.origin[0].value, floor.origin[1].value];
        let mut local = Vec::with_capacity(floor.feet.len());
        let mut ok = true;
        for &i in &floor.feet {
            let (x, z) = (nodes[i].position[0].value, nodes[i].position[2].value);
            let (u, v) = (x - ox, z - oz);
            let clear = u.min(sx - u).min(v).min(sz - v);
            if clear < EDGE_CLEARANCE_M {
                ok = false;
                let placed = if floor.origin_given {
                    "origin".to_string()
                } else {
                    "no origin given, so the panel is centred under its feet".to_string()
                };
                let where_ = if clear < 0.0 { "lies outside" } else { "is on the supported edge of" };
                problems.push((
                    format!("nodes[{i}].at"),
                    format!(
                        "foot \"{}\" at (x, z) = ({} m, {} m) {where_} floor \"{}\", which spans x {} to {} m, z {} to {} m ({placed}); move the foot at least {} mm inside the panel or set the floor's `origin`",
                        nodes[i].id,
                        fmt(x),
                        fmt(z),
                        floor.id,
                        fmt(ox),
                        fmt(ox + sx),
                        fmt(oz),
                        fmt(oz + sz),
                        EDGE_CLEARANCE_M * 1e3
                    ),
                ));
            }
            local.push([u, v]);
        }
        if !ok {
            continue;
        }
        let d = flexural_rigidity(floor.modulus.value, floor.thickness.value, floor.poisson);
        floor.plate = PlatePanel::new(floor.edges, [sx, sz], d, &local);
        if floor.plate.is_none() {
            problems.push((
                format!("floors[{k}].span"),
                format!("floor \"{}\": the plate of this panel cannot be solved (degenerate spans)", floor.id),
            ));
        }
    }
    problems
}

fn fmt(v: f64) -> String {
    let r = (v * 1e4).round() / 1e4;
    if r == 0.0 { "0".to_string() } else { format!("{r}") }
}
