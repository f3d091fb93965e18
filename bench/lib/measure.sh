# Sourced by the benchmarks: the median of their rounds and the empty journal each round starts on.

# median: the median of the numbers on stdin, one a line
median() { sort -g | awk '{ v[NR] = $1 } END { print (NR % 2) ? v[(NR + 1) / 2] : (v[NR / 2] + v[NR / 2 + 1]) / 2 }'; }

# fresh_journal KIND NAME DIR: prints the JDBC URL of an empty journal (user sw, password sw).
#   KIND h2: the H2 file DIR/NAME/journal, removed first;
#   KIND postgres: the database NAME, dropped and created again, on the PostgreSQL server that
#   .ci/postgres.sh runs on SLOPEWATCH_POSTGRES_PORT (default 55432).
fresh_journal() {
  if [ "$1" = postgres ]; then
    local port="${SLOPEWATCH_POSTGRES_PORT:-55432}"
    local psql
    psql="$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1)/psql"
    "$psql" -q -h 127.0.0.1 -p "$port" -U postgres -d postgres -c "DROP DATABASE IF EXISTS $2" -c "CREATE DATABASE $2 OWNER sw" \
      >&2 2>/dev/null
    echo "jdbc:postgresql://127.0.0.1:$port/$2"
  else
    rm -rf "${3:?}/$2"
    echo "jdbc:h2:file:$3/$2/journal"
  fi
}
