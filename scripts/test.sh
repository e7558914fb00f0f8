#!/usr/bin/env bash
# `npm test`: everything. Installs what is missing, lints, typechecks, builds, then runs every Vitest
# project (unit, api against a throwaway MariaDB, e2e in Debian's Chromium).
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"

bash scripts/ensure-deps.sh mariadb-server ngspice chromium
npx nuxt prepare >/dev/null
echo "== lint"; npx eslint . --max-warnings=0
echo "== typecheck"; npx vue-tsc -b --noEmit
echo "== build"; npx nuxi build >tests/.build.log 2>&1 || { tail -n 60 tests/.build.log; exit 1; }
echo "== tests"
mkdir -p tests/.artifacts
set +e
npx vitest run --reporter=default --reporter=json --outputFile.json=tests/.artifacts/vitest.json "$@"
code=$?
set -e
node -e "
const r = JSON.parse(require('node:fs').readFileSync('tests/.artifacts/vitest.json', 'utf8'))
console.log('vitest: ' + r.numPassedTests + ' passed, ' + r.numFailedTests + ' failed' + (r.numPendingTests ? ', ' + r.numPendingTests + ' skipped' : ''))
" || true
exit $code
