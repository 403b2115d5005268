/**
 * Plain-text descriptions of the plant and the controller for the report:
 * what a reviewer needs to recognise the loop, in the trade's notation.
 */
import type { AnalysisRequest } from '../../contract/schemas/analysis-request.js';
import { formatNumber } from '../format-number.js';

/** A polynomial in s, descending powers: [0.028, 0.43, 1] → "0.028 s² + 0.43 s + 1". */
export function polynomialText(coefficients: readonly number[]): string {
  const n = coefficients.length - 1;
  const terms: string[] = [];
  coefficients.forEach((c, i) => {
    if (c === 0) return;
    const power = n - i;
    const magnitude = Math.abs(c);
    const coefficient = magnitude === 1 && power > 0 ? '' : formatNumber(magnitude, 4);
    const variable = power === 0 ? '' : power === 1 ? 's' : `s${superscript(power)}`;
    const term = [coefficient, variable].filter(Boolean).join(' ');
    terms.push(terms.length === 0 ? (c < 0 ? `−${term}` : term) : `${c < 0 ? '−' : '+'} ${term}`);
  });
  return terms.length ? terms.join(' ') : '0';
}

function superscript(n: number): string {
  const digits = '⁰¹²³⁴⁵⁶⁷⁸⁹';
  return String(n)
    .split('')
    .map((d) => digits[Number(d)])
    .join('');
}

const delayText = (delay: number | undefined) => (delay ? ` · e^(−${formatNumber(delay, 4)} s)` : '');
const rootText = (r: number | { re: number; im: number }) =>
  typeof r === 'number' ? formatNumber(r, 4) : `${formatNumber(r.re, 4)} ${r.im < 0 ? '−' : '+'} ${formatNumber(Math.abs(r.im), 4)}j`;

export function describePlant(plant: AnalysisRequest['plant']): string {
  switch (plant.kind) {
    case 'transfer-function':
      return `P(s) = (${polynomialText(plant.numerator)}) / (${polynomialText(plant.denominator)})${delayText(plant.delay)}`;
    case 'zeros-poles':
      return `P(s) = ${formatNumber(plant.gain, 4)} · zeros [${plant.zeros.map(rootText).join(', ')}] / poles [${plant.poles.map(rootText).join(', ')}]${delayText(plant.delay)}`;
    case 'state-space':
      return `State-space model with ${plant.a.length} state(s)${plant.delay ? `, input delay ${formatNumber(plant.delay, 4)} s` : ''}`;
    case 'expression':
      return `P(s) = ${plant.expression}`;
    case 'frequency-response': {
      const n = plant.frequency?.length;
      return `Measured frequency response${n ? ` (${n} points from ${formatNumber(plant.frequency![0])} to ${formatNumber(plant.frequency![n - 1])} ${plant.frequencyUnit ?? 'rad/s'})` : ' (CSV table)'}`;
    }
  }
}

export function describeController(controller: AnalysisRequest['controller']): string {
  if (!controller) return 'None: the plant is the loop transfer function L.';
  const filter = controller.derivativeFilter
    ? 'n' in controller.derivativeFilter
      ? `, derivative filter N = ${formatNumber(controller.derivativeFilter.n, 4)}`
      : `, derivative filter Tf = ${formatNumber(controller.derivativeFilter.timeConstant, 4)} s`
    : '';
  if (controller.form === 'parallel') {
    return `PID, parallel form: kp = ${formatNumber(controller.kp ?? 0, 4)}, ki = ${formatNumber(controller.ki ?? 0, 4)} 1/s, kd = ${formatNumber(controller.kd ?? 0, 4)} s${filter}`;
  }
  const parts = [`K = ${formatNumber(controller.gain, 4)}`];
  if (controller.integralTime !== undefined) parts.push(`Ti = ${formatNumber(controller.integralTime, 4)} s`);
  if (controller.derivativeTime) parts.push(`Td = ${formatNumber(controller.derivativeTime, 4)} s`);
  const kind = controller.derivativeTime ? 'PID' : controller.integralTime !== undefined ? 'PI' : 'P';
  return `${kind}, ${controller.form} form: ${parts.join(', ')}${filter}`;
}
