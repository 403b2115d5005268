/**
 * Text made safe for XML 1.0: the five markup characters escaped, and the
 * characters XML 1.0 does not allow at all (most C0 controls, lone
 * surrogates, U+FFFE/U+FFFF) replaced by U+FFFD.
 */
// eslint-disable-next-line no-control-regex
const NOT_XML = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' };

export const xmlText = (s: string): string => s.replace(NOT_XML, '\uFFFD').replace(/[&<>"']/g, (c) => ENTITIES[c]);
