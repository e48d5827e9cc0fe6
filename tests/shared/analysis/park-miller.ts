/** Park–Miller "minimal standard" generator, z ← 16807·z mod (2³¹ − 1) (Park & Miller 1988). */
export function parkMiller(seed = 1): () => number {
  let z = seed;
  return () => {
    z = (16807 * z) % 2147483647;
    return z;
  };
}
