//! Warnings grouped: one per kind and case, with the count and every
//! subject. A kind that occurs once keeps its own specific text; a repeated
//! kind is named once with its count, the first few subjects ("and N more")
//! and the first warning's own text as the example (which item, what limit,
//! by how much).

use serde::Serialize;

use super::results::Warning;
use super::warning_kind::WarningKind;

/// Subjects named in a group's text (all of them are in `subjects`).
pub const SUBJECTS_IN_TEXT: usize = 5;

/// The warnings of one kind in one case (or in the scenario as a whole).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct WarningGroup {
    /// The kind.
    pub kind: WarningKind,
    /// How many warnings of this kind.
    pub count: usize,
    /// Every subject (member, floor, node, part), in the order warned.
    pub subjects: Vec<String>,
    /// The group in words: the single warning's text, or the count, the
    /// first subjects and the first warning as the example.
    pub message: String,
}

/// "a, b, c, d, e and 7 more".
pub fn first_few(ids: &[String], shown: usize) -> String {
    let head = ids.iter().take(shown).map(String::as_str).collect::<Vec<_>>().join(", ");
    if ids.len() > shown { format!("{head} and {} more", ids.len() - shown) } else { head }
}

/// Group `items` by kind, kinds in the order they first occur; `case` is
/// named in a group's text.
pub fn group_warnings(items: &[Warning], case: Option<&str>) -> Vec<WarningGroup> {
    let mut order: Vec<WarningKind> = Vec::new();
    let mut members: Vec<Vec<usize>> = Vec::new();
    for (i, w) in items.iter().enumerate() {
        match order.iter().position(|k| *k == w.kind) {
            Some(g) => members[g].push(i),
            None => {
                order.push(w.kind);
                members.push(vec![i]);
            }
        }
    }
    order
        .into_iter()
        .zip(members)
        .map(|(kind, idx)| {
            let subjects: Vec<String> = idx.iter().filter_map(|&i| items[i].subject.clone()).collect();
            let first = &items[idx[0]].message;
            let message = if idx.len() == 1 {
                first.clone()
            } else {
                format!(
                    "{} {}{}: {}; the first: {first}",
                    idx.len(),
                    kind.group_words(),
                    case.map(|c| format!(" in case {c}")).unwrap_or_default(),
                    first_few(&subjects, SUBJECTS_IN_TEXT)
                )
            };
            WarningGroup { kind, count: idx.len(), subjects, message }
        })
        .collect()
}
