/**
 * A check's answer as JUnit XML, the report format CI systems display: one
 * <testcase> per loop, named by the loop's name, with a <failure> holding
 * the findings when the loop fails (or warns, with failOnWarn). Warnings of
 * a loop that passes go to its <system-out>, where CI pages show them.
 */
import type { CheckResponse, Finding, LoopCheck } from '../contract/schemas/checks.js';
import { formatFinding, formatFigures } from './format-figures.js';
import { xmlText } from './xml-text.js';

export interface JunitOptions {
  /** Name of the test suite, e.g. the checked file's name. */
  suiteName: string;
  /** Warn loops count as failures. */
  failOnWarn?: boolean;
}

const attr = (name: string, value: string | number) => `${name}="${xmlText(String(value))}"`;

function isFailure(loop: LoopCheck, failOnWarn: boolean): boolean {
  return loop.verdict === 'fail' || (failOnWarn && loop.verdict === 'warn');
}

function testcase(loop: LoopCheck, suiteName: string, failOnWarn: boolean): string {
  const lines = [`    <testcase ${attr('name', loop.name)} ${attr('classname', suiteName)}>`];
  const findingText = (fs: Finding[]) => fs.map(formatFinding).join('\n');
  if (isFailure(loop, failOnWarn)) {
    const codes = [...new Set(loop.findings.map((f) => f.code))].join(', ');
    lines.push(
      `      <failure ${attr('message', `${loop.verdict}: ${codes}`)} ${attr('type', `loopgate.${loop.verdict}`)}>${xmlText(findingText(loop.findings))}</failure>`,
    );
  }
  const out = [`profile ${loop.profile}${loop.overridden.length ? ` (overridden: ${loop.overridden.join(', ')})` : ''}`, formatFigures(loop.summary)];
  if (!isFailure(loop, failOnWarn) && loop.findings.length) out.push(findingText(loop.findings));
  lines.push(`      <system-out>${xmlText(out.join('\n'))}</system-out>`, '    </testcase>');
  return lines.join('\n');
}

export function formatJunit(result: CheckResponse, options: JunitOptions): string {
  const failOnWarn = options.failOnWarn ?? false;
  const tests = result.loops.length;
  const failures = result.loops.filter((l) => isFailure(l, failOnWarn)).length;
  const counts = `${attr('tests', tests)} ${attr('failures', failures)} ${attr('errors', 0)} ${attr('skipped', 0)}`;
  const properties = [
    ['loopgate.version', result.version],
    ['loopgate.requestHash', result.requestHash],
    ['loopgate.profile', result.profile],
    ['loopgate.verdict', result.verdict],
  ].map(([n, v]) => `      <property ${attr('name', n)} ${attr('value', v)}/>`);
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<testsuites ${attr('name', 'loopgate')} ${counts}>`,
    `  <testsuite ${attr('name', options.suiteName)} ${counts}>`,
    '    <properties>',
    ...properties,
    '    </properties>',
    ...result.loops.map((l) => testcase(l, options.suiteName, failOnWarn)),
    '  </testsuite>',
    '</testsuites>',
    '',
  ].join('\n');
}
