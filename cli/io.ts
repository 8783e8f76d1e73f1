import { readPasswordLine } from '../host/password';

/** The terminal as the command line sees it; tests pass their own to capture output. */
export interface CliIo {
  readonly out: (text: string) => void;
  readonly err: (text: string) => void;
  readonly env: Readonly<Record<string, string | undefined>>;
  readonly cwd: string;
  /** True when stderr is an interactive terminal (progress bars, prompts). */
  readonly interactive: boolean;
  /** The first line of standard input (a password given with --pass-stdin); undefined when empty. */
  readonly stdinLine?: () => Promise<string | undefined>;
}

export const EXIT_OK = 0;
export const EXIT_OTHER = 1;
export const EXIT_BAD_INPUT = 2;

export function processIo(): CliIo {
  return {
    out: (text) => process.stdout.write(text),
    err: (text) => process.stderr.write(text),
    env: process.env,
    cwd: process.cwd(),
    // A large input runs in a child whose standard error is a pipe to the parent (scripts/start-flags.cjs), which says whether it is a terminal.
    interactive: process.env.TWOFOLD_INTERACTIVE === undefined ? Boolean(process.stderr.isTTY) : process.env.TWOFOLD_INTERACTIVE === '1',
    stdinLine: () => readPasswordLine(process.stdin),
  };
}

/** A command-line usage mistake: reported with the usage text, exit 2. */
export class UsageError extends Error {}
