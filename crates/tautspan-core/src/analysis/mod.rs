//! Analysis of a scenario: static and dynamic cases, allowables, states,
//! limits, warnings and the comparison table.

mod allowable;
mod analyse;
mod curves;
mod drawn_shape;
mod evaluate;
mod fittings;
mod floor_check;
pub mod formulas;
mod illinois;
mod limits;
mod load_paths;
mod multi_leg;
pub mod results;
mod scope;
mod simulate_case;
mod simulate_stream;
mod strut;
mod swing_arc;
mod threads;
mod warning_group;
mod warning_kind;
mod warnings;
mod worst;

pub use allowable::{Allowable, NEEDS_RATED_POINT, floor_allowable, member_allowable, member_allowable_n};
pub use analyse::{Prior, analyse, analyse_from, assumptions};
pub use curves::{ReleaseCurve, release_curve, single_line_swing};
pub use drawn_shape::{SHAPE_MOVE_FLOOR_M, SHAPE_MOVE_FRACTION, rig_size_m, shape_move_limit_m};
pub use evaluate::Allowables;
pub use fittings::node_load_n;
pub use load_paths::{ALL_MASSES, LOAD_PATH_THRESHOLD, MAX_LISTED};
pub use results::*;
pub use scope::{Scope, scope};
pub use simulate_case::{CaseSimulation, MAX_SIMULATE_STEPS, SimulateRequest, check_step_cap, simulate_case};
pub use simulate_stream::{
    COARSE_STEP_FRACTION, PlanError, Sample, ShortestPeriod, SimulationPlan, SimulationSummary, plan_simulation,
    shortest_period,
};
pub use strut::{Compression, compression, compression_explanation};
pub use swing_arc::{GRID_STEP_DEG, PEAK_TOLERANCE, arc_loads};
pub use threads::{set_thread_limit, with_thread_limit};
pub use warning_group::{SUBJECTS_IN_TEXT, WarningGroup, first_few, group_warnings};
pub use warning_kind::WarningKind;
pub use worst::{ItemKind, Worst, worst};
