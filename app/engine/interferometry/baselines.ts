/**
 * Baselines of a station set. With N stations there are N(N−1)/2 baselines;
 * baseline i–j (i < j) is the vector station j minus station i, and baselines
 * are ordered (0,1), (0,2), …, (0,N−1), (1,2), … following the order in which
 * the stations are listed.
 */
import { float64Arrays } from "../arrays";

/** Number of baselines N(N−1)/2 of N stations (0 for N < 2). */
export function baselineCount(nStations: number): number {
  return nStations < 2 ? 0 : (nStations * (nStations - 1)) / 2;
}

/** Index of baseline (i, j), 0 ≤ i < j < n, in the ordering above. */
export function baselineIndex(nStations: number, i: number, j: number): number {
  return i * nStations - (i * (i + 1)) / 2 + (j - i - 1);
}

/** Longest distance between two stations (east, north, up), metres; 0 for fewer than two. */
export function longestBaselineM(stations: readonly { eastM: number; northM: number; upM: number }[]): number {
  let longest = 0;
  for (let i = 0; i < stations.length; i++) {
    for (let j = i + 1; j < stations.length; j++) {
      const a = stations[i];
      const b = stations[j];
      longest = Math.max(longest, Math.hypot(b.eastM - a.eastM, b.northM - a.northM, b.upM - a.upM));
    }
  }
  return longest;
}

export interface BaselineSet {
  nStations: number;
  count: number;
  /** First station index of each baseline. */
  first: Int32Array;
  /** Second station index of each baseline. */
  second: Int32Array;
  /** Equatorial components of station(second) − station(first), metres. */
  xM: Float64Array;
  yM: Float64Array;
  zM: Float64Array;
  /** Fixed path offset difference P_second − P_first, metres. */
  pathOffsetDiffM: Float64Array;
}

/**
 * Builds every baseline of a station set.
 * @param stationXyz packed equatorial positions [x0,y0,z0,...], metres (see stations.ts)
 * @param pathOffsetsM fixed optical path offset of each station, metres (same order)
 */
export function buildBaselines(stationXyz: Float64Array, pathOffsetsM: ArrayLike<number>): BaselineSet {
  const n = stationXyz.length / 3;
  const count = baselineCount(n);
  const first = new Int32Array(count);
  const second = new Int32Array(count);
  const [xM, yM, zM, pathOffsetDiffM] = float64Arrays(4, count);
  let b = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      first[b] = i;
      second[b] = j;
      xM[b] = stationXyz[3 * j] - stationXyz[3 * i];
      yM[b] = stationXyz[3 * j + 1] - stationXyz[3 * i + 1];
      zM[b] = stationXyz[3 * j + 2] - stationXyz[3 * i + 2];
      pathOffsetDiffM[b] = pathOffsetsM[j] - pathOffsetsM[i];
      b++;
    }
  }
  return { nStations: n, count, first, second, xM, yM, zM, pathOffsetDiffM };
}
