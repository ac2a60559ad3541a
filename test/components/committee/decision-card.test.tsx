import { expectContainsAll } from "@test/contains-all";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { DecisionCard } from "~/components/committee/DecisionCard";

const text = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/\s+/g, " ");

describe("the decision card on the proposer's page", () => {
  it("shows the outcome, the hours per configuration, the chair's message and the reviewers' comments", () => {
    const html = renderToStaticMarkup(
      <DecisionCard
        decision={{
          cycleName: "2027A",
          decision: "accept",
          words: "Accepted",
          message: "Observe in May.",
          hours: [
            { configuration: "compact-3", hours: 4 },
            { configuration: "extended-6", hours: 2.5 },
          ],
          totalHours: 6.5,
          comments: [{ label: "Reviewer 1", text: "Clear case." }],
          releasedAt: "2027-02-10T12:00:00.000Z",
        }}
      />,
    );
    const t = text(html);
    expectContainsAll(t, [
      "Accepted",
      "Time granted: 6.5 h",
      "compact-3: 4.0 h",
      "extended-6: 2.5 h",
      "Observe in May.",
      "Reviewer 1: Clear case.",
      "sent 2027-02-10 12:00 UTC",
    ]);
  });

  it("shows no hours for a proposal on the waiting list, and nothing before the release", () => {
    const t = text(
      renderToStaticMarkup(
        <DecisionCard
          decision={{
            cycleName: "2027A",
            decision: "waitlist",
            words: "Waiting list",
            message: "",
            hours: [],
            totalHours: 0,
            comments: [],
            releasedAt: "2027-02-10T12:00:00.000Z",
          }}
        />,
      ),
    );
    expect(t).toContain("Waiting list");
    expect(t).not.toContain("Time granted");
    expect(renderToStaticMarkup(<DecisionCard decision={null} />)).toBe("");
  });
});
