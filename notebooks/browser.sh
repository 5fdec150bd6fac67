#!/usr/bin/env bash
# Opens every rendered notebook HTML in the output folder ($1, default out/notebooks) in
# headless Chromium, as a reader would, saves a screenshot per notebook (NAME.png beside the
# HTML), and fails a notebook whose page shows an error output, an empty display, an image that
# does not load, or a JavaScript error. Prints one line per notebook and "browser: N passed,
# N failed"; exits 1 if any failed.
set -u
cd "$(dirname "$0")/.."
out="${1:-out/notebooks}"
if ! command -v chromium >/dev/null; then
	echo "browser: chromium not found (Debian: apt-get install chromium; make setup installs it as root)"
	exit 1
fi
pass=0
fail=0
for html in "$out"/*.html; do
	[ -e "$html" ] || { echo "browser: no HTML in $out"; exit 1; }
	case "$html" in *.dom.html) rm -f "$html"; continue ;; esac # left by an interrupted run
	name="$(basename "$html" .html)"
	profile="$(mktemp -d)"
	flags=(--headless --no-sandbox --disable-gpu --disable-quic --no-first-run --disable-background-networking
		--disable-component-update --disable-sync --user-data-dir="$profile" --virtual-time-budget=10000)
	url="file://$(realpath "$html")"
	chromium "${flags[@]}" --window-size=1300,4000 --screenshot="$out/$name.png" "$url" >/dev/null 2>&1
	chromium "${flags[@]}" --enable-logging=stderr --v=0 --dump-dom "$url" >"$out/$name.dom.html" 2>"$out/$name.browser.log"
	rm -rf "$profile"
	if /usr/bin/python3 - "$out/$name.dom.html" "$out/$name.browser.log" "$out/$name.png" <<'PY'; then
import re, sys, os
dom = open(sys.argv[1], encoding="utf-8", errors="replace").read()
log = open(sys.argv[2], encoding="utf-8", errors="replace").read()
bad = []
if len(dom) < 1000:
    bad.append("page did not render")
if not os.path.exists(sys.argv[3]) or os.path.getsize(sys.argv[3]) < 10000:
    bad.append("no screenshot")
# JavaScript errors and failed loads, as Chromium logs them from the page's console.
for line in log.splitlines():
    if ":CONSOLE" in line and re.search(r"Uncaught|Error", line):
        bad.append("JavaScript: " + line.strip()[:200])
    if "Failed to load resource" in line or "net::ERR_" in line:
        bad.append("load: " + line.strip()[:200])
# Error outputs (tracebacks, panics) and empty displays in the rendered outputs.
for m in re.finditer(r'<div class="([^"]*jp-OutputArea-output[^"]*)"([^>]*)>(.*?)</div>\s*</div>', dom, re.S):
    cls, attrs, body = m.groups()
    text = re.sub(r"<[^>]+>", "", body).strip()
    if "application/vnd.jupyter.stderr" in attrs and re.search(r"panic:|Traceback|ERROR", text):
        bad.append("error output: " + text[:200])
    if not text and "<svg" not in body and "<img" not in body:
        bad.append("empty display")
for src in re.findall(r'<img[^>]*src="([^"]*)"', dom):
    if not (src.startswith("data:image/") and len(src) > 100) and not os.path.exists(os.path.join(os.path.dirname(sys.argv[1]), src)):
        bad.append("image does not load: " + src[:80])
if bad:
    print("\n".join(sorted(set(bad))[:20]))
    sys.exit(1)
PY
		echo "browser ok    $html -> $out/$name.png"
		pass=$((pass + 1))
	else
		echo "browser FAIL  $html (screenshot $out/$name.png)"
		fail=$((fail + 1))
	fi
	rm -f "$out/$name.dom.html"
done
echo "browser: $pass passed, $fail failed"
[ "$fail" -eq 0 ]
