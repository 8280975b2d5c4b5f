// The sync cost benchmark, against the real Apache (mod_dav) and nginx (dav) servers the tests start: ten phones
// each holding the crew's log of 20 000 drops (each phone recorded a tenth, on days of its own, and all have
// synced), one drop changed on one phone, then another phone's next sync. Prints the requests, the bytes of the
// bodies each way and the time of that sync, and of the changing phone's own sync (its upload).
// Every other phone's next sync does the same work as the one measured (the phones are alike); BENCH_READERS=n
// measures n of them. Run: npm run bench:sync [drops] [phones]
import { loadavg } from 'node:os';
import { execFileSync } from 'node:child_process';
import { apacheMissing, startApache } from '../test/servers/apache';
import { nginxMissing, startNginx } from '../test/servers/nginx';
import type { DavServer } from '../test/servers/dav-server';
import { changeOneDrop, emptyTraffic, fleet, settleFleet, syncPhone, type Traffic } from '../test/sync/fleet';

const DROPS = Number(process.argv[2] ?? 20_000);
const PHONES = Number(process.argv[3] ?? 10);
const READERS = Math.max(1, Math.min(PHONES - 1, Number(process.env.BENCH_READERS ?? 1)));

const kb = (bytes: number) => `${(bytes / 1024).toFixed(1)} KiB`;
const s = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
const load = () => loadavg().map((x) => x.toFixed(2)).join(' ');

function line(who: string, traffic: Traffic, ms: number): string {
  const methods = Object.entries(traffic.byMethod).map(([m, n]) => `${m} ${n}`).join(', ');
  return `  ${who}: ${s(ms)}, ${traffic.requests} requests (${methods}), received ${kb(traffic.received)}, sent ${kb(traffic.sent)}`;
}

async function one(name: string, start: () => Promise<DavServer>): Promise<void> {
  const server = await start();
  try {
    const f = fleet(server, PHONES, DROPS);
    const readers = Array.from({ length: READERS }, (_, i) => i + 1);
    const t0 = performance.now();
    await settleFleet(f, [0, ...readers]);
    console.log(`${name}: ${PHONES} phones, each holding ${f.records.length} records (${DROPS} drops); fleet set up in ${s(performance.now() - t0)}`);
    await changeOneDrop(f.phones[0]!);
    const up = emptyTraffic();
    let t = performance.now();
    const upload = await syncPhone(f.phones[0]!, f.settings, up);
    if (!upload.ok) throw new Error(JSON.stringify(upload.error));
    console.log(line('the phone that changed a drop, its sync', up, performance.now() - t));
    for (const i of readers) {
      // A run that fails on a passing network fault (the server dropping a connection on this loaded machine) is
      // run again, as the phone's back-off would; the figures are those of the run that succeeded.
      let traffic = emptyTraffic();
      let report;
      let ms = 0;
      for (let attempt = 1; ; attempt++) {
        traffic = emptyTraffic();
        t = performance.now();
        report = await syncPhone(f.phones[i]!, f.settings, traffic);
        ms = performance.now() - t;
        if (report.ok || !report.error?.retryable || attempt >= 3) break;
        console.log(`  phone${i}: run ${attempt} failed (${report.error.message}); again`);
      }
      if (!report.ok) throw new Error(JSON.stringify(report.error));
      const merged = report.merged.reduce((n, m) => n + m.updated + m.added, 0);
      console.log(`${line(`phone${i}, its next sync`, traffic, ms)}; records taken in ${merged}; load ${load()}`);
    }
  } finally {
    await server.dispose();
  }
}

async function main(): Promise<void> {
  const commit = execFileSync('git', ['log', '-1', '--format=%h %s'], { encoding: 'utf8' }).trim().slice(0, 100);
  console.log(`Node ${process.version}, commit ${commit}, load ${load()}`);
  if (!apacheMissing()) await one('Apache mod_dav', () => startApache());
  else console.log(`Apache: skipped (${apacheMissing()})`);
  if (!nginxMissing()) await one('nginx dav', () => startNginx());
  else console.log(`nginx: skipped (${nginxMissing()})`);
}

await main();
