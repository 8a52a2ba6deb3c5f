# Shared by start.sh and test.sh. Sourced, not run.

root=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
cd "$root"

say() { echo "[mendstep] $*" >&2; }

# Installs the npm packages when node_modules is missing or older than the lock file.
ensure_node_modules() {
  if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    say "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

ensure_apt_package() {
  local command_path=$1 package=$2
  if [ ! -x "$command_path" ]; then
    if [ "$(id -u)" -ne 0 ]; then say "$package is missing: install it with 'sudo apt-get install -y $package'"; exit 1; fi
    say "installing Debian's $package package"
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq >/dev/null
    apt-get install -y -qq "$package" >/dev/null
  fi
}

migrate_and_seed() {
  say "migrating the database"
  npx sequelize-cli db:migrate >/dev/null
  if [ "${NODE_ENV:-development}" != production ]; then
    say "seeding the demo (only what is missing)"
    npx sequelize-cli db:seed:all >/dev/null
  fi
}

# Builds the client unless dist/ is newer than every source it is built from (a second start skips it).
build_client_if_changed() {
  if [ -f dist/index.html ] && [ -z "$(find src shared machines public index.html vite.config.ts tailwind.config.ts package-lock.json -newer dist/index.html -print -quit 2>/dev/null)" ]; then
    say "client is up to date"
    return
  fi
  say "building the client"
  npx vite build --logLevel error
}
