"""The lumped-node network of a thermal model JSON (the shape of POST /api/v1/thermal/solve) as
NumPy arrays, shared by the SciPy references thermal.py and thermal_loops.py."""
from types import SimpleNamespace

import numpy as np

SIGMA = 5.670374419e-8  # Stefan-Boltzmann, CODATA 2018
K0 = 273.15


def network(model):
    nodes = model['nodes']
    n = len(nodes)
    index = {node['name']: i for i, node in enumerate(nodes)}
    steps = model['steps']
    cap = np.array([node['capacitanceJK'] for node in nodes], float)
    rad = np.array([SIGMA * node.get('radiatorAreaM2', 0) * node.get('emissivity', 0) for node in nodes])
    diss = np.array([float(node.get('dissipationW', 0)) for node in nodes])
    absorbed = np.zeros((n, steps))
    for i, node in enumerate(nodes):
        a = node.get('absorbedW', 0)
        absorbed[i, :] = a if isinstance(a, (int, float)) else np.array(a, float)
    ea, eb, eg, er = [], [], [], []
    for c in model.get('couplings', []):
        ea.append(index[c['from']]); eb.append(index[c['to']]); eg.append(c['conductanceWK']); er.append(0.0)
    for c in model.get('radiativeCouplings', []):
        ea.append(index[c['from']]); eb.append(index[c['to']]); eg.append(0.0)
        er.append(SIGMA * c['areaM2'] * c['effectiveEmissivity'] * c['viewFactor'])
    return SimpleNamespace(nodes=nodes, n=n, index=index, steps=steps, period=model['periodS'], cap=cap, rad=rad, diss=diss,
                           absorbed=absorbed, ea=np.array(ea), eb=np.array(eb), eg=np.array(eg), er=np.array(er))
