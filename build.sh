#!/usr/bin/env bash
# StringModes set-up and entry point.
#   bash build.sh demo   build, then analyse the bundled demo clip into ./demo-output
#   bash build.sh test   build, then run the whole test suite
#   bash build.sh cli    only build the ready-to-run tool into ./bin/stringmodes (for bench/performance.sh)
# Installs the Debian packages the native runtimes need when run as root; otherwise names them.
set -euo pipefail
cd "$(dirname "$0")"

# libgtk-3-0: OpenCvSharp's Linux runtime links against it. fonts-dejavu-core: figure text.
# ffmpeg: the tests encode H.264/HEVC fixtures with it. chromium: the report is tested in a real browser.
runtime_packages=(libgtk-3-0 fonts-dejavu-core)
test_packages=(ffmpeg chromium)

ensure_packages() {
  local missing=()
  for p in "$@"; do
    dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  if [ "$(id -u)" -eq 0 ] && command -v apt-get >/dev/null; then
    echo "build.sh: installing Debian packages: ${missing[*]}" >&2
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq >/dev/null
    apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
  else
    echo "build.sh: missing system packages: ${missing[*]}; install them with: sudo apt-get install ${missing[*]}" >&2
    exit 1
  fi
}

command -v dotnet >/dev/null || { echo "build.sh: the .NET SDK (dotnet) is not on PATH; install .NET 10 SDK first" >&2; exit 1; }
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1

# The command-line tool, compiled ahead of time (ReadyToRun) for this machine's runtime so that a run does not
# spend its first half second compiling the numeric code; framework-dependent, in ./bin/stringmodes/.
publish_cli() {
  dotnet publish src/StringModes.Cli -c Release --use-current-runtime --self-contained false -p:PublishReadyToRun=true \
    -o bin/stringmodes -v quiet -nologo >/dev/null
}

case "${1:-}" in
  cli)
    # Used by bench/performance.sh: only the ready-to-run tool.
    ensure_packages "${runtime_packages[@]}"
    publish_cli
    ;;
  demo)
    ensure_packages "${runtime_packages[@]}"
    publish_cli
    cli=bin/stringmodes/stringmodes
    clip=demo-clips/nylon-bench/nylon-bench.mp4
    "$cli" analyze "$clip" --rig demo-clips/nylon-bench/rig.json --out demo-output --force
    echo "Report: $(pwd)/demo-output/report.html"
    ;;
  test)
    ensure_packages "${runtime_packages[@]}" "${test_packages[@]}"
    dotnet build StringModes.sln -c Release -v quiet -nologo
    log=$(mktemp)
    status=0
    dotnet test StringModes.sln -c Release --no-build -v quiet --logger "console;verbosity=minimal" | tee "$log" || status=$?
    # One plain closing line for the whole suite.
    passed=$(grep -oE "Passed: +[0-9]+" "$log" | awk '{s += $2} END {print s + 0}')
    failed=$(grep -oE "Failed: +[0-9]+" "$log" | awk '{s += $2} END {print s + 0}')
    rm -f "$log"
    echo "${passed:-0} passed, ${failed:-0} failed"
    exit "$status"
    ;;
  *)
    echo "usage: bash build.sh demo | bash build.sh test | bash build.sh cli" >&2
    exit 2
    ;;
esac
