/**
 * A refused check (the error JSON of the service, or a LoopgateError
 * in-process) → one line naming the file and the field, e.g.
 * `loops.json: loops[2].plant.denominator: The denominator is zero (zero_denominator)`.
 */
import { formatPath } from '../contract/input-guards.js';

interface Refusal {
  code?: string;
  message?: string;
  issues?: { path: (string | number)[]; message: string }[];
}

export function describeRefusal(file: string, refusal: Refusal): string {
  const issue = refusal.issues?.[0];
  const where = issue ? formatPath(issue.path) : '(body)';
  const message = issue && refusal.code === 'validation_failed' ? issue.message : (refusal.message ?? issue?.message ?? 'refused');
  const more = refusal.issues && refusal.issues.length > 1 ? ` (and ${refusal.issues.length - 1} more issue(s))` : '';
  return `${file}: ${where}: ${message}${refusal.code ? ` [${refusal.code}]` : ''}${more}`;
}
