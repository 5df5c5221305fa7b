"""Times networkx's d-separation on the benchmark's graphs and queries (read from a JSON file),
so the benchmark can compare Causeway with a general-purpose reference library. CPU time of
this process (time.process_time), as the benchmark measures its own side; each case may ask
for only its first `limit` queries (networkx takes seconds per query on the largest graphs)."""
import json, sys, time
import networkx as nx

spec = json.load(open(sys.argv[1]))
out = []
test = getattr(nx, "is_d_separator", None) or nx.d_separated
for case in spec:
    G = nx.DiGraph()
    G.add_nodes_from(range(case["n"]))
    G.add_edges_from(case["arrows"])
    queries = case["queries"][: case.get("limit", len(case["queries"]))]
    answers = []
    t0 = time.process_time()
    for q in queries:
        answers.append(bool(test(G, set(q["X"]), set(q["Y"]), set(q["Z"]))))
    dt = time.process_time() - t0
    out.append({"n": case["n"], "seconds_per_query": dt / len(queries), "answers": answers})
print(json.dumps({"networkx": nx.__version__, "results": out}))
