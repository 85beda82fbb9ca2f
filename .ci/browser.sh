#!/usr/bin/env bash
# Installs Chromium and its driver from Debian's packages when missing, for the sodium-course browser test
# (tests/CdsNatremia.Service.Tests/Course/CourseBrowserTests). Safe to run again. Nothing is downloaded at test time:
# Selenium is pointed at /usr/bin/chromedriver and /usr/bin/chromium.
set -euo pipefail
if [[ -x /usr/bin/chromium && -x /usr/bin/chromedriver ]]; then
  echo "browser: $(/usr/bin/chromedriver --version | head -1)"
  exit 0
fi
if [[ $(id -u) -ne 0 ]]; then
  echo "browser: chromium or chromium-driver not installed and not root, cannot install them" >&2
  exit 1
fi
echo "browser: installing chromium and chromium-driver from Debian's packages"
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq
apt-get install -y -qq chromium chromium-driver >/dev/null
echo "browser: $(/usr/bin/chromedriver --version | head -1)"
