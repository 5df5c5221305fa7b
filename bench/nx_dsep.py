"""Times networkx's d-separation on the benchmark's graphs and queries (read from a JSON file),
so the benchmark can compare Causeway with a general-purpose reference library."""
import json, sys, time
import networkx as nx

spec = json.load(open(sys.argv[1]))
out = []
test = getattr(nx, "is_d_separator", None) or nx.d_separated
for case in spec:
    G = nx.DiGraph()
    G.add_nodes_from(range(case["n"]))
    G.add_edges_from(case["arrows"])
    answers = []
    t0 = time.perf_counter()
    for q in case["queries"]:
        answers.append(bool(test(G, set(q["X"]), set(q["Y"]), set(q["Z"]))))
    dt = time.perf_counter() - t0
    out.append({"n": case["n"], "seconds_per_query": dt / len(case["queries"]), "answers": answers})
print(json.dumps({"networkx": nx.__version__, "results": out}))
