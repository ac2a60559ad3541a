import { describe, expect, it } from "vitest";
import { parseStationsFile, parseStationsJson } from "~/services/registry/registry-json";
import { parseStationsCsv } from "~/services/registry/stations-csv";
import { decodeUpload, issueText, MAX_IMPORT_BYTES } from "~/services/registry/upload";

const utf8 = (s: string) => new TextEncoder().encode(s);
const texts = (issues: Parameters<typeof issueText>[0][]) => issues.map(issueText);

const GOOD_CSV = `name,eastM,northM,upM,pathOffsetM
C01,-16,-27.713,0.16,15.9
C02,0,-27.713,0.32,1.2
X01,32.161,105.194,1.2,14.5
`;

describe("station CSV", () => {
  it("reads a good file, rows numbered by the lines of the file (the header on line 1)", () => {
    const out = parseStationsCsv(GOOD_CSV);
    expect(out.errors).toEqual([]);
    expect(out.notices).toEqual([]);
    expect(out.stations).toEqual([
      { row: 2, name: "C01", eastM: -16, northM: -27.713, upM: 0.16, pathOffsetM: 15.9 },
      { row: 3, name: "C02", eastM: 0, northM: -27.713, upM: 0.32, pathOffsetM: 1.2 },
      { row: 4, name: "X01", eastM: 32.161, northM: 105.194, upM: 1.2, pathOffsetM: 14.5 },
    ]);
  });

  it("takes columns in any order, headers with units in brackets, semicolons and a byte-order mark", () => {
    const out = parseStationsCsv("\uFEFFPath offset (m);Station;North (m);east_m;UP M\r\n1.5;W7;10;-3;0.25\r\n");
    expect(out.errors).toEqual([]);
    expect(out.stations).toEqual([{ row: 2, name: "W7", eastM: -3, northM: 10, upM: 0.25, pathOffsetM: 1.5 }]);
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
      "row 5, eastM: must be a number",
      "row 6, eastM: must be a number with a point for decimals (5.5, not 5,5)",
    ]);
  });

  it("reports every bad cell of a row, empty cells as required, and out-of-range values with the range", () => {
    const out = parseStationsCsv("name,eastM,northM,upM,pathOffsetM\n,1e6,,2000,x\n");
    expect(texts(out.errors)).toEqual([
      "row 2, name: is required",
      "row 2, eastM: must be between -20000 and 20000 m",
      "row 2, northM: is required",
      "row 2, upM: must be between -1000 and 1000 m",
      "row 2, pathOffsetM: must be a number",
    ]);
  });

  it("refuses a station name twice in one file, naming both rows", () => {
    const out = parseStationsCsv("name,eastM,northM,upM,pathOffsetM\nC01,0,0,0,0\nC02,1,0,0,0\nC01,2,0,0,0\n");
    expect(texts(out.errors)).toEqual(["row 4, name: C01 is already on row 2; a station may appear only once"]);
  });

  it("ignores extra columns and says which", () => {
    const out = parseStationsCsv(
      "name,eastM,northM,upM,pathOffsetM,Distance from centre (m),notes\nC01,3,4,0,0,5,pier\n",
    );
    expect(out.errors).toEqual([]);
    expect(out.stations).toHaveLength(1);
    expect(out.notices).toEqual(["Not used and ignored: the columns “Distance from centre (m)”, “notes”."]);
  });

  it("skips blank lines but counts them in the line numbers", () => {
    const out = parseStationsCsv("name,eastM,northM,upM,pathOffsetM\nC01,0,0,0,0\n\n,,,,\nC02,x,0,0,0\n");
    expect(texts(out.errors)).toEqual(["row 5, eastM: must be a number"]);
  });

  it("refuses a row with too few or too many values, an unclosed quote, a header without rows, an empty file", () => {
    expect(texts(parseStationsCsv("name,eastM,northM,upM,pathOffsetM\nC01,0,0\nC02,0,0,0,0,9\n").errors)).toEqual([
      "row 2: has 3 values but the header has 5 columns",
      "row 3: has 6 values but the header has 5 columns",
    ]);
    expect(texts(parseStationsCsv('name,eastM,northM,upM,pathOffsetM\n"C01,0,0,0,0\n').errors)).toEqual([
      "row 2: a quoted value is never closed",
    ]);
    expect(texts(parseStationsCsv("name,eastM,northM,upM,pathOffsetM\n").errors)).toEqual([
      "The file has a header row but no stations under it.",
    ]);
    expect(texts(parseStationsCsv("\n\n").errors)).toEqual(["The file is empty."]);
  });

  it("refuses names that would break a configuration's station list", () => {
    const out = parseStationsCsv("name,eastM,northM,upM,pathOffsetM\nC 01,0,0,0,0\n=cmd,0,0,0,0\n");
    expect(texts(out.errors)).toEqual([
      "row 2, name: must start with a letter or digit and use only letters, digits, '.', '_' or '-'",
      "row 3, name: must start with a letter or digit and use only letters, digits, '.', '_' or '-'",
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
