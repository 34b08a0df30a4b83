//! The caution every output carries.

/// One line, in every screen, report and command output.
pub const CAUTION: &str = "Planning aid only: the manufacturer's ratings, the local codes and standards, and a competent person's judgement govern every lift. Never stand or work under a suspended load.";
