// Phones whose clocks disagree by years, and files whose revision stamps are at or beyond the clock's range:
// several in-memory log stores merging each other's exports through the real import path. Every phone must
// keep saving, no received stamp may drag a phone's clock far ahead of its own time, and after everyone has
// merged everyone else's file all phones hold the same log.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { canonicalJson } from '../../src/log/canonical';
import { exportLog } from '../../src/log/export';
import { CLOCK_AHEAD_LIMIT_MS, parseHlc, formatHlc } from '../../src/log/hlc';
import { recordsFromClockAhead } from '../../src/log/clock-ahead';
import type { LogRecord, SiteRecord } from '../../src/log/types';
import { createMemoryStore, type LogStore } from '../../src/store';
import { applyImport, previewImport } from '../../src/sync/import-log';
import { fakeEnvironment, type FakeEnvironment } from '../store/fake-environment';
import * as demo from '../log/demo-bodies';
import { idMaker } from './sample-log';

const T0 = Date.UTC(2026, 5, 14, 9, 0, 0);
const YEAR = 365.25 * 86_400_000;
/** The most a received stamp may move a phone's clock ahead of its wall time: one hour (see src/log/hlc.ts). */
const AHEAD_LIMIT_MS = 3_600_000;

interface Phone {
  store: LogStore;
  fake: FakeEnvironment;
  device: string;
  /** How far this phone's wall clock is from the true time (ms; years for some). */
  skew: number;
}

async function phone(skew: number): Promise<Phone> {
  const fake = fakeEnvironment(T0 + skew);
  const store = await createMemoryStore({ environment: fake.environment });
  return { store, fake, device: await store.deviceId(), skew };
}

const dump = async (p: Phone) => canonicalJson(await p.store.allRecords({ includeDeleted: true }));

/** The phone's whole log as a file, imported by another phone through preview and apply, as the Send screen does. */
async function send(from: Phone, to: Phone): Promise<void> {
  const text = exportLog(await from.store.allRecords({ includeDeleted: true }), { device: from.device, app_version: '0.1.0' });
  const { file } = await previewImport(to.store, text);
  await applyImport(to.store, file);
}

/** A file from a phone whose stamps say `ms`, with one site in it (a hostile or broken clock). */
function fileStampedAt(ms: number, counter: number, id: string, createdAt = '2026-06-14T09:00:00.000Z'): string {
  const device = 'farphone';
  const site: SiteRecord = {
    ...demo.site(),
    name: `from a clock at ${ms}`,
    id,
    kind: 'site',
    created_at: createdAt,
    updated_at: createdAt,
    rev: formatHlc({ ms, counter, device }),
    device,
    deleted: false,
    history: [],
  };
  return exportLog([site], { device, app_version: '0.1.0' });
}

/** Imports the file if the gate lets it in; a refusal must name the field. Returns whether it was taken. */
async function offer(to: Phone, text: string): Promise<boolean> {
  let preview;
  try {
    preview = await previewImport(to.store, text);
  } catch (e) {
    expect((e as { field: unknown }).field).toMatch(/records\[0\]\.(rev|created_at|updated_at)/);
    return false;
  }
  await applyImport(to.store, preview.file);
  return true;
}

/** The phone saves something new; its stamp must be no further ahead of its wall time than the limit. */
async function save(p: Phone, name: string): Promise<SiteRecord> {
  const site = await p.store.create('site', { ...demo.site(), name });
  expect(parseHlc(site.rev).ms - p.fake.environment.now(), `stamp ${site.rev} of a new record`).toBeLessThanOrEqual(AHEAD_LIMIT_MS);
  return site;
}

const CEILING_MS = 999_999_999_999_999;

describe('a clock that cannot be poisoned', () => {
  it('states the bound this test holds phones to', () => {
    expect(CLOCK_AHEAD_LIMIT_MS).toBe(AHEAD_LIMIT_MS);
  });

  it('a file stamped at the top of the clock’s range is refused with the field and range named, and saving goes on', async () => {
    const p = await phone(0);
    const text = fileStampedAt(CEILING_MS, 999_999, idMaker(7)());
    await expect(previewImport(p.store, text)).rejects.toMatchObject({ field: 'records[0].rev' });
    await expect(previewImport(p.store, text)).rejects.toThrow(/9999-12-31T23:59:59\.999Z/);
    await save(p, 'after the ceiling');
  });

  it('a file stamped decades ahead is merged as data but does not drag the clock; the record is flagged', async () => {
    const p = await phone(0);
    const id = idMaker(8)();
    expect(await offer(p, fileStampedAt(T0 + 40 * YEAR, 999_999, id))).toBe(true);
    expect((await p.store.allRecords()).map((r) => r.id)).toContain(id);
    expect(recordsFromClockAhead(await p.store.allRecords(), p.fake.environment.now()).map((r) => r.id)).toEqual([id]);
    await save(p, 'after the far-ahead file');
    // The crew can still change and remove the far-ahead record; the new version sorts after it.
    const renamed = await p.store.revise('site', id, { name: 'renamed here' });
    expect(renamed.rev > formatHlc({ ms: T0 + 40 * YEAR, counter: 999_999, device: 'farphone' })).toBe(true);
    const gone = await p.store.remove('site', id, 'a test entry from a phone with a wrong clock');
    expect(gone.deleted).toBe(true);
    await save(p, 'after editing the far-ahead record');
  });

  it('a stamp or a creation time before 1970 (year 0) is refused at the gate with the field and range named', async () => {
    const p = await phone(0);
    const pre1970 = fileStampedAt(T0, 0, idMaker(9)(), '1969-12-31T23:59:59.000Z');
    await expect(previewImport(p.store, pre1970)).rejects.toMatchObject({ field: 'records[0].created_at' });
    await expect(previewImport(p.store, pre1970)).rejects.toThrow(/1970-01-01T00:00:00\.000Z/);
    const yearZero = fileStampedAt(T0, 0, idMaker(10)(), '0000-01-01T00:00:00.000Z');
    await expect(previewImport(p.store, yearZero)).rejects.toMatchObject({ field: 'records[0].created_at' });
    const negative = fileStampedAt(T0, 0, idMaker(11)()).replace(/"rev":"\d{15}/, '"rev":"-00000000001000');
    await expect(previewImport(p.store, negative)).rejects.toMatchObject({ field: expect.stringMatching(/^records\[0\]\.rev$|rev/) });
    await save(p, 'after the old stamps');
  });

  // Phones with clocks years apart edit, exchange files in any order and now and then take in a hostile file.
  type Step =
    | { op: 'create'; phone: number }
    | { op: 'rename'; phone: number; pick: number }
    | { op: 'remove'; phone: number; pick: number }
    | { op: 'send'; from: number; to: number }
    | { op: 'hostile'; phone: number; at: 'ceiling' | 'decades' | 'top-counter' };
  const stepArb: fc.Arbitrary<Step> = fc.oneof(
    fc.record({ op: fc.constant('create' as const), phone: fc.nat({ max: 3 }) }),
    fc.record({ op: fc.constant('rename' as const), phone: fc.nat({ max: 3 }), pick: fc.nat() }),
    fc.record({ op: fc.constant('remove' as const), phone: fc.nat({ max: 3 }), pick: fc.nat() }),
    fc.record({ op: fc.constant('send' as const), from: fc.nat({ max: 3 }), to: fc.nat({ max: 3 }) }),
    fc.record({ op: fc.constant('hostile' as const), phone: fc.nat({ max: 3 }), at: fc.constantFrom('ceiling' as const, 'decades' as const, 'top-counter' as const) }),
  );
  // One honest phone, one a few minutes fast, one years slow, one decades fast.
  const skewArb = fc.tuple(fc.constant(0), fc.integer({ min: 0, max: 10 * 60_000 }), fc.integer({ min: -8, max: -2 }).map((y) => y * YEAR), fc.integer({ min: 10, max: 60 }).map((y) => y * YEAR));

  it('every phone keeps saving and all phones converge to the same log (fast-check)', async () => {
    await fc.assert(
      fc.asyncProperty(skewArb, fc.array(stepArb, { minLength: 1, maxLength: 25 }), fc.integer({ min: 1, max: 1_000_000 }), async (skews, steps, seed) => {
        const phones = await Promise.all(skews.map((s) => phone(s)));
        const nextId = idMaker(seed);
        let n = 0;
        const live = async (p: Phone) => (await p.store.allRecords({ includeDeleted: false })) as LogRecord[];
        for (const step of steps) {
          for (const p of phones) p.fake.advance(1000);
          if (step.op === 'create') await save(phones[step.phone]!, `site ${n++}`);
          else if (step.op === 'rename' || step.op === 'remove') {
            const p = phones[step.phone]!;
            const records = await live(p);
            if (records.length === 0) continue;
            const target = records[step.pick % records.length]!;
            if (step.op === 'rename') await p.store.revise('site', target.id, { name: `renamed ${n++}` });
            else await p.store.remove('site', target.id, `removed in step ${n++}`);
          } else if (step.op === 'send') {
            if (step.from !== step.to) await send(phones[step.from]!, phones[step.to]!);
          } else {
            const p = phones[step.phone]!;
            const ms = step.at === 'ceiling' ? CEILING_MS : step.at === 'decades' ? T0 + 45 * YEAR : T0 + 1000;
            await offer(p, fileStampedAt(ms, step.at === 'decades' ? 42 : 999_999, nextId()));
            await save(p, `after a ${step.at} file ${n++}`);
          }
        }
        for (const p of phones) await save(p, `last save of ${p.device}`);
        // Everyone merges everyone else's file, twice round: then every phone has seen every version.
        for (let round = 0; round < 2; round++) for (const to of phones) for (const from of phones) if (from !== to) await send(from, to);
        const dumps = await Promise.all(phones.map(dump));
        for (const d of dumps) expect(d).toBe(dumps[0]);
      }),
      { numRuns: 40, seed: 1313 },
    );
    // 40 runs of up to 25 steps over four phones: about 1.5 s on a quiet machine, past vitest's 5 s default under load.
  }, 60_000);
});
