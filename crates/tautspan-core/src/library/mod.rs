//! The member library: kinds, materials, rope constructions, chain grades,
//! fibre rope stiffness, floor slabs. Every value carries its source.

mod bend;
mod buckling;
mod chain;
pub(crate) mod dense;
mod duty;
mod eye_bolt;
mod fibre_rope;
mod hitch;
mod material;
mod member_kind;
mod plate_clamped;
mod plate_navier;
mod plate_panel;
mod plate_single_series;
mod sheave;
mod slab;
mod termination;
mod textile_sling;
mod wire_rope;

pub use bend::{BEND_CURVE, BEND_SOURCE, bend_efficiency};
pub use buckling::{
    ALUMINIUM_CLASSES, Buckling, Curve, CurveError, STAINLESS_HOLLOW, STEEL_CURVES, Section, buckling, curve_for,
    euler_load_n, reduction_factor, steel_tube_class_4,
};
pub use chain::{ChainGrade, chain_area_m2, chain_linear_mass_kg_m};
pub use duty::Duty;
pub use eye_bolt::{EYE_BOLT_SOURCE, EyeBoltRow, PLAIN_EYE_BOLT, SHOULDER_EYE_BOLT, eye_bolt_fraction};
pub use fibre_rope::{default_elongation_at_20pct, fibre_axial_stiffness_n, fibre_linear_mass_kg_m};
pub use hitch::{Hitch, HitchField, ModeFactor, Rules, mode_factor};
pub use material::{Material, MaterialData};
pub use member_kind::{Carries, DefaultFactor, MemberKind};
pub use plate_clamped::{ClampedPlate, RITZ_TERMS};
pub use plate_navier::{FIELD_TERMS, FLEXIBILITY_TERMS, NavierField, navier_flexibility};
pub use plate_panel::PlatePanel;
pub use plate_single_series::navier_flexibility_matrix;
pub use sheave::{Bearing, RopeMotion, SHEAVE_SOURCE, lead_line_factor, segment_factors};
pub use slab::{Edges, flexural_rigidity, point_load_coefficient, point_stiffness_n_per_m};
pub use termination::{Termination, UNSTATED_TERMINATION_EFFICIENCY};
pub use textile_sling::TextileSling;
pub use wire_rope::{Construction, ROPE_GRADES, rope_linear_mass_kg_m};
