#!/usr/bin/env bash
# Installs HAProxy from Debian's packages when missing, for the fleet test (tests/…/Fleet). Safe to run again.
# Only the binary is used: the test writes its own configuration and runs HAProxy on loopback; the packaged
# system service is not started.
set -euo pipefail
if command -v haproxy >/dev/null 2>&1 || [[ -x /usr/sbin/haproxy ]]; then
  echo "haproxy: $(/usr/sbin/haproxy -v 2>/dev/null | head -1 || haproxy -v | head -1)"
  exit 0
fi
if [[ $(id -u) -ne 0 ]]; then
  echo "haproxy: not installed and not root, cannot install it" >&2
  exit 1
fi
echo "haproxy: installing from Debian's packages"
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq
apt-get install -y -qq haproxy >/dev/null
echo "haproxy: $(/usr/sbin/haproxy -v | head -1)"
