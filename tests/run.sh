#!/usr/bin/env bash
# The project's test command (README): installs what the tests need, then runs every test project.
# Real components: mosquitto and VictoriaMetrics (Debian packages) and node-opcua (npm, tests/peers)
# are installed here when missing; the test fixtures start each on a free loopback port and stop it.
# Ends with one line "N passed, N failed" read from the TRX result files.
set -euo pipefail
here=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
cd "$here"
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1 DOTNET_SKIP_FIRST_TIME_EXPERIENCE=1

need=()
command -v mosquitto >/dev/null 2>&1 || [ -x /usr/sbin/mosquitto ] || need+=(mosquitto)
command -v mosquitto_pub >/dev/null 2>&1 || need+=(mosquitto-clients)
command -v victoria-metrics >/dev/null 2>&1 || [ -x /usr/bin/victoria-metrics ] || need+=(victoria-metrics)
command -v chromium >/dev/null 2>&1 || need+=(chromium)
if [ ${#need[@]} -gt 0 ]; then
  echo "installing ${need[*]} (Debian packages)"
  if [ "$(id -u)" = 0 ]; then SUDO=""; else SUDO="sudo"; fi
  $SUDO apt-get update -qq >/dev/null
  DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq --no-install-recommends "${need[@]}" >/dev/null
  # The Debian packages start their own services; the tests start private instances instead.
  for svc in mosquitto victoria-metrics; do
    (systemctl stop "$svc" 2>/dev/null || service "$svc" stop 2>/dev/null || true) >/dev/null 2>&1
  done
fi

if [ -f tests/peers/package.json ]; then
  (cd tests/peers && { [ -d node_modules ] || npm ci --no-audit --no-fund --loglevel=error; })
fi

results="$here/TestResults"
rm -rf "$results"
set +e
dotnet test SoftSensor.sln -c Release --logger "trx" --results-directory "$results" "$@" 2>&1 | grep -vE '^\s*$'
status=${PIPESTATUS[0]}
set -e

passed=0; failed=0
# The published program's demo from outside the repository (README "Install").
if bash tests/published-demo.sh; then passed=$((passed + 1)); else failed=$((failed + 1)); fi
for f in "$results"/*.trx; do
  [ -f "$f" ] || continue
  p=$(grep -o '<Counters [^>]*' "$f" | grep -o ' passed="[0-9]*"' | grep -o '[0-9]*' || echo 0)
  q=$(grep -o '<Counters [^>]*' "$f" | grep -o ' failed="[0-9]*"' | grep -o '[0-9]*' || echo 0)
  passed=$((passed + ${p:-0})); failed=$((failed + ${q:-0}))
done
if [ "$status" -ne 0 ] && [ "$failed" -eq 0 ]; then failed=1; echo "dotnet test exited $status (build or run failure)"; fi
echo "$passed passed, $failed failed"
[ "$failed" -eq 0 ]
