#!/usr/bin/env bash
# The one command that passes the tests on a fresh machine:
#   bash tests/run.sh            install what is missing, build, run every test tier, print the benchmarks
#   bash tests/run.sh --no-bench skip the benchmark tier (quicker while developing)
# Test tiers: unit and integration tests (xunit, with a real Mosquitto broker, SQLite, PostgreSQL, Python reference
# libraries, headless Chromium where a test needs them), then the benchmarks, which print figures and ratios.
set -euo pipefail
cd "$(dirname "$0")/.."

run_bench=1
for arg in "$@"; do
  case "$arg" in
    --no-bench) run_bench=0 ;;
    *) echo "unknown option: $arg (known: --no-bench)"; exit 2 ;;
  esac
done

# Debian packages the tests use: an independent MQTT broker and clients, PDF text extraction, an independent
# TIFF writer, PostgreSQL (fleet store), the Python reference libraries (for /usr/bin/python3), a headless browser, fonts.
debian_packages=(mosquitto mosquitto-clients postgresql poppler-utils imagemagick python3-scipy python3-skimage
  python3-shapely python3-opencv python3-pil chromium chromium-driver fonts-dejavu-core openssl)

missing=()
for p in "${debian_packages[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if [ ${#missing[@]} -gt 0 ]; then
  if [ "$(id -u)" = 0 ]; then
    echo "installing Debian packages: ${missing[*]}"
    apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
  else
    echo "missing Debian packages: ${missing[*]}"
    echo "install them with: sudo apt-get install ${missing[*]}"
    exit 2
  fi
fi
# The Debian broker and PostgreSQL must not run as system services here: tests start their own on free loopback ports.
if command -v systemctl >/dev/null 2>&1; then systemctl stop mosquitto postgresql >/dev/null 2>&1 || true; fi

# One throw-away PostgreSQL cluster for the whole run (temporary data folder, free loopback port), stopped at exit.
# Tests that need PostgreSQL read RUNWATCH_TEST_POSTGRES and create their own databases in it; a test that must
# restart the server starts a cluster of its own the same way (tests/postgres-cluster.sh).
pg_dir=$(mktemp -d /tmp/runwatch-test-pg-XXXXXX)
trap 'bash tests/postgres-cluster.sh stop "$pg_dir"' EXIT
echo "== PostgreSQL (temporary cluster in $pg_dir)"
RUNWATCH_TEST_POSTGRES=$(bash tests/postgres-cluster.sh start "$pg_dir" | tail -1) \
  || { echo "PostgreSQL could not be started (message above); the store and fleet tests need it, so the run stops here"; exit 2; }
export RUNWATCH_TEST_POSTGRES

export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1
export RUNWATCH_REFERENCE_PYTHON=/usr/bin/python3

echo "== build"
dotnet build RunWatch.sln -c Release -nologo -v quiet

results_dir=$(mktemp -d)
total_passed=0; total_failed=0; total_skipped=0; status=0
for project in tests/*.Tests/*.csproj; do
  name=$(basename "$project" .csproj)
  echo "== test $name"
  log="$results_dir/$name.log"
  if dotnet test "$project" -c Release --no-build -nologo --logger "console;verbosity=minimal" >"$log" 2>&1; then :; else status=1; fi
  line=$(grep -E "(Passed|Failed)!.*Total:" "$log" | tail -1 || true)
  if [ -z "$line" ]; then
    echo "   no summary from $name:"; tail -40 "$log"; status=1; continue
  fi
  case "$line" in Failed!*) grep -vE "^\s*$" "$log" | grep -vE "(Passed|Failed)!.*Total:" | tail -80 ;; esac
  echo "   $line"
  p=$(sed -E 's/.*Passed: *([0-9]+).*/\1/' <<<"$line"); f=$(sed -E 's/.*Failed: *([0-9]+).*/\1/' <<<"$line")
  s=$(sed -E 's/.*Skipped: *([0-9]+).*/\1/' <<<"$line")
  total_passed=$((total_passed + p)); total_failed=$((total_failed + f)); total_skipped=$((total_skipped + s))
done

if [ "$run_bench" = 1 ]; then
  echo "== benchmarks (figures and ratios; reported, never pass/fail on time)"
  dotnet run -c Release --no-build --project tests/RunWatch.Benchmarks -- --quick || status=1
fi

echo
echo "Tests: $total_passed passed, $total_failed failed, $total_skipped skipped"
[ "$total_failed" = 0 ] || status=1
exit $status
