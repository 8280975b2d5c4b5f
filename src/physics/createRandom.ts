/**
 * A small seeded random generator, so that an uncertainty run gives the same interval every time
 * for the same input (and a test can replay it).
 *
 * Uniforms: xoshiro128** (D. Blackman, S. Vigna, "Scrambled linear pseudorandom number
 * generators", ACM TOMS 47 (2021)), seeded through splitmix32. Normals: the ziggurat method
 * (G. Marsaglia, W. W. Tsang, J. Stat. Softw. 5(8), 2000) with 128 layers; the layer index and
 * the value come from different bits of the word, which avoids the correlation J. A. Doornik
 * (2005) found when the same bits serve both. Gamma and χ²: Marsaglia–Tsang (ACM TOMS 26
 * (2000) 363–372). 32-bit words are plenty for Monte Carlo of a few 10⁵ draws.
 */

export interface RandomSource {
  /** Uniform on the open interval (0, 1). */
  uniform(): number;
  /** Standard normal. */
  normal(): number;
  /** Gamma with the given shape and unit scale. */
  gamma(shape: number): number;
  /** χ² with ν degrees of freedom. */
  chiSquare(dof: number): number;
}

/** Used when a request gives no seed: any fixed number would do. */
export const DEFAULT_SEED = 20_080_149;

export function createRandom(seed: number = DEFAULT_SEED): RandomSource {
  return new Xoshiro128(seed);
}

class Xoshiro128 implements RandomSource {
  // The four state words live in an Int32Array: as object fields, words past the small-integer range would be
  // boxed on every store (a heap number per draw, a measurable share of a Monte Carlo run in the collector).
  private readonly s = new Int32Array(4);

  constructor(seed: number) {
    let x = seed >>> 0;
    const next = (): number => {
      // splitmix32
      x = (x + 0x9e3779b9) >>> 0;
      let z = x;
      z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
      z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
      return (z ^ (z >>> 16)) >>> 0;
    };
    const s = this.s;
    s[0] = next();
    s[1] = next();
    s[2] = next();
    s[3] = next();
    if ((s[0]! | s[1]! | s[2]! | s[3]!) === 0) s[0] = 1;
  }

  private nextUint32(): number {
    const s = this.s;
    const s0 = s[0]!;
    const s1 = s[1]!;
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    const s2 = s[2]! ^ s0;
    const s3 = s[3]! ^ s1;
    s[1] = s1 ^ s2;
    s[0] = s0 ^ s3;
    s[2] = s2 ^ t;
    s[3] = (s3 << 11) | (s3 >>> 21);
    return result;
  }

  uniform(): number {
    return (this.nextUint32() + 0.5) / 4294967296;
  }

  normal(): number {
    // Ziggurat: the low 7 bits pick the layer, the upper 25 bits (sign and 24-bit magnitude) the point.
    for (;;) {
      const word = this.nextUint32() | 0;
      const layer = word & 127;
      const hz = word >> 7; // signed, |hz| < 2^24
      if (Math.abs(hz) < ZIGGURAT_K[layer]!) return hz * ZIGGURAT_W[layer]!;
      const x = hz * ZIGGURAT_W[layer]!;
      if (layer === 0) {
        // The base layer's tail beyond r: Marsaglia's exponential rejection.
        let tx: number;
        let ty: number;
        do {
          tx = -Math.log(this.uniform()) / ZIGGURAT_R;
          ty = -Math.log(this.uniform());
        } while (ty + ty < tx * tx);
        return hz > 0 ? ZIGGURAT_R + tx : -ZIGGURAT_R - tx;
      }
      // The wedge between two layers: accept under the density, else start again.
      const f0 = ZIGGURAT_F[layer - 1]!;
      const f1 = ZIGGURAT_F[layer]!;
      if (f1 + this.uniform() * (f0 - f1) < Math.exp(-0.5 * x * x)) return x;
    }
  }

  gamma(shape: number): number {
    // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
    if (!(shape > 0)) throw new RangeError(`gamma shape must be positive, got ${shape}`);
    if (shape < 1) {
      // Boost: Gamma(a) = Gamma(a + 1)·U^{1/a}
      return this.gamma(shape + 1) * Math.pow(this.uniform(), 1 / shape);
    }
    const d = shape - 1 / 3;
    const c = 1 / Math.sqrt(9 * d);
    for (;;) {
      let x: number;
      let v: number;
      do {
        x = this.normal();
        v = 1 + c * x;
      } while (v <= 0);
      v = v * v * v;
      const u = this.uniform();
      if (u < 1 - 0.0331 * x * x * x * x) return d * v;
      if (Math.log(u) < 0.5 * x * x + d * (1 - v + Math.log(v))) return d * v;
    }
  }

  chiSquare(dof: number): number {
    return 2 * this.gamma(dof / 2);
  }
}

// Ziggurat tables for the standard normal, 128 layers (Marsaglia & Tsang 2000, zigset), scaled
// for a 24-bit magnitude.
const ZIGGURAT_R = 3.442619855899;
const ZIGGURAT_K = new Float64Array(128);
const ZIGGURAT_W = new Float64Array(128);
const ZIGGURAT_F = new Float64Array(128);
(function buildZiggurat(): void {
  const m = 16777216; // 2^24
  const v = 9.91256303526217e-3; // area of each layer
  let dn = ZIGGURAT_R;
  let tn = dn;
  const q = v / Math.exp(-0.5 * dn * dn);
  ZIGGURAT_K[0] = (dn / q) * m;
  ZIGGURAT_K[1] = 0;
  ZIGGURAT_W[0] = q / m;
  ZIGGURAT_W[127] = dn / m;
  ZIGGURAT_F[0] = 1;
  ZIGGURAT_F[127] = Math.exp(-0.5 * dn * dn);
  for (let i = 126; i >= 1; i--) {
    dn = Math.sqrt(-2 * Math.log(v / dn + Math.exp(-0.5 * dn * dn)));
    ZIGGURAT_K[i + 1] = (dn / tn) * m;
    tn = dn;
    ZIGGURAT_F[i] = Math.exp(-0.5 * dn * dn);
    ZIGGURAT_W[i] = dn / m;
  }
})();

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}
