/**
 * A description that is well formed but cannot be analysed (an improper
 * loop, a zero denominator, a lone complex root...). The contract layer maps
 * it to HTTP 422 with the stable `code` and the field `path`.
 */
export class ModelError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly path: (string | number)[] = [],
  ) {
    super(message);
    this.name = 'ModelError';
  }
}
