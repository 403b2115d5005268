/** Reads the check file: its JSON, with --profile laid over its criteria. Unusable files are CliErrors (exit 2) naming the file. */
import { readFile } from 'node:fs/promises';
import type { ProfileName } from '../gate/criteria-profiles.js';
import { CliError, EXIT } from './exit-codes.js';

export async function readCheckFile(file: string, profile?: ProfileName): Promise<unknown> {
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (err) {
    const reason = (err as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : err instanceof Error ? err.message : String(err);
    throw new CliError(`${file}: cannot read the file (${reason})`, EXIT.unusableInput);
  }
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch (err) {
    throw new CliError(`${file}: not valid JSON (${err instanceof Error ? err.message : String(err)})`, EXIT.unusableInput);
  }
  if (!profile) return body;
  if (body === null || typeof body !== 'object' || Array.isArray(body)) {
    throw new CliError(`${file}: the file must hold a JSON object {"loops": [...]}`, EXIT.unusableInput);
  }
  const b = body as Record<string, unknown>;
  const criteria = b.criteria && typeof b.criteria === 'object' && !Array.isArray(b.criteria) ? b.criteria : {};
  return { ...b, criteria: { ...criteria, profile } };
}
