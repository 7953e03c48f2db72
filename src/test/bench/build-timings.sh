#!/usr/bin/env bash
# Whole-command timings of `rungtone build` on generated 60 s and 600 s 44.1 kHz stereo clips.
# Prints wall time (median of 5 runs) and peak RSS per clip. Needs /usr/bin/time (Debian package "time").
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/../../.." && pwd)"
cd "$here"
mvn -B -q -DskipTests package >/dev/null || { echo "build failed" >&2; exit 1; }
mvn -B -q test-compile >/dev/null
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
lengths="${*:-60 600}"
printf '%-10s %-12s %-12s %-12s %s\n' clip "wall median" "wall min" "peak RSS" "input samples/s (median)"
for secs in $lengths; do
  java -cp target/test-classes:target/classes org.rungtone.bench.ClipMaker "$work/clip$secs.wav" "$secs"
  times=()
  rss=0
  for i in 1 2 3 4 5 6; do
    /usr/bin/time -f "%e %M" -o "$work/t" ./rungtone build \
      "$work/clip$secs.wav" --bits 8 --rate 16k --dither tpdf --out "$work/out" --quiet
    read -r wall kb < "$work/t"
    [ "$i" -gt 1 ] && times+=("$wall")   # first run is a warm-up (page cache)
    [ "$kb" -gt "$rss" ] && rss=$kb
  done
  sorted=($(printf '%s\n' "${times[@]}" | sort -n))
  med=${sorted[2]}
  rate=$(awk -v s="$secs" -v t="$med" 'BEGIN { printf "%.1f M", s * 44100 * 2 / t / 1e6 }')
  printf '%-10s %-12s %-12s %-12s %s\n' "${secs}s" "${med}s" "${sorted[0]}s" "$((rss / 1024)) MB" "$rate"
done
