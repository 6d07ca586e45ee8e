#!/usr/bin/env bash
# scripts/fresh-clones.sh N — N fresh clones in a row, each running CI's command (CI=true bash .ci/run).
# Each clone is fresh: `git clone` of this repository's committed HEAD into a new temporary folder,
# so it has no node_modules, no .nuxt, no .cache, no .output and no storage (all untracked here);
# npm ci, the PostgreSQL cluster and the build all start from nothing. One at a time (the machine
# is shared). Logs go to storage/fresh-clones/<n>.log; each line printed gives the clone's
# duration and the last line of its run ("N passed, N failed"). Exits non-zero if any run failed.
set -uo pipefail
REPO_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
count="${1:?usage: scripts/fresh-clones.sh N}"
logs="$REPO_ROOT/storage/fresh-clones"
mkdir -p "$logs"
failed=0
for i in $(seq 1 "$count"); do
  dir="$(mktemp -d /tmp/scholium-fresh-XXXXXX)"
  chmod 755 "$dir" # so the postgres user can reach storage/test/pg inside the clone
  git clone --quiet --no-local "$REPO_ROOT" "$dir/repo" || { echo "clone $i: git clone failed"; failed=1; continue; }
  for leftover in node_modules .nuxt .cache .output storage/test; do
    [ -e "$dir/repo/$leftover" ] && { echo "clone $i: $leftover exists in a fresh clone"; failed=1; }
  done
  started=$(date +%s)
  (cd "$dir/repo" && CI=true bash .ci/run) > "$logs/$i.log" 2>&1 </dev/null
  rc=$?
  last="$(grep -v '^\s*$' "$logs/$i.log" | tail -1)"
  echo "clone $i ($dir/repo, $(git -C "$dir/repo" rev-parse --short HEAD)): exit $rc in $(( $(date +%s) - started )) s — $last"
  [ "$rc" = 0 ] || failed=1
  case "$last" in *" 0 failed"*) ;; *) failed=1 ;; esac
  # The clone's PostgreSQL data may sit outside the clone (scripts/lib/provision.sh pg_data_dir): stopped by .ci/run.
  rm -rf "$dir"
done
exit "$failed"
