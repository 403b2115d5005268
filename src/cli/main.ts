/**
 * The command line: `loopgate check FILE.json [--profile NAME]
 * [--format text|json|junit] [--output PATH] [--server URL] [--fail-on-warn]`.
 * Checks in-process by default (large batches on worker threads), or asks a
 * running service with --server. Never loads the HTTP framework, and
 * loads the analysis code (mathjs among it) only for an in-process check, so
 * --help, argument errors and --server answer at once.
 */
import { writeFile } from 'node:fs/promises';
import { basename } from 'node:path';
import { LoopgateError } from '../contract/errors.js';
import type { CheckResponse } from '../contract/schemas/checks.js';
import { formatJunit } from '../gate/format-junit.js';
import { formatText } from '../gate/format-text.js';
import type { LoopCheckPool } from '../gate/worker-pool.js';
import { VERSION } from '../version.js';
import { checkRemote } from './check-remote.js';
import { describeRefusal } from './describe-refusal.js';
import { CliError, EXIT } from './exit-codes.js';
import { parseArguments, type CheckCommand } from './parse-arguments.js';
import { ProgressBar, type ProgressStream } from './progress-bar.js';
import { readCheckFile } from './read-check-file.js';
import { USAGE } from './usage.js';

export interface CliIo {
  stdout: ProgressStream;
  stderr: ProgressStream;
}

/**
 * In-process, workers pay a start-up cost (loading the model code) that a
 * few hundred simple loops never win back on a small machine; only larger
 * batches use them. The service, with other callers to keep answering,
 * uses the pool from GATE_LIMITS.poolThreshold.
 */
const CLI_POOL_THRESHOLD = 200;

async function checkInProcess(cmd: CheckCommand, body: unknown, io: CliIo): Promise<CheckResponse> {
  const [{ runChecks }, { LoopCheckPool }] = await Promise.all([import('../gate/run-checks.js'), import('../gate/worker-pool.js')]);
  const progress = new ProgressBar(io.stderr, io.stdout.isTTY === true);
  let pool: LoopCheckPool | null = null;
  try {
    return await runChecks(body, {
      pool: () => (pool ??= new LoopCheckPool()),
      poolThreshold: CLI_POOL_THRESHOLD,
      onProgress: (done, total) => progress.update(done, total),
    });
  } catch (err) {
    if (err instanceof LoopgateError) {
      throw new CliError(describeRefusal(cmd.file, err), err.statusCode >= 500 ? EXIT.notRun : EXIT.unusableInput);
    }
    throw err;
  } finally {
    progress.finish();
    await (pool as LoopCheckPool | null)?.close();
  }
}

function report(result: CheckResponse, cmd: CheckCommand): string {
  switch (cmd.format) {
    case 'json':
      return JSON.stringify(result, null, 2) + '\n';
    case 'junit':
      return formatJunit(result, { suiteName: basename(cmd.file), failOnWarn: cmd.failOnWarn });
    case 'text':
      return formatText(result);
  }
}

async function check(cmd: CheckCommand, io: CliIo): Promise<number> {
  const body = await readCheckFile(cmd.file, cmd.profile);
  const result = cmd.server ? await checkRemote(cmd.server, cmd.file, body) : await checkInProcess(cmd, body, io);
  const text = report(result, cmd);
  if (cmd.output) {
    try {
      await writeFile(cmd.output, text);
    } catch (err) {
      throw new CliError(`cannot write the report to ${cmd.output}: ${err instanceof Error ? err.message : String(err)}`, EXIT.unusableInput);
    }
    // The file holds the report; the log still gets the table a person reads.
    io.stdout.write(cmd.format === 'text' ? `wrote ${cmd.output}\n` : formatText(result));
  } else {
    io.stdout.write(text);
  }
  const failing = result.verdict === 'fail' || (cmd.failOnWarn && result.verdict === 'warn');
  return failing ? EXIT.failed : EXIT.passed;
}

/** Runs the command line and returns the exit code. */
export async function runCli(argv: readonly string[], io: CliIo = { stdout: process.stdout, stderr: process.stderr }): Promise<number> {
  try {
    const cmd = parseArguments(argv);
    if (cmd.command === 'help') {
      io.stdout.write(USAGE);
      return EXIT.passed;
    }
    if (cmd.command === 'version') {
      io.stdout.write(`loopgate ${VERSION}\n`);
      return EXIT.passed;
    }
    return await check(cmd, io);
  } catch (err) {
    if (err instanceof CliError) {
      io.stderr.write(`loopgate: ${err.message}\n`);
      return err.exitCode;
    }
    io.stderr.write(`loopgate: internal error: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}\n`);
    return EXIT.notRun;
  }
}
