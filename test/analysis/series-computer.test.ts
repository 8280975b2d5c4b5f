import { describe, expect, it } from 'vitest';
import { analyzeSeriesRecords, physicsSeriesComputer, SeriesIncomplete, seriesRequest } from '../../src/analysis';
import { logCsv, seriesInputs } from '../../src/log/csv-tables';
import { parseCsv } from '../log/csv-reader';
import { excludedCopy, testDay } from './day-records';

describe('the CSV tables and the screens', () => {
  it('compute the same numbers for a series, to the digit', () => {
    const day = testDay();
    const copy = excludedCopy(day.drops[2]!, 7, '00000000-0000-4000-8000-000000000007');
    const records = [...day.records, copy];
    const screen = analyzeSeriesRecords(day.site, [day.reading], day.specimen, day.series, [...day.drops, copy]);
    if (screen.kind !== 'ready') throw new Error('the screen could not compute the series');
    const input = seriesInputs(records)[0]!;
    const table = physicsSeriesComputer()(input);
    expect(table.drag_coefficient).toBe(screen.result.drag_coefficient);
    expect(table.drag_coefficient_standard_uncertainty).toBe(screen.result.drag_coefficient_standard_uncertainty);
    expect(table.drag_coefficient_interval_95).toEqual(screen.result.drag_coefficient_interval_95);
    expect(table.timing_offset_s).toBe(screen.result.timing_offset_s);
    expect(table.air_density_kg_m3).toBe(screen.result.air.density_kg_m3);
    expect(table.drops!.map((d) => [d.drop_id, d.drag_coefficient, d.residual_s])).toEqual(screen.result.drops.map((d) => [d.id, d.drag_coefficient, d.residual_s]));
  });

  it('write each drop row with its own drop’s numbers, joined by id', () => {
    const day = testDay();
    const screen = analyzeSeriesRecords(day.site, [day.reading], day.specimen, day.series, day.drops);
    if (screen.kind !== 'ready') throw new Error('the screen could not compute the series');
    const csv = logCsv(day.records, physicsSeriesComputer());
    const rows = parseCsv(csv.drops);
    const header = rows[0]!;
    const col = (name: string) => header.indexOf(name);
    for (const row of rows.slice(1)) {
      const result = screen.result.drops.find((d) => d.id === row[col('drop_id')])!;
      // The tables round: times to the microsecond, a drop's own C_d to four significant digits.
      expect(Math.abs(Number(row[col('residual_s')]) - result.residual_s)).toBeLessThanOrEqual(0.5e-6 + 1e-15);
      expect(Number(row[col('drag_coefficient')])).toBe(Number(result.drag_coefficient!.toPrecision(4)));
      // The predicted time's own uncertainty (the standard sphere curve's), as the result gives it for that height.
      const spread = screen.result.prediction.heights!.find((h) => h.height_m === result.height_m)!.time_standard_uncertainty_s;
      expect(spread).toBeGreaterThan(0);
      expect(Math.abs(Number(row[col('u_predicted_time_s')]) - spread)).toBeLessThanOrEqual(0.5e-6 + 1e-15);
    }
  });

  it('refuse an incomplete series with the missing part’s code, read by the tables and the office command', () => {
    const day = testDay();
    const records = day.records.filter((r) => r.kind !== 'reading');
    const input = seriesInputs(records)[0]!;
    expect(() => seriesRequest(input)).toThrow(SeriesIncomplete);
    try {
      seriesRequest(input);
    } catch (error) {
      expect((error as SeriesIncomplete).code).toBe('series-without-reading');
    }
    const rows = parseCsv(logCsv(records, physicsSeriesComputer()).series);
    expect(rows[1]![rows[0]!.indexOf('error_code')]).toBe('series-without-reading');
  });
});
