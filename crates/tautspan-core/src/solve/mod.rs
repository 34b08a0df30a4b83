//! The load-path solvers on a [`Network`]: large-displacement static
//! equilibrium, effective stiffness of the load path, load paths, and the
//! implicit time-domain integrator.

mod assemble;
mod compliance;
mod contact;
mod envelope;
mod equilibrium;
mod error;
mod factor;
mod load_path;
mod model;
mod network;
mod newmark;
mod newton;
mod stability;
mod static_solver;
mod validate;

pub use equilibrium::Equilibrium;
pub use error::SolveError;
pub use load_path::{CUT_RATIO, LoadFlow, LoadPath, TraceScratch, load_paths, load_paths_from};
pub use network::{AxialLaw, Fixity, NetMember, NetNode, NetPlate, Network};
pub use newmark::{SimulateOptions, Simulation, SimulationStart, simulate};
pub use newton::SolveOptions;
pub use stability::Unstable;
pub use static_solver::{StaticSolver, solve_static};
