#!/usr/bin/env bash
# TEST ONLY. Mints a short-lived CDS Hooks client token (RS384) with the test key pair in this folder, for trying the
# service by hand. Real EHRs sign with their own private key, which never leaves them.
# Usage: mint-test-token.sh AUDIENCE_URL [ISSUER] [PRIVATE_KEY_PEM] [KID]
#   AUDIENCE_URL is the exact URL the token will be sent to, e.g. http://127.0.0.1:5080/cds-services
set -euo pipefail
aud="${1:?usage: mint-test-token.sh AUDIENCE_URL [ISSUER] [PRIVATE_KEY_PEM] [KID]}"
iss="${2:-https://ehr.test.example}"
key="${3:-$(dirname "$0")/TEST-ONLY-client-private-key.pem}"
kid="${4:-test-ehr-2026}"
b64url() { openssl base64 -A | tr '+/' '-_' | tr -d '='; }
now=$(date +%s)
jti=$(cat /proc/sys/kernel/random/uuid 2>/dev/null || openssl rand -hex 16)
header=$(printf '{"alg":"RS384","typ":"JWT","kid":"%s"}' "$kid" | b64url)
payload=$(printf '{"iss":"%s","aud":"%s","iat":%d,"exp":%d,"jti":"%s"}' "$iss" "$aud" "$now" "$((now + 300))" "$jti" | b64url)
signature=$(printf '%s.%s' "$header" "$payload" | openssl dgst -sha384 -sign "$key" -binary | b64url)
printf '%s.%s.%s\n' "$header" "$payload" "$signature"
