#!/usr/bin/env bash
# A real PostgreSQL 15 server for the tests, as a separate process on loopback (no Docker).
#
#   .ci/postgres.sh start   install Debian's postgresql if needed (root), initdb a fresh cluster,
#                           start it, create the user and database sw/sw; prints the server's pid
#   .ci/postgres.sh stop    stop the server started from the same state directory
#
# Settings (environment):
#   SLOPEWATCH_POSTGRES_PORT  port on 127.0.0.1                 (default 55432)
#   SLOPEWATCH_POSTGRES_DIR   state: cluster, socket, log         (default ${TMPDIR:-/tmp}/slopewatch-postgres-$PORT)
#   SLOPEWATCH_APT_UPDATED    set to 1 when the caller already ran apt-get update
# Messages go to stderr; stdout carries only the pid, so that callers can capture it.
set -euo pipefail

PG_BIN=/usr/lib/postgresql/15/bin
PORT="${SLOPEWATCH_POSTGRES_PORT:-55432}"
DIR="${SLOPEWATCH_POSTGRES_DIR:-${TMPDIR:-/tmp}/slopewatch-postgres-$PORT}"
DATA="$DIR/data"

say() { echo "postgres.sh: $*" >&2; }
die() { say "error: $*"; exit 1; }

# run a server command as the cluster's owner: postgres refuses to run as root
as_owner() {
    if [[ "$(id -u)" == 0 ]]; then
        "$(command -v runuser || echo /usr/sbin/runuser)" -u postgres -- "$@"
    else
        "$@"
    fi
}

port_in_use() {
    (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null
}

server_pid() {
    [[ -f "$DATA/postmaster.pid" ]] || return 1
    local pid
    pid="$(head -n 1 "$DATA/postmaster.pid")"
    [[ -n "$pid" ]] && kill -0 "$pid" 2>/dev/null && echo "$pid"
}

install() {
    [[ -x "$PG_BIN/initdb" ]] && return
    if [[ "$(id -u)" != 0 ]]; then
        die "PostgreSQL 15 is not installed ($PG_BIN/initdb is missing); install it with 'sudo apt-get install -y postgresql', or run this script as root"
    fi
    say "installing Debian's postgresql package"
    export DEBIAN_FRONTEND=noninteractive
    if [[ "${SLOPEWATCH_APT_UPDATED:-0}" != 1 ]]; then
        apt-get update -qq >/dev/null
    fi
    apt-get install -y -qq postgresql >/dev/null
    [[ -x "$PG_BIN/initdb" ]] || die "the postgresql package did not bring $PG_BIN/initdb (is this Debian 12?)"
}

start() {
    local pid
    if pid="$(server_pid)"; then
        say "already running (pid $pid) on 127.0.0.1:$PORT"
        echo "$pid"
        return
    fi
    if port_in_use "$PORT"; then
        die "port $PORT on 127.0.0.1 is taken by another process; stop it or set SLOPEWATCH_POSTGRES_PORT"
    fi
    install
    mkdir -p "$DIR"
    rm -rf "$DATA"
    if [[ "$(id -u)" == 0 ]]; then
        chown postgres:postgres "$DIR"
    fi
    as_owner "$PG_BIN/initdb" -D "$DATA" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >"$DIR/initdb.log" 2>&1 \
        || { cat "$DIR/initdb.log" >&2; die "initdb failed in $DATA"; }
    say "starting PostgreSQL on 127.0.0.1:$PORT (state in $DIR)"
    # fsync off: a test cluster is thrown away, and durability costs seconds on every commit-heavy test
    as_owner "$PG_BIN/pg_ctl" -D "$DATA" -l "$DIR/server.log" -w -t 60 \
        -o "-c listen_addresses=127.0.0.1 -p $PORT -k $DIR -c fsync=off -c synchronous_commit=off -c full_page_writes=off" \
        start >"$DIR/pg_ctl.log" 2>&1 \
        || { cat "$DIR/pg_ctl.log" >&2; tail -n 20 "$DIR/server.log" >&2 || true; die "the server did not start (log in $DIR/server.log)"; }
    "$PG_BIN/psql" -q -v ON_ERROR_STOP=1 -h 127.0.0.1 -p "$PORT" -U postgres -d postgres \
        -c "CREATE USER sw PASSWORD 'sw' CREATEDB" -c "CREATE DATABASE sw OWNER sw" >&2 \
        || die "could not create the user and database sw"
    pid="$(server_pid)" || die "the server started but left no postmaster.pid in $DATA"
    say "ready on 127.0.0.1:$PORT, database sw, user sw (pid $pid)"
    echo "$pid"
}

stop() {
    local pid
    if ! pid="$(server_pid)"; then
        say "not running (no live server for $DATA)"
        return
    fi
    as_owner "$PG_BIN/pg_ctl" -D "$DATA" -m fast -w stop >/dev/null \
        || die "pg_ctl could not stop the server (pid $pid)"
    say "stopped (pid $pid)"
}

case "${1:-}" in
    start) start ;;
    stop) stop ;;
    *) echo "usage: $0 start|stop" >&2; exit 2 ;;
esac
