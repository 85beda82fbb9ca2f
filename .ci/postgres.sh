#!/usr/bin/env bash
# Prepares a local PostgreSQL for the audit tests and writes .ci/postgres.env with NATREMIA_TEST_POSTGRES.
# Safe to run again: installs only when missing, starts the cluster only when down, creates role and database only
# when absent. Listens on loopback only (Debian's default).
set -euo pipefail
cd "$(dirname "$0")"
rm -f postgres.env

if [[ -n "${NATREMIA_TEST_POSTGRES:-}" ]]; then
  printf 'export NATREMIA_TEST_POSTGRES=%q\n' "$NATREMIA_TEST_POSTGRES" > postgres.env
  echo "postgres: using the NATREMIA_TEST_POSTGRES already set"
  exit 0
fi

if [[ $(id -u) -ne 0 ]]; then
  echo "postgres: not root, cannot install or start PostgreSQL" >&2
  exit 1
fi

if ! command -v pg_lsclusters >/dev/null 2>&1 || ! compgen -G "/usr/lib/postgresql/*/bin/postgres" >/dev/null; then
  echo "postgres: installing from Debian's packages"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq postgresql >/dev/null
fi

read -r version cluster port status <<<"$(pg_lsclusters --no-header | awk 'NR==1 {print $1, $2, $3, $4}')"
if [[ -z "${version:-}" ]]; then
  version=$(basename "$(compgen -G "/usr/lib/postgresql/*" | sort -V | tail -1)")
  pg_createcluster "$version" main >/dev/null
  read -r version cluster port status <<<"$(pg_lsclusters --no-header | awk 'NR==1 {print $1, $2, $3, $4}')"
fi

if [[ "$status" != online* ]]; then
  pg_ctlcluster "$version" "$cluster" start
fi

for _ in $(seq 1 30); do
  pg_isready -q -h 127.0.0.1 -p "$port" && break
  sleep 1
done
pg_isready -h 127.0.0.1 -p "$port"

role=natremia_ci
password=natremia-ci-only
database=natremia_audit_test
psql_postgres() { su postgres -c "psql -p $port -v ON_ERROR_STOP=1 -qtAc \"$1\""; }
if [[ "$(psql_postgres "SELECT 1 FROM pg_roles WHERE rolname = '$role'")" != 1 ]]; then
  psql_postgres "CREATE ROLE $role LOGIN PASSWORD '$password'"
fi
if [[ "$(psql_postgres "SELECT 1 FROM pg_database WHERE datname = '$database'")" != 1 ]]; then
  psql_postgres "CREATE DATABASE $database OWNER $role"
fi

printf 'export NATREMIA_TEST_POSTGRES=%q\n' "Host=127.0.0.1;Port=$port;Username=$role;Password=$password;Database=$database" > postgres.env
echo "postgres: $version/$cluster on 127.0.0.1:$port, database $database ready"
