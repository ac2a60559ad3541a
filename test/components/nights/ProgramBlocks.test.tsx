import { expectContainsAll } from "@test/contains-all";
import { renderToString } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { ProgramBlocks } from "~/components/nights/ProgramBlocks";

describe("ProgramBlocks", () => {
  it("lists the hours per configuration and every block with its outcome", () => {
    // React separates adjacent text nodes with empty comments; they are not part of the text.
    const html = renderToString(
      <ProgramBlocks
        hours={[
          { configuration: "medium-4", grantedHours: 3, plannedHours: 1.33, executedHours: 0.67, owedHours: 2.33 },
        ]}
        blocks={[
          {
            id: 1,
            night: "2025-05-20",
            configuration: "medium-4",
            kind: "science",
            target: "Ardilla 1",
            object: "Ardilla 1",
            startUtc: "2025-05-21T01:15:59Z",
            endUtc: "2025-05-21T01:55:59Z",
            outcome: "executed",
            note: "fringes stable",
          },
          {
            id: 2,
            night: "2025-05-20",
            configuration: "medium-4",
            kind: "calibrator",
            target: "Ardilla 1",
            object: "Ardilla 1 cal A",
            startUtc: "2025-05-21T01:55:59Z",
            endUtc: "2025-05-21T02:10:59Z",
            outcome: "weather",
            note: "",
          },
        ]}
      />,
    ).replaceAll("<!-- -->", "");
    expect(html).toContain("Nights: planned and executed blocks");
    expect(html).toMatch(/medium-4<\/td><td[^>]*>3<\/td><td[^>]*>1.33<\/td><td[^>]*>0.67<\/td><td[^>]*>2.33<\/td>/);
    expectContainsAll(html, [
      "Science: Ardilla 1",
      "Calibrator Ardilla 1 cal A for Ardilla 1",
      "01:15 UTC",
      "fringes stable",
      "lost to weather",
    ]);
  });

  it("says so when no published plan holds a block yet", () => {
    const html = renderToString(<ProgramBlocks hours={[]} blocks={[]} />);
    expect(html).toContain("No published night plan holds a block of this program yet.");
  });
});
