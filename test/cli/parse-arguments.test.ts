import { describe, expect, it } from 'vitest';
import { CliError } from '../../src/cli/exit-codes.js';
import { parseArguments } from '../../src/cli/parse-arguments.js';

const refusal = (argv: string[]) => {
  try {
    parseArguments(argv);
  } catch (err) {
    expect(err).toBeInstanceOf(CliError);
    expect((err as CliError).exitCode).toBe(2);
    return (err as CliError).message;
  }
  throw new Error('expected a refusal');
};

describe('parseArguments', () => {
  it('reads the check command with defaults', () => {
    expect(parseArguments(['check', 'loops.json'])).toEqual({ command: 'check', file: 'loops.json', format: 'text', failOnWarn: false });
  });

  it('reads every option', () => {
    const c = parseArguments(['check', 'l.json', '--profile', 'plant-changes', '--format', 'junit', '--output', 'r.xml', '--server', 'http://127.0.0.1:8080', '--fail-on-warn']);
    expect(c).toMatchObject({ command: 'check', file: 'l.json', profile: 'plant-changes', format: 'junit', output: 'r.xml', failOnWarn: true });
    expect(c.command === 'check' && c.server?.href).toBe('http://127.0.0.1:8080/');
  });

  it('help and version win over everything else', () => {
    expect(parseArguments(['check', '--help'])).toEqual({ command: 'help' });
    expect(parseArguments(['-v'])).toEqual({ command: 'version' });
  });

  it('refuses what it cannot use, saying what', () => {
    expect(refusal([])).toMatch(/No command/);
    expect(refusal(['lint', 'x.json'])).toMatch(/Unknown command "lint"/);
    expect(refusal(['check'])).toMatch(/needs the FILE\.json/);
    expect(refusal(['check', 'a.json', 'b.json'])).toMatch(/Unexpected argument "b\.json"/);
    expect(refusal(['check', 'a.json', '--format', 'html'])).toMatch(/--format must be one of text, json, junit/);
    expect(refusal(['check', 'a.json', '--profile', 'strict'])).toMatch(/--profile must be one of baseline, plant-changes/);
    expect(refusal(['check', 'a.json', '--server', 'ftp://host'])).toMatch(/http or https/);
    expect(refusal(['check', 'a.json', '--server', '::'])).toMatch(/must be a URL/);
    expect(refusal(['check', 'a.json', '--verbose'])).toMatch(/verbose/);
  });
});
