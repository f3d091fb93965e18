# Sourced by the benchmarks that post a history file to a daemon over HTTP.

# split_history FILE DATES_PER_BODY DIR: the file as CSV bodies of whole dates (the rows of one
# date stay together), its header on each, named in order
split_history() {
  awk -F, -v per="$2" -v dir="$3" 'NR==1 {h=$0; system("mkdir -p " dir); next}
    $1 != last {dates++; last=$1; if ((dates-1) % per == 0) {n++; f=sprintf("%s/%06d.csv", dir, n); print h > f}}
    {print >> f}' "$1"
}

# curves_of FILE: the curve names of a multi-curve history file, comma-separated
curves_of() {
  awk -F, 'NR>1 {print $2}' "$1" | sort -u | paste -sd,
}

# await_ready PORT: waits up to 60 s for the daemon's readiness
await_ready() {
  for _ in $(seq 1 120); do
    curl -sf "http://127.0.0.1:$1/q/health/ready" > /dev/null 2>&1 && return 0
    sleep 0.5
  done
  echo "the daemon on port $1 did not become ready" >&2
  return 1
}

# post_bodies PORT TOKEN DIR: posts every body in order, one after another; prints the snapshots accepted
post_bodies() {
  local accepted=0 answer body
  for body in "$3"/*.csv; do
    answer=$(curl -sf -H "Authorization: Bearer $2" -H 'Content-Type: text/csv' --data-binary @"$body" "http://127.0.0.1:$1/api/quotes")
    accepted=$((accepted + $(echo "$answer" | sed -E 's/.*"accepted":([0-9]+).*/\1/')))
  done
  echo "$accepted"
}
