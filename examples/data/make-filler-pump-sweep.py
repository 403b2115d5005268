#!/usr/bin/env python3
"""Writes examples/data/filler-pump-sweep.csv: DEMO DATA, not a measurement.

The bottling plant's filler-pump speed loop (src/demo/bottling-plant.ts) is
designed on the model P(s) = 0.92·e^(−0.02 s)/((0.35 s + 1)(0.08 s + 1))
(drive command % → pump speed % of rated). This script plays the part of a
stepped-sine sweep on the "real" pump: the same model plus the 5 ms
first-order filter of the speed encoder, which the design model leaves out,
read through output noise. All numbers are invented demo numbers.

Noise: the sweep reports the magnitude-squared coherence
γ² = |P|²/(|P|² + σ²) of a constant output-noise level σ, and each point
carries the random error of an estimate averaged over nd = 16 periods,
relative standard deviation ε = sqrt(1 − γ²)/(|γ|·sqrt(2·nd)) in both
magnitude and phase (radians) (Bendat & Piersol, Random Data, 4th ed.,
§9.2.4). The random draws are seeded, so the file is reproducible.

Standard library only, so it runs wherever python3 does:
    python3 examples/data/make-filler-pump-sweep.py > examples/data/filler-pump-sweep.csv
"""
import cmath
import math
import random

GAIN = 0.92           # %/%
MOTOR_LAG = 0.35      # s, motor and pump inertia
HYDRAULIC_LAG = 0.08  # s, build-up of hydraulic load torque
DELAY = 0.02          # s, fieldbus and scan delay
ENCODER_FILTER = 0.005  # s, the speed encoder's filter (not in the design model)
NOISE = 0.0012        # output-noise level σ, same units as |P|
AVERAGES = 16         # periods averaged per sweep step
F_MIN, F_MAX, POINTS = 0.05, 20.0, 36  # Hz, log-spaced steps


def pump_response(omega):
    s = 1j * omega
    return GAIN * cmath.exp(-DELAY * s) / ((MOTOR_LAG * s + 1) * (HYDRAULIC_LAG * s + 1) * (ENCODER_FILTER * s + 1))


def main():
    rng = random.Random(20240611)
    print('# DEMO DATA (invented, not a measurement): bottling-plant filler-pump speed, drive command % -> speed % of rated.')
    print('# Written by examples/data/make-filler-pump-sweep.py; stepped-sine sweep, 16 periods averaged per step.')
    print('# Units: frequency Hz, magnitude dB, phase deg, coherence 0..1.')
    print('frequency,magnitude,phase,coherence')
    previous_phase = 0.0
    for k in range(POINTS):
        f = F_MIN * (F_MAX / F_MIN) ** (k / (POINTS - 1))
        p = pump_response(2 * math.pi * f)
        coherence = abs(p) ** 2 / (abs(p) ** 2 + NOISE ** 2)
        epsilon = math.sqrt(1 - coherence) / (math.sqrt(coherence) * math.sqrt(2 * AVERAGES))
        magnitude = abs(p) * (1 + epsilon * rng.gauss(0, 1))
        phase = cmath.phase(p) + epsilon * rng.gauss(0, 1)
        # Unwrap against the previous step, as the analyser's display does.
        while phase - previous_phase > math.pi:
            phase -= 2 * math.pi
        while phase - previous_phase < -math.pi:
            phase += 2 * math.pi
        previous_phase = phase
        print(f'{f:.4f},{20 * math.log10(magnitude):.3f},{math.degrees(phase):.2f},{coherence:.6f}')


if __name__ == '__main__':
    main()
