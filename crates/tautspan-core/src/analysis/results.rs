//! What an analysis answers, per case: member forces against allowables,
//! floor normal forces, node positions, support reactions, the load path,
//! limits and warnings. Plain `f64` in SI units, names carry the unit.

use super::scope::Scope;
use super::warning_group::{WarningGroup, group_warnings};
use super::warning_kind::WarningKind;
use serde::Serialize;

/// A member's or floor's state in a case.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum State {
    /// Within allowable, below the near-limit threshold.
    Ok,
    /// At or above the near-limit threshold, within allowable.
    Near,
    /// Over the allowable.
    Over,
    /// Carrying nothing: a slack rope, or a floor contact that has lifted off.
    Slack,
    /// A check the inputs cannot support (a strut without a section, a floor
    /// foot without a point rating): never counted as within.
    Unchecked,
}

impl State {
    /// The contract's word.
    pub fn as_str(self) -> &'static str {
        match self {
            State::Ok => "ok",
            State::Near => "near",
            State::Over => "over",
            State::Slack => "slack",
            State::Unchecked => "unchecked",
        }
    }
}

/// One member in one case.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct MemberResult {
    /// Member id.
    pub id: String,
    /// Axial force, N (tension positive).
    pub force_n: f64,
    /// Allowable force, N.
    pub allowable_n: f64,
    /// |force| ÷ allowable.
    pub utilisation: f64,
    /// State.
    pub state: State,
    /// Stretch from the unstretched length, m (negative: shortened rod or slack rope).
    pub stretch_m: f64,
    /// Length in the solved geometry, m.
    pub length_m: f64,
    /// Angle from horizontal in the solved geometry, degrees.
    pub sling_angle_deg: f64,
    /// Own-weight sag at mid-length across the chord, m (parabolic, Irvine).
    pub sag_m: f64,
    /// Longitudinal stress-wave transit time `L / c`, s, with `c = √(EA/μ)`
    /// (`√(E/ρ)` for a solid member; CRC thin-rod speed), where the own
    /// weight is known.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub wave_transit_s: Option<f64>,
    /// Why the member is `unchecked`, when it is.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub reason: Option<String>,
    /// The hitch's mode factor on the allowable, where the member has a hitch.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub mode_factor: Option<f64>,
    /// The D/d efficiency of a wire rope bent over a pin, where given.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub bend_efficiency: Option<f64>,
    /// A rod's Euler load `π² E I / (K L)²`, N; `None` where not a strut
    /// or its buckling cannot be found.
    pub euler_n: Option<f64>,
    /// A rod's buckling resistance `χ A f_y` (γ_M1 = 1, before the design
    /// factor), N; `None` where not a strut or not found.
    pub buckling_resistance_n: Option<f64>,
    /// Swing cases: the angle of the arc where this member peaks, degrees.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub peak_at_deg: Option<f64>,
    /// Rated parts in series with the member, each on the member's force.
    pub fittings: Vec<FittingResult>,
    /// A rope over sheaves: each span between its end, sheaves and end, with
    /// its own tension (equal over frictionless sheaves); empty for a member.
    #[serde(skip_serializing_if = "Vec::is_empty")]
    pub segments: Vec<SegmentResult>,
}

/// One span of a rope over sheaves in one case.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SegmentResult {
    /// Node id the span starts at.
    pub from: String,
    /// Node id it ends at.
    pub to: String,
    /// Tension in the span, N.
    pub force_n: f64,
    /// Length between the node centres in the solved geometry, m.
    pub length_m: f64,
}

/// One rated part (a fitting on a member or at a node, or an anchor's
/// rating) in one case.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct FittingResult {
    /// `shackle`, `hook`, `master_link`, `eye_bolt`, `hoist`, `fitting`, `anchor`.
    pub kind: String,
    /// Name shown (given, or the kind in words).
    pub name: String,
    /// Working load limit used, N (an eye bolt's derated by angle).
    pub wll_n: f64,
    /// The rated (in-line) working load limit as entered, N.
    pub rated_wll_n: f64,
    /// Force carried, N: the member's axial force (tension positive), the
    /// resultant at a node, or the reaction's magnitude.
    pub force_n: f64,
    /// |force| ÷ wll (infinite where the part is not rated at all in this geometry).
    pub utilisation: f64,
    /// State.
    pub state: State,
    /// Angle that governs the part, degrees: an eye bolt's pull from its axis,
    /// a hoist's off plumb; none for the others.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub angle_deg: Option<f64>,
    /// How the WLL was found (rating as entered, derating and its source).
    pub source: String,
    /// Why the state is what it is, where it is not plain force ÷ WLL.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub reason: Option<String>,
}

/// One foot (a node resting on a floor) in one case.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct FootResult {
    /// Node id.
    pub node: String,
    /// Normal force the slab carries at this foot, N (0 when lifted off).
    pub normal_force_n: f64,
    /// Horizontal reaction the foot needs (|(R_x, R_z)|), N.
    pub horizontal_n: f64,
    /// Friction coefficient the foot needs, |horizontal| ÷ normal force
    /// (None when the foot carries no normal force).
    pub friction_required: Option<f64>,
    /// Normal force ÷ pad area, Pa (None without a pad).
    pub bearing_pressure_pa: Option<f64>,
    /// Normal force ÷ the rated concentrated load (None without one).
    pub utilisation: Option<f64>,
    /// State: over also when it needs more friction than the floor's limit.
    pub state: State,
    /// Why the foot is `unchecked` or over on friction, when it is.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub reason: Option<String>,
}

/// One floor in one case.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct FloorResult {
    /// Floor id.
    pub id: String,
    /// Normal force of all its feet together, N.
    pub normal_force_n: f64,
    /// Largest deflection over the whole panel, m.
    pub deflection_m: f64,
    /// Where the largest deflection is, (x, z) in plan, m.
    pub deflection_at_m: [f64; 2],
    /// Allowable force: the rated concentrated load per foot where given,
    /// else the rated uniform load × panel area (a total), N.
    pub allowable_n: f64,
    /// Rated uniform load × panel area, N (the total check), where given.
    pub total_allowable_n: Option<f64>,
    /// Friction coefficient the feet may rely on.
    pub friction_limit: f64,
    /// Per foot.
    pub feet: Vec<FootResult>,
    /// Deflection limit, m.
    pub deflection_limit_m: f64,
    /// Largest of each foot's force ÷ rated concentrated load, the total ÷
    /// rated uniform load × area, and deflection ÷ limit.
    pub utilisation: f64,
    /// State.
    pub state: State,
    /// Why the floor is `unchecked`, when it is.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub reason: Option<String>,
    /// Swing cases: the angle of the arc where this floor peaks, degrees.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub peak_at_deg: Option<f64>,
}

/// A node's solved position.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct NodeResult {
    /// Node id.
    pub id: String,
    /// Solved position, m.
    pub position_m: [f64; 3],
    /// Fittings at the node, each on the resultant of the members above it
    /// (on the reaction at a support).
    pub fittings: Vec<FittingResult>,
}

/// A support's reaction: the force the support exerts on the rig.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SupportResult {
    /// Node id.
    pub node: String,
    /// Reaction, N.
    pub reaction_n: [f64; 3],
    /// Swing cases: the angle of the arc where the reaction is largest, degrees.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub peak_at_deg: Option<f64>,
    /// The anchor's rating checked on the reaction's magnitude, where given.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub rated: Option<FittingResult>,
}

/// The members and supports that carry one mass (or all masses together),
/// each with its share: the fraction of the weight it carries (vertical
/// component), traced through the solved forces (`solve::LoadFlow`).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct LoadPathResult {
    /// Mass id (for the combined path: `all masses`).
    pub mass: String,
    /// Member ids carrying at least the threshold share of the weight (the
    /// largest shares, at most `analysis::MAX_LISTED` a mass; the combined
    /// path lists every member carrying any of the weight).
    pub members: Vec<String>,
    /// Their shares, same order as `members` (fractions of the weight).
    pub shares: Vec<f64>,
    /// How many members carry some of the weight, below the threshold.
    pub below_threshold: usize,
    /// How many members at or above the threshold are not listed (only the
    /// largest shares are: `analysis::MAX_LISTED` a mass).
    pub not_listed: usize,
    /// Support node ids taking at least the threshold share.
    pub supports: Vec<String>,
    /// Their shares, same order as `supports`.
    pub support_shares: Vec<f64>,
    /// How many supports take some of the weight, below the threshold.
    pub supports_below_threshold: usize,
    /// Fraction of the weight not followed to a support (flows far below
    /// the threshold, or weight going round a loop of members past the
    /// trace's budget): a bound on how much any share may read low.
    pub untraced: f64,
}

impl LoadPathResult {
    /// Why weight may go untraced, in words for every output.
    pub const UNTRACED_REASON: &'static str = "flows too small to follow, or carried round a loop of members";

    /// Whether the untraced part is large enough to say (at least the
    /// listing threshold, 1 % of the weight).
    pub fn untraced_worth_saying(&self) -> bool {
        self.untraced >= super::LOAD_PATH_THRESHOLD
    }

    /// For the outputs' tests: mass `w` on member `m` to anchor `A`, with
    /// `untraced` of its weight not followed.
    #[cfg(test)]
    pub(crate) fn one_member(untraced: f64) -> Self {
        LoadPathResult {
            mass: "w".into(),
            members: vec!["m".into()],
            shares: vec![1.0],
            below_threshold: 0,
            not_listed: 0,
            supports: vec!["A".into()],
            support_shares: vec![1.0 - untraced],
            supports_below_threshold: 0,
            untraced,
        }
    }
}

/// Largest release angle and drop height inside the allowable.
#[derive(Debug, Clone, PartialEq, Default, Serialize)]
pub struct Limits {
    /// Largest release angle from the vertical, degrees (capped at 90: beyond it a rope goes slack).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub release_deg: Option<f64>,
    /// Largest free-fall height, m.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub drop_height_m: Option<f64>,
}

/// A specific warning: who, what limit, by how much.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Warning {
    /// What kind of warning: warnings of one kind in one case are grouped.
    pub kind: WarningKind,
    /// Member, floor, node or case it concerns, if any.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub subject: Option<String>,
    /// The message.
    pub message: String,
}

/// How the dynamic load on the case's mass was found.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct DynamicLoad {
    /// Mass id.
    pub mass: String,
    /// Load on the mass ÷ its weight.
    pub factor: f64,
    /// Load on the mass, N.
    pub load_n: f64,
    /// Formula used, in words, with its source.
    pub formula: String,
    /// Effective stiffness of the path at the mass, N/m (drop and sudden).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub path_stiffness_n_per_m: Option<f64>,
}

/// How a swing's arc was swept.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ArcSummary {
    /// Release angle, degrees.
    pub release_deg: f64,
    /// Azimuth of the swing plane, degrees.
    pub azimuth_deg: f64,
    /// The angles solved, degrees, increasing.
    pub angles_deg: Vec<f64>,
    /// The angle of the case's highest utilisation, degrees; the nodes shown
    /// are the rig's shape there.
    pub governing_deg: f64,
}

/// One case's answer.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CaseResult {
    /// Case id.
    pub id: String,
    /// `static`, `swing`, `drop` or `sudden`.
    pub kind: String,
    /// Whether the solver converged.
    pub converged: bool,
    /// Newton iterations used.
    pub iterations: usize,
    /// Out-of-balance force reached, N.
    pub residual_n: f64,
    /// Why the case could not be solved, if it could not.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub error: Option<String>,
    /// The dynamic load, for dynamic cases.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub dynamic: Option<DynamicLoad>,
    /// Swing cases: how the arc was swept.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub arc: Option<ArcSummary>,
    /// Members.
    pub members: Vec<MemberResult>,
    /// Floors.
    pub floors: Vec<FloorResult>,
    /// Nodes.
    pub nodes: Vec<NodeResult>,
    /// Supports.
    pub supports: Vec<SupportResult>,
    /// Load paths, one per mass (members and supports above the threshold share).
    pub load_path: Vec<LoadPathResult>,
    /// The path of all masses together, each at its load in this case.
    pub combined_load_path: Option<LoadPathResult>,
    /// Limits for the case's mass.
    pub limits: Limits,
    /// Warnings, one per kind (grouped: `warning_groups`).
    pub warnings: Vec<String>,
    /// Every warning with its kind and subject, ungrouped.
    #[serde(skip)]
    pub warning_items: Vec<Warning>,
}

impl CaseResult {
    /// The case's warnings, one group per kind (their texts are `warnings`).
    pub fn warning_groups(&self) -> Vec<WarningGroup> {
        group_warnings(&self.warning_items, Some(&self.id))
    }

    /// Every rated part of the case with the id of what it belongs to
    /// (`leg-1/shackle`): member fittings in member order, then node
    /// fittings, then anchor ratings. The comparison table and
    /// [`Analysis::verdict`] read them in this order.
    pub fn parts(&self) -> impl Iterator<Item = &FittingResult> {
        self.members
            .iter()
            .flat_map(|m| m.fittings.iter())
            .chain(self.nodes.iter().flat_map(|n| n.fittings.iter()))
            .chain(self.supports.iter().filter_map(|s| s.rated.as_ref()))
    }

    /// As [`parts`](Self::parts), each with its comparison id (`leg-1/shackle`, `A1/anchor`).
    pub fn part_ids(&self) -> Vec<String> {
        self.members
            .iter()
            .flat_map(|m| m.fittings.iter().map(move |f| format!("{}/{}", m.id, f.name)))
            .chain(self.nodes.iter().flat_map(|n| n.fittings.iter().map(move |f| format!("{}/{}", n.id, f.name))))
            .chain(self.supports.iter().filter_map(|s| s.rated.as_ref().map(|f| format!("{}/{}", s.node, f.name))))
            .collect()
    }
}

/// Per member, across cases: the inspector's comparison row.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ComparisonRow {
    /// Member or floor id.
    pub id: String,
    /// Force in the first static case, N.
    pub static_force_n: Option<f64>,
    /// Force per case (same order as the cases), N.
    pub force_n: Vec<Option<f64>>,
    /// Ratio of each case's force to the static force.
    pub ratio_to_static: Vec<Option<f64>>,
    /// Allowable, N.
    pub allowable_n: f64,
    /// Utilisation per case.
    pub utilisation: Vec<Option<f64>>,
    /// The case with the highest utilisation.
    pub governing_case: Option<String>,
    /// This member's own limits.
    pub limits: Limits,
}

/// Everything the analysis of one scenario answers.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Analysis {
    /// Scenario title.
    pub title: String,
    /// The caution.
    pub caution: String,
    /// Cases, in file order.
    pub cases: Vec<CaseResult>,
    /// The comparison table, members then floors.
    pub comparison: Vec<ComparisonRow>,
    /// Warnings about the scenario as a whole (design factors, inputs).
    pub warnings: Vec<Warning>,
    /// The assumptions, formulas and sources used.
    pub assumptions: Vec<String>,
    /// What this analysis checks and, by name, what it does not.
    pub scope: Scope,
}

/// The verdict of a whole scenario.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Verdict {
    /// Every item within its allowable in every case, as far as this tool checks.
    Within,
    /// Something over its allowable, slack where it must carry, a case not
    /// solved, or a solved shape far from the drawing.
    NotWithin,
    /// Nothing over, but something the inputs cannot check.
    Unchecked,
}

impl Verdict {
    /// The contract's word.
    pub fn as_str(self) -> &'static str {
        match self {
            Verdict::Within => "within",
            Verdict::NotWithin => "not_within",
            Verdict::Unchecked => "unchecked",
        }
    }

    /// In words for people.
    pub fn words(self) -> &'static str {
        match self {
            Verdict::Within => "within what this tool checks",
            Verdict::NotWithin => "NOT within the allowables",
            Verdict::Unchecked => "UNCHECKED: parts of the load path cannot be checked from the inputs",
        }
    }
}

impl Analysis {
    /// The scenario-wide warnings, one group per kind.
    pub fn warning_groups(&self) -> Vec<WarningGroup> {
        group_warnings(&self.warnings, None)
    }

    /// True when every member and floor is within allowable in every case
    /// and nothing meant to carry went slack; false otherwise (exit code 1).
    pub fn all_within(&self) -> bool {
        self.verdict() == Verdict::Within
    }

    /// The scenario's verdict: not within when anything is over, slack
    /// where it must carry, not solved or far from its drawing; else unchecked when any item could
    /// not be checked; else within.
    pub fn verdict(&self) -> Verdict {
        if !self.cases.iter().all(|c| c.converged && c.error.is_none()) || self.any_fault() {
            Verdict::NotWithin
        } else if self.any_unchecked() {
            Verdict::Unchecked
        } else {
            Verdict::Within
        }
    }

    fn any_unchecked(&self) -> bool {
        self.cases.iter().any(|c| {
            c.members.iter().any(|m| m.state == State::Unchecked)
                || c.floors.iter().any(|f| f.state == State::Unchecked)
                || c.parts().any(|p| p.state == State::Unchecked)
        })
    }

    fn any_fault(&self) -> bool {
        self.cases.iter().any(|c| {
            c.members.iter().any(|m| m.state == State::Over)
                || c.floors.iter().any(|f| f.state == State::Over)
                || c.parts().any(|p| p.state == State::Over)
        }) || self.cases.iter().any(|c| {
            c.warning_items
                .iter()
                .any(|w| w.message.contains("meant to carry") || w.kind == WarningKind::FarFromDrawing)
        })
    }
}
