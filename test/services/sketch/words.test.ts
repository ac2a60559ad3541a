import { describe, expect, it } from "vitest";
import { plural, seconds, sketchStatus, utcSpan } from "~/services/sketch/words";

const base = {
  typing: false,
  computing: false,
  refused: false,
  ready: true,
  waitingForTarget: false,
  answered: true,
  drawnMs: 283.4,
  opened: false,
};

describe("words of the sketch pages", () => {
  it("counts in the singular and the plural", () => {
    expect(plural(1, "triangle")).toBe("1 triangle");
    expect(plural(0, "triangle")).toBe("0 triangles");
    expect(plural(2024, "triangle")).toBe("2024 triangles");
    expect(plural(1, "station is", "stations are")).toBe("1 station is");
    expect(seconds(283.4)).toBe("0.28 s");
  });

  it("writes spans of time in UTC on a 24-hour clock with the zone", () => {
    const a = Date.UTC(2027, 2, 16, 1, 20);
    expect(utcSpan(a, Date.UTC(2027, 2, 16, 6, 40))).toBe("2027-03-16 01:20–06:40 UTC (5.3 h)");
    expect(utcSpan(Date.UTC(2027, 2, 15, 23, 10), Date.UTC(2027, 2, 16, 4, 40))).toBe(
      "2027-03-15 23:10 – 2027-03-16 04:40 UTC (5.5 h)",
    );
  });

  it("tells the time from the change to the plots drawn, and waits for typing only while typing", () => {
    expect(sketchStatus(base).text).toBe("Up to date: drawn 0.28 s after your change");
    expect(sketchStatus({ ...base, opened: true }).text).toBe("Up to date");
    expect(sketchStatus({ ...base, drawnMs: null })).toMatchObject({ text: "Drawing the plots…", busy: true });
    expect(sketchStatus({ ...base, computing: true, answered: false }).text).toBe("Computing the sketch…");
    expect(sketchStatus({ ...base, typing: true }).text).toBe("Waiting for you to finish typing…");
    expect(sketchStatus({ ...base, refused: true, answered: false })).toMatchObject({ problem: true });
    expect(sketchStatus({ ...base, refused: true, answered: false, busyRetryS: 2 })).toMatchObject({
      text: "The server is busy: asking again in 2 s",
      busy: true,
      problem: false,
    });
    expect(sketchStatus({ ...base, ready: false, answered: false, waitingForTarget: true }).text).toBe(
      "Waiting for a target",
    );
  });
});
