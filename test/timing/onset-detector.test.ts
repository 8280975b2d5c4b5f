import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { OnsetDetector, SoundIntervalPairer, type Onset, type SoundInterval } from '../../src/timing';
import { IMPACT_CLICK, RATE, RELEASE_CLICK, addClick, blocks, noise, quantize16, zeroGap, type ClickShape } from './signals';

// The test signals are our own: Gaussian noise at a phone microphone's background level in a quiet outdoor
// spot (about −54 dBFS, common practice) with synthetic clicks added at chosen samples.
const NOISE_RMS = 0.002;

function run(signal: Float32Array, sizes: readonly number[] = [128], firstFrame = 0) {
  const detector = new OnsetDetector({ sampleRate_Hz: RATE });
  const onsets: Onset[] = [];
  for (const [block, frame] of blocks(signal, sizes, firstFrame)) onsets.push(...detector.process(block, frame));
  detector.flush();
  return { onsets, gaps: detector.gaps, detector };
}

function intervals(signal: Float32Array, sizes: readonly number[] = [128]): SoundInterval[] {
  const detector = new OnsetDetector({ sampleRate_Hz: RATE });
  const pairer = new SoundIntervalPairer(RATE);
  const out: SoundInterval[] = [];
  for (const [block, frame] of blocks(signal, sizes)) {
    for (const onset of detector.process(block, frame)) {
      const interval = pairer.push(onset, detector.gaps);
      if (interval) out.push(interval);
    }
  }
  return out;
}

function dropSignal(release: number, impact: number, length: number, seed: number, impactShape: ClickShape = IMPACT_CLICK): Float32Array {
  const signal = noise(length, NOISE_RMS, seed);
  addClick(signal, release, RELEASE_CLICK);
  addClick(signal, impact, impactShape);
  return signal;
}

describe('OnsetDetector', () => {
  it('finds a release click and an impact in noise at the very samples they start', () => {
    const signal = dropSignal(30_011, 83_377, 120_000, 1);
    const { onsets, gaps } = run(signal);
    expect(onsets.map((o) => o.frame)).toEqual([30_011, 83_377]);
    expect(gaps).toEqual([]);
  });

  it('counts frames from the absolute index of the first block', () => {
    const signal = dropSignal(30_011, 83_377, 120_000, 2);
    const { onsets } = run(signal, [128], 9_876_543);
    expect(onsets.map((o) => o.frame - 9_876_543)).toEqual([30_011, 83_377]);
  });

  it('places a click that starts in the last sample of a block', () => {
    // 128 · 300 − 1 = 38 399: the click's first sample ends one block, the rest falls in the next.
    const signal = dropSignal(38_399, 90_000, 120_000, 3);
    expect(run(signal).onsets.map((o) => o.frame)).toEqual([38_399, 90_000]);
  });

  it('places a soft click at its first sample although the envelope triggers some samples later', () => {
    // 0.02 full scale is 10× the noise RMS: loud enough to pass the amplitude threshold (5× RMS) at once,
    // too soft for the 1 ms energy envelope to pass 20× the background in a single sample.
    const signal = noise(2 * RATE, NOISE_RMS, 19);
    addClick(signal, 40_000, { amplitude: 0.02, frequency_Hz: 600, decay_s: 0.01 });
    const detector = new OnsetDetector({ sampleRate_Hz: RATE, lookBack_s: 0 });
    const late = [...blocks(signal, [128])].flatMap(([b, f]) => detector.process(b, f));
    expect(late).toHaveLength(1);
    expect(late[0]!.frame).toBeGreaterThan(40_002);
    expect(run(signal).onsets.map((o) => o.frame)).toEqual([40_000]);
  });

  it('measures the interval to within one sample for any positions, block sizes, noise and 16-bit rounding', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0.5 * RATE, max: 1.5 * RATE }),
        fc.integer({ min: Math.round(0.2 * RATE), max: Math.round(2.5 * RATE) }),
        fc.array(fc.integer({ min: 1, max: 4096 }), { minLength: 1, maxLength: 5 }),
        fc.double({ min: 0.0005, max: 0.004, noNaN: true }),
        fc.integer({ min: 0, max: 3 }),
        fc.boolean(),
        fc.integer(),
        (release, interval, sizes, rms, rise, pcm, seed) => {
          const impact = release + interval;
          let signal = noise(impact + RATE / 2, rms, seed);
          addClick(signal, release, { ...RELEASE_CLICK, rise });
          addClick(signal, impact, { ...IMPACT_CLICK, rise });
          if (pcm) signal = quantize16(signal);
          const found = intervals(signal, sizes);
          expect(found).toHaveLength(1);
          expect(found[0]!.problem).toBeNull();
          expect(Math.abs(found[0]!.frames - interval)).toBeLessThanOrEqual(1);
        },
      ),
      { numRuns: 40, seed: 20_260_614 },
    );
  });

  it('gives one onset for an impact that rattles and rings', () => {
    const signal = dropSignal(30_000, 70_000, 120_000, 4, { amplitude: 0.6, frequency_Hz: 400, decay_s: 0.03 });
    // Two bounces 25 ms and 90 ms after the first contact.
    addClick(signal, 70_000 + Math.round(0.025 * RATE), { amplitude: 0.4, frequency_Hz: 700, decay_s: 0.005 });
    addClick(signal, 70_000 + Math.round(0.09 * RATE), { amplitude: 0.3, frequency_Hz: 700, decay_s: 0.005 });
    expect(run(signal).onsets.map((o) => o.frame)).toEqual([30_000, 70_000]);
  });

  it('takes a second impact after the hold-off as a new onset', () => {
    const signal = dropSignal(30_000, 60_000, 120_000, 5);
    addClick(signal, 60_000 + Math.round(0.4 * RATE), IMPACT_CLICK);
    expect(run(signal).onsets.map((o) => o.frame)).toEqual([30_000, 60_000, 60_000 + Math.round(0.4 * RATE)]);
  });

  it('finds nothing in noise alone, nor when the background doubles', () => {
    const quiet = noise(3 * RATE, NOISE_RMS, 6);
    const louder = noise(3 * RATE, 2 * NOISE_RMS, 7);
    const signal = new Float32Array(6 * RATE);
    signal.set(quiet, 0);
    signal.set(louder, 3 * RATE);
    expect(run(signal).onsets).toEqual([]);
  });

  it('does not take the start of the noise after silence for an onset', () => {
    // Streams begin with exact zeros until the microphone delivers; the noise that follows is not a sound.
    const signal = new Float32Array(3 * RATE);
    signal.set(noise(2 * RATE, NOISE_RMS, 8), RATE);
    addClick(signal, Math.round(2.2 * RATE), IMPACT_CLICK);
    const { onsets, gaps } = run(signal);
    expect(onsets.map((o) => o.frame)).toEqual([Math.round(2.2 * RATE)]);
    expect(gaps).toEqual([{ start_frame: 0, end_frame: RATE, kind: 'zeros' }]);
  });

  it('ignores a click that is not above the absolute floor even in digital near-silence', () => {
    // Background of ±1 LSB of 16-bit audio and a "click" of 0.001 full scale: below minimumLevel 0.002.
    const signal = quantize16(noise(2 * RATE, 1 / 32768, 9));
    addClick(signal, RATE, { amplitude: 0.001, frequency_Hz: 1000, decay_s: 0.002 });
    expect(run(signal).onsets).toEqual([]);
  });

  it('records a run of exact zeros as a gap and takes no onset from the noise coming back', () => {
    const signal = noise(2 * RATE, NOISE_RMS, 10);
    zeroGap(signal, 50_000, 441);
    const { onsets, gaps } = run(signal);
    expect(gaps).toEqual([{ start_frame: 50_000, end_frame: 50_441, kind: 'zeros' }]);
    expect(onsets).toEqual([]);
  });

  it('does not take a few zeros in a row for a gap', () => {
    const signal = noise(RATE, NOISE_RMS, 11);
    zeroGap(signal, 20_000, 63);
    expect(run(signal).gaps).toEqual([]);
  });

  it('records a zero run that spans blocks, and one still open when the stream ends', () => {
    const signal = noise(RATE, NOISE_RMS, 12);
    zeroGap(signal, 20_000, 500);
    zeroGap(signal, RATE - 1000, 1000);
    expect(run(signal, [100, 37]).gaps).toEqual([
      { start_frame: 20_000, end_frame: 20_500, kind: 'zeros' },
      { start_frame: RATE - 1000, end_frame: RATE, kind: 'zeros' },
    ]);
  });

  it('records a jump in the frame index between blocks as a gap', () => {
    const detector = new OnsetDetector({ sampleRate_Hz: RATE });
    const signal = noise(2048, NOISE_RMS, 13);
    detector.process(signal.subarray(0, 1024), 0);
    detector.process(signal.subarray(1024), 1024 + 441);
    expect(detector.gaps).toEqual([{ start_frame: 1024, end_frame: 1465, kind: 'discontinuity' }]);
  });

  it('refuses a bad frame index', () => {
    const detector = new OnsetDetector({ sampleRate_Hz: RATE });
    expect(() => detector.process(new Float32Array(4), 1.5)).toThrow(/startFrame = 1.5/);
    expect(() => detector.process(new Float32Array(4), -1)).toThrow(/startFrame = -1/);
    expect(() => new OnsetDetector({ sampleRate_Hz: 0 })).toThrow(/sampleRate_Hz = 0/);
  });
});

describe('intervals from sound onsets', () => {
  it('pairs release and impact and gives the interval in frames and seconds', () => {
    const found = intervals(dropSignal(30_011, 83_377, 120_000, 14));
    expect(found).toHaveLength(1);
    expect(found[0]).toMatchObject({ release_frame: 30_011, impact_frame: 83_377, frames: 53_366, sample_rate_Hz: RATE, problem: null });
    expect(found[0]!.heard_s).toBe(53_366 / RATE);
  });

  it('refuses an interval with inserted silence between release and impact', () => {
    const signal = dropSignal(30_000, 80_000, 120_000, 15);
    zeroGap(signal, 55_000, 441);
    const found = intervals(signal);
    expect(found).toHaveLength(1);
    expect(found[0]!.problem?.code).toBe('spans-gap');
    expect(found[0]!.problem?.value).toEqual({ release_frame: 30_000, impact_frame: 80_000, gap_start_frame: 55_000, gap_end_frame: 55_441 });
    expect(found[0]!.problem?.message).toMatch(/441 samples of exact silence/);
  });

  it('refuses an interval across missing frames', () => {
    const signal = dropSignal(30_000, 80_000, 120_000, 16);
    const detector = new OnsetDetector({ sampleRate_Hz: RATE });
    const pairer = new SoundIntervalPairer(RATE);
    const found: SoundInterval[] = [];
    for (const [block, frame] of blocks(signal, [128])) {
      // 441 frames lost after frame 51 200.
      const shifted = frame >= 51_200 ? frame + 441 : frame;
      for (const onset of detector.process(block, shifted)) {
        const interval = pairer.push(onset, detector.gaps);
        if (interval) found.push(interval);
      }
    }
    expect(found.map((i) => i.problem?.code)).toEqual(['spans-gap']);
  });

  it('keeps an interval whose gap lies before the release or after the impact', () => {
    const signal = dropSignal(30_000, 80_000, 120_000, 17);
    zeroGap(signal, 10_000, 441);
    zeroGap(signal, 100_000, 441);
    const found = intervals(signal);
    expect(found.map((i) => [i.frames, i.problem])).toEqual([[50_000, null]]);
  });

  it('starts afresh after a refused interval: the next two onsets make the next drop', () => {
    const signal = dropSignal(30_000, 60_000, 5 * RATE, 18);
    zeroGap(signal, 45_000, 441);
    addClick(signal, 100_000, RELEASE_CLICK);
    addClick(signal, 150_001, IMPACT_CLICK);
    const found = intervals(signal);
    expect(found.map((i) => [i.frames, i.problem?.code ?? null])).toEqual([
      [30_000, 'spans-gap'],
      [50_001, null],
    ]);
  });

  it('takes an onset more than the longest fall (3600 s) after a lone release as the new release', () => {
    const pairer = new SoundIntervalPairer(RATE);
    expect(pairer.push({ frame: 0, amplitude: 0.1, background: 0.001 }, [])).toBeNull();
    expect(pairer.push({ frame: 3601 * RATE, amplitude: 0.1, background: 0.001 }, [])).toBeNull();
    expect(pairer.pendingRelease?.frame).toBe(3601 * RATE);
    expect(pairer.push({ frame: 3602 * RATE, amplitude: 0.1, background: 0.001 }, [])?.frames).toBe(RATE);
  });
});
