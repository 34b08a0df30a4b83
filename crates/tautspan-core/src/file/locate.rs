//! Where things are in a scenario file: a tolerant scan of the RON text that
//! records the line and column of every value under its path
//! (`members[2].area`, `nodes[0].at.1`), so that a validation error found
//! after parsing, or a parse error at a bare position, can name both the
//! field and its place. It never fails: on text it cannot follow it simply
//! records less.

/// A line and column, both counted from 1 (columns in characters).
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord)]
pub struct Location {
    /// Line, from 1.
    pub line: usize,
    /// Column, from 1.
    pub column: usize,
}

#[derive(Debug, Clone)]
struct Entry {
    path: String,
    at: Location,
}

/// The index of value positions in one text. The scan runs on the first
/// question asked of it: a file that reads and validates never pays for it.
#[derive(Debug, Clone, Default)]
pub struct SpanIndex {
    text: String,
    entries: std::sync::OnceLock<Vec<Entry>>,
}

#[derive(Debug, Clone, PartialEq)]
enum Tok {
    Ident(String),
    Atom,
    Open(char),
    Close,
    Colon,
    Comma,
}

fn tokenize(text: &str) -> Vec<(Tok, Location)> {
    let chars: Vec<char> = text.chars().collect();
    let mut out = Vec::new();
    let (mut i, mut line, mut col) = (0usize, 1usize, 1usize);
    let advance = |i: &mut usize, line: &mut usize, col: &mut usize| {
        let c = chars[*i];
        *i += 1;
        if c == '\n' {
            *line += 1;
            *col = 1;
        } else {
            *col += 1;
        }
    };
    while i < chars.len() {
        let c = chars[i];
        let here = Location { line, column: col };
        if c.is_whitespace() {
            advance(&mut i, &mut line, &mut col);
        } else if c == '/' && chars.get(i + 1) == Some(&'/') {
            while i < chars.len() && chars[i] != '\n' {
                advance(&mut i, &mut line, &mut col);
            }
        } else if c == '/' && chars.get(i + 1) == Some(&'*') {
            let mut depth = 0usize;
            while i < chars.len() {
                if chars[i] == '/' && chars.get(i + 1) == Some(&'*') {
                    depth += 1;
                    advance(&mut i, &mut line, &mut col);
                    advance(&mut i, &mut line, &mut col);
                } else if chars[i] == '*' && chars.get(i + 1) == Some(&'/') {
                    depth = depth.saturating_sub(1);
                    advance(&mut i, &mut line, &mut col);
                    advance(&mut i, &mut line, &mut col);
                    if depth == 0 {
                        break;
                    }
                } else {
                    advance(&mut i, &mut line, &mut col);
                }
            }
        } else if c == '"' {
            advance(&mut i, &mut line, &mut col);
            while i < chars.len() && chars[i] != '"' {
                if chars[i] == '\\' {
                    advance(&mut i, &mut line, &mut col);
                    if i < chars.len() {
                        advance(&mut i, &mut line, &mut col);
                    }
                } else {
                    advance(&mut i, &mut line, &mut col);
                }
            }
            if i < chars.len() {
                advance(&mut i, &mut line, &mut col);
            }
            out.push((Tok::Atom, here));
        } else if matches!(c, '(' | '[' | '{') {
            advance(&mut i, &mut line, &mut col);
            out.push((Tok::Open(c), here));
        } else if matches!(c, ')' | ']' | '}') {
            advance(&mut i, &mut line, &mut col);
            out.push((Tok::Close, here));
        } else if c == ':' {
            advance(&mut i, &mut line, &mut col);
            out.push((Tok::Colon, here));
        } else if c == ',' {
            advance(&mut i, &mut line, &mut col);
            out.push((Tok::Comma, here));
        } else if c.is_alphabetic() || c == '_' {
            let mut s = String::new();
            while i < chars.len() && (chars[i].is_alphanumeric() || chars[i] == '_') {
                s.push(chars[i]);
                advance(&mut i, &mut line, &mut col);
            }
            // raw strings r"…" / r#"…"#
            if s == "r" && i < chars.len() && (chars[i] == '"' || chars[i] == '#') {
                let mut hashes = 0;
                while i < chars.len() && chars[i] == '#' {
                    hashes += 1;
                    advance(&mut i, &mut line, &mut col);
                }
                if i < chars.len() && chars[i] == '"' {
                    advance(&mut i, &mut line, &mut col);
                    loop {
                        if i >= chars.len() {
                            break;
                        }
                        if chars[i] == '"' && (1..=hashes).all(|k| chars.get(i + k) == Some(&'#')) {
                            for _ in 0..=hashes {
                                advance(&mut i, &mut line, &mut col);
                            }
                            break;
                        }
                        advance(&mut i, &mut line, &mut col);
                    }
                }
                out.push((Tok::Atom, here));
            } else {
                out.push((Tok::Ident(s), here));
            }
        } else {
            // numbers and anything else: one atom up to a delimiter
            while i < chars.len() && !chars[i].is_whitespace() && !"()[]{}:,\"".contains(chars[i]) {
                advance(&mut i, &mut line, &mut col);
            }
            if i < chars.len() && here == (Location { line, column: col }) {
                advance(&mut i, &mut line, &mut col);
            }
            out.push((Tok::Atom, here));
        }
    }
    out
}

#[derive(Debug)]
struct Frame {
    path: String,
    list: bool,
    index: usize,
    field: Option<String>,
}

fn child_path(frame: Option<&Frame>) -> String {
    match frame {
        None => String::new(),
        Some(f) if f.list => format!("{}[{}]", f.path, f.index),
        Some(f) => match &f.field {
            Some(name) if f.path.is_empty() => name.clone(),
            Some(name) => format!("{}.{}", f.path, name),
            None => format!("{}.{}", f.path, f.index),
        },
    }
}

impl SpanIndex {
    /// The index of `text` (scanned when first asked). Never fails; an
    /// unreadable tail simply records nothing.
    pub fn scan(text: &str) -> SpanIndex {
        SpanIndex { text: text.to_string(), entries: std::sync::OnceLock::new() }
    }

    fn entries(&self) -> &[Entry] {
        self.entries.get_or_init(|| scan_entries(&self.text))
    }
}

/// Every value's path and place in `text`.
fn scan_entries(text: &str) -> Vec<Entry> {
    let toks = tokenize(text);
    let mut entries = Vec::new();
    let mut stack: Vec<Frame> = Vec::new();
    let mut k = 0;
    // cap the depth so a hostile file cannot make the index quadratic
    const MAX_DEPTH: usize = 256;
    while k < toks.len() {
        let (tok, at) = (&toks[k].0, toks[k].1);
        match tok {
            Tok::Ident(name)
                if matches!(toks.get(k + 1), Some((Tok::Colon, _))) && stack.last().is_some_and(|f| !f.list) =>
            {
                if let Some(f) = stack.last_mut() {
                    f.field = Some(name.clone());
                }
                entries.push(Entry { path: child_path(stack.last()), at });
                k += 2;
                continue;
            }
            Tok::Ident(_) if matches!(toks.get(k + 1), Some((Tok::Open('('), _))) => {
                let path = child_path(stack.last());
                entries.push(Entry { path: path.clone(), at });
                if stack.len() < MAX_DEPTH {
                    stack.push(Frame { path, list: false, index: 0, field: None });
                }
                k += 2;
                continue;
            }
            Tok::Ident(_) | Tok::Atom => {
                entries.push(Entry { path: child_path(stack.last()), at });
            }
            Tok::Open(c) => {
                let path = child_path(stack.last());
                entries.push(Entry { path: path.clone(), at });
                if stack.len() < MAX_DEPTH {
                    stack.push(Frame { path, list: *c == '[', index: 0, field: None });
                }
            }
            Tok::Close => {
                stack.pop();
            }
            Tok::Comma => {
                if let Some(f) = stack.last_mut() {
                    f.index += 1;
                    f.field = None;
                }
            }
            Tok::Colon => {}
        }
        k += 1;
    }
    entries
}

impl SpanIndex {
    /// Where the value at `path` starts; for a path the text lacks (a
    /// missing field), the nearest enclosing value that it has.
    pub fn locate(&self, path: &str) -> Option<Location> {
        let mut p = path.to_string();
        loop {
            if let Some(e) = self.entries().iter().find(|e| e.path == p) {
                return Some(e.at);
            }
            let cut = p.rfind(['.', '['])?;
            p.truncate(cut);
            if p.is_empty() {
                return self.entries().first().map(|e| e.at);
            }
        }
    }

    /// The path of the value at or just before a location (for errors the
    /// parser reports by position only).
    pub fn path_at(&self, at: Location) -> Option<&str> {
        self.entries().iter().rev().find(|e| e.at <= at).map(|e| e.path.as_str()).filter(|p| !p.is_empty())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn records_paths() {
        let text = "Scenario(\n  format: 1,\n  nodes: [\n    Node(id: \"A\", at: (\"0 m\", \"6 m\"), support: Anchor),\n    Node(id: \"B\", at: (\"0 m\", \"2 m\")), // c\n  ],\n  cases: [ Static(id: \"s\") ],\n)\n";
        let idx = SpanIndex::scan(text);
        assert_eq!(idx.locate("format"), Some(Location { line: 2, column: 3 }));
        assert_eq!(idx.locate("nodes[1].at.1"), Some(Location { line: 5, column: 31 }));
        assert_eq!(idx.locate("nodes[0].support"), Some(Location { line: 4, column: 39 }));
        assert_eq!(idx.locate("cases[0].id"), Some(Location { line: 7, column: 19 }));
        // a missing field falls back to its enclosing value
        assert_eq!(idx.locate("nodes[1].support"), Some(Location { line: 5, column: 5 }));
        assert_eq!(idx.path_at(Location { line: 5, column: 33 }), Some("nodes[1].at.1"));
    }
}
