#!/usr/bin/env bash
# Uploads a 1,000,000-fix CSV as multipart/form-data to a locally started service and reports the
# upload's wall time (curl) and the service's peak resident memory (/usr/bin/time -v "Maximum resident
# set size", and VmHWM from /proc/PID/status). Invented data: 24 marks (reference case 0), fixes
# scattered about them by a seeded normal generator.
#   bench/upload-million.sh [fix-count]        (needs the .NET SDK, python3, curl, /usr/bin/time)
#   SERVICE_ARGS="--Storage:Provider=postgres --Storage:ConnectionString=..." bench/upload-million.sh   (other storage)
set -euo pipefail
cd "$(dirname "$0")/.."
count=${1:-1000000}
work=$(mktemp -d)
port=5097
pid=""
timepid=""
trap '[ -n "$pid" ] && kill "$pid" 2>/dev/null; rm -rf "$work"' EXIT

python3 - "$count" "$work" <<'PY'
import json, random, sys
count, work = int(sys.argv[1]), sys.argv[2]
case = json.load(open("tests/reference-data/assessment-cases.json"))["cases"][0]["request"]
with open(f"{work}/marks.csv", "w") as f:
    f.write("id,e,n,h\n")
    for m in case["marks"]["points"]:
        f.write(f"{m['id']},{m['e']},{m['n']},{m['h']}\n")
fixes = case["fixes"]["points"]
rnd = random.Random(20260526)
with open(f"{work}/fixes.csv", "w") as f:
    f.write("id,mark,lat,lon,h\n")
    for i in range(count):
        base = fixes[i % len(fixes)]
        f.write(f"F{i:07d},{base['mark']},{base['lat'] + rnd.gauss(0, 3e-6):.9f},{base['lon'] + rnd.gauss(0, 4e-6):.9f},{base['h'] + rnd.gauss(0, 0.3):.3f}\n")
PY
ls -l "$work/fixes.csv" | awk '{printf "fixes.csv: %.1f MB\n", $5 / 1e6}'

if curl -fs "http://127.0.0.1:$port/healthz" >/dev/null 2>&1; then echo "port $port is already in use"; exit 1; fi
dotnet publish src/QaService.Api -c Release -o "$work/app" --nologo -v quiet >/dev/null
/usr/bin/time -v -o "$work/time.txt" dotnet "$work/app/QaService.Api.dll" --urls "http://127.0.0.1:$port" \
  --Storage:ConnectionString="Data Source=$work/bench.db" --Demo:Enabled=false --Limits:MaxPoints=2000000 --Serilog:MinimumLevel:Default=Warning \
  ${SERVICE_ARGS:-} >"$work/service.log" 2>&1 &
timepid=$!
for _ in $(seq 1 100); do curl -fs "http://127.0.0.1:$port/healthz" >/dev/null && break; sleep 0.2; done
# The service's start-up warm-up (an invented upload run in memory) has finished when its duration is in /metrics.
for _ in $(seq 1 150); do curl -fs "http://127.0.0.1:$port/metrics" | grep -q '^qaservice_warmup_duration_seconds{' && break; sleep 0.2; done
pid=$(pgrep -P "$timepid" | head -1)
[ -n "$pid" ] || { echo "service did not start; see $work/service.log"; cat "$work/service.log"; exit 1; }

curl -s -o "$work/report.json" -w 'HTTP %{http_code}, upload and assessment %{time_total} s\n' \
  -F 'options={"marks":{"crs":"EPSG:32633","heights":"ellipsoidal"},"fixes":{"crs":"EPSG:4979","heights":"ellipsoidal"},"spec":{"standard":"nssda","horizontal":1.0,"vertical":1.0}};type=application/json' \
  -F "marks=@$work/marks.csv;filename=marks.dat" -F "fixes=@$work/fixes.csv;filename=upload.dat" \
  "http://127.0.0.1:$port/v1/assessments"
grep -E 'VmHWM' "/proc/$pid/status" 2>/dev/null | awk '{printf "service peak RSS (VmHWM): %.0f MiB\n", $2 / 1024}'
python3 -c "import json,sys; r=json.load(open(sys.argv[1])); print('paired', r['counts']['paired'], 'nssda95 H', round(r['horizontal']['nssda95'],3), 'V', round(r['vertical']['nssda95'],3), 'verdict', r['verdict'])" "$work/report.json" || head -c 600 "$work/report.json"
kill -TERM "$pid" 2>/dev/null || true; wait "$timepid" || true
grep -E 'Maximum resident set size' "$work/time.txt" | awk '{printf "service peak RSS (/usr/bin/time -v): %.0f MiB\n", $6 / 1024}'
