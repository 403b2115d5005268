import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { formatJunit } from '../../src/gate/format-junit.js';
import { runChecks } from '../../src/gate/run-checks.js';
import { thirdOrderGainFor, thirdOrderLag } from './support/closed-form-loops.js';

const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '@', isArray: (name) => ['testcase', 'property', 'testsuite'].includes(name) });

async function report(failOnWarn = false) {
  const result = await runChecks({
    criteria: { profile: 'baseline' },
    loops: [
      { name: 'filler-pump speed', plant: thirdOrderLag(0.5) }, // GM = 12 → 21.6 dB; passes
      { name: 'pasteuriser <temperature> & "hold"', plant: thirdOrderLag(thirdOrderGainFor(5)) }, // GM 5 dB: fails
      { name: 'unstable loop', plant: thirdOrderLag(7) }, // K > 6: unstable
      { name: 'resonant', plant: thirdOrderLag(0.5), criteria: { maxComplementaryPeak: 0.9 } }, // Mt = 1 > 0.9: warns
    ],
  });
  const xml = formatJunit(result, { suiteName: 'plant-loops.json', failOnWarn });
  return { result, xml, doc: parser.parse(xml) };
}

describe('formatJunit', () => {
  it('writes well-formed XML: one testcase per loop, named by the loop, failures holding the findings', async () => {
    const { result, xml, doc } = await report();
    expect(XMLValidator.validate(xml)).toBe(true);
    const suite = doc.testsuites.testsuite[0];
    expect(suite['@name']).toBe('plant-loops.json');
    expect(suite['@tests']).toBe('4');
    expect(suite['@failures']).toBe('2');
    expect(doc.testsuites['@failures']).toBe('2');
    const cases = suite.testcase as Record<string, any>[];
    expect(cases.map((c) => c['@name'])).toEqual(result.loops.map((l) => l.name));
    expect(cases[1]['@name']).toBe('pasteuriser <temperature> & "hold"');

    expect(cases[0].failure).toBeUndefined();
    const gm = cases[1].failure;
    expect(gm['@type']).toBe('loopgate.fail');
    expect(gm['@message']).toContain('gain_margin_low');
    expect(gm['#text']).toContain('Gain margin 5.00 dB');
    expect(gm['#text']).toContain('Skogestad & Postlethwaite');
    expect(cases[2].failure['@message']).toContain('closed_loop_unstable');
    // A warning alone is not a failure; it is shown in system-out.
    expect(cases[3].failure).toBeUndefined();
    expect(cases[3]['system-out']).toContain('complementary_peak_high');
  });

  it('with failOnWarn, a warning loop is a failure too', async () => {
    const { doc } = await report(true);
    const cases = doc.testsuites.testsuite[0].testcase as Record<string, any>[];
    expect(doc.testsuites.testsuite[0]['@failures']).toBe('3');
    expect(cases[3].failure['@type']).toBe('loopgate.warn');
  });

  it('records version, request hash and profile as suite properties', async () => {
    const { result, doc } = await report();
    const props = Object.fromEntries(doc.testsuites.testsuite[0].properties.property.map((p: Record<string, string>) => [p['@name'], p['@value']]));
    expect(props).toEqual({ 'loopgate.version': result.version, 'loopgate.requestHash': result.requestHash, 'loopgate.profile': 'baseline', 'loopgate.verdict': 'fail' });
  });

  it('stays well-formed with names holding characters XML forbids', async () => {
    const result = await runChecks({ loops: [{ name: 'bell\u0007 and \uD800 lone', plant: thirdOrderLag(0.5) }] });
    const xml = formatJunit(result, { suiteName: 'x' });
    expect(XMLValidator.validate(xml)).toBe(true);
  });
});
