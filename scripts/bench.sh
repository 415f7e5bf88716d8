#!/usr/bin/env bash
# `npm run bench`: engine and checklist throughput, then impact analysis and the event loop under heavy
# work (evidence packs and reports) in a throw-away MariaDB.
# Prints figures; tests never depend on them.
set -uo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
ensure_debian_packages
ensure_node_modules

npx tsx scripts/bench.ts
echo
npx tsx scripts/bench-rules.ts
echo
npx tsx scripts/bench-compare.ts
echo
dir=".data/bench-$$"
export DB_NAME=torquetrail_bench DB_USER=torquetrail_bench DB_PASSWORD=bench-only LOG_LEVEL=silent
db_start "$dir" "$(free_port)"
export DB_HOST=127.0.0.1 DB_PORT
trap 'db_stop; rm -rf "$dir"' EXIT
db_ensure_schema "$DB_NAME" "$DB_USER" "$DB_PASSWORD"
npx tsx scripts/bench-impact.ts
db_stop
echo

# The library of 100,000 calcs lives in its own data folder, kept between runs because seeding it
# takes minutes: BENCH_FRESH=1 seeds anew, BENCH_LISTS_DIR moves it, BENCH_SCALE=0.1 seeds a tenth.
lists_dir="${BENCH_LISTS_DIR:-.data/bench-lists}"
[ "${BENCH_FRESH:-0}" = "1" ] && rm -rf "$lists_dir"
db_start "$lists_dir" "$(free_port)"
export DB_PORT DB_POOL_MAX="${DB_POOL_MAX:-20}"
trap 'db_stop; rm -rf "$dir"' EXIT
db_ensure_schema "$DB_NAME" "$DB_USER" "$DB_PASSWORD"
npx tsx scripts/bench-seed.ts && npx tsx scripts/bench-lists.ts
echo
db_stop

# Review-health signals (issue 15) over a library of its own at a tenth of the scale: 10,000 calcs and
# their signatures, kept like the large one (BENCH_HEALTH_DIR moves it; BENCH_FRESH=1 seeds anew).
health_dir="${BENCH_HEALTH_DIR:-.data/bench-health}"
[ "${BENCH_FRESH:-0}" = "1" ] && rm -rf "$health_dir"
db_start "$health_dir" "$(free_port)"
export DB_PORT
db_ensure_schema "$DB_NAME" "$DB_USER" "$DB_PASSWORD"
BENCH_SCALE=0.1 npx tsx scripts/bench-seed.ts && BENCH_SCALE=0.1 npx tsx scripts/bench-health.ts
db_stop
echo
db_start "$lists_dir" "$(free_port)"
export DB_PORT
MAIL_SENDER=false npx tsx scripts/bench-stall.ts
# The writers bench uploads files: object storage (and the fake SMTP server) on free ports.
export SMTP_HOST=127.0.0.1 SMTP_PORT=$(free_port) S3_ENDPOINT="http://127.0.0.1:$(free_port)" S3_BUCKET=torquetrail-bench MAIL_SENDER=false
fakes_start "$dir/fakes"
trap 'fakes_stop; db_stop; rm -rf "$dir"' EXIT
npx tsx scripts/bench-writers.ts
echo

# Screens in headless Chromium against the demo data, in their own database beside the library's.
[ -f dist/torquetrail/browser/index.html ] || npx ng build --configuration production >/dev/null || die "client build failed"
DB_NAME=torquetrail_screens DB_USER=torquetrail_screens db_ensure_schema torquetrail_screens torquetrail_screens bench-only
DB_NAME=torquetrail_screens DB_USER=torquetrail_screens DB_PASSWORD=bench-only npx tsx server/db/migrate.ts >/dev/null
DB_NAME=torquetrail_screens DB_USER=torquetrail_screens DB_PASSWORD=bench-only npx tsx server/db/seed.ts >/dev/null
DB_NAME=torquetrail_screens DB_USER=torquetrail_screens DB_PASSWORD=bench-only npx tsx scripts/bench-screens.ts
echo
# Returning and signing on the calc page, on revisions of their own added to the same demo database.
DB_NAME=torquetrail_screens DB_USER=torquetrail_screens DB_PASSWORD=bench-only npx tsx scripts/bench-signing.ts
echo
echo "Figures measure this machine at this moment; they support, never replace, engineering judgement of the product's fitness."
