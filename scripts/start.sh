#!/usr/bin/env bash
# npm start: install what is missing, start PostgreSQL on loopback, migrate, seed the demo, build and serve.
# With NODE_ENV=production: SESSION_SECRET and DATABASE_URL are required (the local cluster only with
# ALLOW_LOCAL_DATABASE=1), and nothing is seeded.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

if [ "${NODE_ENV:-development}" = production ]; then
  missing=()
  if [ -z "${SESSION_SECRET:-}" ]; then missing+=("SESSION_SECRET"); fi
  if [ -z "${DATABASE_URL:-}" ] && [ "${ALLOW_LOCAL_DATABASE:-0}" != 1 ]; then missing+=("DATABASE_URL"); fi
  if [ ${#missing[@]} -gt 0 ]; then
    say "refusing to start in production without ${missing[*]}"
    say "set DATABASE_URL to your managed PostgreSQL (or ALLOW_LOCAL_DATABASE=1 to run the local cluster on this machine)"
    say "and SESSION_SECRET to a long random value; see 'Deployment' in README.md"
    exit 1
  fi
fi

ensure_node_modules
if [ -z "${DATABASE_URL:-}" ]; then
  if [ "${NODE_ENV:-development}" = production ]; then say "ALLOW_LOCAL_DATABASE=1: using the local PostgreSQL cluster"; fi
  DATABASE_URL=$(bash scripts/db.sh start demo)
fi
export DATABASE_URL
migrate_and_seed
build_client_if_changed
say "serving on http://${HOST:-127.0.0.1}:${PORT:-3000} (Ctrl+C to stop; 'npm run db:stop' stops PostgreSQL)"
exec node --import tsx server/index.ts
