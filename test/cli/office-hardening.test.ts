/**
 * The office command against hostile paths and files, run as a crew's office runs it (the built bundle as a
 * spawned process, `plummet analyze …`): every case ends with exit status 1 and a message naming the path
 * or field and the value, never a stack trace, never a hang (the spawn's timeout is a guard against a hang, not a
 * measurement).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, lstatSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, truncateSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { INPUT_LIMIT_BYTES, readInputStream } from '../../src/cli/read-input';
import { exportLog } from '../../src/log/export';
import { sampleLog } from '../sync/sample-log';
import { buildCommand, root, runBuilt } from './built-command';

let built: Awaited<ReturnType<typeof buildCommand>>;
beforeAll(async () => {
  built = await buildCommand();
}, 120_000);
afterAll(() => built?.dispose());
const run = (args: string[], input?: string | Buffer) => runBuilt(built.bin, ['analyze', ...args], { input });

const work = mkdtempSync(join(tmpdir(), 'plummet-office-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));
let n = 0;
const fresh = (name: string) => join(work, `${++n}-${name}`);

const logText = exportLog(sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 3 }), { device: 'phoneA', app_version: '0.1.0' });
const logFile = fresh('log.json');
writeFileSync(logFile, logText);
const request = () => JSON.parse(readFileSync(join(root, 'examples/footbridge-ball.json'), 'utf8'));

/** Refused as it should be: status 1, nothing on stdout, the words expected, no stack frame. */
function expectRefused(result: ReturnType<typeof run>, ...words: (string | RegExp)[]) {
  expect(result.error, 'the command ran to its end (no hang, no spawn failure)').toBeUndefined();
  expect(result.status, result.stderr).toBe(1);
  expect(result.stdout).toBe('');
  for (const w of words) typeof w === 'string' ? expect(result.stderr).toContain(w) : expect(result.stderr).toMatch(w);
  expect(result.stderr).not.toMatch(/\n\s+at .+:\d+:\d+/);
}

describe('the office command: where it writes', () => {
  it('refuses an output path that is a file, leaving the file as it was', () => {
    const file = fresh('a-file');
    writeFileSync(file, 'keep me');
    expectRefused(run([logFile, '--csv', file]), `cannot write ${file}`, 'is a file, not a folder');
    expect(readFileSync(file, 'utf8')).toBe('keep me');
  }, 60_000);

  it('refuses an output folder holding a folder named like an output file, writing neither table', () => {
    const out = fresh('out');
    mkdirSync(join(out, 'drops.csv'), { recursive: true });
    expectRefused(run([logFile, '--csv', out]), join(out, 'drops.csv'), 'a folder of that name is in the way');
    expect(existsSync(join(out, 'series.csv'))).toBe(false);
  }, 60_000);

  it('refuses a path under /proc at once instead of spinning', () => {
    expectRefused(run([logFile, '--csv', '/proc/plummet-office-test/out']), 'cannot write /proc/plummet-office-test/out');
    expectRefused(run([logFile, '--csv', '/proc/self/plummet']), 'cannot write /proc/self/plummet');
  }, 120_000);

  it('replaces a symbolic link planted in the output folder instead of writing through it', () => {
    const out = fresh('links');
    mkdirSync(out);
    const target = fresh('precious.txt');
    writeFileSync(target, 'precious');
    symlinkSync(target, join(out, 'drops.csv'));
    symlinkSync(fresh('not-yet-there'), join(out, 'series.csv'));
    const result = run([logFile, '--csv', out]);
    expect(result.status, result.stderr).toBe(0);
    expect(readFileSync(target, 'utf8')).toBe('precious');
    for (const name of ['drops.csv', 'series.csv']) {
      expect(lstatSync(join(out, name)).isFile(), `${name} is a file of its own`).toBe(true);
      expect(lstatSync(join(out, name)).isSymbolicLink()).toBe(false);
    }
    expect(readFileSync(join(out, 'drops.csv'), 'utf8')).toContain('time_s');
    expect(existsSync(join(work, `${n}-not-yet-there`))).toBe(false);
  }, 60_000);
});

describe('the office command: what it reads', () => {
  it('refuses a FIFO without waiting for a writer', () => {
    const fifo = fresh('fifo');
    const made = spawnSync('mkfifo', [fifo]);
    expect(made.status, 'mkfifo is there').toBe(0);
    expectRefused(run([fifo]), fifo, 'a FIFO (named pipe), not a regular file');
  }, 60_000);

  it('refuses /dev/zero and a folder as not regular files', () => {
    expectRefused(run(['/dev/zero']), '/dev/zero is a character device, not a regular file');
    expectRefused(run([work]), `${work} is a folder, not a regular file`);
  }, 120_000);

  it('refuses a file over the size cap before reading it', () => {
    const big = fresh('big.json');
    writeFileSync(big, '');
    truncateSync(big, INPUT_LIMIT_BYTES + 1); // sparse: no disk is used
    expectRefused(run([big]), big, 'is larger than the 256 MiB', `${INPUT_LIMIT_BYTES + 1} bytes`);
  }, 60_000);

  it('reads standard input with -', () => {
    const result = run(['-'], logText);
    expect(result.status, result.stderr).toBe(0);
    expect(JSON.parse(result.stdout).device).toBe('phoneA');
    expectRefused(run(['-'], '[1'), '(standard input) is not valid JSON');
  }, 120_000);

  it('caps standard input while reading it', async () => {
    const mib = new Uint8Array(1024 * 1024).fill(0x20);
    let given = 0;
    async function* endless() {
      for (;;) {
        given++;
        yield mib;
      }
    }
    await expect(readInputStream(endless())).rejects.toThrow(/standard input is larger than the 256 MiB/);
    expect(given).toBe(257);
  });

  it('refuses 100 000 nested arrays as nested too deeply', () => {
    const deep = fresh('deep.json');
    writeFileSync(deep, `${'['.repeat(100_000)}${']'.repeat(100_000)}`);
    expectRefused(run([deep]), `${deep} is nested too deeply`);
    const deepObject = fresh('deep-object.json');
    writeFileSync(deepObject, `{"site":${'{"a":'.repeat(100_000)}1${'}'.repeat(100_000)}}`);
    expectRefused(run([deepObject]), 'nested too deeply');
  }, 120_000);

  it('refuses a denormal diameter with the field and its range', () => {
    const file = fresh('denormal.json');
    const r = request();
    r.specimen.diameter_m = 5e-324;
    writeFileSync(file, JSON.stringify(r));
    expectRefused(run([file]), 'field: specimen.diameter_m', 'value: 5e-324', 'above 0 and at most 10 m', 'code: out-of-range');
  }, 60_000);

  it('reads a log saved with a UTF-8 byte-order mark, or as UTF-16 LE or BE with one, like the plain file', () => {
    const plain = run([logFile]);
    expect(plain.status, plain.stderr).toBe(0);
    const le = Buffer.from(`\ufeff${logText}`, 'utf16le');
    const be = Buffer.from(le).swap16();
    for (const [name, bytes] of [
      ['bom.json', Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(logText)])],
      ['le.json', le],
      ['be.json', be],
    ] as const) {
      const file = fresh(name);
      writeFileSync(file, bytes);
      const result = run([file]);
      expect(result.status, `${name}: ${result.stderr}`).toBe(0);
      expect(result.stdout, name).toBe(plain.stdout);
    }
  }, 120_000);

  it('refuses bytes that are not UTF-8, naming the offset', () => {
    const file = fresh('latin1.json');
    writeFileSync(file, Buffer.concat([Buffer.from('{"note":"caf'), Buffer.from([0xe9]), Buffer.from('"}')]));
    expectRefused(run([file]), `${file}: the file is not UTF-8 text: at byte 12 (0xE9 0x22 0x7D)`);
  }, 60_000);
});

describe('the office command: what a file is', () => {
  it('calls JSON that is neither a log nor a request by its name, listing what it has', () => {
    const other = fresh('other.json');
    writeFileSync(other, JSON.stringify({ name: 'x', items: [1, 2] }));
    expectRefused(run([other]), `${other} is not a Plummet log file nor a series request`, '"name", "items"');
    const array = fresh('array.json');
    writeFileSync(array, '[1,2,3]');
    expectRefused(run([array, '--csv', fresh('never')]), 'is not a Plummet log file nor a series request: it is an array');
  }, 120_000);

  it('names what a nearly complete request lacks, and a log of another format by its format', () => {
    const partial = fresh('partial.json');
    const r = request();
    delete r.timing;
    writeFileSync(partial, JSON.stringify(r));
    expectRefused(run([partial]), 'not a Plummet log file nor a series request', 'a request would also need timing');
    const foreign = fresh('foreign.json');
    writeFileSync(foreign, JSON.stringify({ format: 'someone-else', records: [] }));
    expectRefused(run([foreign]), 'is not a Plummet log', '"someone-else"');
  }, 120_000);

  it('says a request is a request when --csv asks for tables', () => {
    const file = fresh('request.json');
    writeFileSync(file, JSON.stringify(request()));
    expectRefused(run([file, '--csv', fresh('never')]), `${file} is a series request: --csv needs an exported log file`);
  }, 60_000);
});
