#!/usr/bin/env bash
# Times `voteworth tally` against what a user would otherwise reach for, in one run, on the same files:
# DuckDB (JDBC) twice (the vote sums only, and the same reviewer table written to CSV), cut | awk, and a
# readLine/split/HashMap Java baseline; plus the read-only limits
# (cat > /dev/null, and decompressing the compressed copies). Checks that every method agrees on rows,
# reviewer count and vote sums. Usage: src/test/bench/tally-benchmark.sh [SIZE ...]   (default: 4GB; e.g. 1GB 4GB 16GB)
# Each size is generated, measured and deleted before the next. Prints ready-to-paste Markdown tables: one per
# size, and at the end voteworth's time, CPU and peak memory across the sizes (linearity).
# Environment: BENCH_DIR (default: a temp folder, deleted at the end), THREADS (default: nproc),
# LINESPLIT_MAX_GB (default 4: above it the readLine/split/HashMap baseline, which keeps every id as a String
# in a HashMap and needs about 1 GiB of heap per GB of dump, is left out), VOTEWORTH_JAVA_OPTS.
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/../../.." && pwd)"
sizes=("$@"); [ ${#sizes[@]} -eq 0 ] && sizes=(4GB)
threads="${THREADS:-$(nproc)}"
work="${BENCH_DIR:-$(mktemp -d "${TMPDIR:-/tmp}/voteworth-bench.XXXXXX")}"
mkdir -p "$work"
trap 'rm -rf "$work"' EXIT
command -v /usr/bin/time >/dev/null || { echo "needs /usr/bin/time (apt-get install time)" >&2; exit 1; }
command -v zstd >/dev/null || { echo "needs zstd (apt-get install zstd)" >&2; exit 1; }

echo "building (target-bench) ..." >&2
(cd "$here" && mvn -q -B -Dbuild.dir=target-bench -DskipTests package test-compile \
    dependency:build-classpath -Dmdep.outputFile="$work/cp.txt" -Dmdep.includeScope=test >&2)
jar="$here/target-bench/voteworth.jar"
cp="$here/target-bench/test-classes:$here/target-bench/classes:$(cat "$work/cp.txt")"
vw_java="${VOTEWORTH_JAVA_OPTS:--Xmx384m -XX:+UseSerialGC}"

key() { echo "$1" | tr -c 'A-Za-z0-9\n' _; }
# run NAME INPUT_BYTES CMD...: times CMD; keeps its stdout in $work/KEY.out and "name|bytes|secs|kb|cpu" in $work/rows
run() {
  local name="$1" bytes="$2"; shift 2
  local k; k="$(key "$name")"
  echo "  $name ..." >&2
  /usr/bin/time -f "%e %M %U %S" -o "$work/$k.time" "$@" > "$work/$k.out" 2> "$work/$k.err" || {
    echo "$name failed:" >&2; cat "$work/$k.err" >&2; exit 1; }
  read -r s kb u sy < "$work/$k.time"
  echo "$name|$bytes|$s|$kb|$(echo "$u + $sy" | bc)" >> "$work/rows"
}
# table: MB/s and the ratio to voteworth's rate on the same input (plain, or the compressed part)
table() {
  awk -F'|' '{name[NR]=$1; b[NR]=$2; s[NR]=$3; kb[NR]=$4; cpu[NR]=$5; if ($1=="voteworth tally") vp=$2/$3;
      if ($1 ~ /^voteworth tally \.gz/) vg=$2/$3; if ($1 ~ /^voteworth tally \.zst/) vz=$2/$3}
    END {for (i=1; i<=NR; i++) {r=b[i]/s[i]; ref=(name[i] ~ /gz/ ? vg : name[i] ~ /zst/ ? vz : vp);
      printf "| %-28s | %9.0f | %8.2f | %8.2f | %8.0f | %13.2f | %9.0f |\n", name[i], b[i]/1e6, s[i], cpu[i], r/1e6, r/ref, kb[i]/1024}}' "$work/rows"
}

for size in "${sizes[@]}"; do
  d="$work/dump-$size"; rm -rf "$d" "$work/table"
  echo "generating $size of plain TSV (no malformed rows, so every method must agree exactly) ..." >&2
  java -jar "$jar" generate --size "$size" --plain --no-malformed --out "$d/plain" --quiet >&2
  files=("$d"/plain/*.tsv)
  bytes=$(cat "${files[@]}" | wc -c)
  # A compressed copy of part of the dump: the two largest files, as .gz and .zst.
  mkdir -p "$d/gz" "$d/zst"
  part=($(ls -S "${files[@]}" | head -2))
  for f in "${part[@]}"; do gzip -6 -c "$f" > "$d/gz/$(basename "$f").gz"; zstd -q -3 -T0 -c "$f" > "$d/zst/$(basename "$f").zst"; done
  pbytes=$(cat "${part[@]}" | wc -c)
  echo "warming the page cache ..." >&2
  cat "${files[@]}" "$d"/gz/* "$d"/zst/* > /dev/null; cat "${files[@]}" > /dev/null
  {
    echo "## $size: ${#files[@]} plain files, $(printf "%'d" "$bytes") bytes; compressed part: ${#part[@]} files, $(printf "%'d" "$pbytes") bytes uncompressed; $threads threads"
    echo
    echo "Load average before: $(cut -d' ' -f1-3 /proc/loadavg) (other work on the machine slows every method)."
    echo
    echo "| method                       |  input MB |  seconds |  CPU s   |     MB/s | rate / voteworth's | peak RSS MiB |"
    echo "|------------------------------|----------:|---------:|---------:|---------:|--------------:|----------:|"
  } > "$work/head"
  : > "$work/rows"
  # The read-only limits write to /dev/null themselves: run() keeps a method's stdout in a file, and writing
  # gigabytes there would time the disk instead of reading.
  run "read only: cat > /dev/null" "$bytes" bash -c 'cat "$@" > /dev/null' _ "${files[@]}"
  run "voteworth tally" "$bytes" java $vw_java -jar "$jar" tally "${files[@]}" --out "$d/vw" --threads "$threads" --quiet --format json
  # DuckDB twice: the least an engine must do (group by reviewer, four sums, nothing written), and the job
  # itself (every column of voteworth's reviewer table, one row per reviewer in id order, written to CSV).
  run "DuckDB (JDBC), sums only" "$bytes" java -Xmx8g -cp "$cp" org.voteworth.bench.DuckDbTally "${files[@]}"
  run "DuckDB (JDBC), same table" "$bytes" java -Xmx8g -cp "$cp" org.voteworth.bench.DuckDbTally --table "$d/duck.csv" "${files[@]}"
  linesplit=$(echo "$bytes <= ${LINESPLIT_MAX_GB:-4} * 1050000000" | bc)
  if [ "$linesplit" = 1 ]; then
    run "readLine/split/HashMap" "$bytes" java -Xmx12g -cp "$cp" org.voteworth.bench.LineSplitTally "${files[@]}"
  fi
  run "cut + awk pipeline" "$bytes" bash -c 'tail -q -n +2 "$@" | cut -f1,6,7 | LC_ALL=C awk -F"\t" "{n++; h[\$1]+=\$2; t[\$1]+=\$3} END {r=0; H=0; T=0; for (k in h) {r++; H+=h[k]; T+=t[k]}; printf \"%d %d %d %d\n\", n, r, H, T}"' _ "${files[@]}"
  run "read only: gzip -dc (part)" "$pbytes" bash -c 'cat "$@" | gzip -dc > /dev/null' _ "$d"/gz/*
  run "voteworth tally .gz (part)" "$pbytes" java $vw_java -jar "$jar" tally "$d"/gz/* --out "$d/vwgz" --threads "$threads" --quiet --format json
  run "read only: zstd -dc (part)" "$pbytes" bash -c 'zstd -q -dc "$@" > /dev/null' _ "$d"/zst/*
  run "voteworth tally .zst (part)" "$pbytes" java $vw_java -jar "$jar" tally "$d"/zst/* --out "$d/vwzst" --threads "$threads" --quiet --format json
  # Agreement: rows, reviewers, helpful and total vote sums.
  sums() { awk -F, 'NR>1 {n+=$2; r++; h+=$3; t+=$4} END {printf "%d %d %d %d\n", n, r, h, t}' "$1"; }
  vw="$(sums "$d/vw/reviewers.csv")"
  sums "$d/duck.csv" > "$work/$(key "DuckDB (JDBC), same table").out"
  {
    cat "$work/head"; table
    echo
    echo "Agreement (rows reviewers helpful total): voteworth $vw; DuckDB sums $(cat "$work/$(key "DuckDB (JDBC), sums only").out");" \
         "DuckDB table $(cat "$work/$(key "DuckDB (JDBC), same table").out");" \
         "cut|awk $(cat "$work/$(key "cut + awk pipeline").out")$([ "$linesplit" = 1 ] && echo "; readLine/split $(cat "$work/$(key "readLine/split/HashMap").out")")"
    [ "$linesplit" = 1 ] || echo "(readLine/split/HashMap left out at this size: it needs more heap than LINESPLIT_MAX_GB allows.)"
    echo "Load average after: $(cut -d' ' -f1-3 /proc/loadavg)."
    echo
  } | tee -a "$work/report.md"
  methods=("DuckDB (JDBC), sums only" "DuckDB (JDBC), same table" "cut + awk pipeline"); [ "$linesplit" = 1 ] && methods+=("readLine/split/HashMap")
  for m in "${methods[@]}"; do
    [ "$(cat "$work/$(key "$m").out")" = "$vw" ] || { echo "MISMATCH: $m disagrees with voteworth" >&2; exit 1; }
  done
  grep '^voteworth tally|' "$work/rows" | sed "s/^/$size|${#files[@]}|/" >> "$work/sizes"
  rm -rf "$d"
done
# Linearity: voteworth on the plain dump at every size, time per GB.
{
  echo "## voteworth tally across sizes (plain TSV, $threads threads, default --memory, JVM: $vw_java)"
  echo
  echo "| size | files | input MB | seconds | CPU s | MB/s | seconds per GB | peak RSS MiB |"
  echo "|------|------:|---------:|--------:|------:|-----:|---------------:|-------------:|"
  awk -F'|' '{printf "| %s | %d | %.0f | %.2f | %.2f | %.0f | %.2f | %.0f |\n", $1, $2, $4/1e6, $5, $7, $4/$5/1e6, $5/($4/1e9), $6/1024}' "$work/sizes"
  echo
} | tee -a "$work/report.md"
report="${BENCH_REPORT:-target/bench-report.md}"; mkdir -p "$(dirname "$report")"
echo "report: $work/report.md (copied to $report)" >&2
cp "$work/report.md" "$report"
