# Sourced by bench/project.sh and bench/groups.sh: publish the service (Release), start it on a fresh SQLite database
# (or the storage in SERVICE_ARGS) under GNU time, stop it, and measure one GET with wrk. The caller sets `work` (a
# temporary folder) and `port`, and removes the folder on exit (`service_cleanup` stops a running service first).
#   SERVICE_ARGS="--Storage:Provider=postgres --Storage:ConnectionString=..."   other storage, as bench/upload-million.sh
pid=""; timepid=""

service_cleanup() { [ -n "$pid" ] && kill "$pid" 2>/dev/null; rm -rf "$work"; }

loadavg() { cut -d' ' -f1-3 /proc/loadavg; }

publish_service() {
  if curl -fs "http://127.0.0.1:$port/healthz" >/dev/null 2>&1; then echo "port $port is already in use" >&2; exit 1; fi
  dotnet publish src/QaService.Api -c Release -o "$work/app" --nologo -v quiet >/dev/null
}

start_service() { # start_service NAME: a fresh service and database; peak memory counted from zero
  rm -rf "$work"/bench.db*  # the database, its WAL and its .reports folder
  # shellcheck disable=SC2086  # SERVICE_ARGS is a list of arguments
  /usr/bin/time -v -o "$work/time-$1.txt" dotnet "$work/app/QaService.Api.dll" --urls "http://127.0.0.1:$port" \
    --Storage:ConnectionString="Data Source=$work/bench.db" --Demo:Enabled=false --Limits:MaxPoints=2000000 \
    --Limits:RateLimitPermits=100000000 --Serilog:MinimumLevel:Default=Warning ${SERVICE_ARGS:-} >"$work/service-$1.log" 2>&1 &
  timepid=$!
  for _ in $(seq 1 150); do curl -fs "http://127.0.0.1:$port/healthz" >/dev/null && break; sleep 0.2; done
  # The start-up warm-up (an invented upload run in memory) has finished when its duration is in /metrics.
  for _ in $(seq 1 150); do curl -fs "http://127.0.0.1:$port/metrics" | grep -q '^qaservice_warmup_duration_seconds{' && break; sleep 0.2; done
  pid=$(pgrep -P "$timepid" | head -1)
  [ -n "$pid" ] || { echo "the service did not start:" >&2; cat "$work/service-$1.log" >&2; exit 1; }
}

stop_service() { kill -TERM "$pid" 2>/dev/null || true; wait "$timepid" 2>/dev/null || true; pid=""; }

peak_rss_mib() { awk '/VmHWM/ {print int($2 / 1024)}' "/proc/$pid/status"; }

measure_get() { # measure_get NAME URL SECONDS: status, response size, then wrk's p50/p99 and requests/s, with the load average
  local size
  size=$(curl -s -o /dev/null -w '%{http_code} %{size_download}' "$2")
  wrk -t1 -c4 -d"$3s" --latency "$2" >"$work/wrk-$1.txt"
  printf '%-22s status/bytes=%-14s p50=%-9s p99=%-9s req/s=%-9s load average %s\n' "$1" "${size// //}" \
    "$(awk '$1=="50%" {print $2}' "$work/wrk-$1.txt")" "$(awk '$1=="99%" {print $2}' "$work/wrk-$1.txt")" \
    "$(awk '/Requests\/sec/ {print $2}' "$work/wrk-$1.txt")" "$(loadavg)"
  grep -E "Non-2xx|Socket errors" "$work/wrk-$1.txt" || true
}
