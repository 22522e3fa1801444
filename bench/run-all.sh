#!/usr/bin/env bash
# End-to-end comparisons of the service with PROJ's cs2cs (Debian proj-bin) on the same points, in the same run,
# and the small-assessment throughput under wrk. Prints each figure and the ratios the performance targets use:
#   (a) POST /v1/transform, N WGS 84 points -> UTM 33N, vs cs2cs on the same points        (target <= 0.25, must <= 1.0)
#   (b) multipart CSV upload, M fixes + K marks paired by id, full JSON report, vs cs2cs on those M points, on a service that
#       has answered one small upload (2,000 fixes) as a running service has; the first request of a fresh service apart
#       (target <= 1.0, must <= 2.0) and the service's peak RSS (VmHWM)                      (target <= 512 MiB, must <= 1.5 GiB)
#   (c) small JSON assessments (24 points) under wrk on loopback: requests/s, p99, errors  (target >= 3,000/s, p99 <= 25 ms)
#
#   bash bench/run-all.sh [transform-points=200000] [upload-fixes=400000] [marks=2000] [wrk-seconds=20]
#   PARTS=c bash bench/run-all.sh ...   runs only the listed parts (any of a, b, c; default abc)
#
# Needs: .NET SDK, proj-bin (cs2cs), python3, curl, GNU time (/usr/bin/time), wrk (apt-get install -y wrk).
# The machine may be shared: every comparison runs its two sides back to back, best of RUNS (env, default 3).
set -euo pipefail
cd "$(dirname "$0")/.."
TPOINTS=${1:-200000}
FIXES=${2:-400000}
MARKS=${3:-2000}
WRK_SECONDS=${4:-20}
RUNS=${RUNS:-3}
PARTS=${PARTS:-abc}
part() { [[ "$PARTS" == *"$1"* ]]; }
PORT=${BENCH_PORT:-5098}
work=$(mktemp -d)
pid=""; timepid=""
trap '[ -n "$pid" ] && kill "$pid" 2>/dev/null; rm -rf "$work"' EXIT
for tool in cs2cs curl python3 /usr/bin/time; do command -v "$tool" >/dev/null || { echo "$tool is missing" >&2; exit 1; }; done

dotnet publish src/QaService.Api -c Release -o "$work/app" --nologo -v quiet >/dev/null

start_service() { # start_service NAME: a fresh service and database, peak memory counted from zero
  rm -rf "$work"/bench.db*  # the database, its WAL and its .reports folder
  /usr/bin/time -v -o "$work/time-$1.txt" dotnet "$work/app/QaService.Api.dll" --urls "http://127.0.0.1:$PORT" \
    --Storage:ConnectionString="Data Source=$work/bench.db" --Demo:Enabled=false --Limits:MaxPoints=2000000 \
    --Limits:RateLimitPermits=100000000 --Serilog:MinimumLevel:Default=Warning >"$work/service-$1.log" 2>&1 &
  timepid=$!
  for _ in $(seq 1 150); do curl -fs "http://127.0.0.1:$PORT/healthz" >/dev/null && break; sleep 0.2; done
  # The service's own start-up warm-up (an invented upload run in memory) has finished when its duration is in /metrics.
  for _ in $(seq 1 150); do curl -fs "http://127.0.0.1:$PORT/metrics" | grep -q '^qaservice_warmup_duration_seconds{' && break; sleep 0.2; done
  pid=$(pgrep -P "$timepid" | head -1)
}
stop_service() { kill -TERM "$pid" 2>/dev/null || true; wait "$timepid" 2>/dev/null || true; pid=""; }
best() { sort -n | head -n 1; }
ratio() { python3 -c "print(f'{float(\"$1\") / float(\"$2\"):.2f}')"; }

if part a || part b; then
python3 - "$TPOINTS" "$FIXES" "$MARKS" "$work" <<'PY'
import json, random, sys
tpoints, fixes, marks, work = int(sys.argv[1]), int(sys.argv[2]), int(sys.argv[3]), sys.argv[4]
r = random.Random(42)
pts = [(r.uniform(40, 55), r.uniform(12, 18), r.uniform(0, 1000)) for _ in range(tpoints)]
with open(f"{work}/t-points.txt", "w") as f:
    f.writelines(f"{a:.9f} {b:.9f} {c:.3f}\n" for a, b, c in pts)
with open(f"{work}/t-body.json", "w") as f:
    json.dump({"from": "EPSG:4326", "to": "EPSG:32633",
               "points": [{"lat": round(a, 9), "lon": round(b, 9), "h": round(c, 3)} for a, b, c in pts]}, f, separators=(",", ":"))
# Invented marks on a grid near 15 E 50 N (UTM 33N), fixes scattered about them by a seeded normal generator.
mk = [(f"M{i:05d}", 500000.0 + 37.0 * (i % 50), 5540000.0 + 41.0 * (i // 50), 250.0 + (i % 7)) for i in range(marks)]
with open(f"{work}/marks.csv", "w") as f:
    f.write("id,e,n,h\n")
    f.writelines(f"{m},{e:.3f},{n:.3f},{h:.3f}\n" for m, e, n, h in mk)
# Fix positions: the marks' geographic coordinates come from cs2cs below; here only ids and offsets are drawn.
with open(f"{work}/fix-plan.txt", "w") as f:
    for i in range(fixes):
        m, e, n, h = mk[i % marks]
        f.write(f"{e + r.gauss(0, 0.3):.3f} {n + r.gauss(0, 0.3):.3f} {h + r.gauss(0, 0.5):.3f} F{i:07d} {m}\n")
PY
# Geographic fixes (lat lon h) from the planned UTM positions, with cs2cs itself (so the upload is realistic WGS 84).
cs2cs -f %.9f EPSG:32633 EPSG:4979 <"$work/fix-plan.txt" | awk 'BEGIN {print "id,mark,lat,lon,h"} {printf "%s,%s,%s,%s,%s\n", $4, $5, $1, $2, $3}' >"$work/fixes.csv"
awk -F, 'NR > 1 {print $3, $4, $5}' "$work/fixes.csv" >"$work/u-points.txt"
fi

if part a; then
echo "== (a) POST /v1/transform, $TPOINTS points, EPSG:4326 -> EPSG:32633 (best of $RUNS)"
start_service transform
curl -sf -H 'Content-Type: application/json' --data-binary @"$work/t-body.json" "http://127.0.0.1:$PORT/v1/transform" -o /dev/null # warm-up
# The client streams the body from the file (-T, with POST): curl's --data-binary @file first reads the whole 10 MB into
# memory, ~60 ms of the client's own time on this machine kind; that client is still timed and printed beside it.
for i in $(seq 1 "$RUNS"); do
  /usr/bin/time -f "%e" -o "$work/a-cs2cs-$i" cs2cs -f %.6f EPSG:4326 EPSG:32633 <"$work/t-points.txt" >"$work/cs2cs.out"
  /usr/bin/time -f "%e" -o "$work/a-api-$i" curl -sf -X POST -T "$work/t-body.json" -H 'Content-Type: application/json' \
    "http://127.0.0.1:$PORT/v1/transform" -o "$work/api.json"
  /usr/bin/time -f "%e" -o "$work/a-inmemory-$i" curl -sf -H 'Content-Type: application/json' --data-binary @"$work/t-body.json" \
    "http://127.0.0.1:$PORT/v1/transform" -o /dev/null
done
stop_service
a_cs2cs=$(cat "$work"/a-cs2cs-* | best); a_api=$(cat "$work"/a-api-* | best); a_inmemory=$(cat "$work"/a-inmemory-* | best)
python3 - "$work" <<'PY'
import json, sys
w = sys.argv[1]
api = json.load(open(f"{w}/api.json"))["points"]
worst = max(max(abs(float(l.split()[0]) - p["e"]), abs(float(l.split()[1]) - p["n"])) for l, p in zip(open(f"{w}/cs2cs.out"), api))
print(f"   largest |difference| service vs cs2cs: {worst:.2e} m over {len(api)} points")
PY
echo "   cs2cs ${a_cs2cs} s, service ${a_api} s, ratio service/cs2cs $(ratio "$a_api" "$a_cs2cs")"
echo "   (a client that loads the body into memory first, curl --data-binary @file: ${a_inmemory} s, ratio $(ratio "$a_inmemory" "$a_cs2cs"))"

fi

if part b; then
echo "== (b) multipart CSV upload, $FIXES fixes, $MARKS marks paired by id, full JSON report (best of $RUNS)"
options='{"marks":{"crs":"EPSG:32633","heights":"ellipsoidal"},"fixes":{"crs":"EPSG:4979","heights":"ellipsoidal"},"spec":{"standard":"nssda","horizontal":1.0,"vertical":1.0}}'
head -n 2001 "$work/fixes.csv" >"$work/warm-fixes.csv" # the same shape, 2,000 fixes
upload() { # upload FIXES-FILE OUTPUT: sets the array up to the curl command (an array, so /usr/bin/time can run it)
  up=(curl -sf -o "$2" -F "options=$options;type=application/json" -F "marks=@$work/marks.csv;filename=marks.dat"
    -F "fixes=@$1;filename=upload.dat" "http://127.0.0.1:$PORT/v1/assessments")
}
# A fresh service (started, its start-up warm-up finished): its first large upload, timed once on its own, reported apart.
start_service cold
upload "$work/fixes.csv" /dev/null
/usr/bin/time -f "%e" -o "$work/b-cold" "${up[@]}"
stop_service
peak=0
for i in $(seq 1 "$RUNS"); do
  /usr/bin/time -f "%e" -o "$work/b-cs2cs-$i" cs2cs -f %.6f EPSG:4326 EPSG:32633 <"$work/u-points.txt" >/dev/null
  # A running service: one small upload of the same shape first (as in part a), then the timed one.
  start_service upload
  upload "$work/warm-fixes.csv" /dev/null
  "${up[@]}"
  upload "$work/fixes.csv" "$work/report.json"
  /usr/bin/time -f "%e" -o "$work/b-api-$i" "${up[@]}"
  hwm=$(awk '/VmHWM/ {print int($2 / 1024)}' "/proc/$pid/status")
  stop_service
  [ "$hwm" -gt "$peak" ] && peak=$hwm
done
b_cs2cs=$(cat "$work"/b-cs2cs-* | best); b_api=$(cat "$work"/b-api-* | best)
python3 -c "import json,os,sys; r=json.load(open(sys.argv[1])); print('   paired', r['counts']['paired'], 'verdict', r['verdict'], 'report', os.path.getsize(sys.argv[1]), 'bytes')" "$work/report.json"
echo "   cs2cs ${b_cs2cs} s, service ${b_api} s, ratio service/cs2cs $(ratio "$b_api" "$b_cs2cs"); service peak RSS (VmHWM, largest of $RUNS runs) ${peak} MiB"
echo "   first upload on a fresh service (after its start-up warm-up only): $(cat "$work/b-cold") s, ratio $(ratio "$(cat "$work/b-cold")" "$b_cs2cs")"

fi

if ! part c; then
  :
elif command -v wrk >/dev/null; then
  echo "== (c) small JSON assessments (24 marks, 24 fixes) under wrk, ${WRK_SECONDS} s, 2 threads, 32 connections"
  python3 - "$work/small.json" <<'PY'
import json, sys
case = json.load(open("tests/reference-data/assessment-cases.json"))["cases"][0]["request"]
json.dump(case, open(sys.argv[1], "w"))
PY
  cat >"$work/post.lua" <<LUA
local f = io.open("$work/small.json", "rb"); wrk.body = f:read("*a"); f:close()
wrk.method = "POST"; wrk.headers["Content-Type"] = "application/json"
LUA
  start_service wrk
  wrk -t2 -c32 -d5s -s "$work/post.lua" "http://127.0.0.1:$PORT/v1/assessments" >/dev/null # warm-up
  wrk -t2 -c32 -d"${WRK_SECONDS}s" --latency -s "$work/post.lua" "http://127.0.0.1:$PORT/v1/assessments" | tee "$work/wrk.txt" | grep -E "requests in|Requests/sec|99%|Non-2xx|Socket errors" | sed 's/^/   /'
  grep -q "Non-2xx\|Socket errors" "$work/wrk.txt" || echo "   errors: none"
  stop_service
else
  echo "== (c) skipped: wrk is missing (apt-get install -y wrk)"
fi
echo "== load average during the run: $(cut -d' ' -f1-3 /proc/loadavg)"
