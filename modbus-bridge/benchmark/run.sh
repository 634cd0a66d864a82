#!/usr/bin/env bash
# Modbus TCP request rate of drumloop's server against a C reference server (libmodbus), both
# measured with the same C client (refload.c) on 127.0.0.1, for 1 and for 8 connections at once.
# Needs gcc and the Debian package libmodbus-dev, and the built bench (mvn -B install -DskipTests).
#
#   modbus-bridge/benchmark/run.sh [SECONDS] [ROUNDS]
#
# The two servers are measured in alternating rounds so that other load on the machine hits both
# alike; the load average is printed beside every figure. Not part of the test suite.
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
root="$(cd "$here/../.." && pwd)"
seconds="${1:-10}"
rounds="${2:-3}"
build="$(mktemp -d)"
trap 'kill $(jobs -p) 2>/dev/null || true; rm -rf "$build"' EXIT
gcc -O2 -Wall -Wextra -o "$build/refload" "$here/refload.c" -lmodbus -lpthread
gcc -O2 -Wall -Wextra -o "$build/refserver" "$here/refserver.c" -lmodbus
jar="$root/bench/target/drumloop.jar"
[ -f "$jar" ] || { echo "build first: mvn -B install -DskipTests" >&2; exit 2; }

ref_port=15020
our_port=15021
"$build/refserver" "$ref_port" &
java -XX:+UseSerialGC -jar "$jar" serve-plant --map aux-holding --tcp "127.0.0.1:$our_port" >"$build/serve.log" 2>&1 &
sleep 3

for ((r = 1; r <= rounds; r++)); do
  for conns in 1 8; do
    echo "round $r, load $(cut -d' ' -f1-3 /proc/loadavg)"
    printf '  libmodbus  '; "$build/refload" 127.0.0.1 "$ref_port" "$seconds" "$conns" 20
    printf '  drumloop   '; "$build/refload" 127.0.0.1 "$our_port" "$seconds" "$conns" 20
  done
done
