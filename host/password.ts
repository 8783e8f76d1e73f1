/**
 * Asks for a password on the terminal without echoing it. The certificate password never
 * travels on the command line, where other users could read it in the process list.
 */
import { createInterface } from 'node:readline';

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
