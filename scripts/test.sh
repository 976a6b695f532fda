#!/usr/bin/env bash
# npm test: the same preparation as npm start (plus Chromium), on a separate MariaDB
# server with an empty test database and a separate, empty Redis, then every test. Exits non-zero on any failure.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/prepare.sh

export DB_PORT=${TEST_DB_PORT:-3308}
export DB_NAME=tarnish_test
export DB_USER=tarnish
export DB_PASSWORD=tarnish-test-only
export NODE_ENV=test
export REDIS_PORT=${TEST_REDIS_PORT:-6380}
# Geodata files of the test database, emptied with it.
export GEODATA_DIR=.local/geodata-test
rm -rf "$GEODATA_DIR"

ensure_node_modules
ensure_mariadb_installed
ensure_redis_installed
ensure_chromium_installed
ensure_gdal_installed
trap local_servers_stop EXIT
mariadb_start .local/mariadb-test "$DB_PORT" "$DB_NAME" "$DB_USER" "$DB_PASSWORD" fresh
redis_start .local/redis-test "$REDIS_PORT" fresh
# A second, empty database where the migrations are run up, down and up again.
export MIGRATIONS_DB_NAME=tarnish_migrations_test
mariadb_extra_database "$MIGRATIONS_DB_NAME" "$DB_USER"

log "Migrating the empty test database"
npm run --silent migrate
log "Type checks and lint"
npm run --silent typecheck
npm run --silent lint
log "Building the client for browser tests"
npx vite build --logLevel warn
log "Running every test"
npx vitest run "$@"
