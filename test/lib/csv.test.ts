import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { neutralizeCell, toCsv } from "~/lib/csv";

describe("CSV export", () => {
  // OWASP, "CSV Injection": cells beginning with =, +, -, @, tab (0x09) or carriage return (0x0D)
  // are read as formulas by spreadsheets; prefix them with a single quote and quote the cell.
  it("neutralizes text cells that a spreadsheet would run as a formula", () => {
    const csv = toCsv(
      ["name", "notes"],
      [
        ['=HYPERLINK("http://evil.example","x")', "plain"],
        ["+1", "@SUM(A1:A2)"],
        ["-2+3", "\tindented"],
        ["\rreturn", "safe - in the middle"],
      ],
    );
    const rows = Papa.parse<string[]>(csv).data;
    expect(rows[1]).toEqual(['\'=HYPERLINK("http://evil.example","x")', "plain"]);
    expect(rows[2]).toEqual(["'+1", "'@SUM(A1:A2)"]);
    expect(rows[3]).toEqual(["'-2+3", "'\tindented"]);
    expect(rows[4]).toEqual(["'\rreturn", "safe - in the middle"]);
  });

  it("leaves numbers as numbers, negative ones included, so coordinates keep their sign", () => {
    const csv = toCsv(["decDeg", "latitudeDeg", "ok", "empty"], [[-1.2, -31.4, true, null]]);
    expect(csv.split("\r\n")[1]).toBe("-1.2,-31.4,true,");
  });

  it("neutralizes a formula-like header too, and reads back exactly what was meant", () => {
    expect(toCsv(["=cmd"], []).split("\r\n")[0]).toBe('"\'=cmd"');
    expect(neutralizeCell("-01:12:07")).toBe("'-01:12:07");
    expect(neutralizeCell("Lumbre Nova 12")).toBe("Lumbre Nova 12");
  });
});
