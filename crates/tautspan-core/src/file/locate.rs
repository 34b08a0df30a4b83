//! Where things are in a scenario file: a tolerant scan of the RON text that
//! records the line and column of every value under its path
//! (`members[2].area`, `nodes[0].at.1`), so that a validation error found
//! after parsing, or a parse error at a bare position, can name both the
//! field and its place. It never fails: on text it cannot follow it simply
//! records less.
//!
//! The scan runs only when an error needs a place, and keeps paths as a
//! tree (each value a parent and one step: `[2]`, `.area`, `.1`), written
//! out only for the errors that name them; a path is found by walking the
//! tree through a map, so locating every one of many errors costs the
//! length of each path, not the size of the file. Values nested deeper than
//! [`MAX_NESTING`] are not recorded (such a file is refused before parsing,
//! see `nesting.rs`), and a parse error's place is found by scanning only
//! up to it.

use std::collections::HashMap;
use std::sync::OnceLock;
use std::sync::atomic::{AtomicUsize, Ordering};

/// The deepest nesting of brackets a scenario file may have. A scenario
/// written by hand or by the app nests about 6 deep (`Scenario(` `members: [`
/// `Member(` `fittings: [` `EyeBolt(` `axis: (`).
pub const MAX_NESTING: usize = 32;

/// A line and column, both counted from 1 (columns in characters).
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub struct Location {
    /// Line, from 1.
    pub line: usize,
    /// Column, from 1.
    pub column: usize,
}

/// A multiply-rotate hasher for the index's small keys (ids and steps made
/// by the scan itself, so no defence against chosen collisions is needed
/// beyond what the table's growth gives): several times cheaper than the
/// default SipHash on millions of look-ups.
#[derive(Default, Clone, Copy)]
struct StepHasher(u64);

impl std::hash::Hasher for StepHasher {
    fn finish(&self) -> u64 {
        self.0
    }
    fn write(&mut self, bytes: &[u8]) {
        for chunk in bytes.chunks(8) {
            let mut w = [0u8; 8];
            w[..chunk.len()].copy_from_slice(chunk);
            self.write_u64(u64::from_le_bytes(w));
        }
    }
    fn write_u8(&mut self, n: u8) {
        self.write_u64(u64::from(n));
    }
    fn write_u32(&mut self, n: u32) {
        self.write_u64(u64::from(n));
    }
    fn write_u64(&mut self, n: u64) {
        self.0 = (self.0.rotate_left(5) ^ n).wrapping_mul(0x51_7c_c1_b7_27_22_0a_95);
    }
    fn write_usize(&mut self, n: usize) {
        self.write_u64(n as u64);
    }
}

type FastMap<K, V> = HashMap<K, V, std::hash::BuildHasherDefault<StepHasher>>;

/// One step of a path below its parent.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
enum Step {
    /// The whole file.
    Root,
    /// `[i]`: an element of a list.
    Index(u32),
    /// `.name` (or `name` at the top): a struct's field, by interned name.
    Field(u32),
    /// `.i`: an element of a tuple (or a struct's value without a name).
    Pos(u32),
}

/// The recorded values of a text (or of its start, up to a place).
#[derive(Debug, Default)]
struct Tree {
    names: Vec<String>,
    name_ids: FastMap<String, u32>,
    /// Per value: its parent and its step.
    nodes: Vec<(u32, Step)>,
    /// Per value: where it first appears.
    first_at: Vec<Location>,
    children: FastMap<(u32, Step), u32>,
    /// Every recorded token's place and value, in text order.
    entries: Vec<(Location, u32)>,
}

impl Tree {
    fn new() -> Tree {
        let mut t = Tree::default();
        t.nodes.push((0, Step::Root));
        t.first_at.push(Location { line: 1, column: 1 });
        t
    }

    fn name_id(&mut self, name: &str) -> u32 {
        if let Some(&id) = self.name_ids.get(name) {
            return id;
        }
        let id = self.names.len() as u32;
        self.names.push(name.to_string());
        self.name_ids.insert(name.to_string(), id);
        id
    }

    fn child(&mut self, parent: u32, step: Step, at: Location) -> u32 {
        if let Some(&c) = self.children.get(&(parent, step)) {
            return c;
        }
        let id = self.nodes.len() as u32;
        self.nodes.push((parent, step));
        self.first_at.push(at);
        self.children.insert((parent, step), id);
        id
    }

    fn record(&mut self, node: u32, at: Location) {
        if self.entries.is_empty() {
            self.first_at[0] = at;
        }
        self.entries.push((at, node));
    }

    fn path(&self, mut node: u32) -> String {
        let mut steps = Vec::new();
        while node != 0 {
            let (parent, step) = self.nodes[node as usize];
            steps.push(step);
            node = parent;
        }
        let mut out = String::new();
        for step in steps.iter().rev() {
            match *step {
                Step::Root => {}
                Step::Index(i) => out.push_str(&format!("[{i}]")),
                Step::Field(n) => {
                    if !out.is_empty() {
                        out.push('.');
                    }
                    out.push_str(&self.names[n as usize]);
                }
                Step::Pos(i) => out.push_str(&format!(".{i}")),
            }
        }
        out
    }
}

/// The index of value positions in one text. The scan runs on the first
/// question asked of it: a file that reads and validates never pays for it.
#[derive(Debug, Default)]
pub struct SpanIndex {
    text: String,
    tree: OnceLock<Tree>,
    /// Map look-ups made by [`SpanIndex::locate`] (for tests of its cost).
    lookups: AtomicUsize,
}

impl Clone for SpanIndex {
    fn clone(&self) -> SpanIndex {
        SpanIndex::scan(&self.text)
    }
}

#[derive(Debug, Clone, Copy, PartialEq)]
pub(super) enum Tok {
    /// An identifier, as a byte range of the text.
    Ident(usize, usize),
    Atom,
    Open(u8),
    Close,
    Colon,
    Comma,
}

/// A streaming tokenizer over the text's bytes, keeping line and column
/// (columns count characters: UTF-8 continuation bytes are not counted).
pub(super) struct Tokens<'a> {
    b: &'a [u8],
    i: usize,
    line: usize,
    col: usize,
}

impl<'a> Tokens<'a> {
    pub(super) fn new(text: &'a str) -> Tokens<'a> {
        Tokens { b: text.as_bytes(), i: 0, line: 1, col: 1 }
    }

    fn peek(&self, k: usize) -> Option<u8> {
        self.b.get(self.i + k).copied()
    }

    fn bump(&mut self) {
        if let Some(&c) = self.b.get(self.i) {
            self.i += 1;
            if c == b'\n' {
                self.line += 1;
                self.col = 1;
            } else if c & 0xC0 != 0x80 {
                self.col += 1;
            }
        }
    }

    fn here(&self) -> Location {
        Location { line: self.line, column: self.col }
    }

    /// Skip a quoted string or char starting at the quote `q`.
    fn quoted(&mut self, q: u8) {
        self.bump();
        while let Some(c) = self.peek(0) {
            if c == b'\\' {
                self.bump();
                self.bump();
            } else if c == q {
                self.bump();
                return;
            } else if q == b'\'' && c == b'\n' {
                return;
            } else {
                self.bump();
            }
        }
    }
}

impl Iterator for Tokens<'_> {
    type Item = (Tok, Location);

    fn next(&mut self) -> Option<(Tok, Location)> {
        loop {
            let c = self.peek(0)?;
            let here = self.here();
            if c.is_ascii_whitespace() {
                self.bump();
            } else if c == b'/' && self.peek(1) == Some(b'/') {
                while self.peek(0).is_some_and(|c| c != b'\n') {
                    self.bump();
                }
            } else if c == b'/' && self.peek(1) == Some(b'*') {
                let mut depth = 0usize;
                while let Some(c) = self.peek(0) {
                    if c == b'/' && self.peek(1) == Some(b'*') {
                        depth += 1;
                        self.bump();
                        self.bump();
                    } else if c == b'*' && self.peek(1) == Some(b'/') {
                        depth = depth.saturating_sub(1);
                        self.bump();
                        self.bump();
                        if depth == 0 {
                            break;
                        }
                    } else {
                        self.bump();
                    }
                }
            } else if c == b'"' || c == b'\'' {
                self.quoted(c);
                return Some((Tok::Atom, here));
            } else if matches!(c, b'(' | b'[' | b'{') {
                self.bump();
                return Some((Tok::Open(c), here));
            } else if matches!(c, b')' | b']' | b'}') {
                self.bump();
                return Some((Tok::Close, here));
            } else if c == b':' {
                self.bump();
                return Some((Tok::Colon, here));
            } else if c == b',' {
                self.bump();
                return Some((Tok::Comma, here));
            } else if c.is_ascii_alphabetic() || c == b'_' {
                let start = self.i;
                while self.peek(0).is_some_and(|c| c.is_ascii_alphanumeric() || c == b'_') {
                    self.bump();
                }
                let end = self.i;
                // raw strings r"…" / r#"…"#
                if end - start == 1 && self.b[start] == b'r' && matches!(self.peek(0), Some(b'"' | b'#')) {
                    let mut hashes = 0;
                    while self.peek(0) == Some(b'#') {
                        hashes += 1;
                        self.bump();
                    }
                    if self.peek(0) == Some(b'"') {
                        self.bump();
                        while let Some(c) = self.peek(0) {
                            if c == b'"' && (1..=hashes).all(|k| self.peek(k) == Some(b'#')) {
                                for _ in 0..=hashes {
                                    self.bump();
                                }
                                break;
                            }
                            self.bump();
                        }
                    }
                    return Some((Tok::Atom, here));
                }
                return Some((Tok::Ident(start, end), here));
            } else {
                // numbers and anything else: one atom up to a delimiter
                let start = self.i;
                while self.peek(0).is_some_and(|c| !c.is_ascii_whitespace() && !b"()[]{}:,\"'".contains(&c)) {
                    self.bump();
                }
                if self.i == start {
                    self.bump();
                }
                return Some((Tok::Atom, here));
            }
        }
    }
}

#[derive(Debug)]
struct Frame {
    node: u32,
    list: bool,
    index: u32,
    field: Option<u32>,
}

/// The value a token at the top of `stack` stands for.
fn child_of(tree: &mut Tree, stack: &[Frame], at: Location) -> u32 {
    match stack.last() {
        None => 0,
        Some(f) if f.list => tree.child(f.node, Step::Index(f.index), at),
        Some(f) => match f.field {
            Some(name) => tree.child(f.node, Step::Field(name), at),
            None => tree.child(f.node, Step::Pos(f.index), at),
        },
    }
}

/// Every value's place in `text`, up to the first token after `until`.
fn scan_tree(text: &str, until: Option<Location>) -> Tree {
    let mut tree = Tree::new();
    let mut toks = Tokens::new(text).peekable();
    let mut stack: Vec<Frame> = Vec::new();
    // brackets open beyond MAX_NESTING: nothing inside them is recorded
    let mut beyond = 0usize;
    while let Some((tok, at)) = toks.next() {
        if until.is_some_and(|u| at > u) {
            break;
        }
        if beyond > 0 {
            match tok {
                Tok::Open(_) => beyond += 1,
                Tok::Close => beyond -= 1,
                _ => {}
            }
            continue;
        }
        let next = toks.peek().map(|t| t.0);
        match tok {
            Tok::Ident(s, e) if next == Some(Tok::Colon) && stack.last().is_some_and(|f| !f.list) => {
                let name = tree.name_id(&text[s..e]);
                if let Some(f) = stack.last_mut() {
                    f.field = Some(name);
                }
                let node = child_of(&mut tree, &stack, at);
                tree.record(node, at);
                toks.next();
            }
            Tok::Ident(..) if next == Some(Tok::Open(b'(')) => {
                let node = child_of(&mut tree, &stack, at);
                tree.record(node, at);
                toks.next();
                if stack.len() < MAX_NESTING {
                    stack.push(Frame { node, list: false, index: 0, field: None });
                } else {
                    beyond = 1;
                }
            }
            Tok::Ident(..) | Tok::Atom => {
                let node = child_of(&mut tree, &stack, at);
                tree.record(node, at);
            }
            Tok::Open(c) => {
                let node = child_of(&mut tree, &stack, at);
                tree.record(node, at);
                if stack.len() < MAX_NESTING {
                    stack.push(Frame { node, list: c == b'[', index: 0, field: None });
                } else {
                    beyond = 1;
                }
            }
            Tok::Close => {
                stack.pop();
            }
            Tok::Comma => {
                if let Some(f) = stack.last_mut() {
                    f.index = f.index.saturating_add(1);
                    f.field = None;
                }
            }
            Tok::Colon => {}
        }
    }
    tree
}

/// The steps of a written path (`members[2].ends.0`), or `None` at the
/// first step that cannot be read.
fn parse_path(path: &str) -> Vec<PathStep<'_>> {
    let mut out = Vec::new();
    let b = path.as_bytes();
    let mut i = 0;
    while i < b.len() {
        match b[i] {
            b'[' => {
                let end = path[i..].find(']').map_or(b.len(), |k| i + k);
                match path[i + 1..end].parse::<u32>() {
                    Ok(n) => out.push(PathStep::Index(n)),
                    Err(_) => return out,
                }
                i = end + 1;
            }
            b'.' => i += 1,
            _ => {
                let end = path[i..].find(['.', '[']).map_or(b.len(), |k| i + k);
                let word = &path[i..end];
                out.push(match word.parse::<u32>() {
                    Ok(n) => PathStep::Pos(n),
                    Err(_) => PathStep::Field(word),
                });
                i = end;
            }
        }
    }
    out
}

enum PathStep<'a> {
    Index(u32),
    Field(&'a str),
    Pos(u32),
}

impl SpanIndex {
    /// The index of `text` (scanned when first asked). Never fails; an
    /// unreadable tail simply records nothing.
    pub fn scan(text: &str) -> SpanIndex {
        SpanIndex { text: text.to_string(), tree: OnceLock::new(), lookups: AtomicUsize::new(0) }
    }

    fn tree(&self) -> &Tree {
        self.tree.get_or_init(|| scan_tree(&self.text, None))
    }

    /// Where the value at `path` starts; for a path the text lacks (a
    /// missing field), the nearest enclosing value that it has.
    pub fn locate(&self, path: &str) -> Option<Location> {
        let tree = self.tree();
        let mut node = 0u32;
        for step in parse_path(path) {
            let step = match step {
                PathStep::Index(i) => Step::Index(i),
                PathStep::Pos(i) => Step::Pos(i),
                PathStep::Field(name) => match tree.name_ids.get(name) {
                    Some(&n) => Step::Field(n),
                    None => break,
                },
            };
            self.lookups.fetch_add(1, Ordering::Relaxed);
            match tree.children.get(&(node, step)) {
                Some(&c) => node = c,
                None => break,
            }
        }
        if tree.entries.is_empty() {
            return None;
        }
        Some(tree.first_at[node as usize])
    }

    /// The path of the value at or just before a location (for errors the
    /// parser reports by position only). Scans only up to the location
    /// unless the whole text has been scanned already.
    pub fn path_at(&self, at: Location) -> Option<String> {
        let partial;
        let tree = match self.tree.get() {
            Some(t) => t,
            None => {
                partial = scan_tree(&self.text, Some(at));
                &partial
            }
        };
        let k = tree.entries.partition_point(|e| e.0 <= at);
        let node = tree.entries.get(k.checked_sub(1)?)?.1;
        Some(tree.path(node)).filter(|p| !p.is_empty())
    }

    /// Where the bracketed value closing at `close` (or at the first
    /// closing bracket after it) opens: its name for `Name(…)`, else its
    /// bracket. For errors the parser reports at a struct's end, such as a
    /// missing field.
    pub fn opening_of(&self, close: Location) -> Option<Location> {
        let mut stack: Vec<Location> = Vec::new();
        let mut last_ident: Option<Location> = None;
        for (tok, at) in Tokens::new(&self.text) {
            match tok {
                Tok::Open(_) => stack.push(last_ident.take().unwrap_or(at)),
                Tok::Close if at >= close => return stack.pop(),
                Tok::Close => {
                    stack.pop();
                }
                _ => {}
            }
            last_ident = if let Tok::Ident(..) = tok { Some(at) } else { None };
        }
        None
    }

    /// Map look-ups made by [`SpanIndex::locate`] so far: the work of
    /// locating errors, for tests that it grows with the errors' path
    /// lengths and not with the file.
    pub fn lookups(&self) -> usize {
        self.lookups.load(Ordering::Relaxed)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn records_paths() {
        let text = "Scenario(\n  format: 1,\n  nodes: [\n    Node(id: \"A\", at: (\"0 m\", \"6 m\"), support: Anchor),\n    Node(id: \"B\", at: (\"0 m\", \"2 m\")), // c\n  ],\n  cases: [ Static(id: \"s\") ],\n)\n";
        let idx = SpanIndex::scan(text);
        assert_eq!(idx.path_at(Location { line: 5, column: 33 }).as_deref(), Some("nodes[1].at.1"));
        assert_eq!(idx.locate("format"), Some(Location { line: 2, column: 3 }));
        assert_eq!(idx.locate("nodes[1].at.1"), Some(Location { line: 5, column: 31 }));
        assert_eq!(idx.locate("nodes[0].support"), Some(Location { line: 4, column: 39 }));
        assert_eq!(idx.locate("cases[0].id"), Some(Location { line: 7, column: 19 }));
        // a missing field falls back to its enclosing value
        assert_eq!(idx.locate("nodes[1].support"), Some(Location { line: 5, column: 5 }));
        assert_eq!(idx.locate("nothing"), Some(Location { line: 1, column: 1 }));
        assert_eq!(idx.path_at(Location { line: 5, column: 33 }).as_deref(), Some("nodes[1].at.1"));
        assert_eq!(idx.path_at(Location { line: 2, column: 11 }).as_deref(), Some("format"));
        // a struct's opening from its closing bracket
        assert_eq!(idx.opening_of(Location { line: 5, column: 37 }), Some(Location { line: 5, column: 5 }));
        assert_eq!(idx.opening_of(Location { line: 5, column: 36 }), Some(Location { line: 5, column: 23 }));
        assert_eq!(idx.opening_of(Location { line: 8, column: 1 }), Some(Location { line: 1, column: 1 }));
        // columns count characters, not bytes
        let idx = SpanIndex::scan("S(title: \"é\", format: 1)");
        assert_eq!(idx.locate("format"), Some(Location { line: 1, column: 15 }));
    }

    #[test]
    fn deep_nesting_is_not_recorded_and_costs_nothing_per_level() {
        let text = format!("S(a: {}1{}, b: 2)", "[".repeat(100_000), "]".repeat(100_000));
        let idx = SpanIndex::scan(&text);
        // the value after the deep one is still found where it is
        assert_eq!(idx.locate("b"), Some(Location { line: 1, column: 200_009 }));
        let tree = idx.tree();
        assert!(tree.entries.len() < 2 * MAX_NESTING + 10, "{} entries", tree.entries.len());
    }

    // Locating an error walks the path through the map: 100,000 errors in a
    // 100,000-member file take 4 look-ups each (members, [i], ends, 0), not
    // a search of the file's 1.7 million entries each.
    #[test]
    fn locating_many_errors_costs_their_path_lengths() {
        let n = 100_000;
        let mut text = String::from("Scenario(members: [\n");
        for i in 0..n {
            text.push_str(&format!("  Member(id: \"m{i}\", ends: (\"x{i}\", \"y{i}\")),\n"));
        }
        text.push_str("])\n");
        let idx = SpanIndex::scan(&text);
        for i in (0..n).rev() {
            let at = idx.locate(&format!("members[{i}].ends.0"));
            assert_eq!(at, Some(Location { line: i + 2, column: 26 + i.to_string().len() }));
        }
        assert_eq!(idx.lookups(), 4 * n);
    }
}
