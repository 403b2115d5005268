import { describe, expect, it } from 'vitest';
import { ProgressBar, renderProgress } from '../../src/cli/progress-bar.js';

function stream(isTTY: boolean) {
  const written: string[] = [];
  return { isTTY, columns: 60, written, write: (t: string) => written.push(t) };
}

describe('progress bar', () => {
  it('renders the share done within the width', () => {
    expect(renderProgress(0, 4, 80)).toBe(`[${'-'.repeat(40)}] 0/4 loops`);
    expect(renderProgress(2, 4, 80)).toBe(`[${'#'.repeat(20)}${'-'.repeat(20)}] 2/4 loops`);
    expect(renderProgress(1000, 1000, 30).length).toBeLessThanOrEqual(30);
  });

  it('draws on a terminal after the delay, and clears its line at the end', () => {
    const err = stream(true);
    const bar = new ProgressBar(err, true, 0);
    bar.update(1, 2);
    bar.finish();
    expect(err.written[0]).toBe(`\r${renderProgress(1, 2, 60)}`);
    expect(err.written.at(-1)).toBe('\r\x1b[K');
  });

  it('stays quiet when stdout or stderr is not a terminal, and before the delay', () => {
    for (const [errTty, outTty, delay] of [[true, false, 0], [false, true, 0], [true, true, 60_000]] as const) {
      const err = stream(errTty);
      const bar = new ProgressBar(err, outTty, delay);
      bar.update(1, 2);
      bar.finish();
      expect(err.written).toEqual([]);
    }
  });
});
