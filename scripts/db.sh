#!/usr/bin/env bash
# The project's private MariaDB: its own my.cnf, data directory and port on 127.0.0.1.
# Usage: scripts/db.sh start|stop|status|ensure-installed
# Environment: RW_DB_DIR (default .data/mariadb), RW_DB_PORT (default 33306),
#              RW_DB_NAME / RW_DB_USER / RW_DB_PASSWORD (default rungwise / rungwise / rungwise-dev).
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DIR="${RW_DB_DIR:-$ROOT/.data/mariadb}"
PORT="${RW_DB_PORT:-33306}"
NAME="${RW_DB_NAME:-rungwise}"
USER_NAME="${RW_DB_USER:-rungwise}"
PASSWORD="${RW_DB_PASSWORD:-rungwise-dev}"
CNF="$DIR/my.cnf"
SOCK="$DIR/run/mariadb.sock"

ensure_installed() {
  if command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ]; then return 0; fi
  if [ "$(id -u)" = "0" ]; then
    echo "Installing MariaDB from Debian's packages (mariadb-server, mariadb-client)..."
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq mariadb-server mariadb-client >/dev/null
  else
    echo "MariaDB is not installed. Run: sudo apt-get update && sudo apt-get install -y mariadb-server mariadb-client" >&2
    exit 1
  fi
}

write_cnf() {
  mkdir -p "$DIR/data" "$DIR/run"
  local run_as=""
  [ "$(id -u)" = "0" ] && run_as="user=root"
  cat >"$CNF" <<CNF
[client]
port=$PORT
socket=$SOCK
[mariadbd]
$run_as
port=$PORT
bind-address=127.0.0.1
skip-name-resolve
socket=$SOCK
pid-file=$DIR/run/mariadb.pid
datadir=$DIR/data
tmpdir=$DIR
log-error=$DIR/mariadb.err
character-set-server=utf8mb4
collation-server=utf8mb4_unicode_ci
max_connections=300
max_allowed_packet=256M
CNF
}

ping() { mariadb-admin --defaults-file="$CNF" --protocol=socket -uroot ping >/dev/null 2>&1; }

start() {
  ensure_installed
  export PATH="$PATH:/usr/sbin"
  write_cnf
  if ping; then echo "MariaDB already running on 127.0.0.1:$PORT"; provision; return 0; fi
  if (exec 3<>"/dev/tcp/127.0.0.1/$PORT") 2>/dev/null; then
    echo "Port $PORT is taken by another program; set RW_DB_PORT to a free port." >&2
    exit 1
  fi
  if [ ! -d "$DIR/data/mysql" ]; then
    mariadb-install-db --defaults-file="$CNF" --datadir="$DIR/data" --skip-test-db \
      --auth-root-authentication-method=socket --auth-root-socket-user="$(id -un)" >"$DIR/install.log" 2>&1 \
      || { echo "mariadb-install-db failed; see $DIR/install.log" >&2; exit 1; }
  fi
  setsid nohup mariadbd --defaults-file="$CNF" >>"$DIR/mariadb.out" 2>&1 < /dev/null &
  for _ in $(seq 1 200); do
    if ping; then provision; echo "MariaDB running on 127.0.0.1:$PORT (data in $DIR)"; return 0; fi
    sleep 0.1
  done
  echo "MariaDB did not start within 20 s; last lines of $DIR/mariadb.err:" >&2
  tail -n 15 "$DIR/mariadb.err" >&2 || true
  exit 1
}

provision() {
  mariadb --defaults-file="$CNF" --protocol=socket -uroot <<SQL
CREATE DATABASE IF NOT EXISTS \`$NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$USER_NAME'@'127.0.0.1' IDENTIFIED BY '$PASSWORD';
GRANT ALL PRIVILEGES ON \`$NAME\`.* TO '$USER_NAME'@'127.0.0.1';
FLUSH PRIVILEGES;
SQL
}

stop() {
  export PATH="$PATH:/usr/sbin"
  [ -f "$CNF" ] || { echo "No MariaDB instance in $DIR"; return 0; }
  if ping; then
    mariadb-admin --defaults-file="$CNF" --protocol=socket -uroot shutdown
    echo "MariaDB stopped"
  else
    echo "MariaDB was not running"
  fi
}

status() {
  export PATH="$PATH:/usr/sbin"
  if [ -f "$CNF" ] && ping; then echo "running on 127.0.0.1:$PORT"; else echo "stopped"; exit 3; fi
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) status ;;
  ensure-installed) ensure_installed ;;
  *) echo "usage: scripts/db.sh start|stop|status|ensure-installed" >&2; exit 2 ;;
esac
