#!/usr/bin/env bash
# Regenerates every golden file in testdata/ into a fresh temporary directory
# with its gen_*.py script and compares it byte for byte with the committed
# file. Exit status: 0 when all match (or when python3 with mpmath is not
# available: the check is skipped with a message), 1 otherwise.
#
#   bash testdata/check_golden.sh
set -u
here=$(cd "$(dirname "$0")" && pwd)
py=${PYTHON:-python3}

if ! command -v "$py" >/dev/null 2>&1 || ! "$py" -c 'import mpmath' >/dev/null 2>&1; then
  echo "check_golden: skipped: python3 with mpmath not available"
  exit 0
fi

tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT

names="special elementary pade conformal"

# The scripts are independent; run them side by side (the conformal one
# dominates the run time).
declare -A pid
for n in $names; do
  "$py" "$here/gen_$n.py" "$tmp" >"$tmp/gen_$n.log" 2>&1 &
  pid[$n]=$!
done

status=0
for n in $names; do
  file=${n}_golden.json
  if ! wait "${pid[$n]}"; then
    echo "check_golden: FAIL: testdata/gen_$n.py failed; its output:"
    sed 's/^/  /' "$tmp/gen_$n.log"
    status=1
  elif [ ! -f "$here/$file" ]; then
    echo "check_golden: FAIL: testdata/$file is missing (regenerate: python3 testdata/gen_$n.py)"
    status=1
  elif ! cmp -s "$tmp/$file" "$here/$file"; then
    echo "check_golden: FAIL: testdata/$file differs from what testdata/gen_$n.py writes:"
    diff -u "$here/$file" "$tmp/$file" | head -n 40 | sed 's/^/  /'
    echo "  (if the script change is intended: python3 testdata/gen_$n.py, review, commit both)"
    status=1
  else
    echo "check_golden: ok: testdata/$file"
  fi
done
exit $status
