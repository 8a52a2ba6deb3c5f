#!/usr/bin/env bash
# Private PostgreSQL cluster on loopback, from Debian's packages.
#   scripts/db.sh start [demo|test]   install PostgreSQL if missing, create the cluster, start it, create the database
#   scripts/db.sh stop  [demo|test]   stop the cluster
#   scripts/db.sh url   [demo|test]   print the DATABASE_URL for it
#   scripts/db.sh status [demo|test]  exit 0 when running
# Idempotent: a second start finds the cluster running. When DATABASE_URL is set, nothing here is needed.
set -euo pipefail

action=${1:-start}
flavour=${2:-demo}
root=$(cd "$(dirname "$0")/.." && pwd)

if [ "$flavour" = test ]; then
  port=${PGPORT_TEST:-54330}
  dbname=mendstep_test
  # Throwaway data: trade durability for speed. Never used for the demo's data.
  fast_opts="-c fsync=off -c full_page_writes=off -c synchronous_commit=off"
else
  port=${PGPORT:-54329}
  dbname=mendstep
  fast_opts=""
fi
url="postgres://postgres@127.0.0.1:${port}/${dbname}"

if [ "$action" = url ]; then echo "$url"; exit 0; fi

log() { echo "[db:$flavour] $*" >&2; }

find_bin() {
  local dir
  dir=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)
  if [ -n "$dir" ] && [ -x "$dir/initdb" ]; then echo "$dir"; fi
}

bin=$(find_bin)
if [ -z "$bin" ]; then
  if [ "$action" = stop ]; then exit 0; fi
  log "PostgreSQL is not installed; installing Debian's postgresql package"
  if [ "$(id -u)" -ne 0 ]; then
    log "installing needs root: run 'sudo apt-get install -y postgresql' once, then try again"; exit 1
  fi
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >/dev/null
  apt-get install -y -qq postgresql >/dev/null
  # Debian's package starts its own cluster on 5432; we do not use it.
  bin=$(find_bin)
fi

# PostgreSQL refuses to run as root: run it as the postgres user then, as yourself otherwise.
if [ "$(id -u)" -eq 0 ]; then
  as_pg() { runuser -u postgres -- "$@"; }
else
  as_pg() { "$@"; }
fi

# The cluster lives under .data/ when the postgres user can reach it; a checkout under a private folder
# (e.g. /root, mode 700) cannot be entered by that user, so then the cluster lives under /var/tmp,
# keyed by the checkout's path.
mkdir -p "$root/.data"
datadir="$root/.data/pg-$flavour"
if [ "$(id -u)" -eq 0 ] && ! runuser -u postgres -- test -x "$root/.data" 2>/dev/null; then
  key=$(echo -n "$root" | sha1sum | cut -c1-12)
  datadir="/var/tmp/mendstep-$key/pg-$flavour"
  mkdir -p "$(dirname "$datadir")"
  chmod 755 "$(dirname "$datadir")"
  ln -sfn "$datadir" "$root/.data/pg-$flavour.link"
fi
logfile="$(dirname "$datadir")/pg-$flavour.log"

is_running() { as_pg "$bin/pg_ctl" -D "$datadir" status >/dev/null 2>&1; }

if [ "$action" = status ]; then
  if [ -d "$datadir" ] && is_running; then echo running; exit 0; else echo stopped; exit 3; fi
fi

if [ "$action" = stop ]; then
  if [ -d "$datadir" ] && is_running; then
    as_pg "$bin/pg_ctl" -D "$datadir" -m fast -w stop >/dev/null
    log "stopped"
  else
    log "not running"
  fi
  exit 0
fi

if [ ! -s "$datadir/PG_VERSION" ]; then
  log "creating a private cluster in $datadir"
  mkdir -p "$datadir"
  if [ "$(id -u)" -eq 0 ]; then chown postgres:postgres "$datadir"; fi
  chmod 700 "$datadir"
  as_pg "$bin/initdb" -D "$datadir" -U postgres -A trust -E UTF8 --locale=C.UTF-8 --no-sync >/dev/null
fi
touch "$logfile"
if [ "$(id -u)" -eq 0 ]; then chown postgres:postgres "$logfile"; fi

if is_running; then
  log "already running on 127.0.0.1:$port"
else
  if (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null; then
    log "port $port is taken by another program; set PGPORT (or PGPORT_TEST) to a free port"; exit 1
  fi
  # Loopback only, TCP only (no Unix socket folder to clash with other clusters).
  as_pg "$bin/pg_ctl" -D "$datadir" -l "$logfile" -w -t 60 \
    -o "-c listen_addresses=127.0.0.1 -p $port -c unix_socket_directories='' $fast_opts" start >/dev/null
  log "started on 127.0.0.1:$port"
fi

exists=$("$bin/psql" -h 127.0.0.1 -p "$port" -U postgres -d postgres -tAc "select 1 from pg_database where datname='$dbname'")
if [ "$exists" != 1 ]; then
  "$bin/createdb" -h 127.0.0.1 -p "$port" -U postgres "$dbname"
  log "created database $dbname"
fi
echo "$url"
