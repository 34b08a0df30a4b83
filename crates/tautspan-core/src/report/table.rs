//! A small builder for the report's tables: a header row that repeats on
//! every printed page and body rows kept whole across page breaks. Cells are
//! HTML fragments the caller has already escaped.

/// A table with a class, a header and rows of ready HTML cells.
pub fn table(class: &str, head: &[&str], rows: &[Vec<String>]) -> String {
    let head: String = head.iter().map(|h| format!("<th scope=\"col\">{h}</th>")).collect();
    let body: String = rows
        .iter()
        .map(|r| format!("<tr>{}</tr>", r.iter().map(|c| format!("<td>{c}</td>")).collect::<String>()))
        .collect();
    format!("<table class=\"{class}\"><thead><tr>{head}</tr></thead><tbody>{body}</tbody></table>")
}

/// A value with an explanatory note under it (both already escaped).
pub fn with_note(value: &str, note: &str) -> String {
    if note.is_empty() { value.to_string() } else { format!("{value}<span class=\"note\">{note}</span>") }
}

/// The placeholder for a value the results do not have.
pub const NONE: &str = "<span class=\"none\">–</span>";
