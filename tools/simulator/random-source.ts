/**
 * Seeded pseudo-random source for the simulator: sfc32 (Chris Doty-Humphrey's Small Fast
 * Counting generator) seeded through splitmix32, with Box–Muller for normal deviates.
 * The simulator never touches Math.random so that every sample is byte-identical on re-run.
 */
export class RandomSource {
  private a: number;
  private b: number;
  private c: number;
  private d: number;
  private spareNormal: number | null = null;

  constructor(seed: number) {
    let state = seed >>> 0;
    const nextSplitMix = (): number => {
      state = (state + 0x9e3779b9) >>> 0;
      let z = state;
      z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
      z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
      return (z ^ (z >>> 16)) >>> 0;
    };
    this.a = nextSplitMix();
    this.b = nextSplitMix();
    this.c = nextSplitMix();
    this.d = nextSplitMix();
    // Discard the first outputs: sfc32's state mixes poorly during its first few rounds.
    for (let i = 0; i < 12; i++) this.nextUint32();
  }

  /** Uniform 32-bit unsigned integer. */
  nextUint32(): number {
    const t = (((this.a + this.b) >>> 0) + this.d) >>> 0;
    this.d = (this.d + 1) >>> 0;
    this.a = this.b ^ (this.b >>> 9);
    this.b = (this.c + (this.c << 3)) >>> 0;
    this.c = ((this.c << 21) | (this.c >>> 11)) >>> 0;
    this.c = (this.c + t) >>> 0;
    return t;
  }

  /** Uniform in [0, 1). */
  uniform(): number {
    return this.nextUint32() / 4294967296;
  }

  /** Uniform in [low, high). */
  uniformBetween(low: number, high: number): number {
    return low + (high - low) * this.uniform();
  }

  /** True with the given probability. */
  chance(probability: number): boolean {
    return this.uniform() < probability;
  }

  /** Standard normal deviate by the Box–Muller transform (both outputs are used). */
  standardNormal(): number {
    if (this.spareNormal !== null) {
      const spare = this.spareNormal;
      this.spareNormal = null;
      return spare;
    }
    const u1 = 1 - this.uniform(); // (0, 1]: log stays finite
    const u2 = this.uniform();
    const radius = Math.sqrt(-2 * Math.log(u1));
    this.spareNormal = radius * Math.sin(2 * Math.PI * u2);
    return radius * Math.cos(2 * Math.PI * u2);
  }

  /** Normal deviate with mean 0 and the given variance (not standard deviation). */
  normalWithVariance(variance: number): number {
    return variance > 0 ? Math.sqrt(variance) * this.standardNormal() : 0;
  }

  /** Index drawn from a discrete distribution whose weights sum to 1. */
  categorical(probabilities: readonly number[]): number {
    const u = this.uniform();
    let cumulative = 0;
    for (let i = 0; i < probabilities.length; i++) {
      cumulative += probabilities[i];
      if (u < cumulative) return i;
    }
    return probabilities.length - 1;
  }
}

/** Independent stream for one subsystem, so tuning one sensor does not reshuffle the others. */
export function createStream(scenarioSeed: number, streamId: number): RandomSource {
  return new RandomSource((Math.imul(scenarioSeed, 0x2c1b3c6d) ^ Math.imul(streamId + 1, 0x297a2d39)) >>> 0);
}
