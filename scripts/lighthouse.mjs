// `npm run lighthouse`: serves dist/ (run `npm run build` first) with the project's own server on a free port
// of 127.0.0.1, runs Lighthouse 12 (its defaults: the mobile preset with simulated throttling) with the system
// Chromium three times (LIGHTHOUSE_RUNS overrides), and prints each run's scores and timings with the machine's
// load average beside it, then the median of the runs: one run moves a lot with what else the machine does.
// Reports: reports/lighthouse-run<N>.report.{json,html}; the median run's are copied to reports/lighthouse.report.*.
import { copyFileSync, existsSync, mkdirSync, readFileSync } from 'node:fs';
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { createServer } from 'node:net';
import { CHROMIUM_ARGS } from './chromium-args.mjs';

const dist = fileURLToPath(new URL('../dist/', import.meta.url));
if (!existsSync(dist)) {
  console.error('dist/ is missing: run `npm run build` first.');
  process.exit(1);
}
const chromePath = process.env.CHROME_PATH ?? '/usr/bin/chromium';
const flags = ['--headless=new', ...CHROMIUM_ARGS];
mkdirSync('reports', { recursive: true });
// The server runs in a process of its own, as `npm start` runs it.
const port = await new Promise((resolve) => {
  const probe = createServer().listen(0, '127.0.0.1', () => {
    const { port } = probe.address();
    probe.close(() => resolve(port));
  });
});
const serverProcess = spawn(process.execPath, [fileURLToPath(new URL('./serve.mjs', import.meta.url))], {
  env: { ...process.env, PORT: String(port), HOST: '127.0.0.1' },
  stdio: ['ignore', 'pipe', 'inherit'],
});
await new Promise((resolve, reject) => {
  serverProcess.stdout.once('data', resolve);
  serverProcess.once('exit', (code) => reject(new Error(`the server exited with ${code}`)));
});
const server = { url: `http://127.0.0.1:${port}` };
const runs = Math.max(1, Number(process.env.LIGHTHOUSE_RUNS ?? 3));
const loadavg = () => (existsSync('/proc/loadavg') ? readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ') : 'n/a');
const results = [];
let status = 0;
let current = null;
// If this script is stopped, the Lighthouse run (and the Chromium it started) must not outlive it.
const stop = () => current?.kill('SIGINT'); // Lighthouse's own handler closes its Chromium on SIGINT
process.once('SIGINT', stop);
process.once('SIGTERM', stop);
try {
  for (let run = 1; run <= runs; run++) {
    const before = loadavg();
    const output = `reports/lighthouse-run${run}`;
    // The CLI runs in its own process; waiting asynchronously keeps our server answering meanwhile.
    current = spawn(
      fileURLToPath(new URL('../node_modules/.bin/lighthouse', import.meta.url)),
      [
        `${server.url}/`,
        '--quiet',
        '--only-categories=performance,accessibility,best-practices,seo',
        '--output=json',
        '--output=html',
        `--output-path=${output}`,
        `--chrome-flags=${flags.join(' ')}`,
      ],
      { stdio: 'inherit', env: { ...process.env, CHROME_PATH: chromePath } },
    );
    const code = await new Promise((resolve) => current.on('exit', (c) => resolve(c ?? 1)));
    const after = loadavg();
    if (code !== 0) {
      status = code;
      console.error(`run ${run}: Lighthouse exited with ${code}`);
      continue;
    }
    const report = JSON.parse(readFileSync(`${output}.report.json`, 'utf8'));
    if (report.runtimeError) {
      status = 1;
      console.error(`run ${run}: Lighthouse could not measure the page: ${report.runtimeError.code} ${report.runtimeError.message}`);
      continue;
    }
    const a = report.audits;
    const scores = Object.fromEntries(Object.entries(report.categories).map(([id, cat]) => [id, Math.round((cat.score ?? 0) * 100)]));
    results.push({
      run,
      output,
      scores,
      fcp: a['first-contentful-paint'].numericValue,
      lcp: a['largest-contentful-paint'].numericValue,
      tbt: a['total-blocking-time'].numericValue,
      cls: a['cumulative-layout-shift'].numericValue,
      before,
      after,
    });
  }
} finally {
  serverProcess.kill('SIGTERM');
}
if (results.length === 0) process.exit(status || 1);
const median = (values) => {
  const v = [...values].sort((x, y) => x - y);
  const mid = Math.floor(v.length / 2);
  return v.length % 2 ? v[mid] : (v[mid - 1] + v[mid]) / 2;
};
const ms = (n) => `${Math.round(n)} ms`;
for (const r of results) {
  console.log(
    `run ${r.run}: performance ${r.scores.performance}, accessibility ${r.scores.accessibility}, best practices ${r.scores['best-practices']}, SEO ${r.scores.seo}; ` +
      `FCP ${ms(r.fcp)}, LCP ${ms(r.lcp)}, TBT ${ms(r.tbt)}, CLS ${r.cls.toFixed(3)}; load average ${r.before} before, ${r.after} after`,
  );
}
const med = {
  performance: median(results.map((r) => r.scores.performance)),
  fcp: median(results.map((r) => r.fcp)),
  lcp: median(results.map((r) => r.lcp)),
  tbt: median(results.map((r) => r.tbt)),
};
console.log(`median of ${results.length}: performance ${med.performance}, FCP ${ms(med.fcp)}, LCP ${ms(med.lcp)}, TBT ${ms(med.tbt)}`);
// The run whose performance score is the median is kept as the report of record.
const kept = [...results].sort((x, y) => x.scores.performance - y.scores.performance)[Math.floor((results.length - 1) / 2)];
copyFileSync(`${kept.output}.report.json`, 'reports/lighthouse.report.json');
copyFileSync(`${kept.output}.report.html`, 'reports/lighthouse.report.html');
console.log(`reports: reports/lighthouse-run1..${runs}.report.{json,html}; run ${kept.run} (the median) also as reports/lighthouse.report.*`);
process.exit(status);
