//! Fields holding text that is not (yet) a valid value: the document keeps
//! the last valid one, so the results shown are stale for as long as such
//! text stands, and a save would silently write the old value. Named here
//! for people: "the area of member leg-west holds \"12 mx\"".

use crate::fields::qty_field::FieldBuffers;
use tautspan_core::file::ScenarioDto;

/// What a list in the file holds, in words, and the id of its item `i`.
fn item(dto: &ScenarioDto, list: &str, i: usize) -> Option<String> {
    let (noun, id) = match list {
        "members" => ("member", dto.members.get(i)?.id.as_str()),
        "ropes" => ("rope", dto.ropes.get(i)?.id.as_str()),
        "nodes" => ("node", dto.nodes.get(i)?.id.as_str()),
        "floors" => ("floor", dto.floors.get(i)?.id.as_str()),
        "masses" => ("mass", dto.masses.get(i)?.id.as_str()),
        "cases" => ("case", dto.cases.get(i)?.id()),
        _ => return None,
    };
    Some(format!("{noun} {id}"))
}

/// A field path (`members[2].fittings[0].wll`) in words: "wll of fittings[0] of member leg-west".
pub fn describe_path(dto: &ScenarioDto, path: &str) -> String {
    let Some((head, rest)) = path.split_once('.') else { return path.to_string() };
    let parsed = head.split_once('[').and_then(|(list, i)| Some((list, i.strip_suffix(']')?.parse::<usize>().ok()?)));
    match parsed.and_then(|(list, i)| item(dto, list, i)) {
        Some(owner) => {
            let field: Vec<&str> = rest.rsplit('.').collect();
            format!("the {} of {owner}", field.join(" of ").replace('_', " "))
        }
        None => format!("the field {path}"),
    }
}

/// Every field whose text is not a valid value, in words, with the text.
/// A rename being typed counts when it is refused or not yet applied.
pub fn invalid_fields(bufs: &FieldBuffers, dto: &ScenarioDto) -> Vec<String> {
    bufs.entries()
        .into_iter()
        .filter_map(|(key, text)| match key.strip_prefix("rename:") {
            Some(r) => {
                let (noun, old) = r.split_once(':')?;
                (text.trim() != old).then(|| format!("the id of {noun} {old} (\"{text}\" is not applied)"))
            }
            None => Some(format!("{} holds \"{text}\"", describe_path(dto, key))),
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn paths_are_named_by_their_item() {
        let loaded = tautspan_core::model::load_scenario(crate::DEMO_SCENARIO).unwrap_or_else(|e| panic!("{e}"));
        let d = &loaded.dto;
        let first = d.members[0].id.clone();
        assert_eq!(describe_path(d, "members[0].area"), format!("the area of member {first}"));
        assert_eq!(describe_path(d, "members[0].fittings[1].wll"), format!("the wll of fittings[1] of member {first}"));
        assert_eq!(describe_path(d, "members[99].area"), "the field members[99].area");
        let mut b = FieldBuffers::default();
        b.put("members[0].design_factor", "x5");
        b.put(&format!("rename:member:{first}"), &first);
        assert_eq!(invalid_fields(&b, d), [format!("the design factor of member {first} holds \"x5\"")]);
    }
}
