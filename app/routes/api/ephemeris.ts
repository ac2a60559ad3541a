// POST /api/ephemeris — a night's Sun events, sidereal time and Moon.
// Request and response: docs/cli.md (same JSON as `npm run -s cli -- ephemeris`).

import { computationAction, computationLoader } from "~/services/api/computation.server";

export const loader = computationLoader;

export const action = computationAction("ephemeris");
