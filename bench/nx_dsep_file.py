"""Whole-process reference for `causeway dsep` (bench/cli.ts): reads a native Causeway diagram
file, builds a networkx DiGraph and answers one d-separation query with nx.d_separated
(networkx 2.8.8 as Debian's python3-networkx ships it; is_d_separator from 3.3 on). Prints
{"separated": bool} on stdout, so the benchmark can compare answers as well as times.

    /usr/bin/python3 bench/nx_dsep_file.py DIAGRAM.json FROM,… TO,… [GIVEN,…]
"""
import json, sys
import networkx as nx

path, a, b = sys.argv[1], sys.argv[2], sys.argv[3]
given = sys.argv[4] if len(sys.argv) > 4 else ""
with open(path, encoding="utf-8") as f:
    d = json.load(f)
G = nx.DiGraph()
G.add_nodes_from(v["id"] for v in d["variables"])
G.add_edges_from((e["from"], e["to"]) for e in d["arrows"])
test = getattr(nx, "is_d_separator", None) or nx.d_separated
split = lambda s: set(x for x in s.split(",") if x)
print(json.dumps({"separated": bool(test(G, split(a), split(b), split(given))), "networkx": nx.__version__}))
