#!/usr/bin/env bash
# npm run db:backup — a pg_dump of the database in PostgreSQL's custom format (-Fc: compressed, restorable
# table by table with pg_restore), named with the time it was taken:
#   <BACKUP_DIR or .data/backups>/mendstep-YYYYMMDDTHHMMSSZ.dump
# The database is DATABASE_URL when set, otherwise the local cluster's. Prints the file's path.
set -euo pipefail
root=$(cd "$(dirname "$0")/.." && pwd)
source "$root/scripts/pg-tools.sh"

url=${DATABASE_URL:-$(bash "$root/scripts/db.sh" url demo)}
dir=${BACKUP_DIR:-$root/.data/backups}
mkdir -p "$dir"
# UTC with seconds, so two backups a minute apart never share a name and names sort by time.
file="$dir/mendstep-$(date -u +%Y%m%dT%H%M%SZ).dump"
if [ -e "$file" ]; then file="${file%.dump}-$$.dump"; fi

# Written under a temporary name first: a failed dump never leaves a file that looks like a backup.
"$(pg_tool pg_dump)" --format=custom --no-owner --no-privileges --dbname="$url" --file="$file.partial"
mv "$file.partial" "$file"
echo "[mendstep] backup written: $file ($(du -h "$file" | cut -f1))" >&2
echo "$file"
