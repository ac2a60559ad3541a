import Papa from "papaparse";
import * as v from "valibot";
import { describe, expect, it } from "vitest";
import {
  BandFormSchema,
  bandsToCsv,
  ConfigurationSchema,
  configurationsToCsv,
  decodeUpload,
  fieldErrors,
  issueText,
  MAX_IMPORT_BYTES,
  metresToMicrons,
  micronsToMetres,
  parseRegistryJson,
  parseStationsCsv,
  parseStationsFile,
  parseStationsJson,
  planRegistry,
  planStations,
  type RegistrySnapshot,
  registryToJson,
  SiteSchema,
  StationSchema,
  stationsToCsv,
} from "~/services/registry/io";

const utf8 = (s: string) => new TextEncoder().encode(s);
const texts = (issues: Parameters<typeof issueText>[0][]) => issues.map(issueText);

const GOOD_CSV = `name,eastM,northM,upM,pathOffsetM
C01,-16,-27.713,0.16,15.9
C02,0,-27.713,0.32,1.2
X01,32.161,105.194,1.2,14.5
`;

describe("station CSV", () => {
  it("reads a good file, rows counted from the first row under the header", () => {
    const out = parseStationsCsv(GOOD_CSV);
    expect(out.errors).toEqual([]);
    expect(out.notices).toEqual([]);
    expect(out.stations).toEqual([
      { row: 1, name: "C01", eastM: -16, northM: -27.713, upM: 0.16, pathOffsetM: 15.9 },
      { row: 2, name: "C02", eastM: 0, northM: -27.713, upM: 0.32, pathOffsetM: 1.2 },
      { row: 3, name: "X01", eastM: 32.161, northM: 105.194, upM: 1.2, pathOffsetM: 14.5 },
    ]);
  });

  it("takes columns in any order, headers with units in brackets, semicolons and a byte-order mark", () => {
    const out = parseStationsCsv("\uFEFFPath offset (m);Station;North (m);east_m;UP M\r\n1.5;W7;10;-3;0.25\r\n");
    expect(out.errors).toEqual([]);
    expect(out.stations).toEqual([{ row: 1, name: "W7", eastM: -3, northM: 10, upM: 0.25, pathOffsetM: 1.5 }]);
  });

  it("names the missing column", () => {
    const out = parseStationsCsv("name,northM,upM,pathOffsetM\nC01,1,0,0\n");
    expect(texts(out.errors)).toEqual([
      "eastM: the column is missing (the header row must name name, eastM, northM, upM, pathOffsetM)",
    ]);
    expect(out.stations).toEqual([]);
  });

  it("names row and column of a bad number, and of a decimal comma", () => {
    const out = parseStationsCsv(`name,eastM,northM,upM,pathOffsetM
C01,1,2,0,0
C02,2,3,0,0
C03,3,4,0,0
C04,abc,5,0,0
C05,"5,5",6,0,0
`);
    expect(texts(out.errors)).toEqual([
      "row 4, eastM: must be a number",
      "row 5, eastM: must be a number with a point for decimals (5.5, not 5,5)",
    ]);
  });

  it("reports every bad cell of a row, empty cells as required, and out-of-range values with the range", () => {
    const out = parseStationsCsv("name,eastM,northM,upM,pathOffsetM\n,1e6,,2000,x\n");
    expect(texts(out.errors)).toEqual([
      "row 1, name: is required",
      "row 1, eastM: must be between -20000 and 20000 m",
      "row 1, northM: is required",
      "row 1, upM: must be between -1000 and 1000 m",
      "row 1, pathOffsetM: must be a number",
    ]);
  });

  it("refuses a station name twice in one file, naming both rows", () => {
    const out = parseStationsCsv("name,eastM,northM,upM,pathOffsetM\nC01,0,0,0,0\nC02,1,0,0,0\nC01,2,0,0,0\n");
    expect(texts(out.errors)).toEqual(["row 3, name: C01 is already on row 1; a station may appear only once"]);
  });

  it("ignores extra columns and says which", () => {
    const out = parseStationsCsv(
      "name,eastM,northM,upM,pathOffsetM,Distance from centre (m),notes\nC01,3,4,0,0,5,pier\n",
    );
    expect(out.errors).toEqual([]);
    expect(out.stations).toHaveLength(1);
    expect(out.notices).toEqual(["Not used and ignored: the columns “Distance from centre (m)”, “notes”."]);
  });

  it("skips blank lines but keeps their row numbers", () => {
    const out = parseStationsCsv("name,eastM,northM,upM,pathOffsetM\nC01,0,0,0,0\n\n,,,,\nC02,x,0,0,0\n");
    expect(texts(out.errors)).toEqual(["row 4, eastM: must be a number"]);
  });

  it("refuses a row with too few or too many values, an unclosed quote, a header without rows, an empty file", () => {
    expect(texts(parseStationsCsv("name,eastM,northM,upM,pathOffsetM\nC01,0,0\nC02,0,0,0,0,9\n").errors)).toEqual([
      "row 1: has 3 values but the header has 5 columns",
      "row 2: has 6 values but the header has 5 columns",
    ]);
    expect(texts(parseStationsCsv('name,eastM,northM,upM,pathOffsetM\n"C01,0,0,0,0\n').errors)).toEqual([
      "row 1: a quoted value is never closed",
    ]);
    expect(texts(parseStationsCsv("name,eastM,northM,upM,pathOffsetM\n").errors)).toEqual([
      "The file has a header row but no stations under it.",
    ]);
    expect(texts(parseStationsCsv("\n\n").errors)).toEqual(["The file is empty."]);
  });

  it("refuses names that would break a configuration's station list", () => {
    const out = parseStationsCsv("name,eastM,northM,upM,pathOffsetM\nC 01,0,0,0,0\n=cmd,0,0,0,0\n");
    expect(texts(out.errors)).toEqual([
      "row 1, name: must start with a letter or digit and use only letters, digits, '.', '_' or '-'",
      "row 2, name: must start with a letter or digit and use only letters, digits, '.', '_' or '-'",
    ]);
  });
});

describe("station JSON", () => {
  it("reads a list, or an object with a stations list, and tells it from CSV by the first character", () => {
    const list = [{ name: "C01", eastM: 1, northM: 2, upM: 0, pathOffsetM: 3 }];
    expect(parseStationsJson(JSON.stringify(list)).stations).toEqual([{ ...list[0], row: 1 }]);
    const wrapped = parseStationsFile(`  \n${JSON.stringify({ stations: list })}`);
    expect(wrapped.format).toBe("json");
    expect(wrapped.stations).toEqual([{ ...list[0], row: 1 }]);
    expect(parseStationsFile(GOOD_CSV).format).toBe("csv");
  });

  it("names the item and field of a bad value, missing fields, non-objects and duplicates; ignores extra fields with a notice", () => {
    const out = parseStationsJson(
      JSON.stringify([
        { name: "C01", eastM: 1, northM: 2, upM: 0, pathOffsetM: 0, pad: "north" },
        { name: "C02", eastM: "far", northM: 2, upM: 0, pathOffsetM: 0 },
        { name: "C03", northM: 2, upM: 0, pathOffsetM: 0 },
        "C04",
        { name: "C01", eastM: 5, northM: 2, upM: 0, pathOffsetM: 0 },
      ]),
    );
    expect(texts(out.errors)).toEqual([
      "row 2, eastM: must be a number",
      "row 3, eastM: is required",
      "row 4: must be an object with name, eastM, northM, upM, pathOffsetM",
      "row 5, name: C01 is already on row 1; a station may appear only once",
    ]);
    expect(out.notices).toEqual(["Not used and ignored: the field “pad”."]);
  });

  it("refuses broken JSON, a wrong shape and an empty list", () => {
    expect(parseStationsJson("[{").errors[0].message).toMatch(/^The file is not valid JSON \(/);
    expect(texts(parseStationsJson('{"name":"C01"}').errors)).toEqual([
      "The JSON must be a list of stations, or an object with a “stations” list.",
    ]);
    expect(texts(parseStationsJson("[]").errors)).toEqual(["The list of stations is empty."]);
  });
});

describe("uploads", () => {
  it("decodes UTF-8 with or without a byte-order mark", () => {
    expect(decodeUpload(utf8("name\nC01"))).toEqual({ ok: true, text: "name\nC01" });
    expect(decodeUpload(new Uint8Array([0xef, 0xbb, 0xbf, ...utf8("Año")]))).toEqual({ ok: true, text: "Año" });
  });

  it("refuses empty, oversized, UTF-16, Latin-1, binary and zipped files with a reason", () => {
    expect(decodeUpload(new Uint8Array())).toEqual({ ok: false, error: "The file is empty." });
    expect(decodeUpload(utf8("  \n\t"))).toEqual({ ok: false, error: "The file is empty." });
    expect(decodeUpload(new Uint8Array(MAX_IMPORT_BYTES + 1).fill(65))).toEqual({
      ok: false,
      error: "The file is 1.0 MB; the limit is 1.0 MB.",
    });
    expect(decodeUpload(new Uint8Array(2_600_000).fill(65))).toEqual({
      ok: false,
      error: "The file is 2.6 MB; the limit is 1.0 MB.",
    });
    expect(decodeUpload(new Uint8Array([0xff, 0xfe, 0x6e, 0x00]))).toMatchObject({
      ok: false,
      error: expect.stringMatching(/UTF-16/),
    });
    expect(decodeUpload(new Uint8Array([0x41, 0xf1, 0x6f]))).toEqual({
      ok: false,
      error: "The file is not UTF-8 text; save it as UTF-8 and try again.",
    });
    expect(decodeUpload(new Uint8Array([0x41, 0x00, 0x42]))).toEqual({
      ok: false,
      error: "This is not a text file; import a CSV or JSON file.",
    });
    expect(decodeUpload(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14]))).toMatchObject({
      ok: false,
      error: expect.stringMatching(/workbook/),
    });
  });
});

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

  it("takes band wavelengths in µm, stores metres as typed, and keeps the bandwidth below twice the centre", () => {
    const ok = v.safeParse(BandFormSchema, {
      name: "H",
      centralWavelengthUm: "1.65",
      channels: "6",
      bandwidthUm: "0.3",
      limitingMagnitude: "7.5",
    });
    expect(ok.success).toBe(true);
    expect(micronsToMetres(1.65)).toBe(1.65e-6);
    expect(micronsToMetres(2.2)).toBe(2.2e-6);
    expect(metresToMicrons(1.65e-6)).toBe(1.65);
    const wide = v.safeParse(BandFormSchema, {
      name: "H",
      centralWavelengthUm: "1",
      channels: "1.5",
      bandwidthUm: "0.5",
      limitingMagnitude: "7",
    });
    expect(!wide.success && fieldErrors(wide.issues)).toEqual({ channels: "must be a whole number" });
    const wide2 = v.safeParse(BandFormSchema, {
      name: "H",
      centralWavelengthUm: "1",
      channels: "1",
      bandwidthUm: "2",
      limitingMagnitude: "7",
    });
    expect(!wide2.success && fieldErrors(wide2.issues)).toEqual({
      bandwidthUm: "must be less than twice the central wavelength (the band's short edge would fall below zero)",
    });
  });
});

const SNAPSHOT: RegistrySnapshot = {
  site: {
    name: "Test Array",
    latitudeDeg: -31.4,
    longitudeDeg: -68.9,
    altitudeM: 2450,
    minElevationDeg: 30,
    delayLineStrokeM: 90,
    timeZone: "UTC",
  },
  stations: [
    { name: "A1", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
    { name: "A2", eastM: 10, northM: 0, upM: 0, pathOffsetM: 1 },
    { name: "A3", eastM: 0, northM: 10, upM: 0, pathOffsetM: 2 },
    { name: "A4", eastM: 20, northM: 20, upM: 0, pathOffsetM: 3 },
  ],
  configurations: [{ name: "pair", description: "two", offered: true, stations: ["A1", "A2"] }],
  instruments: [
    {
      name: "Combiner",
      description: "",
      maxTelescopes: 3,
      bands: [{ name: "H", centralWavelengthM: 1.65e-6, channels: 6, bandwidthM: 0.3e-6, limitingMagnitude: 7.5 }],
    },
  ],
};

describe("what a station import would change", () => {
  const incoming = parseStationsCsv(
    "name,eastM,northM,upM,pathOffsetM\nA1,0,0,0,0\nA2,11,0,0,1\nB1,5,5,0,0\n",
  ).stations;

  it("sorts stations into new, updated (with the changed fields) and unchanged, and keeps the rest by default", () => {
    const plan = planStations(SNAPSHOT.stations, incoming, {
      removeMissing: false,
      usage: { A1: ["pair"], A2: ["pair"] },
    });
    expect(plan.lines.map((l) => [l.name, l.change, l.changed])).toEqual([
      ["A1", "unchanged", []],
      ["A2", "updated", ["eastM"]],
      ["B1", "new", []],
      ["A3", "keep", []],
      ["A4", "keep", []],
    ]);
    expect(plan.counts).toEqual({ new: 1, updated: 1, unchanged: 1, remove: 0, keep: 2 });
  });

  it("removes stations missing from the file only when asked, and never one a configuration uses", () => {
    const plan = planStations(SNAPSHOT.stations, incoming.slice(2), {
      removeMissing: true,
      usage: { A1: ["pair"], A2: ["pair"] },
    });
    expect(plan.lines.map((l) => [l.name, l.change])).toEqual([
      ["B1", "new"],
      ["A1", "keep"],
      ["A2", "keep"],
      ["A3", "remove"],
      ["A4", "remove"],
    ]);
    expect(plan.lines.find((l) => l.name === "A1")?.note).toBe("not in the file, but used by pair, so it stays");
    expect(plan.notices).toEqual(["2 stations missing from the file stay because configurations use them."]);
  });
});

describe("whole registry JSON", () => {
  const exported = () => JSON.parse(JSON.stringify(registryToJson(SNAPSHOT, new Date("2027-01-01T00:00:00Z"))));

  it("round-trips through its own export and changes nothing", () => {
    const parsed = parseRegistryJson(JSON.stringify(exported()));
    expect(parsed.errors).toEqual([]);
    const plan = planRegistry(SNAPSHOT, parsed.registry!, { removeMissing: true });
    expect(plan.errors).toEqual([]);
    expect(plan.counts.site.unchanged).toBe(1);
    expect(plan.counts.stations).toEqual({ new: 0, updated: 0, unchanged: 4, remove: 0, keep: 0 });
    expect(plan.counts.configurations.unchanged).toBe(1);
    expect(plan.counts.bands.unchanged).toBe(1);
  });

  it("plans a new site with everything new when no site has the file's name", () => {
    const file = exported();
    file.site.name = "Other Array";
    const plan = planRegistry(null, parseRegistryJson(JSON.stringify(file)).registry!, { removeMissing: false });
    expect(plan.site.change).toBe("new");
    expect(plan.counts.stations.new).toBe(4);
    expect(plan.counts.instruments.new).toBe(1);
  });

  it("sees updates to the site, a configuration's order and a band, and warns of a configuration wider than every instrument", () => {
    const file = exported();
    file.site.minElevationDeg = 25;
    file.configurations[0].stations = ["A2", "A1"];
    file.configurations.push({ name: "all", description: "", offered: false, stations: ["A1", "A2", "A3", "A4"] });
    file.instruments[0].bands[0].limitingMagnitude = 8;
    const plan = planRegistry(SNAPSHOT, parseRegistryJson(JSON.stringify(file)).registry!, { removeMissing: false });
    expect(plan.site.changed).toEqual(["minElevationDeg"]);
    expect(plan.configurations.map((c) => [c.name, c.change, c.changed])).toEqual([
      ["pair", "updated", ["stations"]],
      ["all", "new", []],
    ]);
    expect(plan.instruments[0].bands.map((b) => [b.name, b.change, b.changed])).toEqual([
      ["H", "updated", ["limitingMagnitude"]],
    ]);
    expect(plan.notices).toEqual(["Configuration all has 4 stations; no instrument combines more than 3."]);
  });

  it("keeps stations that a configuration in the file uses even when asked to remove missing ones", () => {
    const file = exported();
    file.stations = file.stations.filter((s: { name: string }) => s.name === "A3");
    const plan = planRegistry(SNAPSHOT, parseRegistryJson(JSON.stringify(file)).registry!, { removeMissing: true });
    expect(plan.stations.map((l) => [l.name, l.change])).toEqual([
      ["A3", "unchanged"],
      ["A1", "keep"],
      ["A2", "keep"],
      ["A4", "remove"],
    ]);
  });

  it("names the section, row and field of every problem", () => {
    const file = exported();
    file.site.latitudeDeg = 95;
    file.stations[1].northM = "north";
    file.stations.push({ ...file.stations[0] });
    file.configurations.push({ name: "pair", stations: ["A1"] });
    file.instruments[0].maxTelescopes = 1;
    file.instruments[0].bands[0].channels = 0;
    const parsed = parseRegistryJson(JSON.stringify(file));
    expect(parsed.registry).toBeNull();
    expect(texts(parsed.errors)).toEqual([
      "site, latitudeDeg: must be between -90 and 90 °",
      "stations row 2, northM: must be a number",
      "stations row 5, name: A1 is already on row 1; a station may appear only once",
      "configurations row 2, stations: needs at least 2 stations",
      "instruments row 1, maxTelescopes: must be between 2 and 50",
      "instruments row 1, bands[1].channels: must be between 1 and 100000",
    ]);
  });

  it("refuses a configuration that lists a station neither in the file nor at the site", () => {
    const file = exported();
    file.configurations.push({ name: "far", stations: ["A1", "Z9"] });
    const plan = planRegistry(SNAPSHOT, parseRegistryJson(JSON.stringify(file)).registry!, { removeMissing: false });
    expect(texts(plan.errors)).toEqual([
      "configurations row 2, stations: Z9 is neither in the file's stations nor at the site",
    ]);
  });

  it("refuses CSV, missing lists and a foreign format", () => {
    expect(texts(parseRegistryJson(GOOD_CSV).errors)).toEqual([
      "A whole-registry import is a JSON file in the format of the registry export; this looks like CSV.",
    ]);
    expect(texts(parseRegistryJson(JSON.stringify({ site: SNAPSHOT.site, stations: [] })).errors)).toEqual([
      "configurations: the file needs a “configurations” list (it may be empty)",
      "instruments: the file needs a “instruments” list (it may be empty)",
    ]);
    expect(texts(parseRegistryJson(JSON.stringify({ ...exported(), format: "other" })).errors)).toEqual([
      "format: must be “fringe-docket-registry”",
    ]);
  });
});

describe("exports", () => {
  it("writes stations with units in the header and reads them back unchanged", () => {
    const csv = stationsToCsv(SNAPSHOT.stations);
    expect(csv.split("\n")[0]).toBe("name,eastM,northM,upM,pathOffsetM");
    const back = parseStationsCsv(csv);
    expect(back.stations.map(({ row: _row, ...s }) => s)).toEqual(SNAPSHOT.stations);
  });

  it("writes configurations with their ordered stations and bands in micrometres", () => {
    const configs = Papa.parse<string[]>(configurationsToCsv(SNAPSHOT.configurations)).data;
    expect(configs).toEqual([
      ["name", "description", "offered", "stationCount", "stations"],
      ["pair", "two", "true", "2", "A1 A2"],
    ]);
    const bands = Papa.parse<string[]>(bandsToCsv(SNAPSHOT.instruments)).data;
    expect(bands).toEqual([
      ["instrument", "maxTelescopes", "band", "centralWavelengthUm", "bandwidthUm", "channels", "limitingMagnitude"],
      ["Combiner", "3", "H", "1.65", "0.3", "6", "7.5"],
    ]);
  });

  it("neutralises spreadsheet formulas in free text", () => {
    const csv = configurationsToCsv([{ name: "x", description: "=HYPERLINK(1)", offered: true, stations: ["A", "B"] }]);
    expect(csv).toContain("'=HYPERLINK(1)");
  });
});
