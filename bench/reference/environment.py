"""Plain numpy implementation of Eclipta's environment math, for the benchmark (bench/environment.bench.ts).

The same models as shared/physics: VSOP87B Sun (coefficients handed over by the bench), the Earth's
J2000 equator, Kepler orbits with J2 secular drift of the node, the conical shadow with the two-disk
overlap, the Howell plate-to-sphere view factor, S a F cos(theta) albedo, OLR F infrared. Vectorised
the way a numpy user would write it (whole arrays per operation, no Python loops over samples).

Reads a JSON job on stdin, prints JSON with per-case median milliseconds and results to compare.
"""
import json
import sys
import time

import numpy as np

TWO_PI = 2 * np.pi


def vsop(series, jde):
    """Heliocentric lon, lat, range (J2000 ecliptic) at an array of JDEs: sum of A cos(B + C tau) per power."""
    tau = (np.atleast_1d(jde) - 2451545.0) / 365250.0
    out = []
    for coord in ("L", "B", "R"):
        total = np.zeros_like(tau)
        for power in sorted(series[coord], key=int, reverse=True):
            terms = np.asarray(series[coord][power])
            s = (terms[:, 0:1] * np.cos(terms[:, 1:2] + terms[:, 2:3] * tau[None, :])).sum(axis=0)
            total = total * tau + s
        out.append(total)
    lon, lat, rng = out
    return np.mod(lon, TWO_PI), lat, rng


def sun_vectors(job, jde):
    """Vector from the Earth's centre toward the Sun, J2000 equator, AU, for each JDE."""
    lon, lat, rng = vsop(job["vsop"], jde)
    x = rng * np.cos(lat) * np.cos(lon)
    y = rng * np.cos(lat) * np.sin(lon)
    z = rng * np.sin(lat)
    eps = np.radians(job["obliquityDeg"])
    return np.stack([-x, -(y * np.cos(eps) - z * np.sin(eps)), -(y * np.sin(eps) + z * np.cos(eps))], axis=-1)


def jde_of(ms, job):
    return 2440587.5 + (np.asarray(ms) / 1000.0 + job["ttMinusUtcS"]) / 86400.0


def basis(inc, raan, argp):
    ci, si = np.cos(inc), np.sin(inc)
    cO, sO = np.cos(raan), np.sin(raan)
    cw, sw = np.cos(argp), np.sin(argp)
    p = np.stack([cO * cw - sO * sw * ci, sO * cw + cO * sw * ci, sw * si * np.ones_like(cO)], axis=-1)
    q = np.stack([-cO * sw - sO * cw * ci, -sO * sw + cO * cw * ci, cw * si * np.ones_like(cO)], axis=-1)
    w = np.stack([sO * si, -cO * si, ci * np.ones_like(cO)], axis=-1)
    return p, q, w


def anomaly(orbit, t):
    """True anomaly at times t after periapsis: Newton on Kepler's equation, vectorised."""
    m = orbit["n"] * t
    e = orbit["e"]
    if e == 0:
        return np.mod(m, TWO_PI)
    m = np.mod(m, TWO_PI)
    big_e = np.where(e > 0.8, np.pi, m + e * np.sin(m))
    for _ in range(50):
        step = (big_e - e * np.sin(big_e) - m) / (1 - e * np.cos(big_e))
        big_e = big_e - step
        if np.max(np.abs(step)) < 1e-13:
            break
    nu = 2 * np.arctan2(np.sqrt(1 + e) * np.sin(big_e / 2), np.sqrt(1 - e) * np.cos(big_e / 2))
    return np.mod(nu, TWO_PI)


def shadow_tests(job, cz, r, d):
    """cos(sun + body radius) - cos(separation) and cos(body - sun radius) - cos(separation), plus the pieces for the overlap."""
    d_sun = np.sqrt(d * d - 2 * d * r * cz + r * r)
    cos_sep = (r - d * cz) / d_sun
    sin_sun = np.minimum(1.0, job["sunRadiusKm"] / d_sun)
    cos_sun = np.sqrt(1 - sin_sun * sin_sun)
    sin_b = np.minimum(1.0, job["body"]["radiusKm"] / r)
    cos_b = np.sqrt(1 - sin_b * sin_b)
    clear = cos_b * cos_sun - sin_b * sin_sun - cos_sep
    umbra = np.where(sin_b > sin_sun, cos_b * cos_sun + sin_b * sin_sun - cos_sep, 1.0)
    return clear, umbra, cos_sep, sin_sun, sin_b


def sunlit_fraction(clear, umbra, cos_sep, sin_sun, sin_b):
    a = np.arcsin(sin_sun)
    b = np.arcsin(sin_b)
    c = np.arccos(np.clip(cos_sep, -1, 1))
    with np.errstate(invalid="ignore", divide="ignore"):
        alpha = np.arccos(np.clip((c * c + a * a - b * b) / (2 * c * a), -1, 1))
        beta = np.arccos(np.clip((c * c + b * b - a * a) / (2 * c * b), -1, 1))
        lens = a * a * alpha + b * b * beta - 0.5 * np.sqrt(np.maximum(0, (-c + a + b) * (c + a - b) * (c - a + b) * (c + a + b)))
        partial = np.clip(1 - lens / (np.pi * a * a), 0, 1)
    partial = np.where(c <= a - b, 1 - (b * b) / (a * a), partial)
    return np.where(clear >= 0, 1.0, np.where(umbra <= 0, 0.0, partial))


def view_factor(r, radius, tilt):
    """Howell catalogue, differential plate to sphere, tilted; arrays broadcast."""
    h = r / radius
    x = np.sqrt(h * h - 1)
    cos_l, sin_l = np.cos(tilt), np.sin(tilt)
    full = np.arccos(1 / h)
    with np.errstate(invalid="ignore", divide="ignore"):
        part = (0.5 - np.arcsin(np.clip(x / (h * sin_l), -1, 1)) / np.pi
                + (cos_l * np.arccos(np.clip(-x * cos_l / sin_l, -1, 1)) - x * np.sqrt(np.maximum(0, 1 - h * h * cos_l * cos_l))) / (np.pi * h * h))
    f = np.where(tilt <= full, cos_l / (h * h), np.where(tilt >= np.pi - full, 0.0, np.maximum(0, part)))
    return f


def view_factors(r, radius, normals):
    """View factor of each surface (rows) at each sample (columns). A circular orbit has one radius, so,
    as surface-grid.ts does, one evaluation per surface broadcast over the samples."""
    tilt = np.arccos(np.clip(-normals[:, 2:3], -1, 1))
    if np.all(r == r[0]):
        return np.broadcast_to(view_factor(r[None, :1], radius, tilt), (normals.shape[0], r.size))
    return view_factor(r[None, :], radius, tilt)


def test_at(job, orbit, t, sp, sq, d, which):
    nu = anomaly(orbit, t)
    e = orbit["e"]
    r = orbit["a"] * (1 - e * e) / (1 + e * np.cos(nu))
    clear, umbra, *_ = shadow_tests(job, sp * np.cos(nu) + sq * np.sin(nu), r, d)
    return clear if which == 0 else umbra


def refine(job, orbit, t0, t1, f0_negative, sp, sq, d, which):
    lo, hi = t0.copy(), t1.copy()
    for _ in range(48):
        mid = (lo + hi) / 2
        same = (test_at(job, orbit, mid, sp, sq, d, which) < 0) == f0_negative
        lo = np.where(same, mid, lo)
        hi = np.where(same, hi, mid)
        if np.max(hi - lo) <= 1e-6:
            break
    return lo, hi


def eclipse(job, orbit, clear, umbra, sp, sq, d):
    """Eclipse time per row from the sampled tests (rows x steps): scan, refine each crossing, look for grazing shadows."""
    steps = clear.shape[1]
    dt = orbit["T"] / steps
    totals = []
    crossings_per_row = None
    for which, f in enumerate((clear, umbra)):
        f0 = f
        f1 = np.roll(f, -1, axis=1)
        inside = (f0 < 0) & (f1 < 0)
        total = inside.sum(axis=1) * dt
        rows, ks = np.nonzero((f0 < 0) != (f1 < 0))
        if which == 0:
            crossings_per_row = np.bincount(rows, minlength=f.shape[0])
        if rows.size:
            t0 = ks * dt
            neg = f0[rows, ks] < 0
            lo, hi = refine(job, orbit, t0, t0 + dt, neg, sp[rows], sq[rows], d[rows], which)
            np.add.at(total, rows, np.where(neg, lo - t0, t0 + dt - hi))
        totals.append(total)
    shadow, umbra_s = totals
    graze = np.nonzero((crossings_per_row == 0) & (clear.min(axis=1) >= 0))[0]
    if graze.size:
        centre = np.argmin(clear[graze], axis=1) * dt
        g = (np.sqrt(5) - 1) / 2
        lo, hi = centre - dt, centre + dt
        args = (sp[graze], sq[graze], d[graze], 0)
        for _ in range(60):
            x1 = hi - g * (hi - lo)
            x2 = lo + g * (hi - lo)
            left = test_at(job, orbit, x1, *args) < test_at(job, orbit, x2, *args)
            hi = np.where(left, x2, hi)
            lo = np.where(left, lo, x1)
        t_min = (lo + hi) / 2
        hit = test_at(job, orbit, t_min, *args) < 0
        if hit.any():
            idx = np.nonzero(hit)[0]
            sub = (sp[graze][idx], sq[graze][idx], d[graze][idx], 0)
            exit_lo, _ = refine(job, orbit, t_min[idx], centre[idx] + dt, np.ones(idx.size, bool), *sub)
            _, entry_hi = refine(job, orbit, centre[idx] - dt, t_min[idx], np.zeros(idx.size, bool), *sub)
            np.add.at(shadow, graze[idx], exit_lo - entry_hi)
    umbra_s = np.minimum(umbra_s, shadow)
    return (umbra_s + (shadow - umbra_s) / 2) / orbit["T"]


def loads(job, orbit, t_grid, sp, sq, sw, d_km, flux):
    """Orbit-sampled loads for rows of Suns: returns sunlit (rows x steps), cz, cx, r, shadow tests."""
    nu = anomaly(orbit, t_grid)
    e = orbit["e"]
    r = orbit["a"] * (1 - e * e) / (1 + e * np.cos(nu))
    c, s = np.cos(nu)[None, :], np.sin(nu)[None, :]
    cz = sp[:, None] * c + sq[:, None] * s
    cx = sq[:, None] * c - sp[:, None] * s
    clear, umbra, cos_sep, sin_sun, sin_b = shadow_tests(job, cz, r[None, :], d_km[:, None])
    sunlit = sunlit_fraction(clear, umbra, cos_sep, sin_sun, sin_b)
    return nu, r, cz, cx, clear, umbra, sunlit


def one_orbit(job, case):
    """Case (a): one orbit, every step and surface: incident solar, albedo, IR and absorbed per surface per
    step (surfaces x steps arrays), their orbit averages and peaks, the eclipse. The same quantities as
    computeEnvironmentColumns (shared/physics/environment-columns.ts)."""
    orbit, body = case["orbit"], job["body"]
    sun = sun_vectors(job, jde_of([case["epochMs"]], job))
    d_au = np.linalg.norm(sun, axis=1)
    s = sun / d_au[:, None]
    p, q, w = basis(orbit["i"], np.array([orbit["raan"]]), np.array([orbit["argp"]]))
    sp, sq, sw = (s * p).sum(1), (s * q).sum(1), (s * w).sum(1)
    flux = job["solarConstantWm2"] / d_au ** 2
    t_grid = np.arange(case["steps"]) * orbit["T"] / case["steps"]
    d_km = d_au * job["auKm"]
    nu, r, cz, cx, clear, umbra, sunlit = loads(job, orbit, t_grid, sp, sq, sw, d_km, flux)
    n = np.asarray(case["normals"])
    area, alpha, eps = (np.asarray(case[k])[:, None] for k in ("areaM2", "absorptivity", "emissivity"))
    cos_inc = n[:, 0:1] * cx + n[:, 1:2] * sw[:, None] + n[:, 2:3] * cz
    f = view_factors(r, body["radiusKm"], n)
    solar = flux[0] * sunlit * np.maximum(cos_inc, 0)
    albedo = np.where(cz > 0, flux[0] * case["albedo"] * f * cz, 0.0)
    ir = case["olrWm2"] * f
    absorbed = area * (alpha * (solar + albedo) + eps * ir)
    result = {
        "solarAverage": solar.mean(axis=1), "albedoAverage": albedo.mean(axis=1), "irAverage": ir.mean(axis=1),
        "absorbedAverage": absorbed.mean(axis=1),
        "solarPeak": solar.max(axis=1), "albedoPeak": albedo.max(axis=1), "irPeak": ir.max(axis=1), "absorbedPeak": absorbed.max(axis=1),
        "eclipseFraction": eclipse(job, orbit, clear, umbra, sp, sq, d_km),
    }
    return result


def sweep(job, case):
    """Case (b): one orbit per date, the Sun interpolated between VSOP87 nodes as sun-track.ts does."""
    orbit, body = case["orbit"], job["body"]
    rows = case["rows"]
    ms = case["startMs"] + np.arange(rows) * case["stepDays"] * 86400e3
    h = case["nodeDays"] * 86400e3
    first = case["startMs"] - h
    count = int((ms[-1] - case["startMs"]) // h) + 4
    nodes = sun_vectors(job, jde_of(first + np.arange(count) * h, job))
    u_all = (ms - first) / h
    j = np.clip(np.floor(u_all).astype(int), 1, count - 3)
    u = (u_all - j)[:, None]
    # Abramowitz & Stegun 25.2.13, four-point Lagrange weights
    sun = (-u * (u - 1) * (u - 2) / 6 * nodes[j - 1] + (u + 1) * (u - 1) * (u - 2) / 2 * nodes[j]
           - (u + 1) * u * (u - 2) / 2 * nodes[j + 1] + (u + 1) * u * (u - 1) / 6 * nodes[j + 2])
    d_au = np.linalg.norm(sun, axis=1)
    s = sun / d_au[:, None]
    elapsed = (ms - case["orbitEpochMs"]) / 1000
    p, q, w = basis(orbit["i"], orbit["raan"] + orbit["nodalRate"] * elapsed, orbit["argp"] + orbit["apsidalRate"] * elapsed)
    sp, sq, sw = (s * p).sum(1), (s * q).sum(1), (s * w).sum(1)
    flux = job["solarConstantWm2"] / d_au ** 2
    steps = case["steps"]
    t_grid = np.arange(steps) * orbit["T"] / steps
    d_km = d_au * job["auKm"]
    nu, r, cz, cx, clear, umbra, sunlit = loads(job, orbit, t_grid, sp, sq, sw, d_km, flux)
    n = np.asarray(case["normals"])
    area, alpha, eps = (np.asarray(case[k]) for k in ("areaM2", "absorptivity", "emissivity"))
    f = view_factors(r, body["radiusKm"], n)  # surfaces x steps
    zplus = np.maximum(cz, 0)
    albedo_avg = flux[:, None] * case["albedo"] * (zplus @ f.T) / steps
    ir_avg = case["olrWm2"] * f.mean(axis=1)[None, :]
    solar_avg = np.empty((rows, n.shape[0]))
    for k in range(n.shape[0]):
        cos_inc = n[k, 0] * cx + n[k, 1] * sw[:, None] + n[k, 2] * cz
        solar_avg[:, k] = flux * (sunlit * np.maximum(cos_inc, 0)).mean(axis=1)
    absorbed = area * (alpha * (solar_avg + albedo_avg) + eps * ir_avg)
    return {
        "betaDeg": np.degrees(np.arcsin(np.clip(sw, -1, 1))),
        "eclipseFraction": eclipse(job, orbit, clear, umbra, sp, sq, d_km),
        "absorbedAverage": absorbed,
    }


def main():
    job = json.load(sys.stdin)
    answers = []
    for case in job["cases"]:
        run = one_orbit if case["kind"] == "orbit" else sweep
        times = []
        result = None
        for _ in range(case.get("repeats", job["repeats"])):
            started = time.perf_counter()
            result = run(job, case)
            times.append((time.perf_counter() - started) * 1000)
        answers.append({
            "name": case["name"], "medianMs": float(np.median(times)), "bestMs": float(np.min(times)),
            "result": {k: np.asarray(v).tolist() for k, v in result.items()},
        })
    json.dump({"numpy": np.__version__, "cases": answers}, sys.stdout)


if __name__ == "__main__":
    main()
