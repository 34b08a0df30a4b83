//! The one place the app calls the core's analysis. Every number the app
//! shows comes through here from `tautspan_core`; the app adds no physics.
//! Where the core does not yet offer a function the app needs, the stand-in
//! below is written over what the core does offer and says so.

use std::time::Instant;
use tautspan_core::analysis::{Analysis, member_allowable};
use tautspan_core::file::{CaseDto, Qty, ScenarioDto};
use tautspan_core::model::{Problem, Scenario, build, to_network};
use tautspan_core::solve::{SimulateOptions, Simulation, SimulationStart, simulate};

/// A validated scenario and its analysis, or why there is none.
#[derive(Debug, Clone)]
pub struct Solved {
    /// The validated model.
    pub scenario: Scenario,
    /// Every case's answer.
    pub analysis: Analysis,
    /// Wall time of validation and analysis, ms.
    pub solve_ms: f64,
}

/// Validate and analyse a document.
pub fn solve(dto: &ScenarioDto) -> Result<Solved, Vec<Problem>> {
    let start = Instant::now();
    let scenario = build(dto)?;
    let analysis = tautspan_core::analysis::analyse(&scenario);
    Ok(Solved { scenario, analysis, solve_ms: start.elapsed().as_secs_f64() * 1e3 })
}

/// How a member's allowable was found, in words (formula, inputs, sources).
pub fn allowable_explanation(scenario: &Scenario, member: usize) -> String {
    scenario.members.get(member).map(|m| member_allowable(m).explanation).unwrap_or_default()
}

/// One point of the peak-force curve: release angle (deg) and the member's
/// force at the lowest point (N), with the allowable (N).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CurvePoint {
    /// Release angle from the vertical, degrees.
    pub release_deg: f64,
    /// Member force at the lowest point of the swing, N.
    pub force_n: f64,
}

/// Peak force in `member_id` against release angle for the swing case
/// `case_id`, by re-running the core's analysis at each angle on a copy of
/// the document holding only that case.
///
/// Stand-in until the core offers a swing curve of its own; wanted:
/// `tautspan_core::analysis::swing_curve(&Scenario, case: usize, member: usize, angles_deg: &[f64]) -> Vec<f64>`.
pub fn swing_curve(dto: &ScenarioDto, case_id: &str, member_id: &str, angles_deg: &[f64]) -> Vec<CurvePoint> {
    let Some(CaseDto::Swing { id, mass, pivot, .. }) = dto.cases.iter().find(|c| c.id() == case_id).cloned() else {
        return Vec::new();
    };
    let mut out = Vec::with_capacity(angles_deg.len());
    for &deg in angles_deg {
        let mut d = dto.clone();
        d.cases = vec![CaseDto::Swing {
            id: id.clone(),
            mass: mass.clone(),
            release: Qty(format!("{deg} deg")),
            pivot: pivot.clone(),
        }];
        let Ok(s) = build(&d) else { continue };
        let a = tautspan_core::analysis::analyse(&s);
        if let Some(m) =
            a.cases.first().and_then(|c| if c.converged { c.members.iter().find(|m| m.id == member_id) } else { None })
        {
            out.push(CurvePoint { release_deg: deg, force_n: m.force_n });
        }
    }
    out
}

/// A time-domain run of one case: the core's simulation of the scenario.
///
/// Stand-in until the core offers a per-case simulation; wanted:
/// `tautspan_core::analysis::simulate_case(&Scenario, case: usize, &SimulateOptions, progress: &mut dyn FnMut(f64) -> bool) -> Result<Simulation, SolveError>`.
/// Until then this runs the core's integrator on the scenario's network
/// released at rest from the drawn geometry (the load suddenly applied),
/// whatever the case.
pub fn simulate_case(
    scenario: &Scenario,
    _case: usize,
    duration_s: f64,
    progress: &mut dyn FnMut(f64) -> bool,
) -> Result<Simulation, String> {
    let (net, _) = to_network(scenario);
    let opts =
        SimulateOptions { duration_s, output_interval_s: Some(duration_s / 400.0), ..SimulateOptions::default() };
    simulate(&net, &SimulationStart::default(), &opts, progress).map_err(|e| e.to_string())
}

/// What the time history shows until the core simulates each case.
pub const SIMULATION_NOTE: &str = "Time history: the rig released at rest from its drawn geometry (load suddenly applied), from the core's integrator.";

/// The HTML report of a scenario, the same as the command line writes.
///
/// Waiting for the core's report function; wanted:
/// `tautspan_core::report::html(&Scenario, &Analysis, units: UnitSystem) -> String`.
pub fn report_html(_scenario: &Scenario, _analysis: &Analysis, _us_customary: bool) -> Result<String, String> {
    Err("the report export is not in this build yet".to_string())
}
