//! What the drawing shows for each member and floor, picked from the
//! results: the highest utilisation over all cases (the shade), whether it
//! is over its allowable in some case (a thicker line) and whether it is
//! slack in the static case drawn (a dashed line).

use crate::analysis::{Analysis, CaseResult, State};

/// The marks of one member or floor.
#[derive(Debug, Clone, Copy, Default, PartialEq)]
pub struct Mark {
    /// Highest utilisation over all cases, when any case gave one.
    pub utilisation: Option<f64>,
    /// Over its allowable in at least one case.
    pub over: bool,
    /// Slack (or lifted off) in the static case drawn.
    pub slack: bool,
}

/// The marks of the member or floor `id`.
pub fn mark(analysis: &Analysis, drawn_case: Option<&CaseResult>, id: &str) -> Mark {
    let utilisation = analysis
        .comparison
        .iter()
        .find(|r| r.id == id)
        .and_then(|r| r.utilisation.iter().flatten().copied().filter(|u| u.is_finite()).reduce(f64::max));
    let over = analysis.cases.iter().any(|c| state_in(c, id) == Some(State::Over));
    let slack = drawn_case.is_some_and(|c| state_in(c, id) == Some(State::Slack));
    Mark { utilisation, over, slack }
}

/// The state of member, floor or rated part (`leg-1/shackle`) `id` in a case.
pub fn state_in(case: &CaseResult, id: &str) -> Option<State> {
    case.members
        .iter()
        .find(|m| m.id == id)
        .map(|m| m.state)
        .or_else(|| case.floors.iter().find(|f| f.id == id).map(|f| f.state))
        .or_else(|| case.part_ids().iter().zip(case.parts()).find(|(p, _)| *p == id).map(|(_, p)| p.state))
}
