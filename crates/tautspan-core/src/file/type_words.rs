//! The file reader's messages name what a person wrote, never a Rust type:
//! ron names the type it was reading (`SupportDto`, `MemberKind`); this
//! turns such a name into plain words ("support", "member kind").

/// A type name in plain words: a `Dto` suffix dropped, the CamelCase split
/// into lower-case words (`SupportDto` → "support", `MemberKind` → "member
/// kind", `Scenario` → "scenario").
pub fn type_words(type_name: &str) -> String {
    let name = type_name.strip_suffix("Dto").filter(|n| !n.is_empty()).unwrap_or(type_name);
    let mut out = String::with_capacity(name.len() + 4);
    for (i, c) in name.chars().enumerate() {
        if c.is_uppercase() {
            if i > 0 {
                out.push(' ');
            }
            out.extend(c.to_lowercase());
        } else {
            out.push(c);
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn type_names_become_words() {
        let cases = [
            ("SupportDto", "support"),
            ("MemberKind", "member kind"),
            ("CaseDto", "case"),
            ("Scenario", "scenario"),
            ("FittingDto", "fitting"),
            ("Dto", "dto"),
            ("hitch", "hitch"),
        ];
        for (name, words) in cases {
            assert_eq!(type_words(name), words, "{name}");
        }
    }
}
