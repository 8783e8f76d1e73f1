/** A CliIo that keeps what a command prints, for the CLI tests; the working folder is this process's. */
import type { CliIo } from '../../cli/io';

export function io(env: Record<string, string> = {}) {
  const out: string[] = [];
  const err: string[] = [];
  const value: CliIo = { out: (t) => out.push(t), err: (t) => err.push(t), env, cwd: process.cwd(), interactive: false };
  return { io: value, out: () => out.join(''), err: () => err.join('') };
}
