//! Scenario files: the file types, reading with located errors, writing.

mod caps;
mod dto;
mod error;
mod fitting;
mod locate;
mod nesting;
mod read;
mod type_words;
mod write;

pub use caps::{MAX_CASES, MAX_FLOORS, MAX_MASSES, MAX_MEMBERS, MAX_NODES, over_caps};
pub use dto::{CaseDto, FloorDto, MassDto, MemberDto, NodeDto, Position, Qty, RatingDto, ScenarioDto, SupportDto};
pub use dto::{RopeDto, SectionDto, SheaveDto};
pub use error::{FileError, FileErrors};
pub use fitting::{Direction, FittingDto};
pub use locate::{Location, MAX_NESTING, SpanIndex};
pub use nesting::too_deep;
pub use read::{FORMAT_WRITTEN, FORMATS_READ, MAX_FILE_BYTES, parse_scenario_text, ron_options};
pub use write::write_scenario_text;
