/**
 * The `twofold` command line: a thin shell over core/. It reads files, parses flags and
 * prints; every computation is a core function.
 */
import { EXIT_BAD_INPUT, EXIT_OTHER, processIo, UsageError, type CliIo } from './io';
import { SOFTWARE_VERSION } from '../core/version';
import { readProblem } from '../host/read-problem';

export type Command = (args: string[], io: CliIo) => Promise<number>;

interface CommandEntry {
  readonly summary: string;
  readonly load: () => Promise<Command>;
}

const COMMANDS: Readonly<Record<string, CommandEntry>> = {
  inspect: { summary: 'show how a breath file was read', load: async () => (await import('./commands/inspect')).run },
  analyze: { summary: 'thresholds, peaks and effort of one test', load: async () => (await import('./commands/analyze')).run },
  compare: { summary: 'day 2 against day 1 (or a batch manifest)', load: async () => (await import('./commands/compare')).run },
  band: { summary: "derive a lab's own test-retest band from repeat tests", load: async () => (await import('./commands/band')).run },
  report: { summary: 'build (and sign) the PDF report of a pair', load: async () => (await import('./commands/report')).run },
  verify: { summary: 'check a signed report and recompute its numbers', load: async () => (await import('./commands/verify')).run },
  override: { summary: "record or withdraw a reviewer's placement of VT1/VT2 in a case", load: async () => (await import('./commands/override')).run },
  recovery: { summary: 'record, correct or list follow-up reports of recovery after each test', load: async () => (await import('./commands/recovery')).run },
  'sign-off': { summary: "record a reviewer's sign-off statement in a case", load: async () => (await import('./commands/sign-off')).run },
  demo: { summary: 'run the whole job on the demo pair', load: async () => (await import('./commands/demo')).run },
};

function usage(): string {
  const lines = Object.entries(COMMANDS).map(([name, c]) => `  ${name.padEnd(9)} ${c.summary}`);
  return `twofold ${SOFTWARE_VERSION}\n\nusage: twofold COMMAND [options]\n\ncommands:\n${lines.join('\n')}\n\nRun 'twofold COMMAND --help' for a command's options.\n`;
}

export async function main(argv: string[], io: CliIo = processIo()): Promise<number> {
  const [name, ...rest] = argv;
  if (!name || name === '--help' || name === '-h') {
    io.out(usage());
    return name ? 0 : EXIT_BAD_INPUT;
  }
  if (name === '--version') {
    io.out(`${SOFTWARE_VERSION}\n`);
    return 0;
  }
  const entry = COMMANDS[name];
  if (!entry) {
    io.err(`twofold: unknown command '${name}'\n\n${usage()}`);
    return EXIT_BAD_INPUT;
  }
  try {
    const command = await entry.load();
    return await command(rest, io);
  } catch (error) {
    if (error instanceof UsageError) {
      io.err(`twofold ${name}: ${error.message}\n`);
      return EXIT_BAD_INPUT;
    }
    // No stack trace reaches a user: a file the system could not open is bad input, named by
    // its path (exit 2); anything else is one sentence (exit 1), the stack only with TWOFOLD_DEBUG=1.
    const errno = error as NodeJS.ErrnoException;
    if (typeof errno?.code === 'string' && typeof errno.path === 'string') {
      io.err(`${errno.path}:0:0: ${readProblem(error, 'file')}\n`);
      return EXIT_BAD_INPUT;
    }
    const detail = io.env.TWOFOLD_DEBUG === '1' && error instanceof Error ? `\n${error.stack ?? ''}` : '';
    io.err(`twofold ${name}: an internal fault stopped this command (${error instanceof Error ? error.message : String(error)}); nothing more was written.${detail}\n`);
    return EXIT_OTHER;
  }
}
