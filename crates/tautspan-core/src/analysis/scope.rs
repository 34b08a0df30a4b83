//! What an analysis checks and, by name, what it does not: carried by every
//! output so that exit 0 reads as "within what this tool checks", never as
//! "safe". The entries are data, one per item with the condition under which
//! it applies to a scenario.

use crate::model::{Case, Scenario};
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

fn has_floor(s: &Scenario) -> bool {
    !s.floors.is_empty()
}

const CHECKED: &[Entry] = &[
    Entry {
        text: "axial force of every member against its allowable (rated strength x efficiency / design factor, or its working load limit), in every case",
        applies: always,
    },
    Entry { text: "members meant to carry that go slack", applies: always },
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
];

const NOT_CHECKED: &[Entry] = &[
    Entry {
        text: "fittings and hardware not entered in the scenario (shackles, hooks, links, eye bolts, clamps, hoists)",
        applies: always,
    },
    Entry { text: "the structure behind each anchor beyond the reaction shown", applies: always },
    Entry { text: "bending, shear and torsion of members (axial force only)", applies: always },
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
