//! Member kinds: what each carries and its default design factor, with the
//! standard the default comes from.

use super::{Duty, TextileSling};
use serde::{Deserialize, Serialize};

/// What a member can carry.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum Carries {
    /// Ropes, chains, cables: slack in compression.
    TensionOnly,
    /// Rods: tension and compression.
    TensionAndCompression,
    /// Floor slabs: bearing only.
    CompressionOnly,
}

/// A member kind as written in a file.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default, Serialize, Deserialize)]
pub enum MemberKind {
    /// Steel wire rope (sling, running or standing rope).
    #[default]
    WireRope,
    /// Fibre rope (polyester, nylon, HMPE, aramid).
    FibreRope,
    /// Alloy steel chain.
    Chain,
    /// Solid rod (steel, stainless, aluminium …), carries compression too.
    Rod,
    /// Cable: spiral strand or stay, tension only.
    Cable,
}

/// A default design factor and where it comes from.
#[derive(Debug, Clone, PartialEq)]
pub struct DefaultFactor {
    /// Rated strength ÷ allowable.
    pub value: f64,
    /// The standard or practice it is taken from.
    pub source: String,
}

impl MemberKind {
    /// All kinds, in the order pickers show them.
    pub const ALL: [MemberKind; 5] =
        [MemberKind::WireRope, MemberKind::FibreRope, MemberKind::Chain, MemberKind::Rod, MemberKind::Cable];

    /// Plain name for tables.
    pub fn label(self) -> &'static str {
        match self {
            MemberKind::WireRope => "wire rope",
            MemberKind::FibreRope => "fibre rope",
            MemberKind::Chain => "chain",
            MemberKind::Rod => "rod",
            MemberKind::Cable => "cable",
        }
    }

    /// What it carries.
    pub fn carries(self) -> Carries {
        match self {
            MemberKind::Rod => Carries::TensionAndCompression,
            _ => Carries::TensionOnly,
        }
    }

    /// Default design factor on rated strength.
    ///
    /// - wire rope 5: ASME B30.9 slings (also OSHA 29 CFR 1910.184).
    /// - fibre rope 5: ASME B30.9 synthetic rope slings (from memory); the
    ///   Cordage Institute CI 1401 range is 5 to 12, higher for life or shock.
    /// - chain 4: ASME B30.9 alloy chain, EN 818-2 grade 8.
    /// - cable 5: treated as wire rope (practice); standing ropes of cranes
    ///   use 3.0 (ASME B30.5, from memory), so 5 is on the safe side.
    /// - rod 2.0 on yield: ASME BTH-1 design category A, N_d = 2.00 (from memory).
    pub fn default_design_factor(self) -> DefaultFactor {
        let (value, source) = match self {
            MemberKind::WireRope => (5.0, "ASME B30.9 wire rope slings; OSHA 29 CFR 1910.184"),
            MemberKind::FibreRope => (5.0, "ASME B30.9 synthetic rope slings (from memory); CI 1401 range 5-12"),
            MemberKind::Chain => (4.0, "ASME B30.9 alloy chain; EN 818-2 grade 8"),
            MemberKind::Rod => (2.0, "ASME BTH-1 design category A, on yield (from memory)"),
            MemberKind::Cable => (5.0, "as wire rope, ASME B30.9 (practice)"),
        };
        DefaultFactor { value, source: source.to_string() }
    }

    /// Default design factor of a member of this kind used as `sling` (a
    /// textile sling takes its product standard's 7 over the rope's 5), for
    /// `duty` (over people or lifting persons multiply it, see [`Duty`]).
    pub fn default_for(self, sling: Option<TextileSling>, duty: Duty) -> DefaultFactor {
        let base = match sling {
            Some(s) => {
                let (value, source) = s.design_factor();
                DefaultFactor { value, source: source.to_string() }
            }
            None => self.default_design_factor(),
        };
        match duty.multiplier() {
            (1.0, _) => base,
            (m, why) => DefaultFactor { value: base.value * m, source: format!("{} x {m} for {why}", base.source) },
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // Each default beside its source: ASME B30.9 wire rope 5 (also OSHA
    // 29 CFR 1910.184), alloy chain 4 (EN 818-2), synthetic rope 5 (from
    // memory); EN 1492-1/-2/-4 textile slings 7; over people and lifting
    // persons twice (practice; 2006/42/EC Annex I, from memory). Exact.
    #[test]
    fn defaults_by_kind_use_and_duty() {
        let cases = [
            (MemberKind::WireRope, None, Duty::Standard, 5.0, "B30.9"),
            (MemberKind::Chain, None, Duty::Standard, 4.0, "EN 818-2"),
            (MemberKind::FibreRope, None, Duty::Standard, 5.0, "B30.9"),
            (MemberKind::FibreRope, Some(TextileSling::FlatWebbing), Duty::Standard, 7.0, "EN 1492-1"),
            (MemberKind::FibreRope, Some(TextileSling::Roundsling), Duty::Standard, 7.0, "EN 1492-2"),
            (MemberKind::FibreRope, Some(TextileSling::RopeSling), Duty::Standard, 7.0, "EN 1492-4"),
            (MemberKind::WireRope, None, Duty::OverPeople, 10.0, "over people"),
            (MemberKind::FibreRope, Some(TextileSling::Roundsling), Duty::LiftingPersons, 14.0, "2006/42/EC"),
            (MemberKind::Rod, None, Duty::Standard, 2.0, "BTH-1"),
        ];
        for (kind, sling, duty, value, source) in cases {
            let d = kind.default_for(sling, duty);
            assert!((d.value - value).abs() < 1e-12, "{kind:?} {sling:?} {duty:?}: {}", d.value);
            assert!(d.source.contains(source), "{}", d.source);
        }
    }
}
