#!/usr/bin/env bash
# Renders a run's report.html in headless Chromium with networking off, writes a PNG screenshot and checks that
# (1) the PNG is not blank and (2) the page made no network request.
# Usage: .ci/render-report.sh RUN_DIR OUT_PNG
# Installs Debian's chromium when it is missing (CI runs as root on a fresh machine).
set -euo pipefail
if [ $# -ne 2 ]; then
  echo "usage: $0 RUN_DIR OUT_PNG" >&2
  exit 2
fi
run_dir="$1"
out_png="$2"
if [ ! -d "$run_dir" ] || [ ! -f "$run_dir/report.html" ]; then
  echo "render-report: no report.html in $run_dir" >&2
  exit 1
fi
report="$(cd "$run_dir" && pwd)/report.html"

browser="$(command -v chromium || command -v chromium-browser || true)"
if [ -z "$browser" ]; then
  if [ "$(id -u)" -ne 0 ]; then
    echo "render-report: chromium is not installed and this is not root; install it: apt-get install -y chromium" >&2
    exit 1
  fi
  echo "render-report: installing chromium ..." >&2
  apt-get update -qq >/dev/null
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  browser="$(command -v chromium)"
fi

work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
mkdir -p "$(dirname "$out_png")"
rm -f "$out_png"
netlog="$work/netlog.json"
# Networking off: every host name resolves to nothing and any proxied request goes to a closed local port.
timeout 180 "$browser" --headless --no-sandbox --disable-gpu --disable-quic --no-first-run \
  --disable-background-networking --disable-component-update --disable-sync \
  --host-resolver-rules="MAP * ~NOTFOUND" --proxy-server=127.0.0.1:9 \
  --user-data-dir="$work/profile" --log-net-log="$netlog" \
  --screenshot="$out_png" --window-size=1280,4000 \
  "file://$report" >"$work/chromium.log" 2>&1 || {
    echo "render-report: chromium failed:" >&2
    tail -20 "$work/chromium.log" >&2
    exit 1
  }

python3 - "$out_png" "$netlog" <<'PY'
import json, struct, sys, zlib

png_path, netlog_path = sys.argv[1], sys.argv[2]

def pixels(path):
    """Decodes an 8-bit RGB/RGBA PNG (non-interlaced) into rows of bytes."""
    data = open(path, "rb").read()
    if data[:8] != b"\x89PNG\r\n\x1a\n":
        sys.exit("render-report: %s is not a PNG" % path)
    pos, idat, head = 8, [], None
    while pos < len(data):
        length, kind = struct.unpack(">I4s", data[pos:pos + 8])
        body = data[pos + 8:pos + 8 + length]
        if kind == b"IHDR":
            head = struct.unpack(">IIBBBBB", body)
        elif kind == b"IDAT":
            idat.append(body)
        pos += 12 + length
    width, height, depth, colour, _, _, interlace = head
    channels = {2: 3, 6: 4, 0: 1, 4: 2}.get(colour)
    if depth != 8 or channels is None or interlace != 0:
        sys.exit("render-report: unexpected PNG format (depth %d, colour %d)" % (depth, colour))
    raw = zlib.decompress(b"".join(idat))
    stride, bpp = width * channels, channels
    rows, prev, i = [], bytearray(stride), 0
    for _ in range(height):
        f, line = raw[i], bytearray(raw[i + 1:i + 1 + stride])
        i += 1 + stride
        if f == 1:
            for x in range(bpp, stride):
                line[x] = (line[x] + line[x - bpp]) & 255
        elif f == 2:
            line = bytearray((a + b) & 255 for a, b in zip(line, prev))
        elif f == 3:
            for x in range(stride):
                left = line[x - bpp] if x >= bpp else 0
                line[x] = (line[x] + ((left + prev[x]) >> 1)) & 255
        elif f == 4:
            for x in range(stride):
                a = line[x - bpp] if x >= bpp else 0
                b, c = prev[x], (prev[x - bpp] if x >= bpp else 0)
                p = a + b - c
                pa, pb, pc = abs(p - a), abs(p - b), abs(p - c)
                line[x] = (line[x] + (a if pa <= pb and pa <= pc else b if pb <= pc else c)) & 255
        rows.append(bytes(line))
        prev = line
    return width, height, channels, rows

width, height, channels, rows = pixels(png_path)
colours, counts = set(), {}
for y in range(0, height, 4):
    row = rows[y]
    for x in range(0, width * channels, 4 * channels):
        px = row[x:x + 3]
        colours.add(px)
        counts[px] = counts.get(px, 0) + 1
sampled = sum(counts.values())
background = max(counts.values()) / sampled
# A rendered report has text, tables and charts: many colours and well over 2% of pixels off the background
# (common practice, no source; a blank or error page has a few colours and almost everything background).
if len(colours) < 50 or background > 0.98:
    sys.exit("render-report: the screenshot looks blank (%d colours, %.1f%% background)"
             % (len(colours), 100 * background))

log = json.load(open(netlog_path))
types = {v: k for k, v in log["constants"]["logEventTypes"].items()}
page, browser = [], set()
for e in log["events"]:
    p = e.get("params") or {}
    url = p.get("url")
    if not url or types.get(e["type"]) != "URL_REQUEST_START_JOB":
        continue
    if url.startswith("file:") or url.startswith("data:"):
        continue
    # Chromium's own background requests (update, time, account checks) carry no origin; anything the page asks
    # for carries the page's origin ("null" for a file:// page).
    if p.get("initiator") == "not an origin":
        browser.add(url.split("?")[0])
    else:
        page.append(url)
if page:
    sys.exit("render-report: the report made network requests: " + ", ".join(sorted(set(page))[:10]))
print("render-report: %s is %dx%d, %d colours, %.1f%% background; no network request from the page"
      " (%d browser background requests ignored, all blocked)" % (png_path, width, height, len(colours),
                                                                  100 * background, len(browser)))
PY
