/**
 * Reads the configuration from the environment once, at start. A bad value
 * throws ConfigError naming every offending variable; server.ts prints it
 * and exits with code 2.
 */
import { EnvSchema, type Env } from './env-schema.js';

export type Config = Env;

export class ConfigError extends Error {
  constructor(readonly problems: string[]) {
    super(`loopgate cannot start; fix these environment variables:\n${problems.map((p) => `  - ${p}`).join('\n')}`);
    this.name = 'ConfigError';
  }
}

/** Parses the variables loopgate knows; unknown ones are ignored. Empty strings count as unset. */
export function loadConfig(env: Record<string, string | undefined> = process.env): Config {
  const known = Object.keys(EnvSchema.shape);
  const input: Record<string, string> = {};
  for (const key of known) {
    const value = env[key];
    if (value !== undefined && value.trim() !== '') input[key] = value;
  }
  const result = EnvSchema.safeParse(input);
  if (!result.success) {
    throw new ConfigError(
      result.error.issues.map((i) => {
        const name = String(i.path[0] ?? '(environment)');
        // A key is a secret: name the variable and the rule, never echo the value.
        const shown = name === 'LOOPGATE_API_KEYS' ? '' : ` (got ${JSON.stringify(input[name])})`;
        return `${name}: ${i.message}${shown}`;
      }),
    );
  }
  return result.data;
}

/** The configuration with every default: what tests and in-process callers use. */
export const defaultConfig = (): Config => loadConfig({});
