//! Escaping of user text (titles, notes, ids, messages) for HTML and inline
//! SVG. Everything that did not come from this module's own literals goes
//! through [`escape`] before it reaches the document.

/// Escape text for HTML element content and quoted attribute values alike:
/// `&`, `<`, `>`, `"` and `'` become character references, and control
/// characters other than tab and newline are dropped (they are not allowed
/// in HTML text).
pub fn escape(text: &str) -> String {
    let mut out = String::with_capacity(text.len() + text.len() / 8);
    for c in text.chars() {
        match c {
            '&' => out.push_str("&amp;"),
            '<' => out.push_str("&lt;"),
            '>' => out.push_str("&gt;"),
            '"' => out.push_str("&quot;"),
            '\'' => out.push_str("&#39;"),
            '\t' | '\n' => out.push(c),
            '\r' => {}
            c if c.is_control() => {}
            c => out.push(c),
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::escape;

    #[test]
    fn escapes_markup_and_quotes() {
        assert_eq!(
            escape("<script>alert('x') & \"y\"</script>"),
            "&lt;script&gt;alert(&#39;x&#39;) &amp; &quot;y&quot;&lt;/script&gt;"
        );
    }

    #[test]
    fn drops_control_characters_keeps_newlines() {
        assert_eq!(escape("a\u{0}b\r\nc\u{7}"), "ab\nc");
    }
}
