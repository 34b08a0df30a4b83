//! The one rule for ids, shared by the file reader and the app: the items
//! on the drawing (nodes, members, ropes over sheaves, masses, floor slabs)
//! share one set of ids, because warnings, load paths and the results name
//! them by id alone; load cases have a set of their own. An empty id is
//! refused too.

use crate::file::ScenarioDto;
use std::collections::HashMap;

/// The kinds of item whose ids share one set.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum DrawingItem {
    /// A node: anchor, joint or floor foot.
    Node,
    /// A member.
    Member,
    /// A rope over sheaves.
    Rope,
    /// A mass.
    Mass,
    /// A floor slab.
    Floor,
}

impl DrawingItem {
    /// The item's name in messages.
    pub fn noun(self) -> &'static str {
        match self {
            DrawingItem::Node => "node",
            DrawingItem::Member => "member",
            DrawingItem::Rope => "rope",
            DrawingItem::Mass => "mass",
            DrawingItem::Floor => "floor slab",
        }
    }

    /// The scenario's list the item is in.
    pub fn section(self) -> &'static str {
        match self {
            DrawingItem::Node => "nodes",
            DrawingItem::Member => "members",
            DrawingItem::Rope => "ropes",
            DrawingItem::Mass => "masses",
            DrawingItem::Floor => "floors",
        }
    }
}

/// Every drawing item's id in the file's order: nodes, members, ropes,
/// masses, floors.
fn drawing_ids(dto: &ScenarioDto) -> impl Iterator<Item = (DrawingItem, usize, &str)> {
    fn each<'a>(
        kind: DrawingItem,
        ids: impl Iterator<Item = &'a str>,
    ) -> impl Iterator<Item = (DrawingItem, usize, &'a str)> {
        ids.enumerate().map(move |(i, id)| (kind, i, id))
    }
    each(DrawingItem::Node, dto.nodes.iter().map(|n| n.id.as_str()))
        .chain(each(DrawingItem::Member, dto.members.iter().map(|m| m.id.as_str())))
        .chain(each(DrawingItem::Rope, dto.ropes.iter().map(|r| r.id.as_str())))
        .chain(each(DrawingItem::Mass, dto.masses.iter().map(|m| m.id.as_str())))
        .chain(each(DrawingItem::Floor, dto.floors.iter().map(|f| f.id.as_str())))
}

/// The drawing item that already has `id`, with its index in its list (the
/// first in file order), or `None`: what the app asks before it takes a
/// new id for an item on the drawing.
pub fn drawing_id_holder(dto: &ScenarioDto, id: &str) -> Option<(DrawingItem, usize)> {
    drawing_ids(dto).find(|(_, _, x)| *x == id).map(|(k, i, _)| (k, i))
}

/// Ids that two drawing items of different kinds share: the later item's
/// id path and the message naming the first holder. (Duplicates within one
/// list are reported with the list's own check.)
pub fn id_clashes(dto: &ScenarioDto) -> Vec<(String, String)> {
    let mut first: HashMap<&str, (DrawingItem, usize)> = HashMap::new();
    let mut out = Vec::new();
    for (kind, i, id) in drawing_ids(dto) {
        if id.trim().is_empty() {
            continue;
        }
        match first.get(id) {
            Some(&(k0, i0)) if k0 != kind => out.push((
                format!("{}[{i}].id", kind.section()),
                format!(
                    "{} id \"{id}\" is already the id of a {} ({}[{i0}]); nodes, members, ropes, masses and floors share one set of ids",
                    kind.noun(),
                    k0.noun(),
                    k0.section()
                ),
            )),
            Some(_) => {}
            None => {
                first.insert(id, (kind, i));
            }
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::file::{MassDto, MemberDto, NodeDto};

    #[test]
    fn ids_clash_across_the_drawing_but_not_with_cases() {
        let dto = ScenarioDto {
            nodes: vec![NodeDto { id: "J1".into(), ..NodeDto::default() }],
            members: vec![MemberDto { id: "J1".into(), ..MemberDto::default() }],
            masses: vec![MassDto { id: "load".into(), at: "J1".into(), mass: "1 kg".into() }],
            cases: vec![crate::file::CaseDto::Static { id: "load".into() }],
            ..ScenarioDto::default()
        };
        let c = id_clashes(&dto);
        assert_eq!(c.len(), 1, "{c:?}");
        assert_eq!(c[0].0, "members[0].id");
        assert!(c[0].1.contains("already the id of a node (nodes[0])"), "{}", c[0].1);
        assert_eq!(drawing_id_holder(&dto, "J1"), Some((DrawingItem::Node, 0)));
        assert_eq!(drawing_id_holder(&dto, "load"), Some((DrawingItem::Mass, 0)));
        assert_eq!(drawing_id_holder(&dto, "hanging"), None);
    }
}
