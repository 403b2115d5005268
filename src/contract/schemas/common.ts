import { z } from 'zod';

/** A JSON number; finiteness is checked before the schema (non-finite → 422). */
export const num = z.number();
export const time = (description: string) => z.number().describe(`${description} (seconds, ≥ 0)`);
export const complexNumber = z.object({ re: num, im: num }).strict();
export const root = z.union([num, complexNumber]).describe('A real root, or {re, im}; complex roots need their conjugates.');
export const matrix = z.array(z.array(num));
/** The request hash every answer carries (contract/request-hash.ts defines the encoding). */
export const requestHashField = z
  .string()
  .describe('sha256: and the hex SHA-256 of the canonical request encoding v1 (sorted keys, numbers as binary64; see the README), to cite exactly what was analysed');
