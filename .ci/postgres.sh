#!/usr/bin/env bash
# A throw-away PostgreSQL server for the historian tests: its own port, its data folder under target/.
#   .ci/postgres.sh start   initialise (first time) and start; prints the variables the tests read
#   .ci/postgres.sh stop    stop it (the data folder stays until the next clean clone)
# Uses Debian's postgresql package (installed by .ci/run when missing). PostgreSQL refuses to run as root, so the
# server runs as the package's 'postgres' user when we are root.
set -euo pipefail
cd "$(dirname "$0")/.."

PG_BIN=${PG_BIN:-/usr/lib/postgresql/15/bin}
PORT=${TUFA_TEST_PG_PORT:-54329}
ROOT="$PWD/target/postgres"
# As root the server runs as 'postgres', which must be able to reach the folder; a clone under a private home
# (/root is mode 700) is out of its reach, and then the data go to a folder of their own under /tmp instead.
if [ "$(id -u)" = 0 ]; then
  mkdir -p "$ROOT"
  chown postgres "$ROOT"
  if ! runuser -u postgres -- test -w "$ROOT"; then
    ROOT="/tmp/tufa-postgres-$(printf '%s' "$PWD" | md5sum | cut -c1-12)"
    echo "postgres.sh: $PWD/target is out of the postgres user's reach; data in $ROOT" >&2
    mkdir -p "$ROOT"
    chown postgres "$ROOT"
  fi
fi
DATA="$ROOT/data"
LOG="$ROOT/server.log"
USER_NAME=tufa_test
# A password for a server that listens on 127.0.0.1 only and holds nothing but test data.
PASSWORD=tufa-test-only

as_server() {
  if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

case "${1:-}" in
  start)
    mkdir -p "$ROOT"
    if [ ! -f "$DATA/PG_VERSION" ]; then
      pwfile="$ROOT/superuser-password"
      printf '%s\n' "$PASSWORD" >"$pwfile"
      if [ "$(id -u)" = 0 ]; then chown postgres "$pwfile"; fi
      as_server "$PG_BIN/initdb" -D "$DATA" -U postgres --auth=scram-sha-256 --pwfile="$pwfile" -E UTF8 \
        --locale=C.UTF-8 >"$ROOT/initdb.log"
      rm -f "$pwfile"
    fi
    if ! as_server "$PG_BIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; then
      as_server "$PG_BIN/pg_ctl" -D "$DATA" -l "$LOG" -w -t 60 \
        -o "-p $PORT -c listen_addresses=127.0.0.1 -c unix_socket_directories=''" start >/dev/null
    fi
    export PGPASSWORD="$PASSWORD"
    psql="$PG_BIN/psql -h 127.0.0.1 -p $PORT -U postgres -d postgres -v ON_ERROR_STOP=1 -q -t -A"
    if [ -z "$($psql -c "SELECT 1 FROM pg_roles WHERE rolname = '$USER_NAME'")" ]; then
      $psql -c "CREATE ROLE $USER_NAME LOGIN PASSWORD '$PASSWORD'"
      $psql -c "CREATE DATABASE $USER_NAME OWNER $USER_NAME"
    fi
    echo "TUFA_TEST_PG_URL=jdbc:postgresql://127.0.0.1:$PORT/$USER_NAME"
    echo "TUFA_TEST_PG_USER=$USER_NAME"
    echo "TUFA_TEST_PG_PASSWORD=$PASSWORD"
    ;;
  stop)
    if [ -f "$DATA/PG_VERSION" ]; then
      as_server "$PG_BIN/pg_ctl" -D "$DATA" -m fast stop >/dev/null 2>&1 || true
    fi
    ;;
  *)
    echo "usage: $0 start|stop" >&2
    exit 2
    ;;
esac
