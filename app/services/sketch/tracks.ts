/**
 * Sampled quantities as polylines for the uv plane and the closure phases (the samples of each
 * channel joined in time order, broken where samples are missing) and for the V² panel (the channels
 * of each sample joined). A line
 * through thousands of samples draws as one path, where a marker per sample draws thousands (the
 * uv plane of six stations has about 10 000 points). A sample with no neighbour cannot make a line,
 * so those come back apart, to be drawn as markers. Pure.
 */

/** One polyline for Plotly (null between the pieces) and the samples that stand alone. */
export interface Track {
  x: (number | null)[];
  y: (number | null)[];
  /** Per vertex: [hour angle (h), wavelength (µm) or NaN]; null at the breaks. */
  custom: ([number, number] | null)[];
  lone: { x: number[]; y: number[]; custom: [number, number][] };
}

/** A sample as the tracks read it: its hour angle. */
export interface TimedPoint {
  hourAngleH: number;
}

/**
 * The usual spacing of the samples, hours: the smallest positive step between consecutive hour
 * angles (samples further apart than 1.5 of it have something missing between them).
 */
export function sampleSpacingH(points: readonly TimedPoint[]): number {
  let best = Infinity;
  for (let i = 1; i < points.length; i++) {
    const d = points[i].hourAngleH - points[i - 1].hourAngleH;
    if (d > 1e-9 && d < best) best = d;
  }
  return best;
}

/**
 * The tracks of `points` (in time order) over `channels` channels: for each channel the vertices
 * `at(point, channel)` in order, a new piece wherever the next sample is more than 1.5 spacings later
 * (or earlier: the hour angle wrapped), or where `breakBetween` says so.
 */
export function sampleTracks<P extends TimedPoint>(
  points: readonly P[],
  channels: number,
  at: (p: P, channel: number) => [number, number],
  opts: {
    wavelengthsM?: readonly number[];
    breakBetween?: (a: [number, number], b: [number, number]) => boolean;
  } = {},
): Track {
  const out: Track = { x: [], y: [], custom: [], lone: { x: [], y: [], custom: [] } };
  const gap = 1.5 * sampleSpacingH(points);
  for (let c = 0; c < channels; c++) {
    const lambda = (opts.wavelengthsM?.[c] ?? Number.NaN) * 1e6;
    let piece: { xy: [number, number]; ha: number }[] = [];
    const flush = () => {
      if (piece.length === 1) {
        out.lone.x.push(piece[0].xy[0]);
        out.lone.y.push(piece[0].xy[1]);
        out.lone.custom.push([piece[0].ha, lambda]);
      } else if (piece.length > 1) {
        if (out.x.length > 0) {
          out.x.push(null);
          out.y.push(null);
          out.custom.push(null);
        }
        for (const v of piece) {
          out.x.push(v.xy[0]);
          out.y.push(v.xy[1]);
          out.custom.push([v.ha, lambda]);
        }
      }
      piece = [];
    };
    for (const p of points) {
      const xy = at(p, c);
      const last = piece.at(-1);
      if (last) {
        const dt = p.hourAngleH - last.ha;
        if (!(dt > 0 && dt <= gap) || opts.breakBetween?.(last.xy, xy)) flush();
      }
      piece.push({ xy, ha: p.hourAngleH });
    }
    flush();
  }
  return out;
}

/** The track mirrored through the origin: the Hermitian points (−u, −v) of a uv track. */
export function mirrored(t: Track): Track {
  const neg = (a: (number | null)[]) => a.map((x) => (x === null ? null : -x));
  return {
    x: neg(t.x),
    y: neg(t.y),
    custom: t.custom,
    lone: { x: t.lone.x.map((x) => -x), y: t.lone.y.map((y) => -y), custom: t.lone.custom },
  };
}

/** A uv point of the API: projected baseline in metres at one hour angle. */
export interface UvPoint extends TimedPoint {
  uM: number;
  vM: number;
  vis2: number[];
}

/**
 * The uv track of one baseline: in metres one vertex per sample (the projected baseline does not
 * depend on the wavelength); in Mλ one line per channel, u/λ and v/λ in millions.
 */
export function uvTrack(points: readonly UvPoint[], unit: "m" | "mlambda", wavelengthsM: readonly number[]): Track {
  if (unit === "m") return sampleTracks(points, 1, (p) => [p.uM, p.vM]);
  return sampleTracks(
    points,
    wavelengthsM.length,
    (p, c) => [p.uM / wavelengthsM[c] / 1e6, p.vM / wavelengthsM[c] / 1e6],
    {
      wavelengthsM,
    },
  );
}

/**
 * V² against spatial frequency √(u² + v²)/λ (Mλ) of one baseline: for each sample a short line
 * through its channels (the band spreads one baseline over a range of frequencies, along which V²
 * varies smoothly); a one-channel sample is a lone point.
 */
export function vis2Track(points: readonly UvPoint[], wavelengthsM: readonly number[]): Track {
  const out: Track = { x: [], y: [], custom: [], lone: { x: [], y: [], custom: [] } };
  for (const p of points) {
    const r = Math.hypot(p.uM, p.vM);
    if (wavelengthsM.length === 1) {
      out.lone.x.push(r / wavelengthsM[0] / 1e6);
      out.lone.y.push(p.vis2[0]);
      out.lone.custom.push([p.hourAngleH, wavelengthsM[0] * 1e6]);
      continue;
    }
    if (out.x.length > 0) {
      out.x.push(null);
      out.y.push(null);
      out.custom.push(null);
    }
    wavelengthsM.forEach((w, c) => {
      out.x.push(r / w / 1e6);
      out.y.push(p.vis2[c]);
      out.custom.push([p.hourAngleH, w * 1e6]);
    });
  }
  return out;
}

/**
 * Closure phase (degrees) against hour angle of one triangle at channel `channel`, broken where the
 * phase jumps by more than 150° between samples (a wrap across ±180° or a sign flip of the triple
 * product): a gap instead of a vertical stroke.
 */
export function closureTrack(
  points: readonly (TimedPoint & { closurePhaseDeg: number[] })[],
  channel: number,
  wavelengthM: number,
): Track {
  const t = sampleTracks(points, 1, (p) => [p.hourAngleH, p.closurePhaseDeg[channel]], {
    breakBetween: (a, b) => Math.abs(b[1] - a[1]) > 150,
  });
  const um = wavelengthM * 1e6;
  const withLambda = (c: [number, number] | null): [number, number] | null => (c ? [c[0], um] : null);
  return { ...t, custom: t.custom.map(withLambda), lone: { ...t.lone, custom: t.lone.custom.map((c) => [c[0], um]) } };
}
