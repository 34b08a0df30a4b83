//! The panels folder: everything around the canvas. The verdict bar
//! (always on screen), the toolbar, the inspector, the cases panel, the
//! results table, the warnings, the plots, rated parts' results and the
//! hover explanations of a number.

pub(crate) mod cases;
pub(crate) mod confirm_delete;
pub(crate) mod explain;
pub(crate) mod inspector;
pub(crate) mod parts_view;
pub(crate) mod plots;
pub(crate) mod results_rows;
pub(crate) mod results_table;
pub(crate) mod toolbar;
pub(crate) mod verdict_bar;
pub(crate) mod warning_severity;
pub(crate) mod warnings;
