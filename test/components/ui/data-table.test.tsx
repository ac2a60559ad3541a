import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { type Column, DataTable, fixedColumn, namedColumn, tableToCsv } from "~/components/ui";

type Line = { id: string; name: string; institute: string; hours: number | null; note: string };

const columns: Column<Line>[] = [
  namedColumn({ key: "name", header: "Reviewer", name: (r) => r.name, note: (r) => r.institute }),
  fixedColumn({ key: "hours", header: "Hours", unit: "h", digits: 1, missing: "not fixed", value: (r) => r.hours }),
  { key: "note", header: "Note", controls: true, value: (r) => r.note, render: (r) => <input defaultValue={r.note} /> },
];
const rows: Line[] = [
  { id: "a", name: "Ada", institute: "North", hours: 2.25, note: "x" },
  { id: "b", name: "Ben", institute: "South", hours: null, note: "y" },
];
const total: Line = { id: "all", name: "Committee", institute: "", hours: 2.25, note: "" };

describe("the shared data table", () => {
  const html = renderToStaticMarkup(
    <DataTable columns={columns} rows={rows} footer={[total]} caption="Loads" density="compact" />,
  );

  it("names each row in a row header with its muted note, and shows numbers with fixed decimals", () => {
    expect(html).toContain('<th scope="row"');
    expect(html).toMatch(/Ada <span class="font-normal text-night-600">North<\/span>/);
    expect(html).toContain(">2.3</td>");
    expect(html).toContain(">not fixed</td>");
  });

  it("puts summary rows in the foot, after the body", () => {
    const foot = html.slice(html.indexOf("<tfoot"));
    expect(foot).toContain("Committee");
    expect(html.indexOf("Committee")).toBeGreaterThan(html.indexOf("Ben"));
  });

  it("sorts by data columns only: a column of controls has no sort button", () => {
    expect(html).toContain('title="Sort by Reviewer"');
    expect(html).toContain('title="Sort by Hours"');
    expect(html).not.toContain('title="Sort by Note"');
  });

  it("exports the data columns with units in the names and leaves the controls out", () => {
    expect(tableToCsv(columns, [...rows, total]).split("\r\n")).toEqual([
      "Reviewer,Hours (h)",
      "Ada,2.25",
      "Ben,",
      "Committee,2.25",
    ]);
  });
});
