//! The scenario file's own types (format 1): exactly what a person writes,
//! quantities kept as the strings they typed (`"12 mm"`), so a file read and
//! written back keeps its units. Conversion into the model validates them
//! (see `crate::model::build`).

use serde::de::{self, SeqAccess, Visitor};
use serde::{Deserialize, Deserializer, Serialize, Serializer};
use std::fmt;

/// A quantity as written: a number and its unit in one string.
#[derive(Debug, Clone, PartialEq, Eq, Default)]
pub struct Qty(pub String);

impl Qty {
    /// Wrap a string.
    pub fn new(s: impl Into<String>) -> Qty {
        Qty(s.into())
    }
}

impl From<&str> for Qty {
    fn from(s: &str) -> Qty {
        Qty(s.to_string())
    }
}

impl fmt::Display for Qty {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.0)
    }
}

impl Serialize for Qty {
    fn serialize<S: Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        s.serialize_str(&self.0)
    }
}

struct QtyVisitor;

fn bare<E: de::Error>(v: impl fmt::Display) -> E {
    E::custom(format!(
        "bare number {v} where a quantity belongs: write the number and its unit in quotes, e.g. \"{v} kg\" for a mass or \"{v} mm\" for a length"
    ))
}

impl Visitor<'_> for QtyVisitor {
    type Value = Qty;
    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a quantity with its unit in quotes, such as \"12 mm\"")
    }
    fn visit_str<E: de::Error>(self, v: &str) -> Result<Qty, E> {
        Ok(Qty(v.to_string()))
    }
    fn visit_string<E: de::Error>(self, v: String) -> Result<Qty, E> {
        Ok(Qty(v))
    }
    fn visit_f64<E: de::Error>(self, v: f64) -> Result<Qty, E> {
        Err(bare(v))
    }
    fn visit_i64<E: de::Error>(self, v: i64) -> Result<Qty, E> {
        Err(bare(v))
    }
    fn visit_u64<E: de::Error>(self, v: u64) -> Result<Qty, E> {
        Err(bare(v))
    }
}

impl<'de> Deserialize<'de> for Qty {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Qty, D::Error> {
        d.deserialize_any(QtyVisitor)
    }
}

/// A position: `(x, y)` in the elevation, or `(x, y, z)`.
#[derive(Debug, Clone, PartialEq, Eq, Default)]
pub struct Position {
    /// Horizontal, to the right.
    pub x: Qty,
    /// Vertical, up.
    pub y: Qty,
    /// Towards the viewer; absent means 0.
    pub z: Option<Qty>,
}

impl Serialize for Position {
    fn serialize<S: Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        use serde::ser::SerializeTuple;
        let n = if self.z.is_some() { 3 } else { 2 };
        let mut t = s.serialize_tuple(n)?;
        t.serialize_element(&self.x)?;
        t.serialize_element(&self.y)?;
        if let Some(z) = &self.z {
            t.serialize_element(z)?;
        }
        t.end()
    }
}

struct PositionVisitor;

impl<'de> Visitor<'de> for PositionVisitor {
    type Value = Position;
    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a position (\"x\", \"y\") or (\"x\", \"y\", \"z\") with units")
    }
    fn visit_seq<A: SeqAccess<'de>>(self, mut seq: A) -> Result<Position, A::Error> {
        let x: Qty = seq.next_element()?.ok_or_else(|| de::Error::invalid_length(0, &self))?;
        let y: Qty = seq.next_element()?.ok_or_else(|| de::Error::invalid_length(1, &self))?;
        let z: Option<Qty> = seq.next_element()?;
        if seq.next_element::<de::IgnoredAny>()?.is_some() {
            return Err(de::Error::invalid_length(4, &self));
        }
        Ok(Position { x, y, z })
    }
}

impl<'de> Deserialize<'de> for Position {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Position, D::Error> {
        d.deserialize_tuple(3, PositionVisitor)
    }
}

/// How a node is held, as written.
#[derive(Debug, Clone, PartialEq, Eq, Default, Serialize, Deserialize)]
pub enum SupportDto {
    /// A free joint (the default).
    #[default]
    Joint,
    /// Fixed in space: a beam clamp, eye bolt, anchor point.
    Anchor,
    /// Resting on the named floor slab.
    Floor(String),
}

impl SupportDto {
    fn is_joint(&self) -> bool {
        *self == SupportDto::Joint
    }
}

/// A node as written.
#[derive(Debug, Clone, PartialEq, Default, Serialize, Deserialize)]
#[serde(rename = "Node", deny_unknown_fields)]
pub struct NodeDto {
    /// Unique id.
    pub id: String,
    /// Drawn position.
    pub at: Position,
    /// How it is held; omitted for a free joint.
    #[serde(default, skip_serializing_if = "SupportDto::is_joint")]
    pub support: SupportDto,
    // rated parts at the node
    /// An anchor's rated load (force, or mass as on its tag), checked against the reaction.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rated: Option<Qty>,
    /// Fittings at the node (e.g. a master link), checked on the resultant of the members above it.
    #[serde(default, skip_serializing_if = "Vec::is_empty")]
    pub fittings: Vec<super::fitting::FittingDto>,
    /// The direction an anchor's rating holds in: the pull of the rig on the
    /// anchor, e.g. `(0, -1, 0)` for a roof point loaded downwards; omitted =
    /// `rated` holds in any direction.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rated_direction: Option<super::fitting::Direction>,
    /// An anchor's rated load across `rated_direction` (the maker's side rating).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rated_across: Option<Qty>,
    /// A sheave at the node: ropes (`ropes`) may run over it.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub sheave: Option<SheaveDto>,
}

/// A sheave as written.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename = "Sheave", deny_unknown_fields)]
pub struct SheaveDto {
    /// Tread diameter D (for the rope's D/d efficiency).
    pub diameter: Qty,
    /// Its bearing (friction factor per sheave); omitted = frictionless.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bearing: Option<crate::library::Bearing>,
}

/// One continuous rope running from its first node over sheave nodes to its
/// last: one spring, one tension (see `ropes` in the README).
#[derive(Debug, Clone, PartialEq, Default, Serialize, Deserialize)]
#[serde(rename = "Rope", deny_unknown_fields)]
pub struct RopeDto {
    /// Unique id (shared with the members' ids).
    pub id: String,
    /// The nodes it runs through, from the dead end to the lead line; every
    /// node between the two ends carries a sheave.
    pub path: Vec<String>,
    /// Kind: wire rope, fibre rope or cable.
    pub kind: crate::library::MemberKind,
    /// Unstretched length of the whole rope; omitted = the drawn length.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub length: Option<Qty>,
    /// Which way it runs over its sheaves (the bearings' friction); omitted = hoisting.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub motion: Option<crate::library::RopeMotion>,
    /// Load-carrying area (metallic area for wire rope).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub area: Option<Qty>,
    /// Nominal diameter (needed for wire rope: the D/d efficiency over the sheaves).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub diameter: Option<Qty>,
    /// Wire rope construction, e.g. `"6x19 IWRC"`.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub construction: Option<String>,
    /// Rope grade (`"1770"`, N/mm²).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub grade: Option<String>,
    /// Material name from the library.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub material: Option<String>,
    /// Young's modulus.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub modulus: Option<Qty>,
    /// Fibre rope: elastic elongation in percent at `elongation_at_pct` of break.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub elongation_pct: Option<f64>,
    /// Fibre rope: the load, in percent of break, at which `elongation_pct` holds.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub elongation_at_pct: Option<f64>,
    /// Fibre rope: braided or laid.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub braided: Option<bool>,
    /// Rated strength.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rating: Option<RatingDto>,
    /// Design factor on rated strength; omitted = the kind's default.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub design_factor: Option<f64>,
    /// Wire rope: how its ends are made.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub termination: Option<crate::library::Termination>,
    /// Termination efficiency, 0–1, instead of `termination`.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub termination_efficiency: Option<f64>,
    /// Own weight per length.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub linear_mass: Option<Qty>,
    /// True where the rope may go slack in some case without that being a fault.
    #[serde(default, skip_serializing_if = "std::ops::Not::not")]
    pub may_go_slack: bool,
    /// Fittings in series (e.g. the dead end's shackle, the hoist the lead runs to).
    #[serde(default, skip_serializing_if = "Vec::is_empty")]
    pub fittings: Vec<super::fitting::FittingDto>,
}

impl RopeDto {
    /// The member fields of the rope, for the checks a member gets; its ends
    /// are the path's first and last nodes.
    pub fn as_member(&self) -> MemberDto {
        let end = |k: usize| self.path.get(k).cloned().unwrap_or_default();
        MemberDto {
            id: self.id.clone(),
            ends: (end(0), end(self.path.len().saturating_sub(1))),
            kind: self.kind,
            area: self.area.clone(),
            diameter: self.diameter.clone(),
            construction: self.construction.clone(),
            grade: self.grade.clone(),
            material: self.material.clone(),
            modulus: self.modulus.clone(),
            elongation_pct: self.elongation_pct,
            elongation_at_pct: self.elongation_at_pct,
            braided: self.braided,
            rating: self.rating.clone(),
            design_factor: self.design_factor,
            termination: self.termination,
            termination_efficiency: self.termination_efficiency,
            linear_mass: self.linear_mass.clone(),
            may_go_slack: self.may_go_slack,
            fittings: self.fittings.clone(),
            ..MemberDto::default()
        }
    }
}

/// A member's rated strength, as written.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
pub enum RatingDto {
    /// Minimum breaking strength (force).
    BreakingStrength(Qty),
    /// Working load limit given directly (force); used as the allowable.
    WorkingLoadLimit(Qty),
    /// Yield stress (rods); allowable = yield × area ÷ design factor.
    Yield(Qty),
}

/// A member as written.
#[derive(Debug, Clone, PartialEq, Default, Serialize, Deserialize)]
#[serde(rename = "Member", deny_unknown_fields)]
pub struct MemberDto {
    /// Unique id.
    pub id: String,
    /// The two end nodes.
    pub ends: (String, String),
    /// Kind of member.
    pub kind: crate::library::MemberKind,
    /// Cross-section area carrying the load (metallic area for wire rope).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub area: Option<Qty>,
    /// Nominal diameter (with `construction` for wire rope, `grade` for chain).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub diameter: Option<Qty>,
    /// Wire rope construction, e.g. `"6x19 IWRC"`.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub construction: Option<String>,
    /// Rope grade (`"1770"`, N/mm²) or chain grade (`"80"`, `"100"`).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub grade: Option<String>,
    /// Material name from the library (`"steel"`, `"polyester"` …).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub material: Option<String>,
    /// Young's modulus (overrides the material's or the construction's).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub modulus: Option<Qty>,
    /// Fibre rope: elastic elongation in percent at `elongation_at_pct` of break.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub elongation_pct: Option<f64>,
    /// Fibre rope: the load, in percent of break, at which `elongation_pct` holds (default 20).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub elongation_at_pct: Option<f64>,
    /// Fibre rope: braided (true) or laid 3-strand (false) for default elongation.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub braided: Option<bool>,
    /// Rated strength; may be omitted where the library derives it.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rating: Option<RatingDto>,
    /// Design factor on rated strength; omitted = the kind's default.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub design_factor: Option<f64>,
    /// Termination efficiency, 0–1 (e.g. 0.8 for a hand-spliced eye), applied to the rated strength.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub termination_efficiency: Option<f64>,
    /// Knot or hitch efficiency for fibre rope, 0–1 (CI 1401: knots can halve strength).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub knot_efficiency: Option<f64>,
    /// Unstretched length = drawn + slack; negative is pretension.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub slack: Option<Qty>,
    /// Own weight per length; omitted = from the library where it can tell.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub linear_mass: Option<Qty>,
    /// True where the member may go slack in some case without that being a fault.
    #[serde(default, skip_serializing_if = "std::ops::Not::not")]
    pub may_go_slack: bool,
    /// Rod: its cross-section, for the buckling check in compression.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub section: Option<SectionDto>,
    /// Rod: buckling curve (steel `a0`…`d`, EN 1993-1-1 Table 6.1; aluminium class `A` or `B`, EN 1999-1-1).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub buckling_curve: Option<String>,
    /// Rod: effective length factor K (buckling length K L); omitted = 1.0, pinned at both ends.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub effective_length_factor: Option<f64>,
    /// Wire rope: how its ends are made, for the termination efficiency (EN 13414-1).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub termination: Option<crate::library::Termination>,
    /// A sling's hitch (`Straight`, `Choker`, `Basket`): a mode factor on the allowable (not on rods).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub hitch: Option<crate::library::Hitch>,
    /// A choker's choke angle (e.g. `"120 deg"`), for the ASME B30.9 reduction under `rules: ASME`.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub choke_angle: Option<Qty>,
    /// A basket's legs from vertical (0 to 45 deg); omitted = legs parallel.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub basket_angle: Option<Qty>,
    /// Wire rope bent over a pin or sheave of this diameter D: the D/d efficiency (needs `diameter`).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub bent_over: Option<Qty>,
    /// Fibre rope used as a textile sling (EN 1492-1/-2/-4): design factor 7.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub sling: Option<crate::library::TextileSling>,
    // rated parts in series with the member
    /// Fittings in series (shackles, hooks, links, eye bolts, hoists, named parts).
    #[serde(default, skip_serializing_if = "Vec::is_empty")]
    pub fittings: Vec<super::fitting::FittingDto>,
}

/// A rod's cross-section as written.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub enum SectionDto {
    /// Circular hollow section.
    Tube {
        /// Outside diameter.
        outer: Qty,
        /// Wall thickness.
        wall: Qty,
    },
    /// Solid round bar.
    SolidRound {
        /// Diameter.
        diameter: Qty,
    },
}

/// A floor slab as written.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(rename = "Floor", deny_unknown_fields)]
pub struct FloorDto {
    /// Unique id.
    pub id: String,
    /// Panel spans between supports (x, z).
    pub span: (Qty, Qty),
    /// Slab thickness.
    pub thickness: Qty,
    /// Young's modulus; or give `material`.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub modulus: Option<Qty>,
    /// Material name (e.g. `"concrete"`).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub material: Option<String>,
    /// Poisson's ratio; omitted = the material's.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub poisson: Option<f64>,
    /// Edge support.
    pub edges: crate::library::Edges,
    /// Rated uniform load (pressure).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rated_uniform: Option<Qty>,
    /// Rated concentrated load (force).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rated_point: Option<Qty>,
    /// Bearing pad under the node (x, z).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub pad: Option<(Qty, Qty)>,
    /// Deflection limit as span / this number (default 360, common practice for floors).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub deflection_limit: Option<f64>,
    /// The panel's corner in plan (x, z); omitted = centred under its feet.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub origin: Option<(Qty, Qty)>,
    /// Friction coefficient a foot may rely on (default 0.20, EN 1993-1-8 §6.2.2(6)).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub friction_limit: Option<f64>,
}

/// A mass as written.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename = "Mass", deny_unknown_fields)]
pub struct MassDto {
    /// Unique id.
    pub id: String,
    /// The node it hangs at.
    pub at: String,
    /// Its mass.
    pub mass: Qty,
}

/// A load case as written.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub enum CaseDto {
    /// Hanging still.
    Static {
        /// Unique id.
        id: String,
    },
    /// Released from rest at an angle and swung through the lowest point.
    Swing {
        /// Unique id.
        id: String,
        /// The swinging mass.
        mass: String,
        /// Release angle from the vertical.
        release: Qty,
        /// Node it swings about; omitted = the anchor of its path.
        #[serde(default, skip_serializing_if = "Option::is_none")]
        pivot: Option<String>,
        /// Direction of the swing's plane in plan, about y from +x (90 deg
        /// swings towards +z); omitted = 0, the elevation x–y.
        #[serde(default, skip_serializing_if = "Option::is_none")]
        azimuth: Option<Qty>,
    },
    /// Free fall of a height before the path takes the load.
    Drop {
        /// Unique id.
        id: String,
        /// The falling mass.
        mass: String,
        /// Free-fall height.
        height: Qty,
    },
    /// Suddenly applied (zero-height drop).
    Sudden {
        /// Unique id.
        id: String,
        /// The mass.
        mass: String,
    },
}

impl CaseDto {
    /// The case's id.
    pub fn id(&self) -> &str {
        match self {
            CaseDto::Static { id }
            | CaseDto::Swing { id, .. }
            | CaseDto::Drop { id, .. }
            | CaseDto::Sudden { id, .. } => id,
        }
    }
}

/// A whole scenario file, format 1.
#[derive(Debug, Clone, PartialEq, Default, Serialize, Deserialize)]
#[serde(rename = "Scenario", deny_unknown_fields)]
pub struct ScenarioDto {
    /// File format number.
    pub format: u32,
    /// Title.
    pub title: String,
    /// The drawing's revision as the planner marks it (`"B"`); optional,
    /// printed on the report beside the file's SHA-256.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub revision: Option<String>,
    /// Free text for the colleague who opens it.
    #[serde(default)]
    pub notes: String,
    /// Gravity; omitted = standard gravity.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub gravity: Option<Qty>,
    /// Utilisation from which a member counts as near its limit (default 0.8).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub near_limit: Option<f64>,
    /// Warn when a dynamic case exceeds the static force by more than this multiple (default 2.0).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub dynamic_ratio_warning: Option<f64>,
    /// Over people or lifting persons: raises the default design factors (default standard).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub duty: Option<crate::library::Duty>,
    /// Rule set for sling mode factors (`EN` or `ASME`); omitted = EN.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rules: Option<crate::library::Rules>,
    /// Nodes.
    #[serde(default)]
    pub nodes: Vec<NodeDto>,
    /// Members.
    #[serde(default)]
    pub members: Vec<MemberDto>,
    /// Ropes running over sheaves, each one continuous spring.
    #[serde(default, skip_serializing_if = "Vec::is_empty")]
    pub ropes: Vec<RopeDto>,
    /// Floor slabs.
    #[serde(default, skip_serializing_if = "Vec::is_empty")]
    pub floors: Vec<FloorDto>,
    /// Masses.
    #[serde(default)]
    pub masses: Vec<MassDto>,
    /// Load cases.
    #[serde(default)]
    pub cases: Vec<CaseDto>,
}
