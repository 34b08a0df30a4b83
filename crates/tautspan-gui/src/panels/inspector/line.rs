//! A line of the rig: a member or a rope over sheaves, which share the
//! fields of size, library values and rating, so one set of field code in
//! the member and hitch sections edits either.

use tautspan_core::file::{Qty, RatingDto, ScenarioDto};

/// A member or a rope over sheaves: the two share the fields of a line's
/// size, library values and rating (a rope's are checked as a member's), so
/// one set of field code edits either.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Line {
    /// `members[i]`.
    Member(usize),
    /// `ropes[i]`.
    Rope(usize),
}

/// The shared fields of a line, to set.
pub struct LineMut<'a> {
    /// Nominal diameter.
    pub diameter: &'a mut Option<Qty>,
    /// Load-carrying area.
    pub area: &'a mut Option<Qty>,
    /// Wire rope construction.
    pub construction: &'a mut Option<String>,
    /// Rope or chain grade.
    pub grade: &'a mut Option<String>,
    /// Library material.
    pub material: &'a mut Option<String>,
    /// Young's modulus.
    pub modulus: &'a mut Option<Qty>,
    /// Rated strength.
    pub rating: &'a mut Option<RatingDto>,
    /// Design factor.
    pub design_factor: &'a mut Option<f64>,
    /// Wire rope termination.
    pub termination: &'a mut Option<tautspan_core::library::Termination>,
    /// Termination efficiency instead of a termination.
    pub termination_efficiency: &'a mut Option<f64>,
}

impl Line {
    /// A field's path in the file (`members[2].area`, `ropes[0].area`): the
    /// core locates a rope's problems under `ropes[i]` with the member's field names.
    pub fn path(self, field: &str) -> String {
        match self {
            Line::Member(i) => format!("members[{i}].{field}"),
            Line::Rope(i) => format!("ropes[{i}].{field}"),
        }
    }

    /// Set its shared fields (nothing when it is gone).
    pub fn edit(self, d: &mut ScenarioDto, f: impl FnOnce(LineMut<'_>)) {
        match self {
            Line::Member(i) => {
                if let Some(m) = d.members.get_mut(i) {
                    f(LineMut {
                        diameter: &mut m.diameter,
                        area: &mut m.area,
                        construction: &mut m.construction,
                        grade: &mut m.grade,
                        material: &mut m.material,
                        modulus: &mut m.modulus,
                        rating: &mut m.rating,
                        design_factor: &mut m.design_factor,
                        termination: &mut m.termination,
                        termination_efficiency: &mut m.termination_efficiency,
                    });
                }
            }
            Line::Rope(i) => {
                if let Some(r) = d.ropes.get_mut(i) {
                    f(LineMut {
                        diameter: &mut r.diameter,
                        area: &mut r.area,
                        construction: &mut r.construction,
                        grade: &mut r.grade,
                        material: &mut r.material,
                        modulus: &mut r.modulus,
                        rating: &mut r.rating,
                        design_factor: &mut r.design_factor,
                        termination: &mut r.termination,
                        termination_efficiency: &mut r.termination_efficiency,
                    });
                }
            }
        }
    }
}
