import { describe, expect, it } from "vitest";
import {
  ALL_STATIONS,
  readSketchState,
  readTriangleState,
  sketchpadHref,
  splitStationList,
  writeSketchState,
  writeTriangleState,
} from "~/services/sketch/state";

const defaults = { date: "2027-03-15", config: "compact-3", instrument: "Brasa", band: "H" };

describe("Sketchpad state in the URL", () => {
  it("fills the defaults when the address carries nothing", () => {
    const s = readSketchState(new URLSearchParams(""), defaults);
    expect(s).toMatchObject({
      ra: "",
      dec: "",
      date: "2027-03-15",
      config: "compact-3",
      stations: [],
      instrument: "Brasa",
      band: "H",
      sampling: "night",
      stepMin: "10",
      minElevation: "",
      delayLines: true,
      weighting: "natural",
      uvUnit: "mlambda",
      second: null,
    });
    expect(s.model.type).toBe("uniformDisk");
  });

  it("keeps what was typed, even when it is not valid, through a round trip", () => {
    // Common practice for shareable links: the address restores the inputs exactly as typed.
    const q =
      "name=Vela+test&ra=05%3A36%3A12.8&dec=-95&date=2027-04-01&st=C01,X02,C05&inst=Brasa&band=K" +
      "&model=binary&sep=abc&pa=60&ratio=0.4&c2=gaussian&c2fwhm=8&c2flux=0.2&c2east=1&c2north=-2" +
      "&ha=-3,3,0.5&minel=40&dl=off&wt=robust&uv=m";
    const s = readSketchState(new URLSearchParams(q), defaults);
    expect(s.ra).toBe("05:36:12.8");
    expect(s.dec).toBe("-95");
    expect(s.config).toBe("");
    expect(s.stations).toEqual(["C01", "X02", "C05"]);
    expect(s.model.type).toBe("binary");
    expect(s.model.params.separationMas).toBe("abc");
    expect(s.second).toMatchObject({ type: "gaussian", flux: "0.2", east: "1", north: "-2" });
    expect(s.second!.params.fwhmMas).toBe("8");
    expect(s).toMatchObject({
      sampling: "hourAngle",
      haFrom: "-3",
      haTo: "3",
      haStep: "0.5",
      minElevation: "40",
      delayLines: false,
    });
    expect(s).toMatchObject({ weighting: "robust", uvUnit: "m" });
    const again = readSketchState(writeSketchState(s), defaults);
    expect(again).toEqual(s);
  });

  it("writes only the chosen model type's parameters and a configuration instead of a pick", () => {
    const s = readSketchState(new URLSearchParams("ra=84.05&dec=-1.2&model=gaussian&fwhm=3&diam=9"), defaults);
    const p = writeSketchState(s);
    expect(p.get("model")).toBe("gaussian");
    expect(p.get("fwhm")).toBe("3");
    expect(p.has("diam")).toBe(false);
    expect(p.get("config")).toBe("compact-3");
    expect(p.has("st")).toBe(false);
    expect(p.has("step")).toBe(false);
  });

  it("ignores unknown model types and repeated station names", () => {
    const s = readSketchState(new URLSearchParams("model=spiral&st=C01,,C01, C02"), defaults);
    expect(s.model.type).toBe("uniformDisk");
    expect(s.stations).toEqual(["C01", "C02"]);
    expect(splitStationList(null)).toEqual([]);
  });
});

describe("Triangle finder state and the way back to the Sketchpad", () => {
  it("round-trips the pool", () => {
    const t = readTriangleState(new URLSearchParams(`ra=10:00:00&dec=-30&pool=${ALL_STATIONS}&step=20`), defaults);
    expect(t.pool).toBe(ALL_STATIONS);
    expect(t.stepMin).toBe("20");
    expect(readTriangleState(writeTriangleState(t), defaults)).toEqual(t);
  });

  it("opens a triangle in the Sketchpad with the same target, model, night and band", () => {
    const t = readTriangleState(
      new URLSearchParams("name=T&ra=10:00:00&dec=-30&date=2027-05-02&model=ring&diam=3&band=K"),
      defaults,
    );
    const href = sketchpadHref(t, ["C03", "C05", "C15"]);
    expect(href.startsWith("/sketchpad?")).toBe(true);
    const s = readSketchState(new URLSearchParams(href.split("?")[1]), defaults);
    expect(s).toMatchObject({
      name: "T",
      ra: "10:00:00",
      dec: "-30",
      date: "2027-05-02",
      band: "K",
      config: "",
      stations: ["C03", "C05", "C15"],
    });
    expect(s.model).toEqual(t.model);
  });
});
