/**
 * The expression whitelist (src/model/plants/expression.ts) against
 * everything in mathjs that reaches beyond a pure computation, and against
 * syntax that could smuggle such a reach in. Expected: ModelError with
 * `expression_not_allowed` (or `expression_syntax` / `expression_too_deep`),
 * never a result, never a thrown non-ModelError, never a side effect.
 */
import * as mathjs from 'mathjs';
import { describe, expect, it } from 'vitest';
import { compileExpression, MAX_EXPRESSION_DEPTH } from '../../../src/model/plants/expression.js';
import { ModelError } from '../../../src/model/model-error.js';

function refusal(text: string): ModelError {
  try {
    compileExpression(text);
  } catch (err) {
    expect(err, text).toBeInstanceOf(ModelError);
    return err as ModelError;
  }
  throw new Error(`accepted: ${text}`);
}

// Every mathjs function that evaluates, parses, defines, configures, imports or reaches the host.
const REACHING_FUNCTIONS = [
  'import({x: 1})', 'createUnit("widget")', 'evaluate("1+1")', 'parse("s")', 'compile("s")', 'simplify("s")', 'simplifyCore("s")',
  'derivative("s^2", "s")', 'rationalize("1/s")', 'resolve(s)', 'config({number: "BigNumber"})', 'typed("f", {})', 'help(exp)',
  'chain(s)', 'reviver()', 'replacer()', 'print("$a", {a: 1})', 'format(s)', 'string(s)', 'typeOf(s)', 'clone(s)', 'map([1], exp)',
  'forEach([1], exp)', 'filter([1], exp)', 'apply([1], 1, exp)', 'matrix([1])', 'unit("5 cm")', 'bignumber(1)', 'fraction(1, 3)',
  'complex(1, 2)', 'to(s, cm)', 'lsolve([[1]], [1])', 'sort([s])', 'concat("a", "b")', 'numeric("1", "number")', 'isNaN(s)',
];

describe('expression whitelist', () => {
  it.each(REACHING_FUNCTIONS)('refuses %s', (text) => {
    const err = refusal(text);
    expect(['expression_not_allowed', 'expression_syntax']).toContain(err.code);
  });

  it('leaves mathjs untouched by what it refused (no import, no config change, no new units)', () => {
    // The shared default instance, the one expression.ts parses with; config({}) reads without changing.
    // (The default instance's config is read-only anyway; the number type is still plain doubles.)
    for (const t of REACHING_FUNCTIONS) refusal(t);
    expect(typeof mathjs.evaluate('1/3')).toBe('number');
    expect(() => mathjs.parse('1 widget').compile().evaluate()).toThrow(); // createUnit never ran
    expect(Object.keys(Object.prototype)).toEqual([]);
  });

  it.each([
    ['exp.constructor', 'property access'],
    ['exp.constructor("return process")(s)', 'computed function'],
    ['e["constructor"]', 'property access'],
    ['exp[1](s)', 'computed function'],
    ['s.re', 'property access'],
    ['f(x) = x', 'a function definition'],
    ['x = s', 'an assignment'],
    ['s = 1', 'an assignment'],
    ['[1, 2]', 'a matrix'],
    ['{a: 1}', 'an object'],
    ['s > 1 ? 1 : 2', 'a conditional'],
    ['1:3', 'a range'],
    ['s == 1', 'operator'],
    ['s; 1', 'several statements'],
    ['"text"', 'constant'],
    ['5 cm', 'symbol'],
  ])('refuses %s (%s)', (text, what) => {
    const err = refusal(text);
    expect(err.code).toBe('expression_not_allowed');
    expect(err.message).toContain(what);
  });

  it.each(['i', 'Infinity', 'NaN', 'true', 'null', 'undefined', 'tau', 'phi', 'LN2', 'version', '__proto__', 'constructor', 'x', 'E', 'PI'])(
    'refuses the symbol %s: the only variable is s, the only constants pi and e',
    (text) => {
      const err = refusal(text);
      expect(err.code).toBe('expression_not_allowed');
    },
  );

  it.each(['toString(s)', 'hasOwnProperty(s)', 'valueOf(s)', 's(2)', 'pi(s)', 'sqrt(s, 2)', 'exp()', 'log(s, 10)', '(exp)(s)'])('refuses the call %s', (text) => {
    expect(refusal(text).code).toBe('expression_not_allowed');
  });

  it.each(['1!', 's mod 2', 's and 1', 'not s', 's .* s', "s'", 's | 1', 's << 1'])('refuses the operator in %s', (text) => {
    expect(['expression_not_allowed', 'expression_syntax']).toContain(refusal(text).code);
  });

  it('reads juxtaposition as multiplication, as mathjs does: exp(s)(2) = 2·exp(s)', () => {
    const g = compileExpression('exp(s)(2)');
    const v = g({ re: 0, im: 1 });
    expect(v.re).toBeCloseTo(2 * Math.cos(1), 14); // e^{j} = cos 1 + j sin 1 (Euler's formula)
    expect(v.im).toBeCloseTo(2 * Math.sin(1), 14);
  });

  it('refuses pathological nesting without exhausting the stack', () => {
    const depth = MAX_EXPRESSION_DEPTH + 5;
    expect(refusal(`${'('.repeat(depth)}s${')'.repeat(depth)}`).code).toBe('expression_too_deep');
    expect(refusal(`${'exp('.repeat(depth)}s${')'.repeat(depth)}`).code).toBe('expression_too_deep');
    expect(refusal(Array.from({ length: depth }, () => 's').join('+')).code).toBe('expression_too_deep');
    // Far deeper than the parser's own recursion can take: a syntax error, still a ModelError.
    const err = refusal(`${'('.repeat(50_000)}s${')'.repeat(50_000)}`);
    expect(['expression_syntax', 'expression_too_deep']).toContain(err.code);
  });

  it('refuses 4,000 unary minuses with expression_too_deep, not a stack overflow (a hole this test found)', () => {
    expect(refusal(`${'-'.repeat(3990)}s`).code).toBe('expression_too_deep');
  });

  it('refuses pathological lengths of junk quickly', () => {
    const started = performance.now();
    for (const text of ['s'.repeat(4000), '+'.repeat(4000), '1'.repeat(4000), `${'-'.repeat(3990)}s`, 'é'.repeat(4000), '\u0000'.repeat(100)]) {
      try {
        compileExpression(text);
      } catch (err) {
        expect(err).toBeInstanceOf(ModelError);
      }
    }
    expect(performance.now() - started).toBeLessThan(2_000);
  });
});
