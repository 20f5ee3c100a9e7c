#!/usr/bin/env python3
"""Puts the solver worker into the page shell, so that both builds start it from a Blob URL
and the single file needs nothing else: the worker's script as text, and its WebAssembly
gzip-compressed and base64-encoded (the page unpacks it with the browser's own
DecompressionStream), which keeps the single file small.

usage: embed_solver.py SHELL SOLVER_JS SOLVER_WASM OUT
"""
import base64
import gzip
import sys

shell_path, js_path, wasm_path, out_path = sys.argv[1:5]
shell = open(shell_path, encoding="utf-8").read()
script = open(js_path, encoding="utf-8").read()
wasm = open(wasm_path, "rb").read()
marker = "<!-- APPORTION_SOLVER -->"
if marker not in shell:
    sys.exit(f"{shell_path} has no {marker} marker")
if "</script" in script.lower():
    sys.exit("the solver script contains '</script' and cannot be inlined")
packed = base64.b64encode(gzip.compress(wasm, compresslevel=9, mtime=0)).decode("ascii")
block = (f'<script type="text/plain" id="apportion-solver">{script}</script>\n'
         f'<script type="text/plain" id="apportion-solver-wasm">{packed}</script>')
with open(out_path, "w", encoding="utf-8") as out:
    out.write(shell.replace(marker, block))
