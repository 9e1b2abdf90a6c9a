#!/usr/bin/env bash
# What `npm run cluster` and `npm run drill -- --cluster` need beyond `npm start`'s set-up: HAProxy and rsync
# (Galera's state transfer) and mariadb-backup (backups) from Debian. galera-4 comes with mariadb-server; Sentinel is redis-server --sentinel.
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/../../.."
bash packages/devstack/bin/prepare.sh

packages=()
[ -x /usr/sbin/haproxy ] || command -v haproxy >/dev/null 2>&1 || packages+=(haproxy)
command -v rsync >/dev/null 2>&1 || packages+=(rsync)
[ -e /usr/lib/galera/libgalera_smm.so ] || packages+=(galera-4)
command -v mariadb-backup >/dev/null 2>&1 || packages+=(mariadb-backup)

if [ "${#packages[@]}" -gt 0 ]; then
  if [ "$(id -u)" != 0 ]; then
    echo "The cluster needs these Debian packages, and installing them needs root:" >&2
    echo "  sudo apt-get update && sudo apt-get install -y --no-install-recommends ${packages[*]}" >&2
    exit 1
  fi
  log="$(mktemp -t heatfleet-apt.XXXXXX.log)"
  echo "Installing ${packages[*]} with apt-get (log: $log)…"
  if ! { apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends "${packages[@]}"; } >"$log" 2>&1; then
    tail -n 20 "$log" >&2
    echo "apt-get failed; the whole log is in $log" >&2
    exit 1
  fi
  rm -f "$log"
fi
if ! id mysql >/dev/null 2>&1; then
  echo "The Galera nodes run as the mysql user (Debian's mariadb-server makes it), which is missing." >&2
  exit 1
fi
