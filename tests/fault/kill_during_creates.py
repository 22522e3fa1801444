#!/usr/bin/env python3
"""kill -9 during a burst of creates: every acknowledged (201) assessment must still be readable.

Starts real service processes on loopback, sends a burst of POST /v1/assessments from several
threads, kills the instance with SIGKILL part-way through, then reads back every id that was answered
201 (SQLite: from a restarted instance on the same file; PostgreSQL: from a second instance that was
running all along, and from the restarted first one). Exits 1 if any acknowledged report is missing.

  dotnet build -c Release src/QaService.Api
  tests/fault/kill_during_creates.py --provider sqlite
  tests/fault/kill_during_creates.py --provider sqlite --fixes 8000 --threads 4   # large reports: files beside the database
  tests/fault/kill_during_creates.py --provider postgres --connection "Host=127.0.0.1;Port=55432;Database=qaservice;Username=postgres"

Bounded: at most --creates requests and --seconds of burst; loopback only.
"""
import argparse, json, os, signal, subprocess, sys, tempfile, threading, time, urllib.error, urllib.request

ROOT = os.path.dirname(os.path.dirname(os.path.dirname(os.path.abspath(__file__))))
DLL = os.path.join(ROOT, "src/QaService.Api/bin/Release/net10.0/QaService.Api.dll")

MARKS = 24


def body(fixes):
    """24 invented valves and `fixes` fixes on them; 24 is small (group commit), ~8,000 makes a report above 1 MiB (a file beside SQLite)."""
    return json.dumps({
        "title": "kill test, invented Larkspur Hollow valves",
        "marks": {"crs": "EPSG:32633", "heights": "ellipsoidal", "points": [
            {"id": f"M{i}", "e": 500000.0 + 40 * i, "n": 5400000.0 + 25 * (i % 5), "h": 200.0} for i in range(MARKS)]},
        "fixes": {"crs": "EPSG:32633", "heights": "ellipsoidal", "points": [
            {"id": f"F{i}", "mark": f"M{i % MARKS}", "e": 500000.012 + 40 * (i % MARKS), "n": 5400000.0 - 0.008 + 25 * (i % MARKS % 5), "h": 200.03}
            for i in range(fixes)]},
        "spec": {"standard": "nssda", "horizontal": 0.5, "vertical": 1.0},
    }).encode()


BODY = body(MARKS)


def in_use(port):
    try:
        urllib.request.urlopen(f"http://127.0.0.1:{port}/", timeout=1)
        return True
    except urllib.error.HTTPError:
        return True
    except (urllib.error.URLError, ConnectionError, OSError):
        return False


def start(port, settings, workdir, log):
    if in_use(port):
        raise SystemExit(f"port {port} is in use: choose --port")
    env = dict(os.environ)
    for key, value in settings.items():
        env[key.replace(":", "__")] = value
    env["Urls"] = f"http://127.0.0.1:{port}"
    env["Demo__Enabled"] = "false"
    env["Limits__RateLimitPermits"] = "1000000"
    process = subprocess.Popen(["dotnet", DLL], cwd=workdir, env=env, stdout=log, stderr=subprocess.STDOUT)
    deadline = time.time() + 60
    while time.time() < deadline:
        try:
            with urllib.request.urlopen(f"http://127.0.0.1:{port}/readyz", timeout=2) as r:
                if r.status == 200:
                    return process
        except (urllib.error.URLError, ConnectionError, OSError):
            time.sleep(0.2)
    process.kill()
    raise SystemExit(f"instance on port {port} did not become ready; see {log.name}")


def post(port):
    request = urllib.request.Request(f"http://127.0.0.1:{port}/v1/assessments", data=BODY,
                                     headers={"Content-Type": "application/json"}, method="POST")
    with urllib.request.urlopen(request, timeout=10) as r:
        return r.status, r.headers["Location"], r.read()


def get(port, location):
    try:
        with urllib.request.urlopen(f"http://127.0.0.1:{port}{location}", timeout=10) as r:
            return r.status, r.read()
    except urllib.error.HTTPError as e:
        return e.code, b""


def main():
    parser = argparse.ArgumentParser()
    parser.add_argument("--provider", choices=["sqlite", "postgres"], default="sqlite")
    parser.add_argument("--connection", default=os.environ.get("QASERVICE_TEST_POSTGRES", ""))
    parser.add_argument("--creates", type=int, default=3000, help="most POSTs in the burst")
    parser.add_argument("--threads", type=int, default=8)
    parser.add_argument("--kill-after", type=float, default=4.0, help="seconds into the burst")
    parser.add_argument("--seconds", type=float, default=20.0, help="longest burst")
    parser.add_argument("--port", type=int, default=58191, help="first of two free loopback ports")
    parser.add_argument("--fixes", type=int, default=MARKS, help="fixes per request (8000: reports above 1 MiB, kept as files by SQLite)")
    args = parser.parse_args()
    global BODY
    BODY = body(args.fixes)
    if not os.path.exists(DLL):
        raise SystemExit(f"{DLL} is missing: run `dotnet build -c Release src/QaService.Api` first")

    workdir = tempfile.mkdtemp(prefix="qaservice-kill-")
    log = open(os.path.join(workdir, "service.log"), "w")
    if args.provider == "sqlite":
        settings = {"Storage:Provider": "sqlite", "Storage:ConnectionString": f"Data Source={workdir}/kill.db"}
    else:
        if not args.connection:
            raise SystemExit("--connection (or QASERVICE_TEST_POSTGRES) is required for postgres")
        settings = {"Storage:Provider": "postgres", "Storage:ConnectionString": args.connection}

    victim = start(args.port, settings, workdir, log)
    witness = start(args.port + 1, settings, workdir, log) if args.provider == "postgres" else None

    acknowledged, failed, lock = [], [0], threading.Lock()
    started = time.time()
    stop = threading.Event()
    killed = threading.Event()

    def burst():
        while not stop.is_set() and time.time() - started < args.seconds:
            with lock:
                if len(acknowledged) + failed[0] >= args.creates:
                    return
            try:
                status, location, body = post(args.port)
                if status == 201:
                    with lock:
                        acknowledged.append((location, body))
            except (urllib.error.URLError, ConnectionError, OSError, TimeoutError):
                with lock:
                    failed[0] += 1
                if killed.is_set():
                    return

    threads = [threading.Thread(target=burst) for _ in range(args.threads)]
    for t in threads:
        t.start()
    time.sleep(args.kill_after)
    killed.set()
    os.kill(victim.pid, signal.SIGKILL)
    killed_at = time.time() - started
    victim.wait()
    for t in threads:
        t.join()
    stop.set()
    print(f"provider={args.provider} killed with SIGKILL at {killed_at:.2f} s; acknowledged (201) = {len(acknowledged)}, "
          f"cut off by the kill (no answer) = {failed[0]}")

    readers = []
    if witness is not None:
        readers.append(("second instance (ran throughout)", args.port + 1))
    restarted = start(args.port, settings, workdir, log)
    readers.append(("restarted first instance", args.port))

    lost_any = False
    for name, port in readers:
        missing = [loc for loc, body in acknowledged if get(port, loc) != (200, body)]
        print(f"  read back through {name}: {len(acknowledged) - len(missing)} of {len(acknowledged)} identical, {len(missing)} missing or changed")
        lost_any |= bool(missing)
    for process in (restarted, witness):
        if process is not None:
            process.terminate()
            process.wait(timeout=30)
    print("RESULT:", "LOST acknowledged reports" if lost_any else "no acknowledged report lost", f"(logs in {workdir})")
    sys.exit(1 if lost_any or not acknowledged else 0)


if __name__ == "__main__":
    main()
