import { describe, expect, it } from 'vitest';
import { seriesAnalysisKey } from '../../src/analysis';
import { DEVICE, revise, testDay } from './day-records';

describe('the key of a series’ analysis', () => {
  const day = testDay();
  const key = (drops = day.drops, readings = [day.reading]) => seriesAnalysisKey(day.site, readings, day.specimen, day.series, drops);

  it('is the same for new arrays of the same records', () => {
    expect(key([...day.drops], [day.reading])).toBe(key());
    expect(key(day.drops.map((d) => ({ ...d })))).toBe(key());
  });

  it('changes when a record is revised, added or removed', () => {
    const excluded = revise(day.drops[0]!, { excluded: true, exclusion_reason: 'wind' }, Date.UTC(2026, 6, 3, 12), DEVICE);
    expect(key([excluded, ...day.drops.slice(1)])).not.toBe(key());
    expect(key(day.drops.slice(1))).not.toBe(key());
    expect(key(day.drops, [])).not.toBe(key());
    expect(seriesAnalysisKey(day.site, [day.reading], undefined, day.series, day.drops)).not.toBe(key());
    expect(seriesAnalysisKey(day.site, [day.reading], day.specimen, day.series, day.drops, { monteCarloDraws: 200 })).not.toBe(key());
  });
});
