#!/usr/bin/env bash
# Makes a fresh Debian 12 machine able to run the stack: system packages, then node_modules.
# Runs before node_modules exists, so plain bash only. Silent when there is nothing to do.
set -euo pipefail

cd "$(dirname "${BASH_SOURCE[0]}")/../../.."

with_browser=0
for arg in "$@"; do
  case "$arg" in
    # The browser tests and the bench's Lighthouse step drive Debian's Chromium.
    --test | --browser) with_browser=1 ;;
    *) echo "prepare.sh: unknown option $arg (only --test or --browser)" >&2; exit 2 ;;
  esac
done

have() {
  command -v "$1" >/dev/null 2>&1 || [ -x "/usr/sbin/$1" ] || [ -x "/usr/bin/$1" ]
}

packages=()
if ! have mariadbd || ! have mariadb-install-db || ! have mariadb-admin || ! have mariadb; then
  packages+=(mariadb-server)
fi
if ! have redis-server || ! have redis-cli; then
  packages+=(redis-server)
fi
if [ "$with_browser" = 1 ] && [ ! -x /usr/bin/chromium ]; then
  packages+=(chromium)
fi

if [ "${#packages[@]}" -gt 0 ]; then
  if [ "$(id -u)" != 0 ]; then
    echo "Heatfleet needs these Debian packages, and installing them needs root:" >&2
    echo "  sudo apt-get update && sudo apt-get install -y --no-install-recommends ${packages[*]}" >&2
    echo "Run that (or this script as root), then try again." >&2
    exit 1
  fi
  log="$(mktemp -t heatfleet-apt.XXXXXX.log)"
  echo "Installing ${packages[*]} with apt-get (log: $log)…"
  started=$SECONDS
  if ! { apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends "${packages[@]}"; } >"$log" 2>&1; then
    tail -n 20 "$log" >&2
    echo "apt-get failed; the whole log is in $log" >&2
    exit 1
  fi
  rm -f "$log"
  echo "Installed in $((SECONDS - started)) s."
fi

# npm writes node_modules/.package-lock.json on every install and package-lock.json a moment after it,
# so a lock is stale only when it is clearly newer than both that file and our own stamp (a pull, a merge).
stamp=node_modules/.heatfleet-installed
needs_install=0
if [ ! -d node_modules ]; then
  needs_install=1
else
  newest=0
  for ref in "$stamp" node_modules/.package-lock.json; do
    if [ -e "$ref" ]; then
      t=$(stat -c %Y "$ref")
      [ "$t" -gt "$newest" ] && newest=$t
    fi
  done
  lock=$(stat -c %Y package-lock.json 2>/dev/null || echo 0)
  if [ "$lock" -gt $((newest + 5)) ]; then
    needs_install=1
  fi
fi

if [ "$needs_install" = 1 ]; then
  echo "Installing node packages (npm ci)…"
  started=$SECONDS
  npm ci --no-audit --no-fund
  touch "$stamp"
  echo "node_modules ready in $((SECONDS - started)) s."
fi
