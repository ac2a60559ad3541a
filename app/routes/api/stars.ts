// GET /api/stars?q=… — while a star's name is typed: the star it names (if any) and names to offer.
// Answer: docs/api.md (`{query, star, message, suggestions}`).

import { starsLoader } from "~/services/api/catalogue.server";

export const loader = starsLoader;
