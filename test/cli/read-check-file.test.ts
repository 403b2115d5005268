import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCheckFile } from '../../src/cli/read-check-file.js';

const dir = mkdtempSync(join(tmpdir(), 'loopgate-read-'));
const write = (name: string, text: string) => {
  writeFileSync(join(dir, name), text);
  return join(dir, name);
};

describe('readCheckFile', () => {
  it('returns the JSON, with --profile laid over the criteria and their overrides kept', async () => {
    const path = write('a.json', JSON.stringify({ criteria: { profile: 'baseline', maxSensitivityPeak: 1.7 }, loops: [] }));
    expect(await readCheckFile(path)).toEqual({ criteria: { profile: 'baseline', maxSensitivityPeak: 1.7 }, loops: [] });
    expect(await readCheckFile(path, 'advisory')).toEqual({ criteria: { profile: 'advisory', maxSensitivityPeak: 1.7 }, loops: [] });
    expect(await readCheckFile(write('b.json', '{"loops": []}'), 'advisory')).toEqual({ criteria: { profile: 'advisory' }, loops: [] });
  });

  it('refuses (exit 2) a missing file, broken JSON, and a --profile on something that is not an object, naming the file', async () => {
    await expect(readCheckFile(join(dir, 'none.json'))).rejects.toMatchObject({ exitCode: 2, message: expect.stringContaining('none.json: cannot read the file (no such file)') });
    await expect(readCheckFile(write('c.json', '{"loops": [}'))).rejects.toMatchObject({ exitCode: 2, message: expect.stringMatching(/c\.json: not valid JSON/) });
    await expect(readCheckFile(write('d.json', '[1, 2]'), 'baseline')).rejects.toMatchObject({ exitCode: 2, message: expect.stringContaining('d.json: the file must hold a JSON object') });
  });
});
