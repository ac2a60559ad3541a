import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { bandsToCsv, configurationsToCsv, registryToJson, stationsToCsv } from "~/services/registry/exports";
import { planRegistry, planStations, type RegistrySnapshot } from "~/services/registry/plan";
import { parseRegistryJson } from "~/services/registry/registry-json";
import { parseStationsCsv } from "~/services/registry/stations-csv";
import { issueText } from "~/services/registry/upload";

const texts = (issues: Parameters<typeof issueText>[0][]) => issues.map(issueText);

const GOOD_CSV = `name,eastM,northM,upM,pathOffsetM
C01,-16,-27.713,0.16,15.9
C02,0,-27.713,0.32,1.2
X01,32.161,105.194,1.2,14.5
`;

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
