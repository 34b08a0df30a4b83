//! The duty of a lift: ordinary, over people, or lifting persons. Lifts over
//! people or of persons take higher design factors; the duty multiplies the
//! member kinds' default design factors (a factor set in the file below the
//! duty's default is warned about, as below the kind's default).

use serde::{Deserialize, Serialize};

/// A scenario's duty as written in a file (`duty: OverPeople`).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default, Serialize, Deserialize)]
pub enum Duty {
    /// Ordinary lifting, nobody under the load.
    #[default]
    Standard,
    /// The load passes or hangs over people.
    OverPeople,
    /// The rig lifts persons.
    LiftingPersons,
}

impl Duty {
    /// Multiplier on the default design factors, with its source.
    ///
    /// - standard 1: the member kinds' defaults as they stand.
    /// - over people 2: twice the normal factor is the common practice for
    ///   slings and rigging over people (EN 1492-1 guidance and practice;
    ///   overhead rigging uses 8–10 on wire rope, REFERENCES "Design factors").
    /// - lifting persons 2: EU Machinery Directive 2006/42/EC Annex I, 6.1.1:
    ///   the coefficients for lifting persons are generally doubled (from memory).
    pub fn multiplier(self) -> (f64, &'static str) {
        match self {
            Duty::Standard => (1.0, "standard duty"),
            Duty::OverPeople => {
                (2.0, "over people: twice the normal design factor (EN 1492-1 guidance; common practice)")
            }
            Duty::LiftingPersons => {
                (2.0, "lifting persons: design factors doubled (EU 2006/42/EC Annex I 6.1.1, from memory)")
            }
        }
    }

    /// Plain name.
    pub fn label(self) -> &'static str {
        match self {
            Duty::Standard => "standard",
            Duty::OverPeople => "over people",
            Duty::LiftingPersons => "lifting persons",
        }
    }
}
