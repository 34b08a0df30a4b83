//! The fields folder: the editable quantity field (`qty_field`) with its
//! text parsing (`qty_text`), the id field that renames with every reference
//! (`id_field`), and how quantities are shown in the chosen unit system
//! (`units_display`).

pub(crate) mod id_field;
pub(crate) mod invalid;
pub(crate) mod qty_field;
pub(crate) mod qty_text;
pub(crate) mod units_display;
