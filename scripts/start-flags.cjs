'use strict';
// Start-up flags for the `twofold` command, given by running the command in a child process
// started with them (V8 takes these flags only at start-up):
// - a heap limit on very large inputs (issue 12: analyze and report of a million-row file
//   within 1 GB of memory). Left to itself, V8 lets the heap grow to about twice what the
//   analysis keeps alive before it collects the garbage in earnest; with its old generation
//   capped it collects sooner, and the output is the same, byte for byte (docs/performance.md);
// - a single-threaded collector for a batch on worker threads (issue 14, see childFlags).
//
// The child gets the same arguments, working folder, standard input and output; its standard
// error is passed on as it comes. Should the child run out of memory under the limit (an
// input far beyond a million rows), V8's report of it is not shown: one line says so and the
// command runs once more, here, without the limit, so a large input is never refused for
// memory. Only commands that write their outputs atomically at their end run this way
// (REPEATABLE), so the failed run leaves nothing half written.
const { statSync } = require('node:fs');

/** Inputs above this total (bytes) run with the heap limit: about 430,000 rows of our CSV; a real test's file is well under 1 MB. */
const CAP_FROM_BYTES = 24e6;
/** The old generation's limit, MB; measured at a million rows in docs/performance.md. */
const HEAP_CAP_MB = 450;
/** Set in the child: it runs the command itself. */
const CHILD_MARK = 'TWOFOLD_IN_CHILD';
/** Carries the parent's "standard error is a terminal" to the child (prompts, progress bars; cli/io.ts). */
const INTERACTIVE_MARK = 'TWOFOLD_INTERACTIVE';
/** Where V8's report of a heap that ran out begins (it is written to standard error). */
const OOM_REPORT = '<--- Last few GCs --->';

/** The total size of the arguments that name files (flag values included, e.g. --settings FILE). */
function namedFileBytes(argv) {
  let total = 0;
  for (const arg of argv) {
    if (arg.startsWith('-')) continue;
    try {
      const s = statSync(arg);
      if (s.isFile()) total += s.size;
    } catch {
      // Not a file: a command name or a value.
    }
  }
  return total;
}

/** A positive number from the environment, else the default: TWOFOLD_HEAP_CAP_MB and TWOFOLD_HEAP_CAP_FROM_BYTES set others (tests). */
function fromEnv(env, name, fallback, least) {
  const given = Number(env[name]);
  return env[name] !== undefined && Number.isFinite(given) && given >= least ? Math.round(given) : fallback;
}

/**
 * The commands that may run twice (after a child ran out of memory) without a trace of the
 * first run: each writes its outputs only at its end, atomically, and a repeated report
 * reopens the case it saved. Commands that append to a case's reviewer log are not here.
 */
const REPEATABLE = new Set(['analyze', 'band', 'compare', 'inspect', 'report', 'verify']);

/** The batch's worker count: --workers N (or =N), else one per core, as cli/commands/compare.ts counts them. */
function batchWorkers(argv) {
  for (let i = 0; i < argv.length; i++) {
    if (argv[i] === '--workers') return Number(argv[i + 1]);
    if (argv[i].startsWith('--workers=')) return Number(argv[i].slice('--workers='.length));
  }
  return require('node:os').availableParallelism();
}

/**
 * The V8 start-up flags a child should run the command with, or null to run it here:
 * - the heap limit, for a repeatable command whose named files total more than CAP_FROM_BYTES;
 * - `--single-threaded-gc` for a batch (`compare --manifest`) on two or more worker threads:
 *   with a worker per core, the collector's helper threads only take turns with the workers
 *   (a 600-pair batch on 2 cores: 22.4–24.4 s with it, 26.6–28.2 s without;
 *   docs/performance.md). V8 takes it only at start-up (set later, it crashes V8).
 */
function childFlags(argv, env = process.env, execArgv = process.execArgv) {
  if (env[CHILD_MARK] === '1') return null;
  if (!REPEATABLE.has(argv[0])) return null;
  const flags = [];
  if (!execArgv.some((a) => a.startsWith('--max-old-space-size')) && namedFileBytes(argv) > fromEnv(env, 'TWOFOLD_HEAP_CAP_FROM_BYTES', CAP_FROM_BYTES, 0)) {
    flags.push(`--max-old-space-size=${fromEnv(env, 'TWOFOLD_HEAP_CAP_MB', HEAP_CAP_MB, 16)}`);
  }
  if (argv[0] === 'compare' && argv.some((a) => a === '--manifest' || a.startsWith('--manifest=')) && batchWorkers(argv) >= 2 && !execArgv.includes('--single-threaded-gc')) {
    flags.push('--single-threaded-gc');
  }
  return flags.length > 0 ? flags : null;
}

/**
 * Runs the command in a child with `flags`. Resolves to the child's exit code, or to null
 * when the child ran out of memory (the caller then runs the command itself).
 */
function runInChild(argv, flags) {
  return new Promise((resolve) => {
    const env = { ...process.env, [CHILD_MARK]: '1', [INTERACTIVE_MARK]: process.stderr.isTTY ? '1' : '0' };
    // An inspector flag stays with this process: the child would ask for the same port.
    const args = [...process.execArgv.filter((a) => !a.startsWith('--inspect')), ...flags, process.argv[1], ...argv];
    // node:child_process loads only here, when a child is started (about 2 ms of every start otherwise).
    const { spawn } = require('node:child_process');
    const child = spawn(process.execPath, args, { stdio: ['inherit', 'inherit', 'pipe'], env });
    // V8's report begins with an empty line, so a chunk's closing newlines are held back until
    // the next chunk shows they are not the start of it.
    let outOfMemory = false;
    let held = '';
    child.stderr.setEncoding('utf8');
    child.stderr.on('data', (chunk) => {
      if (outOfMemory) return;
      const text = held + chunk;
      const at = text.indexOf(OOM_REPORT);
      if (at >= 0) {
        outOfMemory = true;
        process.stderr.write(text.slice(0, at).replace(/\n$/, ''));
        return;
      }
      const body = text.replace(/\n+$/, '');
      held = text.slice(body.length);
      if (body) process.stderr.write(body);
    });
    const forward = (signal) => child.kill(signal);
    process.on('SIGTERM', forward);
    process.on('SIGHUP', forward);
    child.on('close', (code, signal) => {
      process.off('SIGTERM', forward);
      process.off('SIGHUP', forward);
      if (!outOfMemory && held) process.stderr.write(held);
      if (outOfMemory || signal === 'SIGABRT') resolve(null);
      else resolve(code ?? 1);
    });
  });
}

module.exports = { CAP_FROM_BYTES, REPEATABLE, HEAP_CAP_MB, CHILD_MARK, INTERACTIVE_MARK, namedFileBytes, childFlags, runInChild };
