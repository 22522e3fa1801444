#!/usr/bin/env bash
# Times POST /v1/transform against PROJ's cs2cs on the same 200,000 WGS 84 points (→ WGS 84 / UTM 33N),
# in the same run, with /usr/bin/time (GNU time). Each side is run RUNS times; the best wall time counts.
#
#   bash bench/transform-vs-cs2cs.sh [points] [runs]
#
# Needs: dotnet SDK, proj-bin (cs2cs), curl, python3, GNU time. Builds the API in Release and serves it on
# 127.0.0.1:5099 for the duration (stopped by PID at the end). The service time includes HTTP, JSON parsing
# and writing; cs2cs's includes process start-up and proj.db look-up.
set -euo pipefail
cd "$(dirname "$0")/.."
POINTS="${1:-200000}"
RUNS="${2:-3}"
PORT=5099
work="$(mktemp -d)"
trap 'kill "${server_pid:-0}" 2>/dev/null || true; [ "${ok:-0}" = 1 ] || tail -n 20 "$work/server.log" >&2 2>/dev/null; rm -rf "$work"' EXIT

python3 - "$POINTS" "$work" <<'PY'
import json, random, sys
n, work = int(sys.argv[1]), sys.argv[2]
r = random.Random(42)
pts = [(r.uniform(40, 55), r.uniform(12, 18), r.uniform(0, 1000)) for _ in range(n)]
with open(f"{work}/points.txt", "w") as f:
    f.writelines(f"{a:.9f} {b:.9f} {c:.3f}\n" for a, b, c in pts)
with open(f"{work}/body.json", "w") as f:
    json.dump({"from": "EPSG:4326", "to": "EPSG:32633",
               "points": [{"lat": round(a, 9), "lon": round(b, 9), "h": round(c, 3)} for a, b, c in pts]}, f, separators=(",", ":"))
PY

dotnet publish src/QaService.Api -c Release -o "$work/app" -v q -nologo >/dev/null
(cd "$work" && ASPNETCORE_URLS="http://127.0.0.1:$PORT" Serilog__MinimumLevel__Default=Warning \
   Storage__ConnectionString="Data Source=$work/bench.db" exec dotnet app/QaService.Api.dll --urls "http://127.0.0.1:$PORT" >"$work/server.log" 2>&1) &
server_pid=$!
for _ in $(seq 1 100); do curl -sf "http://127.0.0.1:$PORT/healthz" >/dev/null && break; sleep 0.2; done
# Warm-up: JIT and the first request's one-off costs are not what the batch is measured on.
curl -sf -H 'Content-Type: application/json' --data-binary @"$work/body.json" "http://127.0.0.1:$PORT/v1/transform" -o /dev/null

best() { sort -n | head -n 1; }
for i in $(seq 1 "$RUNS"); do
  /usr/bin/time -f "%e" -o "$work/t-cs2cs-$i" cs2cs -f %.6f EPSG:4326 EPSG:32633 <"$work/points.txt" >"$work/cs2cs.out"
  # The body streamed from the file (-T with POST), as bench/run-all.sh part (a) does: --data-binary @file would first
  # read it whole into curl's memory, client time that is not the service's.
  /usr/bin/time -f "%e" -o "$work/t-api-$i" curl -sf -X POST -T "$work/body.json" -H 'Content-Type: application/json' \
    "http://127.0.0.1:$PORT/v1/transform" -o "$work/api.json"
done
cs2cs_s="$(cat "$work"/t-cs2cs-* | best)"
api_s="$(cat "$work"/t-api-* | best)"

# Same answers? Largest easting/northing difference between the two outputs, metres.
python3 - "$work" <<'PY'
import json, sys
w = sys.argv[1]
api = json.load(open(f"{w}/api.json"))["points"]
worst = 0.0
for line, p in zip(open(f"{w}/cs2cs.out"), api):
    e, n = (float(v) for v in line.split()[:2])
    worst = max(worst, abs(e - p["e"]), abs(n - p["n"]))
print(f"largest |difference| service vs cs2cs: {worst:.2e} m over {len(api)} points")
PY
echo "points: $POINTS  runs: $RUNS (best wall time of each)"
echo "cs2cs -f %.6f           : ${cs2cs_s} s"
echo "POST /v1/transform (curl): ${api_s} s"
python3 -c "print(f'ratio service / cs2cs: {float(\"$api_s\") / float(\"$cs2cs_s\"):.2f}')"
ok=1
