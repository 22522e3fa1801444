#!/usr/bin/env bash
# Starts a throw-away PostgreSQL cluster on loopback for the PostgreSQL tests and fault scripts, and
# prints the ADO.NET connection string on stdout (everything else goes to stderr).
# Usage: eval "export QASERVICE_TEST_POSTGRES=\"$(tools/postgres/start-loopback-cluster.sh [DIR] [PORT])\""
# Needs Debian's postgresql (server binaries under /usr/lib/postgresql/<major>/bin). Runs the server as
# the `postgres` user when started as root (PostgreSQL refuses to run as root). Stop it with
#   su postgres -c "pg_ctl -D DIR stop -m fast"   (or the pg_ctl line the script prints on stderr)
set -euo pipefail
dir=${1:-/tmp/qaservice-pg}
port=${2:-55432}
bin=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1)
[ -x "$bin/initdb" ] || { echo "PostgreSQL server binaries not found (apt-get install postgresql)" >&2; exit 1; }

as_owner() { if [ "$(id -u)" = 0 ]; then su postgres -s /bin/sh -c "$*"; else sh -c "$*"; fi; }

if [ ! -f "$dir/PG_VERSION" ]; then
  mkdir -p "$dir"
  [ "$(id -u)" = 0 ] && chown postgres "$dir"
  as_owner "'$bin/initdb' -D '$dir' -U postgres --auth=trust --encoding=UTF8 --no-locale" >&2
fi
if ! as_owner "'$bin/pg_ctl' -D '$dir' status" >/dev/null 2>&1; then
  # Loopback only; the socket goes in the data folder so no system folder is needed.
  as_owner "'$bin/pg_ctl' -D '$dir' -l '$dir/server.log' -w -o \"-c listen_addresses=127.0.0.1 -p $port -k '$dir'\" start" >&2
fi
as_owner "'$bin/psql' -h 127.0.0.1 -p $port -U postgres -tAc \"SELECT 1 FROM pg_database WHERE datname='qaservice'\"" | grep -q 1 \
  || as_owner "'$bin/createdb' -h 127.0.0.1 -p $port -U postgres qaservice" >&2
echo "stop with: su postgres -c \"$bin/pg_ctl -D $dir stop -m fast\"" >&2
echo "Host=127.0.0.1;Port=$port;Database=qaservice;Username=postgres"
