/**
 * What a timing method brings to a series when the crew says no more: the random part (one drop's standard
 * uncertainty, shrinks with more drops) and the systematic part (a constant start/stop delay, measured minus true,
 * the same in every drop of the series, with its standard uncertainty). Explicit values in the request win.
 *
 * Sources:
 * - Hand timing (stopwatch, a tap on the screen): "Manual timing in physics experiments: Error and uncertainty",
 *   Am. J. Phys. 87(2), 110 (2019): 4304 timekeepers' reactions to an anticipated visual stimulus are N(0.11 s,
 *   (0.07 s)²) each, so a start-and-stop interval is N(0, (0.10 s)²) when both reactions have the same mean. The
 *   same mean is the hope, not the rule: with an anticipated finish, hand timers of a 40-yard dash started
 *   0.065 s late and stopped 0.160 s early, 0.225 s short in all (Meinke et al., Truman State University Student
 *   Research Conference 2009). Hence a delay of 0 declared with a standard uncertainty of 0.1 s (common practice
 *   reading of those two figures).
 * - Sound onsets: after the sound-travel correction the two onsets are picked by the same detector; a soft release
 *   click and a loud impact can still be picked a few milliseconds apart (common practice).
 * - Video: each event is quantised to a frame, rectangular over one frame period for each of the two events, so one
 *   interval's standard uncertainty is T_frame/√6 (JCGM 100:2008 §4.3.7 for each end, combined); at the 30 frames/s
 *   of common phone video (common practice) 13.6 ms. A rolling shutter reads the release (top of the picture) and
 *   the impact (bottom) at different times within a frame: up to about one readout time, 0 ± 10 ms (common practice).
 * - Light gates: response times well below a millisecond; 1 ms random, 0 ± 0.5 ms systematic (common practice).
 * - Typed: times from an instrument the app does not know; nothing is assumed (the crew gives its uncertainty).
 */
export type TimingMethod = 'typed' | 'stopwatch' | 'tap' | 'sound' | 'video' | 'gates';

export const TIMING_METHODS: readonly TimingMethod[] = ['typed', 'stopwatch', 'tap', 'sound', 'video', 'gates'];

export interface TimingMethodDefaults {
  /** One drop's random standard uncertainty, s; null: the crew must give it. */
  standard_uncertainty_s: number | null;
  /** The constant delay, measured minus true, s. */
  offset_s: number;
  offset_standard_uncertainty_s: number;
  source: string;
}

const HAND = 'Am. J. Phys. 87(2), 110 (2019): start-and-stop N(0, (0.10 s)²); delay 0 ± 0.1 s (common practice, after a 0.225 s sprint hand-timing bias)';

export const TIMING_METHOD_DEFAULTS: Readonly<Record<TimingMethod, TimingMethodDefaults>> = {
  typed: { standard_uncertainty_s: null, offset_s: 0, offset_standard_uncertainty_s: 0, source: 'nothing assumed: the crew states the uncertainty' },
  stopwatch: { standard_uncertainty_s: 0.1, offset_s: 0, offset_standard_uncertainty_s: 0.1, source: HAND },
  tap: { standard_uncertainty_s: 0.1, offset_s: 0, offset_standard_uncertainty_s: 0.1, source: `${HAND}; the screen's touch latency is the same at both taps and cancels` },
  sound: { standard_uncertainty_s: 0.002, offset_s: 0, offset_standard_uncertainty_s: 0.005, source: 'onset picking of two sounds (common practice)' },
  video: {
    standard_uncertainty_s: 1 / 30 / Math.sqrt(6),
    offset_s: 0,
    offset_standard_uncertainty_s: 0.01,
    source: 'one frame at 30 frames/s, rectangular at each end: T/√6 (JCGM 100 §4.3.7); rolling shutter 0 ± 10 ms (common practice)',
  },
  gates: { standard_uncertainty_s: 0.001, offset_s: 0, offset_standard_uncertainty_s: 0.0005, source: 'light-gate response (common practice)' },
};
