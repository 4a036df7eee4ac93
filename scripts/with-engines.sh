#!/usr/bin/env bash
# Runs a command with a throw-away PostgreSQL cluster and Redis: starts both on free ports in a temporary
# folder, exports ISOCHRON_TEST_POSTGRES_URL and ISOCHRON_TEST_REDIS_URL for the command, and removes
# everything when it ends. Uses the variables as they are when already set (engines of your own).
#
#   scripts/with-engines.sh npx jest       # what `npm run test:scaled` does, and then tests/scaled/
#   scripts/with-engines.sh tsx bench/scaled.ts
#
# Needs PostgreSQL and Redis from Debian: apt-get install -y postgresql redis-server (.ci/run installs
# them, and HAProxy for tests/scaled/).
set -euo pipefail
cd "$(dirname "$0")/.."

PG_BIN=${PG_BIN:-$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1)}
WORK=$(mktemp -d /tmp/isochron-engines.XXXXXX)
STARTED_PG=
STARTED_REDIS=

as_pg() {
  if [ "$(id -u)" = 0 ]; then su postgres -s /bin/sh -c "$*"; else sh -c "$*"; fi
}

free_port() {
  node -e "const s=require('net').createServer();s.listen(0,'127.0.0.1',()=>{console.log(s.address().port);s.close()})"
}

cleanup() {
  if [ -n "$STARTED_PG" ]; then as_pg "'$PG_BIN/pg_ctl' -D '$WORK/pg' -m immediate stop" >/dev/null 2>&1 || true; fi
  if [ -n "$STARTED_REDIS" ]; then redis-cli -p "$STARTED_REDIS" shutdown nosave >/dev/null 2>&1 || true; fi
  rm -rf "$WORK"
}
trap cleanup EXIT

if [ -z "${ISOCHRON_TEST_POSTGRES_URL:-}" ]; then
  [ -x "$PG_BIN/pg_ctl" ] || { echo "PostgreSQL is missing: apt-get install -y postgresql" >&2; exit 1; }
  port=$(free_port)
  [ "$(id -u)" = 0 ] && chown postgres "$WORK"
  as_pg "'$PG_BIN/initdb' -D '$WORK/pg' -U isochron --auth=trust --encoding=UTF8 >'$WORK/initdb.log'"
  # fsync off: a throw-away test cluster, never for data anyone keeps.
  if ! as_pg "'$PG_BIN/pg_ctl' -D '$WORK/pg' -l '$WORK/postgres.log' -w -o \"-p $port -k '$WORK' -c listen_addresses=127.0.0.1 -c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=300\" start" >/dev/null; then
    cat "$WORK/postgres.log" >&2
    exit 1
  fi
  STARTED_PG=1
  export ISOCHRON_TEST_POSTGRES_URL="postgres://isochron@127.0.0.1:$port/postgres"
fi
if [ -z "${ISOCHRON_TEST_REDIS_URL:-}" ]; then
  command -v redis-server >/dev/null || { echo "Redis is missing: apt-get install -y redis-server" >&2; exit 1; }
  port=$(free_port)
  redis-server --port "$port" --bind 127.0.0.1 --save '' --appendonly no --daemonize yes \
    --pidfile "$WORK/redis.pid" --logfile "$WORK/redis.log" --dir "$WORK"
  for _ in $(seq 50); do redis-cli -p "$port" ping >/dev/null 2>&1 && break; sleep 0.1; done
  STARTED_REDIS=$port
  export ISOCHRON_TEST_REDIS_URL="redis://127.0.0.1:$port"
fi
# Where the engines' pid files are (bench/scaled.ts reads their CPU time).
export ISOCHRON_ENGINES_DIR=$WORK
echo "test engines: $ISOCHRON_TEST_POSTGRES_URL and $ISOCHRON_TEST_REDIS_URL" >&2

"$@"
