//! Wire rope terminations and their efficiency: the share of the rope's
//! minimum breaking force the terminated rope keeps (EN 13414-1 and common
//! practice tables; from memory, not re-read). A wire rope whose
//! termination is not stated takes the lowest common efficiency, 0.80.

use serde::{Deserialize, Serialize};

/// A wire rope termination as written in a file.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum Termination {
    /// Ferrule-secured (pressed) eye.
    FerruleSecured,
    /// Hand-spliced eye.
    HandSplice,
    /// Wedge socket.
    WedgeSocket,
    /// Poured (resin or metal) socket.
    PouredSocket,
    /// Wire rope grips (bulldog clips).
    WireRopeGrips,
}

/// One termination's efficiency and source.
struct Entry {
    termination: Termination,
    label: &'static str,
    efficiency: f64,
    source: &'static str,
}

/// The table: one entry per termination, each with its source.
const TABLE: [Entry; 5] = [
    Entry {
        termination: Termination::FerruleSecured,
        label: "ferrule-secured eye",
        efficiency: 0.90,
        source: "EN 13414-1 / common practice (from memory)",
    },
    Entry {
        termination: Termination::HandSplice,
        label: "hand splice",
        efficiency: 0.80,
        source: "EN 13414-1 / common practice, 0.75 for larger diameters (from memory)",
    },
    Entry {
        termination: Termination::WedgeSocket,
        label: "wedge socket",
        efficiency: 0.80,
        source: "common practice (from memory)",
    },
    Entry {
        termination: Termination::PouredSocket,
        label: "poured socket",
        efficiency: 1.00,
        source: "common practice (from memory)",
    },
    Entry {
        termination: Termination::WireRopeGrips,
        label: "wire rope grips",
        efficiency: 0.80,
        source: "common practice, correctly fitted grips (from memory)",
    },
];

/// Efficiency taken when a wire rope's termination is not stated: the lowest
/// of the common terminations in [`TABLE`] (hand splice, wedge socket, grips).
pub const UNSTATED_TERMINATION_EFFICIENCY: f64 = 0.80;

impl Termination {
    fn entry(self) -> &'static Entry {
        // every variant has exactly one entry (tested)
        TABLE.iter().find(|e| e.termination == self).unwrap_or(&TABLE[1])
    }

    /// Efficiency, 0–1.
    pub fn efficiency(self) -> f64 {
        self.entry().efficiency
    }

    /// Plain name.
    pub fn label(self) -> &'static str {
        self.entry().label
    }

    /// Where the efficiency comes from.
    pub fn source(self) -> &'static str {
        self.entry().source
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // REFERENCES "Hitches, terminations": ferrule 0.90, hand splice 0.80,
    // wedge socket 0.80, poured socket 1.00, grips 0.80 (EN 13414-1 /
    // practice, from memory). Exact table values.
    #[test]
    fn efficiencies_from_the_table() {
        let expect = [
            (Termination::FerruleSecured, 0.90),
            (Termination::HandSplice, 0.80),
            (Termination::WedgeSocket, 0.80),
            (Termination::PouredSocket, 1.00),
            (Termination::WireRopeGrips, 0.80),
        ];
        for (t, e) in expect {
            assert_eq!(TABLE.iter().filter(|x| x.termination == t).count(), 1);
            assert!((t.efficiency() - e).abs() < 1e-12, "{t:?}");
        }
        let lowest = TABLE.iter().map(|e| e.efficiency).fold(f64::INFINITY, f64::min);
        assert!((UNSTATED_TERMINATION_EFFICIENCY - lowest).abs() < 1e-12);
    }
}
