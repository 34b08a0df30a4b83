//! Rated parts as written: fittings in series on a member or at a node
//! (shackle, hook, master link, eye bolt, hoist, any named part), each with
//! its working load limit as a force or a mass (`"3.25 t"`, read as that
//! weight at standard gravity).

use super::dto::Qty;
use serde::{Deserialize, Serialize};

/// A direction as three plain numbers (x, y, z); only its direction counts.
pub type Direction = (f64, f64, f64);

/// A rated part, as written.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub enum FittingDto {
    /// A shackle.
    Shackle {
        /// Working load limit (force, or mass as on the tag).
        wll: Qty,
        /// Optional name shown in outputs.
        #[serde(default, skip_serializing_if = "Option::is_none")]
        name: Option<String>,
    },
    /// A hook.
    Hook {
        /// Working load limit.
        wll: Qty,
        /// Optional name.
        #[serde(default, skip_serializing_if = "Option::is_none")]
        name: Option<String>,
    },
    /// A master link (on a member: its force; at a node: the resultant).
    MasterLink {
        /// Working load limit.
        wll: Qty,
        /// Optional name.
        #[serde(default, skip_serializing_if = "Option::is_none")]
        name: Option<String>,
    },
    /// An eye bolt, derated by the angle between its axis and the pull.
    EyeBolt {
        /// In-line (vertical) working load limit.
        wll: Qty,
        /// The bolt's axis (any length; the line counts, not its sense). Required: an
        /// eye bolt may sit in a ceiling, a wall or the top of a load, so no axis is assumed.
        axis: Direction,
        /// Shoulder eye bolt (derated by angle); omitted or false: plain, in-line only.
        #[serde(default, skip_serializing_if = "std::ops::Not::not")]
        shoulder: bool,
        /// Optional name.
        #[serde(default, skip_serializing_if = "Option::is_none")]
        name: Option<String>,
    },
    /// A hoist (chain hoist, lever hoist) in the member.
    Hoist {
        /// Rated capacity.
        wll: Qty,
        /// The maker's largest side pull off plumb (e.g. `"3 deg"`); omitted: the
        /// off-plumb angle is reported with a request for the maker's limit.
        #[serde(default, skip_serializing_if = "Option::is_none")]
        max_off_plumb: Option<Qty>,
        /// Optional name.
        #[serde(default, skip_serializing_if = "Option::is_none")]
        name: Option<String>,
    },
    /// Any other rated part, named (`"beam clamp"`, `"swivel"`).
    Fitting {
        /// What it is.
        name: String,
        /// Working load limit.
        wll: Qty,
    },
}
