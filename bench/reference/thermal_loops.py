#!/usr/bin/env python3
"""Reference for the loop benchmark (issue 14): the same lumped-node network with closed coolant
loops under PI control, integrated with SciPy's solve_ivp (stiff BDF, finite-difference Jacobian
on the known sparsity), orbit after orbit until no node and no coolant lump changes by more than
toleranceK over an orbit.

Reads the model JSON (the shape of POST /api/v1/thermal/solve: nodes with capacitanceJK, initialC,
constant dissipationW, absorbedW per step, radiatorAreaM2, emissivity; conductive and radiative
couplings; closed loops with path, fluidMassKg, specificHeatJKgK, flows and PI gains) from argv[1];
prints one JSON line with the time taken, the orbits and each node's temperatures over the last orbit.

The periodic test is the solver's: the change over an orbit below toleranceK, and the estimated
distance still to go (shared/physics/thermal-orbit-correction.ts: K^-1 C F / P - 1/2 (C + P K / 6)^-1 C F,
with K the network and the loops' symmetric part, lump-node g and m_dot c_p / 2 along the ring,
linearised at the orbit's mean temperatures and the flows at its end) below it too. The orbits and
time at which the change alone first fell below toleranceK are reported as well.

The equations are shared/physics/thermal-loops.ts's: one coolant lump per path element (its share
of the fluid mass), fed by the lump before it; lump and node exchange g (T_node - Tc) with
g = max(UA, m_dot c_p (exp(min(NTU, 12)) - 1)), NTU = UA / (m_dot c_p), so each element's steady
effectiveness is 1 - exp(-NTU). The flow is nominal + kp e + I, clamped to [min, max], with
e = T_control - set point and dI/dt = ki e except where the flow or I sits at a limit the error
pushes it past (anti-windup). The loads are the model's own function of time, the same on both
sides: the absorbed samples interpolated linearly between them (thermal-network.ts, which each
implicit step evaluates at its end time); maxStepS (optional) caps SciPy's step, for fine checks.
Here the controller acts continuously; eclipta's holds the flow over
each implicit step, so the two differ by the sampling, well inside the 0.1 K the bench asks.
"""
import json
import sys
import time

import numpy as np
from scipy.integrate import solve_ivp
from scipy.sparse import csc_matrix, lil_matrix
from scipy.sparse.linalg import splu

from network import K0, network
MAX_NTU = 12.0


def main(path):
    with open(path) as f:
        model = json.load(f)
    rtol = model.get('rtol', 1e-5)
    atol = model.get('atolK', 1e-3)
    tol = model.get('toleranceK', 0.01)
    max_step = model.get('maxStepS', np.inf)
    max_orbits = model.get('maxOrbits', 400)
    net = network(model)
    nodes, n, index, steps, period = net.nodes, net.n, net.index, net.steps, net.period
    cap, rad, diss, absorbed = net.cap, net.rad, net.diss, net.absorbed
    ea, eb, eg, er = net.ea, net.eb, net.eg, net.er

    # Lumps after the nodes, then one integral per loop.
    loops = model['loops']
    lump_node, lump_prev, lump_ua, lump_loop, lump_cap = [], [], [], [], []
    first = n
    for k, loop in enumerate(loops):
        path_ = loop['path']
        m = len(path_)
        for j, element in enumerate(path_):
            lump_node.append(index[element['node']])
            lump_prev.append(first + (j - 1) % m)
            lump_ua.append(element['conductanceWK'])
            lump_loop.append(k)
            lump_cap.append(loop['fluidMassKg'] * loop['specificHeatJKgK'] / m)
        first += m
    lump_node = np.array(lump_node); lump_prev = np.array(lump_prev); lump_ua = np.array(lump_ua, float)
    lump_loop = np.array(lump_loop); lump_cap = np.array(lump_cap, float)
    nl = len(lump_node)
    lumps = np.arange(n, n + nl)
    L = len(loops)
    size = n + nl + L
    cp = np.array([l['specificHeatJKgK'] for l in loops], float)
    ctl = np.array([index[l['controlNode']] for l in loops])
    sp = np.array([l['setPointC'] + K0 for l in loops])
    fmin = np.array([l['minFlowKgS'] for l in loops]); fmax = np.array([l['maxFlowKgS'] for l in loops])
    fnom = np.array([l['nominalFlowKgS'] for l in loops])
    kp = np.array([l.get('proportionalKgSK', 0.0) for l in loops]); ki = np.array([l.get('integralKgSKs', 0.0) for l in loops])
    lo, hi = fmin - fnom, fmax - fnom

    def flows_of(y):
        e = y[ctl] - sp
        return np.clip(fnom + kp * e + y[n + nl:], fmin, fmax)

    def conductances(flow):
        wl = (flow * cp)[lump_loop]
        ntu = np.minimum(lump_ua / np.maximum(wl, 1e-300), MAX_NTU)
        return wl, np.where(wl > 0, np.maximum(lump_ua, wl * np.expm1(ntu)), lump_ua)

    def distance(mean_y, drift, span, flow):
        m = n + nl
        wl, g = conductances(flow)
        rows, cols, vals = [], [], []
        diag = np.zeros(m)
        T = mean_y[:n]
        h = eg + er * (T[ea] ** 2 + T[eb] ** 2) * (T[ea] + T[eb])
        diag[:n] += 4 * rad * T ** 3
        def pair(a, b, c):
            rows.extend([a, b]); cols.extend([b, a]); vals.extend([-c, -c])
            np.add.at(diag, [a, b], c)
        for a, b, c in zip(ea, eb, h):
            pair(a, b, c)
        for j in range(nl):
            pair(lump_node[j], lumps[j], g[j])
            if lump_prev[j] != lumps[j]:
                pair(lumps[j], lump_prev[j], wl[j] / 2)
        k_mat = csc_matrix((vals, (rows, cols)), shape=(m, m)) + csc_matrix((diag, (np.arange(m), np.arange(m))), shape=(m, m))
        c_all = np.concatenate([cap, lump_cap])
        heat = c_all * drift
        eye = lambda d: csc_matrix((d, (np.arange(m), np.arange(m))), shape=(m, m))
        first = splu((k_mat + eye(c_all / (1e9 * span))).tocsc()).solve(heat / span)
        second = splu((k_mat + eye(6 * c_all / span)).tocsc()).solve(6 * heat / span)
        return float(np.max(np.abs(first - 0.5 * second)))

    def loads(t):
        s = (t % period) / period * steps
        i0 = int(np.floor(s)) % steps
        f = s - np.floor(s)
        return absorbed[:, i0] * (1 - f) + absorbed[:, (i0 + 1) % steps] * f

    def rhs(t, y):
        T = y[:n]
        Tc = y[n:n + nl]
        I = y[n + nl:]
        e = T[ctl] - sp
        wanted = fnom + kp * e + I
        wl, g = conductances(np.clip(wanted, fmin, fmax))
        q = loads(t) + diss - rad * T ** 4
        t4 = T ** 4
        flux = eg * (T[ea] - T[eb]) + er * (t4[ea] - t4[eb])
        q -= np.bincount(ea, flux, n)
        q += np.bincount(eb, flux, n)
        exchange = g * (T[lump_node] - Tc)
        q -= np.bincount(lump_node, exchange, n)
        y_all = y
        dTc = (wl * (y_all[lump_prev] - Tc) + exchange) / lump_cap
        pushing = ((wanted >= fmax) & (e > 0)) | ((wanted <= fmin) & (e < 0)) | ((I >= hi) & (e > 0)) | ((I <= lo) & (e < 0))
        dI = np.where(pushing, 0.0, ki * e)
        return np.concatenate([q / cap, dTc, dI])

    sparsity = lil_matrix((size, size))
    for i in range(size):
        sparsity[i, i] = 1
    for a, b in zip(ea, eb):
        sparsity[a, b] = 1; sparsity[b, a] = 1
    for j in range(nl):
        node, lump, prev, k = lump_node[j], lumps[j], lump_prev[j], lump_loop[j]
        sparsity[node, lump] = 1; sparsity[lump, node] = 1; sparsity[lump, prev] = 1
        for col in (ctl[k], n + nl + k):  # the flow depends on the control node and the integral
            sparsity[lump, col] = 1; sparsity[node, col] = 1
    for k in range(L):
        sparsity[n + nl + k, ctl[k]] = 1
    sparsity = sparsity.tocsc()

    T0 = np.array(model['initialK'], float) if 'initialK' in model else np.array([node['initialC'] + K0 for node in nodes], float)
    y = np.concatenate([T0, T0[lump_node], np.zeros(L)])
    samples = np.arange(steps) * period / steps
    started = time.perf_counter()
    started_cpu = time.process_time()
    last = None
    residual = float('inf')
    orbits = 0
    change_only = None
    converged = False
    for orbit in range(1, max_orbits + 1):
        orbits = orbit
        t0 = (orbit - 1) * period
        start = y.copy()
        sol = solve_ivp(rhs, (t0, t0 + period), y, method='BDF', rtol=rtol, atol=atol, jac_sparsity=sparsity, max_step=max_step,
                        t_eval=np.append(samples + t0, t0 + period))
        if not sol.success:
            raise RuntimeError(sol.message)
        last = sol.y[:n, :-1]
        y = sol.y[:, -1]
        residual = float(np.max(np.abs(y[:n + nl] - start[:n + nl])))
        if residual < tol and change_only is None:
            change_only = (orbit, (time.perf_counter() - started) * 1000, (time.process_time() - started_cpu) * 1000)
        if residual < tol:
            mean_y = sol.y[:n + nl, :-1].mean(axis=1)
            if distance(mean_y, y[:n + nl] - start[:n + nl], period, flows_of(y)) < tol:
                converged = True
                break
    elapsed = (time.perf_counter() - started) * 1000
    cpu = (time.process_time() - started_cpu) * 1000
    print(json.dumps({
        'ms': elapsed, 'cpuMs': cpu, 'orbits': orbits, 'converged': converged, 'residualK': residual,
        'changeOnly': None if change_only is None else {'orbits': change_only[0], 'ms': change_only[1], 'cpuMs': change_only[2]},
        'temperaturesC': (last - K0).round(4).tolist() if last is not None else [],
    }))


if __name__ == '__main__':
    main(sys.argv[1])
