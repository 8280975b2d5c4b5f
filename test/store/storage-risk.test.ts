import { describe, expect, it } from 'vitest';
import { assessRisk, RISK_MESSAGES } from '../../src/store';

const safe = { erased: false, persistent: true, installed: true, unsentChanges: 0, usage_bytes: 1e6, quota_bytes: 1e9 };

describe('assessRisk', () => {
  it('finds nothing at risk when installed, persistent, sent and roomy', () => {
    expect(assessRisk(safe)).toEqual([]);
  });

  it('names each cause on its own', () => {
    expect(assessRisk({ ...safe, installed: false })).toEqual(['not-installed']);
    expect(assessRisk({ ...safe, persistent: false })).toEqual(['not-persistent']);
    expect(assessRisk({ ...safe, unsentChanges: 3 })).toEqual(['unsent-changes']);
    expect(assessRisk({ ...safe, usage_bytes: 0.95e9 })).toEqual(['storage-nearly-full']);
  });

  it('puts an erased log first', () => {
    expect(assessRisk({ ...safe, erased: true, unsentChanges: 2 })).toEqual(['log-erased', 'unsent-changes']);
  });

  it('counts storage nobody promised to keep as at risk, and says nothing about an unknown install state', () => {
    expect(assessRisk({ ...safe, persistent: null, installed: null })).toEqual(['not-persistent']);
  });

  it('has plain words and a way out for every reason', () => {
    for (const text of Object.values(RISK_MESSAGES)) expect(text).toMatch(/Install|Import|Export|export/);
  });
});
