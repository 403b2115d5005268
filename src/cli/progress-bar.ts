/**
 * A progress bar on stderr for batches that take more than a moment. It
 * draws nothing until `delayMs` has passed, and nothing at all unless both
 * stdout and stderr are terminals (so CI logs and pipes stay clean).
 */
export interface ProgressStream {
  isTTY?: boolean;
  columns?: number;
  write(text: string): unknown;
}

export function renderProgress(done: number, total: number, width: number): string {
  const label = ` ${done}/${total} loops`;
  const barWidth = Math.max(10, Math.min(40, width - label.length - 3));
  const filled = total > 0 ? Math.round((barWidth * done) / total) : barWidth;
  return `[${'#'.repeat(filled)}${'-'.repeat(barWidth - filled)}]${label}`;
}

export class ProgressBar {
  private readonly started = Date.now();
  private drawn = false;
  private readonly enabled: boolean;

  constructor(
    private readonly stderr: ProgressStream,
    stdoutIsTty: boolean,
    private readonly delayMs = 500,
  ) {
    this.enabled = stdoutIsTty && stderr.isTTY === true;
  }

  update(done: number, total: number): void {
    if (!this.enabled || Date.now() - this.started < this.delayMs) return;
    this.stderr.write(`\r${renderProgress(done, total, this.stderr.columns ?? 80)}`);
    this.drawn = true;
  }

  /** Clears the bar's line, if one was drawn. */
  finish(): void {
    if (this.drawn) this.stderr.write('\r\x1b[K');
    this.drawn = false;
  }
}
