import { describe, expect, it } from 'vitest';
import { unwrapBinPhases } from '../../src/estimation/unwrap-bin-phases.js';

function spectrum(phasesDeg: number[], magnitude = 1) {
  const re = Float64Array.from(phasesDeg, (p) => magnitude * Math.cos((p * Math.PI) / 180));
  const im = Float64Array.from(phasesDeg, (p) => magnitude * Math.sin((p * Math.PI) / 180));
  return { re, im };
}

describe('unwrapBinPhases', () => {
  it('follows a delay-like phase ramp through several turns', () => {
    const truth = Array.from({ length: 50 }, (_, k) => -37 * k);
    const { re, im } = spectrum(truth);
    const phase = unwrapBinPhases(re, im);
    truth.forEach((p, k) => expect(phase[k]).toBeCloseTo(p, 9));
  });

  it('anchors at bin 1 on the principal branch, not at DC', () => {
    // A sign-inverting plant: DC phase 180°, bin 1 at −178° (principal value).
    // Anchored at DC, bin 1 would read +182°.
    const { re, im } = spectrum([180, -178, -176]);
    const phase = unwrapBinPhases(re, im);
    expect(phase[1]).toBeCloseTo(-178, 9);
    expect(phase[2]).toBeCloseTo(-176, 9);
    expect(phase[0]).toBeCloseTo(-180, 9);
  });

  it('puts DC on the branch nearest bin 1', () => {
    const { re, im } = spectrum([0, -10, -20]);
    expect(unwrapBinPhases(re, im)[0]).toBeCloseTo(0, 12);
  });
});
