#!/usr/bin/env bash
# A throw-away PostgreSQL cluster for tests, on loopback, owned by the postgres user.
#   scripts/pg-cluster.sh start DIR PORT   → prints the connection URL
#   scripts/pg-cluster.sh stop DIR
# Never touches a system cluster: everything lives in DIR.
set -euo pipefail
cmd=${1:?start|stop}; dir=${2:?folder}
bin=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1)
[ -x "$bin/initdb" ] || { echo "PostgreSQL server binaries not found under /usr/lib/postgresql" >&2; exit 3; }
as_pg() { if [ "$(id -un)" = postgres ]; then "$@"; else runuser -u postgres -- "$@"; fi; }
case "$cmd" in
  start)
    port=${3:?port}
    mkdir -p "$dir"
    chown postgres "$dir" 2>/dev/null || true
    as_pg "$bin/initdb" -D "$dir/db" -A trust -U rw --no-sync >"$dir/initdb.log" 2>&1
    as_pg "$bin/pg_ctl" -D "$dir/db" -l "$dir/server.log" \
      -o "-p $port -k $dir -c listen_addresses=127.0.0.1 -c fsync=off" -w start >/dev/null
    echo "postgresql://rw@127.0.0.1:$port/postgres"
    ;;
  stop)
    as_pg "$bin/pg_ctl" -D "$dir/db" -m fast -w stop >/dev/null 2>&1 || true
    rm -rf "$dir"
    ;;
  *) echo "usage: $0 start DIR PORT | stop DIR" >&2; exit 2 ;;
esac
