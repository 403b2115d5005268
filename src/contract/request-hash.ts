/**
 * A hash of the canonical request: JSON with object keys sorted at every
 * level and no white space, hashed with SHA-256. Two requests that differ
 * only in key order or formatting get the same hash, so a review record can
 * cite exactly what was analysed.
 *
 * The canonical text is streamed into the hash in blocks of about 64 KiB
 * rather than built whole: a 1,000,000-sample estimate request is some 40 MB
 * of JSON, which as one string cost more time and memory than the estimate.
 */
import { createHash, hash as oneShot, type Hash } from 'node:crypto';

const BLOCK = 1 << 16;

/** Canonical JSON text under construction; full blocks go to `sink`. */
interface Writer {
  text: string;
  sink: (block: string) => void;
}

/** JSON.stringify of a number: finite numbers as String gives them, others as null. */
const numberText = (v: number) => (Number.isFinite(v) ? String(v) : 'null');

/** Keys made only of these characters need no escaping; JSON.stringify is kept for the rest. */
const PLAIN_KEY = /^[\w.-]*$/;
const keyText = (k: string) => (PLAIN_KEY.test(k) ? `"${k}"` : JSON.stringify(k));

/**
 * Appends the canonical text of `value` to `out.text`. Written with plain
 * string appends rather than a writer object or template pieces per key: a
 * typical request (some 300 characters) took 7 µs before, under 5 after.
 */
function writeCanonical(value: unknown, out: Writer): void {
  if (typeof value === 'number') {
    out.text += numberText(value);
  } else if (value === null || typeof value !== 'object') {
    out.text += JSON.stringify(value) ?? 'null';
  } else if (Array.isArray(value)) {
    out.text += '[';
    for (let i = 0; i < value.length; i++) {
      if (i) out.text += ',';
      const v: unknown = value[i];
      // Numbers (records, coefficients) take the short path, without recursion.
      if (typeof v === 'number') out.text += numberText(v);
      else writeCanonical(v, out);
      if (out.text.length >= BLOCK) {
        out.sink(out.text);
        out.text = '';
      }
    }
    out.text += ']';
  } else {
    const record = value as Record<string, unknown>;
    const keys = Object.keys(record).sort();
    let first = true;
    out.text += '{';
    for (const k of keys) {
      const v = record[k];
      if (v === undefined) continue;
      out.text += first ? `${keyText(k)}:` : `,${keyText(k)}:`;
      first = false;
      writeCanonical(v, out);
    }
    out.text += '}';
  }
}

/** Hands the canonical JSON text of `value` to `sink` in blocks of about BLOCK characters. */
function streamCanonical(value: unknown, sink: (block: string) => void): void {
  const out: Writer = { text: '', sink };
  writeCanonical(value, out);
  if (out.text) sink(out.text);
}

/** The canonical JSON text itself (for tests and for callers who store it). */
export function canonicalJson(value: unknown): string {
  const blocks: string[] = [];
  streamCanonical(value, (b) => blocks.push(b));
  return blocks.join('');
}

export function requestHash(value: unknown): string {
  // Most requests are one block: hash it in one call. A Hash object costs more than
  // hashing a few hundred bytes (2.4 against 0.7 µs for a 300-byte body).
  let first: string | null = null;
  let hash: Hash | null = null;
  streamCanonical(value, (block) => {
    if (hash) hash.update(block);
    else if (first === null) first = block;
    else hash = createHash('sha256').update(first).update(block);
  });
  // (TypeScript does not follow assignments made inside the callback, hence the casts.)
  const streamed = hash as Hash | null;
  return `sha256:${streamed ? streamed.digest('hex') : oneShot('sha256', (first as string | null) ?? '', 'hex')}`;
}
