//! A case's line in the cases panel: its largest utilisation and its worst
//! state, found once per answer on the solve worker (a large net's cases
//! hold tens of thousands of items; a frame only reads the line).

use tautspan_core::analysis::{CaseResult, State};

/// A case's line beside its name: the largest utilisation of every member,
/// floor and rated part in it ("max 34 %"), and its worst state: over where
/// anything is over, else unchecked where anything is, else near; "not
/// solved" where the case failed.
pub fn case_summary(r: &CaseResult) -> (String, Option<State>) {
    if r.error.is_some() || !r.converged {
        return ("not solved".to_string(), Some(State::Over));
    }
    let items = r
        .members
        .iter()
        .map(|m| (m.utilisation, m.state))
        .chain(r.floors.iter().map(|f| (f.utilisation, f.state)))
        .chain(r.parts().map(|p| (p.utilisation, p.state)));
    let (mut max, mut worst) = (0.0_f64, None);
    for (u, st) in items {
        if u.is_finite() {
            max = max.max(u);
        }
        let rank = |s: Option<State>| match s {
            Some(State::Over) => 3,
            Some(State::Unchecked) => 2,
            Some(State::Near) => 1,
            _ => 0,
        };
        if rank(Some(st)) > rank(worst) {
            worst = Some(st);
        }
    }
    let text = match worst {
        Some(State::Over) => format!("OVER, max {:.0} %", max * 100.0),
        Some(State::Unchecked) => format!("UNCHECKED items, max {:.0} %", max * 100.0),
        _ => format!("max {:.0} %", max * 100.0),
    };
    (text, worst)
}
