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
 *   With marks along the fall (drops[i].marks, release estimated): every mark's time is a decoded frame's own
 *   presentation timestamp, so frames are not quantised in time; the random part is the timestamp's jitter, a
 *   container's timestamps being whole ticks of its timescale (90 kHz in MPEG-TS, 1/600 s or finer in phone MP4s;
 *   common practice): 1 ms covers it. The detector's position noise is given apart as uncertainty.mark_distance_m
 *   and enters each mark's time over the speed there. The release is fitted (a release shift per drop), so the
 *   release estimate's own uncertainty and any constant delay drop out. The rolling shutter is not a constant: a
 *   sensor read row by row over a readout time of 10–30 ms per frame (common practice for phone sensors) stamps a
 *   row y of an H-row frame about readout·y/H late. Between a release near the top and an impact near the bottom it
 *   acts as one offset (the 0 ± 10 ms above); along the marks it is a delay growing with the distance fallen, which
 *   a release shift cannot absorb and which would read as drag. The marks' analysis therefore carries a series-wide
 *   delay proportional to the distance fallen over the drop's largest distance (the body crossing the fall's rows
 *   in turn), of 0 ± ROLLING_SHUTTER_STANDARD_UNCERTAINTY_S at the bottom (a readout of up to 30 ms over the whole
 *   frame, the fall spanning part of it, either direction of reading: rectangular ±17 ms → 10 ms), as a systematic
 *   budget row and one draw per series in the Monte Carlo (see marksModel.ts).
 * - Light gates: response times well below a millisecond; 1 ms random, 0 ± 0.5 ms systematic (common practice).
 *   With several gates and a known release, the release instant (the start of the timer when the body is let go)
 *   has its own 1 ms jitter shared by every gate of that drop (common practice for an electromagnet or a latch
 *   that starts the timer); each gate's reading has the 1 ms random part.
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
  /**
   * With marks and a known release: the release instant's standard uncertainty, s, one error shared by all the
   * drop's marks (each mark's own reading has standard_uncertainty_s).
   */
  release_standard_uncertainty_s: number;
  /** With marks: the random part of each mark's own time reading, s; null: standard_uncertainty_s. */
  mark_standard_uncertainty_s: number | null;
  source: string;
}

/** The rolling shutter's delay at the bottom of the fall along a video's marks, standard uncertainty, s (see above). */
export const ROLLING_SHUTTER_STANDARD_UNCERTAINTY_S = 0.01;

const HAND = 'Am. J. Phys. 87(2), 110 (2019): start-and-stop N(0, (0.10 s)²); delay 0 ± 0.1 s (common practice, after a 0.225 s sprint hand-timing bias)';

export const TIMING_METHOD_DEFAULTS: Readonly<Record<TimingMethod, TimingMethodDefaults>> = {
  typed: { standard_uncertainty_s: null, offset_s: 0, offset_standard_uncertainty_s: 0, release_standard_uncertainty_s: 0, mark_standard_uncertainty_s: null, source: 'nothing assumed: the crew states the uncertainty' },
  stopwatch: { standard_uncertainty_s: 0.1, offset_s: 0, offset_standard_uncertainty_s: 0.1, release_standard_uncertainty_s: 0, mark_standard_uncertainty_s: null, source: HAND },
  tap: { standard_uncertainty_s: 0.1, offset_s: 0, offset_standard_uncertainty_s: 0.1, release_standard_uncertainty_s: 0, mark_standard_uncertainty_s: null, source: `${HAND}; the screen's touch latency is the same at both taps and cancels` },
  sound: { standard_uncertainty_s: 0.002, offset_s: 0, offset_standard_uncertainty_s: 0.005, release_standard_uncertainty_s: 0, mark_standard_uncertainty_s: null, source: 'onset picking of two sounds (common practice)' },
  video: {
    standard_uncertainty_s: 1 / 30 / Math.sqrt(6),
    offset_s: 0,
    offset_standard_uncertainty_s: 0.01,
    release_standard_uncertainty_s: 0,
    mark_standard_uncertainty_s: 0.001,
    source: 'one frame at 30 frames/s, rectangular at each end: T/√6 (JCGM 100 §4.3.7); rolling shutter 0 ± 10 ms (common practice); with marks: each frame\'s own timestamp, 1 ms jitter, release fitted, rolling shutter a delay growing with the distance fallen, 0 ± 10 ms at the bottom (common practice)',
  },
  gates: {
    standard_uncertainty_s: 0.001,
    offset_s: 0,
    offset_standard_uncertainty_s: 0.0005,
    release_standard_uncertainty_s: 0.001,
    mark_standard_uncertainty_s: 0.001,
    source: 'light-gate response (common practice); with several gates the release instant 1 ms, shared by the drop\'s gates (common practice)',
  },
};
