#!/usr/bin/env bash
# Whole-process timing and peak memory of `rheoside trend` over a generated year of journals
# (invented plant, bundled demo site), at 1/4, 1/2 and all of the year.
#
#   benches/trend_year.sh [DAYS]      (default 365; needs /usr/bin/time, e.g. apt-get install time)
#
# The journals are written by the trend bench binary (`cargo bench --bench trend -- --write-year
# DIR DAYS`), so no extra binary target is needed. Numbers are printed, never asserted. On a
# shared machine quote user+sys (CPU) beside wall time, and the load average printed with it.
set -euo pipefail
cd "$(dirname "$0")/.."

days="${1:-365}"
[ -x /usr/bin/time ] || { echo "needs /usr/bin/time (apt-get install time)" >&2; exit 2; }

cargo build --release --quiet
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT

for part in 4 2 1; do
    d=$(( days / part ))
    dir="$tmp/year-$d"
    cargo bench --quiet --bench trend -- --write-year "$dir" "$d" | tail -1
    bytes=$(du -cb "$dir"/*.jsonl | tail -1 | cut -f1)
    records=$(cat "$dir"/*.jsonl | wc -l)
    # Warm the page cache once so the runs compare reading, not the disk.
    cat "$dir"/*.jsonl > /dev/null
    best=""
    for run in 1 2 3; do
        /usr/bin/time -v -o "$tmp/time.txt" target/release/rheoside --log-dir "$dir" \
            trend --product chilli-sauce --since "$(( days + 35 ))d" > "$tmp/out.txt"
        wall=$(grep "Elapsed (wall clock)" "$tmp/time.txt" | awk '{print $NF}')
        user=$(grep "User time" "$tmp/time.txt" | awk '{print $NF}')
        sys=$(grep "System time" "$tmp/time.txt" | awk '{print $NF}')
        rss=$(grep "Maximum resident set size" "$tmp/time.txt" | awk '{print $NF}')
        echo "  run $run: wall $wall, user ${user} s, sys ${sys} s, max RSS ${rss} KiB, load $(cut -d' ' -f1 /proc/loadavg)"
        best="wall $wall, cpu $user+$sys s, RSS $rss KiB"
    done
    rows=$(grep -c -E '^(OUT|   ) 20' "$tmp/out.txt" || true)
    out=$(grep -c '^OUT ' "$tmp/out.txt" || true)
    echo "days $d: $records records, $bytes bytes ($(( bytes / 1048576 )) MiB), $rows sessions, $out OUT; last run: $best"
done
