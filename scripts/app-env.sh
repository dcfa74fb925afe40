# Environment for the app processes started by start.sh, dev.sh and test.sh. Sourced after env.sh.
# Secrets for this local installation are generated once and kept in .data/secrets.env (git-ignored).
SECRETS_FILE="$DATA_DIR/secrets.env"
if [ ! -f "$SECRETS_FILE" ]; then
  mkdir -p "$DATA_DIR"
  umask 077
  {
    echo "SESSION_SECRET=$(head -c 48 /dev/urandom | base64 | tr -d '\n')"
    echo "API_TOKEN_SECRET=$(head -c 48 /dev/urandom | base64 | tr -d '\n')"
  } >"$SECRETS_FILE"
fi
set -a
# shellcheck disable=SC1090
source "$SECRETS_FILE"
set +a
# the readiness check (GET /api/ready) watches the free space of the data folder
export ISOPLETH_DATA_DIR="$DATA_DIR"
export HOST="${HOST:-127.0.0.1}"
export PORT="${PORT:-3000}"
export APP_BASE_URL="${APP_BASE_URL:-http://$HOST:$PORT}"
export SMTP_HOST="${SMTP_HOST:-127.0.0.1}"
export SMTP_PORT="${SMTP_PORT:-2525}"
export SMTP_HTTP_PORT="${SMTP_HTTP_PORT:-2580}"
export MAIL_CAPTURE_URL="${MAIL_CAPTURE_URL:-http://127.0.0.1:$SMTP_HTTP_PORT/messages}"
