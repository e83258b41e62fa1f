#!/bin/bash
# Counts the instructions two builds of elbowroom execute on the same
# commands (valgrind's callgrind: repeatable whatever else the machine is
# doing), one line per command with the ratio NEW/OLD. Used to show that a
# refactoring made nothing slower; build both with --release.
#
#   scripts/compare-instructions.sh OLD_BINARY NEW_BINARY
set -eu
old=$(realpath "$1"); new=$(realpath "$2")
scratch=$(mktemp -d)
trap 'rm -rf "$scratch"' EXIT
commands=(
    "schubert 15273846"
    "perm 31628475"
    "dreams 132987654 --count"
    "words 4321 --limit 100"
    "hessenberg --n 9 --json"
    "hessenberg --n 7 --h 3,3,4,5,6,7,7 --json"
    "divsym (x1+2x2+3x3+x4+x5)^6 --n 6"
    "volume --lambda 9,7,5,3,2,1,0"
    "eulerian --n 8 --json"
    "quotient --n 7 --json"
    "survey --n 7 --summary --json"
)
printf '%-48s %15s %15s %7s\n' command old new ratio
for c in "${commands[@]}"; do
    counts=()
    for bin in "$old" "$new"; do
        # shellcheck disable=SC2086
        valgrind --tool=callgrind --callgrind-out-file="$scratch/out" "$bin" $c \
            > /dev/null 2> "$scratch/err" || { cat "$scratch/err"; exit 1; }
        counts+=("$(sed -n 's/^==[0-9]*== Collected : //p' "$scratch/err")")
    done
    ratio=$(awk -v a="${counts[0]}" -v b="${counts[1]}" 'BEGIN { printf "%.3f", b / a }')
    printf '%-48s %15s %15s %7s\n' "$c" "${counts[0]}" "${counts[1]}" "$ratio"
done
