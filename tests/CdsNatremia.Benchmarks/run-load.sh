#!/usr/bin/env bash
# Side-by-side load run (docs/performance.md): the real service and the bare ceiling endpoint, each driven by wrk with
# the typical patient-view request at 32 concurrent connections on loopback. Prints the throughput ratio service/bare
# and p50/p99 of each, samples the service's resident memory from /proc, writes summary.json and summary.md, and
# stops both servers at the end (also on Ctrl-C or error). Traffic goes to 127.0.0.1 only.
#
# Usage: tests/CdsNatremia.Benchmarks/run-load.sh [--duration S] [--soak] [--connections N] [--threads N]
#                                                  [--sample S] [--out DIR] [--no-build]
#   --duration S     measured seconds per endpoint (default 30)
#   --soak           the service runs 300 s (memory steadiness, RSS sampled every 5 s); the bare endpoint keeps --duration
#   --connections N  concurrent connections (default 32)      --threads N  wrk threads (default 2)
#   --sample S       RSS sampling interval in seconds (default 5)
#   --out DIR        output folder (default tests/CdsNatremia.Benchmarks/results/<UTC time>)
#   --no-build       use the existing Release build
# Environment: SERVICE_PORT (default 5180), BARE_PORT (default 5181), WARMUP (seconds, default 10).
set -euo pipefail

ROOT="$(cd "$(dirname "$0")/../.." && pwd)"
DURATION=30
SERVICE_DURATION=""
CONNECTIONS=32
THREADS=2
SAMPLE=5
OUT=""
BUILD=1
SERVICE_PORT="${SERVICE_PORT:-5180}"
BARE_PORT="${BARE_PORT:-5181}"
WARMUP="${WARMUP:-10}"

while [[ $# -gt 0 ]]; do
  case "$1" in
    --duration) DURATION="$2"; shift 2 ;;
    --soak) SERVICE_DURATION=300; shift ;;
    --connections) CONNECTIONS="$2"; shift 2 ;;
    --threads) THREADS="$2"; shift 2 ;;
    --sample) SAMPLE="$2"; shift 2 ;;
    --out) OUT="$2"; shift 2 ;;
    --no-build) BUILD=0; shift ;;
    -h|--help) sed -n '2,17p' "$0"; exit 0 ;;
    *) echo "unknown option: $1 (see --help)" >&2; exit 2 ;;
  esac
done
SERVICE_DURATION="${SERVICE_DURATION:-$DURATION}"
for n in "$DURATION" "$SERVICE_DURATION" "$CONNECTIONS" "$THREADS" "$SAMPLE" "$WARMUP" "$SERVICE_PORT" "$BARE_PORT"; do
  [[ "$n" =~ ^[0-9]+$ && "$n" -gt 0 ]] || { echo "numbers must be positive integers (got '$n')" >&2; exit 2; }
done
[[ "$SERVICE_DURATION" -le 3600 && "$DURATION" -le 3600 ]] || { echo "a run is limited to 3600 s" >&2; exit 2; }
command -v wrk >/dev/null || { echo "wrk is missing: apt-get install -y wrk" >&2; exit 2; }
command -v curl >/dev/null || { echo "curl is missing: apt-get install -y curl" >&2; exit 2; }
command -v python3 >/dev/null || { echo "python3 is missing (used for the summary): apt-get install -y python3" >&2; exit 2; }

OUT="${OUT:-$ROOT/tests/CdsNatremia.Benchmarks/results/$(date -u +%Y%m%dT%H%M%SZ)}"
mkdir -p "$OUT"
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1

SERVICE_BIN="$ROOT/src/CdsNatremia.Service/bin/Release/net10.0"
BARE_BIN="$ROOT/tests/CdsNatremia.Benchmarks.Bare/bin/Release/net10.0"
BENCH_BIN="$ROOT/tests/CdsNatremia.Benchmarks/bin/Release/net10.0"
LUA="$ROOT/tests/CdsNatremia.Benchmarks/post-request.lua"

if [[ "$BUILD" == 1 ]]; then
  echo "== Building Release"
  dotnet build "$ROOT/tests/CdsNatremia.Benchmarks/CdsNatremia.Benchmarks.csproj" -c Release -nologo -v q
  dotnet build "$ROOT/tests/CdsNatremia.Benchmarks.Bare/CdsNatremia.Benchmarks.Bare.csproj" -c Release -nologo -v q
fi

PIDS=()
cleanup() {
  for pid in "${PIDS[@]}"; do
    kill "$pid" 2>/dev/null || true
  done
  for pid in "${PIDS[@]}"; do
    for _ in $(seq 1 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.2; done
    kill -9 "$pid" 2>/dev/null || true
  done
}
trap cleanup EXIT INT TERM

for port in "$SERVICE_PORT" "$BARE_PORT"; do
  if curl -s -o /dev/null --max-time 2 "http://127.0.0.1:$port/"; then
    echo "port $port on 127.0.0.1 is already in use; set SERVICE_PORT / BARE_PORT" >&2; exit 2
  fi
done

echo "== Writing the typical request"
dotnet "$BENCH_BIN/CdsNatremia.Benchmarks.dll" write-request "$OUT/request.json"

# The service: Release build, its appsettings.json, Development environment (no client token needed), warnings-only
# logging as in production, audit storage and everything else on its defaults. Loopback only.
echo "== Starting the service on 127.0.0.1:$SERVICE_PORT and the bare endpoint on 127.0.0.1:$BARE_PORT"
(cd "$SERVICE_BIN" && ASPNETCORE_ENVIRONMENT=Development Logging__LogLevel__Default=Warning \
  exec dotnet CdsNatremia.Service.dll --urls "http://127.0.0.1:$SERVICE_PORT") >"$OUT/service.log" 2>&1 &
SERVICE_PID=$!
PIDS+=("$SERVICE_PID")
(cd "$BARE_BIN" && ASPNETCORE_ENVIRONMENT=Production \
  exec dotnet CdsNatremia.Benchmarks.Bare.dll --urls "http://127.0.0.1:$BARE_PORT") >"$OUT/bare.log" 2>&1 &
BARE_PID=$!
PIDS+=("$BARE_PID")

wait_ready() {
  local port="$1" pid="$2" name="$3"
  for _ in $(seq 1 120); do
    kill -0 "$pid" 2>/dev/null || { echo "$name exited during start-up; see $OUT/$name.log" >&2; exit 1; }
    curl -sf -o /dev/null --max-time 2 "http://127.0.0.1:$port/healthz" && return 0
    sleep 0.5
  done
  echo "$name did not answer /healthz within 60 s; see $OUT/$name.log" >&2
  exit 1
}
wait_ready "$SERVICE_PORT" "$SERVICE_PID" service
wait_ready "$BARE_PORT" "$BARE_PID" bare

# One checked request each: HTTP 200 with at least one card, before any load.
for target in "service:$SERVICE_PORT" "bare:$BARE_PORT"; do
  name="${target%%:*}"; port="${target##*:}"
  code=$(curl -s -o "$OUT/$name-response.json" -w '%{http_code}' --max-time 10 -H 'Content-Type: application/json' \
    --data-binary @"$OUT/request.json" "http://127.0.0.1:$port/cds-services/natremia-chart-review")
  if [[ "$code" != 200 ]] || ! grep -q '"cards":\[{' "$OUT/$name-response.json"; then
    echo "$name answered HTTP $code without a card; see $OUT/$name-response.json" >&2; exit 1
  fi
done
echo "   both answer HTTP 200 with a card ($(wc -c <"$OUT/service-response.json") bytes from the service)"

sample_rss() {
  local pid="$1" file="$2" seconds="$3" start
  start=$(date +%s)
  echo "elapsed_s,rss_kib" >"$file"
  while kill -0 "$pid" 2>/dev/null && (( $(date +%s) - start <= seconds )); do
    awk -v t="$(( $(date +%s) - start ))" '/^VmRSS:/ { print t "," $2 }' "/proc/$pid/status" >>"$file" 2>/dev/null || true
    sleep "$SAMPLE"
  done
}

run_wrk() {
  local name="$1" port="$2" pid="$3" seconds="$4"
  local url="http://127.0.0.1:$port/cds-services/natremia-chart-review"
  echo "== $name: warm-up ${WARMUP} s, then ${seconds} s at $CONNECTIONS connections, $THREADS wrk threads"
  WRK_BODY_FILE="$OUT/request.json" timeout $((WARMUP + 30)) \
    wrk -t"$THREADS" -c"$CONNECTIONS" -d"${WARMUP}s" -s "$LUA" "$url" >"$OUT/$name-warmup.txt"
  sample_rss "$pid" "$OUT/$name-rss.csv" "$seconds" &
  local sampler=$!
  WRK_BODY_FILE="$OUT/request.json" timeout $((seconds + 60)) \
    wrk -t"$THREADS" -c"$CONNECTIONS" -d"${seconds}s" --timeout 10s --latency -s "$LUA" "$url" | tee "$OUT/$name-wrk.txt" | grep -v '^WRK_JSON'
  kill "$sampler" 2>/dev/null || true
  wait "$sampler" 2>/dev/null || true
}

run_wrk service "$SERVICE_PORT" "$SERVICE_PID" "$SERVICE_DURATION"
run_wrk bare "$BARE_PORT" "$BARE_PID" "$DURATION"

# The machine, for the record.
{
  echo "nproc=$(nproc)"
  echo "memory=$(awk '/MemTotal/ { printf "%.1f GiB", $2 / 1048576 }' /proc/meminfo)"
  echo "cpu=$(awk -F': ' '/model name/ { print $2; exit }' /proc/cpuinfo)"
  echo "dotnet=$(dotnet --version)"
  echo "wrk=$(wrk -v 2>&1 | head -1)"
  echo "loadavg_at_end=$(cut -d' ' -f1-3 /proc/loadavg)"
} >"$OUT/machine.txt"

python3 - "$OUT" "$CONNECTIONS" "$THREADS" "$SERVICE_DURATION" "$DURATION" <<'PY'
import csv, json, sys, pathlib
out, connections, threads, service_s, bare_s = pathlib.Path(sys.argv[1]), int(sys.argv[2]), int(sys.argv[3]), int(sys.argv[4]), int(sys.argv[5])

def wrk(name):
    for line in (out / f"{name}-wrk.txt").read_text().splitlines():
        if line.startswith("WRK_JSON "):
            d = json.loads(line[len("WRK_JSON "):])
            d["requests_per_s"] = d["requests"] / (d["duration_us"] / 1e6)
            d["errors_total"] = sum(d["errors"].values())
            return d
    raise SystemExit(f"no WRK_JSON line in {name}-wrk.txt")

def rss(name):
    rows = [(int(r["elapsed_s"]), int(r["rss_kib"])) for r in csv.DictReader(open(out / f"{name}-rss.csv"))]
    if not rows:
        return None
    mib = [(t, k / 1024) for t, k in rows]
    after = [m for t, m in mib if t >= min(60, mib[-1][0] // 2)] or [m for _, m in mib]
    return {"samples": len(mib), "first_mib": round(mib[0][1], 1), "last_mib": round(mib[-1][1], 1),
            "max_mib": round(max(m for _, m in mib), 1), "settled_mib": round(after[0], 1),
            "growth_after_settling_mib": round(mib[-1][1] - after[0], 1)}

service, bare = wrk("service"), wrk("bare")
machine = dict(l.split("=", 1) for l in (out / "machine.txt").read_text().splitlines() if "=" in l)
ratio = service["requests_per_s"] / bare["requests_per_s"] if bare["requests_per_s"] else 0.0
summary = {"connections": connections, "wrk_threads": threads, "service_seconds": service_s, "bare_seconds": bare_s,
           "machine": machine, "service": service, "bare": bare, "throughput_ratio": round(ratio, 3),
           "service_rss": rss("service"), "bare_rss": rss("bare"),
           "targets": {"throughput_ratio_at_least_0_20": ratio >= 0.20,
                       "service_p99_at_most_40_ms": service["latency_us"]["p99"] <= 40000,
                       "no_errors": service["errors_total"] == 0 and bare["errors_total"] == 0}}
(out / "summary.json").write_text(json.dumps(summary, indent=2) + "\n")

ms = lambda us: f"{us / 1000:.2f}"
lines = [f"# Load run ({connections} connections, {threads} wrk threads, loopback)", "",
         f"Machine: {machine.get('nproc')} cores, {machine.get('memory')}, {machine.get('cpu')}; .NET SDK {machine.get('dotnet')}; "
         f"load average at end {machine.get('loadavg_at_end')}.", "",
         "| endpoint | seconds | requests/s | p50 ms | p90 ms | p99 ms | max ms | errors |", "|---|---|---|---|---|---|---|---|"]
for name, d, s in (("service", service, service_s), ("bare", bare, bare_s)):
    l = d["latency_us"]
    lines.append(f"| {name} | {s} | {d['requests_per_s']:.0f} | {ms(l['p50'])} | {ms(l['p90'])} | {ms(l['p99'])} | {ms(l['max'])} | {d['errors_total']} |")
lines += ["", f"Throughput ratio service / bare: **{ratio:.3f}** (target ≥ 0.20, issue 19: {'met' if ratio >= 0.20 else 'not met'}).",
          f"Service p99: **{ms(service['latency_us']['p99'])} ms** (target ≤ 40 ms, issue 19: {'met' if service['latency_us']['p99'] <= 40000 else 'not met'})."]
r = summary["service_rss"]
if r:
    lines.append(f"Service RSS: {r['samples']} samples, settled {r['settled_mib']} MiB, last {r['last_mib']} MiB, max {r['max_mib']} MiB, "
                 f"growth after settling {r['growth_after_settling_mib']} MiB (samples in service-rss.csv).")
(out / "summary.md").write_text("\n".join(lines) + "\n")
print("\n".join(lines))
PY
echo "== Results in $OUT (summary.md, summary.json, *-wrk.txt, *-rss.csv)"
