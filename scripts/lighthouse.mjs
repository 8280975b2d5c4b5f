// `npm run lighthouse`: serves dist/ (run `npm run build` first) on a free port of 127.0.0.1, runs
// Lighthouse 12 (its defaults: the mobile preset with simulated throttling) with the system Chromium, writes
// reports/lighthouse.report.json and reports/lighthouse.report.html, and prints the scores.
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { createServer } from 'node:net';

const dist = fileURLToPath(new URL('../dist/', import.meta.url));
if (!existsSync(dist)) {
  console.error('dist/ is missing: run `npm run build` first.');
  process.exit(1);
}
const chromePath = process.env.CHROME_PATH ?? '/usr/bin/chromium';
const flags = [
  '--headless=new',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];
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
let status = 1;
try {
  // The CLI runs in its own process; waiting asynchronously keeps our server answering meanwhile.
  const child = spawn(
    fileURLToPath(new URL('../node_modules/.bin/lighthouse', import.meta.url)),
    [
      `${server.url}/`,
      '--quiet',
      '--only-categories=performance,accessibility,best-practices,seo',
      '--output=json',
      '--output=html',
      '--output-path=reports/lighthouse',
      `--chrome-flags=${flags.join(' ')}`,
    ],
    { stdio: 'inherit', env: { ...process.env, CHROME_PATH: chromePath } },
  );
  // If this script is stopped, the Lighthouse run (and the Chromium it started) must not outlive it.
  const stop = () => child.kill('SIGINT'); // Lighthouse's own handler closes its Chromium on SIGINT
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
  status = await new Promise((resolve) => child.on('exit', (code) => resolve(code ?? 1)));
} finally {
  serverProcess.kill('SIGTERM');
}
const report = JSON.parse(readFileSync('reports/lighthouse.report.json', 'utf8'));
if (report.runtimeError) {
  console.error(`Lighthouse could not measure the page: ${report.runtimeError.code} ${report.runtimeError.message}`);
  process.exit(1);
}
for (const [id, cat] of Object.entries(report.categories)) {
  console.log(`${id.padEnd(16)} ${Math.round((cat.score ?? 0) * 100)}`);
}
const a = report.audits;
console.log(
  `first contentful paint ${a['first-contentful-paint'].displayValue}, largest contentful paint ${a['largest-contentful-paint'].displayValue}, total blocking time ${a['total-blocking-time'].displayValue}, cumulative layout shift ${a['cumulative-layout-shift'].displayValue}`,
);
console.log('reports: reports/lighthouse.report.json, reports/lighthouse.report.html');
process.exit(status);
