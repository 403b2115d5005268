/** POST the check to a running service with the global fetch (no HTTP framework is loaded for this). */
import type { CheckResponse } from '../contract/schemas/checks.js';
import { CliError, EXIT } from './exit-codes.js';
import { describeRefusal } from './describe-refusal.js';

export async function checkRemote(server: URL, file: string, body: unknown): Promise<CheckResponse> {
  const url = new URL('v1/checks', server.href.endsWith('/') ? server : new URL(`${server.href}/`));
  let response: Response;
  try {
    response = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  } catch (err) {
    const cause = err instanceof Error && err.cause instanceof Error ? err.cause.message : err instanceof Error ? err.message : String(err);
    throw new CliError(`cannot reach the loopgate service at ${url.href}: ${cause}`, EXIT.notRun);
  }
  const text = await response.text();
  let answer: unknown;
  try {
    answer = JSON.parse(text);
  } catch {
    throw new CliError(`the service at ${url.href} answered ${response.status} with something that is not JSON`, EXIT.notRun);
  }
  if (response.status >= 400 && response.status < 500) throw new CliError(describeRefusal(file, answer as object), EXIT.unusableInput);
  if (response.status !== 200) {
    throw new CliError(`the service at ${url.href} answered ${response.status}: ${(answer as { message?: string }).message ?? text.slice(0, 200)}`, EXIT.notRun);
  }
  return answer as CheckResponse;
}
