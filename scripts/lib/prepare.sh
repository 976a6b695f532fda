# Shared preparation for `npm start`, `npm test` and `npm run dev`: install what is
# missing (npm packages, Debian's MariaDB and Redis, Chromium for browser tests, GDAL's tools for
# the geodata tests) and run a private MariaDB server and a private Redis on loopback. Sourced by
# the scripts beside it.

log() { printf '\033[1;34m[tarnish]\033[0m %s\n' "$*"; }

apt_updated=0
apt_install() {
  if [ "$(id -u)" != 0 ]; then
    log "Need root to install Debian packages: $*"; return 1
  fi
  if [ "$apt_updated" = 0 ]; then
    DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null
    apt_updated=1
  fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null
}

# npm ci when node_modules is missing or older than the lock file.
ensure_node_modules() {
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "Installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

ensure_mariadb_installed() {
  if ! command -v mariadbd >/dev/null 2>&1 && [ ! -x /usr/sbin/mariadbd ]; then
    log "Installing Debian's mariadb-server"
    apt_install mariadb-server
  fi
  export PATH="$PATH:/usr/sbin"
}

# GDAL's command-line tools: the geodata tests check slope, aspect, rasterising and
# reprojection against gdaldem, gdal_rasterize, gdalwarp and gdaltransform.
ensure_gdal_installed() {
  if ! command -v gdaldem >/dev/null 2>&1; then
    log "Installing Debian's gdal-bin for the geodata reference tests"
    apt_install gdal-bin
  fi
}

ensure_chromium_installed() {
  if [ ! -x /usr/bin/chromium ]; then
    log "Installing Debian's chromium for browser tests"
    apt_install chromium
  fi
}

# mariadb_start DIR PORT DATABASE USER PASSWORD [fresh]
# Starts mariadbd on 127.0.0.1:PORT with its data in DIR (grant tables on), waits
# until it answers, creates DATABASE and the application USER. With "fresh" the
# database is dropped and created again (tests migrate from empty).
mariadb_start() {
  local dir port db user pass fresh
  dir=$(realpath -m "$1"); port=$2; db=$3; user=$4; pass=$5; fresh=${6:-}
  mkdir -p "$dir"
  MARIADB_DIR=$dir
  if [ -f "$dir/mariadbd.pid" ] && kill -0 "$(cat "$dir/mariadbd.pid")" 2>/dev/null; then
    log "MariaDB already running from $dir (pid $(cat "$dir/mariadbd.pid"))"
    MARIADB_OWNED=0
  else
    if [ ! -d "$dir/data/mysql" ]; then
      mariadb-install-db --no-defaults --datadir="$dir/data" --user=root \
        --auth-root-authentication-method=socket --skip-test-db --skip-name-resolve >"$dir/install.log" 2>&1
    fi
    mariadbd --no-defaults --datadir="$dir/data" --socket="$dir/mysqld.sock" --port="$port" \
      --bind-address=127.0.0.1 --skip-name-resolve --user=root \
      --pid-file="$dir/mariadbd.pid" --log-error="$dir/mariadbd.err" \
      --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
      --innodb-buffer-pool-size=256M --innodb-flush-log-at-trx-commit=2 --max-connections=300 2>>"$dir/mariadbd.err" &
    MARIADB_OWNED=1
    local tries=0
    until mariadb-admin --no-defaults --socket="$dir/mysqld.sock" -uroot ping >/dev/null 2>&1; do
      tries=$((tries + 1))
      if [ $tries -gt 300 ]; then log "MariaDB did not answer; see $dir/mariadbd.err"; tail -20 "$dir/mariadbd.err"; return 1; fi
      sleep 0.1
    done
    log "MariaDB listening on 127.0.0.1:$port (pid $(cat "$dir/mariadbd.pid"))"
  fi
  local drop=""
  [ "$fresh" = fresh ] && drop="DROP DATABASE IF EXISTS \`$db\`;"
  mariadb --no-defaults --socket="$dir/mysqld.sock" -uroot <<SQL
$drop
CREATE DATABASE IF NOT EXISTS \`$db\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$user'@'127.0.0.1' IDENTIFIED BY '$pass';
CREATE USER IF NOT EXISTS '$user'@'localhost' IDENTIFIED BY '$pass';
GRANT ALL PRIVILEGES ON \`$db\`.* TO '$user'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`$db\`.* TO '$user'@'localhost';
SQL
}

# mariadb_extra_database DATABASE USER: another empty database on the server started by
# mariadb_start, for the same application user (dropped first: it always starts empty).
mariadb_extra_database() {
  local db=$1 user=$2
  mariadb --no-defaults --socket="$MARIADB_DIR/mysqld.sock" -uroot <<SQL
DROP DATABASE IF EXISTS \`$db\`;
CREATE DATABASE \`$db\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
GRANT ALL PRIVILEGES ON \`$db\`.* TO '$user'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`$db\`.* TO '$user'@'localhost';
SQL
}

# stop_by_pidfile PIDFILE NAME: SIGTERM to the pid in PIDFILE, then waits (up to 10 s) for it to exit.
stop_by_pidfile() {
  [ -f "$1" ] || return 0
  local pid; pid=$(cat "$1")
  kill -TERM "$pid" 2>/dev/null || return 0
  for _ in $(seq 1 100); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
  log "$2 stopped"
}

# Stops the server we started, by its pid, and waits for it to exit.
mariadb_stop() {
  [ "${MARIADB_OWNED:-0}" = 1 ] || return 0
  stop_by_pidfile "$MARIADB_DIR/mariadbd.pid" MariaDB
}

ensure_redis_installed() {
  if ! command -v redis-server >/dev/null 2>&1; then
    log "Installing Debian's redis-server"
    apt_install redis-server
  fi
}

# redis_start DIR PORT [fresh]
# Starts redis-server on 127.0.0.1:PORT with its data (append-only file on, so a restart
# loses nothing queued) in DIR, and waits until it answers. With "fresh" the data is
# removed first (tests start from an empty queue). A server from an earlier run still
# alive in DIR is reused and left running.
redis_start() {
  local dir port fresh
  dir=$(realpath -m "$1"); port=$2; fresh=${3:-}
  REDIS_DIR=$dir
  if [ -f "$dir/redis.pid" ] && kill -0 "$(cat "$dir/redis.pid")" 2>/dev/null; then
    log "Redis already running from $dir (pid $(cat "$dir/redis.pid"))"
    REDIS_OWNED=0
    [ "$fresh" = fresh ] && redis-cli -h 127.0.0.1 -p "$port" flushall >/dev/null
    return 0
  fi
  [ "$fresh" = fresh ] && rm -rf "$dir"
  mkdir -p "$dir"
  redis-server --bind 127.0.0.1 --port "$port" --dir "$dir" --appendonly yes --appendfsync everysec \
    --save "" --pidfile "$dir/redis.pid" --logfile "$dir/redis.log" --daemonize yes
  REDIS_OWNED=1
  local tries=0
  until redis-cli -h 127.0.0.1 -p "$port" ping >/dev/null 2>&1; do
    tries=$((tries + 1))
    if [ $tries -gt 100 ]; then log "Redis did not answer; see $dir/redis.log"; tail -20 "$dir/redis.log"; return 1; fi
    sleep 0.1
  done
  log "Redis listening on 127.0.0.1:$port (pid $(cat "$dir/redis.pid"))"
}

# Stops the Redis we started, by its pid (it writes its append-only file first).
redis_stop() {
  [ "${REDIS_OWNED:-0}" = 1 ] || return 0
  stop_by_pidfile "$REDIS_DIR/redis.pid" Redis
}

# Both local servers, for the EXIT trap of the scripts beside this one.
local_servers_stop() { redis_stop; mariadb_stop; }
