/**
 * The office command's speed on this machine: `npm run bench:cli`.
 *
 * 1. Start-up: `plummet --help` through bin/plummet.mjs and the built bundle, against a bare `node -e 0`, run
 *    alternately in the same run (median of 15 each after two warm-ups; target: at most 3 times the bare start).
 * 2. A season folder: 1000 generated log files of a typical day (bench/office-day-logs.ts: a site, readings,
 *    3 to 5 specimens, 4 to 6 series of 5 to 15 drops each) merged and every series computed in one call of
 *    `plummet merge --csv DIR --json` (target: at most 60 s).
 * The load average is printed beside each figure: other work on a shared machine moves them.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync, statSync, writeFileSync, readdirSync } from 'node:fs';
import { loadavg, tmpdir, cpus } from 'node:os';
import { join } from 'node:path';
import { buildCommand } from '../test/cli/built-command';
import { officeDayLog } from './office-day-logs';

const FILES = Number(process.env['PLUMMET_BENCH_FILES'] ?? 1000);
const load = () => loadavg().map((x) => x.toFixed(2)).join(' ');
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

function timed(args: string[], cwd?: string): { ms: number; status: number | null; stdout: string; stderr: string } {
  const t0 = performance.now();
  const r = spawnSync(process.execPath, args, { cwd, encoding: 'utf8', maxBuffer: 512 * 1024 * 1024 });
  return { ms: performance.now() - t0, status: r.status, stdout: r.stdout, stderr: r.stderr };
}

const built = await buildCommand();
const work = mkdtempSync(join(tmpdir(), 'plummet-bench-cli-'));
try {
  console.log(`node ${process.version}, ${cpus().length} cores, load before: ${load()}`);

  const bare: number[] = [];
  const help: number[] = [];
  for (let i = 0; i < 17; i++) {
    const b = timed(['-e', '0']);
    const h = timed([built.bin, '--help']);
    if (h.status !== 0) throw new Error(`plummet --help failed: ${h.stderr}`);
    if (i >= 2) {
      bare.push(b.ms);
      help.push(h.ms);
    }
  }
  const ratio = median(help) / median(bare);
  console.log(`start-up: node -e 0 median ${median(bare).toFixed(1)} ms; plummet --help median ${median(help).toFixed(1)} ms; ratio ${ratio.toFixed(2)} (target ≤ 3) [load ${load()}]`);

  const folder = join(work, 'season');
  mkdirSync(folder);
  let bytes = 0;
  for (let i = 0; i < FILES; i++) {
    const text = officeDayLog(i);
    bytes += Buffer.byteLength(text);
    writeFileSync(join(folder, `plummet-log-phone${String(i).padStart(4, '0')}.json`), text);
  }
  console.log(`season folder: ${readdirSync(folder).length} files, ${(bytes / 1e6).toFixed(1)} MB [load ${load()}]`);
  // The CPU time too (GNU time, when the machine has it): on a busy machine the wall time says more about the others.
  const merge = [built.bin, 'merge', '--json', '--csv', join(work, 'out'), '--out', join(work, 'out', 'merged.json'), folder];
  const withTime = existsSync('/usr/bin/time');
  const t0 = performance.now();
  const child = withTime
    ? spawnSync('/usr/bin/time', ['-f', 'cpu-seconds %U %S', process.execPath, ...merge], { encoding: 'utf8', maxBuffer: 512 * 1024 * 1024 })
    : spawnSync(process.execPath, merge, { encoding: 'utf8', maxBuffer: 512 * 1024 * 1024 });
  const run = { ms: performance.now() - t0, status: child.status, stdout: child.stdout, stderr: child.stderr };
  if (run.status !== 0) throw new Error(`plummet merge exited ${run.status}: ${run.stderr.slice(0, 2000)}`);
  const cpu = /cpu-seconds ([\d.]+) ([\d.]+)/.exec(run.stderr);
  const cpuText = cpu ? `, CPU ${cpu[1]} s user + ${cpu[2]} s system` : '';
  const report = JSON.parse(run.stdout) as { files: unknown[]; records: number; series: { verdict: string; drops_used: number }[] };
  const drops = report.series.reduce((n, s) => n + s.drops_used, 0);
  const verdicts = new Map<string, number>();
  for (const s of report.series) verdicts.set(s.verdict, (verdicts.get(s.verdict) ?? 0) + 1);
  console.log(
    `merge of ${report.files.length} files: ${report.records} records, ${report.series.length} series, ${drops} drops used; ` +
      `${(run.ms / 1000).toFixed(1)} s in one call (target ≤ 60 s)${cpuText}, ${(run.ms / report.series.length).toFixed(1)} ms a series; ` +
      `merged log ${(statSync(join(work, 'out', 'merged.json')).size / 1e6).toFixed(1)} MB; verdicts ${[...verdicts].map(([v, n]) => `${n} ${v}`).join(', ')} [load ${load()}]`,
  );
} finally {
  built.dispose();
  rmSync(work, { recursive: true, force: true });
}
