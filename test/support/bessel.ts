/**
 * Bessel functions of the first kind from their integral, J_n(x) = (1/π)∫₀^π cos(nτ − x sin τ) dτ,
 * by Simpson's rule over `steps` intervals: independent of the engine's polynomial approximations.
 */
export function besselIntegral(n: number, x: number, steps = 2000): number {
  let s = 0;
  for (let i = 0; i <= steps; i++) {
    const t = (Math.PI * i) / steps;
    s += Math.cos(n * t - x * Math.sin(t)) * (i === 0 || i === steps ? 1 : i % 2 ? 4 : 2);
  }
  return (s * (Math.PI / steps)) / 3 / Math.PI;
}

/** J₁(x) from the Bessel integral. */
export const j1 = (x: number) => besselIntegral(1, x);
