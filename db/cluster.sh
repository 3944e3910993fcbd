#!/bin/sh
# Sward's own PostgreSQL server on loopback: start | stop | status | url [db]
#   Data folder: $SWARD_PG_DATA when set (a second, separate cluster, e.g. the crash suite's);
#   otherwise .data/pg inside the project (git-ignored), or /tmp/sward-pg-<hash> when the
#   server user cannot reach the project folder. Port: $SWARD_PG_PORT (default 54329).
#   As root, the server runs as the "postgres" user; otherwise as the calling user.
set -eu

ROOT=$(cd "$(dirname "$0")/.." && pwd)
PORT=${SWARD_PG_PORT:-54329}
HOST=127.0.0.1
CMD=${1:-status}

say() { printf 'db: %s\n' "$*" >&2; }

find_bin() {
  ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1
}

PGBIN=$(find_bin || true)
if [ -z "$PGBIN" ] || [ ! -x "$PGBIN/initdb" ]; then
  if [ "$CMD" = "stop" ] || [ "$CMD" = "status" ]; then say "no PostgreSQL server installed"; exit 0; fi
  if [ "$(id -u)" = "0" ] && command -v apt-get >/dev/null 2>&1; then
    say "PostgreSQL server not found; installing Debian's postgresql package (apt-get)…"
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null
    PGBIN=$(find_bin || true)
  fi
  if [ -z "$PGBIN" ] || [ ! -x "$PGBIN/initdb" ]; then
    say "PostgreSQL server binaries not found and could not be installed."
    say "Install them as an administrator:  sudo apt-get install postgresql"
    say "or point DATABASE_URL at a PostgreSQL 15+ server you run yourself."
    exit 1
  fi
fi

if [ "$(id -u)" = "0" ]; then
  RUN_AS=postgres
  as_server() { runuser -u postgres -- "$@"; }
else
  RUN_AS=$(id -un)
  as_server() { "$@"; }
fi

# Choose the data folder: the one named by SWARD_PG_DATA, else inside the project when the server
# user can reach it.
DATA=${SWARD_PG_DATA:-"$ROOT/.data/pg"}
if [ -z "${SWARD_PG_DATA:-}" ] && [ "$RUN_AS" = "postgres" ]; then
  mkdir -p "$ROOT/.data"
  if ! runuser -u postgres -- test -x "$ROOT/.data"; then
    HASH=$(printf '%s' "$ROOT" | cksum | cut -d' ' -f1)
    DATA="/tmp/sward-pg-$HASH"
  fi
fi

is_ready() { "$PGBIN/pg_isready" -q -h "$HOST" -p "$PORT" >/dev/null 2>&1; }

case "$CMD" in
  start)
    if is_ready; then say "reusing the server already running on $HOST:$PORT"; exit 0; fi
    if [ ! -f "$DATA/PG_VERSION" ]; then
      say "creating a new cluster in $DATA"
      mkdir -p "$DATA"
      [ "$RUN_AS" = "postgres" ] && chown postgres: "$DATA"
      chmod 700 "$DATA"
      as_server "$PGBIN/initdb" -D "$DATA" -U postgres -A trust -E UTF8 --locale=C.UTF-8 >/dev/null
    fi
    # A stale pid file from a killed server blocks the start; pg_ctl status tells.
    if [ -f "$DATA/postmaster.pid" ] && ! as_server "$PGBIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; then
      rm -f "$DATA/postmaster.pid"
    fi
    as_server "$PGBIN/pg_ctl" -D "$DATA" -l "$DATA/server.log" -w -t 30 \
      -o "-c listen_addresses=$HOST -p $PORT -k $DATA -c max_connections=200" start >/dev/null \
      || { say "the server did not start; its log follows"; tail -n 20 "$DATA/server.log" >&2; exit 1; }
    say "PostgreSQL listening on $HOST:$PORT (data: $DATA)"
    ;;
  stop)
    if [ -f "$DATA/postmaster.pid" ]; then
      as_server "$PGBIN/pg_ctl" -D "$DATA" -m fast -w stop >/dev/null && say "stopped"
    else
      say "no server of this project is running"
    fi
    ;;
  status)
    if is_ready; then say "running on $HOST:$PORT (data: $DATA)"; else say "not running"; exit 3; fi
    ;;
  url)
    printf 'postgres://postgres@%s:%s/%s\n' "$HOST" "$PORT" "${2:-sward}"
    ;;
  *)
    say "usage: db/cluster.sh start|stop|status|url [database]"; exit 2
    ;;
esac
