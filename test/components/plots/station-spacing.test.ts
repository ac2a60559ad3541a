import { describe, expect, it } from "vitest";
import { extent, namesWithRoom, nearestDistances } from "~/components/plots/station-spacing";

describe("station names on a site plan", () => {
  // Three stations 10 m apart and one far off; distances by hand (Pythagoras).
  const stations = [
    { eastM: 0, northM: 0 },
    { eastM: 10, northM: 0 },
    { eastM: 0, northM: 10 },
    { eastM: 180, northM: 240 },
  ];

  it("finds each station's nearest neighbour", () => {
    // D's nearest is C: √(180² + 230²) = 292.06 m (B is √(170² + 240²) = 294.1 m, A 300 m).
    const d = nearestDistances(stations);
    expect(d.slice(0, 3)).toEqual([10, 10, 10]);
    expect(d[3]).toBeCloseTo(Math.hypot(180, 230), 9);
    expect(nearestDistances([{ eastM: 1, northM: 2 }])).toEqual([Infinity]);
    expect(extent(stations)).toBe(240);
  });

  it("draws a name only where the nearest station is 24 px or more away on screen", () => {
    // At 1 m per pixel the packed three are 10 px apart: their names are left to the hover.
    expect(namesWithRoom(stations, 1)).toEqual([false, false, false, true]);
    // Zoomed in to 0.25 m per pixel they are 40 px apart and every name fits.
    expect(namesWithRoom(stations, 0.25)).toEqual([true, true, true, true]);
  });
});
