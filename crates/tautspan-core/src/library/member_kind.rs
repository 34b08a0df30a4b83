//! Member kinds: what each carries and its default design factor, with the
//! standard the default comes from.

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
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct DefaultFactor {
    /// Rated strength ÷ allowable.
    pub value: f64,
    /// The standard or practice it is taken from.
    pub source: &'static str,
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
        match self {
            MemberKind::WireRope => {
                DefaultFactor { value: 5.0, source: "ASME B30.9 wire rope slings; OSHA 29 CFR 1910.184" }
            }
            MemberKind::FibreRope => DefaultFactor {
                value: 5.0,
                source: "ASME B30.9 synthetic rope slings (from memory); CI 1401 range 5-12",
            },
            MemberKind::Chain => DefaultFactor { value: 4.0, source: "ASME B30.9 alloy chain; EN 818-2 grade 8" },
            MemberKind::Rod => {
                DefaultFactor { value: 2.0, source: "ASME BTH-1 design category A, on yield (from memory)" }
            }
            MemberKind::Cable => DefaultFactor { value: 5.0, source: "as wire rope, ASME B30.9 (practice)" },
        }
    }
}
