import { describe, expect, it } from "vitest";
import { blankCycleValues, parseCycleForm, valuesOfCycle } from "~/services/cycles/form";
import type { CycleFormValues } from "~/services/cycles/schemas";

const ids = [3, 7];

function typed(over: Partial<CycleFormValues> = {}): CycleFormValues {
  return {
    name: " 2027B ",
    description: "Second semester",
    observingStart: "2027-09-01",
    observingEnd: "2028-02-28",
    submissionDeadline: "2027-06-15T12:00",
    reviewDeadline: "",
    decisionDate: "",
    scoreBest: "1",
    scoreWorst: "5",
    offered: ["3", "7"],
    nights: { 3: "30", 7: "20" },
    committee: [],
    ...over,
  };
}

describe("the cycle form", () => {
  it("reads the deadline as UTC, trims the name and the nights of each ticked configuration", () => {
    const out = parseCycleForm(typed(), ids);
    expect(out).toEqual({
      ok: true,
      value: {
        name: "2027B",
        description: "Second semester",
        observingStart: "2027-09-01",
        observingEnd: "2028-02-28",
        submissionDeadline: new Date("2027-06-15T12:00:00Z"),
        reviewDeadline: null,
        decisionDate: null,
        scoreBest: 1,
        scoreWorst: 5,
        committee: [],
        offers: [
          { configurationId: 3, nightsAvailable: 30 },
          { configurationId: 7, nightsAvailable: 20 },
        ],
      },
    });
  });

  it("names each bad field once, by its form name", () => {
    const out = parseCycleForm(
      typed({ name: "", observingStart: "2027-02-30", nights: { 3: "367", 7: "x" }, offered: ["3", "7", "99"] }),
      ids,
    );
    expect(out).toEqual({
      ok: false,
      errors: {
        name: "Name: give the cycle a name, e.g. 2027B",
        observingStart: "First night: not a real date",
        "nights-3": "Nights: a number from 0 to 366",
        "nights-7": "Nights: a number from 0 to 366",
        offered: "Configurations: one of the chosen configurations does not exist",
      },
    });
  });

  it("wants the nights of each ticked configuration, none above the cycle's nights, nor all together", () => {
    // 2027-09-01 … 2028-02-28: 30 + 31 + 30 + 31 + 31 + 28 = 181 nights, both ends counted.
    const empty = parseCycleForm(typed({ nights: { 3: "30", 7: "" } }), ids);
    expect(empty.ok ? {} : empty.errors).toEqual({
      "nights-7": "Nights: give the nights this configuration is on offer, or untick it",
    });
    const long = parseCycleForm(typed({ nights: { 3: "182", 7: "10" } }), ids);
    expect(long.ok ? {} : long.errors).toEqual({
      "nights-3": "Nights: at most 181, the nights from the first to the last night of the cycle",
    });
    expect(parseCycleForm(typed({ nights: { 3: "181", 7: "0" } }), ids).ok).toBe(true);
    const all = parseCycleForm(typed({ nights: { 3: "100", 7: "90" } }), ids);
    expect(all.ok ? {} : all.errors).toEqual({
      offered:
        "Configurations: 190 nights in all, more than the 181 nights of the cycle (one configuration is installed at a time)",
    });
    // An unticked configuration's nights are not read.
    expect(parseCycleForm(typed({ offered: ["3"], nights: { 3: "30", 7: "" } }), ids).ok).toBe(true);
  });

  it("checks the order of the dates only once each date is readable", () => {
    const late = parseCycleForm(typed({ observingEnd: "2027-08-31", submissionDeadline: "2027-09-01T00:00" }), ids);
    expect(late.ok ? {} : late.errors).toEqual({
      observingEnd: "Last night: must not be before the first night",
      submissionDeadline: "Deadline: must fall before the first night of the cycle",
    });
  });

  it("shows a stored cycle as the values it was typed as, and a new one offering nothing yet", () => {
    const parsed = parseCycleForm(typed({ name: "2027B" }), ids);
    if (!parsed.ok) throw new Error("the form should parse");
    expect(valuesOfCycle(parsed.value)).toEqual(typed({ name: "2027B" }));
    expect(blankCycleValues()).toMatchObject({ name: "", offered: [], nights: {} });
  });

  it("reads the committee's dates, scale and members, and checks them against each other", () => {
    const ok = parseCycleForm(
      typed({
        reviewDeadline: "2027-07-15T12:00",
        decisionDate: "2027-08-01",
        scoreBest: "10",
        scoreWorst: "1",
        committee: ["21", "22"],
      }),
      ids,
      [21, 22, 23],
    );
    expect(ok.ok && ok.value).toMatchObject({
      reviewDeadline: new Date("2027-07-15T12:00:00Z"),
      decisionDate: "2027-08-01",
      scoreBest: 10,
      scoreWorst: 1,
      committee: [21, 22],
    });
    const bad = parseCycleForm(
      typed({
        reviewDeadline: "2027-06-01T00:00",
        decisionDate: "2027-05-01",
        scoreBest: "3",
        scoreWorst: "3",
        committee: ["99"],
      }),
      ids,
      [21],
    );
    expect(bad.ok ? {} : bad.errors).toEqual({
      reviewDeadline: "Review deadline: must come after the submission deadline",
      decisionDate: "Decision date: must not be before the review deadline",
      scoreWorst: "Poorest score: must differ from the best score",
      committee: "Committee: only people with the reviewer role can sit on the committee",
    });
    const late = parseCycleForm(typed({ reviewDeadline: "2027-09-02T00:00", scoreWorst: "40" }), ids);
    expect(late.ok ? {} : late.errors).toEqual({
      reviewDeadline: "Review deadline: must fall before the first night of the cycle",
      scoreWorst: "Poorest score: at most 20 steps from the best score",
    });
    const unreadable = parseCycleForm(typed({ scoreBest: "x", decisionDate: "2027-13-01" }), ids);
    expect(unreadable.ok ? {} : unreadable.errors).toEqual({
      scoreBest: "Best score: a whole number from 0 to 100",
      decisionDate: "Decision date: use the form YYYY-MM-DD",
    });
  });
});
