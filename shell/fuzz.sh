#!/usr/bin/env bash
# fuzz.sh [--smoke | --seconds N | --runs N] [TARGET...]: builds the libFuzzer targets
# (preset `fuzz`: clang with AddressSanitizer and UBSan), makes seed corpora from the demo
# networks and from a small network (converted to every format by the command line), and
# runs each target (all, or the ones named: json csv dimacs graphml payload solve result
# matrix).
#   --smoke      deterministic short run (seed 1, 2,000 inputs per target); part of test.sh
#   --seconds N  each target for N seconds (default 60), corpora kept in build/fuzz/corpus
#   --runs N     each target for N inputs (the long runs of the README: --runs 10000000)
# A finding stops the run with the target's report and leaves the input as crash-* / leak-*
# / timeout-* in build/fuzz/findings; add it as a regression test.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
mode=${1:---seconds}
amount=${2:-60}
shift $(( $# >= 2 ? 2 : $# ))
targets=("$@")
[ ${#targets[@]} = 0 ] && targets=(json csv dimacs graphml payload solve result matrix)
"$root/shell/build.sh" native fuzz >/dev/null

cli=build/native/shell/apportion
corpus=build/fuzz/corpus
findings=build/fuzz/findings
[ "$mode" = --smoke ] && rm -rf "$corpus"
mkdir -p "$findings"
for t in json csv dimacs graphml payload solve result matrix; do mkdir -p "$corpus/$t"; done
work=$(mktemp -d); trap 'rm -rf "$work"' EXIT
# The demos, and a three-node network (invented): small seeds keep each input cheap.
cat > "$work/abc.json" <<'JSON'
{"format": "apportion-network", "version": 1, "nodes": [{"id": "a", "x": 0, "y": 0}, {"id": "b", "x": 0, "y": 0},
 {"id": "c", "x": 0, "y": 0}], "arcs": [{"id": "ab", "from": "a", "to": "b", "capacity": 5},
 {"id": "bc", "from": "b", "to": "c", "capacity": 5}], "demands": [{"id": "d", "origin": "a", "destination": "c", "amount": "max"}]}
JSON
for demo in demo-networks/*.json "$work/abc.json"; do
  name=$(basename "$demo" .json)
  cp "$demo" "$corpus/json/$name.json"
  cp "$demo" "$corpus/solve/$name.json"
  $cli convert "$demo" --to csv "$work/$name" >/dev/null
  { cat "$work/$name.nodes.csv"; printf '\f'; cat "$work/$name.arcs.csv"; printf '\f'; cat "$work/$name.demands.csv"; } \
    > "$corpus/csv/$name.csv"
  $cli convert "$demo" --to dimacs-max "$work/$name.max" >/dev/null 2>&1 && cp "$work/$name.max" "$corpus/dimacs/"
  $cli convert "$demo" --to dimacs-min "$work/$name.min" >/dev/null 2>&1 && cp "$work/$name.min" "$corpus/dimacs/"
  python3 -c 'import json, sys; print(json.dumps({"source": "link", "files": [{"name": "n.json", "text": open(sys.argv[1]).read()}]}))' \
    "$demo" > "$corpus/payload/$name.json"
done
# A small GraphML file (invented) and a result file of the network the result target uses.
cat > "$corpus/graphml/small.graphml" <<'XML'
<?xml version="1.0" encoding="UTF-8"?>
<graphml xmlns="http://graphml.graphdrawing.org/xmlns">
  <key id="cap" for="edge" attr.name="capacity" attr.type="double"/>
  <key id="lbl" for="node" attr.name="label" attr.type="string"/>
  <graph id="g" edgedefault="directed">
    <node id="a"><data key="lbl">Alder Cross</data></node>
    <node id="b"/><node id="c"/>
    <edge id="ab" source="a" target="b"><data key="cap">5</data></edge>
    <edge id="bc" source="b" target="c"><data key="cap">7.5</data></edge>
    <edge source="c" target="a"/>
  </graph>
</graphml>
XML
# Traffic matrices for the three nodes a, b, c (labels "Node a", ...) of the matrix target.
printf ',a,Node b,c\na,,12.5,max\nNode b,3,0,\nc,1e3,"7",\n' > "$corpus/matrix/small.csv"
printf 'corner,c,b\r\nb,0.5,\r\n' > "$corpus/matrix/crlf.csv"
# Demands tables for the same nodes (the matrix target reads each input both ways).
printf 'From\tTo\tAmount\tWeight\nNode a\tc\t4\t2\nb\ta\tmax\t\n' > "$corpus/matrix/pasted.tsv"
printf 'id,label,origin,destination,amount,weight\nk1,"x, y",a,b,,1\nk2,,c,a,3.5,\n' > "$corpus/matrix/table.csv"
for rule in fair concurrent throughput feasible; do $cli $rule "$work/abc.json" --json "$corpus/result/$rule.json" >/dev/null 2>&1 || true; done

status=0
for t in "${targets[@]}"; do
  case "$mode" in
    --smoke) args=(-seed=1 -runs=2000) ;;
    --runs) args=(-runs="$amount") ;;
    *) args=(-max_total_time="$amount") ;;
  esac
  start=$(date +%s)
  log="$work/$t.log"
  if build/fuzz/tests/fuzz/fuzz_$t "${args[@]}" -max_len=65536 -timeout=20 -rss_limit_mb=2048 -print_final_stats=1 \
       -artifact_prefix="$findings/$t-" "$corpus/$t" >"$log" 2>&1; then
    runs=$(grep -o 'stat::number_of_executed_units: [0-9]*' "$log" | awk '{print $2}' || true)
    echo "apportion: fuzz $t: ${runs:-?} inputs in $(( $(date +%s) - start )) s, no findings"
  else
    echo "apportion: fuzz $t FOUND A PROBLEM:" >&2
    tail -40 "$log" >&2
    status=1
  fi
done
exit $status
