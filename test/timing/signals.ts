// Synthetic microphone signals for the onset detector's tests: Gaussian background noise with clicks of
// known shape added at known sample positions. Our own test signals; no recorded data.
import { createRandom } from '../../src/physics/createRandom';

export const RATE = 44_100;

export interface ClickShape {
  /** Peak amplitude, full scale 1. */
  amplitude: number;
  frequency_Hz: number;
  /** Decay time constant. */
  decay_s: number;
  /** Samples of linear rise before the peak (0: the first sample is the peak, as a hard impact gives). */
  rise?: number;
}

/** A sharp tick such as a release latch makes (our own shape). */
export const RELEASE_CLICK: ClickShape = { amplitude: 0.15, frequency_Hz: 2500, decay_s: 0.001 };
/** A thud with ringing such as a ball landing on a board makes (our own shape). */
export const IMPACT_CLICK: ClickShape = { amplitude: 0.5, frequency_Hz: 900, decay_s: 0.004 };

export function noise(length: number, rms: number, seed: number): Float32Array {
  const random = createRandom(seed);
  const out = new Float32Array(length);
  for (let i = 0; i < length; i++) out[i] = rms * random.normal();
  return out;
}

/** Adds a decaying cosine burst whose first sample above the noise is at `at` (after `rise` samples of ramp). */
export function addClick(signal: Float32Array, at: number, shape: ClickShape): void {
  const rise = shape.rise ?? 0;
  const length = Math.min(signal.length - at, Math.round(shape.decay_s * RATE * 12) + rise);
  for (let n = 0; n < length; n++) {
    const envelope = n < rise ? (n + 1) / (rise + 1) : Math.exp(-(n - rise) / (shape.decay_s * RATE));
    const k = Math.max(0, n - rise);
    signal[at + n]! += shape.amplitude * envelope * Math.cos((2 * Math.PI * shape.frequency_Hz * k) / RATE);
  }
}

/** Sets `length` samples from `at` to exact zeros, as an audio stack's inserted silence. */
export function zeroGap(signal: Float32Array, at: number, length: number): void {
  signal.fill(0, at, at + length);
}

/** Rounds to 16-bit PCM values, as a WAV file or a phone's converter gives them. */
export function quantize16(signal: Float32Array): Float32Array {
  return signal.map((x) => Math.max(-32768, Math.min(32767, Math.round(x * 32768))) / 32768);
}

/** Cuts a signal into blocks of the given sizes (repeating the list), each with its absolute first frame. */
export function* blocks(signal: Float32Array, sizes: readonly number[], firstFrame = 0): Generator<[Float32Array, number]> {
  let at = 0;
  let i = 0;
  while (at < signal.length) {
    const size = sizes[i++ % sizes.length]!;
    yield [signal.subarray(at, at + size), firstFrame + at];
    at += size;
  }
}
