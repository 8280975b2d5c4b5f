// The progress line of a long run: shown on stderr only when stderr is a terminal, wiped at the end, and never
// mixed into stdout. Run in process (main from the sources) with streams standing in for the terminal.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PassThrough } from 'node:stream';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main';
import { exportLog } from '../../src/log/export';
import { sampleLog } from '../sync/sample-log';

const work = mkdtempSync(join(tmpdir(), 'plummet-progress-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));
for (const device of ['phoneA', 'phoneB']) {
  writeFileSync(join(work, `plummet-log-${device}.json`), exportLog(sampleLog({ device, seed: device.length + device.charCodeAt(5), dropsPerSeries: 3 }), { device, app_version: '0.1.0' }));
}

async function run(args: string[], terminal: boolean) {
  const stdout = new PassThrough();
  const stderr = new PassThrough();
  const out: string[] = [];
  const err: string[] = [];
  stdout.on('data', (c: Buffer) => out.push(c.toString()));
  stderr.on('data', (c: Buffer) => err.push(c.toString()));
  const code = await main(args, { stdin: new PassThrough(), stdout, stderr, stderrIsTerminal: terminal, cwd: work });
  return { code, stdout: out.join(''), stderr: err.join('') };
}

describe('the progress line', () => {
  it('is written to a terminal while the logs are merged and the series computed, then wiped', async () => {
    const result = await run(['merge', '.'], true);
    expect(result.code, result.stderr).toBe(0);
    expect(result.stderr).toContain('\r\x1b[Kmerging logs 2/2');
    expect(result.stderr).toMatch(/\r\x1b\[Kcomputing series \d+\/\d+/);
    expect(result.stderr.endsWith('\r\x1b[K')).toBe(true);
    expect(result.stdout).not.toContain('\r');
  }, 60_000);

  it('is never written when stderr is a file or a pipe', async () => {
    const result = await run(['check', '.'], false);
    expect(result.code).toBe(0);
    expect(result.stderr).toBe('');
    const terminal = await run(['check', '.'], true);
    expect(terminal.stderr).toContain('checking logs 2/2');
  }, 60_000);
});
