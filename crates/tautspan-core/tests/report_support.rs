//! Shared by the report tests: small scenarios and a tag-balance checker.

#![allow(dead_code, reason = "each test file uses part of the support")]

use tautspan_core::model::{Scenario, load_scenario};

/// One wire rope from an anchor to a joint with a mass; all four cases.
pub const SINGLE: &str = r#"Scenario(
    format: 1,
    title: "Single sling",
    notes: "Notes for a colleague.",
    nodes: [
        Node(id: "A1", at: ("0 m", "6 m"), support: Anchor),
        Node(id: "J1", at: ("0 m", "2 m")),
    ],
    members: [
        Member(id: "sling", ends: ("A1", "J1"), kind: WireRope,
               area: "64.7 mm^2", modulus: "100 GPa",
               rating: BreakingStrength("90.7 kN")),
    ],
    masses: [ Mass(id: "load", at: "J1", mass: "250 kg") ],
    cases: [
        Static(id: "hanging"),
        Swing(id: "swing", mass: "load", release: "40 deg"),
        Drop(id: "snatch", mass: "load", height: "0.3 m"),
        Sudden(id: "sudden", mass: "load"),
    ],
)"#;

/// Two legs of a bridle to a joint, a tag chain, and a steel rod propping
/// the joint off a floor slab.
pub const BRIDLE: &str = r#"Scenario(
    format: 1,
    title: "Bridle over the loading bay",
    notes: "Two legs from the beam clamps,\na prop onto the slab.",
    nodes: [
        Node(id: "A1", at: ("-2 m", "5 m"), support: Anchor),
        Node(id: "A2", at: ("2.5 m", "5 m"), support: Anchor),
        Node(id: "J1", at: ("0 m", "3 m")),
        Node(id: "P1", at: ("0.5 m", "0 m"), support: Floor("slab-1")),
    ],
    members: [
        Member(id: "leg-1", ends: ("A1", "J1"), kind: WireRope,
               diameter: "10 mm", construction: "6x19 IWRC", grade: "1770"),
        Member(id: "leg-2", ends: ("A2", "J1"), kind: Chain,
               diameter: "8 mm", grade: "80", rating: BreakingStrength("80.4 kN"), design_factor: 3.5),
        Member(id: "prop", ends: ("J1", "P1"), kind: Rod,
               section: SolidRound(diameter: "30 mm"), material: "steel"),
    ],
    floors: [
        Floor(id: "slab-1", span: ("4 m", "4 m"), thickness: "150 mm",
              modulus: "30 GPa", poisson: 0.2, edges: SimplySupported,
              rated_uniform: "2.4 kPa", rated_point: "8.9 kN", pad: ("0.3 m", "0.3 m")),
    ],
    masses: [ Mass(id: "load", at: "J1", mass: "400 kg") ],
    cases: [
        Static(id: "hanging"),
        Swing(id: "swing", mass: "load", release: "20 deg", pivot: "A1"),
        Sudden(id: "sudden", mass: "load"),
    ],
)"#;

/// Load a scenario or fail with its errors.
pub fn load(text: &str) -> Scenario {
    match load_scenario(text) {
        Ok(l) => l.scenario,
        Err(e) => panic!("scenario does not load: {e:?}"),
    }
}

const VOID: [&str; 8] = ["meta", "br", "hr", "img", "input", "link", "col", "wbr"];

/// Every element closed in order, void elements unclosed, SVG elements
/// self-closed or closed, every `&` a character reference, `<style>` holding
/// no markup, attribute values quoted.
pub fn assert_well_formed(doc: &str) {
    let mut stack: Vec<String> = Vec::new();
    let mut rest = doc;
    let mut offset = 0;
    while let Some(lt) = rest.find('<') {
        check_text(&rest[..lt], offset);
        let after = &rest[lt..];
        let gt = after.find('>').unwrap_or_else(|| panic!("unclosed '<' at {}", offset + lt));
        let tag = &after[1..gt];
        let consumed;
        if tag.starts_with('!') {
            consumed = lt + gt + 1;
        } else if let Some(name) = tag.strip_prefix('/') {
            let name = name.trim().to_ascii_lowercase();
            let open = stack.pop().unwrap_or_else(|| panic!("</{name}> with nothing open at {}", offset + lt));
            assert_eq!(open, name, "</{name}> closes <{open}> at {}", offset + lt);
            consumed = lt + gt + 1;
        } else {
            let name: String = tag
                .chars()
                .take_while(|c| c.is_ascii_alphanumeric() || *c == '-')
                .collect::<String>()
                .to_ascii_lowercase();
            assert!(!name.is_empty(), "bad tag <{tag}> at {}", offset + lt);
            check_attributes(tag, offset + lt);
            if name == "style" {
                let Some(close) = after.find("</style>") else { panic!("<style> not closed") };
                assert!(!after[gt + 1..close].contains('<'), "markup inside <style>");
                consumed = lt + close + "</style>".len();
            } else {
                if !tag.ends_with('/') && !VOID.contains(&name.as_str()) {
                    stack.push(name);
                }
                consumed = lt + gt + 1;
            }
        }
        offset += consumed;
        rest = &rest[consumed..];
    }
    check_text(rest, offset);
    assert!(stack.is_empty(), "unclosed elements: {stack:?}");
}

fn check_text(text: &str, offset: usize) {
    assert!(!text.contains('>'), "stray '>' in text at {offset}: {text:?}");
    for (i, _) in text.match_indices('&') {
        let r = &text[i + 1..];
        let end = r.find(';').unwrap_or_else(|| panic!("bare '&' at {}", offset + i));
        let name = &r[..end];
        let ok = (name.starts_with('#') && name[1..].chars().all(|c| c.is_ascii_digit()) && end > 1)
            || (!name.is_empty() && name.chars().all(|c| c.is_ascii_alphanumeric()));
        assert!(ok, "bad character reference &{name}; at {}", offset + i);
    }
}

fn check_attributes(tag: &str, offset: usize) {
    // Every `=` in a tag is followed by a double-quoted value, and quotes pair.
    assert_eq!(tag.matches('"').count() % 2, 0, "unpaired quote in <{tag}> at {offset}");
    let mut inside = false;
    let bytes = tag.as_bytes();
    for (i, &b) in bytes.iter().enumerate() {
        match b {
            b'"' => inside = !inside,
            b'=' if !inside => assert_eq!(bytes.get(i + 1), Some(&b'"'), "unquoted attribute in <{tag}> at {offset}"),
            b'<' if !inside => panic!("'<' inside a tag at {offset}"),
            _ => {}
        }
    }
}
