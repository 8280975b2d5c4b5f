// Hostile log files for the fuzz suites (import, and sync through real servers): a real log (a demo day typed into
// a store and written by the app's own exporter) and the mutations a file can suffer, driven by a seeded source.
// The demo day is invented, not measured.
import { canonicalJson } from '../../src/log/canonical';
import { exportLog } from '../../src/log/export';
import type { LogRecord } from '../../src/log/types';
import { createMemoryStore, MemoryDatabase } from '../../src/store';
import { seeded } from './sample-log';
import * as demo from '../log/demo-bodies';

export const T0 = Date.UTC(2026, 5, 14, 9, 0, 0);

// ---------------------------------------------------------------------------------------------------------------
// The real log: typed on phone "A" through the store, exported by exportLog. Phone "B" (the store each case starts
// from) holds what A had sent before its last edits, so an import adds, updates and leaves records unchanged.

export function environment(seed: number, start: number) {
  const next = seeded(seed);
  let now = start;
  return {
    now: () => (now += 1000),
    random: (bytes: Uint8Array) => {
      for (let i = 0; i < bytes.length; i++) bytes[i] = Math.floor(next() * 256);
      return bytes;
    },
  };
}

export async function demoDay(): Promise<{ early: LogRecord[]; file: string }> {
  const a = await createMemoryStore({ environment: environment(1, T0) });
  const site = await a.create('site', demo.site(), { id: demo.SITE_ID });
  await a.create('specimen', demo.steelBall(), { id: demo.SPECIMEN_ID });
  const day = await a.create('day', { ...demo.day(), site_id: site.id }, { id: demo.DAY_ID });
  await a.create('reading', { ...demo.reading(), day_id: day.id }, { id: demo.READING_ID });
  const series = await a.create('series', { ...demo.series(), day_id: day.id, reading_id: demo.READING_ID }, { id: demo.SERIES_ID });
  const drops = [];
  for (let seq = 1; seq <= 4; seq++) drops.push(await a.create('drop', { ...demo.drop(seq), series_id: series.id }));
  const early = await a.allRecords({ includeDeleted: true });
  await a.revise('drop', drops[1]!.id, { time_s: drops[1]!.time_s + 0.004 }, 'retyped from the stopwatch');
  await a.revise('drop', drops[2]!.id, { excluded: true, exclusion_reason: 'hit the railing' }, 'excluded');
  await a.remove('drop', drops[3]!.id, 'a duplicate of drop 3');
  await a.revise('site', site.id, { notes: 'Release from the west railing.' });
  const file = exportLog(await a.allRecords({ includeDeleted: true }), { device: await a.deviceId(), app_version: '0.1.0' });
  a.close();
  return { early, file };
}

/** Everything a memory database holds (records, day counts, drafts, meta), as one canonical text. */
export function dump(db: MemoryDatabase): string {
  return canonicalJson([...db.stores].map(([name, store]) => [name, [...store].sort(([x], [y]) => (x < y ? -1 : 1))]));
}

export function copyOf(base: MemoryDatabase): MemoryDatabase {
  const db = new MemoryDatabase();
  for (const [name, store] of base.stores) for (const [key, value] of store) db.stores.get(name)!.set(key, structuredClone(value));
  return db;
}

// ---------------------------------------------------------------------------------------------------------------
// Mutations. Each takes the file's text and a random source and gives the text (or bytes) to import.

export type Random = () => number;
export type Json = Record<string, unknown>;
export const pick = <T,>(r: Random, list: readonly T[]): T => list[Math.floor(r() * list.length)]!;

/** Every [container, key] of a parsed value, for a mutation to aim at. */
export function slots(value: unknown, out: [Json | unknown[], string | number, string][] = [], path = ''): [Json | unknown[], string | number, string][] {
  if (Array.isArray(value)) value.forEach((v, i) => (out.push([value, i, `${path}[${i}]`]), slots(v, out, `${path}[${i}]`)));
  else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      out.push([value as Json, k, `${path}.${k}`]);
      slots(v, out, `${path}.${k}`);
    }
  }
  return out;
}

export const OTHER_TYPES: unknown[] = ['', 'x', '0', 0, -1, 1.5, true, false, null, [], {}, [1, 2], { a: 1 }, 'null', '2026-13-45'];
export const NUMBERS = [0, -0, -1, 1e-300, 5e-324, 1e300, 1.7976931348623157e308, 2 ** 53 + 1, 0.1, 999999999, -1e-9, 3601, 1e21];
export const NON_FINITE_TEXT = ['NaN', 'Infinity', '-Infinity', '1e999999', '-1e999999', '1' + '0'.repeat(400), '1e309'];
export const UPPER = (s: string) => s.toUpperCase();

export function records(file: Json): Json[] {
  return file.records as Json[];
}

export function textWith(file: Json, marker: string, literal: string): string {
  return JSON.stringify(file).replace(JSON.stringify(marker), literal);
}

export const MUTATIONS: Record<string, (text: string, r: Random) => string | Uint8Array> = {
  types(text, r) {
    const file = JSON.parse(text);
    const [owner, key] = pick(r, slots(file.records));
    (owner as Json)[key as string] = pick(r, OTHER_TYPES);
    return JSON.stringify(file);
  },
  ranges(text, r) {
    const file = JSON.parse(text);
    const numeric = slots(file.records).filter(([o, k]) => typeof (o as Json)[k as string] === 'number');
    const [owner, key] = pick(r, numeric);
    const v = (owner as Json)[key as string] as number;
    (owner as Json)[key as string] = r() < 0.5 ? pick(r, NUMBERS) : v * pick(r, [-1, 10, 1000, 1e-3, 1 + 1e-15, 1 - 1e-15]);
    return JSON.stringify(file);
  },
  'NaN and Infinity'(text, r) {
    const file = JSON.parse(text);
    const numeric = slots(file.records).filter(([o, k]) => typeof (o as Json)[k as string] === 'number');
    const [owner, key] = pick(r, numeric);
    (owner as Json)[key as string] = '@@MARK@@';
    return textWith(file, '@@MARK@@', pick(r, NON_FINITE_TEXT));
  },
  ids(text, r) {
    const file = JSON.parse(text);
    const all = records(file);
    const ids = all.map((x) => x.id as string);
    const target = pick(r, all);
    const idFields = Object.keys(target).filter((k) => k === 'id' || k.endsWith('_id'));
    const field = pick(r, idFields);
    const current = target[field];
    const choices = [
      typeof current === 'string' ? UPPER(current) : 'X',
      pick(r, ids), // another record's id, of any kind
      '00000000-0000-0000-0000-000000000000',
      'ffffffff-ffff-4fff-bfff-ffffffffffff',
      typeof current === 'string' ? current.slice(0, 35) : '',
      typeof current === 'string' ? `${current} ` : '',
      typeof current === 'string' ? current.replace(/-/g, '') : '',
      typeof current === 'string' ? current.replace(/[a-f]/, (c) => c.toUpperCase()) : '',
      null,
    ];
    target[field] = pick(r, choices);
    if (r() < 0.3) target.kind = pick(r, ['site', 'specimen', 'day', 'reading', 'series', 'drop', 'Site', 'note', '']);
    return JSON.stringify(file);
  },
  'revision stamps'(text, r) {
    const file = JSON.parse(text);
    const target = pick(r, records(file));
    const device = String(target.device);
    const stamps = [
      `999999999999999-999999-${device}`,
      `999999999999999-000000-${device}`,
      `${String(target.rev).slice(0, 15)}-999999-${device}`,
      `${String(target.rev).slice(0, 15)}-999998-${device}`,
      `000000000000000-000000-${device}`,
      `000000000000000-000001-${device}`,
      `${String(Date.UTC(2070, 0, 1)).padStart(15, '0')}-000000-${device}`,
      `${String(target.rev).slice(0, 15)}-000000-other`,
      `1000000000000000-000000-${device}`,
      `${String(target.rev).slice(0, 15)}-1000000-${device}`,
      `${String(target.rev).slice(0, 15)}-000000-`,
      String(target.rev).replace(/\d/, '9'),
    ];
    const history = target.history as Json[];
    if (history.length > 0 && r() < 0.5) pick(r, history).rev = pick(r, stamps);
    else target.rev = pick(r, stamps);
    if (r() < 0.2) target.created_at = pick(r, ['0000-01-01T00:00:00.000Z', '1969-12-31T23:59:59.999Z', '9999-12-31T23:59:59.999Z']);
    return JSON.stringify(file);
  },
  histories(text, r) {
    const file = JSON.parse(text);
    const all = records(file);
    const withHistory = all.filter((x) => (x.history as unknown[]).length > 0);
    const target = pick(r, withHistory.length > 0 && r() < 0.7 ? withHistory : all);
    const history = target.history as Json[];
    const other = pick(r, all);
    const entry: Json = history[0] ? structuredClone(history[0]) : { rev: target.rev, device: target.device, updated_at: target.updated_at, reason: null, deleted: false, body: {} };
    const kind = Math.floor(r() * 9);
    if (kind === 0) entry.body = {};
    else if (kind === 1) entry.body = '@@PROTO@@';
    else if (kind === 2) {
      const body = structuredClone(other);
      for (const k of ['id', 'kind', 'created_at', 'updated_at', 'rev', 'device', 'deleted', 'history']) delete body[k];
      entry.body = body; // the body of another record, perhaps of another kind
    } else if (kind === 3) entry.body = '@@DEEP@@';
    else if (kind === 4) entry.rev = `${'9'.repeat(15)}-000000-${String(target.device)}`; // newer than the current version
    else if (kind === 5) history.reverse();
    else if (kind === 6) entry.reason = pick(r, [1, '', 'x'.repeat(20_000), '\\ud800']);
    else if (kind === 7) history.length = 0;
    else delete entry[pick(r, ['rev', 'device', 'updated_at', 'reason', 'deleted', 'body'])];
    if (kind !== 5 && kind !== 7) {
      if (history.length > 0 && r() < 0.5) history[Math.floor(r() * history.length)] = entry;
      else history.push(entry);
    }
    let out = JSON.stringify(file);
    out = out.replace('"@@PROTO@@"', '{"__proto__":{"name":"inherited","notes":""}}');
    out = out.replace('"@@DEEP@@"', `{"name":${'['.repeat(20_000)}${']'.repeat(20_000)}}`);
    return out.replace('"\\\\ud800"', '"\\ud800"');
  },
  '__proto__ and constructor keys'(text, r) {
    const file = JSON.parse(text);
    const objects = slots(file).filter(([o, k]) => {
      const v = (o as Json)[k as string];
      return v !== null && typeof v === 'object' && !Array.isArray(v);
    });
    const [owner, key] = pick(r, objects);
    const key2 = pick(r, ['__proto__', 'constructor', 'prototype', 'toString', 'hasOwnProperty', '__defineGetter__']);
    const value = pick(r, ['{"name":"x","mass_kg":1}', '{}', 'null', '1', '"x"', '{"polluted":true}']);
    ((owner as Json)[key as string] as Json)['@@KEY@@'] = '@@VALUE@@';
    return JSON.stringify(file).replace('"@@KEY@@":"@@VALUE@@"', `${JSON.stringify(key2)}:${value}`);
  },
  'duplicate keys'(text, r) {
    // Text level: JSON.parse keeps the last of two equal keys; a reader that kept the first would see another file.
    const keys = [...text.matchAll(/"([a-z_A-Z]+)":/g)];
    const m = pick(r, keys);
    const value = pick(r, ['0', '-1', '"x"', 'null', 'true', '1e999999', '{}', '[]', '"\\ud800"']);
    const at = m.index!;
    return r() < 0.5 ? `${text.slice(0, at)}"${m[1]}":${value},${text.slice(at)}` : `${text.slice(0, at + m[0].length)}${value},"${m[1]}":${text.slice(at + m[0].length)}`;
  },
  encodings(text, r) {
    const utf8 = new TextEncoder().encode(text);
    const kind = Math.floor(r() * 7);
    if (kind === 0) return new Uint8Array([0xef, 0xbb, 0xbf, ...utf8]); // UTF-8 with a byte-order mark
    if (kind === 1 || kind === 2) {
      const le = kind === 1;
      const out = new Uint8Array(2 + text.length * 2);
      out[0] = le ? 0xff : 0xfe;
      out[1] = le ? 0xfe : 0xff;
      for (let i = 0; i < text.length; i++) {
        const c = text.charCodeAt(i);
        out[2 + 2 * i] = le ? c & 0xff : c >> 8;
        out[3 + 2 * i] = le ? c >> 8 : c & 0xff;
      }
      return out;
    }
    if (kind === 3) {
      // A name in Latin-1 rather than UTF-8: an invalid byte sequence inside a string.
      const at = text.indexOf('"name":"') + 8;
      return new Uint8Array([...new TextEncoder().encode(text.slice(0, at)), 0xe9, ...new TextEncoder().encode(text.slice(at))]);
    }
    if (kind === 4) return new TextEncoder().encode(text.replace(/"notes":"/, '"notes":"\\ud83d'));
    if (kind === 5) return new TextEncoder().encode(text.replace(/"notes":"/, '"notes":"\\udc00\\ud800'));
    return new TextEncoder().encode(text.replace(/"notes":"/, '"notes":"\u0000\u2028\ud83d\ude00'));
  },
  truncations(text, r) {
    return text.slice(0, Math.floor(r() * text.length));
  },
  'byte flips'(text, r) {
    const bytes = new TextEncoder().encode(text);
    const flips = 1 + Math.floor(r() * 3);
    for (let i = 0; i < flips; i++) {
      const at = Math.floor(r() * bytes.length);
      bytes[at] = bytes[at]! ^ (1 << Math.floor(r() * 8));
    }
    return bytes;
  },
  'generated logs'(text, r) {
    // A valid log made different: records dropped, reordered, a text changed; with a mutation of another kind on top.
    const file = JSON.parse(text);
    const all = records(file);
    if (r() < 0.5) file.records = all.filter(() => r() < 0.8);
    else file.records = [...all].sort(() => r() - 0.5);
    const t = pick(r, file.records as Json[]);
    if (t && typeof t.notes === 'string') t.notes = pick(r, ['', 'ok', 'x'.repeat(10_001), '<script>alert(1)</script>', '=1+1', 'ü']);
    return JSON.stringify(file);
  },
};

// ---------------------------------------------------------------------------------------------------------------

