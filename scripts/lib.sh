# Shared by start.sh and test.sh: installing what is missing, the local PostgreSQL cluster,
# free ports and stopping what we started. Sourced, not run.

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export NEXT_TELEMETRY_DISABLED=1
PIDS=()          # every background process we started, stopped by PID on exit
PG_DIRS=()       # every cluster we started, stopped with pg_ctl on exit

say() { printf '\033[1m[rosinwood]\033[0m %s\n' "$*"; }
die() { printf '\033[1;31m[rosinwood] %s\033[0m\n' "$*" >&2; exit 1; }

apt_install() {
  # apt-get update once per run, only when something is missing.
  if [ -z "${APT_UPDATED:-}" ]; then
    say "installing Debian packages: $*"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null || die "apt-get update failed"
    APT_UPDATED=1
  fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null \
    || die "could not install Debian packages: $*"
}

pg_bin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1; }

ensure_postgres() {
  [ -n "$(pg_bin)" ] && [ -x "$(pg_bin)/initdb" ] || apt_install postgresql
  [ -x "$(pg_bin)/initdb" ] || die "PostgreSQL's initdb was not found after installing postgresql"
  id postgres >/dev/null 2>&1 || die "the 'postgres' system user is missing (Debian's postgresql package creates it)"
}

ensure_chromium() {
  command -v chromium >/dev/null 2>&1 || apt_install chromium
  command -v chromium >/dev/null 2>&1 || die "chromium is not installed"
}

ensure_ffmpeg() {
  # The listening aid decodes recordings with Debian's ffmpeg (never a downloaded static build).
  command -v ffmpeg >/dev/null 2>&1 || apt_install ffmpeg
  command -v ffmpeg >/dev/null 2>&1 || die "ffmpeg is not installed"
}

ensure_node_modules() {
  # npm ci when node_modules is missing or older than the lock file.
  local marker="$ROOT/node_modules/.package-lock.json"
  if [ ! -f "$marker" ] || [ "$ROOT/package-lock.json" -nt "$marker" ]; then
    say "installing npm dependencies (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error) || die "npm ci failed"
  fi
}

port_free() { ! (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

free_port() {
  node -e 'const s=require("net").createServer();s.listen(0,"127.0.0.1",()=>{console.log(s.address().port);s.close()})'
}

require_port() { # name port
  port_free "$2" || die "port $2 ($1) is already in use on 127.0.0.1: stop what uses it, or set $1 to another port"
}

# pg_init DIR PORT PASSWORD: a cluster owned by postgres, TCP on 127.0.0.1 only, no unix socket.
pg_init() {
  local dir="$1" pass="$3"
  if [ ! -f "$dir/PG_VERSION" ]; then
    mkdir -p "$dir"
    chown postgres "$dir" && chmod 700 "$dir"
    runuser -u postgres -- test -w "$dir" \
      || die "the postgres user cannot reach $dir: a folder above it is not traversable (chmod o+x), or move the project"
    local pwfile; pwfile="$(mktemp)"; printf '%s\n' "$pass" >"$pwfile"; chown postgres "$pwfile"
    runuser -u postgres -- "$(pg_bin)/initdb" -D "$dir" -U rosinwood --pwfile="$pwfile" \
      --auth-host=scram-sha-256 --auth-local=peer -E UTF8 --locale=C.UTF-8 >"$dir.initdb.log" 2>&1 \
      || { rm -f "$pwfile"; cat "$dir.initdb.log" >&2; die "initdb failed"; }
    rm -f "$pwfile"
  fi
}

pg_start() { # DIR PORT
  local dir="$1" port="$2" log="$(dirname "$1")/postgres.log"
  touch "$log" && chown postgres "$log" # written by the server, which runs as postgres
  runuser -u postgres -- "$(pg_bin)/pg_ctl" -D "$dir" -l "$log" -w -t 30 \
    -o "-p $port -c listen_addresses=127.0.0.1 -c unix_socket_directories=''" start >/dev/null \
    || { tail -n 20 "$log" >&2; die "PostgreSQL did not start (log: $log)"; }
  PG_DIRS+=("$dir")
  local i
  for i in $(seq 1 50); do
    "$(pg_bin)/pg_isready" -q -h 127.0.0.1 -p "$port" && return 0
    sleep 0.2
  done
  die "PostgreSQL on port $port does not answer"
}

pg_create_db() { # PORT PASSWORD NAME
  PGPASSWORD="$2" psql -q -h 127.0.0.1 -p "$1" -U rosinwood -d postgres -tAc \
    "select 1 from pg_database where datname='$3'" | grep -q 1 \
    || PGPASSWORD="$2" psql -q -h 127.0.0.1 -p "$1" -U rosinwood -d postgres -c "create database \"$3\"" >/dev/null \
    || die "could not create database $3"
}

# Stop everything we started, by PID; safe to call twice.
cleanup() {
  set +e
  local pid dir
  for pid in "${PIDS[@]}"; do
    kill -TERM "$pid" 2>/dev/null
  done
  for pid in "${PIDS[@]}"; do
    for _ in $(seq 1 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
    kill -KILL "$pid" 2>/dev/null
  done
  PIDS=()
  for dir in "${PG_DIRS[@]}"; do
    if [ -f "$dir/postmaster.pid" ]; then
      pid="$(head -n 1 "$dir/postmaster.pid")"
      kill -INT "$pid" 2>/dev/null # PostgreSQL's "fast" shutdown
      for _ in $(seq 1 100); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
    fi
  done
  PG_DIRS=()
}

# A build is stale when any source file is newer than the last build.
build_is_stale() {
  local stamp="$ROOT/.next/BUILD_ID"
  [ -f "$stamp" ] || return 0
  [ -n "$(cd "$ROOT" && find app components lib db emails public proxy.ts next.config.mjs \
      tailwind.config.ts postcss.config.mjs package-lock.json -newer "$stamp" -type f 2>/dev/null | head -n 1)" ]
}

next_build() {
  say "building the app (next build)"
  (cd "$ROOT" && node_modules/.bin/next build >"$1" 2>&1) || { tail -n 40 "$1" >&2; die "next build failed (log: $1)"; }
}

wait_http() { # URL SECONDS
  local i
  for i in $(seq 1 $(($2 * 5))); do
    node -e 'fetch(process.argv[1]).then(r=>process.exit(r.status<500?0:1),()=>process.exit(1))' "$1" && return 0
    sleep 0.2
  done
  return 1
}

# start_mail_fake PORT LOGDIR [STOREFILE]: the local Resend stand-in on 127.0.0.1.
start_mail_fake() {
  # node --import tsx (not the tsx wrapper) so that $! is the server itself and cleanup stops it.
  RESEND_FAKE_PORT="$1" RESEND_FAKE_STORE="${3:-}" node --import tsx scripts/fakes/resend.ts >"$2/mail-fake.log" 2>&1 &
  PIDS+=("$!")
  wait_http "http://127.0.0.1:$1/_fake/settings" 20 || { tail -n 20 "$2/mail-fake.log" >&2; die "the Resend stand-in did not start (log: $2/mail-fake.log)"; }
}

# start_worker LOGDIR: the job worker (e-mail sending, retries, sweeper), with the exported environment.
start_worker() {
  node --import tsx scripts/worker.ts >"$1/worker.log" 2>&1 &
  PIDS+=("$!")
  local i
  for i in $(seq 1 150); do grep -q "sending e-mail" "$1/worker.log" && return 0; sleep 0.2; done
  tail -n 20 "$1/worker.log" >&2
  die "the worker did not start (log: $1/worker.log)"
}

# start_s3_fake PORT DIR LOGDIR: the local S3-compatible stand-in (s3rver) on 127.0.0.1, objects in DIR.
start_s3_fake() {
  S3_FAKE_PORT="$1" S3_FAKE_DIR="$2" node --import tsx scripts/fakes/s3.ts >"$3/s3-fake.log" 2>&1 &
  PIDS+=("$!")
  wait_http "http://127.0.0.1:$1/" 20 || { tail -n 20 "$3/s3-fake.log" >&2; die "the S3 stand-in did not start (log: $3/s3-fake.log)"; }
}

# start_stripe_fake PORT LOGDIR STATEFILE WEBHOOK_URL: the project's own Stripe stand-in on 127.0.0.1
# (scripts/fakes/stripe/), keeping its objects in STATEFILE and sending signed webhooks to WEBHOOK_URL.
# Reads STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET from the environment.
start_stripe_fake() {
  STRIPE_FAKE_PORT="$1" STRIPE_FAKE_STATE="$3" STRIPE_FAKE_WEBHOOK_URL="$4" \
    node --import tsx scripts/fakes/stripe/server.ts >"$2/stripe-fake.log" 2>&1 &
  PIDS+=("$!")
  wait_http "http://127.0.0.1:$1/_fake/health" 20 || { tail -n 20 "$2/stripe-fake.log" >&2; die "the Stripe stand-in did not start (log: $2/stripe-fake.log)"; }
}
