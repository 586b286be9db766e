"""Writes the graph-measure fixtures of this folder with networkx.

  /usr/bin/python3 make_graph_fixtures.py measures   -> karate_networkx.json
  /usr/bin/python3 make_graph_fixtures.py readback   -> coupling_karate_networkx.json (reads coupling_karate.graphml,
                                                        written by the library's GraphML writer)

Run from this folder with Debian's Python and python3-networkx (see README.md).
"""
import json
import sys

import networkx as nx
from networkx.algorithms import community

SEEDS = range(10)


def first_appearance(labels):
    """Relabel a list of labels 1, 2, ... in order of first appearance."""
    seen = {}
    return [seen.setdefault(x, len(seen) + 1) for x in labels]


def partition_labels(graph, parts):
    label = {}
    for i, part in enumerate(parts):
        for v in part:
            label[v] = i
    return first_appearance([label[v] for v in sorted(graph.nodes)])


def weighted_efficiency(graph):
    """Latora-Marchiori efficiency with edge length 1 / weight (Rubinov and Sporns 2010)."""
    n = graph.number_of_nodes()
    h = nx.Graph()
    h.add_nodes_from(graph.nodes)
    h.add_edges_from((a, b, {"length": 1.0 / d["weight"]}) for a, b, d in graph.edges(data=True))
    total = 0.0
    for source, lengths in nx.all_pairs_dijkstra_path_length(h, weight="length"):
        total += sum(1.0 / d for target, d in lengths.items() if target != source)
    return total / (n * (n - 1))


def describe(graph):
    nodes = sorted(graph.nodes)
    comps = {}
    for i, comp in enumerate(sorted(nx.connected_components(graph), key=min)):
        for v in comp:
            comps[v] = i
    club = [0 if graph.nodes[v]["club"] == "Mr. Hi" else 1 for v in nodes]
    split = [{v for v in nodes if club[v] == c} for c in (0, 1)]
    louvain = []
    for seed in SEEDS:
        parts = community.louvain_communities(graph, weight="weight", resolution=1, seed=seed)
        louvain.append({
            "seed": seed,
            "modules": partition_labels(graph, parts),
            "modularity": community.modularity(graph, parts, weight="weight"),
        })
    return {
        "edges": [[a, b, graph[a][b]["weight"]] for a, b in sorted(tuple(sorted(e)) for e in graph.edges)],
        "clustering": [nx.clustering(graph)[v] for v in nodes],
        "clustering_weighted": [nx.clustering(graph, weight="weight")[v] for v in nodes],
        "average_clustering": nx.average_clustering(graph),
        "average_clustering_weighted": nx.average_clustering(graph, weight="weight"),
        "efficiency": nx.global_efficiency(graph),
        "efficiency_weighted": weighted_efficiency(graph),
        "components": nx.number_connected_components(graph),
        "component_of": first_appearance([comps[v] for v in nodes]),
        "split": club,
        "split_modularity": community.modularity(graph, split, weight="weight"),
        "louvain": louvain,
    }


def measures():
    weighted = nx.karate_club_graph()
    binary = nx.Graph(weighted)
    for a, b in binary.edges:
        binary[a][b]["weight"] = 1
    strong = nx.Graph(weighted)
    strong.remove_edges_from([(a, b) for a, b, d in weighted.edges(data=True) if d["weight"] < 3])
    out = {
        "library": f"networkx {nx.__version__}",
        "source": "networkx.karate_club_graph() (Zachary 1977), nodes 0..33",
        "graphs": {"binary": describe(binary), "weighted": describe(weighted), "strong": describe(strong)},
    }
    with open("karate_networkx.json", "w") as f:
        json.dump(out, f, indent=1)


def readback():
    g = nx.read_graphml("coupling_karate.graphml")
    nodes = sorted(g.nodes, key=lambda v: int(v[1:]))
    modules = {}
    for v in nodes:
        modules.setdefault(g.nodes[v]["module"], set()).add(v)
    out = {
        "library": f"networkx {nx.__version__}",
        "directed": g.is_directed(),
        "graph": dict(g.graph),
        "nodes": [dict(id=v, **g.nodes[v]) for v in nodes],
        "edges": [dict(source=a, target=b, **d) for a, b, d in sorted(g.edges(data=True), key=lambda e: (int(e[0][1:]), int(e[1][1:])))],
        "networkx_on_readback": {
            "clustering_weighted": [nx.clustering(g, weight="weight")[v] for v in nodes],
            "efficiency": nx.global_efficiency(g),
            "modularity_of_module_attribute": community.modularity(g, list(modules.values()), weight="weight"),
        },
    }
    with open("coupling_karate_networkx.json", "w") as f:
        json.dump(out, f, indent=1)


if __name__ == "__main__":
    {"measures": measures, "readback": readback}[sys.argv[1]]()
