#!/usr/bin/env bash
# Compares the numbers that two builds of qbridge print, command by command,
# at q = 4 and q = 6. Used when code is moved or refactored: behaviour must
# stay the same.
#
#   testdata/compare/outputs.sh REV_BEFORE [REV_AFTER]
#
# REV_AFTER defaults to the work tree. Each revision is built into a
# temporary directory; every command below runs with --format json and the
# two documents are compared number by number (testdata/compare/numbers.py):
# equal to a relative 1e-12 for analytic values, to the stated error for
# solver values. Exit status 0 when everything agrees, 1 otherwise.
set -euo pipefail
top=$(git rev-parse --show-toplevel)
before=${1:?usage: outputs.sh REV_BEFORE [REV_AFTER]}
after=${2:-}
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT

build() { # rev dir
  if [ -z "$1" ]; then
    (cd "$top" && go build -o "$2/qbridge" ./cmd/qbridge)
  else
    git -C "$top" worktree add -q --detach "$work/src-$1" "$1"
    (cd "$work/src-$1" && go build -o "$2/qbridge" ./cmd/qbridge)
    git -C "$top" worktree remove --force "$work/src-$1"
  fi
}
mkdir -p "$work/a" "$work/b"
build "$before" "$work/a"
build "$after" "$work/b"

cmds=()
for q in 4 6; do
  cmds+=("exact dims --q $q --n 0..6 --digits 30")
  cmds+=("exact b --q $q --digits 30")
  cmds+=("exact s0 --q $q --digits 30")
  cmds+=("resum dims --q $q --n 1")
  cmds+=("resum b --q $q")
  cmds+=("resum s0 --q $q")
  cmds+=("resum e0 --q $q")
  cmds+=("resum alpha --q $q")
  cmds+=("solve --q $q --beta 50")
  cmds+=("report --q $q")
  cmds+=("ground --q $q --beta-max 2000 --steps 16")
done
cmds+=("series dims --around 2 --n 1 --order 12")
cmds+=("series dims --around inf --n 2 --order 12")
cmds+=("series b --around 2 --order 12")
cmds+=("series b --around inf --order 12")
cmds+=("series s0 --around inf --order 12")
cmds+=("series e0 --around 2 --order 8")
cmds+=("series alpha --around inf --order 6")

status=0
for c in "${cmds[@]}"; do
  f=$(echo "$c" | tr ' ./' '___')
  "$work/a/qbridge" $c --format json --quiet >"$work/a/$f.json" 2>"$work/a/$f.err" || echo "before: '$c' failed: $(cat "$work/a/$f.err")"
  "$work/b/qbridge" $c --format json --quiet >"$work/b/$f.json" 2>"$work/b/$f.err" || echo "after: '$c' failed: $(cat "$work/b/$f.err")"
  if python3 "$top/testdata/compare/numbers.py" "$work/a/$f.json" "$work/b/$f.json"; then
    echo "same: $c"
  else
    echo "DIFFERENT: $c"; status=1
  fi
done
exit $status
