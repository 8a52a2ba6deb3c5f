#!/usr/bin/env bash
# npm test: the whole suite on a fresh machine. Starts its own PostgreSQL cluster (separate from the demo's),
# recreates and migrates the test database, seeds the demo data for end-to-end tests, builds the client and
# runs every vitest project (unit, component, api, e2e). Ends with one line: "N passed, N failed".
set -euo pipefail
source "$(dirname "$0")/lib.sh"

ensure_node_modules
ensure_apt_package /usr/bin/chromium chromium

export NODE_ENV=test
if [ -z "${DATABASE_URL:-}" ]; then
  # A cluster this run started is stopped at the end, so its port is free for the next checkout's run.
  if ! bash scripts/db.sh status test >/dev/null 2>&1; then trap 'bash scripts/db.sh stop test >/dev/null 2>&1 || true' EXIT; fi
  DATABASE_URL=$(bash scripts/db.sh start test)
  # A clean database every run, so no test depends on what an earlier run left behind.
  psql "$DATABASE_URL" -q -c 'DROP SCHEMA public CASCADE; CREATE SCHEMA public;' >/dev/null 2>&1 \
    || node -e "const {Client}=require('pg');const c=new Client(process.env.DATABASE_URL);c.connect().then(()=>c.query('DROP SCHEMA public CASCADE; CREATE SCHEMA public')).then(()=>c.end())"
fi
export DATABASE_URL
migrate_and_seed
say "building the client for the end-to-end tests"
npx vite build --logLevel error

mkdir -p .data
results=.data/test-results.json
rm -f "$results"
status=0
npx vitest run --reporter=default --reporter=json --outputFile.json="$results" "$@" || status=$?

node scripts/summarise-tests.mjs "$results" || status=1
exit $status
