#!/usr/bin/env bash
# Performance benchmark: synthesises a 1920x1080, 240 fps clip with 11 marks (MPEG-4) of 3 s and 10 s, then measures
# decode-only time through the same decoder, `stringmodes analyze` wall time and peak memory (RSS).
# Prints analyze/decode, the peak RSS and the numeric stages' share of the analyze time for both clips. Usage: bash bench/performance.sh [runs]
set -euo pipefail
cd "$(dirname "$0")/.."
runs=${1:-3}
command -v /usr/bin/time >/dev/null || { echo "performance.sh: needs GNU time (apt-get install time)" >&2; exit 1; }
bash build.sh cli   # the same ready-to-run tool that `bash build.sh demo` builds
dotnet build bench/StringModes.Bench.Tracking -c Release -v quiet -nologo >/dev/null
cli=bin/stringmodes/stringmodes
bench=bench/StringModes.Bench.Tracking/bin/Release/net10.0/StringModes.Bench.Tracking
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
for seconds in 3 10; do
  cat > "$work/scene-$seconds.json" <<JSON
{
  "description": "performance benchmark (invented): 1.2 m string, 11 marks, 1080p at 240 fps",
  "string": { "length_m": 1.2, "fundamental_hz": 21, "pluck": { "position_fraction": 0.27, "peak_m": 0.008, "mode_count": 5 },
              "decay": { "s0_per_s": 0.3, "s2_s": 0.0002 } },
  "image": { "width_px": 1920, "height_px": 1080, "end0_px": [120, 540], "end1_px": [1800, 560] },
  "marks": { "count": 11, "radius_px": 6, "colour_rgb": [30, 30, 35] },
  "background": { "colour_rgb": [170, 165, 150], "texture_contrast": 0.15 },
  "camera": { "capture_fps": 240, "duration_s": $seconds, "exposure_s": 0.001, "subframes": 4, "noise_dn": 2 }
}
JSON
  "$cli" synth "$work/scene-$seconds.json" --out "$work/clip-$seconds.mp4" >/dev/null
done
median() { sort -g | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }
for seconds in 3 10; do
  clip="$work/clip-$seconds.mp4"
  decode=(); analyze=(); rss=(); share=()
  "$bench" decode "$clip" >/dev/null   # warm-up: file cache and native libraries
  for r in $(seq "$runs"); do
    decode+=("$("$bench" decode "$clip" | awk '{print $4}')")
    # --debug prints each stage's wall time on stderr; the numeric stages' share of the whole run is kept.
    /usr/bin/time -f "%e %M" -o "$work/time" "$cli" analyze "$clip" --length 1.2 --linear-density 1g/m --out "$work/out" --force --debug >/dev/null 2>"$work/stderr"
    read -r wall kb < "$work/time"
    numeric=$(grep -oE "timing: numeric stages [^0-9]*[0-9.]+ s" "$work/stderr" | grep -oE "[0-9.]+ s$" | awk '{print $1}')
    analyze+=("$wall"); rss+=("$kb"); share+=("$(awk -v n="$numeric" -v w="$wall" 'BEGIN {printf "%.4f", n / w}')")
  done
  d=$(printf '%s\n' "${decode[@]}" | median); a=$(printf '%s\n' "${analyze[@]}" | median); m=$(printf '%s\n' "${rss[@]}" | median)
  n=$(printf '%s\n' "${share[@]}" | median)
  echo "clip ${seconds} s: decode-only ${d} s, analyze ${a} s, analyze/decode $(awk -v a="$a" -v d="$d" 'BEGIN {printf "%.2f", a / d}'), peak RSS $((m / 1024)) MB, numeric stages $(awk -v n="$n" 'BEGIN {printf "%.1f", 100 * n}') % of analyze (median of $runs)"
done
