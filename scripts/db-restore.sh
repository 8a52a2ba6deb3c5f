#!/usr/bin/env bash
# npm run db:restore FILE — restores a db:backup file into an EMPTY database: DATABASE_URL when set, otherwise
# the local cluster's. A database that already holds tables is refused, so a restore never mixes two
# databases' rows or overwrites live data: create a new database (or drop and recreate this one) first.
set -euo pipefail
root=$(cd "$(dirname "$0")/.." && pwd)
source "$root/scripts/pg-tools.sh"

file=${1:-}
if [ -z "$file" ]; then echo "usage: npm run db:restore FILE   (a file written by npm run db:backup)" >&2; exit 2; fi
if [ ! -r "$file" ]; then echo "[mendstep] cannot read $file" >&2; exit 2; fi

url=${DATABASE_URL:-$(bash "$root/scripts/db.sh" url demo)}
# Any table outside PostgreSQL's own schemas means the database is in use.
tables=$("$(pg_tool psql)" "$url" -XtAq -v ON_ERROR_STOP=1 -c \
  "SELECT count(*) FROM pg_catalog.pg_tables WHERE schemaname NOT IN ('pg_catalog', 'information_schema')")
if [ "$tables" != 0 ]; then
  echo "[mendstep] refusing to restore: the target database is not empty ($tables tables)." >&2
  echo "[mendstep] restore into a new, empty database (createdb, then point DATABASE_URL at it)." >&2
  exit 1
fi

# One transaction: a restore that fails half-way leaves the database empty, not half-filled.
"$(pg_tool pg_restore)" --no-owner --no-privileges --exit-on-error --single-transaction --dbname="$url" "$file"
echo "[mendstep] restored $file" >&2
