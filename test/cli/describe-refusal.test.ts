import { describe, expect, it } from 'vitest';
import { describeRefusal } from '../../src/cli/describe-refusal.js';

describe('describeRefusal', () => {
  it('names the file and the field of the first issue, and the code', () => {
    const line = describeRefusal('plant-loops.json', {
      code: 'zero_denominator',
      message: 'loops[2]: The denominator is identically zero.',
      issues: [{ path: ['loops', 2, 'plant', 'denominator'], message: 'The denominator is identically zero.' }],
    });
    expect(line).toBe('plant-loops.json: loops[2].plant.denominator: loops[2]: The denominator is identically zero. [zero_denominator]');
  });

  it("uses the schema issue's own message for validation errors and counts the rest", () => {
    const line = describeRefusal('a.json', {
      code: 'validation_failed',
      message: 'The request does not match the schema: …',
      issues: [
        { path: ['loops', 0, 'name'], message: 'Too small' },
        { path: ['loops', 1, 'name'], message: 'Too small' },
      ],
    });
    expect(line).toBe('a.json: loops[0].name: Too small [validation_failed] (and 1 more issue(s))');
  });

  it('says (body) when there is no path', () => {
    expect(describeRefusal('a.json', { code: 'invalid_json', message: 'The body is not valid JSON.' })).toBe('a.json: (body): The body is not valid JSON. [invalid_json]');
  });
});
