//! Renaming an id. Ids are how the scenario refers to its items, so a
//! rename carries every reference with it: member ends, a mass's node and
//! a swing's pivot and the rope paths through it when a node is renamed, the cases' mass when a mass is,
//! the floor nodes' slab when a slab is. An empty id, or one another item
//! already has, is refused with the clash named.

use crate::document::selection::Selection;
use tautspan_core::file::{CaseDto, ScenarioDto, SupportDto};

/// What kind of item an id names.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum IdKind {
    /// An anchor, joint or floor node.
    Node,
    /// A member.
    Member,
    /// A mass.
    Mass,
    /// A floor slab.
    Floor,
    /// A load case.
    Case,
    /// A rope over sheaves.
    Rope,
}

impl IdKind {
    /// The item's name in messages.
    pub fn noun(self) -> &'static str {
        match self {
            IdKind::Node => "node",
            IdKind::Member => "member",
            IdKind::Mass => "mass",
            IdKind::Floor => "floor slab",
            IdKind::Case => "case",
            IdKind::Rope => "rope",
        }
    }
}

/// Why `new` cannot replace the id `old`, or `None` when it can. Items on
/// the drawing share one set of ids (warnings and load paths name them by
/// id alone); cases have their own.
pub fn refusal(dto: &ScenarioDto, kind: IdKind, old: &str, new: &str) -> Option<String> {
    let new = new.trim();
    if new.is_empty() {
        return Some(format!("A {} needs an id; the id stays \"{old}\".", kind.noun()));
    }
    if new == old {
        return None;
    }
    // cases have their own ids; every item on the drawing shares one set,
    // by the core's rule, the same the file reader applies
    let holder = if kind == IdKind::Case {
        dto.cases.iter().any(|c| c.id() == new).then_some("case")
    } else {
        tautspan_core::model::drawing_id_holder(dto, new).map(|(k, _)| k.noun())
    };
    holder.map(|h| format!("\"{new}\" is already the id of a {h}; the id stays \"{old}\"."))
}

fn case_id_mut(c: &mut CaseDto) -> &mut String {
    match c {
        CaseDto::Static { id } | CaseDto::Swing { id, .. } | CaseDto::Drop { id, .. } | CaseDto::Sudden { id, .. } => {
            id
        }
    }
}

/// Rename `old` to `new` (trimmed) and every reference to it. Returns the
/// selection of the renamed item (cases are not selected on the canvas).
/// Does nothing when [`refusal`] refuses.
pub fn rename(dto: &mut ScenarioDto, kind: IdKind, old: &str, new: &str) -> Option<Selection> {
    if refusal(dto, kind, old, new).is_some() {
        return None;
    }
    let new = new.trim().to_string();
    let swap = |s: &mut String| {
        if s == old {
            s.clone_from(&new);
        }
    };
    match kind {
        IdKind::Node => {
            dto.nodes.iter_mut().for_each(|n| swap(&mut n.id));
            for m in &mut dto.members {
                swap(&mut m.ends.0);
                swap(&mut m.ends.1);
            }
            dto.ropes.iter_mut().for_each(|r| r.path.iter_mut().for_each(&swap));
            dto.masses.iter_mut().for_each(|m| swap(&mut m.at));
            for c in &mut dto.cases {
                if let CaseDto::Swing { pivot: Some(p), .. } = c {
                    swap(p);
                }
            }
            Some(Selection::Node(new))
        }
        IdKind::Member => {
            dto.members.iter_mut().for_each(|m| swap(&mut m.id));
            Some(Selection::Member(new))
        }
        IdKind::Rope => {
            dto.ropes.iter_mut().for_each(|r| swap(&mut r.id));
            Some(Selection::Rope(new))
        }
        IdKind::Mass => {
            dto.masses.iter_mut().for_each(|m| swap(&mut m.id));
            for c in &mut dto.cases {
                if let CaseDto::Swing { mass, .. } | CaseDto::Drop { mass, .. } | CaseDto::Sudden { mass, .. } = c {
                    swap(mass);
                }
            }
            Some(Selection::Mass(new))
        }
        IdKind::Floor => {
            dto.floors.iter_mut().for_each(|f| swap(&mut f.id));
            for n in &mut dto.nodes {
                if let SupportDto::Floor(f) = &mut n.support {
                    swap(f);
                }
            }
            Some(Selection::Floor(new))
        }
        IdKind::Case => {
            dto.cases.iter_mut().for_each(|c| swap(case_id_mut(c)));
            None
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::document::edits::{add_mass, add_member, add_node};
    use crate::fields::units_display::UnitSystem;
    use tautspan_core::library::MemberKind;

    fn rig() -> ScenarioDto {
        let mut d = crate::document::blank_scenario();
        let a = add_node(&mut d, 0.0, 3.0, SupportDto::Anchor, UnitSystem::Si);
        let j = add_node(&mut d, 0.0, 1.0, SupportDto::Joint, UnitSystem::Si);
        add_member(&mut d, &a, &j, MemberKind::WireRope, UnitSystem::Si);
        let m = add_mass(&mut d, &j, UnitSystem::Si);
        d.cases.push(CaseDto::Swing {
            id: "swing".into(),
            mass: m,
            release: "20 deg".into(),
            pivot: Some(a),
            azimuth: None,
        });
        d
    }

    #[test]
    fn a_node_takes_its_references_along() {
        let mut d = rig();
        assert_eq!(rename(&mut d, IdKind::Node, "A1", "beam"), Some(Selection::Node("beam".into())));
        assert_eq!(d.members[0].ends.0, "beam");
        assert!(matches!(&d.cases[1], CaseDto::Swing { pivot: Some(p), .. } if p == "beam"));
        assert!(tautspan_core::model::build(&d).is_ok(), "still validates");
    }

    #[test]
    fn a_node_renamed_renames_it_in_rope_paths_and_rope_ids_clash_with_members() {
        let mut d = rig();
        let b = add_node(&mut d, 2.0, 3.0, SupportDto::Anchor, UnitSystem::Si);
        crate::document::edits::add_rope(&mut d, &["A1".to_string(), "J1".to_string(), b], UnitSystem::Si);
        rename(&mut d, IdKind::Node, "J1", "block");
        assert_eq!(d.ropes[0].path[1], "block");
        assert!(refusal(&d, IdKind::Member, "W1", "rope1").is_some_and(|r| r.contains("id of a rope")));
        assert_eq!(rename(&mut d, IdKind::Rope, "rope1", "fall"), Some(Selection::Rope("fall".into())));
        assert_eq!(d.ropes[0].id, "fall");
    }

    #[test]
    fn a_mass_takes_its_cases_along() {
        let mut d = rig();
        rename(&mut d, IdKind::Mass, "load1", "motor");
        assert!(matches!(&d.cases[1], CaseDto::Swing { mass, .. } if mass == "motor"));
    }

    #[test]
    fn empty_and_taken_ids_are_refused_with_the_clash_named() {
        let d = rig();
        assert!(refusal(&d, IdKind::Node, "A1", "  ").is_some_and(|r| r.contains("needs an id")));
        let clash = refusal(&d, IdKind::Member, "W1", "J1").unwrap_or_default();
        assert!(clash.contains("\"J1\" is already the id of a node"), "{clash}");
        assert!(refusal(&d, IdKind::Case, "hanging", "swing").is_some(), "case ids clash with case ids");
        assert_eq!(refusal(&d, IdKind::Case, "hanging", "J1"), None, "cases have their own ids");
        let mut d2 = d.clone();
        assert_eq!(rename(&mut d2, IdKind::Node, "A1", "J1"), None);
        assert_eq!(d2, d, "a refused rename changes nothing");
    }
}
