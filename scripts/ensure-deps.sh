#!/usr/bin/env bash
# Installs what is missing: npm packages from the lock, and Debian packages the app or tests need.
# Usage: scripts/ensure-deps.sh [debian-package ...]
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"

node_major="$(node -p 'process.versions.node.split(".")[0]')"
if [ "$node_major" -lt 20 ]; then echo "Node.js 20 or newer is needed (found $(node -v))" >&2; exit 1; fi

if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "Installing npm packages from package-lock.json..."
  npm ci --no-audit --no-fund
fi

missing=()
for pkg in "$@"; do
  case "$pkg" in
    mariadb-server) command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ] || missing+=(mariadb-server mariadb-client) ;;
    ngspice) command -v ngspice >/dev/null 2>&1 || missing+=(ngspice) ;;
    chromium) [ -x /usr/bin/chromium ] || missing+=(chromium) ;;
    *) dpkg -s "$pkg" >/dev/null 2>&1 || missing+=("$pkg") ;;
  esac
done
if [ "${#missing[@]}" -gt 0 ]; then
  if [ "$(id -u)" = "0" ]; then
    echo "Installing Debian packages: ${missing[*]}"
    apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${missing[@]}" >/dev/null
  else
    echo "Missing Debian packages. Run: sudo apt-get update && sudo apt-get install -y ${missing[*]}" >&2
    exit 1
  fi
fi
