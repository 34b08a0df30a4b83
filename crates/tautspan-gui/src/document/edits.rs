//! Edits of the scenario's file types that the canvas and the panels ask
//! for: placing nodes, members, masses and floors with sensible defaults,
//! moving nodes, and deleting with everything that depends on the item.

use crate::document::selection::Selection;
use crate::fields::qty_text::requantify;
use crate::fields::units_display::{Shown, UnitSystem};
use tautspan_core::file::SectionDto;
use tautspan_core::file::{
    CaseDto, FloorDto, MassDto, MemberDto, NodeDto, Position, Qty, RatingDto, RopeDto, ScenarioDto, SheaveDto,
    SupportDto,
};
use tautspan_core::library::{Edges, MemberKind};

/// The first free id `prefix1`, `prefix2`, … among `taken`.
pub fn fresh_id<'a>(prefix: &str, taken: impl Iterator<Item = &'a str> + Clone) -> String {
    (1..)
        .map(|i| format!("{prefix}{i}"))
        .find(|id| !taken.clone().any(|t| t == id))
        .unwrap_or_else(|| prefix.to_string())
}

fn position(x_m: f64, y_m: f64, units: UnitSystem) -> Position {
    Position { x: requantify(None, x_m, Shown::Length, units), y: requantify(None, y_m, Shown::Length, units), z: None }
}

/// Add a node at (x, y) m; returns its id.
pub fn add_node(dto: &mut ScenarioDto, x_m: f64, y_m: f64, support: SupportDto, units: UnitSystem) -> String {
    let prefix = match support {
        SupportDto::Anchor => "A",
        SupportDto::Joint => "J",
        SupportDto::Floor(_) => "P",
    };
    let id = fresh_id(prefix, dto.nodes.iter().map(|n| n.id.as_str()));
    dto.nodes.push(NodeDto { id: id.clone(), at: position(x_m, y_m, units), support, ..NodeDto::default() });
    id
}

/// Add a floor node at (x, y) m, creating a slab for it; returns the node id.
pub fn add_floor_node(dto: &mut ScenarioDto, x_m: f64, y_m: f64, units: UnitSystem) -> String {
    let floor_id = fresh_id("slab-", dto.floors.iter().map(|f| f.id.as_str()));
    let us = units == UnitSystem::UsCustomary;
    dto.floors.push(FloorDto {
        id: floor_id.clone(),
        span: if us { (Qty::from("12 ft"), Qty::from("12 ft")) } else { (Qty::from("4 m"), Qty::from("4 m")) },
        thickness: Qty::from(if us { "6 in" } else { "150 mm" }),
        modulus: None,
        material: Some("concrete".to_string()),
        poisson: None,
        edges: Edges::SimplySupported,
        rated_uniform: Some(Qty::from(if us { "50 psf" } else { "2.4 kPa" })),
        rated_point: Some(Qty::from(if us { "2000 lbf" } else { "8.9 kN" })),
        pad: None,
        deflection_limit: None,
        // the new panel centred under its first foot (at z = 0)
        origin: Some((
            requantify(None, x_m - if us { 6.0 * 0.3048 } else { 2.0 }, Shown::Length, units),
            requantify(None, -(if us { 6.0 * 0.3048 } else { 2.0 }), Shown::Length, units),
        )),
        friction_limit: None,
    });
    add_node(dto, x_m, y_m, SupportDto::Floor(floor_id), units)
}

/// A new member of `kind` between two nodes, sized so it validates at once.
pub fn default_member(id: String, a: &str, b: &str, kind: MemberKind, units: UnitSystem) -> MemberDto {
    let us = units == UnitSystem::UsCustomary;
    let q = |si: &str, usc: &str| Some(Qty::from(if us { usc } else { si }));
    let base = MemberDto { id, ends: (a.to_string(), b.to_string()), kind, ..MemberDto::default() };
    match kind {
        MemberKind::WireRope | MemberKind::Cable => MemberDto {
            diameter: q("12 mm", "0.5 in"),
            construction: Some("6x19 IWRC".to_string()),
            grade: Some("1770".to_string()),
            ..base
        },
        MemberKind::FibreRope => MemberDto {
            diameter: q("16 mm", "0.625 in"),
            material: Some("polyester".to_string()),
            rating: Some(RatingDto::BreakingStrength(Qty::from(if us { "9000 lbf" } else { "40 kN" }))),
            ..base
        },
        // 10 mm is in the EN 818-2 table; 3/8 in is not, so it carries its
        // grade 80 WLL, 7,100 lbf (ASTM A391 / NACM, from memory)
        MemberKind::Chain if us => MemberDto {
            diameter: q("10 mm", "0.375 in"),
            grade: Some("80".to_string()),
            rating: Some(RatingDto::WorkingLoadLimit(Qty::from("7100 lbf"))),
            ..base
        },
        MemberKind::Chain => MemberDto { diameter: q("10 mm", "0.375 in"), grade: Some("80".to_string()), ..base },
        // a solid round section, so a rod drawn as a strut is checked for buckling
        MemberKind::Rod => MemberDto {
            section: q("16 mm", "0.625 in").map(|diameter| SectionDto::SolidRound { diameter }),
            material: Some("steel".to_string()),
            ..base
        },
    }
}

/// The ids of members and ropes: one id space.
fn line_ids(dto: &ScenarioDto) -> Vec<&str> {
    dto.members.iter().map(|m| m.id.as_str()).chain(dto.ropes.iter().map(|r| r.id.as_str())).collect()
}

/// Add a member between two nodes; returns its id.
pub fn add_member(dto: &mut ScenarioDto, a: &str, b: &str, kind: MemberKind, units: UnitSystem) -> String {
    let prefix = match kind {
        MemberKind::WireRope => "W",
        MemberKind::FibreRope => "F",
        MemberKind::Chain => "C",
        MemberKind::Rod => "R",
        MemberKind::Cable => "K",
    };
    let id = fresh_id(prefix, line_ids(dto).iter().copied());
    dto.members.push(default_member(id.clone(), a, b, kind, units));
    id
}

/// A sheave as the rope tool gives a node that has none: its diameter left
/// empty for the user to give (the core names the field until then; there
/// is no diameter a sheave could be assumed to have), frictionless.
pub fn new_sheave() -> SheaveDto {
    SheaveDto { diameter: Qty(String::new()), bearing: None }
}

/// Add a wire rope over `path` (first end, the nodes it runs over, last
/// end), sized as a new wire rope member is; every node between the ends
/// without a sheave gets one ([`new_sheave`]). Returns its id. Rope ids are
/// drawn from the members' and ropes' ids together (one id space).
pub fn add_rope(dto: &mut ScenarioDto, path: &[String], units: UnitSystem) -> String {
    let id = fresh_id("rope", line_ids(dto).iter().copied());
    let first = path.first().map_or("", String::as_str);
    let last = path.last().map_or("", String::as_str);
    let m = default_member(id.clone(), first, last, MemberKind::WireRope, units);
    for via in path.iter().skip(1).take(path.len().saturating_sub(2)) {
        if let Some(n) = dto.nodes.iter_mut().find(|n| &n.id == via)
            && n.sheave.is_none()
        {
            n.sheave = Some(new_sheave());
        }
    }
    dto.ropes.push(RopeDto {
        id: id.clone(),
        path: path.to_vec(),
        kind: MemberKind::WireRope,
        diameter: m.diameter,
        construction: m.construction,
        grade: m.grade,
        ..RopeDto::default()
    });
    id
}

/// Hang a mass at a node; returns its id.
pub fn add_mass(dto: &mut ScenarioDto, node: &str, units: UnitSystem) -> String {
    let id = fresh_id("load", dto.masses.iter().map(|m| m.id.as_str()));
    let mass = Qty::from(if units == UnitSystem::UsCustomary { "500 lb" } else { "250 kg" });
    dto.masses.push(MassDto { id: id.clone(), at: node.to_string(), mass });
    id
}

/// Move a node to (x, y) m, keeping the units its coordinates were written in.
pub fn move_node(dto: &mut ScenarioDto, node: &str, x_m: f64, y_m: f64, units: UnitSystem) {
    if let Some(n) = dto.nodes.iter_mut().find(|n| n.id == node) {
        n.at.x = requantify(Some(&n.at.x), x_m, Shown::Length, units);
        n.at.y = requantify(Some(&n.at.y), y_m, Shown::Length, units);
    }
}

fn case_mass(c: &CaseDto) -> Option<&str> {
    match c {
        CaseDto::Static { .. } => None,
        CaseDto::Swing { mass, .. } | CaseDto::Drop { mass, .. } | CaseDto::Sudden { mass, .. } => Some(mass),
    }
}

fn remove_masses(dto: &mut ScenarioDto, doomed: &[String]) {
    dto.masses.retain(|m| !doomed.contains(&m.id));
    dto.cases.retain(|c| case_mass(c).is_none_or(|m| !doomed.contains(&m.to_string())));
}

/// What deleting the selection takes with it or changes, in words, one
/// line each ("member leg-west", "case snatch (its mass goes)"); empty when
/// nothing else uses it, so it is deleted without asking.
pub fn dependents(dto: &ScenarioDto, selection: &Selection) -> Vec<String> {
    let mut out = Vec::new();
    let masses_going: Vec<String> = match selection {
        Selection::Node(id) => {
            out.extend(
                dto.members.iter().filter(|m| &m.ends.0 == id || &m.ends.1 == id).map(|m| format!("member {}", m.id)),
            );
            out.extend(dto.ropes.iter().filter(|r| r.path.contains(id)).map(|r| format!("rope {}", r.id)));
            let masses: Vec<String> = dto.masses.iter().filter(|m| &m.at == id).map(|m| m.id.clone()).collect();
            out.extend(masses.iter().map(|m| format!("mass {m}")));
            out.extend(dto.cases.iter().filter_map(|c| match c {
                CaseDto::Swing { id: case, pivot: Some(p), .. } if p == id => {
                    Some(format!("case {case} swings about its default pivot instead"))
                }
                _ => None,
            }));
            masses
        }
        Selection::Mass(id) => vec![id.clone()],
        Selection::Floor(id) => {
            out.extend(
                dto.nodes
                    .iter()
                    .filter(|n| n.support == SupportDto::Floor(id.clone()))
                    .map(|n| format!("node {} no longer stands on it (becomes a joint)", n.id)),
            );
            Vec::new()
        }
        Selection::None | Selection::Member(_) | Selection::Rope(_) => Vec::new(),
    };
    out.extend(
        dto.cases
            .iter()
            .filter(|c| case_mass(c).is_some_and(|m| masses_going.iter().any(|g| g == m)))
            .map(|c| format!("case {} (its mass goes)", c.id())),
    );
    out
}

/// Delete the selected item and whatever depends on it (a node takes its
/// members, the ropes running through it and its masses; a mass takes its dynamic cases; a slab frees its nodes).
pub fn delete(dto: &mut ScenarioDto, selection: &Selection) {
    match selection {
        Selection::None => {}
        Selection::Node(id) => {
            dto.nodes.retain(|n| &n.id != id);
            dto.members.retain(|m| &m.ends.0 != id && &m.ends.1 != id);
            // a rope cannot run through a node that is gone
            dto.ropes.retain(|r| !r.path.contains(id));
            let doomed: Vec<String> = dto.masses.iter().filter(|m| &m.at == id).map(|m| m.id.clone()).collect();
            remove_masses(dto, &doomed);
            for c in &mut dto.cases {
                if let CaseDto::Swing { pivot, .. } = c
                    && pivot.as_deref() == Some(id.as_str())
                {
                    *pivot = None;
                }
            }
        }
        Selection::Member(id) => dto.members.retain(|m| &m.id != id),
        Selection::Rope(id) => dto.ropes.retain(|r| &r.id != id),
        Selection::Mass(id) => remove_masses(dto, std::slice::from_ref(id)),
        Selection::Floor(id) => {
            dto.floors.retain(|f| &f.id != id);
            for n in &mut dto.nodes {
                if n.support == SupportDto::Floor(id.clone()) {
                    n.support = SupportDto::Joint;
                }
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn what_goes_with_a_node_is_listed_before_it_goes() {
        let mut d = crate::document::blank_scenario();
        let a = add_node(&mut d, 0.0, 3.0, SupportDto::Anchor, UnitSystem::Si);
        let j = add_node(&mut d, 0.0, 1.0, SupportDto::Joint, UnitSystem::Si);
        let m = add_member(&mut d, &a, &j, MemberKind::WireRope, UnitSystem::Si);
        let mass = add_mass(&mut d, &j, UnitSystem::Si);
        d.cases.push(CaseDto::Sudden { id: "s".into(), mass: mass.clone() });
        let deps = dependents(&d, &Selection::Node(j.clone()));
        assert_eq!(deps, [format!("member {m}"), format!("mass {mass}"), "case s (its mass goes)".to_string()]);
        assert_eq!(dependents(&d, &Selection::Mass(mass)), ["case s (its mass goes)"]);
        assert!(dependents(&d, &Selection::Member(m)).is_empty(), "a member: nothing else uses it");
        // and delete takes exactly those
        delete(&mut d, &Selection::Node(j));
        assert!(d.members.is_empty() && d.masses.is_empty() && d.cases.len() == 1);
    }

    #[test]
    fn ids_are_fresh() {
        let taken = ["A1", "A2"];
        assert_eq!(fresh_id("A", taken.iter().copied()), "A3");
    }

    #[test]
    fn deleting_a_node_takes_its_members_and_masses() {
        let mut d = crate::document::blank_scenario();
        let a = add_node(&mut d, 0.0, 3.0, SupportDto::Anchor, UnitSystem::Si);
        let j = add_node(&mut d, 0.0, 1.0, SupportDto::Joint, UnitSystem::Si);
        add_member(&mut d, &a, &j, MemberKind::WireRope, UnitSystem::Si);
        let m = add_mass(&mut d, &j, UnitSystem::Si);
        d.cases.push(CaseDto::Sudden { id: "s".into(), mass: m });
        delete(&mut d, &Selection::Node(j));
        assert!(d.members.is_empty() && d.masses.is_empty());
        assert_eq!(d.cases.len(), 1);
    }

    #[test]
    fn a_rope_gives_its_middle_nodes_sheaves_and_goes_with_any_of_its_nodes() {
        let mut d = crate::document::blank_scenario();
        let a = add_node(&mut d, 0.0, 3.0, SupportDto::Anchor, UnitSystem::Si);
        let k = add_node(&mut d, 1.0, 1.0, SupportDto::Joint, UnitSystem::Si);
        let b = add_node(&mut d, 2.0, 3.0, SupportDto::Anchor, UnitSystem::Si);
        add_member(&mut d, &a, &b, MemberKind::WireRope, UnitSystem::Si);
        let id = add_rope(&mut d, &[a.clone(), k.clone(), b.clone()], UnitSystem::Si);
        assert_eq!(id, "rope1");
        assert!(d.nodes[1].sheave.is_some() && d.nodes[0].sheave.is_none() && d.nodes[2].sheave.is_none());
        // the new sheave's diameter is the user's to give: the core names the field
        let problems = tautspan_core::model::build(&d).err().unwrap_or_default();
        assert!(problems.iter().any(|p| p.path == "nodes[1].sheave.diameter"), "{problems:?}");
        d.nodes[1].sheave = Some(SheaveDto { diameter: Qty::from("300 mm"), bearing: None });
        assert!(tautspan_core::model::build(&d).is_ok());
        delete(&mut d, &Selection::Node(k));
        assert!(d.ropes.is_empty() && d.members.len() == 1);
    }

    #[test]
    fn a_new_member_validates() {
        for kind in MemberKind::ALL {
            let mut d = crate::document::blank_scenario();
            let a = add_node(&mut d, 0.0, 3.0, SupportDto::Anchor, UnitSystem::Si);
            let j = add_node(&mut d, 0.0, 1.0, SupportDto::Joint, UnitSystem::Si);
            add_member(&mut d, &a, &j, kind, UnitSystem::UsCustomary);
            assert!(tautspan_core::model::build(&d).is_ok(), "{kind:?}");
        }
    }
}
