import { describe, expect, it } from 'vitest';
import { exportNaming, incomingDays, incomingSites, tablesFileStem } from '../../src/ui/send-names';
import { logFileName } from '../../src/log';
import { sampleLog } from '../sync/sample-log';

// The days below are an invented scenario of our own (demo data).
const days = [
  { id: 'd1', date: '2026-06-13', site_name: 'Quarry wall' },
  { id: 'd2', date: '2026-06-14', site_name: 'Tower Hill' },
];

describe('the names of what leaves the phone', () => {
  it('names a day’s file by its own date and site', () => {
    const { date, label } = exportNaming('d1', days, '2026-06-20');
    expect(logFileName('phoneA', date, label)).toBe('plummet-log-phoneA-2026-06-13-Quarry_wall.json');
  });

  it('names the whole log by today and its sites, the latest day’s first', () => {
    expect(exportNaming('all', days, '2026-06-20')).toEqual({ date: '2026-06-20', label: 'Tower Hill-and-1-more' });
    expect(exportNaming('all', [days[0]!], '2026-06-20')).toEqual({ date: '2026-06-20', label: 'Quarry wall' });
    expect(exportNaming('catalogue', days, '2026-06-20')).toEqual({ date: '2026-06-20', label: 'catalogue' });
  });

  it('gives the CSV tables a stem safe in any file system', () => {
    expect(tablesFileStem('2026-06-14', 'Tower Hill/Nord')).toBe('plummet-2026-06-14-Tower_Hill_Nord');
  });
});

describe('what an incoming file holds', () => {
  it('lists its days by date and site name, and says which are new on this phone', () => {
    const log = sampleLog();
    const fileDays = log.filter((r) => r.kind === 'day');
    expect(fileDays.length).toBeGreaterThan(0);
    const listed = incomingDays(log, []);
    expect(listed).toHaveLength(fileDays.length);
    const site = log.find((r) => r.kind === 'site')!;
    expect(listed.every((d) => d.isNew)).toBe(true);
    expect(listed.map((d) => d.site)).toContain((site as { name: string }).name);
    expect(incomingDays(log, log).every((d) => !d.isNew)).toBe(true);
    expect(incomingSites(log)).toContain((site as { name: string }).name);
  });
});
