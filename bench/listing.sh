#!/usr/bin/env bash
# Listing latency at 100,000 stored reports: seeds one tenant ("local", Auth:Mode none) with N small report rows
# straight into the store (one bulk transaction; plus N/5 rows of other tenants as noise), starts the service on
# loopback and measures GET /v1/assessments with wrk (Debian package `wrk`, bounded duration) for three cases:
# the first page, a page 90 % deep by cursor, and a title search (q=) that matches one row, so the whole tenant is
# filtered. Prints p50/p99 per case and the load average. Target: p99 <= 50 ms.
#
#   dotnet build -c Release src/QaService.Api
#   bench/listing.sh [sqlite|postgres] [rows=100000] [seconds=10] [postgres connection string]
#   (postgres: a throw-away database "qaservice_listing_bench" is created in that cluster and dropped after)
set -euo pipefail
cd "$(dirname "$0")/.."
provider=${1:-sqlite}
rows=${2:-100000}
seconds=${3:-10}
connection=${4:-${QASERVICE_TEST_POSTGRES:-}}
port=${LISTING_PORT:-58311}
dll=src/QaService.Api/bin/Release/net10.0/QaService.Api.dll
command -v wrk >/dev/null || { echo "wrk is missing: apt-get install wrk" >&2; exit 1; }
[ -f "$dll" ] || { echo "$dll is missing: dotnet build -c Release src/QaService.Api" >&2; exit 1; }
if curl -s -o /dev/null "http://127.0.0.1:$port/"; then echo "port $port is in use: set LISTING_PORT" >&2; exit 1; fi
work=$(mktemp -d /tmp/qaservice-listing.XXXXXX)
pid=
cleanup() {
  [ -n "$pid" ] && { kill "$pid" 2>/dev/null || true; wait "$pid" 2>/dev/null || true; }
  [ "$provider" = postgres ] && [ -n "${admin_psql:-}" ] && $admin_psql -c "DROP DATABASE IF EXISTS qaservice_listing_bench WITH (FORCE)" >/dev/null
  rm -rf "$work"
}
trap cleanup EXIT

if [ "$provider" = postgres ]; then
  [ -n "$connection" ] || { echo "give a PostgreSQL connection string (or set QASERVICE_TEST_POSTGRES)" >&2; exit 1; }
  # Host=…;Port=…;Username=… → psql arguments.
  get() { tr ';' '\n' <<<"$connection" | awk -F= -v k="$1" 'tolower($1)==tolower(k) {print $2}'; }
  admin_psql="psql -X -q -v ON_ERROR_STOP=1 -h $(get Host) -p $(get Port) -U $(get Username) -d postgres"
  $admin_psql -c "DROP DATABASE IF EXISTS qaservice_listing_bench WITH (FORCE)" -c "CREATE DATABASE qaservice_listing_bench" >/dev/null
  bench_psql="${admin_psql% -d postgres} -d qaservice_listing_bench"
  store=(Storage__Provider=postgres "Storage__ConnectionString=Host=$(get Host);Port=$(get Port);Username=$(get Username);Database=qaservice_listing_bench")
else
  store=(Storage__Provider=sqlite "Storage__ConnectionString=Data Source=$work/listing.db")
fi

start() {
  env "${store[@]}" Demo__Enabled=false WarmUp__Enabled=false Limits__RateLimitPermits=100000000 \
      Urls="http://127.0.0.1:$port" Serilog__MinimumLevel__Default=Warning dotnet "$dll" >>"$work/service.log" 2>&1 &
  pid=$!
  for _ in $(seq 1 240); do curl -fs "http://127.0.0.1:$port/readyz" >/dev/null && return; sleep 0.25; done
  echo "the service did not become ready:" >&2; cat "$work/service.log" >&2; exit 1
}
stop() { kill "$pid"; wait "$pid" 2>/dev/null || true; pid=; }

# The service creates the schema (all migrations, including the listing index); then rows go in directly.
start; stop
echo "seeding $rows rows (+ $((rows / 5)) of other tenants) into $provider ..."
seed_start=$(date +%s.%N)
if [ "$provider" = postgres ]; then
  $bench_psql <<SQL
INSERT INTO reports (tenant, id, created_at, title, verdict, json)
SELECT 'local', 'r' || lpad(i::text, 7, '0'), timestamptz '2026-01-01 00:00:00+00' + i * interval '1 second',
       'Hydrant batch ' || i, (ARRAY['pass','fail','inconclusive'])[1 + i % 3], '{"id":"r' || lpad(i::text, 7, '0') || '"}'
FROM generate_series(0, $rows - 1) AS i;
INSERT INTO reports (tenant, id, created_at, title, verdict, json)
SELECT 'noise-' || (i % 7), 'n' || lpad(i::text, 7, '0'), timestamptz '2026-01-01 00:00:00+00' + i * interval '5 second',
       'Valve batch ' || i, 'pass', '{}'
FROM generate_series(0, $rows / 5 - 1) AS i;
ANALYZE reports;
SQL
else
  python3 - "$work/listing.db" "$rows" <<'PY'
import sqlite3, sys, datetime
path, rows = sys.argv[1], int(sys.argv[2])
base = datetime.datetime(2026, 1, 1, tzinfo=datetime.timezone.utc)
def when(seconds):  # the store's text form: ISO 8601, UTC, 7 fraction digits ("O")
    return (base + datetime.timedelta(seconds=seconds)).strftime("%Y-%m-%dT%H:%M:%S.0000000Z")
verdicts = ["pass", "fail", "inconclusive"]
db = sqlite3.connect(path)
with db:
    db.executemany("INSERT INTO reports (tenant, id, created_at, title, verdict, json) VALUES (?, ?, ?, ?, ?, ?)",
                   (("local", f"r{i:07d}", when(i), f"Hydrant batch {i}", verdicts[i % 3], f'{{"id":"r{i:07d}"}}') for i in range(rows)))
    db.executemany("INSERT INTO reports (tenant, id, created_at, title, verdict, json) VALUES (?, ?, ?, ?, ?, ?)",
                   ((f"noise-{i % 7}", f"n{i:07d}", when(5 * i), f"Valve batch {i}", "pass", "{}") for i in range(rows // 5)))
db.execute("ANALYZE")
db.close()
PY
fi
echo "seeded in $(echo "$(date +%s.%N) - $seed_start" | bc) s"

# Cursor of the row 90 % of the way down (row i = rows/10 is that deep, newest first): base64url("v1:" + UTC ticks + ":" + id).
deep=$(python3 - "$rows" <<'PY'
import base64, datetime, sys
i = int(sys.argv[1]) // 10
ticks = (datetime.datetime(2026, 1, 1) + datetime.timedelta(seconds=i) - datetime.datetime(1, 1, 1)) // datetime.timedelta(microseconds=1) * 10
print(base64.urlsafe_b64encode(f"v1:{ticks}:r{i:07d}".encode()).decode().rstrip("="))
PY
)
start
base="http://127.0.0.1:$port/v1/assessments"
declare -A cases=([first]="$base?limit=50" [deep-cursor]="$base?limit=50&cursor=$deep" [q-one-match]="$base?limit=50&q=batch%20$((rows / 2))" [q-many]="$base?limit=50&q=HYDRANT")
for name in first deep-cursor q-one-match q-many; do
  url=${cases[$name]}
  items=$(curl -fs "$url" | python3 -c 'import json,sys; print(len(json.load(sys.stdin)["items"]))')
  wrk -t1 -c4 -d"${seconds}s" --latency "$url" >"$work/wrk.txt"
  p50=$(awk '$1=="50%" {print $2}' "$work/wrk.txt"); p99=$(awk '$1=="99%" {print $2}' "$work/wrk.txt")
  rps=$(awk '/Requests\/sec/ {print $2}' "$work/wrk.txt")
  printf '%-8s %-12s items=%-3s p50=%-9s p99=%-9s req/s=%s\n' "$provider" "$name" "$items" "$p50" "$p99" "$rps"
done
echo "load average: $(cut -d' ' -f1-3 /proc/loadavg)  (wrk -t1 -c4, ${seconds} s per case, $(nproc) cores)"
