#!/bin/bash
# Runs every `$ elbowroom ...` example of README.md and docs/*.md, and the commands in
# scripts/example-commands.txt, with two builds of elbowroom, and says whether
# each gave the same bytes: standard output, standard error, exit status and
# every file written. Used to show that a refactoring changes no behaviour.
#
#   scripts/compare-outputs.sh OLD_BINARY NEW_BINARY
#
# Each line is run as `elbowroom LINE` by the shell, in a scratch folder
# holding a copy of sessions/; `elbowroom` there is a shell function calling
# the binary under test, so a line can go on with `&& elbowroom ...`. A line
# that starts with `!` is run as it is, without the prefix (to prepare a file
# first: `! sed ... > bad.ron && elbowroom session check bad.ron`). What is
# compared is the output of the whole line.
set -u
cd "$(dirname "$0")/.."
old=$(realpath "$1"); new=$(realpath "$2")
scratch=$(mktemp -d)
trap 'rm -rf "$scratch"' EXIT
{
    sed -n 's/^\$ elbowroom //p' README.md docs/*.md
    grep -v '^#' scripts/example-commands.txt | grep -v '^$'
} > "$scratch/commands"
run() { # binary, folder, command line
    mkdir -p "$2"; cp -r sessions "$2/sessions"
    (bin=$1; elbowroom() { "$bin" "$@"; }
     case $3 in '!'*) line=${3#!} ;; *) line="elbowroom $3" ;; esac
     cd "$2" && eval "$line" > ../stdout 2> ../stderr; echo "exit $?" > ../status)
    rm -rf "$2/sessions"
    (cd "$2" && find . -type f | sort | xargs -r sha256sum) > "$2.files"
}
same=0; differ=0; i=0
while IFS= read -r line; do
    i=$((i + 1))
    for side in old new; do
        bin=$old; [ "$side" = new ] && bin=$new
        mkdir -p "$scratch/$side/$i"
        run "$bin" "$scratch/$side/$i/files" "$line"
    done
    if diff -r "$scratch/old/$i" "$scratch/new/$i" > "$scratch/diff" 2>&1; then
        same=$((same + 1))
    else
        differ=$((differ + 1))
        echo "DIFFERS: elbowroom $line"
        head -20 "$scratch/diff"
    fi
done < "$scratch/commands"
echo "$same commands gave identical output, $differ differed"
[ "$differ" = 0 ]
