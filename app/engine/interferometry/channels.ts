/**
 * Spectral channels of an instrument band. Pure; used by the Sketchpad, the Triangle finder and the
 * feasibility report.
 *
 * A band of central wavelength λc and bandwidth Δλ split into n channels is taken as n equal slices
 * of [λc − Δλ/2, λc + Δλ/2]; each channel is represented by the centre of its slice:
 *   λ_k = λc − Δλ/2 + (k + ½)·Δλ/n,  k = 0 … n−1.
 * One channel, or no bandwidth, gives λc itself; the mean of the channels is always λc.
 */

export interface BandLike {
  name: string;
  centralWavelengthM: number;
  bandwidthM: number;
  channels: number;
}

/**
 * Channel wavelengths in metres, shortest first.
 * @param centralM central wavelength λc, metres (> 0)
 * @param bandwidthM full bandwidth Δλ, metres (≥ 0, below 2 λc so every channel stays positive; 0 gives one channel)
 * @param channels channel count n (a whole number ≥ 1; fractions are rounded down, less than 1 gives one channel)
 */
export function channelWavelengthsM(centralM: number, bandwidthM: number, channels: number): number[] {
  const n = Math.max(1, Math.floor(channels));
  if (n === 1 || !(bandwidthM > 0)) return [centralM];
  const width = Math.max(0, bandwidthM) / n;
  const start = centralM - bandwidthM / 2;
  const out: number[] = new Array(n);
  for (let k = 0; k < n; k++) out[k] = start + (k + 0.5) * width;
  return out;
}

/** Formats metres as micrometres with up to three decimals ("1.65"). */
export function micrometres(m: number, decimals = 3): string {
  return String(Math.round(m * 1e6 * 10 ** decimals) / 10 ** decimals);
}

/** One line for the band hint: "6 channels, 1.525–1.775 µm (centres of 6 equal slices of 1.5–1.8 µm)". */
export function describeChannels(band: BandLike): string {
  const list = channelWavelengthsM(band.centralWavelengthM, band.bandwidthM, band.channels);
  const lo = band.centralWavelengthM - band.bandwidthM / 2;
  const hi = band.centralWavelengthM + band.bandwidthM / 2;
  if (list.length === 1) return `1 channel at ${micrometres(list[0])} µm`;
  return (
    `${list.length} channels, ${micrometres(list[0])}–${micrometres(list[list.length - 1])} µm ` +
    `(centres of ${list.length} equal slices of ${micrometres(lo)}–${micrometres(hi)} µm)`
  );
}
