#!/usr/bin/env bash
# Report groups at scale: 2,000 invented marks (a grid near 15 E 50 N, UTM 33N) and N fixes about them (seeded normal
# offsets; geographic positions from cs2cs, Debian proj-bin, as bench/run-all.sh part (b)), each fix with featureClass
# (5 values), crew (8) and receiver (4) columns. Prints (i) the in-process stage times (bench/QaService.Benchmarks
# `stages`, best of 3) including "groups (by fix attribute)", and (ii) the multipart upload to a stored report, end to end,
# with and without the three attribute columns, each on a fresh service after one 2,000-fix upload of the same shape,
# with the service's peak RSS (VmHWM) and the report's group count; the load average with each figure.
#
#   bash bench/groups.sh [fixes=400000]
set -euo pipefail
cd "$(dirname "$0")/.."
fixes=${1:-400000}
marks=2000
port=${BENCH_PORT:-5094}
work=$(mktemp -d /tmp/qaservice-groups.XXXXXX)
. bench/service-lib.sh
trap service_cleanup EXIT
for tool in cs2cs curl python3 /usr/bin/time; do command -v "$tool" >/dev/null || { echo "$tool is missing" >&2; exit 1; }; done

python3 - "$fixes" "$marks" "$work" <<'PY'
import random, sys
fixes, marks, work = int(sys.argv[1]), int(sys.argv[2]), sys.argv[3]
r = random.Random(42)
mk = [(f"M{i:05d}", 500000.0 + 37.0 * (i % 50), 5540000.0 + 41.0 * (i // 50), 250.0 + (i % 7)) for i in range(marks)]
with open(f"{work}/marks.csv", "w") as f:
    f.write("id,e,n,h\n")
    f.writelines(f"{m},{e:.3f},{n:.3f},{h:.3f}\n" for m, e, n, h in mk)
classes = ["valve", "hydrant", "manhole", "kerb", "lamppost"]
crews = [f"crew-{c}" for c in "ABCDEFGH"]
receivers = ["Rx-100", "Rx-200", "Rx-300", "Rx-400"]
with open(f"{work}/fix-plan.txt", "w") as f:
    for i in range(fixes):
        m, e, n, h = mk[i % marks]
        f.write(f"{e + r.gauss(0, 0.3):.3f} {n + r.gauss(0, 0.3):.3f} {h + r.gauss(0, 0.5):.3f} F{i:07d} {m}"
                f" {r.choice(classes)} {r.choice(crews)} {r.choice(receivers)}\n")
PY
cs2cs -f %.9f EPSG:32633 EPSG:4979 <"$work/fix-plan.txt" |
  awk -v plain="$work/fixes-plain.csv" 'BEGIN {print "id,mark,lat,lon,h,featureClass,crew,receiver"; print "id,mark,lat,lon,h" > plain}
       {printf "%s,%s,%s,%s,%s,%s,%s,%s\n", $4, $5, $1, $2, $3, $6, $7, $8; printf "%s,%s,%s,%s,%s\n", $4, $5, $1, $2, $3 > plain}' >"$work/fixes-groups.csv"
options='{"marks":{"crs":"EPSG:32633","heights":"ellipsoidal"},"fixes":{"crs":"EPSG:4979","heights":"ellipsoidal"},"spec":{"standard":"nssda","horizontal":1.0,"vertical":1.0}}'
echo "$options" >"$work/options.json"

echo "== (i) stages, $fixes fixes with attributes, $marks marks (best of 3; load average before: $(loadavg))"
dotnet run -c Release --project bench/QaService.Benchmarks -- stages "$work/marks.csv" "$work/fixes-groups.csv" "$work/options.json" 3 | sed 's/^/   /'
echo "   load average after: $(loadavg)"

echo "== (ii) multipart upload to a stored report, $fixes fixes, $marks marks"
upload() { # upload FIXES-CSV REPORT-JSON: prints the HTTP status and the whole request's seconds (curl)
  curl -sf -o "$2" -w '%{http_code} %{time_total}\n' -F "options=$options;type=application/json" \
    -F "marks=@$work/marks.csv;filename=marks.dat" -F "fixes=@$1;filename=upload.dat" "http://127.0.0.1:$port/v1/assessments"
}
publish_service
for kind in plain groups; do
  start_service "$kind"
  head -n 2001 "$work/fixes-$kind.csv" >"$work/warm-$kind.csv"
  upload "$work/warm-$kind.csv" "$work/warm-$kind.json" >/dev/null  # a running service has answered a small upload
  upload "$work/fixes-$kind.csv" "$work/report-$kind.json" >"$work/report-$kind.time"
  read -r status seconds <"$work/report-$kind.time"
  printf '   %-22s HTTP %s in %s s, service peak RSS (VmHWM) %s MiB, load average %s\n' \
    "$([ "$kind" = groups ] && echo "with attribute columns" || echo "without")" "$status" "$seconds" "$(peak_rss_mib)" "$(loadavg)"
  stop_service
  python3 - "$work/report-$kind.json" "$([ "$kind" = groups ] && echo 17 || echo 0)" <<'PY'
import json, os, sys
r = json.load(open(sys.argv[1]))
groups = r.get("groups") or []
values = sum(len(g["groups"]) for g in groups)
print(f"   {'':22s} paired {r['counts']['paired']}, report {os.path.getsize(sys.argv[1]) / 1e6:.1f} MB, groups: "
      + (", ".join(f"{g['attribute']} {len(g['groups'])}" for g in groups) + f" ({values} values)" if groups else "none"))
expected = int(sys.argv[2])  # 5 classes + 8 crews + 4 receivers; none without the columns
if values != expected:
    sys.exit(f"   expected {expected} group values, the report has {values}")
PY
done
