//! The kinds of warning, one entry each with its key (for JSON and tests)
//! and the words a group of them is named by. Warnings of one kind in one
//! case are grouped (`warning_group.rs`).

use serde::Serialize;

/// What a warning is about.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum WarningKind {
    /// A member over its allowable.
    MemberOver,
    /// A member at or above the near-limit threshold.
    MemberNear,
    /// A tension member slack where it was meant to carry.
    MemberSlack,
    /// A member whose check the inputs cannot support.
    MemberUnchecked,
    /// A sling leg running level.
    LevelLeg,
    /// A sling leg below 30° from horizontal.
    LowSlingAngle,
    /// A steel member strained past the linear model.
    SteelStrain,
    /// Own-weight sag beyond the parabolic view.
    SagRatio,
    /// A dynamic force far above the static one.
    DynamicRatio,
    /// A floor foot over its rating or its friction.
    FootOver,
    /// A floor foot lifting off.
    FootLifts,
    /// A floor's contact lifting off.
    FloorLifts,
    /// A floor over its allowable.
    FloorOver,
    /// A floor near its allowable.
    FloorNear,
    /// A floor whose check the inputs cannot support.
    FloorUnchecked,
    /// A rated part over its WLL.
    PartOver,
    /// A rated part near its WLL.
    PartNear,
    /// A rated part whose check the inputs cannot support.
    PartUnchecked,
    /// A hoist pulled off plumb with no side-pull limit given.
    HoistSidePull,
    /// Three or four sling legs at one gathering point.
    MultiLeg,
    /// A soft line stretched much at the swing's peak.
    SoftLine,
    /// An arrest too quick for the spring picture.
    WaveTransit,
    /// A member going slack over part of a swing.
    SlackOverArc,
    /// A design factor set below the kind's default.
    DesignFactorLow,
    /// A member's own weight not known and left out.
    OwnWeightUnknown,
    /// A case that could not be solved.
    CaseFailed,
    /// A node far from its drawn position, or a member turned over: the
    /// rig does not stand as drawn.
    FarFromDrawing,
}

impl WarningKind {
    /// The JSON key.
    pub fn key(self) -> &'static str {
        match self {
            WarningKind::MemberOver => "member_over",
            WarningKind::MemberNear => "member_near",
            WarningKind::MemberSlack => "member_slack",
            WarningKind::MemberUnchecked => "member_unchecked",
            WarningKind::LevelLeg => "level_leg",
            WarningKind::LowSlingAngle => "low_sling_angle",
            WarningKind::SteelStrain => "steel_strain",
            WarningKind::SagRatio => "sag_ratio",
            WarningKind::DynamicRatio => "dynamic_ratio",
            WarningKind::FootOver => "foot_over",
            WarningKind::FootLifts => "foot_lifts",
            WarningKind::FloorLifts => "floor_lifts",
            WarningKind::FloorOver => "floor_over",
            WarningKind::FloorNear => "floor_near",
            WarningKind::FloorUnchecked => "floor_unchecked",
            WarningKind::PartOver => "part_over",
            WarningKind::PartNear => "part_near",
            WarningKind::PartUnchecked => "part_unchecked",
            WarningKind::HoistSidePull => "hoist_side_pull",
            WarningKind::MultiLeg => "multi_leg",
            WarningKind::SoftLine => "soft_line",
            WarningKind::WaveTransit => "wave_transit",
            WarningKind::SlackOverArc => "slack_over_arc",
            WarningKind::DesignFactorLow => "design_factor_low",
            WarningKind::OwnWeightUnknown => "own_weight_unknown",
            WarningKind::CaseFailed => "case_failed",
            WarningKind::FarFromDrawing => "far_from_drawing",
        }
    }

    /// What a group of this kind is, after its count: "12 members over their allowable".
    pub fn group_words(self) -> &'static str {
        match self {
            WarningKind::MemberOver => "members over their allowable",
            WarningKind::MemberNear => "members near their allowable",
            WarningKind::MemberSlack => {
                "members slack where they were meant to carry (set may_go_slack if that is intended)"
            }
            WarningKind::MemberUnchecked => "members UNCHECKED",
            WarningKind::LevelLeg => "sling legs running level (a leg this flat takes no share of the weight)",
            WarningKind::LowSlingAngle => {
                "sling legs below 30 deg from horizontal (ASME B30.9 allows it only with a qualified person's approval)"
            }
            WarningKind::SteelStrain => "steel members strained beyond the linear spring model's range",
            WarningKind::SagRatio => {
                "members whose own-weight sag/span exceeds 1/8 (the parabolic sag view does not hold)"
            }
            WarningKind::DynamicRatio => "members far above their static force",
            WarningKind::FootOver => "floor feet over their rating",
            WarningKind::FootLifts => "floor feet lifting off",
            WarningKind::FloorLifts => "floors whose contact lifts off",
            WarningKind::FloorOver => "floors over their allowable",
            WarningKind::FloorNear => "floors near their allowable",
            WarningKind::FloorUnchecked => "floors UNCHECKED",
            WarningKind::PartOver => "rated parts over their WLL",
            WarningKind::PartNear => "rated parts near their WLL",
            WarningKind::PartUnchecked => "rated parts UNCHECKED",
            WarningKind::HoistSidePull => {
                "hoists pulled off plumb with no side-pull limit entered (give the maker's `max_off_plumb`)"
            }
            WarningKind::MultiLeg => "gathering points of 3- or 4-leg slings",
            WarningKind::SoftLine => {
                "soft lines stretched over 1 % at the swing peak (run `tautspan simulate` on this case)"
            }
            WarningKind::WaveTransit => {
                "members arrested in under 10 stress-wave transits (the spring picture no longer holds)"
            }
            WarningKind::SlackOverArc => "members going slack over part of the swing, where they were meant to carry",
            WarningKind::DesignFactorLow => "members with a design factor below their kind's default",
            WarningKind::OwnWeightUnknown => "members whose own weight is not known and left out (give `linear_mass`)",
            WarningKind::CaseFailed => "cases not solved",
            WarningKind::FarFromDrawing => {
                "nodes or members far from their drawn shape (the rig does not stand as drawn: check the drawing)"
            }
        }
    }
}
