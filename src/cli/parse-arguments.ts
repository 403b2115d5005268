/** Command-line arguments → what to do, or a CliError (exit 2) saying what is wrong. */
import { parseArgs } from 'node:util';
import { PROFILE_NAMES, type ProfileName } from '../gate/criteria-profiles.js';
import { CliError, EXIT } from './exit-codes.js';

export type ReportFormat = 'text' | 'json' | 'junit';

export interface CheckCommand {
  command: 'check';
  file: string;
  profile?: ProfileName;
  format: ReportFormat;
  output?: string;
  server?: URL;
  failOnWarn: boolean;
}

export type Command = CheckCommand | { command: 'help' } | { command: 'version' };

const FORMATS: readonly ReportFormat[] = ['text', 'json', 'junit'];

const usageError = (message: string) => new CliError(`${message} (see loopgate --help)`, EXIT.unusableInput);

export function parseArguments(argv: readonly string[]): Command {
  let parsed;
  try {
    parsed = parseArgs({
      args: [...argv],
      allowPositionals: true,
      strict: true,
      options: {
        profile: { type: 'string' },
        format: { type: 'string' },
        output: { type: 'string' },
        server: { type: 'string' },
        'fail-on-warn': { type: 'boolean' },
        help: { type: 'boolean', short: 'h' },
        version: { type: 'boolean', short: 'v' },
      },
    });
  } catch (err) {
    throw usageError(err instanceof Error ? err.message : String(err));
  }
  const { values, positionals } = parsed;
  if (values.help) return { command: 'help' };
  if (values.version) return { command: 'version' };
  const [command, file, ...rest] = positionals;
  if (command === undefined) throw usageError('No command given; the command is: loopgate check FILE.json');
  if (command !== 'check') throw usageError(`Unknown command "${command}"; the command is: loopgate check FILE.json`);
  if (file === undefined) throw usageError('loopgate check needs the FILE.json to check');
  if (rest.length) throw usageError(`Unexpected argument "${rest[0]}"`);

  const format = (values.format ?? 'text') as ReportFormat;
  if (!FORMATS.includes(format)) throw usageError(`--format must be one of ${FORMATS.join(', ')} (got "${values.format}")`);
  const profile = values.profile;
  if (profile !== undefined && !(PROFILE_NAMES as readonly string[]).includes(profile)) {
    throw usageError(`--profile must be one of ${PROFILE_NAMES.join(', ')} (got "${profile}")`);
  }
  let server: URL | undefined;
  if (values.server !== undefined) {
    try {
      server = new URL(values.server);
    } catch {
      throw usageError(`--server must be a URL such as http://127.0.0.1:8080 (got "${values.server}")`);
    }
    if (server.protocol !== 'http:' && server.protocol !== 'https:') throw usageError(`--server must be an http or https URL (got "${values.server}")`);
  }
  return {
    command: 'check',
    file,
    format,
    failOnWarn: values['fail-on-warn'] ?? false,
    ...(profile ? { profile: profile as ProfileName } : {}),
    ...(values.output !== undefined ? { output: values.output } : {}),
    ...(server ? { server } : {}),
  };
}
