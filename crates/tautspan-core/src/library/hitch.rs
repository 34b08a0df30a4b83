//! How a sling is hitched (straight, choker, basket) and the mode factor on
//! its allowable, by rule set. Rules are data: one table per rule set, each
//! value with its source. The values are from memory of the common practice
//! tables of EN 13414-1 (wire rope slings), EN 1492-1 (textile slings) and
//! EN 818-4 (chain slings), and of the ASME B30.9 choke-angle reduction
//! (REFERENCES "Hitches, terminations"); they were not re-read.
//!
//! A basket is modelled as one member: the member stands for the whole
//! basket's pull (both parts of the sling around the load, taken together),
//! so its allowable is the single sling's allowable × the basket mode factor.
//! A choker is one member from the choke to the upper end; its allowable is
//! the sling's allowable × the choke mode factor (under ASME rules, × the
//! choke-angle reduction as well).

use serde::{Deserialize, Serialize};

/// A sling's hitch as written in a file (`hitch: Choker`).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum Hitch {
    /// Straight (vertical) pull on the sling.
    Straight,
    /// Choker: the sling passes round the load and through its own eye.
    Choker,
    /// Basket: the sling passes under the load, both ends at the hook.
    Basket,
}

/// The rule set for mode factors (`rules: EN` or `rules: ASME`); EN when
/// the scenario does not say.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default, Serialize, Deserialize)]
pub enum Rules {
    /// EN 13414-1 / EN 1492-1 / EN 818-4 mode factors.
    #[default]
    #[serde(rename = "EN")]
    En,
    /// EN mode factors with the ASME B30.9 choke-angle reduction on chokers.
    #[serde(rename = "ASME")]
    Asme,
}

impl Rules {
    /// Plain name.
    pub fn label(self) -> &'static str {
        match self {
            Rules::En => "EN (EN 13414-1, EN 1492-1, EN 818-4)",
            Rules::Asme => "ASME (B30.9 choke-angle reduction)",
        }
    }
}

/// One row of a mode-factor table.
struct ModeRow {
    hitch: Hitch,
    label: &'static str,
    factor: f64,
    source: &'static str,
}

/// EN mode factors (basket: legs parallel, vertical).
const EN_MODE: [ModeRow; 3] = [
    ModeRow {
        hitch: Hitch::Straight,
        label: "straight",
        factor: 1.0,
        source: "EN 13414-1 / EN 1492-1 / EN 818-4 mode factor, straight (from memory)",
    },
    ModeRow {
        hitch: Hitch::Choker,
        label: "choker",
        factor: 0.8,
        source: "EN 13414-1 / EN 1492-1 / EN 818-4 mode factor, choked (from memory)",
    },
    ModeRow {
        hitch: Hitch::Basket,
        label: "basket, legs parallel",
        factor: 2.0,
        source: "EN 13414-1 / EN 1492-1 / EN 818-4 mode factor, basket with parallel legs (from memory)",
    },
];

/// EN basket with its legs 0°–45° from vertical (not parallel).
const EN_BASKET_ANGLED: (f64, f64, &str) =
    (45.0, 1.4, "EN 13414-1 / EN 1492-1 / EN 818-4 mode factor, basket 0-45 deg from vertical (from memory)");

/// One row of the ASME B30.9 choke-angle reduction: angles from `from_deg`
/// (inclusive, or exclusive where `exclusive`) up to the next row.
struct ChokeRow {
    from_deg: f64,
    exclusive: bool,
    factor: f64,
    source: &'static str,
}

/// ASME B30.9 choke-angle reduction on the choker rating, highest first.
const ASME_CHOKE: [ChokeRow; 4] = [
    ChokeRow {
        from_deg: 120.0,
        exclusive: true,
        factor: 1.00,
        source: "ASME B30.9 choke angle over 120 deg (from memory)",
    },
    ChokeRow {
        from_deg: 90.0,
        exclusive: false,
        factor: 0.87,
        source: "ASME B30.9 choke angle 90-120 deg (from memory)",
    },
    ChokeRow {
        from_deg: 60.0,
        exclusive: false,
        factor: 0.74,
        source: "ASME B30.9 choke angle 60-89 deg (from memory)",
    },
    ChokeRow {
        from_deg: 30.0,
        exclusive: false,
        factor: 0.62,
        source: "ASME B30.9 choke angle 30-59 deg (from memory)",
    },
];

/// A mode factor and how it was found.
#[derive(Debug, Clone, PartialEq)]
pub struct ModeFactor {
    /// The hitch.
    pub hitch: Hitch,
    /// Factor on the sling's allowable.
    pub factor: f64,
    /// Its derivation with sources.
    pub note: String,
}

/// Which input a mode-factor refusal is about.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum HitchField {
    /// `choke_angle`.
    ChokeAngle,
    /// `basket_angle`.
    BasketAngle,
}

fn row(h: Hitch) -> &'static ModeRow {
    // every hitch has exactly one row (tested)
    EN_MODE.iter().find(|r| r.hitch == h).unwrap_or(&EN_MODE[1])
}

fn choke_reduction(angle_deg: f64) -> Option<&'static ChokeRow> {
    ASME_CHOKE.iter().find(|r| if r.exclusive { angle_deg > r.from_deg } else { angle_deg >= r.from_deg })
}

/// The mode factor of `hitch` under `rules`, with the choke angle (ASME
/// only; required there) and the basket's leg angle from vertical (omitted
/// = legs parallel), in degrees. Refusals name the field and say why.
pub fn mode_factor(
    rules: Rules,
    hitch: Hitch,
    choke_angle_deg: Option<f64>,
    basket_angle_deg: Option<f64>,
) -> Result<ModeFactor, (HitchField, String)> {
    if choke_angle_deg.is_some() && !(hitch == Hitch::Choker && rules == Rules::Asme) {
        let why = if hitch == Hitch::Choker {
            "the EN choke mode factor 0.8 has no angle reduction; `choke_angle` is read under `rules: ASME`"
        } else {
            "`choke_angle` applies to a `Choker` hitch"
        };
        return Err((HitchField::ChokeAngle, why.to_string()));
    }
    if basket_angle_deg.is_some() && hitch != Hitch::Basket {
        return Err((HitchField::BasketAngle, "`basket_angle` applies to a `Basket` hitch".to_string()));
    }
    let base = row(hitch);
    match (hitch, rules) {
        (Hitch::Basket, _) => match basket_angle_deg {
            Some(a) if !(0.0..=EN_BASKET_ANGLED.0).contains(&a) => Err((
                HitchField::BasketAngle,
                format!(
                    "a basket's legs {a} deg from vertical are outside the table (0 to {} deg); model the legs as two members",
                    EN_BASKET_ANGLED.0
                ),
            )),
            None | Some(0.0) => Ok(ModeFactor {
                hitch,
                factor: base.factor,
                note: format!(
                    "{} {} ({}); the member is the whole basket's pull",
                    base.label, base.factor, base.source
                ),
            }),
            Some(a) => Ok(ModeFactor {
                hitch,
                factor: EN_BASKET_ANGLED.1,
                note: format!(
                    "basket, legs {a} deg from vertical {} ({}); the member is the whole basket's pull",
                    EN_BASKET_ANGLED.1, EN_BASKET_ANGLED.2
                ),
            }),
        },
        (Hitch::Choker, Rules::Asme) => {
            let Some(a) = choke_angle_deg else {
                return Err((
                    HitchField::ChokeAngle,
                    "under `rules: ASME` a choker needs its `choke_angle` (e.g. \"120 deg\"): the B30.9 reduction depends on it and no row is a safe default".to_string(),
                ));
            };
            if a > 180.0 {
                return Err((HitchField::ChokeAngle, format!("a choke angle is at most 180 deg, not {a}")));
            }
            let Some(r) = choke_reduction(a) else {
                return Err((
                    HitchField::ChokeAngle,
                    format!("choke angle {a} deg is below the ASME B30.9 table (30 deg and up); not rated"),
                ));
            };
            Ok(ModeFactor {
                hitch,
                factor: base.factor * r.factor,
                note: format!(
                    "{} {} ({}) x choke angle {a} deg reduction {} ({})",
                    base.label, base.factor, base.source, r.factor, r.source
                ),
            })
        }
        _ => Ok(ModeFactor {
            hitch,
            factor: base.factor,
            note: format!("{} {} ({})", base.label, base.factor, base.source),
        }),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // Exact table values: tolerance 1e-12 (products of two table values).
    const TOL: f64 = 1e-12;

    // REFERENCES "Hitches, terminations": straight 1.0, choke 0.8, basket
    // with parallel legs 2.0, basket 0-45 deg from vertical 1.4
    // (EN 13414-1 / EN 1492-1 / EN 818-4, from memory).
    #[test]
    fn en_mode_factors() {
        let cases = [
            (Hitch::Straight, None, 1.0),
            (Hitch::Choker, None, 0.8),
            (Hitch::Basket, None, 2.0),
            (Hitch::Basket, Some(0.0), 2.0),
            (Hitch::Basket, Some(30.0), 1.4),
            (Hitch::Basket, Some(45.0), 1.4),
        ];
        for (h, ba, expect) in cases {
            let m = mode_factor(Rules::En, h, None, ba).unwrap();
            assert!((m.factor - expect).abs() < TOL, "{h:?} {ba:?}: {}", m.factor);
            assert!(m.note.contains("from memory"), "{}", m.note);
        }
        for h in [Hitch::Straight, Hitch::Choker, Hitch::Basket] {
            assert_eq!(EN_MODE.iter().filter(|r| r.hitch == h).count(), 1);
        }
    }

    // ASME B30.9 choke-angle reduction (REFERENCES, from memory): over 120
    // deg 1.00, 90-120 0.87, 60-89 0.74, 30-59 0.62, on the choke factor 0.8.
    #[test]
    fn asme_choke_angle_rows() {
        let cases = [
            (180.0, 1.00),
            (121.0, 1.00),
            (120.0, 0.87),
            (90.0, 0.87),
            (89.0, 0.74),
            (60.0, 0.74),
            (59.0, 0.62),
            (30.0, 0.62),
        ];
        for (a, r) in cases {
            let m = mode_factor(Rules::Asme, Hitch::Choker, Some(a), None).unwrap();
            assert!((m.factor - 0.8 * r).abs() < TOL, "{a} deg: {}", m.factor);
            assert!(m.note.contains("ASME B30.9"), "{}", m.note);
        }
        // ASME rules do not change straight and basket (EN table)
        let s = mode_factor(Rules::Asme, Hitch::Straight, None, None).unwrap();
        assert!((s.factor - 1.0).abs() < TOL);
    }

    #[test]
    fn refusals_name_the_field() {
        let f = |r, h, c, b| mode_factor(r, h, c, b).unwrap_err().0;
        assert_eq!(f(Rules::Asme, Hitch::Choker, None, None), HitchField::ChokeAngle);
        assert_eq!(f(Rules::Asme, Hitch::Choker, Some(29.0), None), HitchField::ChokeAngle);
        assert_eq!(f(Rules::Asme, Hitch::Choker, Some(190.0), None), HitchField::ChokeAngle);
        assert_eq!(f(Rules::En, Hitch::Choker, Some(90.0), None), HitchField::ChokeAngle);
        assert_eq!(f(Rules::En, Hitch::Straight, None, Some(10.0)), HitchField::BasketAngle);
        assert_eq!(f(Rules::En, Hitch::Basket, None, Some(50.0)), HitchField::BasketAngle);
    }
}
