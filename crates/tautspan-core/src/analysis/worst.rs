//! The worst item of an analysis over every case: what the verdict line of
//! `check` and the app's verdict bar name. Over first, then unchecked,
//! then by utilisation; members (ropes among them), floors and rated parts
//! (fittings and anchor ratings) all count.

use super::results::{Analysis, State};

/// What kind of item the worst one is.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ItemKind {
    /// A member or a rope over sheaves.
    Member,
    /// A floor slab.
    Floor,
    /// A rated part: a fitting on a member or at a node, or an anchor's rating.
    Part,
}

/// The worst item and where it is worst.
#[derive(Debug, Clone, PartialEq)]
pub struct Worst {
    /// Its id (a part's is `host/part`, as in the comparison).
    pub id: String,
    /// A part's host: the member or node it belongs to; else the id itself.
    pub host: String,
    /// What it is.
    pub kind: ItemKind,
    /// The case where it is worst.
    pub case: String,
    /// Its state there.
    pub state: State,
    /// Its utilisation there.
    pub utilisation: f64,
}

/// How much an item weighs: over, then unchecked, then by utilisation.
fn rank(state: State, u: f64) -> (u8, f64) {
    let u = if u.is_finite() { u } else { 0.0 };
    match state {
        State::Over => (3, u),
        State::Unchecked => (2, u),
        _ => (1, u),
    }
}

/// The worst item over all cases, `None` when there is no item.
pub fn worst(a: &Analysis) -> Option<Worst> {
    let mut best: Option<Worst> = None;
    let mut consider = |w: Worst| {
        if best.as_ref().is_none_or(|b| rank(w.state, w.utilisation) > rank(b.state, b.utilisation)) {
            best = Some(w);
        }
    };
    for c in &a.cases {
        for m in &c.members {
            consider(Worst {
                id: m.id.clone(),
                host: m.id.clone(),
                kind: ItemKind::Member,
                case: c.id.clone(),
                state: m.state,
                utilisation: m.utilisation,
            });
        }
        for f in &c.floors {
            consider(Worst {
                id: f.id.clone(),
                host: f.id.clone(),
                kind: ItemKind::Floor,
                case: c.id.clone(),
                state: f.state,
                utilisation: f.utilisation,
            });
        }
        for (id, p) in c.part_ids().into_iter().zip(c.parts()) {
            let host = id.split('/').next().unwrap_or_default().to_string();
            consider(Worst {
                id,
                host,
                kind: ItemKind::Part,
                case: c.id.clone(),
                state: p.state,
                utilisation: p.utilisation,
            });
        }
    }
    best
}

impl Worst {
    /// How it stands: "unchecked", a percentage of its allowable with
    /// `digits` significant digits, or, where it has no allowable at all
    /// (a plain eye bolt pulled at an angle), "over" with that reason.
    pub fn amount(&self, digits: usize) -> String {
        match self.state {
            State::Unchecked => "unchecked".to_string(),
            State::Over if !self.utilisation.is_finite() => "over: loaded where it has no rating".to_string(),
            _ if !self.utilisation.is_finite() => "no allowable where it is".to_string(),
            _ => format!("{} % of its allowable", crate::units::format_number(self.utilisation * 100.0, digits)),
        }
    }

    /// One line for the verdict: "worst: rated part A/anchor in case s, 125.0 %".
    pub fn line(&self) -> String {
        let what = match self.kind {
            ItemKind::Member => "member",
            ItemKind::Floor => "floor",
            ItemKind::Part => "rated part",
        };
        format!("worst: {what} {} in case {}, {}", self.id, self.case, self.amount(4))
    }
}
