#!/usr/bin/env bash
# A throwaway PostgreSQL server on loopback for the push-down tests (test/postgres).
#
#   source scripts/pg-server.sh     # starts it, exports NESTREADY_PG_URL, stops it on exit (trap)
#
# Installs Debian's postgresql when no server binaries are found, runs initdb in a fresh temp
# directory owned by the postgres user (PostgreSQL refuses to run as root), picks a free port
# and listens on 127.0.0.1 only. Everything is deleted when the calling shell exits.

nestready_pg_bindir() {
  ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1
}

if [ -z "$(nestready_pg_bindir)" ]; then
  apt-get update
  DEBIAN_FRONTEND=noninteractive apt-get install -y postgresql
fi
NESTREADY_PG_BIN="$(nestready_pg_bindir)"
id postgres >/dev/null 2>&1 || useradd --system --no-create-home postgres
NESTREADY_PG_DIR="$(mktemp -d /tmp/nestready-pg.XXXXXX)"
chown postgres "$NESTREADY_PG_DIR"
NESTREADY_PG_PORT="$(node -e "const s=require('net').createServer();s.listen(0,'127.0.0.1',()=>{console.log(s.address().port);s.close()})")"

nestready_pg_stop() {
  if [ -n "${NESTREADY_PG_DIR:-}" ] && [ -d "$NESTREADY_PG_DIR" ]; then
    runuser -u postgres -- "$NESTREADY_PG_BIN/pg_ctl" -D "$NESTREADY_PG_DIR/data" -m immediate stop >/dev/null 2>&1 || true
    rm -rf "$NESTREADY_PG_DIR"
  fi
}
trap nestready_pg_stop EXIT

runuser -u postgres -- "$NESTREADY_PG_BIN/initdb" -D "$NESTREADY_PG_DIR/data" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
runuser -u postgres -- "$NESTREADY_PG_BIN/pg_ctl" -D "$NESTREADY_PG_DIR/data" -l "$NESTREADY_PG_DIR/log" -w \
  -o "-p $NESTREADY_PG_PORT -k $NESTREADY_PG_DIR -c listen_addresses=127.0.0.1" start >/dev/null
export NESTREADY_PG_URL="postgres://postgres@127.0.0.1:$NESTREADY_PG_PORT/postgres"
echo "nestready: PostgreSQL $("$NESTREADY_PG_BIN/postgres" --version | awk '{print $3}') on 127.0.0.1:$NESTREADY_PG_PORT for test/postgres"
