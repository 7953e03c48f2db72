#!/usr/bin/env bash
# Whole-command timings of `rungtone build` on generated 44.1 kHz stereo clips (default 1 s, 60 s and 600 s),
# full report (C files, preview, plots, report.txt/json/html), and of `rungtone --version` against a bare
# `java -version`. Every figure covers the whole process, JVM start included (/usr/bin/time, Debian package
# "time"). Prints per case the median and the lowest wall time, the median processor time (user + system) and
# the highest peak RSS over RUNS runs (default 15) after one warm-up run (page cache, class-data archive).
#
#   ./bench build [SECONDS...]                     this checkout
#   BASELINE=/path/to/other/checkout ./bench build  runs the other checkout's launcher in turn with this one
#                                                   (A B A B ...) and adds the median of the pairwise wall
#                                                   ratios: on a shared, busy machine only figures taken at
#                                                   the same time compare
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/../../.." && pwd)"
cd "$here"
runs="${RUNS:-15}"
baseline="${BASELINE:-}"
mvn -B -q -DskipTests package >/dev/null || { echo "build failed" >&2; exit 1; }
mvn -B -q test-compile >/dev/null
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
# the launchers record their class-data archives before anything is timed
./rungtone --version >/dev/null
[ -n "$baseline" ] && "$baseline/rungtone" --version >/dev/null

# one run of "$@" appended to file $1 as "wall user+system peak-KB"
timed() {
  local out="$1"
  shift
  /usr/bin/time -f "%e %U %S %M" -o "$work/t" "$@" >/dev/null 2>&1 || { echo "failed: $*" >&2; exit 1; }
  awk '{ printf "%.3f %.3f %d\n", $1, $2 + $3, $4 }' "$work/t" >> "$out"
}

median() {
  sort -n | awk '{ v[NR] = $1 } END { printf "%.3f\n", (NR % 2) ? v[(NR + 1) / 2] : (v[NR / 2] + v[NR / 2 + 1]) / 2 }'
}

# prints one row of figures for the runs in file $2, labelled $1
row() {
  local wall cpu
  wall=$(cut -d' ' -f1 "$2" | median)
  cpu=$(cut -d' ' -f2 "$2" | median)
  printf '%-16s %-11s %-11s %-11s %s\n' "$1" "${wall}s" "$(cut -d' ' -f1 "$2" | sort -n | head -1)s" "${cpu}s" \
    "$(( $(cut -d' ' -f3 "$2" | sort -n | tail -1) / 1024 )) MB"
}

# median of the pairwise ratios of the wall times in files $1 and $2
ratio() { paste -d' ' "$1" "$2" | awk '{ printf "%.4f\n", $1 / $4 }' | median; }

# times command line $2 (labelled $1) and, when given, command line $4 (labelled $3) in turn: A B A B ...
compare() {
  local a="$2" b="${4:-}"
  : > "$work/a"
  : > "$work/b"
  eval "$a" >/dev/null 2>&1 || true
  [ -n "$b" ] && { eval "$b" >/dev/null 2>&1 || true; }
  for ((i = 0; i < runs; i++)); do
    eval "timed $work/a $a"
    [ -n "$b" ] && eval "timed $work/b $b"
  done
  row "$1" "$work/a"
  if [ -n "$b" ]; then
    row "  $3" "$work/b"
    printf '%-16s %s\n' "  wall ratio" "$(ratio "$work/a" "$work/b") (median of the pairs' ratios)"
  fi
}

printf '%-16s %-11s %-11s %-11s %s   (%s runs each)\n' case "wall median" "wall min" "cpu median" "peak RSS" "$runs"
for secs in ${*:-1 60 600}; do
  java -cp target/test-classes:target/classes org.rungtone.bench.ClipMaker "$work/clip$secs.wav" "$secs"
  args="$work/clip$secs.wav --bits 8 --rate 16k --dither tpdf --quiet"
  compare "build ${secs}s" "./rungtone build $args --out $work/out" \
    baseline "${baseline:+$baseline/rungtone build $args --out $work/base}"
done
compare "--version" "./rungtone --version" "java -version" "java -version"
