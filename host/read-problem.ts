/**
 * One sentence for why a file could not be read, from the operating system's error code,
 * so that a folder given as a file, a missing file and a file without permission are told
 * apart instead of ending in a stack trace.
 */
export function readProblem(error: unknown, what: string): string {
  const code = (error as NodeJS.ErrnoException | null)?.code;
  switch (code) {
    case 'ENOENT':
      return `The ${what} does not exist.`;
    case 'EISDIR':
      return `The ${what} is a folder, not a file.`;
    case 'EACCES':
    case 'EPERM':
      return `The ${what} cannot be read: no permission.`;
    case 'ENOTDIR':
      return `The ${what} path runs through something that is not a folder.`;
    default:
      return `The ${what} cannot be read (${code ?? (error instanceof Error ? error.message : String(error))}).`;
  }
}
