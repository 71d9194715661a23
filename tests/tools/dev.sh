#!/usr/bin/env bash
# API server in watch mode on API_PORT (default 3000) and the Vite dev server proxying /api to it.
set -euo pipefail
export PORT="${API_PORT:-3000}"
npx tsx watch --tsconfig tsconfig.server.json server/main.ts &
api=$!
trap 'kill $api 2>/dev/null || true' EXIT
npx vite
