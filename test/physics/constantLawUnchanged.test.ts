import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import type { AnalysisRequest } from '../../src/physics/analysisTypes';
import { constantLawRequests, resultJson } from './constantLawRequests';

// Results computed before the scaled sphere law took over the scatter, each drop's C_d and the fitted offset
// (writeConstantLawResults.ts, at the commit named in the file). A series that keeps a constant C_d must not move
// by a single bit.
const stored = JSON.parse(readFileSync(new URL('./fixtures/constant-law-results.json', import.meta.url), 'utf8')) as {
  computed_by_commit: string;
  results: { name: string; request: AnalysisRequest; result: unknown }[];
};

describe('a series that keeps a constant drag coefficient', () => {
  const requests = constantLawRequests();

  it('is the list of requests the stored results were computed from', () => {
    expect(stored.computed_by_commit).toMatch(/^[0-9a-f]{40}$/);
    expect(requests.map((r) => r.name)).toEqual(stored.results.map((r) => r.name));
  });

  it('gives results identical to the bit with those computed before (every field, every drop, every warning)', () => {
    // The stored requests, exactly as analysed then (JSON keeps every double to the bit).
    for (const { name, request, result: before } of stored.results) {
      const result = analyzeSeries(request);
      expect(result.drag_law, name).toBe('constant');
      expect(JSON.parse(resultJson(result)), name).toEqual(before);
    }
  });
});
