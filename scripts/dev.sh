#!/usr/bin/env bash
# npm run dev: PostgreSQL up, migrations, demo data when empty, then the Vite dev server with HMR.
set -euo pipefail
cd "$(dirname "$0")/.."

./docker-less-pg.sh start
export DATABASE_URL="${DATABASE_URL:-$(./docker-less-pg.sh url)}"
export NODE_ENV=development

npx tsx scripts/migrate.ts
npx tsx scripts/seed.ts --if-empty
exec node --import tsx scripts/serve.ts --dev
