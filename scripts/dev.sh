#!/usr/bin/env bash
# npm run dev: MariaDB + Redis + fakes + API server and a worker (reloading on change) +
# Vite dev server proxying /api to it.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/prepare.sh

export DB_PORT=${DB_PORT:-3307}
export DB_NAME=${DB_NAME:-tarnish}
export DB_USER=${DB_USER:-tarnish}
export DB_PASSWORD=${DB_PASSWORD:-tarnish-local-only}
export PORT=${PORT:-3000}
export REDIS_PORT=${REDIS_PORT:-6379}
# Links in mails and the return from the payment page go to the Vite dev server.
export PUBLIC_URL=${PUBLIC_URL:-http://127.0.0.1:5173}

ensure_node_modules
ensure_mariadb_installed
ensure_redis_installed
server_pid=""
cleanup() { [ -n "$server_pid" ] && kill "$server_pid" 2>/dev/null; local_servers_stop; }
trap cleanup EXIT
mariadb_start .local/mariadb "$DB_PORT" "$DB_NAME" "$DB_USER" "$DB_PASSWORD"
redis_start .local/redis "$REDIS_PORT"
npm run --silent migrate
npm run --silent seed
npx tsx watch --clear-screen=false scripts/serve-local.ts &
server_pid=$!
npx vite --host 127.0.0.1
