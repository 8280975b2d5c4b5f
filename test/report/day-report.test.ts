import { describe, expect, it } from 'vitest';
import { analyzeDay } from '../../src/analysis';
import { dayRecords, dayReport, reportHtml, type Cell } from '../../src/report';
import type { DayRecord } from '../../src/log/types';
import { reportLog } from './report-fixture';

const DRAWS = 2000;
const { records, day } = reportLog();
const report = dayReport(records, { generatedAt: '2026-07-04T08:00:00.000Z', monteCarloDraws: DRAWS });
// The core's own figures for the same day, computed apart from the report.
const core = analyzeDay(dayRecords(records, day.day as DayRecord), { monteCarloDraws: DRAWS });

const byField = (cells: readonly Cell[], field: string) => cells.find((c) => c.field === field);

describe('the day report model', () => {
  it('has the day, its site, crew, reading and specimen', () => {
    expect(report.days).toHaveLength(1);
    const d = report.days[0]!;
    expect(d.date).toBe('2026-07-03');
    expect(d.crew).toEqual(['A']);
    expect(d.siteFigures[0]!.cell.text).toBe('Test tower');
    expect(d.readings.rows).toHaveLength(1);
    expect(d.specimens.rows[0]![0]!.text).toBe('ball 95 mm');
  });

  it('prints every series figure as the core computed it', () => {
    const s = report.days[0]!.series[0]!;
    const r = core[0]!.outcome.kind === 'ready' ? core[0]!.outcome.result : null;
    expect(r).not.toBeNull();
    const cells = s.figures.map((f) => f.cell);
    expect(byField(cells, 'drag_coefficient')!.value).toBe(r!.drag_coefficient);
    expect(byField(cells, 'drag_coefficient')!.text).toBe(r!.drag_coefficient!.toFixed(3));
    expect(byField(cells, 'drag_coefficient_standard_uncertainty')!.value).toBe(r!.drag_coefficient_standard_uncertainty);
    expect(byField(cells, 'drag_coefficient_interval_95_low')!.value).toBe(r!.drag_coefficient_interval_95[0]);
    expect(byField(cells, 'drag_coefficient_interval_95_high')!.value).toBe(r!.drag_coefficient_interval_95[1]);
    expect(byField(cells, 'density_kg_m3')!.value).toBe(r!.air.density_kg_m3);
    expect(byField(cells, 'gravity_m_s2')!.value).toBe(r!.gravity_m_s2);
    expect(byField(cells, 'timing_offset_s')!.value).toBe(r!.timing_offset_s);
    expect(s.verdict).toContain(`C_d = ${r!.drag_coefficient!.toFixed(3)} ± ${(2 * r!.drag_coefficient_standard_uncertainty).toFixed(3)}`);
  });

  it('lists every drop, the excluded one with its reason and no residual', () => {
    const rows = report.days[0]!.series[0]!.drops.rows;
    expect(rows).toHaveLength(7);
    const excluded = rows.find((r) => r[0]!.text === '7')!;
    expect(excluded[3]!.text).toBe('excluded');
    expect(excluded[7]!.text).toBe('a second look at drop 3');
    expect(excluded[6]!.text).toBe('—');
    const r = core[0]!.outcome.kind === 'ready' ? core[0]!.outcome.result : null;
    for (const rd of r!.drops) {
      const seq = records.find((x) => x.id === rd.id && x.kind === 'drop') as { seq: number };
      const row = rows.find((x) => x[0]!.value === seq.seq);
      expect(byField(row!, 'residual_s')!.value).toBe(rd.residual_s);
      expect(row, `drop ${rd.id}`).toBeDefined();
      expect(byField(row!, 'time_s')!.value).toBe(rd.time_s);
    }
  });

  it('has the budget rows of the core, with the combined uncertainty last', () => {
    const r = core[0]!.outcome.kind === 'ready' ? core[0]!.outcome.result : null;
    const rows = report.days[0]!.series[0]!.budget.rows;
    expect(rows).toHaveLength(r!.budget.length + 1);
    r!.budget.forEach((b, i) => expect(byField(rows[i]!, 'contribution')!.value).toBe(b.contribution));
    expect(byField(rows.at(-1)!, 'combined_standard_uncertainty')!.value).toBe(r!.gum.combined_standard_uncertainty);
  });

  it('draws the fitted, predicted and drag-free curves, all seven drops and the residuals', () => {
    const [heightTime, residuals] = report.days[0]!.series[0]!.charts;
    expect(heightTime!.geometry!.lines.map((l) => l.label)).toEqual([expect.stringMatching(/^measured C_d/), 'predicted', 'no air']);
    expect(heightTime!.geometry!.marks).toHaveLength(7);
    expect(heightTime!.geometry!.marks.filter((m) => m.hollow)).toHaveLength(1);
    expect(residuals!.geometry!.marks).toHaveLength(6);
  });

  it('lists the reading correction in the history of edits, with its reason', () => {
    const rows = report.days[0]!.history.rows;
    const edit = rows.find((r) => r[1]!.text === 'reading')!;
    expect(edit[2]!.text).toContain('instrument: meter → meter <b>&</b> "probe"');
    expect(edit[3]!.text).toBe('instrument name completed');
    expect(rows.find((r) => r[1]!.text === 'drop 7')![2]!.text).toContain('excluded: false → true');
  });

  it('states the models with their sources', () => {
    expect(report.methods.map((m) => m.topic)).toEqual(['Air density', 'Gravity', 'Drag law and fall model', 'Buoyancy and added mass', 'Uncertainty']);
    expect(report.methods[0]!.source).toContain('Metrologia 45 (2008)');
  });

  it('reports only the chosen days', () => {
    expect(dayReport(records, { generatedAt: 'x', dayIds: ['nope'], monteCarloDraws: 100 }).days).toEqual([]);
  });
});

describe('the day report as HTML', () => {
  const html = reportHtml(report);
  it('is one file with no script, no link and no address to fetch', () => {
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/<link/i);
    expect(html).not.toMatch(/\s(src|href)=/i);
    expect(html.match(/https?:\/\/\S*/g)?.every((u) => u.startsWith("http://www.w3.org/2000/svg"))).toBe(true);
    expect(html).toContain("default-src 'none'");
  });
  it('escapes what the log says', () => {
    expect(html).not.toContain('<b>&</b>');
    expect(html).toContain('meter &lt;b&gt;&amp;&lt;/b&gt; &quot;probe&quot;');
  });
  it('puts each series on its own page', () => {
    expect(html.match(/<section class="rp-series"/g)).toHaveLength(1);
    expect(html).toContain('section.rp-series { break-before: page; }');
  });
});
