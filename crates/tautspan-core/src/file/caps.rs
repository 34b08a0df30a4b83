//! How many items a scenario may hold. The caps are generous for real rigs
//! (the 101 × 101 square net of the benchmarks has 10,201 nodes, 20,200
//! members and 9,801 masses) and keep a hostile or mistaken file from
//! asking for unbounded work; each is named, with the count, in the error.

use super::dto::ScenarioDto;

/// Most nodes a scenario may have.
pub const MAX_NODES: usize = 200_000;
/// Most members a scenario may have, ropes over sheaves counted with them.
pub const MAX_MEMBERS: usize = 200_000;
/// Most masses a scenario may have.
pub const MAX_MASSES: usize = 200_000;
/// Most load cases a scenario may have (each is solved, several times for
/// a swing or a drop).
pub const MAX_CASES: usize = 1_000;
/// Most floor slabs a scenario may have.
pub const MAX_FLOORS: usize = 10_000;

/// Each cap the file exceeds: the list's field path and the message.
pub fn over_caps(dto: &ScenarioDto) -> Vec<(&'static str, String)> {
    let grouped = |n: usize| crate::units::grouped(n as u64);
    let mut out = Vec::new();
    let mut check = |field: &'static str, what: &str, n: usize, cap: usize| {
        if n > cap {
            out.push((field, format!("{} {what}; the cap is {} {what} a scenario", grouped(n), grouped(cap))));
        }
    };
    check("nodes", "nodes", dto.nodes.len(), MAX_NODES);
    let members = dto.members.len() + dto.ropes.len();
    if members > MAX_MEMBERS {
        let field = if dto.members.len() > MAX_MEMBERS || dto.ropes.is_empty() { "members" } else { "ropes" };
        check(field, "members (ropes counted with them)", members, MAX_MEMBERS);
    }
    check("masses", "masses", dto.masses.len(), MAX_MASSES);
    check("cases", "cases", dto.cases.len(), MAX_CASES);
    check("floors", "floors", dto.floors.len(), MAX_FLOORS);
    out
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::file::{CaseDto, NodeDto};

    #[test]
    fn each_cap_is_named_with_the_count() {
        let mut dto = ScenarioDto {
            nodes: vec![NodeDto::default(); MAX_NODES],
            cases: vec![CaseDto::Static { id: String::new() }; MAX_CASES],
            ..ScenarioDto::default()
        };
        assert!(over_caps(&dto).is_empty(), "at the caps is allowed");
        dto.nodes.push(NodeDto::default());
        dto.cases.push(CaseDto::Static { id: String::new() });
        let over = over_caps(&dto);
        assert_eq!(over.len(), 2);
        assert_eq!(over[0], ("nodes", "200,001 nodes; the cap is 200,000 nodes a scenario".to_string()));
        assert_eq!(over[1], ("cases", "1,001 cases; the cap is 1,000 cases a scenario".to_string()));
    }
}
