/**
 * A small seeded random generator, so that an uncertainty run gives the same interval every time
 * for the same input (and a test can replay it).
 *
 * Uniforms: xoshiro128** (D. Blackman, S. Vigna, "Scrambled linear pseudorandom number
 * generators", ACM TOMS 47 (2021)), seeded through splitmix32. Normals: Marsaglia's polar method
 * (G. Marsaglia, T. A. Bray, SIAM Review 6 (1964) 260–264). Gamma and χ²: Marsaglia–Tsang
 * (ACM TOMS 26 (2000) 363–372). 32-bit uniforms are plenty for Monte Carlo of a few 10⁵ draws.
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
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  private spare = 0;
  private hasSpare = false;

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
    this.s0 = next();
    this.s1 = next();
    this.s2 = next();
    this.s3 = next();
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1;
  }

  private nextUint32(): number {
    const s1 = this.s1;
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return result;
  }

  uniform(): number {
    return (this.nextUint32() + 0.5) / 4294967296;
  }

  normal(): number {
    if (this.hasSpare) {
      this.hasSpare = false;
      return this.spare;
    }
    let u: number;
    let v: number;
    let s: number;
    do {
      u = 2 * this.uniform() - 1;
      v = 2 * this.uniform() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const factor = Math.sqrt((-2 * Math.log(s)) / s);
    this.spare = v * factor;
    this.hasSpare = true;
    return u * factor;
  }

  gamma(shape: number): number {
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

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}
