// Log format 4: drops with marks along the fall, a clip's evidence, series timed by gates. What the one gate
// accepts and refuses (naming field, value and range, nothing stored changed), and that a log with marks and clips
// round-trips to the byte and stays editable. Demo values (test/log/marks-demo.ts), not measurements.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { canonicalJson } from '../../src/log/canonical';
import { exportLog } from '../../src/log/export';
import { LogFileError, readLogFile } from '../../src/log/export-parse';
import { HybridLogicalClock } from '../../src/log/hlc';
import { gateRecords } from '../../src/log/record-gate';
import { reviseRecord } from '../../src/log/records';
import { LIST_LIMITS } from '../../src/log/fields';
import { validateBody, validateRecord } from '../../src/log/validate';
import type { DropRecord, LogRecord, SeriesRecord } from '../../src/log/types';
import { createMemoryStore } from '../../src/store';
import { previewImport } from '../../src/sync/import-log';
import { dataUrl, demoClip, demoMarks, JPEG_BYTES, logWithMarks, PNG_BYTES, WEBP_BYTES } from './marks-demo';
import { makeAjv, SCHEMA_FILE } from './schema-files';

const root = fileURLToPath(new URL('../../', import.meta.url));
const META = { device: 'phoneB', app_version: '0.5.0' };
const log = logWithMarks();
const clipDrops = log.filter((r): r is DropRecord => r.kind === 'drop' && r.clip !== undefined);
const gateDrops = log.filter((r): r is DropRecord => r.kind === 'drop' && r.release_time_known === true);
const gatesSeries = log.find((r): r is SeriesRecord => r.kind === 'series' && r.gate_distances_m !== undefined)!;
type Json = Record<string, any>;
const copy = <T,>(v: T): T => JSON.parse(JSON.stringify(v));
const { id: _i, kind: _k, created_at: _c, updated_at: _u, rev: _r, device: _d, deleted: _x, history: _h, ...clipBody } = clipDrops[0]!;

/** The problems of the first clip drop's body with `change` made to a copy. */
function dropProblems(change: (body: Json) => void) {
  const body = copy(clipBody) as Json;
  change(body);
  return validateBody('drop', body);
}

/** The single problem `change` causes, which must name the field, quote the value and state the rule. */
function oneProblem(change: (body: Json) => void) {
  const problems = dropProblems(change);
  expect(problems.map((p) => p.message)).toHaveLength(1);
  return problems[0]!;
}

describe('a drop with marks and a clip', () => {
  it('is a valid record, in the demo log of gates and clips, history included', () => {
    expect(clipDrops).toHaveLength(5);
    expect(gateDrops).toHaveLength(5);
    expect(clipDrops.some((d) => d.history.length === 1 && d.history[0]!.body.clip !== undefined)).toBe(true);
    for (const record of log) expect(validateRecord(record), record.id).toEqual([]);
    expect(gateRecords(log)).toEqual([]);
  });

  it('is accepted by the published format 4 schema (ajv, the reference validator)', () => {
    const validate = makeAjv(false).compile(JSON.parse(readFileSync(root + SCHEMA_FILE, 'utf8')));
    expect(validate(JSON.parse(exportLog(log, META))), JSON.stringify(validate.errors)).toBe(true);
  });

  it('round-trips export → import → export to the byte, and stays editable', async () => {
    const text = exportLog(log, META);
    expect(text).toContain('"marks":[');
    expect(text).toContain('"gate_distances_m":[0.5,1,1.5]');
    const read = readLogFile(text).records;
    expect(exportLog(read, META)).toBe(text);
    const store = await createMemoryStore();
    await store.putRecords(read);
    const stored = await store.allRecords({ includeDeleted: true });
    expect(exportLog(stored, META)).toBe(text);
    // A found instant moved by hand is a correction of the drop, with its reason; the old clip stays in the history.
    const drop = stored.find((r): r is DropRecord => r.id === clipDrops[0]!.id)!;
    const clock = new HybridLogicalClock('phoneB');
    const clip = { ...drop.clip!, impact_s: drop.clip!.impact_s + 0.001 };
    const edited = reviseRecord(drop, { clip, time_s: clip.impact_s - clip.release_s }, { device: 'phoneB', clock, now: Date.parse('2026-06-15T10:00:00.000Z'), reason: 'impact one frame later' });
    expect(edited.history.at(-1)!.body.clip).toEqual(drop.clip);
    expect(edited.history.at(-1)!.reason).toBe('impact one frame later');
    expect(gateRecords([edited], { known: (id) => stored.find((r) => r.id === id)?.kind })).toEqual([]);
    await store.putRecords([edited]);
    const again = await store.allRecords({ includeDeleted: true });
    expect(readLogFile(exportLog(again, META)).records.find((r) => r.id === drop.id)).toEqual(edited);
  });

  it('keeps a drop without the new fields as format 3 had it: no marks, no clip, nothing added', () => {
    const plain = log.find((r): r is DropRecord => r.kind === 'drop' && r.marks === undefined);
    expect(plain).toBeUndefined();
    const { marks: _m, release_time_known: _k2, clip: _cl, ...older } = clipBody;
    expect(validateBody('drop', { ...older, time_s: 1.2 })).toEqual([]);
  });
});

describe('marks are refused, naming the mark, the value and the range', () => {
  it('needs 2 to 64 marks', () => {
    expect(oneProblem((b) => (b.marks = b.marks.slice(0, 1))).message).toBe('marks: a list of 1 is too short: must be a list of 2 to 64 marks (distance_m, time_s)');
    const many = Array.from({ length: LIST_LIMITS.marks_max + 1 }, (_, i) => ({ distance_m: i * 0.01, time_s: i * 0.01 }));
    expect(oneProblem((b) => (b.marks = many)).message).toMatch(/^marks: a list of 65 is too long/);
    expect(dropProblems((b) => (b.marks = many.slice(0, 64)))).toEqual([]);
  });

  it('checks each distance and time against its range', () => {
    expect(oneProblem((b) => (b.marks[1].distance_m = -0.1)).message).toBe('marks[1].distance_m: -0.1 is out of range: must be ≥ 0 and ≤ 10000 m');
    expect(oneProblem((b) => (b.marks[2].time_s = 601)).message).toMatch(/^marks\[2\]\.time_s: 601 is out of range: must be ≥ 0 and ≤ 600 s/);
    expect(oneProblem((b) => (b.marks[0].time_s = '0.2')).message).toMatch(/^marks\[0\]\.time_s: "0.2" is not a finite number/);
    expect(oneProblem((b) => (b.marks[0].height_m = 3)).path).toBe('marks[0].height_m');
  });

  it('needs distance and time strictly increasing', () => {
    const p = oneProblem((b) => (b.marks[2].distance_m = b.marks[1].distance_m));
    expect(p.message).toBe('marks[2].distance_m: 0.6 is out of order: must be above marks[1].distance_m (0.6 m): strictly increasing');
    expect(oneProblem((b) => (b.marks[1].time_s = 0.1)).message).toMatch(/^marks\[1\]\.time_s: 0\.1 is out of order: must be above marks\[0\]\.time_s/);
  });

  it('keeps the landing (time_s, height_m) at or after the last mark', () => {
    // A clip drop's time is also the clip's impact − release: both are said.
    const early = dropProblems((b) => (b.time_s = 0.3)).map((p) => p.message);
    expect(early[0]).toMatch(/^time_s: 0\.3 is out of order: must not be before the last mark, marks\[2\]\.time_s/);
    expect(early[1]).toMatch(/^time_s: 0\.3 does not match the clip/);
    expect(oneProblem((b) => (b.height_m = 0.8)).message).toMatch(/^height_m: 0\.8 is out of order: must not be below the last mark, marks\[2\]\.distance_m \(1 m\)/);
    // The landing may be the last mark itself (the last gate at the landing surface), in both or neither.
    const gates = copy(gateDrops[0]!) as Json;
    for (const key of ['id', 'kind', 'created_at', 'updated_at', 'rev', 'device', 'deleted', 'history']) delete gates[key];
    expect(validateBody('drop', gates)).toEqual([]);
    expect(validateBody('drop', { ...gates, height_m: 2 })[0]!.message).toMatch(/^time_s: .* contradicts the marks/);
  });

  it('takes release_time_known as true or false only', () => {
    expect(oneProblem((b) => (b.release_time_known = 'no')).message).toBe('release_time_known: "no" is not true or false: must be true or false');
  });
});

describe("a series' gates are refused, naming the gate", () => {
  const series = copy(gatesSeries) as Json;
  for (const key of ['id', 'kind', 'created_at', 'updated_at', 'rev', 'device', 'deleted', 'history']) delete series[key];
  it('needs 2 to 64 distances, in range, strictly increasing', () => {
    expect(validateBody('series', series)).toEqual([]);
    expect(validateBody('series', { ...series, gate_distances_m: [1] })[0]!.message).toBe('gate_distances_m: a list of 1 is too short: must be a list of 2 to 64 gate distances');
    expect(validateBody('series', { ...series, gate_distances_m: [0.5, 0.5] })[0]!.message).toMatch(/^gate_distances_m\[1\]: 0\.5 is out of order/);
    expect(validateBody('series', { ...series, gate_distances_m: [0.5, 10_001] })[0]!.message).toBe('gate_distances_m[1]: 10001 is out of range: must be ≥ 0 and ≤ 10000 m');
  });
});

describe("a clip's evidence is refused, naming the field, the value and the range", () => {
  it('checks the frame timestamps: at most 8000, strictly increasing, one tracked row each', () => {
    const frames = Array.from({ length: LIST_LIMITS.clip_frames_max + 1 }, (_, i) => i / 240);
    expect(oneProblem((b) => ((b.clip.frame_times_s = frames), (b.clip.track_y_px = frames.map(() => null)))).message).toMatch(
      /^clip\.frame_times_s: a list of 8001 is too long: must be a list of 2 to 8000 frame timestamps/,
    );
    expect(oneProblem((b) => (b.clip.frame_times_s[5] = b.clip.frame_times_s[4])).message).toMatch(/^clip\.frame_times_s\[5\]: .* is out of order/);
    expect(oneProblem((b) => b.clip.track_y_px.pop()).message).toMatch(/^clip\.track_y_px: a list of \d+ is too short: must be a list of \d+ rows, one per frame timestamp/);
    expect(oneProblem((b) => (b.clip.track_y_px[7] = 'low')).message).toMatch(/^clip\.track_y_px\[7\]: "low" is not a finite number: must be ≥ -16384 and ≤ 32768 px/);
  });

  it("takes the release and the impact anywhere on the clip's timeline, 0 to 3600 s (their edges, judged together)", () => {
    const at = (release_s: number, impact_s: number) =>
      dropProblems((b) => Object.assign(b, { clip: { ...b.clip, release_s, impact_s }, time_s: impact_s - release_s }));
    expect(at(0, 1)).toEqual([]);
    expect(at(3599, 3600)).toEqual([]);
    expect(at(-1e-9, 1)[0]!.message).toBe('clip.release_s: -1e-9 is out of range: must be ≥ 0 and ≤ 3600 s');
    expect(at(3599, 3600.000001)[0]!.message).toBe('clip.impact_s: 3600.000001 is out of range: must be ≥ 0 and ≤ 3600 s');
  });

  it('needs the release before the impact, and the drop time their difference', () => {
    expect(oneProblem((b) => (b.clip.impact_s = b.clip.release_s)).message).toMatch(/^clip\.impact_s: 0\.5 is out of order: must be after clip\.release_s \(0\.5 s\)/);
    expect(oneProblem((b) => (b.time_s += 0.01)).message).toMatch(/^time_s: .* does not match the clip: must equal clip\.impact_s − clip\.release_s/);
    expect(oneProblem((b) => (b.clip.u_release_s = 2)).message).toBe('clip.u_release_s: 2 is out of range: must be ≥ 0 and ≤ 1 s');
  });

  it('checks sizes, the fall line, the scale marks and unknown fields', () => {
    expect(oneProblem((b) => (b.clip.width_px = 0.5)).message).toBe('clip.width_px: 0.5 is out of range: must be ≥ 1 and ≤ 16384 px');
    expect(oneProblem((b) => (b.clip.height_px = 20_000)).message).toBe('clip.height_px: 20000 is out of range: must be ≥ 1 and ≤ 16384 px');
    expect(oneProblem((b) => (b.clip.fall_line.y1_px = null)).path).toBe('clip.fall_line.y1_px');
    expect(oneProblem((b) => b.clip.scale.pop()).message).toBe('clip.scale: a list of 1 has a wrong count: must be a list of 0, 2, 3 scale marks (x_px, y_px, height_m)');
    expect(oneProblem((b) => (b.clip.scale[1].height_m = -1)).path).toBe('clip.scale[1].height_m');
    expect(oneProblem((b) => (b.clip.video = 'AAAA')).message).toMatch(/^clip\.video: "AAAA" is not a field of the evidence of a clip/);
    expect(oneProblem((b) => (b.clip.codec = '')).path).toBe('clip.codec');
  });

  it('takes at most 6 key frames, each a PNG, JPEG or WebP data URL of at most 16 KB whose bytes are of that type', () => {
    const frame = (image: string) => ({ time_s: 1, image });
    expect(oneProblem((b) => (b.clip.key_frames = Array.from({ length: 7 }, () => frame(dataUrl('image/png', PNG_BYTES))))).message).toMatch(
      /^clip\.key_frames: a list of 7 is too long: must be a list of 0 to 6 key frames/,
    );
    const big = [...PNG_BYTES, ...new Array(LIST_LIMITS.key_frame_bytes_max - PNG_BYTES.length + 1).fill(7)];
    expect(oneProblem((b) => (b.clip.key_frames[0].image = dataUrl('image/png', big))).message).toMatch(/^clip\.key_frames\[0\]\.image: "data:image\/png;base64,iVBORw0K"… \(16385 bytes\) is too large: must be a data URL .* at most 16384 bytes$/);
    expect(dropProblems((b) => (b.clip.key_frames[0].image = dataUrl('image/png', big.slice(0, -1))))).toEqual([]);
    const huge = 'data:image/png;base64,' + 'A'.repeat(5_000_000);
    expect(oneProblem((b) => (b.clip.key_frames[0].image = huge)).message).toMatch(/\(5000022 characters\) is too large/);
    expect(oneProblem((b) => (b.clip.key_frames[0].image = dataUrl('image/svg+xml', [60, 115, 118, 103]))).message).toMatch(/is not a data URL of an allowed image/);
    expect(oneProblem((b) => (b.clip.key_frames[0].image = 'data:image/png;base64,iVBO$w0K')).message).toMatch(/is not base64/);
    expect(oneProblem((b) => (b.clip.key_frames[0].image = dataUrl('image/png', JPEG_BYTES))).message).toMatch(/is not a PNG image: its bytes must begin as a PNG file does/);
    expect(oneProblem((b) => (b.clip.key_frames[1].image = dataUrl('image/jpeg', PNG_BYTES))).path).toBe('clip.key_frames[1].image');
    const riffNotWebp = [...WEBP_BYTES];
    riffNotWebp[8] = 0x41;
    expect(oneProblem((b) => (b.clip.key_frames[2].image = dataUrl('image/webp', riffNotWebp))).message).toMatch(/is not a WEBP image/);
  });
});

describe('a hostile file with marks or a clip', () => {
  async function refused(change: (records: Json[]) => void): Promise<LogFileError> {
    const store = await createMemoryStore();
    await store.putRecords(log.slice(0, 3) as LogRecord[]);
    const before = canonicalJson(await store.allRecords({ includeDeleted: true }));
    const file = JSON.parse(exportLog(log, META));
    change(file.records);
    const error = await previewImport(store, JSON.stringify(file), 'plummet-log-phoneB.json').then(
      () => null,
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(LogFileError);
    expect(canonicalJson(await store.allRecords({ includeDeleted: true }))).toBe(before);
    return error as LogFileError;
  }
  const clipIndex = (records: Json[]) => records.findIndex((r) => r['clip'] && r['history'].length > 0);

  it('is refused for a key frame too large in a history version, naming it; nothing stored changes', async () => {
    const big = dataUrl('image/png', [...PNG_BYTES, ...new Array(20_000).fill(1)]);
    const error = await refused((records) => (records[clipIndex(records)]!['history'][0].body.clip.key_frames[0].image = big));
    expect(error.message).toMatch(/history\[0\]\.body\.clip\.key_frames\[0\]\.image: "data:image\/png;base64,.*is too large/);
  });

  it('is refused for marks out of order and for a clip of too many frames', async () => {
    const marks = await refused((records) => (records.find((r) => r['marks'])!['marks'][1].time_s = 0));
    expect(marks.message).toMatch(/marks\[1\]\.time_s: 0 is out of order/);
    const frames = Array.from({ length: 9000 }, (_, i) => i / 240);
    const clip = await refused((records) => {
      const c = records[clipIndex(records)]!['clip'];
      c.frame_times_s = frames;
      c.track_y_px = frames.map(() => null);
    });
    expect(clip.message).toMatch(/clip\.frame_times_s: a list of 9000 is too long: must be a list of 2 to 8000 frame timestamps/);
  });
});

describe('demo data', () => {
  it('builds marks and clips the way the tests above expect', () => {
    expect(demoMarks([0.5, 1])).toHaveLength(2);
    expect(demoClip(1).key_frames.map((f) => f.image.slice(0, 16))).toEqual(['data:image/png;b', 'data:image/jpeg;', 'data:image/webp;']);
  });
});
