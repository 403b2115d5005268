#!/usr/bin/env python3
"""The benchmark's peer: the same loop figures computed the usual vectorised
numpy way, on the same grid, for timing against loopgate.

Reads one JSON document on stdin:
  {"analyses": [{"id", "body", "loopgate": {...figures...}}],
   "estimate": {"input": path, "output": path, "samples", "sampleRate", "segmentLength"} | null,
   "seconds": time budget per timing}
and prints one JSON document on stdout with, per case, the median time per
call (microseconds) for detail "summary" and "full" (unless "timeAnalyses"
is false), numpy's figures, and the residuals of loopgate's refined
crossings on the exact model. With --serve it times one case per input line
instead (see serve()), so that the benchmark can alternate with it.

Method (what a notebook would do): evaluate L = C·P on the grid with
np.polyval, unwrap the phase with np.unwrap, find crossings as sign changes
and interpolate linearly in log-frequency, take the peaks of |S| and |T| as
grid maxima refined by a parabola through three points in log-frequency, the
bandwidths by linear interpolation, the Nyquist count from the unwrapped
argument of 1 + L on the grid, and for a rational loop without delay the
closed-loop poles with np.roots (companion-matrix eigenvalues).
No refinement on the model: this is the cost of the figures at grid accuracy.
"""
import json
import statistics
import sys
import time

import numpy as np

SQRT_HALF = np.sqrt(0.5)


def pid(c, s):
    """C(s) for the three PID forms of loopgate's contract (parallel, standard, series)."""
    f = c.get("derivativeFilter")
    if c["form"] == "parallel":
        kp, ki, kd = c.get("kp", 0.0), c.get("ki", 0.0), c.get("kd", 0.0)
        td = kd / kp if kp else 0.0
        tf = (f["timeConstant"] if "timeConstant" in f else td / f["n"]) if f else 0.0
        return kp + ki / s + kd * s / (1 + tf * s)
    k, ti, td = c["gain"], c.get("integralTime"), c.get("derivativeTime", 0.0)
    tf = (f["timeConstant"] if "timeConstant" in f else td / f["n"]) if f else 0.0
    integral = 0.0 if ti is None else 1 / (ti * s)
    if c["form"] == "standard":
        return k * (1 + integral + td * s / (1 + tf * s))
    return k * (1 + integral) * (1 + td * s) / (1 + tf * s)


def measured_columns(plant):
    w = np.asarray(plant["frequency"], dtype=float)
    mag = np.asarray(plant["magnitude"], dtype=float)
    ph = np.asarray(plant["phase"], dtype=float)
    return w, mag, ph


def loop_on_grid(body):
    """The grid and L(jω) on it: the requested log grid, or the measured frequencies."""
    plant = body["plant"]
    grid = body.get("frequency")
    if plant["kind"] == "frequency-response":
        wd, mag, ph = measured_columns(plant)
        if grid:
            w = np.logspace(np.log10(grid["min"]), np.log10(grid["max"]), grid["points"])
            lw = np.log(w)
            lwd = np.log(wd)
            db = np.interp(lw, lwd, 20 * np.log10(mag))
            phase = np.interp(lw, lwd, np.unwrap(np.radians(ph)))
            p = 10 ** (db / 20) * np.exp(1j * phase)
        else:
            w = wd
            p = mag * np.exp(1j * np.radians(ph))
        rational = None
    else:
        w = np.logspace(np.log10(grid["min"]), np.log10(grid["max"]), grid["points"])
        s = 1j * w
        num = np.asarray(plant["numerator"], dtype=float)
        den = np.asarray(plant["denominator"], dtype=float)
        delay = plant.get("delay", 0.0)
        p = np.polyval(num, s) / np.polyval(den, s)
        if delay:
            p = p * np.exp(-s * delay)
        rational = (num, den, delay)
    c = body.get("controller")
    s = 1j * w
    L = p * pid(c, s) if c else p
    return w, L, rational, c


def controller_polynomials(c):
    """Numerator and denominator of C(s), for the closed-loop polynomial."""
    f = c.get("derivativeFilter")
    if c["form"] == "parallel":
        kp, ki, kd = c.get("kp", 0.0), c.get("ki", 0.0), c.get("kd", 0.0)
        td = kd / kp if kp else 0.0
        tf = (f["timeConstant"] if "timeConstant" in f else td / f["n"]) if f else 0.0
    else:
        k, ti, td = c["gain"], c.get("integralTime"), c.get("derivativeTime", 0.0)
        tf = (f["timeConstant"] if "timeConstant" in f else td / f["n"]) if f else 0.0
        if c["form"] == "series":
            num, den = np.array([k]), np.array([1.0])
            if ti is not None:
                num, den = np.polymul(num, [ti, 1]), np.polymul(den, [ti, 0])
            if td:
                num = np.polymul(num, [td, 1])
                if tf:
                    den = np.polymul(den, [tf, 1])
            return num, den
        kp, ki, kd = k, (0.0 if ti is None else k / ti), k * td
    return np.array([kp * tf + kd, kp + ki * tf, ki]), np.array([tf, 1.0, 0.0])


def crossings(x, f):
    """Linear interpolation of the zeros of f between grid points x (log-frequency)."""
    i = np.nonzero(f[:-1] * f[1:] < 0)[0]
    t = f[i] / (f[i] - f[i + 1])
    return i, t, x[i] + t * (x[i + 1] - x[i])


def parabolic_peak(lw, v):
    k = int(np.argmax(v))
    if 0 < k < len(v) - 1:
        y0, y1, y2 = v[k - 1], v[k], v[k + 1]
        d = y0 - 2 * y1 + y2
        if d < 0:
            h = 0.5 * (y0 - y2) / d
            return y1 - 0.25 * (y0 - y2) * h, float(np.exp(lw[k] + h * (lw[k + 1] - lw[k])))
    return v[k], float(np.exp(lw[k]))


def first_level(lw, v, level, rising):
    d = v - level
    hit = np.nonzero(d >= 0 if rising else d <= 0)[0]
    if hit.size == 0 or hit[0] == 0:
        return None
    k = hit[0]
    t = d[k - 1] / (d[k - 1] - d[k])
    return float(np.exp(lw[k - 1] + t * (lw[k] - lw[k - 1])))


def figures(body, full):
    w, L, rational, c = loop_on_grid(body)
    lw = np.log(w)
    mag = np.abs(L)
    phase = np.unwrap(np.angle(L))
    # Gain crossovers and phase margins.
    i, t, x = crossings(lw, np.log(mag))
    pm = np.degrees(phase[i] + t * (phase[i + 1] - phase[i])) + 180
    pm = (pm + 180) % 360 - 180
    wc = np.exp(x)
    # Phase crossovers (Im L changes sign where Re L < 0) and gain margins.
    sin_phase = L.imag / mag
    j, tj, xj = crossings(lw, sin_phase)
    m180 = np.exp(np.log(mag[j]) + tj * (np.log(mag[j + 1]) - np.log(mag[j])))
    # As loopgate: phase crossovers where |L| has fallen below 1e-3 (gain margin above 60 dB) are not reported.
    keep = (L.real[j] < 0) & (m180 >= 1e-3)
    j, tj, xj, m180 = j[keep], tj[keep], xj[keep], m180[keep]
    gm_db = -20 * np.log10(m180)
    # Sensitivities, peaks, bandwidths.
    F = 1 + L
    aF = np.abs(F)
    aS = 1 / aF
    aT = mag / aF
    ms, wms = parabolic_peak(lw, aS)
    mt, wmt = parabolic_peak(lw, aT)
    bw_closed = first_level(lw, aT, aT[0] * SQRT_HALF, rising=False)
    bw_sens = first_level(lw, aS, SQRT_HALF, rising=True)
    # Nyquist count on the grid, with the closed-loop poles for a rational loop without delay.
    arg_f = np.unwrap(np.angle(F))
    poles = None
    if rational is not None and not rational[2]:
        num, den = rational[0], rational[1]
        if c:
            cn, cd = controller_polynomials(c)
            num, den = np.polymul(num, cn), np.polymul(den, cd)
        poles = np.roots(np.polyadd(den, num))
    out = {
        "gainCrossovers": wc.tolist(),
        "phaseMargin": float(pm.min()) if pm.size else None,
        "phaseCrossovers": np.exp(xj).tolist(),
        "gainMarginDb": float(gm_db[np.argmin(np.abs(gm_db))]) if gm_db.size else None,
        "delayMargin": float(np.min(np.radians(pm[pm > 0]) / wc[pm > 0])) if np.any(pm > 0) else None,
        "sensitivityPeak": float(ms),
        "complementaryPeak": float(mt),
        "bandwidth": [bw_closed, bw_sens],
        "nyquistTurns": float((arg_f[-1] - arg_f[0]) / np.pi),
        "unstableClosedLoopPoles": int(np.sum(poles.real >= 0)) if poles is not None else None,
    }
    if full:
        deg = np.degrees
        out["response"] = {
            "frequency": w,
            "loop": (20 * np.log10(mag), deg(phase), L.real, L.imag),
            "sensitivity": (-20 * np.log10(aF), -deg(arg_f)),
            "complementarySensitivity": (20 * np.log10(aT), deg(phase - arg_f)),
        }
    return out


def median_microseconds(f, seconds, min_batches=15):
    """Median CPU time per call over batches of at least 2 ms, after a warm-up (as bench/timing.mjs)."""
    start = time.perf_counter()
    while time.perf_counter() - start < seconds * 0.2:
        f()
    cpu, wall, runs = [], [], 0
    stop = time.perf_counter() + seconds
    while len(cpu) < min_batches or time.perf_counter() < stop:
        w0, c0, n = time.perf_counter(), time.process_time(), 0
        while True:
            f()
            n += 1
            if time.perf_counter() - w0 >= 0.002:
                break
        cpu.append((time.process_time() - c0) / n * 1e6)
        wall.append((time.perf_counter() - w0) / n * 1e6)
        runs += n
    return statistics.median(cpu), statistics.median(wall), runs


def exact_loop(body, w):
    """L(jω) of a parametric loop at chosen frequencies (complex128), to check loopgate's crossings."""
    plant = body["plant"]
    s = 1j * np.asarray(w, dtype=float)
    p = np.polyval(plant["numerator"], s) / np.polyval(plant["denominator"], s) * np.exp(-s * plant.get("delay", 0.0))
    c = body.get("controller")
    return p * pid(c, s) if c else p


def residuals(body, lg):
    """|L(jωc)| − 1 at loopgate's gain crossovers and sin∠L at its phase crossovers, on the exact model."""
    if body["plant"]["kind"] == "frequency-response":
        return None
    out = {}
    wc = lg.get("gainCrossovers") or []
    if wc:
        out["gainCrossover"] = float(np.max(np.abs(np.abs(exact_loop(body, wc)) - 1)))
    w180 = [w for w in (lg.get("phaseCrossovers") or []) if w > 0]
    if w180:
        L = exact_loop(body, w180)
        out["phaseCrossover"] = float(np.max(np.abs(L.imag / np.abs(L))))
    return out


def welch_h1(u, y, fs, n):
    """Welch-averaged H1 and coherence, 50 % overlap, periodic Hann, mean detrend, as one vectorised pass."""
    step = n // 2
    segments = (len(u) - n) // step + 1
    window = 0.5 - 0.5 * np.cos(2 * np.pi * np.arange(n) / n)
    scale = 2 / (fs * np.sum(window ** 2))

    def spectra(x):
        seg = np.lib.stride_tricks.as_strided(x, shape=(segments, n), strides=(x.strides[0] * step, x.strides[0]))
        seg = seg - seg.mean(axis=1, keepdims=True)
        return np.fft.rfft(seg * window, axis=1)

    U = spectra(u)
    Y = spectra(y)
    guu = scale * np.mean(np.abs(U) ** 2, axis=0)
    gyy = scale * np.mean(np.abs(Y) ** 2, axis=0)
    gyu = scale * np.mean(np.conj(U) * Y, axis=0)
    h = gyu / guu
    coherence = np.abs(gyu) ** 2 / (guu * gyy)
    frequency = 2 * np.pi * np.fft.rfftfreq(n, 1 / fs)
    return frequency, np.abs(h), np.degrees(np.unwrap(np.angle(h))), coherence, segments


def serve():
    """--serve: one timing per line, so that bench/core.mjs can take turns with it.

    Each line of stdin is {"body", "detail", "seconds"}; each answer is one line
    {"microseconds", "wallMicroseconds", "runs"}. Ends at end of input.
    """
    for line in sys.stdin:
        if not line.strip():
            continue
        job = json.loads(line)
        body, full = job["body"], job["detail"] == "full"
        us, wall, runs = median_microseconds(lambda: figures(body, full), job["seconds"])
        print(json.dumps({"microseconds": us, "wallMicroseconds": wall, "runs": runs}), flush=True)


def main():
    job = json.load(sys.stdin)
    seconds = job.get("seconds", 1.0)
    result = {"numpy": np.__version__, "python": sys.version.split()[0], "analyses": [], "estimate": None}
    for case in job["analyses"]:
        body = case["body"]
        entry = {"id": case["id"], "figures": figures(body, False)}
        # The analysis timings are taken in turns with loopgate's (serve); this run may skip them.
        for detail in ("summary", "full") if job.get("timeAnalyses", True) else ():
            us, wall, runs = median_microseconds(lambda: figures(body, detail == "full"), seconds)
            entry[detail] = {"microseconds": us, "wallMicroseconds": wall, "runs": runs}
        entry["loopgateResiduals"] = residuals(body, case.get("loopgate") or {})
        result["analyses"].append(entry)
    est = job.get("estimate")
    if est:
        u = np.fromfile(est["input"], dtype="<f8")
        y = np.fromfile(est["output"], dtype="<f8")
        run = lambda: welch_h1(u, y, est["sampleRate"], est["segmentLength"])
        us, wall, runs = median_microseconds(run, seconds * 3, min_batches=5)
        frequency, magnitude, _, coherence, segments = run()
        k = len(frequency) // 8
        result["estimate"] = {
            "microseconds": us,
            "wallMicroseconds": wall,
            "runs": runs,
            "segments": segments,
            "check": {"frequency": float(frequency[k]), "magnitude": float(magnitude[k]), "coherence": float(coherence[k])},
        }
    json.dump(result, sys.stdout)


if __name__ == "__main__":
    serve() if "--serve" in sys.argv[1:] else main()
