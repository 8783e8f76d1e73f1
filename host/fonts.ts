/**
 * The report's fonts, read from the dejavu-fonts-ttf package (DejaVu Sans, free licence),
 * which has the glyphs the trade needs: subscript two (VO₂), ≥, Δ, −, ±, →.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

export interface ReportFonts {
  readonly regular: Uint8Array;
  readonly bold: Uint8Array;
}

let cached: ReportFonts | null = null;

export function reportFonts(): ReportFonts {
  if (cached) return cached;
  const folder = join(dirname(createRequire(import.meta.url).resolve('dejavu-fonts-ttf/package.json')), 'ttf');
  cached = { regular: readFileSync(join(folder, 'DejaVuSans.ttf')), bold: readFileSync(join(folder, 'DejaVuSans-Bold.ttf')) };
  return cached;
}
