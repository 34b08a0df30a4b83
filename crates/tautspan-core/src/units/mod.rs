//! Quantities with units: the dimensions and units a scenario file accepts,
//! parsing and formatting, and the `uom` types of the public API.

mod dimension;
mod grouped;
mod parse;

pub use dimension::{Dimension, UNITS, UnitDef, unit, unit_of};
pub use grouped::grouped;
pub use parse::{QuantityError, Sig, Sign, format_number, format_quantity, parse_quantity, parse_rated_load};
