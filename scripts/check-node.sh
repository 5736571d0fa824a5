#!/usr/bin/env bash
# Refuses a Node.js that package.json's "engines" does not allow (>=20.19 <21 || >=22), with one
# line on stderr and exit code 2, before npm or the scripts fail in less clear ways. Run by
# bootstrap.sh; keep the test below in step with "engines".
set -euo pipefail
cd "$(dirname "$0")/.."

if ! version="$(node -p 'process.versions.node' 2>/dev/null)"; then
  echo "bootstrap: Node.js is not installed; Wreathwright needs Node.js 20.19 or a later 20.x, or 22 or later" >&2
  exit 2
fi
IFS=. read -r major minor _ <<<"$version"
if ! { { [ "$major" -eq 20 ] && [ "$minor" -ge 19 ]; } || [ "$major" -ge 22 ]; }; then
  echo "bootstrap: Node.js $version is not supported; Wreathwright needs Node.js 20.19 or a later 20.x, or 22 or later (package.json engines)" >&2
  exit 2
fi
