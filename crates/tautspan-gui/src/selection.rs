//! What is selected and which tool is active. Items are named by id, not by
//! index, so a selection survives edits that reorder the lists.

use tautspan_core::library::MemberKind;

/// The current selection.
#[derive(Debug, Clone, PartialEq, Eq, Default)]
pub enum Selection {
    /// Nothing.
    #[default]
    None,
    /// A node (anchor, joint or floor node).
    Node(String),
    /// A member.
    Member(String),
    /// A mass.
    Mass(String),
    /// A floor slab.
    Floor(String),
}

impl Selection {
    /// Whether the selected item is in the scenario (nothing selected counts as there).
    pub fn is_in(&self, dto: &tautspan_core::file::ScenarioDto) -> bool {
        match self {
            Selection::None => true,
            Selection::Node(id) => dto.nodes.iter().any(|n| &n.id == id),
            Selection::Member(id) => dto.members.iter().any(|m| &m.id == id),
            Selection::Mass(id) => dto.masses.iter().any(|m| &m.id == id),
            Selection::Floor(id) => dto.floors.iter().any(|f| &f.id == id),
        }
    }
}

/// The canvas tool.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Tool {
    /// Select and drag.
    #[default]
    Select,
    /// Place an anchor.
    Anchor,
    /// Place a free joint.
    Joint,
    /// Place a member: click two nodes.
    Member(MemberKind),
    /// Place a mass: click a node.
    Mass,
    /// Place a node resting on a floor slab.
    FloorNode,
}

impl Tool {
    /// The tool's button label.
    pub fn label(self) -> &'static str {
        match self {
            Tool::Select => "Select",
            Tool::Anchor => "Anchor",
            Tool::Joint => "Joint",
            Tool::Member(_) => "Member",
            Tool::Mass => "Mass",
            Tool::FloorNode => "Floor node",
        }
    }

    /// What the status bar says the tool does.
    pub fn hint(self) -> &'static str {
        match self {
            Tool::Select => "Click to select, drag a node to move it, drag the background to pan, scroll to zoom.",
            Tool::Anchor => "Click to place an anchor (a fixed point: beam clamp, eye bolt).",
            Tool::Joint => "Click to place a free joint (a shackle, a ring, a bridle apex).",
            Tool::Member(_) => "Click the first node, then the second, to join them with a member.",
            Tool::Mass => "Click a node to hang a mass from it.",
            Tool::FloorNode => "Click to place a node resting on a floor slab.",
        }
    }
}
