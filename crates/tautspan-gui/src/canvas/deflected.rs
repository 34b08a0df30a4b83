//! The deflected shape: the canvas drawn at the core's solved positions of
//! the shown case instead of the drawn ones, each node's displacement
//! (solved position less the position it was solved from) multiplied by a
//! magnification so small stretches can be seen. The app only scales the
//! core's displacements for display; it computes none.

use crate::canvas::geometry::Geometry;
use crate::canvas::view::View;
use crate::document::core_bridge::Solved;
use std::collections::HashMap;
use tautspan_core::analysis::CaseResult;

/// The magnifications offered.
pub const MAGNIFICATIONS: [u32; 4] = [1, 10, 100, 1000];

/// Each node's displacement (x, y, z), m, in a case.
pub fn displacements(solved: &Solved, case: &CaseResult) -> HashMap<String, [f64; 3]> {
    let drawn: HashMap<&str, [f64; 3]> = solved
        .scenario
        .nodes
        .iter()
        .map(|n| (n.id.as_str(), [n.position[0].value, n.position[1].value, n.position[2].value]))
        .collect();
    case.nodes
        .iter()
        .filter_map(|r| {
            let d = drawn.get(r.id.as_str())?;
            Some((r.id.clone(), std::array::from_fn(|k| r.position_m[k] - d[k])))
        })
        .collect()
}

/// The geometry with every node moved by its displacement × `magnification`
/// (slabs move with their node; nodes without a result stay), drawn in `view`.
pub fn displaced(geo: &Geometry, by: &HashMap<String, [f64; 3]>, magnification: f64, view: &View) -> Geometry {
    let mut out = geo.clone();
    let shift = |id: &str, p: &mut [f64; 3]| {
        if let Some(d) = by.get(id) {
            for k in 0..3 {
                p[k] += d[k] * magnification;
            }
        }
    };
    for n in &mut out.nodes {
        shift(&n.id, &mut n.xyz_m);
    }
    for f in &mut out.floors {
        shift(&f.node_id, &mut f.xyz_m);
    }
    out.projected(view)
}

/// The caption the canvas carries in the deflected view.
pub fn caption(case_id: &str, magnification: u32) -> String {
    if magnification > 1 {
        format!("Deflected shape ×{magnification}, exaggerated · case {case_id}")
    } else {
        format!("Deflected shape, true scale (×1) · case {case_id}")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_caption_says_when_it_is_exaggerated() {
        assert!(caption("hanging", 100).starts_with("Deflected shape ×100, exaggerated"));
        assert!(!caption("hanging", 1).contains("exaggerated"));
    }
}
