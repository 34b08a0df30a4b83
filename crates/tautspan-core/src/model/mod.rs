//! The validated model of a scenario and its construction from file types.

mod build;
mod build_fittings;
mod build_ropes;
mod fitting;
mod floor_feet;
mod ids;
mod load;
pub mod plausible;
mod scenario;
mod to_network;

pub use build::{Problem, STANDARD_GRAVITY_M_S2, build};
pub use fitting::{Fitting, FittingKind};
pub use floor_feet::EDGE_CLEARANCE_M;
pub use ids::{DrawingItem, drawing_id_holder, id_clashes};
pub use load::{Loaded, load_scenario};
pub use plausible::{diameter_range_m, implausible_diameter};
pub use scenario::{Bend, RopeRun, Sheave, Strut};
pub use scenario::{Case, DEFAULT_FRICTION_LIMIT, DesignFactor, Floor, Mass, Member, Node, Rating, Scenario, Support};
pub use to_network::{NetworkLoads, to_network};
