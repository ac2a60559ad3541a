import { describe, expect, it } from "vitest";
import { channelWavelengthsM, describeChannels } from "~/engine";

describe("channel wavelengths of a band", () => {
  it("places n channels at the centres of n equal slices of the band", () => {
    // Common practice for a spectrograph with n equal pixels across [λc − Δλ/2, λc + Δλ/2]:
    // centres λc − Δλ/2 + (k + ½)Δλ/n. H band of the demo instrument: 1.65 µm, 0.3 µm, 6 channels
    // → 1.525, 1.575, 1.625, 1.675, 1.725, 1.775 µm.
    const got = channelWavelengthsM(1.65e-6, 0.3e-6, 6);
    const want = [1.525e-6, 1.575e-6, 1.625e-6, 1.675e-6, 1.725e-6, 1.775e-6];
    expect(got).toHaveLength(6);
    for (const [k, w] of got.entries()) expect(w).toBeCloseTo(want[k], 15);
  });

  it("keeps the mean at the central wavelength and the span inside the band", () => {
    // Symmetry of the slice centres about λc (common practice).
    for (const [c, bw, n] of [
      [2.2e-6, 0.4e-6, 8],
      [10e-6, 5e-6, 30],
      [1.65e-6, 0.3e-6, 1],
    ] as const) {
      const list = channelWavelengthsM(c, bw, n);
      const mean = list.reduce((a, b) => a + b, 0) / list.length;
      expect(mean).toBeCloseTo(c, 15);
      expect(Math.min(...list)).toBeGreaterThanOrEqual(c - bw / 2);
      expect(Math.max(...list)).toBeLessThanOrEqual(c + bw / 2);
    }
  });

  it("gives the central wavelength for one channel and never fewer than one", () => {
    expect(channelWavelengthsM(2.2e-6, 0.4e-6, 1)).toEqual([2.2e-6]);
    expect(channelWavelengthsM(2.2e-6, 0.4e-6, 0)).toEqual([2.2e-6]);
  });

  it("describes the spread for the band hint", () => {
    expect(describeChannels({ name: "H", centralWavelengthM: 1.65e-6, bandwidthM: 0.3e-6, channels: 6 })).toBe(
      "6 channels, 1.525–1.775 µm (centres of 6 equal slices of 1.5–1.8 µm)",
    );
    expect(describeChannels({ name: "X", centralWavelengthM: 2.2e-6, bandwidthM: 0, channels: 1 })).toBe(
      "1 channel at 2.2 µm",
    );
  });
});
