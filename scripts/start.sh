#!/usr/bin/env bash
# npm start: install what is missing, start PostgreSQL on loopback, migrate, seed the demo, build and serve.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

ensure_node_modules
if [ -z "${DATABASE_URL:-}" ]; then
  DATABASE_URL=$(bash scripts/db.sh start demo)
fi
export DATABASE_URL
migrate_and_seed
build_client_if_changed
say "serving on http://${HOST:-127.0.0.1}:${PORT:-3000} (Ctrl+C to stop; 'npm run db:stop' stops PostgreSQL)"
exec node --import tsx server/index.ts
