#!/usr/bin/env bash
# `npm start`: install what is missing, start the private MariaDB, migrate, seed the demo, build, serve.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
HOST="${HOST:-127.0.0.1}"
PORT="${PORT:-3000}"

if (exec 3<>"/dev/tcp/127.0.0.1/$PORT") 2>/dev/null; then
  echo "Port $PORT is already in use. Stop the program using it, or run: PORT=3001 npm start" >&2
  exit 1
fi

bash scripts/ensure-deps.sh mariadb-server
bash scripts/db.sh start
npx tsx scripts/migrate.ts latest
npx tsx scripts/migrate.ts seed
# The demo studies' first inputs, evaluated by the engine (once; idempotent).
npx tsx scripts/demo-results.ts

# A per-install signing secret, unless the deployment provides one.
if [ -z "${NUXT_AUTH_SECRET:-}" ]; then
  mkdir -p .data
  [ -s .data/auth-secret ] || node -e "process.stdout.write(require('node:crypto').randomBytes(32).toString('hex'))" > .data/auth-secret
  NUXT_AUTH_SECRET="$(cat .data/auth-secret)"
  export NUXT_AUTH_SECRET
fi

# The local SMTP catcher stands in for a mail service (development only).
MAIL_PORT="${RW_MAIL_PORT:-2525}"
MAIL_DIR="$ROOT/.data/mail-catcher"
if [ -z "${NUXT_SMTP_URL:-}" ]; then
  if ! (exec 3<>"/dev/tcp/127.0.0.1/$MAIL_PORT") 2>/dev/null; then
    mkdir -p "$MAIL_DIR"
    setsid nohup node --import tsx scripts/mail-catcher.ts --port "$MAIL_PORT" --dir "$MAIL_DIR" >"$ROOT/.data/mail-catcher.log" 2>&1 < /dev/null &
    for _ in $(seq 1 100); do (exec 3<>"/dev/tcp/127.0.0.1/$MAIL_PORT") 2>/dev/null && break; sleep 0.1; done
  fi
  export NUXT_SMTP_URL="smtp://127.0.0.1:$MAIL_PORT" NUXT_MAIL_CATCHER_DIR="$MAIL_DIR" NUXT_PUBLIC_MAIL_CATCHER=true
fi
export NUXT_APP_URL="${NUXT_APP_URL:-http://$HOST:$PORT}"

stale=1
if [ -f .output/nitro.json ]; then
  stale="$(find app.vue error.vue nuxt.config.ts tailwind.config.ts package-lock.json pages components layouts middleware composables stores server shared assets public rules -newer .output/nitro.json -type f 2>/dev/null | head -n 1 | wc -l)"
fi
if [ "$stale" != "0" ]; then
  echo "Building the app..."
  npx nuxi build >/tmp/rungwise-build.log 2>&1 || { tail -n 40 /tmp/rungwise-build.log >&2; echo "Build failed (full log: /tmp/rungwise-build.log)" >&2; exit 1; }
fi

cat <<INFO

Rungwise is starting on http://$HOST:$PORT
Demo sign-ins (invented accounts of the fictional Harrow Lake Instruments), password: harrow-lake-demo
  admin@harrowlake.example       admin
  architect@harrowlake.example   architect
  engineer@harrowlake.example    engineer
  manager@harrowlake.example     manager (program manager: reads and comments)
Mail goes to the local catcher on port $MAIL_PORT; admins read it under "Caught mail".
Stop with Ctrl+C; the database keeps running until: npm run db:stop

INFO
export HOST PORT
exec node .output/server/index.mjs
