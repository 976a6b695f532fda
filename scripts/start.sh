#!/usr/bin/env bash
# npm start: install what is missing, start MariaDB on loopback, migrate, seed the
# demo, build the client and serve app + API with the local fakes.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/prepare.sh

export DB_PORT=${DB_PORT:-3307}
export DB_NAME=${DB_NAME:-tarnish}
export DB_USER=${DB_USER:-tarnish}
export DB_PASSWORD=${DB_PASSWORD:-tarnish-local-only}

ensure_node_modules
ensure_mariadb_installed
trap mariadb_stop EXIT
mariadb_start .local/mariadb "$DB_PORT" "$DB_NAME" "$DB_USER" "$DB_PASSWORD"

log "Migrating and seeding the demo"
npm run --silent migrate
npm run --silent seed
log "Building the client"
npx vite build --logLevel warn
npx tsx scripts/serve-local.ts
