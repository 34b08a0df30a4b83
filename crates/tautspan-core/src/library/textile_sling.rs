//! Textile slings: what marks a fibre member as a sling rather than a rope,
//! and the product standard that sets its design factor of 7 (EN 1492-1 flat
//! woven webbing slings, EN 1492-2 roundslings, EN 1492-4 fibre rope slings;
//! also EU 2006/42/EC Annex I 4.1.2.5, textile 7).

use serde::{Deserialize, Serialize};

/// A textile sling type, written on a `FibreRope` member (`sling: Roundsling`).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum TextileSling {
    /// Flat woven webbing sling, EN 1492-1.
    FlatWebbing,
    /// Roundsling, EN 1492-2.
    Roundsling,
    /// Fibre rope sling, EN 1492-4.
    RopeSling,
}

impl TextileSling {
    /// Design factor on the minimum breaking strength, and its standard.
    pub fn design_factor(self) -> (f64, &'static str) {
        match self {
            TextileSling::FlatWebbing => (7.0, "EN 1492-1 flat woven webbing slings; EU 2006/42/EC Annex I textile 7"),
            TextileSling::Roundsling => (7.0, "EN 1492-2 roundslings; EU 2006/42/EC Annex I textile 7"),
            TextileSling::RopeSling => (7.0, "EN 1492-4 fibre rope slings; EU 2006/42/EC Annex I textile 7"),
        }
    }

    /// Plain name.
    pub fn label(self) -> &'static str {
        match self {
            TextileSling::FlatWebbing => "flat webbing sling",
            TextileSling::Roundsling => "roundsling",
            TextileSling::RopeSling => "fibre rope sling",
        }
    }
}
