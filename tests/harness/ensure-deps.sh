#!/bin/sh
# Installs the project's npm dependencies when they are missing or older than package-lock.json.
set -eu
cd "$(dirname "$0")/../.."
if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "setup: installing npm dependencies (npm ci)…"
  npm ci --no-audit --no-fund
fi
