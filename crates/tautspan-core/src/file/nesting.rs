//! The nesting depth of a scenario's text, checked before it is parsed: a
//! file of millions of open brackets is refused at the first bracket past
//! [`MAX_NESTING`], with its line and column, instead of costing the
//! parser's and the index's time and memory.

use super::locate::{Location, MAX_NESTING, Tok, Tokens};

/// Where the first bracket past [`MAX_NESTING`] levels opens (strings and
/// comments skipped), or `None` when the text nests no deeper.
pub fn too_deep(text: &str) -> Option<Location> {
    let mut depth = 0usize;
    for (tok, at) in Tokens::new(text) {
        match tok {
            Tok::Open(_) => {
                depth += 1;
                if depth > MAX_NESTING {
                    return Some(at);
                }
            }
            Tok::Close => depth = depth.saturating_sub(1),
            _ => {}
        }
    }
    None
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_first_bracket_past_the_cap_is_located() {
        let ok = format!("{}{}", "[".repeat(MAX_NESTING), "]".repeat(MAX_NESTING));
        assert_eq!(too_deep(&ok), None);
        let deep = format!("S(\n  a: \"(((\", // [[[[\n  b: {}", "[".repeat(3_000_000));
        // S( is depth 1: the bracket MAX_NESTING + 1 deep is the MAX_NESTING-th `[`, from column 6
        assert_eq!(too_deep(&deep), Some(Location { line: 3, column: 6 + MAX_NESTING - 1 }));
    }
}
