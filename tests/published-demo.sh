#!/usr/bin/env bash
# Install check (README "Install"): from a fresh clone of this checkout (its commit plus any files
# changed or added and not yet committed, through a temporary index: the checkout is not touched), the documented publish command, then the published program's demo run
# from a folder outside the repository for a few minutes of simulated time. Prints one line
# "published-demo: N passed, N failed". SOFTSENSOR_SKIP_PUBLISH=1 skips it.
set -euo pipefail
here=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
if [ "${SOFTSENSOR_SKIP_PUBLISH:-}" = 1 ]; then echo "published-demo: skipped (SOFTSENSOR_SKIP_PUBLISH=1)"; exit 0; fi
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
cp "$(git -C "$here" rev-parse --git-dir)/index" "$work/index"
GIT_INDEX_FILE="$work/index" git -C "$here" add -A
tree=$(GIT_INDEX_FILE="$work/index" git -C "$here" write-tree)
ref=$(git -C "$here" commit-tree "$tree" -p HEAD -m "published-demo snapshot")
git clone -q --no-checkout "$here" "$work/clone"
git -C "$work/clone" checkout -q --detach "$ref"
rid=$(dotnet --info | awk '/^ *RID:/ { print $2; exit }')

# The documented command (README "Install"), with the output folder outside the clone.
(cd "$work/clone" && dotnet publish src/SoftSensor.Daemon -c Release -r "$rid" --self-contained -o "$work/softsensor" -v quiet -nologo) >"$work/publish.log" 2>&1 \
  || { cat "$work/publish.log"; echo "published-demo: 0 passed, 1 failed (publish)"; exit 1; }

mkdir "$work/elsewhere"
cd "$work/elsewhere"
set +e
timeout 300 "$work/softsensor/softsensor" demo --for 10m --speed 300 >"$work/demo.out" 2>"$work/demo.err"
code=$?
set -e
fail=0
check() { if grep -qE "$2" "$work/demo.out"; then :; else echo "published-demo: $1 (no line matching '$2')"; fail=1; fi; }
[ "$code" -eq 0 ] || { echo "published-demo: the demo exited $code"; fail=1; }
check "no status page address" '^status page: http://127\.0\.0\.1:[0-9]+'
check "no header with units" 'OUR mmol/\(L·h\)'
check "no good cycle" ' good$'
[ -f "$work/elsewhere/data/definition/demo.json" ] || { echo "published-demo: the definition was not written to data/definition"; fail=1; }
[ -f "$work/softsensor/examples/models/balance-bacterium-glycerol.json" ] || { echo "published-demo: the published folder lacks examples/models"; fail=1; }
if [ "$fail" -ne 0 ]; then
  echo "--- demo stdout (tail)"; tail -20 "$work/demo.out"; echo "--- demo stderr (tail)"; tail -20 "$work/demo.err"
  echo "published-demo: 0 passed, 1 failed"; exit 1
fi
echo "published-demo: 1 passed, 0 failed ($(grep -c ' good$' "$work/demo.out") good cycles from $work/elsewhere)"
