#!/usr/bin/env bash
# npm run dev: the API on PORT (3000) and Vite with hot reload on 5173, forwarding /api to it.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
ensure_node_modules
if [ -z "${DATABASE_URL:-}" ]; then DATABASE_URL=$(bash scripts/db.sh start demo); fi
export DATABASE_URL
migrate_and_seed
node --import tsx --watch server/index.ts &
api=$!
trap 'kill $api 2>/dev/null' EXIT
npx vite
