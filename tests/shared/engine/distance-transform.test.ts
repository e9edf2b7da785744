import { describe, expect, it } from 'vitest';
import { FAR, squaredDistanceTransform } from '../../../shared/engine/distance-transform';
import { createRandomScratch, fillUniforms, RNG_PURPOSE } from '../../../shared/engine/random';

/** Brute force: minimum squared distance to any feature cell. */
function bruteForce(features: Uint8Array, width: number, height: number): Float64Array {
  const out = new Float64Array(width * height).fill(FAR);
  for (let i = 0; i < height; i++)
    for (let j = 0; j < width; j++)
      for (let p = 0; p < height; p++)
        for (let q = 0; q < width; q++)
          if (features[p * width + q])
            out[i * width + j] = Math.min(out[i * width + j], (i - p) ** 2 + (j - q) ** 2);
  return out;
}

describe('squared Euclidean distance transform (Felzenszwalb & Huttenlocher 2012)', () => {
  it.each([
    [17, 9, 0.05],
    [23, 31, 0.2],
    [40, 12, 0.01],
    [1, 15, 0.3],
  ])('equals brute force on a random %ix%i grid with density %f', (width, height, density) => {
    const scratch = createRandomScratch();
    const features = new Uint8Array(width * height);
    for (let k = 0; k < features.length; k++) {
      fillUniforms(width * 100 + height, RNG_PURPOSE.test, 0, k, 0, scratch);
      features[k] = scratch.values[0] < density ? 1 : 0;
    }
    features[Math.floor(features.length / 2)] = 1;
    expect(Array.from(squaredDistanceTransform(features, width, height))).toEqual(
      Array.from(bruteForce(features, width, height)),
    );
  });

  it('reports FAR everywhere for a grid without features', () => {
    const result = squaredDistanceTransform(new Uint8Array(12), 4, 3);
    expect(Array.from(result).every((d) => d === FAR)).toBe(true);
  });
});
