# A throwaway PostgreSQL server for the tests of the SQL sources.
#
# Sourced by .ci/run (bash, set -euo pipefail) before `go test ./...`:
# installs Debian's postgresql when it is missing, starts a fresh cluster as
# an unprivileged user on a local port and socket folder of its own, waits
# until it answers, creates the test database and exports its connection
# string as CANDOR_TEST_PG, which the tests in blocks/ read (they load their
# own invented data). The cluster is stopped and removed when the sourcing
# shell exits. It can also be run on its own to try it:
#   bash -c 'source .ci/postgres.sh && psql "$CANDOR_TEST_PG" -c "select 1"'

candor_pg_bin() {
  local d
  for d in /usr/lib/postgresql/*/bin; do
    if [ -x "$d/pg_ctl" ] && [ -x "$d/initdb" ]; then
      echo "$d"
    fi
  done | sort -V | tail -n 1
}

CANDOR_PG_BIN=$(candor_pg_bin)
if [ -z "$CANDOR_PG_BIN" ]; then
  if [ "$(id -u)" = 0 ]; then
    DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends postgresql
  else
    sudo env DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends postgresql
  fi
  CANDOR_PG_BIN=$(candor_pg_bin)
fi
if [ -z "$CANDOR_PG_BIN" ]; then
  echo "postgres.sh: no PostgreSQL server binaries under /usr/lib/postgresql" >&2
  return 1 2>/dev/null || exit 1
fi

# PostgreSQL refuses to run as root: the cluster belongs to a user of its own.
CANDOR_PG_USER=candor-pg
if [ "$(id -u)" = 0 ]; then
  if ! id "$CANDOR_PG_USER" >/dev/null 2>&1; then
    useradd --system --no-create-home --shell /usr/sbin/nologin "$CANDOR_PG_USER"
  fi
  candor_pg_as() { runuser -u "$CANDOR_PG_USER" -- "$@"; }
else
  CANDOR_PG_USER=$(id -un)
  candor_pg_as() { "$@"; }
fi

CANDOR_PG_DIR=$(mktemp -d /tmp/candor-pg.XXXXXX)
chmod 755 "$CANDOR_PG_DIR"
mkdir -p "$CANDOR_PG_DIR/data" "$CANDOR_PG_DIR/socket"
if [ "$(id -u)" = 0 ]; then
  chown -R "$CANDOR_PG_USER" "$CANDOR_PG_DIR"
fi

# A free port on the loopback address, from 55432 up.
CANDOR_PG_PORT=${CANDOR_PG_PORT:-55432}
while (exec 3<>"/dev/tcp/127.0.0.1/$CANDOR_PG_PORT") 2>/dev/null; do
  CANDOR_PG_PORT=$((CANDOR_PG_PORT + 1))
done

candor_pg_stop() {
  if [ -n "${CANDOR_PG_DIR:-}" ] && [ -d "$CANDOR_PG_DIR/data" ]; then
    candor_pg_as "$CANDOR_PG_BIN/pg_ctl" -D "$CANDOR_PG_DIR/data" -m fast -w stop >/dev/null 2>&1 || true
    rm -rf "$CANDOR_PG_DIR"
  fi
}
trap candor_pg_stop EXIT

candor_pg_as "$CANDOR_PG_BIN/initdb" -D "$CANDOR_PG_DIR/data" -U candor --auth=trust \
  --encoding=UTF8 --locale=C.UTF-8 >"$CANDOR_PG_DIR/initdb.log" 2>&1 ||
  { cat "$CANDOR_PG_DIR/initdb.log" >&2; return 1 2>/dev/null || exit 1; }
candor_pg_as "$CANDOR_PG_BIN/pg_ctl" -D "$CANDOR_PG_DIR/data" -l "$CANDOR_PG_DIR/server.log" -w -t 60 \
  -o "-p $CANDOR_PG_PORT -k $CANDOR_PG_DIR/socket -c listen_addresses=127.0.0.1 -c fsync=off" start >/dev/null ||
  { cat "$CANDOR_PG_DIR/server.log" >&2; return 1 2>/dev/null || exit 1; }

for _ in $(seq 1 60); do
  if "$CANDOR_PG_BIN/pg_isready" -q -h 127.0.0.1 -p "$CANDOR_PG_PORT"; then
    break
  fi
  sleep 1
done
if ! "$CANDOR_PG_BIN/pg_isready" -q -h 127.0.0.1 -p "$CANDOR_PG_PORT"; then
  echo "postgres.sh: the server did not answer on port $CANDOR_PG_PORT" >&2
  cat "$CANDOR_PG_DIR/server.log" >&2
  return 1 2>/dev/null || exit 1
fi
"$CANDOR_PG_BIN/createdb" -h 127.0.0.1 -p "$CANDOR_PG_PORT" -U candor candor_test

export CANDOR_TEST_PG="postgres://candor@127.0.0.1:$CANDOR_PG_PORT/candor_test?sslmode=disable"
echo "postgres.sh: PostgreSQL $("$CANDOR_PG_BIN/postgres" --version | awk '{print $3}') on 127.0.0.1:$CANDOR_PG_PORT (CANDOR_TEST_PG)"
