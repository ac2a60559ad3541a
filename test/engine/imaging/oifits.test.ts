import { binaryTarget, demoSite, demoStations } from "@test/demo-array";
import { describe, expect, it } from "vitest";
import {
  enuToEcefOffset,
  formatCard,
  formatReal,
  geodeticToEcef,
  oifitsBytes,
  parseSimulateRequest,
  simulateData,
  simulateResponse,
  WGS84_A_M,
} from "~/engine";
import { columns, columnValues, type Hdu, parseCard, readFits } from "./fits-reader";

const request = {
  site: demoSite(),
  stations: demoStations("C01", "C02", "W1", "N2"),
  target: binaryTarget("Demo's binary"),
  wavelengthsM: [1.6e-6, 1.7e-6, 1.8e-6],
  hourAnglesH: [-3, -2, -1, 0, 1, 2],
};

function build() {
  const parsed = parseSimulateRequest(request);
  if (!parsed.ok) throw new Error(parsed.message);
  const data = simulateData(parsed.value);
  const bytes = oifitsBytes(data, parsed.value, "2026-05-01T12:00:00");
  return { data, response: simulateResponse(data), bytes, hdus: readFits(bytes) };
}

const { response, bytes, hdus } = build();
const byName = (name: string) => hdus.find((h) => h.get("EXTNAME") === name) as Hdu;

/** Expects the columns of an OIFITS 2 table with their TFORM letter, repeat and unit. */
type ColumnSpec = [string, string, number | "NWAVE", string?];

/** The columns every data table (OI_VIS2, OI_T3) begins with: which target, and when (Tables 6 and 8). */
const WHEN_COLUMNS: ColumnSpec[] = [
  ["TARGET_ID", "I", 1],
  ["TIME", "D", 1, "s"],
  ["MJD", "D", 1, "day"],
  ["INT_TIME", "D", 1, "s"],
];

function expectColumns(hdu: Hdu, spec: ColumnSpec[], nwave: number) {
  const cols = columns(hdu);
  for (const [name, code, repeat, unit] of spec) {
    const c = cols.find((x) => x.name === name);
    expect(c, `${hdu.get("EXTNAME")}.${name}`).toBeDefined();
    expect(c!.code, `${name} type`).toBe(code);
    expect(c!.repeat, `${name} repeat`).toBe(repeat === "NWAVE" ? nwave : repeat);
    if (unit) expect(c!.unit, `${name} unit`).toBe(unit);
  }
}

describe("FITS structure (FITS Standard 4.0)", () => {
  it("is whole 2880-byte blocks of 80-character ASCII cards", () => {
    // §3.1: a FITS file is a sequence of 2880-byte blocks.
    expect(bytes.length % 2880).toBe(0);
    expect(hdus).toHaveLength(6);
    for (const h of hdus) {
      expect(h.headerBytes % 2880).toBe(0);
      for (const c of h.cards) {
        expect(c.raw).toHaveLength(80);
        // §4.1.1: header bytes are printable ASCII (0x20–0x7E); keywords use A–Z, 0–9, '-' and '_'.
        expect(/^[\x20-\x7e]{80}$/.test(c.raw)).toBe(true);
        expect(/^[A-Z0-9_-]*$/.test(c.key)).toBe(true);
      }
    }
  });

  it("pads headers with blanks and data with zero bytes", () => {
    // §3.3.1 / §7.3.3: header fill is ASCII blanks after END; data fill is zero bytes.
    let p = 0;
    for (const h of hdus) {
      const head = String.fromCharCode(...bytes.subarray(p, p + h.headerBytes));
      const end = head.indexOf(`END${" ".repeat(77)}`);
      expect(end % 80).toBe(0);
      expect(head.slice(end + 80).trim()).toBe("");
      const dataStart = p + h.headerBytes;
      const padded = Math.ceil(h.dataBytes / 2880) * 2880;
      expect(bytes.subarray(dataStart + h.dataBytes, dataStart + padded).every((b) => b === 0)).toBe(true);
      p = dataStart + padded;
    }
    expect(p).toBe(bytes.length);
  });

  it("writes the primary header's mandatory keywords first, in order", () => {
    // §4.4.1.1 (Table 7, from memory): SIMPLE = T, BITPIX, NAXIS, then EXTEND for a file with extensions.
    const keys = hdus[0].cards.map((c) => c.key);
    expect(keys.slice(0, 4)).toEqual(["SIMPLE", "BITPIX", "NAXIS", "EXTEND"]);
    expect(hdus[0].get("SIMPLE")).toBe(true);
    expect(hdus[0].get("NAXIS")).toBe(0);
  });

  it("writes each binary table's mandatory keywords in order, with NAXIS1 the sum of the field widths", () => {
    // §7.3.1 (Table 17, from memory): XTENSION, BITPIX = 8, NAXIS = 2, NAXIS1, NAXIS2, PCOUNT, GCOUNT = 1, TFIELDS.
    // Field widths of Table 18 (from memory): L, A 1 byte; I 2; J, E 4; D 8.
    for (const h of hdus.slice(1)) {
      expect(h.cards.slice(0, 8).map((c) => c.key)).toEqual([
        "XTENSION",
        "BITPIX",
        "NAXIS",
        "NAXIS1",
        "NAXIS2",
        "PCOUNT",
        "GCOUNT",
        "TFIELDS",
      ]);
      expect(h.get("XTENSION")).toBe("BINTABLE");
      expect(h.get("BITPIX")).toBe(8);
      expect(h.get("NAXIS")).toBe(2);
      expect(h.get("PCOUNT")).toBe(0);
      expect(h.get("GCOUNT")).toBe(1);
      const width = { L: 1, A: 1, I: 2, J: 4, E: 4, D: 8 } as Record<string, number>;
      const sum = columns(h).reduce((s, c) => s + c.repeat * width[c.code], 0);
      expect(h.get("NAXIS1")).toBe(sum);
      expect(h.get("TFIELDS")).toBe(columns(h).length);
    }
  });

  it("formats fixed-format values in the columns the standard gives", () => {
    // §4.2.1: a string starts with a quote in column 11, at least 8 characters between the quotes,
    // embedded quotes doubled. §4.2.2: a logical T/F in column 30. §4.2.3/§4.2.4: numbers right-justified
    // to column 30; a real has a decimal point or an exponent.
    const s = formatCard({ key: "OBJECT", value: "Demo's" });
    expect(s.slice(8, 11)).toBe("= '");
    expect(s.slice(10, 20)).toBe("'Demo''s '");
    expect(parseCard(s).value).toBe("Demo's");
    const l = formatCard({ key: "SIMPLE", value: true });
    expect(l[29]).toBe("T");
    expect(l.slice(10, 29).trim()).toBe("");
    const i = formatCard({ key: "NAXIS1", value: { int: 1234 } });
    expect(i.slice(26, 30)).toBe("1234");
    const r = formatCard({ key: "ARRAYX", value: { real: 1.65e-6 } });
    expect(r.slice(10, 30).trim()).toBe("0.00000165");
    expect(r[29]).toBe("5");
    expect(parseCard(r).value).toBe(1.65e-6);
    expect(formatReal(2000)).toBe("2000.0");
    expect(formatReal(1e-7)).toBe("1.0E-7");
    expect(formatReal(-12.5)).toBe("-12.5");
  });
});

/** Every mandatory column of the five tables, by the standard's table: name, data type, repeat, unit. */
const MANDATORY_COLUMNS: Record<string, ColumnSpec[]> = {
  // Table 3 (OI_TARGET)
  OI_TARGET: [
    ["TARGET_ID", "I", 1],
    ["TARGET", "A", 16],
    ["RAEP0", "D", 1, "deg"],
    ["DECEP0", "D", 1, "deg"],
    ["EQUINOX", "E", 1, "yr"],
    ["RA_ERR", "D", 1, "deg"],
    ["DEC_ERR", "D", 1, "deg"],
    ["SYSVEL", "D", 1, "m/s"],
    ["VELTYP", "A", 8],
    ["VELDEF", "A", 8],
    ["PMRA", "D", 1, "deg/yr"],
    ["PMDEC", "D", 1, "deg/yr"],
    ["PMRA_ERR", "D", 1, "deg/yr"],
    ["PMDEC_ERR", "D", 1, "deg/yr"],
    ["PARALLAX", "E", 1, "deg"],
    ["PARA_ERR", "E", 1, "deg"],
    ["SPECTYP", "A", 16],
  ],
  // Table 4 (OI_ARRAY)
  OI_ARRAY: [
    ["TEL_NAME", "A", 16],
    ["STA_NAME", "A", 16],
    ["STA_INDEX", "I", 1],
    ["DIAMETER", "E", 1, "m"],
    ["STAXYZ", "D", 3, "m"],
    ["FOV", "D", 1, "arcsec"],
    ["FOVTYPE", "A", 6],
  ],
  // Table 5 (OI_WAVELENGTH, from memory: EFF_WAVE and EFF_BAND, E, metres)
  OI_WAVELENGTH: [
    ["EFF_WAVE", "E", 1, "m"],
    ["EFF_BAND", "E", 1, "m"],
  ],
  // Table 6 (OI_VIS2)
  OI_VIS2: [
    ...WHEN_COLUMNS,
    ["VIS2DATA", "D", "NWAVE"],
    ["VIS2ERR", "D", "NWAVE"],
    ["UCOORD", "D", 1, "m"],
    ["VCOORD", "D", 1, "m"],
    ["STA_INDEX", "I", 2],
    ["FLAG", "L", "NWAVE"],
  ],
  // Table 8 (OI_T3)
  OI_T3: [
    ...WHEN_COLUMNS,
    ["T3AMP", "D", "NWAVE"],
    ["T3AMPERR", "D", "NWAVE"],
    ["T3PHI", "D", "NWAVE", "deg"],
    ["T3PHIERR", "D", "NWAVE", "deg"],
    ["U1COORD", "D", 1, "m"],
    ["V1COORD", "D", 1, "m"],
    ["U2COORD", "D", 1, "m"],
    ["V2COORD", "D", 1, "m"],
    ["STA_INDEX", "I", 3],
    ["FLAG", "L", "NWAVE"],
  ],
};

describe("OIFITS 2 layout (Duvert, Young & Hummel 2017, A&A 597, A8)", () => {
  it("has the main header's mandatory keywords (Table 2)", () => {
    const h = hdus[0];
    for (const k of ["ORIGIN", "DATE", "DATE-OBS", "CONTENT", "TELESCOP", "INSTRUME", "OBSERVER", "OBJECT", "INSMODE"])
      expect(h.get(k), k).toBeTypeOf("string");
    expect(h.get("CONTENT")).toBe("OIFITS2");
    expect(h.get("OBJECT")).toBe("Demo's binary");
    expect(h.get("NUM_CHAN")).toBe(3);
  });

  it("has the five tables with OI_REVN = 2 and their keywords (Tables 3, 4, 5, 6, 8)", () => {
    expect(hdus.slice(1).map((h) => h.get("EXTNAME"))).toEqual([
      "OI_TARGET",
      "OI_ARRAY",
      "OI_WAVELENGTH",
      "OI_VIS2",
      "OI_T3",
    ]);
    for (const h of hdus.slice(1)) expect(h.get("OI_REVN")).toBe(2);
    for (const k of ["ARRNAME", "FRAME", "ARRAYX", "ARRAYY", "ARRAYZ"])
      expect(byName("OI_ARRAY").get(k), k).toBeDefined();
    expect(byName("OI_ARRAY").get("FRAME")).toBe("GEOCENTRIC");
    expect(byName("OI_WAVELENGTH").get("INSNAME")).toBe("SIMULATED");
    for (const t of ["OI_VIS2", "OI_T3"]) {
      for (const k of ["DATE-OBS", "ARRNAME", "INSNAME"]) expect(byName(t).get(k), `${t} ${k}`).toBeTypeOf("string");
      expect(byName(t).get("ARRNAME")).toBe(byName("OI_ARRAY").get("ARRNAME"));
      expect(byName(t).get("INSNAME")).toBe(byName("OI_WAVELENGTH").get("INSNAME"));
    }
  });

  it("has every mandatory column with the data type of the standard's tables", () => {
    const nwave = 3; // the request's three channels
    for (const [extname, spec] of Object.entries(MANDATORY_COLUMNS)) expectColumns(byName(extname), spec, nwave);
  });

  it("reads back the simulated values", () => {
    const wave = columnValues(byName("OI_WAVELENGTH"), "EFF_WAVE") as number[];
    for (const [i, w] of wave.entries()) expect(Math.abs(w / request.wavelengthsM[i] - 1)).toBeLessThan(1e-7); // float32
    const vis2 = byName("OI_VIS2");
    const rows = vis2.get("NAXIS2") as number;
    expect(rows * 3).toBe(response.vis2.length);
    const v2 = columnValues(vis2, "VIS2DATA") as number[];
    const u = columnValues(vis2, "UCOORD") as number[];
    const sta = columnValues(vis2, "STA_INDEX") as number[];
    const names = columnValues(byName("OI_ARRAY"), "STA_NAME");
    response.vis2.forEach((e, i) => {
      expect(v2[i]).toBeCloseTo(e.vis2, 9);
      const row = Math.floor(i / 3);
      expect(u[row]).toBeCloseTo(e.uM, 6);
      expect([names[sta[2 * row] - 1], names[sta[2 * row + 1] - 1]]).toEqual(e.stations);
    });
    expect((columnValues(vis2, "TIME") as number[]).every((t) => t === 0)).toBe(true); // Table 6: TIME zero
    expect((columnValues(vis2, "FLAG") as boolean[]).every((f) => f === false)).toBe(true);
    const t3 = byName("OI_T3");
    const phi = columnValues(t3, "T3PHI") as number[];
    const u2 = columnValues(t3, "U2COORD") as number[];
    response.closurePhases.forEach((e, i) => {
      expect(phi[i]).toBeCloseTo(e.closurePhaseDeg, 5);
      expect(u2[Math.floor(i / 3)]).toBeCloseTo(e.u2M, 6);
    });
    expect((columnValues(t3, "T3AMP") as number[]).every(Number.isNaN)).toBe(true);
    const mjd = columnValues(vis2, "MJD") as number[];
    expect(mjd[1] - mjd[0]).toBeCloseTo(1 / 24 / 1.0027379, 6); // one hour of hour angle, sidereal rate
  });

  it("places the array on the WGS 84 ellipsoid and keeps station separations", () => {
    // WGS 84 (NIMA TR8350.2): a = 6378137 m, b = 6356752.3142 m; the equator/Greenwich point is (a, 0, 0).
    expect(geodeticToEcef(0, 0, 0)).toEqual([WGS84_A_M, 0, 0]);
    expect(geodeticToEcef(Math.PI / 2, 0, 0)[2]).toBeCloseTo(6356752.3142, 3);
    const xyz = columnValues(byName("OI_ARRAY"), "STAXYZ") as number[];
    const s = request.stations;
    for (let i = 0; i < s.length; i++)
      for (let j = i + 1; j < s.length; j++) {
        const d = Math.hypot(xyz[3 * i] - xyz[3 * j], xyz[3 * i + 1] - xyz[3 * j + 1], xyz[3 * i + 2] - xyz[3 * j + 2]);
        const e = Math.hypot(s[i].eastM - s[j].eastM, s[i].northM - s[j].northM, s[i].upM - s[j].upM);
        expect(d).toBeCloseTo(e, 9);
      }
    // Up at the site points along the ellipsoid normal: the offset of 1 m up is the unit normal.
    const up = enuToEcefOffset(0, 0, 1, (-31.4 * Math.PI) / 180, (-68.9 * Math.PI) / 180);
    expect(Math.hypot(...up)).toBeCloseTo(1, 12);
    expect(up[2]).toBeCloseTo(Math.sin((-31.4 * Math.PI) / 180), 12);
  });
});
