# Sourced by db-backup.sh and db-restore.sh: the newest PostgreSQL client tools on this machine, so pg_dump is
# never older than the server it reads (Debian keeps each version's tools in /usr/lib/postgresql/N/bin).
pg_tool() {
  local name=$1 dir
  dir=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)
  if [ -n "$dir" ] && [ -x "$dir/$name" ]; then echo "$dir/$name"; return; fi
  if command -v "$name" >/dev/null 2>&1; then command -v "$name"; return; fi
  echo "[mendstep] $name is missing: install Debian's postgresql-client package" >&2
  exit 1
}
