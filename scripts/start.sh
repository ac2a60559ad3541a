#!/usr/bin/env bash
# npm start: PostgreSQL up, migrations, demo data when the database is empty, production build when
# the sources changed, then the server (and the local fakes) on http://localhost:${PORT:-3000}.
set -euo pipefail
cd "$(dirname "$0")/.."

./docker-less-pg.sh start
mkdir -p .data
export DATABASE_URL="${DATABASE_URL:-$(./docker-less-pg.sh url)}"
export NODE_ENV=production

npx tsx scripts/migrate.ts
npx tsx scripts/seed.ts --if-empty

# Build when there is no build yet or any source is newer than it.
stamp="${BUILD_DIR:-build}/server/index.js"
if [ ! -f "$stamp" ] || [ -n "$(find app public react-router.config.ts vite.config.ts package-lock.json -newer "$stamp" -print -quit 2>/dev/null)" ]; then
  echo "[build] building the production bundle"
  if ! npx react-router build >.data/build.log 2>&1; then
    cat .data/build.log
    exit 1
  fi
fi

exec node --import tsx scripts/serve.ts
