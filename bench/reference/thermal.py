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
switching, the state repeats p orbits later (p up to 24); and the estimated distance still to go
(shared/physics/thermal-orbit-correction.ts: K^-1 C F / P - 1/2 (C + P K / 6)^-1 C F, with K the
network linearised at the orbit's mean temperatures and cycling thermostats pinned) is below
toleranceK too. The time and orbits at which the change alone first fell below toleranceK (the
solver's test before the distance was added) are reported as well.
"""
import json
import sys
import time

import numpy as np
from scipy.integrate import solve_ivp
from scipy.sparse import csc_matrix
from scipy.sparse.linalg import splu

from network import K0, network


def main(path):
    with open(path) as f:
        model = json.load(f)
    rtol = model.get('rtol', 1e-5)
    atol = model.get('atolK', 1e-3)
    tol = model.get('toleranceK', 0.01)
    max_orbits = model.get('maxOrbits', 200)
    net = network(model)
    nodes, n, index, steps, period = net.nodes, net.n, net.index, net.steps, net.period
    cap, rad, diss, absorbed = net.cap, net.rad, net.diss, net.absorbed
    ea, eb, eg, er = net.ea, net.eb, net.eg, net.er
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

    def distance(mean_t, drift, span, cycling):
        # The solver's estimate of the distance from the end of the span to the periodic state.
        t3 = mean_t ** 3
        h = eg + er * (mean_t[ea] ** 2 + mean_t[eb] ** 2) * (mean_t[ea] + mean_t[eb])
        diag = 4 * rad * t3 + np.bincount(ea, h, n) + np.bincount(eb, h, n)
        np.add.at(diag, hn[cycling], 1e3 * hp[cycling] / np.maximum(hoff[cycling] - hon[cycling], 1e-3))
        off = csc_matrix((np.concatenate([-h, -h]), (np.concatenate([ea, eb]), np.concatenate([eb, ea]))), shape=(n, n))
        k_mat = off + csc_matrix((diag, (np.arange(n), np.arange(n))), shape=(n, n))
        heat = cap * drift
        shift = csc_matrix((cap / (1e9 * span), (np.arange(n), np.arange(n))), shape=(n, n))
        blend = csc_matrix((6 * cap / span, (np.arange(n), np.arange(n))), shape=(n, n))
        first = splu((k_mat + shift).tocsc()).solve(heat / span)
        second = splu((k_mat + blend).tocsc()).solve(6 * heat / span)
        return float(np.max(np.abs(first - 0.5 * second)))

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
    change_only = None
    on_times = []
    for orbit in range(1, max_orbits + 1):
        orbits = orbit
        t0 = (orbit - 1) * period
        t1 = orbit * period
        start = T.copy()
        t = t0
        ts, ys = [], []
        switched = False
        on_s = np.zeros(len(heaters))
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
            on_s += np.where(state, t_end - t, 0.0)
            if sol.status == 1:
                for k, hit in enumerate(sol.t_events):
                    if len(hit):
                        state[k] = not state[k]
                        switched = True
            t = t_end
        last = np.concatenate(ys, axis=1)
        mean_t = last.mean(axis=1)
        on_times.append(on_s)
        residual = float(np.max(np.abs(T - start)))
        ends.append(T.copy())
        if residual < tol and change_only is None:
            change_only = (orbit, (time.perf_counter() - started) * 1000, (time.process_time() - started_cpu) * 1000)
        if residual < tol and distance(mean_t, T - start, period, (on_s > 0) & (on_s < period)) < tol:
            period_orbits = 1
            break
        if switched and len(heaters):
            for p in range(2, min(24, len(ends) - 1) + 1):
                d = float(np.max(np.abs(T - ends[-1 - p])))
                if d < tol:
                    on_p = np.sum(on_times[-p:], axis=0)
                    if change_only is None:
                        change_only = (orbit, (time.perf_counter() - started) * 1000, (time.process_time() - started_cpu) * 1000)
                    if distance(mean_t, T - ends[-1 - p], p * period, (on_p > 0) & (on_p < p * period)) < tol:
                        period_orbits, residual = p, d
                        break
            if period_orbits:
                break
    elapsed = (time.perf_counter() - started) * 1000
    cpu = (time.process_time() - started_cpu) * 1000
    print(json.dumps({
        'ms': elapsed, 'cpuMs': cpu, 'orbits': orbits, 'periodOrbits': period_orbits, 'converged': period_orbits > 0,
        'residualK': residual, 'rtol': rtol, 'atolK': atol,
        'changeOnly': None if change_only is None else {'orbits': change_only[0], 'ms': change_only[1], 'cpuMs': change_only[2]},
        'temperaturesC': (last - K0).round(4).tolist() if last is not None else [],
    }))


if __name__ == '__main__':
    main(sys.argv[1])
