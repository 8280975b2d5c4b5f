// The day report as one self-contained HTML document: inline CSS, inline SVG charts, no script, no link to
// anything, so it opens the same anywhere and prints (see report-style.ts for the pages). Every text of the log
// is escaped here; nothing from a record is ever written unescaped.
import type { PlotGeometry } from '../charts';
import type { Bar } from '../charts';
import type { Cell, ChartView, DayReport, DaySection, Figure, SeriesSection, Table } from './report-model';
import { REPORT_CSS } from './report-style';

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Text safe inside an element or a quoted attribute. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ESCAPES[c]!);
}

const e = escapeHtml;
/** A number as written in an SVG attribute: two decimals at most. */
const n = (v: number) => String(Math.round(v * 100) / 100);

function cellAttrs(c: Cell): string {
  return c.value === undefined ? '' : ` data-value="${e(String(c.value))}"${c.field ? ` data-field="${e(c.field)}"` : ''}`;
}

function table(t: Table, cls = ''): string {
  if (t.rows.length === 0) return `<p class="rp-empty"><strong>${e(t.caption)}:</strong> ${e(t.empty)}</p>`;
  return `<div class="rp-table-wrap"><table${cls ? ` class="${cls}"` : ''}><caption>${e(t.caption)}</caption><thead><tr>${t.headers.map((h) => `<th scope="col">${e(h)}</th>`).join('')}</tr></thead><tbody>${t.rows
    .map((row) => `<tr>${row.map((c) => `<td${cellAttrs(c)}>${e(c.text)}</td>`).join('')}</tr>`)
    .join('')}</tbody></table></div>`;
}

function figures(list: readonly Figure[], cls = 'rp-figures'): string {
  return `<dl class="${cls}">${list.map((f) => `<div><dt>${e(f.label)}</dt><dd${cellAttrs(f.cell)}>${e(f.cell.text)}</dd></div>`).join('')}</dl>`;
}

/** The chart's SVG from its geometry: the same elements, positions and classes as the app's <pl-plot>. */
export function plotSvg(g: PlotGeometry, xLabel: string, yLabel: string, summary: string): string {
  const parts: string[] = [];
  for (const t of g.yTicks) {
    parts.push(`<line class="rp-grid" x1="${n(g.left)}" x2="${n(g.right)}" y1="${n(t.at)}" y2="${n(t.at)}"/>`);
    parts.push(`<text x="${n(g.left - 6)}" y="${n(t.at + 4)}" text-anchor="end">${e(t.label)}</text>`);
  }
  for (const t of g.xTicks) {
    parts.push(`<line class="rp-grid" y1="${n(g.top)}" y2="${n(g.bottom)}" x1="${n(t.at)}" x2="${n(t.at)}"/>`);
    parts.push(`<text x="${n(t.at)}" y="${n(g.bottom + 16)}" text-anchor="middle">${e(t.label)}</text>`);
  }
  if (g.zeroY !== null) parts.push(`<line class="rp-axis" x1="${n(g.left)}" x2="${n(g.right)}" y1="${n(g.zeroY)}" y2="${n(g.zeroY)}"/>`);
  parts.push(`<line class="rp-axis" x1="${n(g.left)}" x2="${n(g.left)}" y1="${n(g.top)}" y2="${n(g.bottom)}"/>`);
  parts.push(`<line class="rp-axis" x1="${n(g.left)}" x2="${n(g.right)}" y1="${n(g.bottom)}" y2="${n(g.bottom)}"/>`);
  parts.push(`<text x="${n(g.xLabelAt.x)}" y="${n(g.xLabelAt.y)}" text-anchor="middle">${e(xLabel)}</text>`);
  parts.push(`<text transform="translate(${n(g.yLabelAt.x)} ${n(g.yLabelAt.y)}) rotate(-90)" text-anchor="middle">${e(yLabel)}</text>`);
  for (const l of g.lines) parts.push(`<polyline class="rp-line rp-${l.tone} rp-${l.style}" points="${l.points}"/>`);
  for (const m of g.marks) {
    if (m.errorBar) parts.push(`<line class="rp-errbar" x1="${n(m.cx)}" x2="${n(m.cx)}" y1="${n(m.errorBar.y1)}" y2="${n(m.errorBar.y2)}"/>`);
    parts.push(`<circle class="rp-mark${m.hollow ? ' rp-hollow' : ''}" cx="${n(m.cx)}" cy="${n(m.cy)}" r="4"><title>${e(m.label)}</title></circle>`);
  }
  return `<svg class="rp-plot" viewBox="0 0 ${g.width} ${g.height}" role="img" aria-label="${e(summary)}" xmlns="http://www.w3.org/2000/svg">${parts.join('')}</svg>`;
}

function legend(c: ChartView): string {
  const items = c.legend.map((l) =>
    l.kind === 'mark'
      ? `<li><svg viewBox="0 0 24 10" aria-hidden="true"><circle class="rp-mark${l.hollow ? ' rp-hollow' : ''}" cx="12" cy="5" r="4"/></svg>${e(l.label)}</li>`
      : `<li><svg viewBox="0 0 24 10" aria-hidden="true"><line class="rp-line rp-${e(l.tone)} rp-${e(l.style)}" x1="1" x2="23" y1="5" y2="5"/></svg>${e(l.label)}</li>`,
  );
  return `<ul class="rp-legend">${items.join('')}</ul>`;
}

function chart(c: ChartView): string {
  const body = c.geometry ? plotSvg(c.geometry, c.xLabel, c.yLabel, c.summary) : '<p>No data to plot.</p>';
  return `<figure class="rp-chart"><figcaption>${e(c.title)}</figcaption>${body}${legend(c)}</figure>`;
}

function bars(list: readonly Bar[]): string {
  if (list.length === 0) return '';
  return `<dl class="rp-bars" aria-label="Contributions to the uncertainty of C_d">${list
    .map((b) => `<dt>${e(b.label)}</dt><dd><svg viewBox="0 0 100 10" preserveAspectRatio="none" aria-hidden="true"><rect class="rp-bar" x="0" y="1" height="8" width="${n(b.widthPct)}"/></svg><span>${e(b.text)}</span></dd>`)
    .join('')}</dl>`;
}

function seriesHtml(s: SeriesSection): string {
  const verdictClass = s.state !== 'ready' ? ' rp-not-ready' : s.targetMet === false ? ' rp-not-met' : '';
  const flags = s.flags.length
    ? `<h3>Flags</h3><ul class="rp-flags">${s.flags.map((f) => `<li class="rp-flag-${f.severity}" data-code="${e(f.code)}">${f.severity === 'warning' ? 'Warning: ' : 'Note: '}${e(f.message)}</li>`).join('')}</ul>`
    : s.state === 'ready'
      ? '<h3>Flags</h3><p>None.</p>'
      : '';
  return `<section class="rp-series" data-series-id="${e(s.id)}" data-state="${s.state}">
<h2>${e(s.title)}</h2>
<p class="rp-verdict${verdictClass}">${e(s.verdict)}</p>
${s.figures.length ? figures(s.figures) : ''}
${s.charts.length ? `<div class="rp-charts${s.charts.length === 1 ? ' rp-charts-one' : ''}">${s.charts.map(chart).join('')}</div>` : ''}
${table(s.drops, 'rp-drops')}
${s.state === 'ready' ? `<div class="rp-keep">${table(s.budget, 'rp-budget')}${bars(s.bars)}</div>` : ''}
${flags}
</section>`;
}

function dayHtml(d: DaySection): string {
  return `<section class="rp-day" data-day-id="${e(d.id)}">
<h2>${e(d.heading)}</h2>
${figures(d.siteFigures)}
<p><strong>Crew:</strong> ${d.crew.length ? e(d.crew.join(', ')) : 'not recorded'}</p>
${d.notes ? `<p><strong>Notes:</strong> ${e(d.notes)}</p>` : ''}
${table(d.readings, 'rp-readings')}
${table(d.specimens, 'rp-specimens')}
<p>${d.series.length} series this day${d.series.length ? ': each on its own page below.' : '.'}</p>
${table(d.history, 'rp-history')}
${d.series.map(seriesHtml).join('\n')}
</section>`;
}

/** The whole report as one HTML document (UTF-8). */
export function reportHtml(report: DayReport): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">
<title>${e(report.title)}</title>
<style>${REPORT_CSS}</style>
</head>
<body>
<main class="rp">
<h1>${e(report.title)}</h1>
<p class="rp-meta">Made ${e(report.generatedAt.replace('T', ' ').replace(/\.\d+Z$/, 'Z'))} by Plummet from the crews' log. Figures are the analysis' own; uncertainties are standard uncertainties unless marked k = 2 or 95 %.</p>
<p class="rp-caution"><strong>Safety.</strong> ${e(report.caution)}</p>
${report.days.length ? report.days.map(dayHtml).join('\n') : '<p>No day matches: nothing to report.</p>'}
<section class="rp-methods">
<h2>Methods</h2>
<dl class="rp-methods">${report.methods.map((m) => `<dt>${e(m.topic)}</dt><dd>${e(m.text)}<br><span class="rp-source">Source: ${e(m.source)}</span></dd>`).join('')}</dl>
</section>
</main>
</body>
</html>
`;
}
