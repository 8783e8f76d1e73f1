/**
 * Where a certificate password comes from on the command line: a prompt on the terminal
 * without echo, or the first line of standard input. It never travels as an argument (other
 * users can read arguments in the process list) and Twofold never writes it anywhere.
 */
import { createInterface } from 'node:readline';
import type { Readable } from 'node:stream';

/** A password line longer than this is not a password: refused rather than read on. */
export const MAX_PASSWORD_CHARS = 1024;

/**
 * The first line of `input` (without its line end), or undefined when the stream ends empty
 * or the line is longer than MAX_PASSWORD_CHARS. Reads no further than the first line end.
 */
export async function readPasswordLine(input: Readable): Promise<string | undefined> {
  let text = '';
  for await (const chunk of input) {
    text += typeof chunk === 'string' ? chunk : (chunk as Buffer).toString('utf8');
    const end = text.search(/\r?\n/);
    if (end >= 0) {
      text = text.slice(0, end);
      break;
    }
    if (text.length > MAX_PASSWORD_CHARS) break;
  }
  if (text.length === 0 || text.length > MAX_PASSWORD_CHARS) return undefined;
  return text;
}

export async function readPassword(prompt: string): Promise<string | undefined> {
  if (!process.stdin.isTTY) return undefined;
  const rl = createInterface({ input: process.stdin, output: process.stderr, terminal: true });
  const writeOutput = (rl as unknown as { _writeToOutput: (s: string) => void })._writeToOutput;
  process.stderr.write(prompt);
  (rl as unknown as { _writeToOutput: (s: string) => void })._writeToOutput = (s: string) => {
    if (s.includes('\n')) writeOutput.call(rl, '\n');
  };
  try {
    return await new Promise<string>((done) => rl.question('', done));
  } finally {
    rl.close();
  }
}
