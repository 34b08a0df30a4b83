//! The validated scenario: every reference resolved to an index, every
//! quantity a `uom` quantity, every library lookup done, and each derived
//! value carrying a note of where it came from so reports can explain it.

use crate::library::{
    Bearing, ChainGrade, Construction, Curve, DefaultFactor, Duty, Edges, Material, MemberKind, ModeFactor, PlatePanel,
    RopeMotion, Rules, Section,
};
use uom::si::f64::{Acceleration, Angle, Area, Force, Length, LinearMassDensity, Mass as MassQ, Pressure};

/// How a node is held.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Support {
    /// Free joint.
    Joint,
    /// Fixed anchor.
    Anchor,
    /// Resting on a floor (index into [`Scenario::floors`]).
    Floor(usize),
}

/// A node.
#[derive(Debug, Clone, PartialEq)]
pub struct Node {
    /// Id from the file.
    pub id: String,
    /// Drawn position (x, y, z).
    pub position: [Length; 3],
    /// How it is held.
    pub support: Support,
    // rated parts at the node
    /// An anchor's rated load, where given.
    pub rated: Option<super::fitting::Fitting>,
    /// Fittings at the node, checked on the resultant of the members above it.
    pub fittings: Vec<super::fitting::Fitting>,
    /// The unit direction an anchor's rating holds in (the rig's pull on
    /// it); `None`: the rating holds in any direction.
    pub rated_direction: Option<[f64; 3]>,
    /// The anchor's rated load across that direction, where given.
    pub rated_across: Option<super::fitting::Fitting>,
    /// A sheave at the node, where ropes may run over it.
    pub sheave: Option<Sheave>,
}

/// A sheave at a node.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Sheave {
    /// Tread diameter D.
    pub diameter: Length,
    /// Its bearing.
    pub bearing: Bearing,
}

/// The route of a rope over its sheaves: it runs from the member's
/// `ends[0]` over `via` to `ends[1]`.
#[derive(Debug, Clone, PartialEq)]
pub struct RopeRun {
    /// The sheave nodes passed over, in order.
    pub via: Vec<usize>,
    /// Per segment, its tension ÷ the rope's largest (1 over frictionless sheaves).
    pub segment_factors: Vec<f64>,
    /// The sense the bearings' friction is taken in.
    pub motion: RopeMotion,
    /// How the tensions were found, with the source, for explanations.
    pub note: String,
}

/// Rated strength as the allowable is derived from it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Rating {
    /// Minimum breaking strength; allowable = MBS × efficiency ÷ design factor.
    BreakingStrength(Force),
    /// Working load limit, used as the allowable directly.
    WorkingLoadLimit(Force),
    /// Yield stress; allowable = yield × area ÷ design factor.
    Yield(Pressure),
}

/// The design factor in force for a member and where it comes from.
#[derive(Debug, Clone, PartialEq)]
pub struct DesignFactor {
    /// Rated strength ÷ allowable.
    pub value: f64,
    /// True when the file gave it; false when the kind's default applies.
    pub from_file: bool,
    /// The default (the kind's, or the sling standard's, times the duty's
    /// multiplier) and its source.
    pub default: DefaultFactor,
    /// The duty's multiplier (1 for standard duty); a working load limit is
    /// divided by it, as the default design factors are multiplied by it.
    pub duty_multiplier: f64,
}

/// A rod's inputs for the buckling check in compression.
#[derive(Debug, Clone, PartialEq)]
pub struct Strut {
    /// Its cross-section, when given.
    pub section: Option<Section>,
    /// Its buckling curve, or why there is none (the check is then `unchecked`).
    pub curve: Result<Curve, String>,
    /// Effective length factor K.
    pub effective_length_factor: f64,
    /// True when the file gave K; false when the default 1.0 (pinned both ends) applies.
    pub k_from_file: bool,
}

/// A member, ready for the solver and the checks.
#[derive(Debug, Clone, PartialEq)]
pub struct Member {
    /// Id from the file.
    pub id: String,
    /// End node indices.
    pub ends: [usize; 2],
    /// Kind.
    pub kind: MemberKind,
    /// Load-carrying area (metallic area for wire rope).
    pub area: Area,
    /// Axial stiffness E·A.
    pub axial_stiffness: Force,
    /// How E·A was found, for explanations.
    pub stiffness_note: String,
    /// Rated strength.
    pub rating: Rating,
    /// Where the rating came from.
    pub rating_note: String,
    /// Design factor.
    pub design_factor: DesignFactor,
    /// Termination efficiency × knot efficiency × D/d bending efficiency (1 when none given).
    pub efficiency: f64,
    /// What the efficiency is made of, for explanations.
    pub efficiency_note: String,
    /// Unstretched length minus drawn length.
    pub slack: Length,
    /// Own weight per length (zero when unknown, noted in `weight_note`).
    pub linear_mass: LinearMassDensity,
    /// Where the own weight came from.
    pub weight_note: String,
    /// Longitudinal wave speed `√(EA/μ)`, m/s, when the own weight is known.
    pub wave_speed_m_s: Option<f64>,
    /// May go slack without being a fault.
    pub may_go_slack: bool,
    /// Nominal diameter, where given.
    pub diameter: Option<Length>,
    /// Rope construction, where given.
    pub construction: Option<Construction>,
    /// Chain grade, where given.
    pub chain_grade: Option<ChainGrade>,
    /// Material, where given.
    pub material: Option<Material>,
    // rated parts in series with the member
    /// Fittings in series, each checked on the member's force.
    pub fittings: Vec<super::fitting::Fitting>,
    /// Rods: what the buckling check needs; `None` for tension-only kinds.
    pub strut: Option<Strut>,
    /// A sling's hitch and its mode factor on the allowable, where given.
    pub hitch: Option<ModeFactor>,
    /// Wire rope bent over a pin or sheave: its D/d efficiency (already in `efficiency`).
    pub bend: Option<Bend>,
    /// A rope running over sheaves (from the file's `ropes`); `None` for a member.
    pub run: Option<RopeRun>,
}

impl Member {
    /// The nodes along the member: its first end, any sheaves, its last end.
    pub fn path(&self) -> Vec<usize> {
        let mut p = vec![self.ends[0]];
        if let Some(r) = &self.run {
            p.extend(&r.via);
        }
        p.push(self.ends[1]);
        p
    }

    /// The first span's two nodes: the member's ends, or a rope's dead end
    /// and its first sheave (no allocation: used per member per solve).
    pub fn first_span(&self) -> [usize; 2] {
        match self.run.as_ref().and_then(|r| r.via.first()) {
            Some(&s) => [self.ends[0], s],
            None => self.ends,
        }
    }

    /// The segments `(from, to, factor)`: one for a member, one per span of a rope.
    pub fn segments(&self) -> Vec<(usize, usize, f64)> {
        let p = self.path();
        (0..p.len() - 1)
            .map(|i| {
                let w = self.run.as_ref().and_then(|r| r.segment_factors.get(i)).copied().unwrap_or(1.0);
                (p[i], p[i + 1], w)
            })
            .collect()
    }
}

/// A wire rope bent over a pin or sheave.
#[derive(Debug, Clone, PartialEq)]
pub struct Bend {
    /// Pin or sheave diameter D.
    pub pin: Length,
    /// D/d.
    pub ratio: f64,
    /// Efficiency from the D/d curve.
    pub efficiency: f64,
    /// Its derivation with the source.
    pub note: String,
}

/// A floor slab.
#[derive(Debug, Clone, PartialEq)]
pub struct Floor {
    /// Id from the file.
    pub id: String,
    /// Panel spans (x, z).
    pub span: [Length; 2],
    /// Thickness.
    pub thickness: Length,
    /// Young's modulus.
    pub modulus: Pressure,
    /// Poisson's ratio.
    pub poisson: f64,
    /// Edge support.
    pub edges: Edges,
    /// Rated uniform load.
    pub rated_uniform: Option<Pressure>,
    /// Rated concentrated load.
    pub rated_point: Option<Force>,
    /// Bearing pad (x, z).
    pub pad: Option<[Length; 2]>,
    /// Deflection limit as span / this.
    pub deflection_limit: f64,
    /// Point-load spring stiffness at the centre, N/m (T&W's tabulated α).
    pub stiffness_n_per_m: f64,
    /// The panel's corner (x, z) in plan.
    pub origin: [Length; 2],
    /// False when the file gave no origin and the panel was centred under
    /// its feet's centroid (said in the assumptions).
    pub origin_given: bool,
    /// Friction coefficient a foot may rely on sideways.
    pub friction_limit: f64,
    /// Where [`Floor::friction_limit`] came from.
    pub friction_source: &'static str,
    /// The feet: nodes resting on this floor, ascending.
    pub feet: Vec<usize>,
    /// The plate with its feet (None when no node rests on it).
    pub plate: Option<PlatePanel>,
}

/// EN 1993-1-8:2005 §6.2.2(6): coefficient of friction between a base plate
/// and a sand-cement mortar bed, C_f,d = 0.20.
pub const DEFAULT_FRICTION_LIMIT: f64 = 0.20;

impl Floor {
    /// The spring rate of foot `node` alone on the panel (1 / C_ii), N/m; the
    /// centre value where the node is not one of the feet.
    pub fn foot_stiffness_n_per_m(&self, node: usize) -> f64 {
        match (&self.plate, self.feet.iter().position(|&f| f == node)) {
            (Some(p), Some(i)) => 1.0 / p.flexibility_m_per_n()[i * self.feet.len() + i],
            _ => self.stiffness_n_per_m,
        }
    }

    /// Panel area, m².
    pub fn area_m2(&self) -> f64 {
        self.span[0].value * self.span[1].value
    }
}

/// A mass hung at a node.
#[derive(Debug, Clone, PartialEq)]
pub struct Mass {
    /// Id from the file.
    pub id: String,
    /// Node index.
    pub node: usize,
    /// Mass.
    pub mass: MassQ,
}

/// A load case.
#[derive(Debug, Clone, PartialEq)]
pub enum Case {
    /// Hanging still.
    Static {
        /// Id.
        id: String,
    },
    /// Released from rest at an angle (at most 90 deg from the vertical);
    /// checked over the whole arc from −release to +release.
    Swing {
        /// Id.
        id: String,
        /// Mass index.
        mass: usize,
        /// Release angle from the vertical.
        release: Angle,
        /// Pivot node index, if given.
        pivot: Option<usize>,
        /// Direction of the swing's plane in plan, about y from +x: at a
        /// positive swing angle θ the line points along
        /// `(sin θ cos ψ, −cos θ, sin θ sin ψ)` from the pivot.
        azimuth: Angle,
    },
    /// Free fall `height` before the path takes the load.
    Drop {
        /// Id.
        id: String,
        /// Mass index.
        mass: usize,
        /// Free-fall height.
        height: Length,
    },
    /// Suddenly applied: a drop of zero height.
    Sudden {
        /// Id.
        id: String,
        /// Mass index.
        mass: usize,
    },
}

impl Case {
    /// The case's id.
    pub fn id(&self) -> &str {
        match self {
            Case::Static { id } | Case::Swing { id, .. } | Case::Drop { id, .. } | Case::Sudden { id, .. } => id,
        }
    }

    /// The contract's name of the case kind.
    pub fn kind_name(&self) -> &'static str {
        match self {
            Case::Static { .. } => "static",
            Case::Swing { .. } => "swing",
            Case::Drop { .. } => "drop",
            Case::Sudden { .. } => "sudden",
        }
    }

    /// The mass the case concerns (none for the static case).
    pub fn mass(&self) -> Option<usize> {
        match self {
            Case::Static { .. } => None,
            Case::Swing { mass, .. } | Case::Drop { mass, .. } | Case::Sudden { mass, .. } => Some(*mass),
        }
    }
}

/// A validated scenario.
#[derive(Debug, Clone, PartialEq)]
pub struct Scenario {
    /// Title.
    pub title: String,
    /// The file's revision mark, if it gives one.
    pub revision: Option<String>,
    /// Notes.
    pub notes: String,
    /// Gravity (magnitude; acts along −y).
    pub gravity: Acceleration,
    /// Utilisation from which a member is near its limit.
    pub near_limit: f64,
    /// Dynamic/static ratio above which a warning is given.
    pub dynamic_ratio_warning: f64,
    /// Standard, over people or lifting persons.
    pub duty: Duty,
    /// Rule set for sling mode factors.
    pub rules: Rules,
    /// Nodes.
    pub nodes: Vec<Node>,
    /// Members, then the file's ropes (each a member with a [`RopeRun`]).
    pub members: Vec<Member>,
    /// Floors.
    pub floors: Vec<Floor>,
    /// Masses.
    pub masses: Vec<Mass>,
    /// Cases.
    pub cases: Vec<Case>,
}

impl Scenario {
    /// Drawn position of a node, m.
    pub fn position_m(&self, node: usize) -> [f64; 3] {
        let p = &self.nodes[node].position;
        [p[0].value, p[1].value, p[2].value]
    }

    /// Drawn length of a member, m (a rope: the sum of its spans between sheave centres).
    pub fn drawn_length_m(&self, member: usize) -> f64 {
        let m = &self.members[member];
        let chord = |a: usize, b: usize| {
            let (pa, pb) = (self.position_m(a), self.position_m(b));
            ((pb[0] - pa[0]).powi(2) + (pb[1] - pa[1]).powi(2) + (pb[2] - pa[2]).powi(2)).sqrt()
        };
        match &m.run {
            None => chord(m.ends[0], m.ends[1]),
            Some(_) => m.segments().iter().map(|&(a, b, _)| chord(a, b)).sum(),
        }
    }

    /// Unstretched length of a member, m.
    pub fn rest_length_m(&self, member: usize) -> f64 {
        self.drawn_length_m(member) + self.members[member].slack.value
    }

    /// Gravity magnitude, m/s².
    pub fn gravity_m_s2(&self) -> f64 {
        self.gravity.value
    }

    /// Index of a case by id.
    pub fn case_index(&self, id: &str) -> Option<usize> {
        self.cases.iter().position(|c| c.id() == id)
    }
}
