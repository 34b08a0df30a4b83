//! How serious each kind of warning is, as a table: faults (over, a case
//! not solved), unplanned slack and unchecked items come first and are
//! marked as such; near-limit items next; advisories last, in quieter type.
//! The warnings list sorts and colours its groups by it.

use egui::Color32;
use tautspan_core::analysis::{WarningGroup, WarningKind};

/// A warning's severity, most serious first (the derived order sorts by it).
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord)]
pub enum Severity {
    /// Over an allowable or rating, or a case not solved.
    Over,
    /// Slack or lifting off where it was meant to carry.
    Slack,
    /// A check the inputs cannot support.
    Unchecked,
    /// At or above the near-limit threshold, within the allowable.
    Near,
    /// Advice: the geometry, the model's range, inputs worth a look.
    Advisory,
}

/// Red of an overload (the fields' error colour).
pub const OVER_RED: Color32 = crate::fields::qty_field::ERROR;
/// Amber of an item near its limit or unchecked.
pub const NEAR_AMBER: Color32 = Color32::from_rgb(0xc8, 0x8a, 0x12);
/// Violet of an unchecked item: neither within nor over.
pub const UNCHECKED_VIOLET: Color32 = Color32::from_rgb(0x9a, 0x5c, 0xc6);

impl Severity {
    /// The severity of a kind of warning.
    pub fn of(kind: WarningKind) -> Severity {
        use WarningKind as K;
        match kind {
            K::MemberOver | K::FootOver | K::FloorOver | K::PartOver | K::CaseFailed => Severity::Over,
            K::MemberSlack | K::SlackOverArc | K::FootLifts | K::FloorLifts => Severity::Slack,
            // a solved shape far from the drawing: the numbers are not those of the rig drawn
            K::MemberUnchecked | K::FloorUnchecked | K::PartUnchecked | K::FarFromDrawing => Severity::Unchecked,
            K::MemberNear | K::FloorNear | K::PartNear => Severity::Near,
            K::LevelLeg
            | K::LowSlingAngle
            | K::SteelStrain
            | K::SagRatio
            | K::DynamicRatio
            | K::HoistSidePull
            | K::MultiLeg
            | K::SoftLine
            | K::WaveTransit
            | K::DesignFactorLow
            | K::OwnWeightUnknown => Severity::Advisory,
        }
    }

    /// The mark shown before a warning of this severity.
    pub fn mark(self) -> &'static str {
        match self {
            Severity::Over => "OVER",
            Severity::Slack => "SLACK",
            Severity::Unchecked => "UNCHECKED",
            Severity::Near => "near",
            Severity::Advisory => "note",
        }
    }

    /// The colour of the mark and text; `None`: the theme's weak text.
    pub fn colour(self) -> Option<Color32> {
        match self {
            Severity::Over | Severity::Slack => Some(OVER_RED),
            Severity::Unchecked => Some(UNCHECKED_VIOLET),
            Severity::Near => Some(NEAR_AMBER),
            Severity::Advisory => None,
        }
    }

    /// Words for the summary line after the count `n` ("2 over", "1 note").
    pub fn summary_words(self, n: usize) -> &'static str {
        match self {
            Severity::Over => "over",
            Severity::Slack => "slack",
            Severity::Unchecked => "unchecked",
            Severity::Near => "near",
            Severity::Advisory if n == 1 => "note",
            Severity::Advisory => "notes",
        }
    }
}

/// The groups most serious first; within one severity the order they came
/// in (the scenario's, then each case's in file order).
pub fn by_severity<T>(groups: &[(T, WarningGroup)]) -> Vec<(Severity, &(T, WarningGroup))> {
    let mut v: Vec<(Severity, &(T, WarningGroup))> = groups.iter().map(|g| (Severity::of(g.1.kind), g)).collect();
    v.sort_by_key(|(s, _)| *s);
    v
}

/// How many warnings of each severity, in severity order, zeros left out
/// (a group counts its warnings).
pub fn counts<T>(groups: &[(T, WarningGroup)]) -> Vec<(Severity, usize)> {
    let all = [Severity::Over, Severity::Slack, Severity::Unchecked, Severity::Near, Severity::Advisory];
    all.into_iter()
        .map(|s| (s, groups.iter().filter(|g| Severity::of(g.1.kind) == s).map(|g| g.1.count).sum()))
        .filter(|(_, n)| *n > 0)
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn group(kind: WarningKind, count: usize) -> (Option<String>, WarningGroup) {
        (None, WarningGroup { kind, count, subjects: Vec::new(), message: kind.key().to_string() })
    }

    #[test]
    fn faults_come_first_and_advisories_last_in_their_own_order() {
        let groups = vec![
            group(WarningKind::DynamicRatio, 3),
            group(WarningKind::MemberNear, 1),
            group(WarningKind::MemberOver, 1),
            group(WarningKind::FloorUnchecked, 2),
            group(WarningKind::DesignFactorLow, 1),
            group(WarningKind::MemberSlack, 1),
        ];
        let keys: Vec<&str> = by_severity(&groups).iter().map(|(_, g)| g.1.kind.key()).collect();
        assert_eq!(
            keys,
            ["member_over", "member_slack", "floor_unchecked", "member_near", "dynamic_ratio", "design_factor_low"]
        );
        assert_eq!(
            counts(&groups),
            [
                (Severity::Over, 1),
                (Severity::Slack, 1),
                (Severity::Unchecked, 2),
                (Severity::Near, 1),
                (Severity::Advisory, 4)
            ]
        );
    }

    #[test]
    fn advisories_are_not_the_colour_of_an_overload() {
        assert_eq!(Severity::of(WarningKind::PartOver).colour(), Some(OVER_RED));
        assert_ne!(Severity::Advisory.colour(), Some(OVER_RED));
        assert_ne!(Severity::Near.colour(), Some(OVER_RED));
    }
}
