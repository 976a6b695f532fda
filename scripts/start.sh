#!/usr/bin/env bash
# npm start: install what is missing, start MariaDB and Redis on loopback, migrate, seed the
# demo, build the client and serve app + API with a worker process and the local fakes.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/prepare.sh

export DB_PORT=${DB_PORT:-3307}
export DB_NAME=${DB_NAME:-tarnish}
export DB_USER=${DB_USER:-tarnish}
export DB_PASSWORD=${DB_PASSWORD:-tarnish-local-only}
export REDIS_PORT=${REDIS_PORT:-6379}

ensure_node_modules
ensure_mariadb_installed
ensure_redis_installed
trap local_servers_stop EXIT
mariadb_start .local/mariadb "$DB_PORT" "$DB_NAME" "$DB_USER" "$DB_PASSWORD"
redis_start .local/redis "$REDIS_PORT"

log "Migrating and seeding the demo"
npm run --silent migrate
npm run --silent seed
log "Building the client"
npx vite build --logLevel warn
npx tsx scripts/serve-local.ts
