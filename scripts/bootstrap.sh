#!/usr/bin/env bash
# Installs what `npm run demo` (bootstrap.sh demo) or `npm test` (bootstrap.sh test) needs on a
# fresh Debian machine: Debian's packages (as root) and the npm packages of package-lock.json.
# Safe to repeat: it installs only what is missing.
set -euo pipefail
cd "$(dirname "$0")/.."
mode="${1:-test}"

bash scripts/check-node.sh

missing=()
compgen -G '/usr/lib/postgresql/*/bin/initdb' >/dev/null || missing+=(postgresql)
if [ "$mode" = test ]; then
  command -v chromium >/dev/null || missing+=(chromium)
  command -v pdftoppm >/dev/null || missing+=(poppler-utils)
fi

if [ "${#missing[@]}" -gt 0 ]; then
  if [ "$(id -u)" -ne 0 ]; then
    echo "bootstrap: please install these Debian packages as root first: ${missing[*]}" >&2
    exit 2
  fi
  echo "bootstrap: installing ${missing[*]} from Debian's packages"
  apt-get update -qq
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
fi

# npm ci when node_modules is missing or older than the lock file.
if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "bootstrap: npm ci"
  npm ci --no-audit --no-fund --loglevel=error
fi
