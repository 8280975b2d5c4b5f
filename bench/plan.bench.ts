/**
 * Speed of the planner on this machine: `npm run bench:plan`.
 *
 * Prints the median time of one planDrop call with a target (the Planner screen's request: a ball, the day's
 * air, a 5 % target, up to 30 drops from at most 50 m) and of a series' "what would it take" advice (up to
 * 50 drops from at most 100 m). Medians of repeated runs after a warm-up; the load average is printed
 * because other work on a shared machine moves these numbers.
 */
import { cpus, loadavg } from 'node:os';
import { planDrop, type DropPlanRequest } from '../src/physics/index';

function median(run: () => void, samples: number): number {
  for (let i = 0; i < 3; i++) run();
  const times: number[] = [];
  for (let i = 0; i < samples; i++) {
    const t0 = performance.now();
    run();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(samples / 2)]!;
}

// An invented ball on an invented day (demo data).
const screen: DropPlanRequest = {
  site: { latitude_deg: 46.1, elevation_m: 430 },
  air: { temperature_C: 17.5, pressure_Pa: 96_120, pressure_reference: 'station', relative_humidity_pct: 55 },
  specimen: { shape: 'sphere', mass_kg: 0.21, diameter_m: 0.095 },
  timing: { standard_uncertainty_s: 0.03 },
  uncertainty: { mass_kg: 0.0005, diameter_m: 0.0003, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3, height_m: 0.01 },
  height_m: 10,
  target_relative_uncertainty: 0.05,
  max_height_m: 50,
  max_drops: 30,
};
const advice: DropPlanRequest = { ...screen, timing: { standard_uncertainty_s: 0.004 }, drag_coefficient: 0.47, height_m: 12, max_height_m: 100, max_drops: 50 };

let sink = 0;
const a = median(() => (sink += planDrop(screen).target?.smallest_height_m ?? 0), 15);
const b = median(() => (sink += planDrop(advice).target?.smallest_height_m ?? 0), 15);
console.log(`planDrop, Planner screen request (≤ 30 drops, ≤ 50 m): ${a.toFixed(2)} ms (median)`);
console.log(`planDrop, a series' advice (≤ 50 drops, ≤ 100 m): ${b.toFixed(2)} ms (median)`);
console.log(`load average ${loadavg().map((x) => x.toFixed(2)).join(' ')} on ${cpus().length} cores${sink === 0 ? ' ' : ''}`);
