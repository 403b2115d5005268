#!/usr/bin/env node
// The command line; the code is built into dist/ (npm run build).
import { runCli } from '../dist/cli/main.js';

process.exitCode = await runCli(process.argv.slice(2));
