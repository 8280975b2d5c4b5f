// The day report's one stylesheet, for the office's HTML file (inlined in a <style> element) and for the app's
// printable screen (adopted as a constructed stylesheet, which the Content-Security-Policy allows, where a
// <style> element or a style attribute would need 'unsafe-inline'). Every rule is scoped under .rp.
// Print: A4 or Letter (the browser's page size decides), each series on a page of its own.
export const REPORT_CSS = `
.rp { color: #111; background: #fff; font: 10.5pt/1.35 system-ui, "DejaVu Sans", sans-serif; max-width: 190mm; margin: 0 auto; padding: 8mm 0; }
.rp h1 { font-size: 17pt; margin: 0 0 2mm; }
.rp h2 { font-size: 14pt; margin: 5mm 0 2mm; border-bottom: 1.5pt solid #0b6b4f; padding-bottom: 1mm; }
.rp h3 { font-size: 11.5pt; margin: 4mm 0 1.5mm; }
.rp p { margin: 1mm 0 2mm; }
.rp .rp-meta { color: #444; font-size: 9pt; }
.rp .rp-caution { border: 1pt solid #8a1c1c; border-left-width: 4pt; padding: 2mm 3mm; margin: 3mm 0; font-size: 9.5pt; }
.rp dl.rp-figures { display: grid; grid-template-columns: repeat(3, 1fr); gap: 1mm 4mm; margin: 2mm 0; }
.rp dl.rp-figures div { border-bottom: 0.5pt solid #bbb; padding: 0.5mm 0; }
.rp dl.rp-figures dt { font-size: 8.5pt; color: #444; }
.rp dl.rp-figures dd { margin: 0; font-variant-numeric: tabular-nums; font-weight: 600; }
.rp table { border-collapse: collapse; width: 100%; margin: 1mm 0 3mm; font-size: 9pt; }
.rp caption { text-align: left; font-weight: 700; font-size: 10pt; padding: 1mm 0; }
.rp th, .rp td { border: 0.5pt solid #999; padding: 0.8mm 1.5mm; text-align: left; vertical-align: top; }
.rp th { background: #eef3f1; font-weight: 600; }
.rp td[data-value] { font-variant-numeric: tabular-nums; }
.rp .rp-drops td[data-value], .rp .rp-budget td[data-value] { white-space: nowrap; }
.rp tr { break-inside: avoid; }
.rp .rp-keep { break-inside: avoid; }
.rp caption, .rp thead { break-after: avoid; }
.rp thead { display: table-header-group; }
.rp .rp-verdict { font-size: 12pt; font-weight: 600; border: 1pt solid #0b6b4f; padding: 2mm 3mm; margin: 2mm 0; }
.rp .rp-verdict.rp-not-met, .rp .rp-verdict.rp-not-ready { border-color: #8a1c1c; }
.rp .rp-charts { display: grid; grid-template-columns: 1fr 1fr; gap: 3mm; }
.rp .rp-charts.rp-charts-one { grid-template-columns: minmax(0, 120mm); }
.rp figure { margin: 0; break-inside: avoid; }
.rp figcaption { font-weight: 600; font-size: 9.5pt; margin-bottom: 1mm; }
.rp svg.rp-plot { width: 100%; height: auto; display: block; border: 0.5pt solid #888; }
.rp svg text { fill: #111; font: 9px system-ui, "DejaVu Sans", sans-serif; }
.rp .rp-axis { stroke: #111; stroke-width: 1.2; }
.rp .rp-grid { stroke: #999; stroke-width: 0.5; stroke-dasharray: 2 3; }
.rp .rp-line { fill: none; stroke-width: 2.2; stroke-linejoin: round; }
.rp .rp-brand { stroke: #0b6b4f; }
.rp .rp-accent { stroke: #b86e00; }
.rp .rp-ink { stroke: #111; }
.rp .rp-soft { stroke: #555; }
.rp .rp-dash { stroke-dasharray: 9 6; }
.rp .rp-dot { stroke-dasharray: 2 5; stroke-linecap: round; }
.rp .rp-mark { fill: #111; stroke: #fff; stroke-width: 1.2; }
.rp .rp-mark.rp-hollow { fill: #fff; stroke: #111; stroke-width: 1.6; }
.rp .rp-errbar { stroke: #111; stroke-width: 1.2; }
.rp ul.rp-legend { list-style: none; margin: 1mm 0 0; padding: 0; display: flex; flex-wrap: wrap; gap: 0.5mm 4mm; font-size: 8.5pt; }
.rp ul.rp-legend svg { width: 24px; height: 10px; vertical-align: middle; margin-right: 1mm; }
.rp .rp-bars { display: grid; grid-template-columns: minmax(40mm, 40%) 1fr; gap: 0.8mm 3mm; margin: 1mm 0 3mm; font-size: 9pt; }
.rp .rp-bars dd { margin: 0; display: flex; align-items: center; gap: 2mm; }
.rp .rp-bars svg { flex: 1 1 auto; height: 10px; }
.rp .rp-bar { fill: #0b6b4f; }
.rp ul.rp-flags { margin: 1mm 0 3mm; padding-left: 5mm; }
.rp .rp-flag-info { color: #333; }
.rp .rp-flag-warning { font-weight: 600; }
.rp section.rp-series { break-before: page; }
.rp section.rp-methods { break-before: page; }
.rp section.rp-day + section.rp-day { break-before: page; }
.rp dl.rp-methods dt { font-weight: 700; margin-top: 2mm; }
.rp dl.rp-methods dd { margin: 0 0 1mm; }
.rp .rp-source { font-size: 8.5pt; color: #333; }
@page { margin: 14mm 12mm; }
@media print {
  .rp { max-width: none; padding: 0; }
  .rp a { color: inherit; text-decoration: none; }
}
@media screen and (max-width: 600px) {
  .rp { padding: 3mm; font-size: 10pt; }
  .rp dl.rp-figures { grid-template-columns: 1fr 1fr; }
  .rp .rp-charts { grid-template-columns: 1fr; }
  .rp .rp-table-wrap { overflow-x: auto; }
}
`;
