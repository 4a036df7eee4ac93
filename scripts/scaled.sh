#!/usr/bin/env bash
# Starts or stops the scaled set-up on one machine, from Debian packages: PostgreSQL, Redis, HAProxy in
# front of two or more Isochron instances. Everything lives in data/scaled/ (database cluster, logs, pid
# files, generated secrets), so `stop` and a fresh `start` never touch the embedded default.
#
#   scripts/scaled.sh start [INSTANCES]   # default 2; builds the server first if needed
#   scripts/scaled.sh stop
#   scripts/scaled.sh status
#
# Ports (override in the environment): PROXY_PORT 8080 (what clients use), INSTANCE_BASE_PORT 8091
# (instances on 8091, 8092, ...), PG_PORT 55433, REDIS_PORT 56380.
# Needs: apt-get install -y postgresql redis-server haproxy
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT=$(pwd)
DIR=${SCALED_DIR:-$ROOT/data/scaled}
PROXY_PORT=${PROXY_PORT:-8080}
INSTANCE_BASE_PORT=${INSTANCE_BASE_PORT:-8091}
PG_PORT=${PG_PORT:-55433}
REDIS_PORT=${REDIS_PORT:-56380}
PG_BIN=${PG_BIN:-$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1)}
DATABASE_URL="postgres://isochron@127.0.0.1:$PG_PORT/isochron"
REDIS_URL="redis://127.0.0.1:$REDIS_PORT"

say() { printf '%s\n' "$*" >&2; }
need() { command -v "$1" >/dev/null 2>&1 || { say "missing $1: apt-get install -y $2"; exit 1; }; }

# PostgreSQL refuses to run as root: the cluster then belongs to the `postgres` user Debian creates.
as_pg() {
  if [ "$(id -u)" = 0 ]; then su postgres -s /bin/sh -c "$*"; else sh -c "$*"; fi
}

start_postgres() {
  [ -x "$PG_BIN/pg_ctl" ] || { say "missing PostgreSQL: apt-get install -y postgresql"; exit 1; }
  mkdir -p "$DIR"
  if [ ! -f "$DIR/pg/PG_VERSION" ]; then
    mkdir -p "$DIR/pg"
    [ "$(id -u)" = 0 ] && chown postgres "$DIR" "$DIR/pg"
    # Local trust authentication on the loopback interface only: a development set-up, not production.
    as_pg "'$PG_BIN/initdb' -D '$DIR/pg' -U isochron --auth=trust --encoding=UTF8 >'$DIR/initdb.log'"
  fi
  [ "$(id -u)" = 0 ] && chown postgres "$DIR"
  if ! as_pg "'$PG_BIN/pg_ctl' -D '$DIR/pg' status" >/dev/null 2>&1; then
    as_pg "'$PG_BIN/pg_ctl' -D '$DIR/pg' -l '$DIR/postgres.log' -w -o \"-p $PG_PORT -k '$DIR' -c listen_addresses=127.0.0.1 -c max_connections=200\" start" >/dev/null
  fi
  "$PG_BIN/psql" -h 127.0.0.1 -p "$PG_PORT" -U isochron -d postgres -tAc "SELECT 1 FROM pg_database WHERE datname='isochron'" |
    grep -q 1 || "$PG_BIN/createdb" -h 127.0.0.1 -p "$PG_PORT" -U isochron isochron
  say "PostgreSQL on 127.0.0.1:$PG_PORT (database isochron)"
}

start_redis() {
  need redis-server redis-server
  if ! redis-cli -p "$REDIS_PORT" ping >/dev/null 2>&1; then
    redis-server --port "$REDIS_PORT" --bind 127.0.0.1 --save '' --appendonly no --daemonize yes \
      --pidfile "$DIR/redis.pid" --logfile "$DIR/redis.log"
    for _ in $(seq 50); do redis-cli -p "$REDIS_PORT" ping >/dev/null 2>&1 && break; sleep 0.1; done
  fi
  say "Redis on 127.0.0.1:$REDIS_PORT"
}

secrets() {
  # One pair of secrets for every instance: keys and session cookies must be valid on all of them.
  if [ ! -f "$DIR/secrets.env" ]; then
    umask 077
    {
      echo "ISOCHRON_KEY_HASH_SECRET=$(openssl rand -base64 48 | tr -d '\n')"
      echo "ISOCHRON_SESSION_SECRET=$(openssl rand -base64 48 | tr -d '\n')"
    } >"$DIR/secrets.env"
  fi
}

start_instances() {
  local count=$1
  # As `npm start`: the console and the server are built first (the server again when its sources changed).
  if [ ! -f dist/console/browser/index.html ]; then
    npm run build >&2
  elif [ ! -f dist/server/api/main.js ] || [ -n "$(find api shared seeds openapi -newer dist/server/api/main.js -type f | head -1)" ]; then
    npm run build:server >&2
  fi
  secrets
  for i in $(seq 1 "$count"); do
    local port=$((INSTANCE_BASE_PORT + i - 1))
    if [ -f "$DIR/instance-$i.pid" ] && kill -0 "$(cat "$DIR/instance-$i.pid")" 2>/dev/null; then continue; fi
    (
      set -a
      . "$DIR/secrets.env"
      set +a
      PORT=$port DATABASE_URL=$DATABASE_URL REDIS_URL=$REDIS_URL TRUST_PROXY_HOPS=1 \
        PUBLIC_URL=${PUBLIC_URL:-http://localhost:$PROXY_PORT} NODE_ENV=${NODE_ENV:-development} \
        exec node dist/server/api/main.js >>"$DIR/instance-$i.log" 2>&1
    ) &
    echo $! >"$DIR/instance-$i.pid"
  done
  for i in $(seq 1 "$count"); do
    local port=$((INSTANCE_BASE_PORT + i - 1))
    for _ in $(seq 300); do
      curl -fsS "http://127.0.0.1:$port/readyz" >/dev/null 2>&1 && break
      kill -0 "$(cat "$DIR/instance-$i.pid")" 2>/dev/null || { say "instance $i exited; see $DIR/instance-$i.log"; exit 1; }
      sleep 0.2
    done
    say "instance $i on 127.0.0.1:$port"
  done
  echo "$count" >"$DIR/instances"
}

start_proxy() {
  need haproxy haproxy
  local count=$1
  {
    cat <<EOF
global
  maxconn 4096
defaults
  mode http
  timeout connect 5s
  timeout client 60s
  timeout server 60s
  option http-keep-alive
frontend isochron
  bind 127.0.0.1:$PROXY_PORT
  default_backend instances
backend instances
  balance roundrobin
  option httpchk GET /readyz
  http-check expect status 200
  # Readiness writes a row: under a burst of writes it may take a moment, which is not being down.
  timeout check 5s
  retries 3
  option redispatch
  # The instances see the client's address in X-Forwarded-For (TRUST_PROXY_HOPS=1).
  option forwardfor
EOF
    for i in $(seq 1 "$count"); do
      echo "  server instance$i 127.0.0.1:$((INSTANCE_BASE_PORT + i - 1)) check inter 2s fall 3 rise 1"
    done
  } >"$DIR/haproxy.cfg"
  if [ -f "$DIR/haproxy.pid" ] && kill -0 "$(cat "$DIR/haproxy.pid")" 2>/dev/null; then
    # Reload with the new instance list, handing over the listening socket.
    haproxy -f "$DIR/haproxy.cfg" -D -p "$DIR/haproxy.pid" -sf "$(cat "$DIR/haproxy.pid")"
  else
    haproxy -f "$DIR/haproxy.cfg" -D -p "$DIR/haproxy.pid"
  fi
  say "HAProxy on http://127.0.0.1:$PROXY_PORT -> $count instances"
}

stop_pidfile() {
  local file=$1
  [ -f "$file" ] || return 0
  local pid
  pid=$(cat "$file")
  if kill -0 "$pid" 2>/dev/null; then
    kill -TERM "$pid"
    for _ in $(seq 150); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
  fi
  rm -f "$file"
}

case "${1:-}" in
  start)
    count=${2:-2}
    mkdir -p "$DIR"
    start_postgres
    start_redis
    start_instances "$count"
    start_proxy "$count"
    echo "Isochron (scaled): http://127.0.0.1:$PROXY_PORT  DATABASE_URL=$DATABASE_URL REDIS_URL=$REDIS_URL"
    ;;
  stop)
    stop_pidfile "$DIR/haproxy.pid"
    # SIGTERM: each instance finishes its requests and writes its metered usage before exiting.
    for file in "$DIR"/instance-*.pid; do [ -e "$file" ] && stop_pidfile "$file"; done
    redis-cli -p "$REDIS_PORT" shutdown nosave >/dev/null 2>&1 || true
    rm -f "$DIR/redis.pid"
    if [ -f "$DIR/pg/PG_VERSION" ]; then
      as_pg "'$PG_BIN/pg_ctl' -D '$DIR/pg' -m fast stop" >/dev/null 2>&1 || true
    fi
    say "stopped (data kept in $DIR; remove it to start afresh)"
    ;;
  status)
    for file in "$DIR"/instance-*.pid "$DIR/haproxy.pid"; do
      [ -e "$file" ] || continue
      if kill -0 "$(cat "$file")" 2>/dev/null; then say "$(basename "$file" .pid): running"; else say "$(basename "$file" .pid): stopped"; fi
    done
    curl -fsS "http://127.0.0.1:$PROXY_PORT/readyz" && echo || say "proxy: not answering"
    ;;
  *)
    say "usage: scripts/scaled.sh start [INSTANCES] | stop | status"
    exit 2
    ;;
esac
