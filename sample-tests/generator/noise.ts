/**
 * Correlated breath-to-breath noise: a stationary first-order autoregressive process,
 * e[k] = φ·e[k−1] + √(1 − φ²)·z[k], z standard normal, so every e[k] has unit variance and
 * neighbouring breaths correlate by φ (breath-by-breath noise after Lamarra et al.,
 * J Appl Physiol 1987;62:2003–12). Scale by the SD you want.
 */
import { normalRandom, type Random } from '../../core/math/random';

/** `n` unit-variance AR(1) values with coefficient `phi` (|phi| < 1), drawn from `random`. */
export function ar1Series(n: number, phi: number, random: Random): number[] {
  const normal = normalRandom(random);
  const out = new Array<number>(n);
  const innovation = Math.sqrt(1 - phi * phi);
  let previous = normal();
  for (let k = 0; k < n; k++) {
    previous = k === 0 ? previous : phi * previous + innovation * normal();
    out[k] = previous;
  }
  return out;
}
