/**
 * Seeded random numbers for the simulated noise and the reconstruction's start image.
 *
 * Generator: the Mersenne Twister MT19937 (Matsumoto & Nishimura 1998, ACM Trans. Model. Comput. Simul.
 * 8, 3), 32-bit words, seeded by the authors' `init_genrand` recurrence
 * (x_i = 1812433253 · (x_{i−1} ⊕ (x_{i−1} >> 30)) + i). Uniform doubles in [0, 1) from two words with 53
 * random bits (the authors' `genrand_res53`). Normal deviates by the Box–Muller transform (Box & Muller
 * 1958, Ann. Math. Stat. 29, 610): from u1 ∈ (0, 1], u2 ∈ [0, 1),
 *   z1 = √(−2 ln u1) cos(2π u2),  z2 = √(−2 ln u1) sin(2π u2),
 * both used in turn. The same seed always gives the same sequence, on every platform.
 */

const N = 624;
const M = 397;
const MATRIX_A = 0x9908b0df;
const UPPER = 0x80000000;
const LOWER = 0x7fffffff;

export class Mt19937 {
  private readonly state = new Uint32Array(N);
  private index = N + 1;
  private spare = Number.NaN;

  /** @param seed any integer; taken modulo 2³² (negative values wrap). */
  constructor(seed: number) {
    const mt = this.state;
    mt[0] = seed >>> 0;
    for (let i = 1; i < N; i++) {
      const prev = mt[i - 1] ^ (mt[i - 1] >>> 30);
      // 1812433253 · prev mod 2³², split to stay exact in doubles.
      mt[i] = ((((prev & 0xffff0000) >>> 16) * 1812433253) << 16) + (prev & 0x0000ffff) * 1812433253 + i;
    }
    this.index = N;
  }

  private twist(): void {
    const mt = this.state;
    for (let k = 0; k < N; k++) {
      const y = (mt[k] & UPPER) | (mt[(k + 1) % N] & LOWER);
      mt[k] = mt[(k + M) % N] ^ (y >>> 1) ^ (y & 1 ? MATRIX_A : 0);
    }
    this.index = 0;
  }

  /** Next 32-bit unsigned integer, [0, 2³²). */
  nextUint32(): number {
    if (this.index >= N) this.twist();
    let y = this.state[this.index++];
    y ^= y >>> 11;
    y ^= (y << 7) & 0x9d2c5680;
    y ^= (y << 15) & 0xefc60000;
    y ^= y >>> 18;
    return y >>> 0;
  }

  /** Uniform double in [0, 1) with 53 random bits. */
  nextDouble(): number {
    const a = this.nextUint32() >>> 5;
    const b = this.nextUint32() >>> 6;
    return (a * 67108864 + b) / 9007199254740992;
  }

  /** Standard normal deviate (mean 0, variance 1) by Box–Muller; the pair's second value is kept for the next call. */
  nextGaussian(): number {
    if (!Number.isNaN(this.spare)) {
      const z = this.spare;
      this.spare = Number.NaN;
      return z;
    }
    const u1 = 1 - this.nextDouble(); // (0, 1]: ln u1 finite
    const u2 = this.nextDouble();
    const r = Math.sqrt(-2 * Math.log(u1));
    const t = 2 * Math.PI * u2;
    this.spare = r * Math.sin(t);
    return r * Math.cos(t);
  }
}
