//! Rated parts shown in the inspector: each fitting (or an anchor's rating)
//! with its force against its working load limit, utilisation and state,
//! the governing angle and, on hover, where the rating came from.

use crate::fields::units_display::{Shown, UnitSystem, fmt_utilisation};
use egui::{RichText, Ui};
use tautspan_core::analysis::{FittingResult, State};

/// One line per part; nothing when there are none.
pub fn fittings(ui: &mut Ui, parts: &[FittingResult], u: UnitSystem) {
    if parts.is_empty() {
        return;
    }
    ui.label(RichText::new("Rated parts").strong());
    for p in parts {
        part(ui, p, u);
    }
}

/// One part's line.
pub fn part(ui: &mut Ui, p: &FittingResult, u: UnitSystem) {
    let mut text = format!(
        "{} ({}): {} of WLL {} — utilisation {} ({})",
        p.name,
        p.kind.replace('_', " "),
        u.fmt(p.force_n, Shown::Force),
        u.fmt(p.wll_n, Shown::Force),
        if p.utilisation.is_finite() { fmt_utilisation(p.utilisation) } else { "not rated at this angle".to_string() },
        p.state.as_str()
    );
    if let Some(a) = p.angle_deg {
        let what = if p.kind == "hoist" { "off plumb" } else { "from its axis" };
        text.push_str(&format!(", {a:.1}° {what}"));
    }
    let rt = RichText::new(text);
    let rt =
        if matches!(p.state, State::Over | State::Unchecked) { rt.color(crate::fields::qty_field::ERROR) } else { rt };
    let hover = match &p.reason {
        Some(r) => format!("{}\n{r}", p.source),
        None => p.source.clone(),
    };
    ui.label(rt).on_hover_text(hover);
}
