#!/usr/bin/env python3
"""Reference for the thermal benchmark: the same lumped-node network integrated with SciPy's
solve_ivp (stiff BDF, analytic sparse Jacobian), orbit after orbit until the periodic state.

Reads the model JSON (the shape of POST /api/v1/thermal/solve: nodes with capacitanceJK, initialC,
constant dissipationW, absorbedW per step, radiatorAreaM2, emissivity; conductive and radiative
couplings; thermostat heaters) from the path in argv[1]; prints one JSON line with the time taken,
the orbits and each node's temperatures over the last orbit.

Thermostats switch exactly where a temperature crosses a set point (solve_ivp events, restarting
the integration at each switch); loads are interpolated linearly between the samples. The periodic
test is the solver's: no node changes by more than toleranceK over an orbit, or, with thermostats
switching, the state repeats p orbits later (p up to 24).
"""
import json
import sys
import time

import numpy as np
from scipy.integrate import solve_ivp
from scipy.sparse import csc_matrix

SIGMA = 5.670374419e-8  # Stefan-Boltzmann, CODATA 2018
K0 = 273.15


def main(path):
    with open(path) as f:
        model = json.load(f)
    rtol = model.get('rtol', 1e-5)
    atol = model.get('atolK', 1e-3)
    tol = model.get('toleranceK', 0.01)
    max_orbits = model.get('maxOrbits', 200)
    nodes = model['nodes']
    n = len(nodes)
    index = {node['name']: i for i, node in enumerate(nodes)}
    steps = model['steps']
    period = model['periodS']
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
    ea, eb, eg, er = np.array(ea), np.array(eb), np.array(eg), np.array(er)
    heaters = model.get('heaters', [])
    hn = np.array([index[h['node']] for h in heaters], int)
    hp = np.array([h['powerW'] for h in heaters], float)
    hon = np.array([h['onC'] + K0 for h in heaters])
    hoff = np.array([h['offC'] + K0 for h in heaters])
    state = np.zeros(len(heaters), bool)

    def loads(t):
        s = (t % period) / period * steps
        i0 = int(np.floor(s)) % steps
        f = s - np.floor(s)
        return absorbed[:, i0] * (1 - f) + absorbed[:, (i0 + 1) % steps] * f

    def rhs(t, T):
        q = loads(t) + diss - rad * T ** 4
        q[hn] += np.where(state, hp, 0.0)
        t4 = T ** 4
        flow = eg * (T[ea] - T[eb]) + er * (t4[ea] - t4[eb])
        q -= np.bincount(ea, flow, n)
        q += np.bincount(eb, flow, n)
        return q / cap

    rows = np.concatenate([ea, eb, ea, eb, np.arange(n)])
    cols = np.concatenate([ea, eb, eb, ea, np.arange(n)])

    def jac(t, T):
        t3 = T ** 3
        da = eg + 4 * er * t3[ea]  # d flow / d T_a
        db = eg + 4 * er * t3[eb]  # -d flow / d T_b
        vals = np.concatenate([-da / cap[ea], -db / cap[eb], db / cap[ea], da / cap[eb], -4 * rad * t3 / cap])
        return csc_matrix((vals, (rows, cols)), shape=(n, n))

    def events_for():
        evs = []
        for k in range(len(heaters)):
            def ev(t, T, k=k):
                return T[hn[k]] - (hoff[k] if state[k] else hon[k])
            ev.terminal = True
            ev.direction = 1 if state[k] else -1
            evs.append(ev)
        return evs

    T = np.array([node['initialC'] + K0 for node in nodes], float)
    if 'initialK' in model:
        T = np.array(model['initialK'], float)
    for k in range(len(heaters)):
        state[k] = T[hn[k]] <= hon[k]
    ends = []
    started = time.perf_counter()
    started_cpu = time.process_time()
    samples = np.arange(steps) * period / steps
    last = None
    orbits = 0
    residual = float('inf')
    period_orbits = 0
    for orbit in range(1, max_orbits + 1):
        orbits = orbit
        t0 = (orbit - 1) * period
        t1 = orbit * period
        start = T.copy()
        t = t0
        ts, ys = [], []
        switched = False
        while t < t1 - 1e-9:
            sol = solve_ivp(rhs, (t, t1), T, method='BDF', rtol=rtol, atol=atol, jac=jac,
                            events=events_for(), dense_output=True)
            if not sol.success and sol.status != 1:
                raise RuntimeError(sol.message)
            t_end = sol.t[-1]
            inside = samples + t0
            pick = inside[(inside >= t - 1e-9) & (inside < t_end - 1e-9)]
            if len(pick):
                ts.append(pick)
                ys.append(sol.sol(pick))
            T = sol.y[:, -1]
            if sol.status == 1:
                for k, hit in enumerate(sol.t_events):
                    if len(hit):
                        state[k] = not state[k]
                        switched = True
            t = t_end
        last = np.concatenate(ys, axis=1)
        residual = float(np.max(np.abs(T - start)))
        ends.append(T.copy())
        if residual < tol:
            period_orbits = 1
            break
        if switched and len(heaters):
            for p in range(2, min(24, len(ends) - 1) + 1):
                d = float(np.max(np.abs(T - ends[-1 - p])))
                if d < tol:
                    period_orbits, residual = p, d
                    break
            if period_orbits:
                break
    elapsed = (time.perf_counter() - started) * 1000
    cpu = (time.process_time() - started_cpu) * 1000
    print(json.dumps({
        'ms': elapsed, 'cpuMs': cpu, 'orbits': orbits, 'periodOrbits': period_orbits, 'converged': period_orbits > 0,
        'residualK': residual, 'rtol': rtol, 'atolK': atol,
        'temperaturesC': (last - K0).round(4).tolist() if last is not None else [],
    }))


if __name__ == '__main__':
    main(sys.argv[1])
