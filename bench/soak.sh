#!/usr/bin/env bash
# Soak test: one service instance on loopback under wrk (Debian package `wrk`) for a bounded time,
# a mix of POST /v1/assessments (24 marks, 24 fixes) and GET of the stored report, in keys mode with a
# tenant key. Prints wrk's figures, the service's memory before and after, its 5xx count from /metrics,
# and whether it is still healthy.
#
#   dotnet build -c Release src/QaService.Api
#   bench/soak.sh [seconds=60] [connections=16] [sqlite|postgres] [postgres connection string]
set -euo pipefail
cd "$(dirname "$0")/.."
seconds=${1:-60}
connections=${2:-16}
provider=${3:-sqlite}
connection=${4:-${QASERVICE_TEST_POSTGRES:-}}
port=${SOAK_PORT:-58291}
dll=src/QaService.Api/bin/Release/net10.0/QaService.Api.dll
command -v wrk >/dev/null || { echo "wrk is missing: apt-get install wrk" >&2; exit 1; }
[ -f "$dll" ] || { echo "$dll is missing: dotnet build -c Release src/QaService.Api" >&2; exit 1; }

if curl -s -o /dev/null "http://127.0.0.1:$port/"; then echo "port $port is in use: set SOAK_PORT" >&2; exit 1; fi
work=$(mktemp -d /tmp/qaservice-soak.XXXXXX)
admin=$(head -c 32 /dev/urandom | base64 | tr -d '/+=' )
if [ "$provider" = postgres ]; then store=(Storage__Provider=postgres "Storage__ConnectionString=$connection")
else store=(Storage__Provider=sqlite "Storage__ConnectionString=Data Source=$work/soak.db"); fi
env "${store[@]}" Auth__Mode=keys "Auth__AdminToken=$admin-soak-admin-token" Demo__Enabled=false \
    Limits__RateLimitPermits=100000000 Urls="http://127.0.0.1:$port" Serilog__MinimumLevel__Default=Warning \
    dotnet "$dll" >"$work/service.log" 2>&1 &
pid=$!
trap 'kill $pid 2>/dev/null || true; wait $pid 2>/dev/null || true' EXIT
for _ in $(seq 1 120); do curl -fs "http://127.0.0.1:$port/readyz" >/dev/null && break; sleep 0.25; done

key=$(curl -fs -X POST "http://127.0.0.1:$port/v1/admin/tenants" -H "Authorization: Bearer $admin-soak-admin-token" \
      -H 'Content-Type: application/json' -d '{"name":"soak-tenant"}' | python3 -c 'import json,sys; print(json.load(sys.stdin)["apiKey"])')

python3 - "$work/body.json" <<'PY'
import json, sys
marks = [{"id": f"M{i}", "e": 500000.0 + 40 * i, "n": 5400000.0 + 25 * (i % 5), "h": 200.0} for i in range(24)]
fixes = [{"id": f"F{i}", "mark": f"M{i}", "e": 500000.012 + 40 * i, "n": 5399999.992 + 25 * (i % 5), "h": 200.03} for i in range(24)]
json.dump({"title": "soak, invented Larkspur Hollow valves", "marks": {"crs": "EPSG:32633", "heights": "ellipsoidal", "points": marks},
           "fixes": {"crs": "EPSG:32633", "heights": "ellipsoidal", "points": fixes},
           "spec": {"standard": "nssda", "horizontal": 0.5, "vertical": 1.0}}, open(sys.argv[1], "w"))
PY
location=$(curl -fs -D - -o /dev/null -X POST "http://127.0.0.1:$port/v1/assessments" -H "Authorization: Bearer $key" \
           -H 'Content-Type: application/json' --data-binary "@$work/body.json" | tr -d '\r' | awk 'tolower($1)=="location:" {print $2}')

# Every other request is a POST; the rest read the first stored report.
cat >"$work/mix.lua" <<LUA
local f = io.open("$work/body.json", "rb"); local body = f:read("*a"); f:close()
local n = 0
request = function()
  n = n + 1
  local headers = { ["Authorization"] = "Bearer $key", ["Content-Type"] = "application/json" }
  if n % 2 == 0 then return wrk.format("POST", "/v1/assessments", headers, body) end
  return wrk.format("GET", "$location", headers)
end
LUA

rss() { awk '/VmRSS/ {print $2 " kB"}' "/proc/$pid/status"; }
echo "provider=$provider seconds=$seconds connections=$connections; service RSS before: $(rss)"
wrk -t2 -c"$connections" -d"${seconds}s" --latency -s "$work/mix.lua" "http://127.0.0.1:$port" | tee "$work/wrk.txt"
echo "service RSS after: $(rss)"
sleep 1
curl -fs "http://127.0.0.1:$port/metrics" >"$work/metrics.txt" || true
echo "5xx answers counted by the service: $(awk '/^http_server_request_duration_seconds_count/ && /http_response_status_code="5/ {s += $NF} END {print s + 0}' "$work/metrics.txt")"
echo "assessments stored (metrics): $(awk '/^qaservice_assessments_total/ {s += $NF} END {print s + 0}' "$work/metrics.txt")"
echo "healthz after the soak: $(curl -s -o /dev/null -w '%{http_code}' "http://127.0.0.1:$port/healthz"), readyz: $(curl -s -o /dev/null -w '%{http_code}' "http://127.0.0.1:$port/readyz")"
echo "files in $work"
