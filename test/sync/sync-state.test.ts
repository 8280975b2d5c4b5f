// When the listing alone may be trusted to say a file is unchanged (no request for it).
import { describe, expect, it } from 'vitest';
import type { DavResource } from '../../src/sync/multistatus';
import { listedUnchanged, remoteState, skippedFiles, emptySyncState } from '../../src/sync/sync-state';

const at = (s: number) => new Date(Date.UTC(2026, 6, 1, 9, 0, s)).toUTCString();

function listed(lastModified: string, contentLength = 100, etag: string | null = null): DavResource {
  return { url: 'https://office.example/dav/f.json', name: 'f.json', collection: false, etag, lastModified, contentLength };
}

describe('listedUnchanged', () => {
  it('trusts a version read at least a second after it was written, and not one read within that second', () => {
    const settled = remoteState({ etag: null, lastModified: at(10), contentLength: 100, date: at(11) }, 'h');
    const fresh = remoteState({ etag: null, lastModified: at(10), contentLength: 100, date: at(10) }, 'h');
    expect(listedUnchanged(settled, listed(at(10)), at(20))).toBe(true);
    expect(listedUnchanged(settled, listed(at(12)), at(20))).toBe(false);
    expect(listedUnchanged(settled, listed(at(10), 101), at(20))).toBe(false);
    expect(listedUnchanged(fresh, listed(at(10)), at(20))).toBe(false);
  });

  it('trusts a file dated well ahead of the server clock while the clock is well before that time, then reads it once', () => {
    // Read at 09:00:05 a file dated 09:10:00 (its copy kept a fast clock's time).
    const ahead = remoteState({ etag: null, lastModified: at(600), contentLength: 100, date: at(5) }, 'h');
    expect(ahead.settled).toBe(false);
    expect(listedUnchanged(ahead, listed(at(600)), at(30))).toBe(true);
    expect(listedUnchanged(ahead, listed(at(600)), at(539))).toBe(true);
    // A write since shows as another time (the server's own, before 09:10:00).
    expect(listedUnchanged(ahead, listed(at(31)), at(32))).toBe(false);
    // Within a minute of the file's time (or past it), a write could carry the same time: read it again.
    expect(listedUnchanged(ahead, listed(at(600)), at(540))).toBe(false);
    expect(listedUnchanged(ahead, listed(at(600)), at(700))).toBe(false);
    // Without the listing's time nothing is assumed.
    expect(listedUnchanged(ahead, listed(at(600)), null)).toBe(false);
  });

  it('does not trust a file only seconds ahead (a file system clock a little off the server clock), until it settles', () => {
    const near = remoteState({ etag: null, lastModified: at(50), contentLength: 100, date: at(5) }, 'h');
    expect(listedUnchanged(near, listed(at(50)), at(6))).toBe(false);
  });

  it('compares Apache tags of a file ahead by the listing time, as Apache clamps Last-Modified of a GET to its Date', () => {
    const ahead = remoteState({ etag: '"64-abc"', lastModified: at(5), contentLength: 100, date: at(5) }, 'h');
    expect(listedUnchanged(ahead, listed(at(600), 100, '"64-abc"'), at(30))).toBe(true);
    expect(listedUnchanged(ahead, listed(at(600), 100, '"64-abd"'), at(30))).toBe(false);
  });

  it('always reads a file it could not take in last time (no time it was seen is kept)', () => {
    const passing = { ...remoteState({ etag: null, lastModified: at(600), contentLength: 100, date: at(5) }, ''), settled: false, seen_at: null };
    expect(listedUnchanged(passing, listed(at(600)), at(30))).toBe(false);
  });
});

describe('skippedFiles', () => {
  it('lists the files kept with a problem and the own file, by name', () => {
    const state = emptySyncState('https://office.example/dav/');
    const version = { etag: null, lastModified: at(1), contentLength: 1, date: at(3) };
    state.files['z.json'] = remoteState(version, 'h', { code: 'log-not-a-log', message: 'not a log' });
    state.files['a.json'] = remoteState(version, 'h');
    state.files['b.json'] = remoteState(version, 'h', { code: 'record-invalid', message: 'bad', device: 'phoneB', record: 'r1', field: 'time_s' });
    state.own_problem = { name: 'plummet-log-me.json', code: 'log-truncated', message: 'cut' };
    expect(skippedFiles(state).map((f) => f.name)).toEqual(['b.json', 'plummet-log-me.json', 'z.json']);
    expect(skippedFiles(state)[0]).toMatchObject({ device: 'phoneB', record: 'r1', field: 'time_s' });
    expect(skippedFiles(null)).toEqual([]);
  });
});
