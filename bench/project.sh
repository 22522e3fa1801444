#!/usr/bin/env bash
# A project with many deliveries: publishes the service (Release), starts it on a fresh SQLite database, creates a
# project (POST /v1/projects), posts N JSON deliveries into it (projectId, no spec of their own; each with F fixes on
# 40 marks, invented data around the invented town of Harrowmere, seeded), records a decision on every 50th, then
# measures GET /v1/projects/{id} and GET /v1/projects/{id}/report.html with wrk (Debian `wrk`, bounded duration):
# p50/p99, requests/s and the response size, with the load average. Also prints the posts' p50/p99 per request.
#
#   bash bench/project.sh [deliveries=500] [fixes-per-delivery=200] [wrk-seconds=10]
#   SERVICE_ARGS="--Storage:Provider=postgres --Storage:ConnectionString=..." bash bench/project.sh   (other storage)
set -euo pipefail
cd "$(dirname "$0")/.."
deliveries=${1:-500}
fixes=${2:-200}
seconds=${3:-10}
port=${BENCH_PORT:-5096}
work=$(mktemp -d /tmp/qaservice-project.XXXXXX)
. bench/service-lib.sh
trap service_cleanup EXIT
for tool in wrk curl python3 /usr/bin/time; do command -v "$tool" >/dev/null || { echo "$tool is missing" >&2; exit 1; }; done

publish_service
start_service project
base="http://127.0.0.1:$port"
project=$(curl -fs -H 'Content-Type: application/json' "$base/v1/projects" \
  -d '{"name":"Harrowmere water mains 2026","spec":{"standard":"nssda","horizontal":0.10,"vertical":0.15}}' |
  python3 -c 'import json,sys; print(json.load(sys.stdin)["id"])')

echo "posting $deliveries deliveries of $fixes fixes into project $project ..."
python3 - "$base" "$project" "$deliveries" "$fixes" <<'PY'
import http.client, json, math, random, statistics, sys, time, urllib.parse
base, project, deliveries, fixes = sys.argv[1], sys.argv[2], int(sys.argv[3]), int(sys.argv[4])
url = urllib.parse.urlparse(base)
conn = http.client.HTTPConnection(url.hostname, url.port)
rnd = random.Random(20260611)
lat0, lon0, metre_lat = 52.1183, 14.3021, 1 / 111_320  # the invented Harrowmere, its valves and hydrants
metre_lon = metre_lat / math.cos(math.radians(lat0))
def post(path, body):
    started = time.perf_counter()
    conn.request("POST", path, json.dumps(body), {"Content-Type": "application/json"})
    response = conn.getresponse()
    answer = response.read()
    if response.status != 201:
        sys.exit(f"POST {path}: {response.status} {answer[:400]!r}")
    return json.loads(answer), time.perf_counter() - started
times, ids = [], []
for d in range(deliveries):
    sigma = 0.03 + 0.015 * math.sin(d / 40) + 0.005 * (d % 7)  # a drifting crew quality, so the trend moves
    marks = [{"id": f"HM-{m:03d}", "lat": lat0 + 400 * metre_lat * (m // 8) + 0.001 * d, "lon": lon0 + 350 * metre_lon * (m % 8),
              "h": 61.0 + m % 9} for m in range(40)]
    points = []
    for f in range(fixes):
        mark = marks[f % 40]
        points.append({"id": f"V{d:04d}-{f:05d}", "mark": mark["id"], "lat": round(mark["lat"] + rnd.gauss(0, sigma) * metre_lat, 10),
                       "lon": round(mark["lon"] + rnd.gauss(0, sigma) * metre_lon, 10), "h": round(mark["h"] + rnd.gauss(0, 1.4 * sigma), 4)})
    body = {"title": f"Harrowmere valves, batch {d + 1}", "projectId": project,
            "marks": {"crs": "EPSG:4979", "heights": "ellipsoidal", "points": marks},
            "fixes": {"crs": "EPSG:4979", "heights": "ellipsoidal", "points": points}}
    report, seconds = post("/v1/assessments", body)
    times.append(seconds)
    ids.append(report["id"])
decided = 0
for d in range(0, deliveries, 50):
    post(f"/v1/assessments/{ids[d]}/decisions", {"decision": "accepted" if d % 100 == 0 else "rejected",
                                                  "by": "R. Calder, QA lead", "comment": f"batch {d + 1} checked"})
    decided += 1
ms = sorted(1000 * t for t in times)
print(f"posted {deliveries} deliveries: p50 {statistics.median(ms):.1f} ms, p99 {ms[min(len(ms) - 1, int(0.99 * len(ms)))]:.1f} ms"
      f" per request, {sum(times):.1f} s in all; {decided} decisions")
PY
echo "load average after posting: $(loadavg)"
curl -fs "$base/v1/projects/$project" | python3 -c '
import json, sys
p = json.load(sys.stdin)
accepted = sum(1 for a in p["assessments"] if a["acceptance"] == "accepted")
print("project:", len(p["assessments"]), "deliveries,", len(p["trend"]), "trend points,", accepted, "accepted")'
measure_get project "$base/v1/projects/$project" "$seconds"
measure_get project-report.html "$base/v1/projects/$project/report.html" "$seconds"
echo "(wrk -t1 -c4, $seconds s per case, $(nproc) cores)"
stop_service
