/**
 * Speed of the physics core on this machine: `npm run bench`.
 *
 * Prints: one drop's inversion (median, µs); one five-drop 14 m series with the full GUM budget and the
 * adaptive Monte Carlo (median, ms; target ≤ 8 ms), beside the same with a fixed 20 000 draws and a 1 mm bead
 * under the scaled sphere curve; a five-drop series of video marks (20 a drop) through the marks' model; and the closed-form fall time against
 * integrating the same fall with odex (a general-purpose integrator) and with our own
 * Dormand–Prince, side by side as a ratio. Medians of repeated runs after a warm-up; the load
 * average is printed because other work on a shared machine moves these numbers.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { cpus, loadavg } from 'node:os';
import { analyzeSeries, createRandom, dragCoefficientFromTime, fallDistance, fallParameters, fallTime, fallWithVariableDrag, validateAnalysisRequest, type AnalysisRequest } from '../src/physics/index';
import { AirColumn, FREE_AIR_GRAVITY_GRADIENT_PER_S2 } from '../src/physics/airColumn';
import { fallThroughColumn } from '../src/physics/fallThroughColumn';
import { TALL_CROSSWIND_SERIES } from '../test/physics/tallCrosswindSeries';

interface OdexSolver {
  absoluteTolerance: number;
  relativeTolerance: number;
  maxSteps: number;
  solve(f: (x: number, y: number[]) => number[], x0: number, y0: number[], xEnd: number): { y: number[] };
}
const odex = createRequire(import.meta.url)('odex') as { Solver: new (n: number) => OdexSolver };

/** Median over `samples` runs of the time per call of `run` (called `batch` times per sample), in ms. */
function median(run: () => void, samples: number, batch = 1): number {
  for (let i = 0; i < Math.max(3, samples / 5); i++) for (let j = 0; j < batch; j++) run();
  const times: number[] = [];
  for (let i = 0; i < samples; i++) {
    const t0 = performance.now();
    for (let j = 0; j < batch; j++) run();
    times.push((performance.now() - t0) / batch);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(samples / 2)]!;
}

/** The same median of the process's CPU time per call (user + system, ms): steadier than the clock on a loaded machine. */
function cpuMedian(run: () => void, samples: number): number {
  for (let i = 0; i < 3; i++) run();
  const times: number[] = [];
  for (let i = 0; i < samples; i++) {
    const c0 = process.cpuUsage();
    run();
    const c = process.cpuUsage(c0);
    times.push((c.user + c.system) / 1000);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(samples / 2)]!;
}

const example = (name: string) => validateAnalysisRequest(JSON.parse(readFileSync(new URL(`../examples/${name}`, import.meta.url), 'utf8')));
let sink = 0;

// 1. One drop's inversion: the C_d that reproduces one measured time.
const ball = {
  mass_kg: 0.18,
  area_m2: (Math.PI * 0.07 ** 2) / 4,
  volume_m3: (Math.PI * 0.07 ** 3) / 6,
  density_kg_m3: 1.137,
  gravity_m_s2: 9.8061,
  buoyancy: true,
  added_mass_coefficient: 0.5,
};
let k = 0;
const inversionMs = median(() => (sink += dragCoefficientFromTime(ball, 14, 1.7 + 1e-5 * (k++ % 1000))), 101, 2000);

// 2. A five-drop series: validation, air, fit, GUM budget, 20 000-draw Monte Carlo, prediction.
const series = example('footbridge-ball.json');
const seriesMs = median(() => (sink += analyzeSeries(series).drag_coefficient_estimate), 31);
const seriesCpuMs = cpuMedian(() => (sink += analyzeSeries(series).drag_coefficient_estimate), 31);
const seriesDraws = analyzeSeries(series).monte_carlo;
const fixedSeries = { ...series, options: { ...series.options, monte_carlo_draws: 20_000 } };
const fixedMs = median(() => (sink += analyzeSeries(fixedSeries).drag_coefficient_estimate), 31);
// A 1 mm glass bead timed five times from 1 m: speed-dependent drag (the scaled standard sphere curve).
const bead = validateAnalysisRequest({
  site: { latitude_deg: 46.1, elevation_m: 430 },
  air: { temperature_C: 19, pressure_Pa: 96_120, pressure_reference: 'station', relative_humidity_pct: 55 },
  specimen: { shape: 'sphere', mass_kg: 1.309e-6, diameter_m: 0.001 },
  drops: [0.483, 0.479, 0.476, 0.474, 0.478].map((t) => ({ height_m: 1, time_s: t })),
  timing: { standard_uncertainty_s: 0.004 },
  uncertainty: { height_m: 0.003, mass_kg: 1e-8, diameter_m: 5e-6, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3 },
});
const beadResult = analyzeSeries(bead);
const beadMs = median(() => (sink += analyzeSeries(bead).drag_coefficient_estimate), 15);
const offsetSeries = example('stairwell-box-offset.json');
const offsetMs = median(() => (sink += analyzeSeries(offsetSeries).drag_coefficient_estimate), 15);

// 3. The same fall, closed form against integration.
const params = fallParameters({ ...ball, drag_coefficient: 0.48 });
const h = 14;
const closedMs = median(() => (sink += fallTime(h + 1e-9 * (k++ % 7), params)), 101, 20000);
const solver = new odex.Solver(2);
solver.absoluteTolerance = 1e-10;
solver.relativeTolerance = 1e-10;
solver.maxSteps = 100000;
const g = params.effective_gravity_m_s2;
const kd = params.drag_constant_per_m;
const tFall = fallTime(h, params);
// odex integrates to a given time (it has no event location): the closed-form time, checked against h.
const odexMs = median(() => (sink += solver.solve((_t, [, v]) => [v!, g - kd * v! * v!], 0, [0, 0], tFall).y[0]!), 51, 10);
const odexDistance = solver.solve((_t, [, v]) => [v!, g - kd * v! * v!], 0, [0, 0], tFall).y[0]!;
const dpBody = { effective_gravity_m_s2: g, drag_constant_per_unit_cd_per_m: kd / 0.48, reynolds_per_speed_s_m: 1, dragCoefficient: () => 0.48 };
const ownMs = median(() => (sink += fallWithVariableDrag(h, dpBody, 1e-10).time_s), 51, 10);
const ownTime = fallWithVariableDrag(h, dpBody, 1e-10).time_s;

// 4. A five-drop 3000 m series through the air column with a 4 m/s crosswind, full budget and 20 000-draw Monte
// Carlo (invented scenario: a 0.5 kg, 100 mm ball, hand-timed; test/physics/tallCrosswindSeries.ts).
const tall = validateAnalysisRequest(TALL_CROSSWIND_SERIES);
const tallMs = median(() => (sink += analyzeSeries(tall).drag_coefficient_estimate), 7);

// 5. The stratified fall (still air: the quadrature) against the same fall by odex driving the full equations.
const column = new AirColumn(
  { height_m: 0, temperature_K: 290.65, pressure_Pa: 96120, gasFactor: (1.1505 * 290.65) / 96120, verticalWind_m_s: 0, windSpeed_m_s: 0 },
  9.8061,
  0.0065,
);
const tallBody = { mass_kg: 0.5, area_m2: (Math.PI * 0.1 ** 2) / 4, volume_m3: (Math.PI * 0.1 ** 3) / 6, characteristic_length_m: 0.1, buoyancy: true, added_mass_coefficient: 0.5, drag_coefficient: 0.5 };
const stratifiedMs = median(() => (sink += fallThroughColumn(3000 + 1e-9 * (k++ % 7), tallBody, column, 1e-10, true).time_s), 51, 20);
const stratifiedTime = fallThroughColumn(3000, tallBody, column, 1e-10, true).time_s;
const odexTall = new odex.Solver(2);
odexTall.absoluteTolerance = 1e-10;
odexTall.relativeTolerance = 1e-10;
odexTall.maxSteps = 1_000_000;
const tallRhs = (_t: number, [d, v]: number[]): number[] => {
  const z = 3000 - d!;
  const rho = column.density(z);
  const me = 0.5 + 0.5 * rho * tallBody.volume_m3;
  const g = 9.8061 - FREE_AIR_GRAVITY_GRADIENT_PER_S2 * z;
  return [v!, (g * (0.5 - rho * tallBody.volume_m3)) / me - ((rho * 0.5 * tallBody.area_m2) / (2 * me)) * v! * Math.abs(v!)];
};
const odexTallMs = median(() => (sink += odexTall.solve(tallRhs, 0, [0, 0], stratifiedTime).y[0]!), 11, 2);
const odexTallDistance = odexTall.solve(tallRhs, 0, [0, 0], stratifiedTime).y[0]!;

// A five-drop series of video marks, 20 per drop (a 70 mm, 5 g ball from 2 m, an invented scenario of our own; 1 ms
// timestamp jitter and 2 mm detector noise, seeded): the marks' fit, its full budget and the adaptive Monte Carlo.
const markNoise = createRandom(12);
const markFall = fallParameters({ mass_kg: 0.005, area_m2: (Math.PI * 0.07 ** 2) / 4, volume_m3: (Math.PI * 0.07 ** 3) / 6, density_kg_m3: 1.12, gravity_m_s2: 9.806, added_mass_coefficient: 0.5, drag_coefficient: 0.47 });
const clipDuration = fallTime(2, markFall);
const marksSeries: AnalysisRequest = {
  site: { latitude_deg: 46.1, elevation_m: 430 },
  air: { temperature_C: 19, pressure_Pa: 96_120, pressure_reference: 'station', relative_humidity_pct: 55 },
  specimen: { shape: 'sphere', diameter_m: 0.07, mass_kg: 0.005 },
  drops: Array.from({ length: 5 }, () => {
    const marks = Array.from({ length: 20 }, (_, i) => {
      const t = 0.12 + ((clipDuration - 0.12) * i) / 19;
      return { distance_m: fallDistance(t, markFall) + 0.002 * markNoise.normal(), time_s: t - 0.004 + 0.001 * markNoise.normal() };
    });
    return { height_m: marks[19]!.distance_m, time_s: marks[19]!.time_s, release_time_known: false, marks };
  }),
  timing: { standard_uncertainty_s: 0.001, method: 'video' },
  uncertainty: { mass_kg: 0.00005, diameter_m: 0.0002, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3, mark_distance_m: 0.002, mark_scale_relative: 0.003 },
};
const marksMs = median(() => (sink += analyzeSeries(marksSeries).drag_coefficient_estimate), 5);
const marksDraws = analyzeSeries(marksSeries).monte_carlo;

const us = (ms: number): string => `${(ms * 1000).toFixed(2)} µs`;
console.log(`Plummet physics benchmark — Node ${process.version}, ${cpus().length} cores, load average ${loadavg().map((l) => l.toFixed(2)).join(' ')}`);
console.log('');
console.log(`one drop's inversion (C_d from one time), median:            ${us(inversionMs)}`);
console.log(`five-drop 14 m series, full budget + adaptive Monte Carlo:  ${seriesMs.toFixed(2)} ms  (CPU time ${seriesCpuMs.toFixed(2)} ms; target ≤ 8 ms; ${seriesDraws.draws} draws in ${seriesDraws.adaptive?.batches} batches, stabilized ${seriesDraws.adaptive?.stabilized})`);
console.log(`  the same with a fixed 20 000 draws:                        ${fixedMs.toFixed(2)} ms`);
console.log(`  a 1 mm bead, five drops from 1 m, drag law ${beadResult.drag_law}:   ${beadMs.toFixed(2)} ms  (${beadResult.monte_carlo.draws} draws)`);
console.log(`  (eight drops from four heights with a fitted offset:      ${offsetMs.toFixed(2)} ms)`);
console.log(`five-drop series of video marks, 20 a drop, full budget + adaptive Monte Carlo: ${marksMs.toFixed(0)} ms  (${marksDraws.draws} draws in ${marksDraws.adaptive?.batches} batches)`);
console.log('');
console.log(`the same 14 m fall of the 70 mm ball, time to impact:`);
console.log(`  closed form                                  ${us(closedMs).padStart(12)}   1×`);
console.log(`  odex (GBS extrapolation), tolerance 1e-10    ${us(odexMs).padStart(12)}   ${(odexMs / closedMs).toFixed(0)}× the closed form  (distance error ${(odexDistance / h - 1).toExponential(1)})`);
console.log(`  our Dormand–Prince 5(4) with event, 1e-10    ${us(ownMs).padStart(12)}   ${(ownMs / closedMs).toFixed(0)}× the closed form  (time error ${(ownTime / tFall - 1).toExponential(1)})`);
console.log('');
console.log(`five-drop 3000 m series through the air column, 4 m/s crosswind, full budget + 20 000-draw Monte Carlo: ${tallMs.toFixed(1)} ms  (target ≤ 100 ms)`);
console.log(`the 3000 m fall in still stratified air, time to impact:`);
console.log(`  our quadrature (48 + 96 panels, Richardson)  ${us(stratifiedMs).padStart(12)}   1×`);
console.log(`  odex, tolerance 1e-10, same equations        ${us(odexTallMs).padStart(12)}   ${(odexTallMs / stratifiedMs).toFixed(0)}× the quadrature  (odex's distance at our time: error ${(odexTallDistance / 3000 - 1).toExponential(1)})`);
if (!Number.isFinite(sink)) console.log('(sink)', sink);
