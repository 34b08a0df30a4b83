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
    /// A rope running over sheaves.
    Rope(String),
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
            Selection::Rope(id) => dto.ropes.iter().any(|r| &r.id == id),
        }
    }

    /// The selection of a member result's id: the analysis lists ropes
    /// among the members (after the file's members), so an id the model
    /// routes over sheaves is a rope.
    pub fn of_member_result(scenario: &tautspan_core::model::Scenario, id: &str) -> Selection {
        if scenario.members.iter().any(|m| m.id == id && m.run.is_some()) {
            Selection::Rope(id.to_string())
        } else {
            Selection::Member(id.to_string())
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
    /// Route a rope: click its first end, the sheave nodes, its last end.
    Rope,
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
            Tool::Rope => "Rope over sheaves",
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
            Tool::FloorNode => {
                "Click to place a node resting on a floor slab: on the selected foot's slab, or a new slab when no \
                 foot is selected."
            }
            Tool::Rope => {
                "Click the rope's first end, then each node it runs over (each gets a sheave), then its last end; \
                 Enter, a double click or the last node clicked again finishes, Esc cancels."
            }
        }
    }
}
