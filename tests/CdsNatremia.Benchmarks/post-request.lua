-- wrk script for run-load.sh: POSTs the typical CDS Hooks request (the file named by WRK_BODY_FILE) and, when done,
-- prints one machine-readable line (WRK_JSON {...}) with counts and latency percentiles in microseconds.
local path = os.getenv("WRK_BODY_FILE")
assert(path, "set WRK_BODY_FILE to the request JSON file")
local file = assert(io.open(path, "rb"))
wrk.method = "POST"
wrk.body = file:read("*a")
file:close()
wrk.headers["Content-Type"] = "application/json"

function done(summary, latency, requests)
  local e = summary.errors
  io.write(string.format(
    'WRK_JSON {"requests":%d,"duration_us":%d,"bytes":%d,"errors":{"connect":%d,"read":%d,"write":%d,"status":%d,"timeout":%d},' ..
    '"latency_us":{"mean":%.1f,"p50":%d,"p90":%d,"p99":%d,"max":%d}}\n',
    summary.requests, summary.duration, summary.bytes, e.connect, e.read, e.write, e.status, e.timeout,
    latency.mean, latency:percentile(50), latency:percentile(90), latency:percentile(99), latency.max))
end
