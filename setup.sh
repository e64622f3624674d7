#!/usr/bin/env bash
# Leeward's one entry point: installs what is missing (idempotent), then builds, serves or tests.
#   ./setup.sh serve   set up, build the release page and serve it on http://127.0.0.1:8080
#   ./setup.sh test    set up, build, and run every test (native engine, integration, browser)
#   ./setup.sh build   set up and build dist/ and dist/leeward.html only
#   ./setup.sh bench   set up, build, and print every performance figure (criterion in full)
#   ./setup.sh tools   set up the tools only
set -euo pipefail
cd "$(dirname "$0")"

TRUNK_VERSION=0.21.14
BINARYEN_VERSION=132
export PATH="$HOME/.cargo/bin:$PATH"

log() { printf '\033[1m[setup]\033[0m %s\n' "$*" >&2; }

# The wasm-bindgen CLI must equal the wasm-bindgen crate in Cargo.lock exactly.
wasm_bindgen_version() {
  if [ -f Cargo.lock ]; then
    awk '/^name = "wasm-bindgen"$/ {getline; gsub(/version = |"/, ""); print; exit}' Cargo.lock
  else
    sed -n 's/^wasm-bindgen = .*"=\([0-9.]*\)".*/\1/p' Cargo.toml | head -n1
  fi
}

ensure_target() {
  if rustup target list --installed | grep -qx wasm32-unknown-unknown; then
    log "wasm32 target: present"
  else
    log "wasm32 target: installing"
    rustup target add wasm32-unknown-unknown
  fi
}

# The page's wasm is built with its standard library recompiled for size (see wasm_env below):
# that needs the library's source.
ensure_rust_src() {
  if [ -d "$(rustc --print sysroot)/lib/rustlib/src/rust/library/std" ]; then
    log "rust-src: present"
  else
    log "rust-src: installing (the standard library's source, for the size-tuned wasm build)"
    rustup component add rust-src
  fi
}

ensure_trunk() {
  local have
  have=$(trunk --version 2>/dev/null | awk '{print $2}' || true)
  if [ "$have" = "$TRUNK_VERSION" ]; then
    log "trunk $have: present"
  else
    log "trunk: found '${have:-none}', installing $TRUNK_VERSION (about 14 minutes on 2 cores)"
    cargo install --locked trunk --version "$TRUNK_VERSION" --force
  fi
}

ensure_wasm_bindgen() {
  local want have
  want=$(wasm_bindgen_version)
  have=$(wasm-bindgen --version 2>/dev/null | awk '{print $2}' || true)
  if [ "$have" = "$want" ]; then
    log "wasm-bindgen-cli $have: present"
  else
    log "wasm-bindgen-cli: found '${have:-none}', installing $want (about 5 minutes)"
    # No --locked: the CLI's own lockfile pins a crate version the registry mirror lacks.
    cargo install wasm-bindgen-cli --version "$want" --force
  fi
}

ensure_wasm_opt() {
  local have
  have=$(wasm-opt --version 2>/dev/null | sed -n 's/.*version \([0-9]*\).*/\1/p' || true)
  if [ "$have" = "$BINARYEN_VERSION" ]; then
    log "wasm-opt $have: present"
  else
    log "wasm-opt: found '${have:-none}', installing binaryen@$BINARYEN_VERSION from npm"
    # Debian's binaryen (108) produces wasm that fails in the browser; it also blocks the npm install.
    if dpkg -s binaryen >/dev/null 2>&1; then apt-get remove -y binaryen; fi
    npm install -g "binaryen@$BINARYEN_VERSION"
    hash -r
  fi
}

TWIGGY_VERSION=0.8.0
# twiggy (crates.io) reads the wasm's code by function for the size ledger.
ensure_twiggy() {
  local have
  have=$(twiggy --version 2>/dev/null | awk '{print $2}' || true)
  if [ "$have" = "$TWIGGY_VERSION" ]; then
    log "twiggy $have: present"
  else
    log "twiggy: found '${have:-none}', installing $TWIGGY_VERSION (about 3 minutes)"
    cargo install --locked twiggy --version "$TWIGGY_VERSION" --force
  fi
}

AXE_VERSION=4.14.1
# axe-core (npm registry) for the accessibility check inside the browser tests; kept in .tools/.
ensure_axe() {
  local have
  have=$(node -e "try{console.log(require('./.tools/node_modules/axe-core/package.json').version)}catch(e){}" 2>/dev/null || true)
  if [ "$have" = "$AXE_VERSION" ]; then
    log "axe-core $have: present"
  else
    log "axe-core: found '${have:-none}', installing $AXE_VERSION from npm into .tools/"
    mkdir -p .tools
    npm install --silent --no-audit --no-fund --prefix .tools "axe-core@$AXE_VERSION"
  fi
}

apt_updated=0
apt_install() {
  if [ "$apt_updated" = 0 ]; then apt-get update -qq; apt_updated=1; fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null
}

ensure_browser() {
  if command -v chromium >/dev/null && command -v chromedriver >/dev/null; then
    log "$(chromium --version 2>/dev/null | head -n1): present"
  else
    log "chromium + chromedriver: installing from Debian"
    apt_install chromium chromium-driver
  fi
}

tools() {
  ensure_target
  ensure_rust_src
  ensure_wasm_opt
  ensure_browser
  ensure_trunk
  ensure_wasm_bindgen
  ensure_axe
  ensure_twiggy
  log "fetching crates"
  cargo fetch --quiet
  # The standard library's own dependencies, for the wasm build below (Trunk runs cargo offline).
  wasm_env cargo fetch --quiet -Zbuild-std=std,panic_abort --target wasm32-unknown-unknown
}

# The environment of the page's wasm build, and only of it (native builds and tests never see it).
# The standard library is recompiled with the page (build-std) and tuned for size: a panic is an
# immediate trap with no message formatting (the engine never panics on any input: the fuzz test
# in tests/it/property_laws.rs), no source locations, and the library's size-optimised paths.
# These are unstable options of the pinned stable toolchain, opened with RUSTC_BOOTSTRAP for this
# build alone. Measured on this page: 284,528 -> 263,475 bytes of gzipped wasm (-21 kB). Without
# them the same code builds with `trunk build --release` and Leptos's erased views alone, and is
# then over the 300,000-byte budget.
wasm_env() {
  RUSTC_BOOTSTRAP=1 \
    CARGO_UNSTABLE_BUILD_STD=std,panic_abort \
    CARGO_UNSTABLE_BUILD_STD_FEATURES=optimize_for_size \
    CARGO_TARGET_WASM32_UNKNOWN_UNKNOWN_RUSTFLAGS="--cfg erase_components -Zunstable-options -Cpanic=immediate-abort -Zlocation-detail=none" \
    "$@"
}

# Size report of dist/, and the budget: the app (wasm + js + css + html) <= 300,000 bytes gzipped.
APP_BUDGET_GZ=300000
size_report() {
  local total=0 f raw gz
  log "size report (bytes, raw and gzip -9):"
  for f in dist/*.wasm dist/*.js dist/*.css dist/index.html; do
    raw=$(wc -c < "$f"); gz=$(gzip -9c "$f" | wc -c); total=$((total + gz))
    printf '  %-48s %9d %9d\n' "$f" "$raw" "$gz" >&2
  done
  printf '  %-48s %9d %9d\n' dist/leeward.html "$(wc -c < dist/leeward.html)" "$(gzip -9c dist/leeward.html | wc -c)" >&2
  log "app total gzipped: $total bytes (budget $APP_BUDGET_GZ)"
  if [ "$total" -gt "$APP_BUDGET_GZ" ]; then
    log "the app is over its size budget"
    return 1
  fi
}

# The size ledger: the release wasm Trunk just built from, optimised as Trunk does but keeping
# its function names, summed by crate and by module of this crate (tests/bench/size_ledger.awk).
ledger() {
  local tmp
  tmp=$(mktemp -d)
  wasm-bindgen --target web --out-dir "$tmp" "${CARGO_TARGET_DIR:-target}/wasm32-unknown-unknown/release/leeward.wasm"
  wasm-opt -Oz --converge --low-memory-unused --flatten --rereloop -Oz --strip-producers --strip-target-features -g --enable-bulk-memory --enable-nontrapping-float-to-int \
    --enable-sign-ext --enable-mutable-globals "$tmp/leeward_bg.wasm" -o "$tmp/named.wasm"
  log "size ledger (raw bytes of the optimised wasm, by crate; generic view code counts under tachys):"
  twiggy top -n 1000000 "$tmp/named.wasm" | awk -f tests/bench/size_ledger.awk >&2
  rm -rf "$tmp"
}

build() {
  log "building dist/ (release, size-tuned, wasm-opt)"
  wasm_env trunk build --release
  log "building dist/leeward.html (single self-contained file)"
  cargo run --quiet --no-default-features --bin leeward-bundle -- dist
  ledger
  size_report
}

# Performance figures: reported, never gated (times vary; the size budget is gated in build).
# --quick runs each criterion benchmark once (a smoke test that they work) instead of measuring.
figures() {
  if [ "${1:-}" = "--quick" ]; then
    log "benchmarks, each run once (cargo bench measures them: ./setup.sh bench)"
    cargo test --benches --quiet
  else
    log "criterion benchmarks (native, opt-level 3)"
    cargo bench --bench engine -- --warm-up-time 1 --measurement-time 3
  fi
  log "browser figures (headless Chromium; reported only)"
  cargo run --quiet --example browser_timing || log "browser timing failed (reported only)"
  log "CoolProp side by side (PyPI CoolProp==8.0.0; reported only)"
  if python3 -c "import CoolProp" 2>/dev/null || python3 -m pip install --quiet "CoolProp==8.0.0" >/dev/null 2>&1; then
    python3 tests/bench/coolprop_ratio.py || log "CoolProp comparison failed (reported only)"
  else
    log "CoolProp could not be installed: comparison skipped"
  fi
}

case "${1:-}" in
  tools) tools ;;
  build) tools; build ;;
  serve)
    tools; build
    log "serving dist/ on http://127.0.0.1:8080/  (single file: dist/leeward.html)"
    exec cargo run --quiet --no-default-features --bin leeward-serve -- dist 127.0.0.1:8080
    ;;
  test)
    tools; build
    log "engine alone (no web feature)"
    cargo test --no-default-features --lib
    log "everything, the browser tests against dist/ included (a plain cargo test lists them as ignored)"
    mkdir -p target
    cargo test -- --include-ignored 2>&1 | tee target/test-everything.log
    ran=$(grep -cE '^test browser::[a-z_:0-9]+ \.\.\. ok$' target/test-everything.log || true)
    want=$(cat tests/it/browser/*.rs | grep -c '#\[ignore = "browser:')
    log "browser tests run: $ran of $want"
    if [ "$ran" -ne "$want" ]; then
      log "not every browser test ran and passed: that is a failure, not a skip"
      exit 1
    fi
    figures --quick
    ;;
  bench)
    tools; build
    figures
    ;;
  *) echo "usage: $0 serve|test|bench|build|tools" >&2; exit 2 ;;
esac
