//! What an analysis checks and, by name, what it does not: carried by every
//! output so that exit 0 reads as "within what this tool checks", never as
//! "safe". The entries are data, one per item with the condition under which
//! it applies to a scenario.

use crate::library::Rules;
use crate::model::{Case, Scenario, Support};
use serde::Serialize;

/// What is checked and what is not.
#[derive(Debug, Clone, PartialEq, Default, Serialize)]
pub struct Scope {
    /// Checked, each in one line.
    pub checked: Vec<String>,
    /// Not checked, each named.
    pub not_checked: Vec<String>,
}

/// One entry of the scope table: its words and when it applies.
struct Entry {
    text: &'static str,
    applies: fn(&Scenario) -> bool,
}

fn always(_: &Scenario) -> bool {
    true
}

fn has_swing(s: &Scenario) -> bool {
    s.cases.iter().any(|c| matches!(c, Case::Swing { .. }))
}

fn has_drop(s: &Scenario) -> bool {
    s.cases.iter().any(|c| matches!(c, Case::Drop { .. } | Case::Sudden { .. }))
}

fn has_rod(s: &Scenario) -> bool {
    s.members.iter().any(|m| m.strut.is_some())
}

fn has_floor(s: &Scenario) -> bool {
    !s.floors.is_empty()
}

fn has_parts(s: &Scenario) -> bool {
    s.members.iter().any(|m| !m.fittings.is_empty())
        || s.nodes.iter().any(|n| !n.fittings.is_empty() || n.rated.is_some())
}

fn has_hitch_en(s: &Scenario) -> bool {
    s.rules == Rules::En && s.members.iter().any(|m| m.hitch.is_some())
}

fn has_hitch_asme(s: &Scenario) -> bool {
    s.rules == Rules::Asme && s.members.iter().any(|m| m.hitch.is_some())
}

fn has_bend(s: &Scenario) -> bool {
    // a rope's D/d over its sheaves is said in the ropes' own line
    s.members.iter().any(|m| m.bend.is_some() && m.run.is_none())
}

fn has_rope(s: &Scenario) -> bool {
    s.members.iter().any(|m| m.run.is_some())
}

fn has_fibre_rope_over_sheaves(s: &Scenario) -> bool {
    s.members.iter().any(|m| m.run.is_some() && m.kind == crate::library::MemberKind::FibreRope)
}

fn has_directional_anchor(s: &Scenario) -> bool {
    s.nodes.iter().any(|n| n.rated_direction.is_some())
}

fn has_unrated_anchor(s: &Scenario) -> bool {
    s.nodes.iter().any(|n| n.support == Support::Anchor && n.rated.is_none())
}

const CHECKED: &[Entry] = &[
    Entry {
        text: "axial force of every member against its allowable (rated strength x efficiency / design factor, or its working load limit), in every case",
        applies: always,
    },
    Entry { text: "members meant to carry that go slack", applies: always },
    Entry {
        text: "rods in compression: flexural buckling (Euler load, EN 1993-1-1 6.3.1 curves for steel, EN 1999-1-1 6.3.1 for aluminium alloy, EN 1993-1-4 5.4.2 for stainless hollow sections), buckling length K L from the member's length",
        applies: has_rod,
    },
    Entry {
        text: "swing: every member over the whole arc from -release to +release (quasi-static, rigid line)",
        applies: has_swing,
    },
    Entry {
        text: "drop and sudden load: peak from the path stiffness at the mass (energy balance)",
        applies: has_drop,
    },
    Entry {
        text: "floors: feet coupled through the plate (Navier series simply supported, Ritz clamped), compression-only per foot; each foot against rated_point (unchecked without it); the feet's total against rated_uniform x area (necessary, not sufficient); the largest deflection over the panel against span / limit",
        applies: has_floor,
    },
    Entry {
        text: "floors: the friction each foot needs (|horizontal| / normal) against friction_limit (default 0.20, EN 1993-1-8 6.2.2(6))",
        applies: has_floor,
    },
    Entry {
        text: "fittings entered: WLL against the member force (at a node: the resultant of the members above it); eye bolts derated by angle; hoists against their side-pull limit where given; anchors with a rating against the reaction",
        applies: has_parts,
    },
    Entry {
        text: "sling hitches entered, rules EN: the member's allowable x the mode factor of its hitch (EN 13414-1 / EN 1492-1 / EN 818-4)",
        applies: has_hitch_en,
    },
    Entry {
        text: "sling hitches entered, rules ASME: the member's allowable x the mode factor of its hitch, chokers also x the ASME B30.9 choke-angle reduction",
        applies: has_hitch_asme,
    },
    Entry {
        text: "wire rope bent over a pin or sheave where bent_over is given: the D/d efficiency on the allowable",
        applies: has_bend,
    },
    Entry {
        text: "ropes over sheaves: one continuous rope, one spring over its whole length, checked on its largest span's tension; bearing friction per sheave (Wire Rope Users Manual: K 1.09 plain, 1.04 roller) in the rope's stated motion; wire rope: the D/d efficiency of its smallest sheave on the allowable; each sheave's load (the vector sum of its spans) in the node's resultant and the anchor's reaction",
        applies: has_rope,
    },
    Entry {
        text: "anchors rated in a direction: the reaction's component along the rated direction against the rating and, where rated_across is given, the linear interaction along/rated + across/rated_across (common practice, conservative)",
        applies: has_directional_anchor,
    },
];

const NOT_CHECKED: &[Entry] = &[
    Entry {
        text: "ropes over sheaves: the sheaves, pins and blocks themselves (enter a block's WLL as a fitting at its node), fleet angle, rope wrap and the sheave's radius (spans run between node centres), friction while the rope is held still (taken in the stated motion only), and a rope sliding over a sheave under load",
        applies: has_rope,
    },
    Entry {
        text: "fibre rope over sheaves: no D/d reduction is applied; use the maker's rating for the sheave size",
        applies: has_fibre_rope_over_sheaves,
    },
    Entry {
        text: "hitches not entered: every sling is taken as a straight pull (mode factor 1); the rules for mode factors are EN unless `rules: ASME` is given",
        applies: always,
    },
    Entry {
        text: "bending of wire rope over pins, sheaves, hooks and load edges where bent_over is not given; edge protection; 3- and 4-leg slings: the EN 818-4 / EN 13414-2 two-leg rating is shown as advice at each gathering point beside the solved leg forces, not checked (each leg is checked on its own solved force)",
        applies: always,
    },
    Entry {
        text: "fittings and hardware not entered in the scenario (shackles, hooks, links, eye bolts, clamps, hoists), and the fit, wear and side loading of those entered beyond their WLL and the angles named",
        applies: always,
    },
    Entry { text: "anchors without a rating: only their reaction is shown", applies: has_unrated_anchor },
    Entry { text: "the structure behind each anchor beyond the reaction shown", applies: always },
    Entry { text: "bending, shear and torsion of members (axial force only)", applies: always },
    Entry {
        text: "rods: buckling of a rod without a section, without a yield rating or of a material without a curve (reported unchecked; the limits take it at its yield allowable); local buckling of aluminium and stainless tube walls; torsional and lateral buckling; the effective length beyond the K given",
        applies: has_rod,
    },
    Entry { text: "wear, corrosion, damage, fatigue and inspection state of the gear", applies: always },
    Entry { text: "wind, snow, temperature and other environmental loads", applies: always },
    Entry {
        text: "the load's own integrity, lifting points and centre of gravity beyond the masses entered",
        applies: always,
    },
    Entry {
        text: "dynamic effects beyond the cases entered (stress waves, resonance, crane motion, second impacts)",
        applies: always,
    },
    Entry {
        text: "floors: punching shear, cracking, continuity over supports, bearing pressure under pads (shown, not checked), plate stiffness between panels and the structure below the panel",
        applies: has_floor,
    },
];

/// The scope of an analysis of `s`.
pub fn scope(s: &Scenario) -> Scope {
    let pick = |t: &[Entry]| t.iter().filter(|e| (e.applies)(s)).map(|e| e.text.to_string()).collect();
    Scope { checked: pick(CHECKED), not_checked: pick(NOT_CHECKED) }
}
