/**
 * The text of a PDF, as poppler's `pdftotext -layout` reads it (table rows stay on one
 * line), or null when pdftotext is not installed or cannot read the file.
 */
import { spawnSync } from 'node:child_process';

export function pdfText(pdf: Uint8Array): string | null {
  const run = spawnSync('pdftotext', ['-layout', '-enc', 'UTF-8', '-', '-'], { input: pdf, maxBuffer: 64 * 1024 * 1024 });
  if (run.error || run.status !== 0) return null;
  return run.stdout.toString('utf8');
}
