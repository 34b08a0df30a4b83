//! Edits that place and move nodes anywhere in space, for the canvas's
//! plan, side and elevation views: each view sets the two coordinates it
//! shows and keeps the third, so these take all three. A z of 0 on a node
//! that had none stays unwritten (the file's default), so drawing in the
//! elevation leaves files as they were.

use crate::document::edits;
use crate::fields::qty_text::requantify;
use crate::fields::units_display::{Shown, UnitSystem};
use tautspan_core::file::{NodeDto, ScenarioDto, SupportDto};

fn set_z(n: &mut NodeDto, z_m: f64, units: UnitSystem) {
    if n.at.z.is_none() && z_m == 0.0 {
        return;
    }
    n.at.z = Some(requantify(n.at.z.as_ref(), z_m, Shown::Length, units));
}

/// Move a node to (x, y, z) m, keeping the units its coordinates were written in.
pub fn move_node_to(dto: &mut ScenarioDto, node: &str, xyz_m: [f64; 3], units: UnitSystem) {
    edits::move_node(dto, node, xyz_m[0], xyz_m[1], units);
    if let Some(n) = dto.nodes.iter_mut().find(|n| n.id == node) {
        set_z(n, xyz_m[2], units);
    }
}

/// Add a node at (x, y, z) m; returns its id.
pub fn add_node_at(dto: &mut ScenarioDto, xyz_m: [f64; 3], support: SupportDto, units: UnitSystem) -> String {
    let id = edits::add_node(dto, xyz_m[0], xyz_m[1], support, units);
    move_node_to(dto, &id, xyz_m, units);
    id
}

/// Add a floor node at (x, y, z) m with a new slab whose panel is centred
/// under it in plan; returns the node id.
pub fn add_floor_node_at(dto: &mut ScenarioDto, xyz_m: [f64; 3], units: UnitSystem) -> String {
    let id = edits::add_floor_node(dto, xyz_m[0], xyz_m[1], units);
    move_node_to(dto, &id, xyz_m, units);
    let floor = dto.nodes.iter().find(|n| n.id == id).and_then(|n| match &n.support {
        SupportDto::Floor(f) => Some(f.clone()),
        _ => None,
    });
    // the new panel's origin was put for a foot at z = 0: shift it to this z
    if let Some(f) = floor.and_then(|fid| dto.floors.iter_mut().find(|f| f.id == fid))
        && let Some((_, oz)) = &mut f.origin
        && xyz_m[2] != 0.0
    {
        let half_m = tautspan_core::units::parse_quantity(
            &oz.0,
            tautspan_core::units::Dimension::Length,
            tautspan_core::units::Sign::Any,
        )
        .unwrap_or(0.0);
        *oz = requantify(Some(oz), half_m + xyz_m[2], Shown::Length, units);
    }
    id
}

#[cfg(test)]
mod tests {
    use super::*;
    use tautspan_core::file::Qty;

    #[test]
    fn a_node_placed_in_space_keeps_all_three_coordinates() {
        let mut dto = ScenarioDto::default();
        let id = add_node_at(&mut dto, [1.0, 2.0, -0.5], SupportDto::Joint, UnitSystem::Si);
        let n = &dto.nodes[0];
        assert_eq!(n.id, id);
        assert_eq!((n.at.x.0.as_str(), n.at.y.0.as_str()), ("1 m", "2 m"));
        assert_eq!(n.at.z, Some(Qty::from("-0.5 m")));
        // z = 0 on a node without z stays unwritten
        let flat = add_node_at(&mut dto, [0.0, 0.0, 0.0], SupportDto::Anchor, UnitSystem::Si);
        assert!(dto.nodes.iter().any(|n| n.id == flat && n.at.z.is_none()));
    }
}
