// The sync cost benchmark's scenario (bench/sync.bench.ts), small, as a correctness test against the real Apache
// and nginx servers: a fleet in its steady state, one drop changed on one phone; the changing phone writes only
// that day's part and the index, and another phone's next sync reads only those two of the colleague's files,
// takes in the one change and writes back only its own copy of that day's part and its index.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exportLog } from '../../src/log/export';
import type { DropRecord } from '../../src/log/types';
import { deviceIndexName } from '../../src/sync/sync-run';
import { apacheMissing, startApache } from '../servers/apache';
import type { DavServer } from '../servers/dav-server';
import { nginxMissing, startNginx } from '../servers/nginx';
import { changeOneDrop, emptyTraffic, fleet, settleFleet, syncPhone } from './fleet';
import { partsOf } from './folder-log';

const kinds = [
  ['Apache mod_dav', apacheMissing(), startApache],
  ['nginx dav', nginxMissing(), startNginx],
] as const;

describe.each(kinds)('the cost of a sync through %s follows what changed', (_name, missing, start) => {
  if (missing && process.env.CI === 'true') throw new Error(missing);
  let server: DavServer;
  beforeAll(async () => {
    if (!missing) server = await start({});
  });
  afterAll(async () => {
    await server?.dispose();
  });

  it.skipIf(missing)('four phones of a crew; one drop changed on one of them; the next syncs move one day', async () => {
    const f = fleet(server, 4, 1600);
    await settleFleet(f, [0, 1]);
    const [changer, reader] = [f.phones[0]!, f.phones[1]!];
    const changed = await changeOneDrop(changer);
    const day = (await changer.allRecords()).find((r) => r.kind === 'series' && r.id === changed.series_id) as { day_id: string } | undefined;
    const date = ((await changer.allRecords()).find((r) => r.id === day!.day_id) as { date: string }).date;

    const up = emptyTraffic();
    const upload = await syncPhone(changer, f.settings, up);
    expect(upload.error).toBeNull();
    expect(up.log.filter((r) => r.startsWith('PUT'))).toEqual([`PUT /dav/${partsOf('phone0')}/${date}.json`, `PUT /dav/${deviceIndexName('phone0')}`]);
    // Nothing of the other phones is read: their files have not changed since the last run.
    expect(up.log.filter((r) => r.startsWith('GET') && !r.includes('phone0'))).toEqual([]);

    const down = emptyTraffic();
    const report = await syncPhone(reader, f.settings, down);
    expect(report.error).toBeNull();
    expect(down.log.filter((r) => r.startsWith('GET') && !r.includes('phone1'))).toEqual([`GET /dav/${deviceIndexName('phone0')}`, `GET /dav/${partsOf('phone0')}/${date}.json`]);
    expect(down.log.filter((r) => r.startsWith('PUT'))).toEqual([`PUT /dav/${partsOf('phone1')}/${date}.json`, `PUT /dav/${deviceIndexName('phone1')}`]);
    expect(down.requests).toBe(7);
    expect(report.merged.reduce((n, m) => n + m.updated + m.added, 0)).toBe(1);
    expect((reader.records.get(changed.id) as DropRecord).time_s).toBe(changed.time_s);
    // The two phones hold the same log again.
    const whole = (records: Iterable<unknown>) => exportLog([...records] as never, { device: 'x', app_version: 'x' });
    expect(whole(reader.records.values())).toBe(whole(changer.records.values()));
    // One day of the four moves: read from the colleague, written and read back once, plus the listing and the
    // indexes (the whole log would be read and written, and read back, before).
    const logBytes = Buffer.byteLength(whole(reader.records.values()));
    expect(down.received).toBeLessThan(0.6 * logBytes);
    expect(down.sent).toBeLessThan(0.3 * logBytes);
  }, 120_000);
});
