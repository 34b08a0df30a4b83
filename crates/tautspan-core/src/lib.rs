//! Tautspan core: model, units, member library, scenario files, solvers,
//! dynamic cases, checks and reports. No GUI, no file or network IO beyond
//! parsing text it is given.

pub mod analysis;
pub mod caution;
pub mod colour_ramp;
pub mod file;
pub mod library;
pub mod model;
pub mod output;
pub mod report;
pub mod solve;
pub mod units;

pub use caution::CAUTION;
