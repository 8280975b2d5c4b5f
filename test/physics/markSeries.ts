/**
 * Simulated series with marks (an invented scenario of our own): a 70 mm foam ball of 5 g (C_d 0.47, from
 * memory a sphere's subcritical value) dropped from 2 m, the truth for the marks' fit and coverage tests. Every
 * input is drawn around its recorded value by its declared uncertainty; the fall itself is the closed form
 * (fallModel.ts, checked against the textbook form and an ODE integrator in its own tests).
 *
 * - video: five clips at 240 frames/s, release estimated (unknown), each frame's timestamp with 1 ms jitter, the
 *   detector's position with 2 mm noise, one scale error per clip (0.3 %), one rolling-shutter delay per series
 *   (10 ms at the bottom), every `stride`-th frame kept as a mark (8 to 30 marks a drop).
 * - gates: five drops, release known (the gates' timer started by the release, 1 ms jitter per drop), 2 to 4 gates
 *   with 1 ms each, each gate's position off by its tape error (1 mm, the same in every drop), one delay per
 *   series (0.5 ms).
 */
import type { AnalysisRequest, DropInput } from '../../src/physics/analysisTypes';
import type { RandomSource } from '../../src/physics/createRandom';
import { fallDistance, fallTime, type FallParameters } from '../../src/physics/fallModel';
import { prepareSetup } from '../../src/physics/seriesSetup';

export const BALL = { shape: 'sphere' as const, diameter_m: 0.07, mass_kg: 0.005 };
export const BALL_CD = 0.47;
export const SITE = { latitude_deg: 46.1, elevation_m: 430 };
export const AIR = { temperature_C: 19, pressure_Pa: 96_120, pressure_reference: 'station' as const, relative_humidity_pct: 55 };
const INPUTS_U = { mass_kg: 0.00005, diameter_m: 0.0002, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3 };

export interface MarkSeriesOptions {
  kind: 'video' | 'gates';
  random: RandomSource;
  drops?: number;
  /** Video: keep every stride-th frame (default 6: about 26 marks from 2 m). Gates: how many gates (2 to 4). */
  stride?: number;
  gates?: number;
  draws?: number;
  /** Leave out the noise-free check of the truth's k (for the bench). */
  cd?: number;
}

/** The truth's fall parameters with the true inputs. */
export function trueFall(specimen: typeof BALL, air: typeof AIR, cd: number): FallParameters {
  const setup = prepareSetup({ site: SITE, air, specimen, drops: [{ height_m: 1, time_s: 1 }], timing: { standard_uncertainty_s: 0.001 } });
  const k = (setup.density_kg_m3 * cd * setup.geometry.area_m2) / (2 * setup.effectiveMass_kg);
  return { effective_gravity_m_s2: setup.effectiveGravity_m_s2, drag_constant_per_m: k, effective_mass_kg: setup.effectiveMass_kg };
}

export function markSeriesRequest(o: MarkSeriesOptions): AnalysisRequest {
  const r = o.random;
  const n = () => r.normal();
  const u = INPUTS_U;
  const specimen = { ...BALL, mass_kg: BALL.mass_kg + u.mass_kg * n(), diameter_m: BALL.diameter_m + u.diameter_m * n() };
  const air = { ...AIR, temperature_C: AIR.temperature_C + u.temperature_C * n(), pressure_Pa: AIR.pressure_Pa + u.pressure_Pa * n(), relative_humidity_pct: AIR.relative_humidity_pct + u.relative_humidity_pct * n() };
  const p = trueFall(specimen, air, o.cd ?? BALL_CD);
  const count = o.drops ?? 5;
  const drops: DropInput[] = [];
  if (o.kind === 'video') {
    const frame = 1 / 240;
    const stride = o.stride ?? 6;
    const shutter = 0.01 * n();
    const height = 2;
    const landing = fallTime(height, p);
    for (let i = 0; i < count; i++) {
      const scale = 1 + 0.003 * n();
      const phase = frame * r.uniform();
      const releaseEstimate = (frame / 3) * n();
      const marks: { distance_m: number; time_s: number }[] = [];
      for (let f = 1; f * frame - phase < landing; f += stride) {
        const t = f * frame - phase;
        const d = fallDistance(t, p);
        if (d < 0.05) continue;
        // Read a little late lower in the picture (rolling shutter); the detector sees the row, the scale maps it.
        const readLate = shutter * (d / height);
        const distance = (d * scale + 0.002 * n());
        const time = t + readLate + 0.001 * n() - releaseEstimate;
        const before = marks[marks.length - 1];
        if (before && !(distance > before.distance_m && time > before.time_s)) continue;
        marks.push({ distance_m: Number(distance.toFixed(5)), time_s: Number(time.toFixed(6)) });
      }
      drops.push({ marks: marks.slice(0, 64), release_time_known: false } as DropInput);
    }
  } else {
    const gates = [0.5, 1.0, 1.5, 2.0].slice(4 - (o.gates ?? 4));
    const tape = gates.map(() => 0.001 * n());
    const delay = 0.0005 * n();
    for (let i = 0; i < count; i++) {
      const release = 0.001 * n();
      drops.push({
        marks: gates.map((g, j) => ({ distance_m: g, time_s: Number((fallTime(g + tape[j]!, p) + delay + release + 0.001 * n()).toFixed(6)) })),
      } as DropInput);
    }
  }
  return {
    site: SITE,
    air: AIR,
    specimen: BALL,
    drops,
    timing: { standard_uncertainty_s: 0.001, method: o.kind },
    uncertainty: o.kind === 'video' ? { ...INPUTS_U, mark_distance_m: 0.002, mark_scale_relative: 0.003 } : { ...INPUTS_U, height_m: 0.001 },
    ...(o.draws !== undefined ? { options: { monte_carlo_draws: o.draws } } : {}),
  };
}
