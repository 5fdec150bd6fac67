#!/usr/bin/env bash
# Executes every notebook in notebooks/ headless with the GoNB kernel, writing the executed
# notebook and its HTML rendering to the output folder given as $1 (default out/notebooks).
# Prints one line per notebook and a closing line "N passed, N failed"; exits 1 if any failed.
set -u
cd "$(dirname "$0")/.."
out="${1:-out/notebooks}"
mkdir -p "$out"
pass=0
fail=0

# check_outputs fails if a code cell that displays something (nb.Show, nb.Table, nb.Footer,
# nb.Markdown, fmt.Print...) came back without output: a lost display is a failure too.
check_outputs() {
	/usr/bin/python3 - "$1" <<'PY'
import json, re, sys
nb = json.load(open(sys.argv[1]))
bad = []
for i, c in enumerate(nb["cells"]):
    src = "".join(c["source"]) if isinstance(c["source"], list) else c["source"]
    if c["cell_type"] == "code" and re.search(r"\bnb\.(Show|Table|Footer|Markdown)\(|fmt\.Print", src) and not c.get("outputs"):
        bad.append(i)
if bad:
    print("cells with display calls but no output:", bad)
    sys.exit(1)
PY
}
for nb in notebooks/*.ipynb; do
	name="$(basename "$nb" .ipynb)"
	log="$out/$name.log"
	if jupyter nbconvert --to notebook --execute --ExecutePreprocessor.timeout=900 \
		--ExecutePreprocessor.kernel_name=gonb --output-dir "$out" "$nb" >"$log" 2>&1 &&
		check_outputs "$out/$name.ipynb" >>"$log" 2>&1 &&
		jupyter nbconvert --to html --output-dir "$out" "$out/$name.ipynb" >>"$log" 2>&1; then
		echo "notebook ok   $nb -> $out/$name.html"
		pass=$((pass + 1))
	else
		echo "notebook FAIL $nb (log: $log)"
		tail -n 30 "$log" | sed 's/^/    /'
		fail=$((fail + 1))
	fi
done
echo "executed notebooks and HTML are in $out/"
echo "notebooks: $pass passed, $fail failed"
[ "$fail" -eq 0 ]
