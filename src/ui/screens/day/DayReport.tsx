// The printable day report in the app (#/day/<id>/report): the same model as the office command's HTML file
// (src/report dayReport), drawn with Preact in the same elements and classes, so the browser's "Save as PDF"
// gives the office's pages. Its stylesheet is the report's one, adopted as a constructed stylesheet: the
// Content-Security-Policy forbids style elements and attributes, not adopted sheets. The app's bar and tabs are
// hidden in print (styles.css).
import { useEffect, useMemo } from 'preact/hooks';
import { useApp } from '../../app-context';
import { useStoreData } from '../../hooks';
import { Notice } from '../../forms';
import { routeHref } from '../../router';
import { describeError } from '../../errors';
import { dayReport, REPORT_CSS, type Cell, type ChartView, type DaySection, type Figure, type SeriesSection, type Table } from '../../../report';
import type { LogRecord } from '../../../log';
import type { PlotGeometry } from '../../../charts';

let sheet: CSSStyleSheet | null = null;
/** Adds the report's stylesheet to the document once. */
function useReportStyles(): void {
  useEffect(() => {
    if (!sheet) {
      sheet = new CSSStyleSheet();
      sheet.replaceSync(REPORT_CSS);
    }
    if (!document.adoptedStyleSheets.includes(sheet)) document.adoptedStyleSheets = [...document.adoptedStyleSheets, sheet];
  }, []);
}

const r2 = (v: number) => Math.round(v * 100) / 100;
const valueAttrs = (c: Cell) => (c.value === undefined ? {} : { 'data-value': String(c.value), ...(c.field ? { 'data-field': c.field } : {}) });

function ReportTable({ t, cls }: { t: Table; cls: string }) {
  if (t.rows.length === 0)
    return (
      <p class="rp-empty">
        <strong>{t.caption}:</strong> {t.empty}
      </p>
    );
  return (
    <div class="rp-table-wrap">
      <table class={cls}>
        <caption>{t.caption}</caption>
        <thead>
          <tr>
            {t.headers.map((h) => (
              <th scope="col">{h}</th>
            ))}
          </tr>
        </thead>
        <tbody>
          {t.rows.map((row) => (
            <tr>
              {row.map((c) => (
                <td {...valueAttrs(c)}>{c.text}</td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function Figures({ list }: { list: readonly Figure[] }) {
  return (
    <dl class="rp-figures">
      {list.map((f) => (
        <div>
          <dt>{f.label}</dt>
          <dd {...valueAttrs(f.cell)}>{f.cell.text}</dd>
        </div>
      ))}
    </dl>
  );
}

/** The same SVG as the office file's plotSvg, element for element. */
function Plot({ g, c }: { g: PlotGeometry; c: ChartView }) {
  return (
    <svg class="rp-plot" viewBox={`0 0 ${g.width} ${g.height}`} role="img" aria-label={c.summary}>
      {g.yTicks.map((t) => (
        <>
          <line class="rp-grid" x1={r2(g.left)} x2={r2(g.right)} y1={r2(t.at)} y2={r2(t.at)} />
          <text x={r2(g.left - 6)} y={r2(t.at + 4)} text-anchor="end">
            {t.label}
          </text>
        </>
      ))}
      {g.xTicks.map((t) => (
        <>
          <line class="rp-grid" y1={r2(g.top)} y2={r2(g.bottom)} x1={r2(t.at)} x2={r2(t.at)} />
          <text x={r2(t.at)} y={r2(g.bottom + 16)} text-anchor="middle">
            {t.label}
          </text>
        </>
      ))}
      {g.zeroY !== null ? <line class="rp-axis" x1={r2(g.left)} x2={r2(g.right)} y1={r2(g.zeroY)} y2={r2(g.zeroY)} /> : null}
      <line class="rp-axis" x1={r2(g.left)} x2={r2(g.left)} y1={r2(g.top)} y2={r2(g.bottom)} />
      <line class="rp-axis" x1={r2(g.left)} x2={r2(g.right)} y1={r2(g.bottom)} y2={r2(g.bottom)} />
      <text x={r2(g.xLabelAt.x)} y={r2(g.xLabelAt.y)} text-anchor="middle">
        {c.xLabel}
      </text>
      <text transform={`translate(${r2(g.yLabelAt.x)} ${r2(g.yLabelAt.y)}) rotate(-90)`} text-anchor="middle">
        {c.yLabel}
      </text>
      {g.lines.map((l) => (
        <polyline class={`rp-line rp-${l.tone} rp-${l.style}`} points={l.points} />
      ))}
      {g.marks.map((m) => (
        <>
          {m.errorBar ? <line class="rp-errbar" x1={r2(m.cx)} x2={r2(m.cx)} y1={r2(m.errorBar.y1)} y2={r2(m.errorBar.y2)} /> : null}
          <circle class={`rp-mark${m.hollow ? ' rp-hollow' : ''}`} cx={r2(m.cx)} cy={r2(m.cy)} r="4">
            <title>{m.label}</title>
          </circle>
        </>
      ))}
    </svg>
  );
}

function Chart({ c }: { c: ChartView }) {
  return (
    <figure class="rp-chart">
      <figcaption>{c.title}</figcaption>
      {c.geometry ? <Plot g={c.geometry} c={c} /> : <p>No data to plot.</p>}
      <ul class="rp-legend">
        {c.legend.map((l) => (
          <li>
            <svg viewBox="0 0 24 10" aria-hidden="true">
              {l.kind === 'mark' ? <circle class={`rp-mark${l.hollow ? ' rp-hollow' : ''}`} cx="12" cy="5" r="4" /> : <line class={`rp-line rp-${l.tone} rp-${l.style}`} x1="1" x2="23" y1="5" y2="5" />}
            </svg>
            {l.label}
          </li>
        ))}
      </ul>
    </figure>
  );
}

function Series({ s }: { s: SeriesSection }) {
  const verdictClass = s.state !== 'ready' ? ' rp-not-ready' : s.targetMet === false ? ' rp-not-met' : '';
  return (
    <section class="rp-series" data-series-id={s.id} data-state={s.state}>
      <h2>{s.title}</h2>
      <p class={`rp-verdict${verdictClass}`}>{s.verdict}</p>
      {s.figures.length ? <Figures list={s.figures} /> : null}
      {s.charts.length ? (
        <div class={`rp-charts${s.charts.length === 1 ? ' rp-charts-one' : ''}`}>
          {s.charts.map((c) => (
            <Chart c={c} />
          ))}
        </div>
      ) : null}
      <ReportTable t={s.drops} cls="rp-drops" />
      {s.state === 'ready' ? (
        <div class="rp-keep">
          <ReportTable t={s.budget} cls="rp-budget" />
          {s.bars.length ? (
            <dl class="rp-bars" aria-label="Contributions to the uncertainty of C_d">
              {s.bars.map((b) => (
                <>
                  <dt>{b.label}</dt>
                  <dd>
                    <svg viewBox="0 0 100 10" preserveAspectRatio="none" aria-hidden="true">
                      <rect class="rp-bar" x="0" y="1" height="8" width={r2(b.widthPct)} />
                    </svg>
                    <span>{b.text}</span>
                  </dd>
                </>
              ))}
            </dl>
          ) : null}
        </div>
      ) : null}
      {s.flags.length ? (
        <>
          <h3>Flags</h3>
          <ul class="rp-flags">
            {s.flags.map((f) => (
              <li class={`rp-flag-${f.severity}`} data-code={f.code}>
                {f.severity === 'warning' ? 'Warning: ' : 'Note: '}
                {f.message}
              </li>
            ))}
          </ul>
        </>
      ) : s.state === 'ready' ? (
        <>
          <h3>Flags</h3>
          <p>None.</p>
        </>
      ) : null}
    </section>
  );
}

function Day({ d }: { d: DaySection }) {
  return (
    <section class="rp-day" data-day-id={d.id}>
      <h2>{d.heading}</h2>
      <Figures list={d.siteFigures} />
      <p>
        <strong>Crew:</strong> {d.crew.length ? d.crew.join(', ') : 'not recorded'}
      </p>
      {d.notes ? (
        <p>
          <strong>Notes:</strong> {d.notes}
        </p>
      ) : null}
      <ReportTable t={d.readings} cls="rp-readings" />
      <ReportTable t={d.specimens} cls="rp-specimens" />
      <p>
        {d.series.length} series this day{d.series.length ? ': each on its own page below.' : '.'}
      </p>
      <ReportTable t={d.history} cls="rp-history" />
      {d.series.map((s) => (
        <Series s={s} />
      ))}
    </section>
  );
}

export function DayReport({ dayId }: { dayId: string }) {
  const app = useApp();
  useReportStyles();
  const data = useStoreData(() => app.store.loadDay(dayId), [dayId]);
  const report = useMemo(() => {
    if (data.state !== 'ready') return null;
    const v = data.value;
    const records: LogRecord[] = [v.day, ...(v.site ? [v.site] : []), ...v.readings, ...v.specimens, ...v.series, ...v.drops];
    return dayReport(records, { dayIds: [dayId], generatedAt: new Date().toISOString() });
  }, [data, dayId]);
  if (data.state === 'loading') return <p>Loading…</p>;
  if (data.state === 'failed') return <Notice tone="bad">{describeError(data.error)}</Notice>;
  if (!report) return null;
  return (
    <div class="day-report">
      <div class="no-print report-actions">
        <a class="back" href={routeHref('day', dayId, 'summary')}>
          ← Back to the end of the day
        </a>
        <p class="hint">Print this page, or choose "Save as PDF" in the print dialogue: A4 or Letter, each series on a page of its own.</p>
        <button type="button" class="btn btn-block" onClick={() => window.print()}>
          Print or save as PDF
        </button>
      </div>
      <article class="rp">
        <h1>{report.title}</h1>
        <p class="rp-meta">
          Made {report.generatedAt.replace('T', ' ').replace(/\.\d+Z$/, 'Z')} by Plummet from this phone's log. Figures are the analysis' own; uncertainties are standard uncertainties unless marked k = 2 or 95 %.
        </p>
        <p class="rp-caution">
          <strong>Safety.</strong> {report.caution}
        </p>
        {report.days.map((d) => (
          <Day d={d} />
        ))}
        <section class="rp-methods">
          <h2>Methods</h2>
          <dl class="rp-methods">
            {report.methods.map((m) => (
              <>
                <dt>{m.topic}</dt>
                <dd>
                  {m.text}
                  <br />
                  <span class="rp-source">Source: {m.source}</span>
                </dd>
              </>
            ))}
          </dl>
        </section>
      </article>
    </div>
  );
}
