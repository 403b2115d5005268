/**
 * Plant written as an expression in s, e.g. "2*exp(-0.5*s)/((10*s+1)*(s+1))".
 *
 * mathjs parses the text into a syntax tree; nothing of mathjs evaluates it.
 * The tree is checked node by node against a whitelist (numbers, the
 * symbols s, pi and e, + − * / ^, parentheses and a few elementary
 * functions) and compiled into closures of our own over complex numbers.
 * Anything else is refused with the offending token named.
 */
import { parse, type MathNode } from 'mathjs';
import type { Complex } from '../../numeric/complex.js';
import { add, div, mul, sub } from '../../numeric/complex.js';
import { ccos, ccosh, cexp, clog, cpow, csin, csinh, csqrt, ctanh } from '../../numeric/complex-functions.js';
import type { FrequencyModel } from '../frequency-model.js';
import type { ExpressionPlant } from '../plant-description.js';
import { ModelError } from '../model-error.js';

type Compiled = (s: Complex) => Complex;

const FUNCTIONS: Record<string, (z: Complex) => Complex> = {
  exp: cexp,
  sqrt: csqrt,
  sinh: csinh,
  cosh: ccosh,
  tanh: ctanh,
  sin: csin,
  cos: ccos,
  log: clog,
};

const CONSTANTS: Record<string, number> = { pi: Math.PI, e: Math.E };

/** Deepest syntax tree accepted; deeper trees are refused rather than risking the stack. */
export const MAX_EXPRESSION_DEPTH = 200;

export const ALLOWED_EXPRESSION_FUNCTIONS = Object.keys(FUNCTIONS);

function refuse(token: string, why: string, path: (string | number)[]): never {
  throw new ModelError('expression_not_allowed', `The expression uses ${token}, which is not allowed: ${why}`, path);
}

function compileNode(node: MathNode, depth: number, path: (string | number)[]): Compiled {
  if (depth > MAX_EXPRESSION_DEPTH) {
    throw new ModelError('expression_too_deep', `The expression nests deeper than ${MAX_EXPRESSION_DEPTH} levels.`, path);
  }
  const n = node as MathNode & Record<string, any>;
  switch (n.type) {
    case 'ConstantNode': {
      if (typeof n.value !== 'number' || !Number.isFinite(n.value)) refuse(`the constant ${JSON.stringify(String(n.value))}`, 'only finite numbers are constants', path);
      const c = { re: n.value as number, im: 0 };
      return () => c;
    }
    case 'SymbolNode': {
      const name = n.name as string;
      if (name === 's') return (s) => s;
      if (Object.hasOwn(CONSTANTS, name)) {
        const c = { re: CONSTANTS[name], im: 0 };
        return () => c;
      }
      return refuse(`the symbol "${name}"`, 'the only variable is s and the only constants are pi and e', path);
    }
    case 'ParenthesisNode':
      return compileNode(n.content, depth + 1, path);
    case 'OperatorNode': {
      const args = (n.args as MathNode[]).map((a) => compileNode(a, depth + 1, path));
      const op = n.fn as string;
      if (op === 'unaryMinus' && args.length === 1) return (s) => { const v = args[0](s); return { re: -v.re, im: -v.im }; };
      if (op === 'unaryPlus' && args.length === 1) return args[0];
      if (args.length !== 2) return refuse(`the operator "${n.op}"`, 'only + − * / ^ are allowed', path);
      const [a, b] = args;
      switch (op) {
        case 'add': return (s) => add(a(s), b(s));
        case 'subtract': return (s) => sub(a(s), b(s));
        case 'multiply': return (s) => mul(a(s), b(s));
        case 'divide': return (s) => div(a(s), b(s));
        case 'pow': return (s) => cpow(a(s), b(s));
        default: return refuse(`the operator "${n.op}"`, 'only + − * / ^ are allowed', path);
      }
    }
    case 'FunctionNode': {
      const fnNode = n.fn as MathNode & Record<string, any>;
      const name = fnNode.type === 'SymbolNode' ? (fnNode.name as string) : '(computed function)';
      if (!Object.hasOwn(FUNCTIONS, name)) {
        return refuse(`the function "${name}"`, `allowed functions are ${ALLOWED_EXPRESSION_FUNCTIONS.join(', ')}`, path);
      }
      if (n.args.length !== 1) return refuse(`the function "${name}" with ${n.args.length} arguments`, 'each function takes one argument', path);
      const f = FUNCTIONS[name];
      const arg = compileNode(n.args[0], depth + 1, path);
      return (s) => f(arg(s));
    }
    default:
      return refuse(describeNode(n), 'only numbers, s, pi, e, + − * / ^, parentheses and elementary functions are allowed', path);
  }
}

function describeNode(n: Record<string, any>): string {
  const names: Record<string, string> = {
    AccessorNode: 'property access',
    AssignmentNode: 'an assignment',
    FunctionAssignmentNode: 'a function definition',
    ObjectNode: 'an object',
    ArrayNode: 'a matrix or array',
    IndexNode: 'indexing',
    ConditionalNode: 'a conditional (?:)',
    RangeNode: 'a range (:)',
    RelationalNode: 'a comparison',
    BlockNode: 'several statements',
  };
  const text = typeof n.toString === 'function' ? String(n.toString()).slice(0, 60) : n.type;
  return `${names[n.type] ?? n.type} "${text}"`;
}

/** Parses and compiles an expression in s; throws ModelError on anything outside the whitelist. */
export function compileExpression(text: string, path: (string | number)[] = ['plant', 'expression']): Compiled {
  return compileExpressionTree(text, path).evaluate;
}

function compileExpressionTree(text: string, path: (string | number)[]): { evaluate: Compiled; nodes: number } {
  let tree: MathNode;
  try {
    tree = parse(text);
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    throw new ModelError('expression_syntax', `The expression could not be parsed: ${message.slice(0, 200)}`, path);
  }
  // Compile first: it refuses trees deeper than MAX_EXPRESSION_DEPTH, which mathjs's
  // recursive traverse would otherwise meet with a stack overflow (e.g. 4,000 unary minuses).
  const evaluate = compileNode(tree, 0, path);
  let nodes = 0;
  tree.traverse(() => {
    nodes++;
  });
  return { evaluate, nodes };
}

/**
 * Integrators of an expression cannot be read off its text; estimate them
 * from the log-log slope of |G(jω)| between two very low frequencies.
 */
function estimateIntegrators(g: Compiled): number {
  const m1 = Math.hypot(...Object.values(g({ re: 0, im: 1e-7 })) as [number, number]);
  const m2 = Math.hypot(...Object.values(g({ re: 0, im: 1e-6 })) as [number, number]);
  const slope = Math.log10(m2 / m1);
  return Number.isFinite(slope) ? Math.max(0, Math.round(-slope)) : 0;
}

/** Frequencies where the log-log slope of |G| changes noticeably, from a coarse scan. */
function scanCharacteristicFrequencies(g: Compiled): number[] {
  const out: number[] = [];
  let prevSlope = NaN;
  let prev = g({ re: 0, im: 1e-6 });
  let prevW = 1e-6;
  for (let e = -6 + 0.1; e <= 6.0001; e += 0.1) {
    const w = Math.pow(10, e);
    const v = g({ re: 0, im: w });
    const slope = Math.log10(Math.hypot(v.re, v.im) / Math.hypot(prev.re, prev.im)) / 0.1;
    // Only the magnitude: a delay turns the phase at every frequency and would mark them all.
    if (Number.isFinite(prevSlope) && Math.abs(slope - prevSlope) > 0.05) out.push(prevW);
    prevSlope = slope;
    prev = v;
    prevW = w;
  }
  return out.length ? [out[0], out[out.length - 1]] : [1];
}

/**
 * The group delay −dφ/dω at the top of the scan (a delay e^{−sT} inside the
 * expression gives T there), estimated by a small finite difference.
 */
function estimatePhaseRate(g: Compiled): number {
  let rate = 0;
  for (const w of [1e2, 1e3, 1e4]) {
    const a = g({ re: 0, im: w });
    const b = g({ re: 0, im: w * (1 + 1e-6) });
    const turn = Math.atan2(a.re * b.im - a.im * b.re, a.re * b.re + a.im * b.im);
    if (Number.isFinite(turn)) rate = Math.max(rate, -turn / (w * 1e-6));
  }
  return rate;
}

export function expressionModel(plant: ExpressionPlant, path: (string | number)[] = ['plant']): FrequencyModel {
  const { evaluate: g, nodes } = compileExpressionTree(plant.expression, [...path, 'expression']);
  const probe = g({ re: 0, im: 1 });
  if (!Number.isFinite(probe.re) || !Number.isFinite(probe.im)) {
    const probe2 = g({ re: 0, im: 1.37 });
    if (!Number.isFinite(probe2.re) || !Number.isFinite(probe2.im)) {
      throw new ModelError('expression_not_finite', 'The expression does not evaluate to a finite number on the imaginary axis.', [...path, 'expression']);
    }
  }
  const s: Complex = { re: 0, im: 0 };
  return {
    evaluate(omega, out) {
      s.im = omega;
      const v = g(s);
      out.re = v.re;
      out.im = v.im;
      return out;
    },
    rational: null,
    poles: null,
    zeros: null,
    delay: 0,
    phaseRate: estimatePhaseRate(g),
    integrators: estimateIntegrators(g),
    imaginaryAxisPoles: [],
    unstablePoles: plant.openLoopUnstablePoles ?? 0,
    unstablePolesAssumed: plant.openLoopUnstablePoles === undefined,
    relativeDegree: null,
    highFrequencyGain: NaN,
    lowFrequencyGain: NaN,
    characteristicFrequencies: scanCharacteristicFrequencies(g),
    magnitudeBoundAbove: () => Infinity,
    deviationBoundAbove: () => Infinity,
    evaluationCost: nodes,
    exact: true,
  };
}
