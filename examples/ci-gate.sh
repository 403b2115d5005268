#!/usr/bin/env bash
# The review gate as a CI job calls it: judge every loop of a batch file
# against a criteria profile and leave a JUnit report for the CI server.
#
#   examples/ci-gate.sh [BATCH.json] [REPORT.xml]
#
# Defaults: examples/data/bottling-plant-loops.json (the bottling plant's two
# demo loops and a deliberately fragile retune of the filler pump, so this
# example FAILS on purpose: exit 1) and loopgate-report.xml. Run it from the
# project root. With LOOPGATE_URL set, the check asks that running service
# (--server); otherwise it runs in-process. LOOPGATE_PROFILE picks a criteria
# profile other than the file's own.
#
# In a project that depends on loopgate the job step is the same command;
# --no stops npx from fetching a package of that name from the registry when
# loopgate is not installed locally (the step then fails instead), and --
# hands every later option to loopgate rather than to npm.
set -u

batch="${1:-examples/data/bottling-plant-loops.json}"
report="${2:-loopgate-report.xml}"

args=(check "$batch" --format junit --output "$report")
if [ -n "${LOOPGATE_PROFILE:-}" ]; then args+=(--profile "$LOOPGATE_PROFILE"); fi
if [ -n "${LOOPGATE_URL:-}" ]; then args+=(--server "$LOOPGATE_URL"); fi

echo "+ npx loopgate ${args[*]}"
status=0
npx --no -- loopgate "${args[@]}" || status=$?

case "$status" in
  0) echo "loopgate: exit 0 - every loop passes its criteria (JUnit report: $report)" ;;
  1) echo "loopgate: exit 1 - at least one loop fails its criteria; the findings are in $report" ;;
  2) echo "loopgate: exit 2 - unusable input: the arguments or $batch cannot be checked (nothing was judged)" ;;
  3) echo "loopgate: exit 3 - the check could not run: the server is unreachable or failing" ;;
  *) echo "loopgate: exit $status - unexpected; treat the check as not run" ;;
esac
exit "$status"
