#!/usr/bin/env bash
# The multi-instance run on its own: PostgreSQL, three service instances and HAProxy on loopback, load through
# HAProxy, one instance killed mid-run; prints the figures (docs/deployment.md, "Trying a fleet on one machine").
# The same test runs inside `bash .ci/run` as part of the whole suite. Takes about two minutes.
set -euo pipefail
cd "$(dirname "$0")/.."
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1
bash .ci/haproxy.sh
bash .ci/postgres.sh
source .ci/postgres.env
if [[ "${NATREMIA_FLEET_NO_BUILD:-}" != 1 ]]; then
  dotnet build tests/CdsNatremia.Service.Tests -c Debug -warnaserror
fi

export NATREMIA_FLEET_REPORT="${TMPDIR:-/tmp}/natremia-fleet-report.txt"
rm -f "$NATREMIA_FLEET_REPORT"
status=0
dotnet test tests/CdsNatremia.Service.Tests --no-build -c Debug --filter "FullyQualifiedName~CdsNatremia.Service.Tests.Fleet" || status=$?
echo
echo "Fleet figures:"
cat "$NATREMIA_FLEET_REPORT" 2>/dev/null || echo "(no figures: the test did not run; see above)"
exit $status
