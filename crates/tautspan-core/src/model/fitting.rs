//! Rated parts in the load path, validated: fittings in series on a member
//! (checked on the member's force), fittings at a node (checked on the
//! resultant of the members above it) and an anchor's rated load (checked
//! on the support reaction).

use uom::si::f64::{Angle, Force};

/// What a fitting is and what its check needs.
#[derive(Debug, Clone, PartialEq)]
pub enum FittingKind {
    /// A shackle.
    Shackle,
    /// A hook.
    Hook,
    /// A master link.
    MasterLink,
    /// An eye bolt: its axis (unit vector) and whether it has a shoulder.
    EyeBolt {
        /// Unit vector along the shank; the line counts, not its sense.
        axis: [f64; 3],
        /// Shoulder eye bolt (derated by angle); false: plain, in line only.
        shoulder: bool,
    },
    /// A hoist: the maker's side-pull limit, where given.
    Hoist {
        /// Largest angle off plumb the maker allows, where given.
        max_off_plumb: Option<Angle>,
    },
    /// Any other named rated part.
    Other,
}

impl FittingKind {
    /// The contract's word for the kind (`shackle`, `hook`, `master_link`,
    /// `eye_bolt`, `hoist`, `fitting`).
    pub fn word(&self) -> &'static str {
        match self {
            FittingKind::Shackle => "shackle",
            FittingKind::Hook => "hook",
            FittingKind::MasterLink => "master_link",
            FittingKind::EyeBolt { .. } => "eye_bolt",
            FittingKind::Hoist { .. } => "hoist",
            FittingKind::Other => "fitting",
        }
    }
}

/// A rated part.
#[derive(Debug, Clone, PartialEq)]
pub struct Fitting {
    /// Kind and what its check needs.
    pub kind: FittingKind,
    /// Name shown in outputs: the one given, else the kind in words
    /// (`shackle`, `master link`), numbered when a kind repeats on one item.
    pub name: String,
    /// Working load limit (in line, for an eye bolt).
    pub wll: Force,
    /// Where the WLL came from (as written; a mass read at standard gravity).
    pub wll_note: String,
}
