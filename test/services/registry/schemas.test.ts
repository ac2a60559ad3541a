import * as v from "valibot";
import { describe, expect, it } from "vitest";
import { fieldErrors } from "~/lib/form-errors";
import {
  BandFormSchema,
  ConfigurationSchema,
  metresToMicrons,
  micronsToMetres,
  SiteSchema,
  StationSchema,
} from "~/services/registry/schemas";

describe("value rules shared with the forms", () => {
  const site = {
    name: "Test",
    latitudeDeg: "-31.4",
    longitudeDeg: "-68.9",
    altitudeM: "2450",
    minElevationDeg: "30",
    delayLineStrokeM: "90",
    timeZone: "UTC",
  };

  it("accepts a good site and names each bad field", () => {
    expect(v.safeParse(SiteSchema, site).success).toBe(true);
    const bad = v.safeParse(SiteSchema, {
      ...site,
      latitudeDeg: "-91",
      longitudeDeg: "181",
      minElevationDeg: "95",
      delayLineStrokeM: "0",
      timeZone: "Mars/Olympus",
    });
    expect(bad.success).toBe(false);
    if (bad.success) return;
    expect(fieldErrors(bad.issues)).toEqual({
      latitudeDeg: "must be between -90 and 90 °",
      longitudeDeg: "must be between -180 and 180 °",
      minElevationDeg: "must be between 0 and 90 °",
      delayLineStrokeM: "must be greater than 0 and at most 10000 m",
      timeZone: "must be a time zone name such as UTC or America/Argentina/San_Juan",
    });
  });

  it("takes a unicode minus sign as a minus", () => {
    const out = v.safeParse(StationSchema, { name: "S1", eastM: "−12.5", northM: "0", upM: "0", pathOffsetM: "0" });
    expect(out.success && out.output.eastM).toBe(-12.5);
  });

  it("reads a configuration's stations from text, in order, each once, at least two", () => {
    const ok = v.safeParse(ConfigurationSchema, {
      name: "wide",
      description: "",
      offered: "on",
      stations: "X01, C02  X03",
    });
    expect(ok.success && ok.output).toEqual({
      name: "wide",
      description: "",
      offered: true,
      stations: ["X01", "C02", "X03"],
    });
    const off = v.safeParse(ConfigurationSchema, { name: "wide", stations: ["A", "B"], offered: false });
    expect(off.success && off.output.offered).toBe(false);
    const one = v.safeParse(ConfigurationSchema, { name: "x", stations: "C01" });
    expect(!one.success && fieldErrors(one.issues)).toEqual({ stations: "needs at least 2 stations" });
    const twice = v.safeParse(ConfigurationSchema, { name: "x", stations: "C01 C02 C01" });
    expect(!twice.success && fieldErrors(twice.issues)).toEqual({ stations: "lists C01 twice" });
  });

  /** Band H as the form takes it: central wavelength and bandwidth in µm. */
  const bandH = (centralWavelengthUm: string, channels: string, bandwidthUm: string, limitingMagnitude: string) =>
    v.safeParse(BandFormSchema, { name: "H", centralWavelengthUm, channels, bandwidthUm, limitingMagnitude });

  it("takes band wavelengths in µm, stores metres as typed, and keeps the bandwidth below twice the centre", () => {
    const ok = bandH("1.65", "6", "0.3", "7.5");
    expect(ok.success).toBe(true);
    expect(micronsToMetres(1.65)).toBe(1.65e-6);
    expect(micronsToMetres(2.2)).toBe(2.2e-6);
    expect(metresToMicrons(1.65e-6)).toBe(1.65);
    const wide = bandH("1", "1.5", "0.5", "7");
    expect(!wide.success && fieldErrors(wide.issues)).toEqual({ channels: "must be a whole number" });
    const wide2 = bandH("1", "1", "2", "7");
    expect(!wide2.success && fieldErrors(wide2.issues)).toEqual({
      bandwidthUm: "must be less than twice the central wavelength (the band's short edge would fall below zero)",
    });
  });
});
