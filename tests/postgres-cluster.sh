#!/usr/bin/env bash
# A throw-away PostgreSQL cluster for tests and benchmarks, from Debian's postgresql-15 package:
#   bash tests/postgres-cluster.sh start DIR   initdb + pg_ctl start in DIR/data on a free loopback port;
#                                             prints the Npgsql connection string on stdout (last line)
#   bash tests/postgres-cluster.sh stop DIR    pg_ctl stop -m fast, then removes DIR
#   bash tests/postgres-cluster.sh restart DIR pg_ctl restart on the same port and data (a server restart)
# tests/run.sh and the test fixture (RunWatch.Testing/Postgres/PostgresServer.cs) both start clusters this way.
# initdb refuses to run as root, so as root the cluster belongs to the Debian `postgres` user (runuser).
# Trust authentication is safe here only because the server listens on 127.0.0.1 and a socket folder in DIR.
set -euo pipefail

bin=${RUNWATCH_POSTGRES_BIN:-/usr/lib/postgresql/15/bin}
command=${1:-}; dir=${2:-}
if [ -z "$command" ] || [ -z "$dir" ]; then
  echo "usage: $0 start|stop|restart DIR" >&2; exit 2
fi
if [ "$command" != stop ] && [ ! -x "$bin/initdb" ]; then
  echo "PostgreSQL binaries not found in $bin: install the Debian package postgresql (tests/run.sh does)" >&2; exit 3
fi

as_owner() {
  if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

case "$command" in
  start)
    mkdir -p "$dir/socket"
    if [ "$(id -u)" = 0 ]; then chown -R postgres: "$dir"; chmod 700 "$dir"; fi
    port=$(/usr/bin/python3 -c 'import socket; s=socket.socket(); s.bind(("127.0.0.1",0)); print(s.getsockname()[1]); s.close()')
    echo "$port" > "$dir/port"
    as_owner "$bin/initdb" -D "$dir/data" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >"$dir/initdb.log" 2>&1 \
      || { cat "$dir/initdb.log" >&2; echo "initdb failed in $dir" >&2; exit 4; }
    # Settings for a test server: loopback only, our own socket folder, enough connections for two daemons and a
    # test, keepalives so that a lost client's advisory locks are released in seconds, not hours.
    cat >>"$dir/data/postgresql.conf" <<EOF
listen_addresses = '127.0.0.1'
port = $port
unix_socket_directories = '$dir/socket'
max_connections = 200
tcp_keepalives_idle = 5
tcp_keepalives_interval = 2
tcp_keepalives_count = 3
EOF
    as_owner "$bin/pg_ctl" -D "$dir/data" -l "$dir/server.log" -w -t 60 start >/dev/null \
      || { tail -30 "$dir/server.log" >&2; echo "pg_ctl start failed in $dir" >&2; exit 5; }
    echo "Host=127.0.0.1;Port=$port;Username=postgres;Database=postgres"
    ;;
  restart)
    as_owner "$bin/pg_ctl" -D "$dir/data" -l "$dir/server.log" -w -t 60 -m fast restart >/dev/null \
      || { tail -30 "$dir/server.log" >&2; echo "pg_ctl restart failed in $dir" >&2; exit 5; }
    ;;
  stop)
    if [ -f "$dir/data/postmaster.pid" ] && [ -x "$bin/pg_ctl" ]; then
      as_owner "$bin/pg_ctl" -D "$dir/data" -w -t 30 -m fast stop >/dev/null 2>&1 || true
    fi
    rm -rf "$dir"
    ;;
  *)
    echo "unknown command: $command (start|stop|restart)" >&2; exit 2 ;;
esac
