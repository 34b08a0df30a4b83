//! The report's stylesheet, inlined in the document: a sober screen layout
//! and print rules for A4 or Letter paper (margins that suit both, header
//! rows repeated, rows and figures kept whole, shading printed exactly).

/// The stylesheet.
pub const CSS: &str = r#"
:root { --ink: #1b1f24; --muted: #555d66; --rule: #b9c0c7; --band: #eef2f4; }
* { box-sizing: border-box; }
html { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
body { margin: 0 auto; max-width: 190mm; padding: 12mm 8mm; color: var(--ink); background: #fff;
  font: 10pt/1.4 "DejaVu Sans", "Liberation Sans", "Segoe UI", Helvetica, Arial, sans-serif; }
header.top { border-bottom: 2.5pt solid var(--ink); padding-bottom: 3mm; margin-bottom: 4mm; }
.doc-kind { font-size: 8.5pt; letter-spacing: 0.12em; text-transform: uppercase; color: var(--muted); margin: 0; }
h1 { font-size: 18pt; line-height: 1.2; margin: 1mm 0 2mm; }
h2 { font-size: 12.5pt; margin: 7mm 0 2mm; padding-bottom: 1mm; border-bottom: 0.8pt solid var(--ink);
  break-after: avoid; page-break-after: avoid; }
h3 { font-size: 10.5pt; margin: 4mm 0 1.5mm; break-after: avoid; page-break-after: avoid; }
p { margin: 1mm 0 2mm; }
dl.meta { display: grid; grid-template-columns: max-content 1fr; gap: 0.5mm 5mm; margin: 0; }
dl.meta dt { font-weight: bold; }
dl.meta dd { margin: 0; }
.notes { white-space: pre-wrap; }
.caution { border: 2pt solid var(--ink); border-left-width: 6pt; padding: 2.5mm 3.5mm; margin: 3mm 0;
  font-weight: bold; font-size: 10.5pt; background: #fff6e0; break-inside: avoid; page-break-inside: avoid; }
.caution .tag { display: inline-block; margin-right: 2mm; padding: 0 1.5mm; background: var(--ink); color: #fff;
  letter-spacing: 0.08em; }
.verdict { border: 1pt solid var(--ink); padding: 2mm 3.5mm; margin: 3mm 0; break-inside: avoid; }
.verdict.fail { border-width: 2pt; border-style: double; }
.verdict strong { font-size: 11pt; }
.verdict .tag { display: inline-block; margin-right: 2mm; padding: 0 1.5mm; background: var(--ink); color: #fff;
  letter-spacing: 0.08em; }
figure { margin: 2mm 0; break-inside: avoid; page-break-inside: avoid; }
figcaption { font-size: 8.5pt; color: var(--muted); margin-top: 1mm; }
svg { display: block; width: 100%; height: auto; }
svg.legend { margin-top: 1mm; }
svg .lbl { font: 12px "DejaVu Sans", "Liberation Sans", Arial, sans-serif; fill: var(--ink);
  paint-order: stroke; stroke: #fff; stroke-width: 3px; stroke-linejoin: round; }
svg .small { font-size: 10.5px; }
svg .id { font-weight: bold; }
svg .node-id { fill: var(--muted); font-size: 10px; }
svg path, svg rect { fill-rule: nonzero; }
svg .member path { fill: none; }
table { width: 100%; border-collapse: collapse; margin: 1mm 0 3mm; font-size: 8.5pt; }
thead { display: table-header-group; }
tr { break-inside: avoid; page-break-inside: avoid; }
th, td { border: 0.6pt solid var(--rule); padding: 1mm 1.4mm; text-align: left; vertical-align: top; }
th { background: var(--band); font-weight: bold; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
.note { display: block; font-size: 7.5pt; color: var(--muted); }
.none { color: var(--muted); }
.state-over { font-weight: bold; text-decoration: underline; }
.state-near { font-style: italic; }
.state-unchecked { font-weight: bold; font-style: italic; }
.state-slack { font-style: italic; color: var(--muted); }
.swatch { display: inline-block; width: 2.6mm; height: 2.6mm; border: 0.5pt solid var(--ink);
  vertical-align: -0.3mm; margin-right: 1mm; }
.cell-case span { display: block; white-space: nowrap; }
ul.warnings, ul.assumptions { margin: 1mm 0 3mm; padding-left: 5mm; }
ul.warnings li, ul.assumptions li { margin-bottom: 0.8mm; break-inside: avoid; }
.subject { font-weight: bold; }
section.case { break-inside: auto; }
.signoff { display: grid; grid-template-columns: 1fr 1fr 1fr; gap: 6mm; margin-top: 8mm; break-inside: avoid; }
.signoff div { border-top: 0.8pt solid var(--ink); padding-top: 1mm; font-size: 8.5pt; color: var(--muted); min-height: 14mm; }
footer { margin-top: 6mm; font-size: 8pt; color: var(--muted); }
@page { margin: 16mm 14mm 18mm 14mm;
  @bottom-left { content: "Tautspan load-path check"; font: 8pt sans-serif; color: #555d66; }
  @bottom-right { content: "page " counter(page) " of " counter(pages); font: 8pt sans-serif; color: #555d66; } }
@media print {
  body { max-width: none; padding: 0 1pt; font-size: 9.5pt; }
  h2 { margin-top: 5mm; }
  section.page-start { break-before: page; page-break-before: always; }
  a { color: inherit; text-decoration: none; }
}
"#;
