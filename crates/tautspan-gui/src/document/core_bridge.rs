//! The one place the app calls the core's analysis: validation, the
//! analysis of every case, the release curve, the time-domain run of a
//! case and the report. Every number the app shows comes through here from
//! `tautspan_core`; the app adds no physics.

use std::time::Instant;
use tautspan_core::analysis::{
    Analysis, CaseSimulation, Prior, SimulateRequest, WarningGroup, Worst, analyse_from, member_allowable,
    release_curve, simulate_case, worst,
};
use tautspan_core::file::ScenarioDto;
use tautspan_core::model::{Problem, Scenario, build};
use tautspan_core::report::{SourceFile, UnitSystem as ReportUnits, html_for_file};

/// A validated scenario and its analysis, or why there is none.
#[derive(Debug, Clone)]
pub struct Solved {
    /// The validated model.
    pub scenario: Scenario,
    /// Every case's answer.
    pub analysis: Analysis,
    /// Wall time of validation and analysis, ms.
    pub solve_ms: f64,
    /// The warnings grouped by kind: the scenario's (case `None`), then
    /// each case's; grouped once here, off the UI thread.
    pub warning_groups: Vec<(Option<String>, WarningGroup)>,
    /// The worst item over every case (the verdict bar's), found once here.
    pub worst: Option<Worst>,
    /// Each case's line in the cases panel (its largest utilisation and
    /// worst state), in the order of the cases, found once here.
    pub case_summaries: Vec<(String, Option<tautspan_core::analysis::State>)>,
}

/// Validate and analyse a document. With a `prior` answer (the previous
/// revision's), the core starts the static solve from its displacements:
/// the same answer, found in fewer steps; the core falls back by itself when
/// the nodes differ.
pub fn solve(dto: &ScenarioDto, prior: Option<&Solved>) -> Result<Solved, Vec<Problem>> {
    let start = Instant::now();
    let scenario = build(dto)?;
    Ok(analyse_model(scenario, prior, start))
}

/// Validate a document (the first step of [`solve`]).
pub fn validate(dto: &ScenarioDto) -> Result<Scenario, Vec<Problem>> {
    build(dto)
}

/// Analyse a validated scenario, warm-started from `prior` (the second step
/// of [`solve`]); the time reported runs from `start`.
pub fn analyse_model(scenario: Scenario, prior: Option<&Solved>, start: Instant) -> Solved {
    // the core starts from the prior only where it has the same nodes and
    // the same members joining them
    let prior = prior.map(|p| Prior { scenario: &p.scenario, analysis: &p.analysis });
    let analysis = analyse_from(&scenario, prior);
    let warning_groups = analysis
        .warning_groups()
        .into_iter()
        .map(|g| (None, g))
        .chain(analysis.cases.iter().flat_map(|c| c.warning_groups().into_iter().map(|g| (Some(c.id.clone()), g))))
        .collect();
    let worst = worst(&analysis);
    let case_summaries = analysis.cases.iter().map(super::case_summary::case_summary).collect();
    Solved { scenario, analysis, solve_ms: start.elapsed().as_secs_f64() * 1e3, warning_groups, worst, case_summaries }
}

/// How a member's allowable was found, in words (formula, inputs, sources).
pub fn allowable_explanation(scenario: &Scenario, member: usize) -> String {
    scenario.members.get(member).map(|m| member_allowable(m).explanation).unwrap_or_default()
}

/// How a rod is checked in compression, in words (section, Euler load,
/// slenderness, curve, χ and sources; or why it cannot be); `None` for
/// tension-only members.
pub fn compression_explanation(scenario: &Scenario, member: usize) -> Option<String> {
    let m = scenario.members.get(member)?;
    m.strut.as_ref()?;
    Some(tautspan_core::analysis::compression_explanation(m, &tautspan_core::analysis::compression(scenario, member)))
}

/// One point of the peak-force curve.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CurvePoint {
    /// Release angle from the vertical, degrees.
    pub release_deg: f64,
    /// Member force at its peak over the swing's arc, N.
    pub force_n: f64,
}

/// Force in `member_id` at its peak over the swing's arc against release
/// angle, for the mass of swing case `case_id`: the core's release curve.
pub fn swing_curve(
    scenario: &Scenario,
    case_id: &str,
    member_id: &str,
    angles_deg: &[f64],
) -> Result<Vec<CurvePoint>, String> {
    let case = scenario.cases.iter().find(|c| c.id() == case_id).ok_or_else(|| format!("no case {case_id}"))?;
    let mass = case.mass().ok_or_else(|| format!("case {case_id} has no mass"))?;
    let azimuth_rad = match case {
        tautspan_core::model::Case::Swing { azimuth, .. } => azimuth.value,
        _ => 0.0,
    };
    let member =
        scenario.members.iter().position(|m| m.id == member_id).ok_or_else(|| format!("no member {member_id}"))?;
    let curve = release_curve(scenario, mass, azimuth_rad, angles_deg)?;
    Ok(curve
        .release_deg
        .iter()
        .zip(&curve.member_force_n)
        .filter_map(|(deg, forces)| Some(CurvePoint { release_deg: *deg, force_n: *forces.get(member)? }))
        .collect())
}

/// A time-domain run of one case: the core's simulation of that case
/// (a swing released at its angle, a drop from its height, a sudden load).
pub fn simulate(
    scenario: &Scenario,
    case_id: &str,
    duration_s: f64,
    progress: &mut dyn FnMut(f64) -> bool,
) -> Result<CaseSimulation, String> {
    let req = SimulateRequest { duration_s, ..SimulateRequest::default() };
    simulate_case(scenario, case_id, &req, progress)
}

/// Today's date as `YYYY-MM-DD` (UTC), for the report's title block.
fn today() -> String {
    let secs = std::time::SystemTime::now().duration_since(std::time::UNIX_EPOCH).map_or(0, |d| d.as_secs());
    tautspan_core::report::civil_date(secs)
}

/// The HTML report of a scenario: the same function the command line uses,
/// naming the scenario file and its SHA-256 when `source` is given.
pub fn report_html(
    scenario: &Scenario,
    analysis: &Analysis,
    us_customary: bool,
    source: Option<&SourceFile>,
) -> Result<String, String> {
    let units = if us_customary { ReportUnits::UsCustomary } else { ReportUnits::Si };
    Ok(html_for_file(scenario, analysis, &today(), units, source))
}
