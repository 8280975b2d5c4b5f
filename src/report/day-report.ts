// Builds the day report's model from a log's records: for each chosen day its site, crew, readings, specimens,
// and every series with the core's analysis (analyzeDay), the charts' geometry (src/charts), the drop table's rows
// (seriesDropRows), the budget and the flags; the day's history of edits; the methods with their sources.
// Every figure is the core's own number, printed once here; nothing is recomputed another way.
import { analyzeDay, readingAirDensity, relativeUncertainty, seriesDropRows, type DayRecords, type SeriesOfDay } from '../analysis';
import { budgetBars, plotGeometry, seriesPlots, type PlotInput } from '../charts';
import type { BodyOf, DayRecord, LogRecord, ReadingRecord, Revision, SpecimenRecord } from '../log';
import type { AnalysisResult } from '../physics';
import { METHOD_NOTES, REPORT_CAUTION } from './methods';
import type { Cell, ChartView, DayReport, DaySection, Figure, Flag, LegendEntry, SeriesSection, Table } from './report-model';

export interface DayReportOptions {
  /** The days to report (ids); all days of the records when absent. */
  dayIds?: readonly string[];
  /** When the report is made, ISO 8601 (the caller reads the clock). */
  generatedAt: string;
  /** Monte Carlo draws per series (the analysis' default when absent). */
  monteCarloDraws?: number;
}

const txt = (text: string): Cell => ({ text });
/** A figure of the analysis: printed with `digits` decimals (or significant digits with 'e'), value kept exact. */
const num = (value: number | null | undefined, digits: number, field?: string, unit = ''): Cell =>
  value === null || value === undefined || !Number.isFinite(value)
    ? { text: '—' }
    : { text: `${value.toFixed(digits)}${unit ? ` ${unit}` : ''}`, value, ...(field ? { field } : {}) };
const sci = (value: number, digits: number, field?: string): Cell => ({ text: value.toExponential(digits), value, ...(field ? { field } : {}) });

/** Every live record of the log grouped for one day, as analyzeDay takes them. */
export function dayRecords(records: readonly LogRecord[], day: DayRecord): DayRecords {
  const live = records.filter((r) => !r.deleted);
  const series = live.filter((r) => r.kind === 'series' && r.day_id === day.id) as DayRecords['series'];
  const seriesIds = new Set(series.map((s) => s.id));
  const specimenIds = new Set(series.map((s) => s.specimen_id));
  return {
    site: (live.find((r) => r.kind === 'site' && r.id === day.site_id) as DayRecords['site']) ?? null,
    readings: (live.filter((r) => r.kind === 'reading' && r.day_id === day.id) as ReadingRecord[]).sort((a, b) => a.taken_at.localeCompare(b.taken_at)),
    specimens: live.filter((r) => r.kind === 'specimen' && specimenIds.has(r.id)) as SpecimenRecord[],
    series: series.sort((a, b) => a.started_at.localeCompare(b.started_at)),
    drops: live.filter((r) => r.kind === 'drop' && seriesIds.has(r.series_id)) as DayRecords['drops'],
  };
}

export function dayReport(records: readonly LogRecord[], options: DayReportOptions): DayReport {
  const days = (records.filter((r) => r.kind === 'day' && !r.deleted) as DayRecord[])
    .filter((d) => !options.dayIds || options.dayIds.includes(d.id))
    .sort((a, b) => a.date.localeCompare(b.date) || a.id.localeCompare(b.id));
  const draws = options.monteCarloDraws === undefined ? {} : { monteCarloDraws: options.monteCarloDraws };
  return {
    title: days.length === 1 ? `Day report ${days[0]!.date}` : `Day reports ${days.map((d) => d.date).join(', ')}`,
    generatedAt: options.generatedAt,
    days: days.map((day) => daySection(records, day, analyzeDay(dayRecords(records, day), draws))),
    methods: [...METHOD_NOTES],
    caution: REPORT_CAUTION,
  };
}

function daySection(records: readonly LogRecord[], day: DayRecord, analysed: SeriesOfDay[]): DaySection {
  const recs = dayRecords(records, day);
  const site = recs.site;
  const siteFigures: Figure[] = site
    ? [
        { label: 'Site', cell: txt(site.name) },
        { label: 'Latitude', cell: num(site.latitude_deg, 5, 'latitude_deg', '°') },
        { label: 'Longitude', cell: num(site.longitude_deg, 5, 'longitude_deg', '°') },
        { label: 'Elevation', cell: { ...num(site.elevation_m, 1, 'elevation_m', 'm'), text: `${site.elevation_m.toFixed(1)} m (${site.elevation_source})` } },
      ]
    : [{ label: 'Site', cell: txt('no site recorded') }];
  return {
    id: day.id,
    date: day.date,
    heading: `${day.date}${site ? ` · ${site.name}` : ''}`,
    siteFigures,
    crew: [...day.crew],
    notes: day.notes,
    readings: readingsTable(recs),
    specimens: specimensTable(recs.specimens),
    series: analysed.map((s, i) => seriesSection(s, i + 1)),
    history: historyTable(records, recs, day),
  };
}

function readingsTable(recs: DayRecords): Table {
  return {
    caption: 'Air readings through the day',
    headers: ['taken at (UTC)', 'temperature', 'pressure', 'humidity', 'wind', 'instrument', 'air density (CIPM-2007)'],
    empty: 'No air reading was recorded this day.',
    rows: recs.readings.map((r) => {
      const h = r.humidity;
      return [
        txt(r.taken_at.slice(11, 19)),
        { text: `${r.temperature_C.toFixed(1)} ± ${r.u_temperature_C.toFixed(1)} °C`, value: r.temperature_C, field: 'temperature_C' },
        { text: `${(r.pressure_Pa / 100).toFixed(1)} ± ${(r.u_pressure_Pa / 100).toFixed(1)} hPa (${r.pressure_reference === 'station' ? 'station' : 'sea level'})`, value: r.pressure_Pa, field: 'pressure_Pa' },
        h.kind === 'relative'
          ? { text: `${h.relative_humidity_pct.toFixed(0)} ± ${h.u_relative_humidity_pct.toFixed(0)} % RH`, value: h.relative_humidity_pct, field: 'relative_humidity_pct' }
          : { text: `dew point ${h.dew_point_C.toFixed(1)} ± ${h.u_dew_point_C.toFixed(1)} °C`, value: h.dew_point_C, field: 'dew_point_C' },
        r.wind_speed_m_s === null ? txt('—') : num(r.wind_speed_m_s, 1, 'wind_speed_m_s', 'm/s'),
        txt(r.instrument),
        num(readingAirDensity(r, recs.site), 4, 'density_kg_m3', 'kg/m³'),
      ];
    }),
  };
}

function shapeText(p: SpecimenRecord): string {
  const mm = (m: number) => `${(m * 1000).toFixed(1)} mm`;
  const s = p.shape;
  switch (s.kind) {
    case 'sphere':
      return `sphere, diameter ${mm(s.diameter_m)}`;
    case 'cylinder':
      return `cylinder, diameter ${mm(s.diameter_m)}, length ${mm(s.length_m)}`;
    case 'disc':
      return `disc, diameter ${mm(s.diameter_m)}, thickness ${mm(s.thickness_m)}`;
    case 'box':
      return `box ${mm(s.length_m)} × ${mm(s.width_m)} × ${mm(s.height_m)}`;
    case 'custom':
      return `area ${s.area_m2.toExponential(3)} m², volume ${s.volume_m3.toExponential(3)} m³`;
  }
}

function specimensTable(specimens: readonly SpecimenRecord[]): Table {
  return {
    caption: 'Specimens',
    headers: ['name', 'mass', 'shape', 'reference C_d', 'notes'],
    empty: 'No specimen was dropped this day.',
    rows: specimens.map((p) => [
      txt(p.name),
      { text: `${(p.mass_kg * 1000).toFixed(1)} ± ${(p.u_mass_kg * 1000).toFixed(1)} g`, value: p.mass_kg, field: 'mass_kg' },
      txt(shapeText(p)),
      p.reference_drag_coefficient === null ? txt('—') : num(p.reference_drag_coefficient, 3, 'reference_drag_coefficient'),
      txt(p.notes),
    ]),
  };
}

function chartView(title: string, plot: PlotInput & { xLabel: string; yLabel: string; summary: string }): ChartView {
  const legend: LegendEntry[] = plot.lines.map((l) => ({ kind: 'line', label: l.label, tone: l.tone ?? 'brand', style: l.style ?? 'solid' }));
  if (plot.marks.some((m) => !m.hollow)) legend.push({ kind: 'mark', label: 'measured', hollow: false });
  if (plot.marks.some((m) => m.hollow)) legend.push({ kind: 'mark', label: 'excluded', hollow: true });
  return { title, summary: plot.summary, xLabel: plot.xLabel, yLabel: plot.yLabel, geometry: plotGeometry(plot), legend };
}

function seriesTitle(s: SeriesOfDay, n: number): string {
  const specimen = s.specimen?.name ?? 'unknown specimen';
  return `Series ${n}: ${specimen}, ${s.series.height_m.toFixed(2)} m, ${s.series.timing_method}`;
}

/** A predicted time with, for the standard sphere curve, its own standard uncertainty: "1.596 s ± 1.5 ms". */
function predictedCell(time: number | null, u: number | null): Cell {
  const cell = num(time, 3, 'predicted_time_s', 's');
  return u === null || time === null ? cell : { ...cell, text: `${cell.text} ± ${(u * 1000).toFixed(1)} ms` };
}

function seriesSection(s: SeriesOfDay, n: number): SeriesSection {
  const { series, outcome, drops } = s;
  const rows = seriesDropRows(series, drops, outcome);
  const dropsTable: Table = {
    caption: 'Drops',
    headers: ['drop', 'height', 'time', 'in fit', 'own C_d', 'predicted time', 'residual', 'reason left out / note'],
    empty: 'No drops yet.',
    rows: rows.map((r) => [
      { text: String(r.drop.seq), value: r.drop.seq, field: 'seq' },
      num(r.height_m, 3, 'height_m', 'm'),
      num(r.drop.time_s, 3, 'time_s', 's'),
      txt(r.used ? 'yes' : r.drop.excluded ? 'excluded' : 'no'),
      r.own_drag_coefficient === null ? txt(r.ownMessage ? 'not computable' : '—') : num(r.own_drag_coefficient, 3, 'own_drag_coefficient'),
      predictedCell(r.predicted_time_s, r.predicted_time_standard_uncertainty_s),
      r.residual_s === null ? txt('—') : { text: `${(r.residual_s * 1000).toFixed(1)} ms`, value: r.residual_s, field: 'residual_s' },
      txt([r.drop.excluded ? (r.drop.exclusion_reason ?? 'excluded') : '', r.drop.note].filter(Boolean).join(' · ')),
    ]),
  };
  const base = { id: series.id, title: seriesTitle(s, n), drops: dropsTable };
  if (outcome.kind !== 'ready') {
    return {
      ...base,
      state: outcome.kind,
      verdict: outcome.kind === 'missing' ? `Not computed: ${outcome.message}` : `Cannot be computed: ${outcome.message}`,
      targetMet: null,
      figures: [],
      charts: [],
      budget: { caption: 'Uncertainty budget', headers: [], rows: [], empty: 'No budget: the series is not computed.' },
      bars: [],
      flags: [],
    };
  }
  const r = outcome.result;
  const plots = seriesPlots(outcome, drops, series);
  const charts = [chartView('Height against time', plots.heightTime)];
  if (plots.residuals) charts.push(chartView('Residuals against height', plots.residuals));
  const rel = relativeUncertainty(r);
  return {
    ...base,
    state: 'ready',
    verdict: verdictText(r, rel, series.target_relative_uncertainty),
    targetMet: s.targetMet,
    figures: seriesFigures(r, rel, series.target_relative_uncertainty),
    charts,
    budget: budgetTable(r),
    bars: budgetBars(r),
    flags: seriesFlags(r, drops),
  };
}

function verdictText(r: AnalysisResult, rel: number | null, target: number): string {
  if (r.drag_coefficient === null) {
    return `Drag not resolved: C_d is below ${r.drag_coefficient_upper_bound_95?.toFixed(3)} with 95 % probability. Drop from higher or time more precisely.`;
  }
  const U = 2 * r.drag_coefficient_standard_uncertainty;
  const met = rel !== null && rel <= target;
  return `C_d = ${r.drag_coefficient.toFixed(3)} ± ${U.toFixed(3)} (k = 2); relative standard uncertainty ${((rel ?? 0) * 100).toFixed(1)} %, ${met ? 'within' : 'above'} the target ${(target * 100).toFixed(1)} %.`;
}

function seriesFigures(r: AnalysisResult, rel: number | null, target: number): Figure[] {
  const f: Figure[] = [
    { label: 'C_d', cell: num(r.drag_coefficient, 3, 'drag_coefficient') },
    { label: 'u(C_d)', cell: num(r.drag_coefficient_standard_uncertainty, 4, 'drag_coefficient_standard_uncertainty') },
    { label: '95 % interval (Monte Carlo) from', cell: num(r.drag_coefficient_interval_95[0], 3, 'drag_coefficient_interval_95_low') },
    { label: '95 % interval (Monte Carlo) to', cell: num(r.drag_coefficient_interval_95[1], 3, 'drag_coefficient_interval_95_high') },
    { label: 'relative u(C_d)', cell: rel === null ? txt('—') : { text: `${(rel * 100).toFixed(1)} %`, value: rel, field: 'relative_uncertainty' } },
    { label: 'target', cell: { text: `${(target * 100).toFixed(1)} %`, value: target, field: 'target_relative_uncertainty' } },
    {
      label: 'terminal velocity',
      cell:
        r.terminal_velocity_m_s !== null
          ? num(r.terminal_velocity_m_s, 1, 'terminal_velocity_m_s', 'm/s')
          : { ...num(r.terminal_velocity_lower_bound_m_s, 1, 'terminal_velocity_lower_bound_m_s', 'm/s'), text: `above ${r.terminal_velocity_lower_bound_m_s?.toFixed(1)} m/s` },
    },
    { label: `air density (${r.air.density_source === 'cipm-2007' ? 'CIPM-2007' : 'given'})`, cell: num(r.air.density_kg_m3, 4, 'density_kg_m3', 'kg/m³') },
    { label: `gravity (${r.gravity_source === 'override' ? 'given' : 'WGS84'})`, cell: num(r.gravity_m_s2, 5, 'gravity_m_s2', 'm/s²') },
    { label: 'largest Reynolds number', cell: sci(Math.max(...r.drops.map((d) => d.reynolds_number)), 2, 'reynolds_number_max') },
    { label: 'largest impact energy', cell: num(Math.max(...r.drops.map((d) => d.impact_energy_J)), 2, 'impact_energy_J_max', 'J') },
    { label: 'Monte Carlo draws', cell: { text: String(r.monte_carlo.draws), value: r.monte_carlo.draws, field: 'monte_carlo_draws' } },
  ];
  if (r.timing_offset_s !== undefined) {
    f.push({
      label: 'fitted timing offset',
      cell: { text: `${(r.timing_offset_s * 1000).toFixed(1)} ± ${((r.timing_offset_standard_uncertainty_s ?? 0) * 1000).toFixed(1)} ms`, value: r.timing_offset_s, field: 'timing_offset_s' },
    });
  }
  return f;
}

function budgetTable(r: AnalysisResult): Table {
  const total = r.budget.reduce((s, b) => s + b.contribution ** 2, 0);
  return {
    caption: 'Uncertainty budget of C_d (GUM)',
    headers: ['input', 'type', 'standard uncertainty', 'sensitivity', 'contribution to u(C_d)', 'share of variance', 'degrees of freedom'],
    empty: 'No inputs.',
    rows: [
      ...r.budget.map((b) => [
        txt(b.description ? `${b.description} (${b.input})` : b.input),
        txt(b.evaluation),
        sci(b.standard_uncertainty, 2, 'standard_uncertainty'),
        sci(b.sensitivity, 2, 'sensitivity'),
        sci(b.contribution, 2, 'contribution'),
        { text: `${total > 0 ? ((100 * b.contribution ** 2) / total).toFixed(1) : '0.0'} %` },
        txt(b.degrees_of_freedom === null ? '∞' : String(b.degrees_of_freedom)),
      ]),
      [
        txt('combined'),
        txt(''),
        txt(''),
        txt(''),
        sci(r.gum.combined_standard_uncertainty, 2, 'combined_standard_uncertainty'),
        txt('100 %'),
        txt(r.gum.effective_degrees_of_freedom === null ? '∞' : r.gum.effective_degrees_of_freedom.toFixed(0)),
      ],
    ],
  };
}

function seriesFlags(r: AnalysisResult, drops: SeriesOfDay['drops']): Flag[] {
  const flags: Flag[] = r.warnings.map((w) => ({ severity: w.severity ?? 'warning', code: w.code, message: w.message }));
  for (const h of r.heights) {
    if (h.grubbs?.outlier) {
      const id = r.drops.filter((d) => d.height_m === h.height_m)[h.grubbs.suspect_drop_index]?.id;
      const drop = drops.find((d) => d.id === id);
      flags.push({
        severity: 'warning',
        code: 'grubbs-outlier',
        message: `Drop ${drop?.seq ?? '?'} at ${h.height_m.toFixed(2)} m looks like an outlier (Grubbs' test, G = ${h.grubbs.statistic.toFixed(2)} above ${h.grubbs.critical_value.toFixed(2)} at α = ${h.grubbs.alpha}); it stays in the fit unless excluded.`,
      });
    }
  }
  return flags;
}

type AnyRevision = Revision<BodyOf[keyof BodyOf]>;

/** The record's versions, oldest first: its history, then the current one. */
function versionsOf(record: LogRecord): AnyRevision[] {
  const { id: _id, kind: _kind, created_at: _c, updated_at, rev, device, deleted, history, ...body } = record;
  // A version's reason says why it was replaced: the current one has none yet.
  return [...(history as AnyRevision[]), { rev, device, updated_at, reason: null, deleted, body: body as unknown as AnyRevision['body'] }];
}

function shown(v: unknown): string {
  const s = typeof v === 'string' ? v : JSON.stringify(v);
  return s.length > 40 ? `${s.slice(0, 37)}…` : s;
}

/** Every later version of the day's records (edits, exclusions, deletions): when, which phone, what changed, why. */
function historyTable(records: readonly LogRecord[], recs: DayRecords, day: DayRecord): Table {
  const seriesIds = new Set(records.filter((r) => r.kind === 'series' && r.day_id === day.id).map((r) => r.id));
  const seqOf = (r: LogRecord) => (r.kind === 'drop' ? ` ${r.seq}` : '');
  const mine = records.filter(
    (r) =>
      (r.kind === 'day' && r.id === day.id) ||
      (r.kind === 'reading' && r.day_id === day.id) ||
      (r.kind === 'series' && r.day_id === day.id) ||
      (r.kind === 'drop' && seriesIds.has(r.series_id)) ||
      (r.kind === 'site' && r.id === recs.site?.id) ||
      (r.kind === 'specimen' && recs.specimens.some((p) => p.id === r.id)),
  );
  const rows: { at: string; cells: Cell[] }[] = [];
  for (const record of mine) {
    const versions = versionsOf(record);
    for (let i = 1; i < versions.length; i++) {
      const before = versions[i - 1]!.body as unknown as Record<string, unknown>;
      const after = versions[i]!;
      const body = after.body as unknown as Record<string, unknown>;
      const changed = Object.keys(body).filter((k) => JSON.stringify(body[k]) !== JSON.stringify(before[k]));
      const what = after.deleted && !versions[i - 1]!.deleted ? 'deleted' : changed.map((k) => `${k}: ${shown(before[k])} → ${shown(body[k])}`).join('; ') || 'saved again';
      rows.push({ at: after.updated_at, cells: [txt(after.updated_at.replace('T', ' ').slice(0, 19)), txt(`${record.kind}${seqOf(record)}`), txt(what), txt(versions[i - 1]!.reason ?? ''), txt(after.device)] });
    }
  }
  rows.sort((a, b) => a.at.localeCompare(b.at));
  return {
    caption: 'History of edits',
    headers: ['when (UTC)', 'record', 'what changed', 'reason', 'phone'],
    empty: 'No record of this day was changed after it was first saved.',
    rows: rows.map((r) => r.cells),
  };
}
