#!/usr/bin/env bash
# The store's three targets on one generated dump of at least 10 M reviews (plain TSV), in one run:
#   1. store size against the raw TSV, and against a plain `cut` of the same columns;
#   2. `profile` of one reviewer: median inside a running process and for the whole command with JVM
#      start, against `grep -F` for the same id over the raw files and over the cut;
#   3. `tally --store` time against `tally` alone on the same input.
# Usage: src/test/bench/store-benchmark.sh [ROWS]   (default: 10000000)
# Environment: BENCH_DIR (default: a temp folder, deleted at the end), THREADS (default: nproc).
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/../../.." && pwd)"
rows="${1:-10000000}"
threads="${THREADS:-$(nproc)}"
work="${BENCH_DIR:-$(mktemp -d "${TMPDIR:-/tmp}/voteworth-store-bench.XXXXXX")}"
mkdir -p "$work"
trap 'rm -rf "$work"' EXIT
command -v /usr/bin/time >/dev/null || { echo "needs /usr/bin/time (apt-get install time)" >&2; exit 1; }

echo "building (target-bench-store) ..." >&2
(cd "$here" && mvn -q -B -Dbuild.dir=target-bench-store -DskipTests package test-compile \
    dependency:build-classpath -Dmdep.outputFile="$work/cp.txt" -Dmdep.includeScope=test >&2)
jar="$here/target-bench-store/voteworth.jar"
cp="$here/target-bench-store/test-classes:$here/target-bench-store/classes:$(cat "$work/cp.txt")"
vw_java="${VOTEWORTH_JAVA_OPTS:--Xmx1g}"
secs() { /usr/bin/time -f "%e" -o "$work/t" "$@" > /dev/null 2> "$work/err" || { cat "$work/err" >&2; exit 1; }; cat "$work/t"; }
median() { sort -g | awk '{a[NR]=$1} END {print (NR % 2 ? a[(NR+1)/2] : (a[NR/2] + a[NR/2+1]) / 2)}'; }

d="$work/dump"
echo "generating $rows rows of plain TSV ..." >&2
java -jar "$jar" generate --rows "$rows" --plain --no-malformed --out "$d" --quiet >&2
files=("$d"/*.tsv)
raw=$(cat "${files[@]}" | wc -c)
echo "warming the page cache ..." >&2
cat "${files[@]}" > /dev/null

echo "tally alone, then tally --store (same input, same options) ..." >&2
t_tally=$(secs java $vw_java -jar "$jar" tally "${files[@]}" --out "$work/plain" --threads "$threads" --quiet)
t_store=$(secs java $vw_java -jar "$jar" tally "${files[@]}" --store "$work/store" --threads "$threads" --quiet)
store=$(du -sb --exclude=rejects.tsv --exclude=reconciliation.txt "$work/store" | cut -f1)
reviews=$(awk '/"rows"/ {f = 1} f && /"accepted"/ {gsub(/[^0-9]/, ""); print; exit}' "$work/store/manifest.json")

echo "a plain cut of the same columns ..." >&2
# reviewer, review, item, category, stars, helpful, total, verified, incentivised, date (not the two text columns)
t_cut=$(secs sh -c "cut -f1-9,12 ${files[*]} > '$work/cut.tsv'")
cut_bytes=$(wc -c < "$work/cut.tsv")

echo "picking reviewer ids ..." >&2
# 120 ids of reviewers that appear in the dump, taken at evenly spaced lines (the first 20 warm the JVM up).
step=$(( rows / 400 + 1 ))
awk -F'\t' -v step="$step" 'FNR > 1 && FNR % step == 0 {print $1}' "${files[@]}" | sort -u | shuf -n 120 --random-source=<(yes) > "$work/ids.txt"
read -r lookups med p90 maxms found cpu < <(java $vw_java -cp "$cp" org.voteworth.bench.ProfileLatency "$work/store" "$work/ids.txt")

# The same command with a class-data archive of the classes it loads (made once, by a first run), and C1 only.
java -XX:ArchiveClassesAtExit="$work/profile.jsa" -jar "$jar" profile "$(head -1 "$work/ids.txt")" --store "$work/store" > /dev/null 2>&1
cds="-XX:SharedArchiveFile=$work/profile.jsa -XX:TieredStopAtLevel=1"
cmd_times=(); cds_times=(); grep_times=(); grepcut_times=()
for id in $(sed -n 2,6p "$work/ids.txt"); do
  cmd_times+=("$(secs java $vw_java -jar "$jar" profile "$id" --store "$work/store")")
  cds_times+=("$(secs java $vw_java $cds -jar "$jar" profile "$id" --store "$work/store")")
  grep_times+=("$(secs sh -c "grep -F -- '$id' ${files[*]} || true")")
  grepcut_times+=("$(secs sh -c "grep -F -- '$id' '$work/cut.tsv' || true")")
done
cmd_med=$(printf '%s\n' "${cmd_times[@]}" | median)
cds_med=$(printf '%s\n' "${cds_times[@]}" | median)
grep_med=$(printf '%s\n' "${grep_times[@]}" | median)
grepcut_med=$(printf '%s\n' "${grepcut_times[@]}" | median)

cat <<REPORT
## store benchmark ($(date -u +%Y-%m-%d), load average $(cut -d' ' -f1-3 /proc/loadavg) at the end): $(printf "%'d" "$reviews") reviews in ${#files[@]} plain files, $(printf "%'d" "$raw") bytes; $threads threads

| figure | value | target |
|---|---:|---|
| store size / raw TSV | $(awk "BEGIN {printf \"%.2f %%\", 100 * $store / $raw}") ($(awk "BEGIN {printf \"%.0f\", $store / 1e6}") MB) | at most 5 % |
| plain cut of the same columns / raw TSV | $(awk "BEGIN {printf \"%.2f %%\", 100 * $cut_bytes / $raw}") ($(awk "BEGIN {printf \"%.0f\", $cut_bytes / 1e6}") MB, cut took ${t_cut} s) | |
| profile, in a running process: median (p90, max) of $lookups lookups, wall | ${med} ms (${p90}, ${maxms} ms) | at most 50 ms |
| profile, in a running process: median CPU time of the lookup thread | ${cpu} ms | |
| profile, whole command with JVM start: median of 5 | ${cmd_med} s | at most 1 s |
| the same with a class-data archive and C1 only (\`-XX:SharedArchiveFile -XX:TieredStopAtLevel=1\`) | ${cds_med} s | |
| grep -F for the same id over the raw files: median of 5 | ${grep_med} s | |
| grep -F for the same id over the cut: median of 5 | ${grepcut_med} s | |
| tally --store / tally | $(awk "BEGIN {printf \"%.2f\", $t_store / $t_tally}") (${t_store} s / ${t_tally} s) | at most 1.3 |
REPORT
