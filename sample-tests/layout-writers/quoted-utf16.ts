/**
 * Invented layout "quoted-utf16" (Twofold's own, in the demo scenario): every field in double
 * quotes, comma-delimited, CRLF line ends, encoded UTF-16 little-endian with a byte-order
 * mark. A titled block of quoted label/value pairs above the table (one label holds an escaped
 * quote and a comma), a blank line, then headers written out in plain words with the unit in
 * square brackets ("Elapsed [s]", "O2 uptake [mL/min]", "Respiratory rate [/min]"), except
 * the end-tidal pressures, which give no unit (the importer infers mmHg from the values,
 * warns, and the workbench asks).
 * Time in s with one decimal; no RPE column (the highest rating is a label/value line instead).
 */
import type { BreathTable } from '../../core/model/breath-table';
import { fixed, sexWord } from './text-cells';

function quote(text: string): string {
  return `"${text.replace(/"/g, '""')}"`;
}

/** UTF-16 LE bytes with a BOM (FF FE). */
export function utf16LeWithBom(text: string): Uint8Array {
  const bytes = new Uint8Array(2 + text.length * 2);
  bytes[0] = 0xff;
  bytes[1] = 0xfe;
  for (let i = 0; i < text.length; i++) {
    const unit = text.charCodeAt(i);
    bytes[2 + 2 * i] = unit & 0xff;
    bytes[3 + 2 * i] = unit >> 8;
  }
  return bytes;
}

export function quotedUtf16Text(table: BreathTable): string {
  const m = table.metadata;
  const peakRpe = table.rpe.length > 0 ? String(Math.max(...table.rpe.map((r) => r.borg))) : '';
  const pairs: [string, string][] = [
    ['Participant', m.subjectId ?? ''],
    ['Age (years)', m.ageY === null ? '' : String(m.ageY)],
    ['Sex', sexWord(m.sex)],
    ['Stature', m.heightCm === null ? '' : `${m.heightCm} cm`],
    ['Body mass', m.weightKg === null ? '' : `${m.weightKg} kg`],
    ['Start date-time', (m.testStart ?? '').replace('T', ' ')],
    ['Protocol, "as run"', m.protocol ?? ''],
    ['Highest Borg rating', peakRpe],
  ];
  const lines = [quote('Exercise session export'), ...pairs.map(([k, v]) => [quote(k), quote(v)].join(','))];
  const header = [
    'Elapsed [s]',
    'O2 uptake [mL/min]',
    'CO2 output [mL/min]',
    'Ventilation [L/min]',
    'Heart rate [bpm]',
    'Power [W]',
    'End-tidal O2',
    'End-tidal CO2',
    'Respiratory rate [/min]',
    'Tidal volume [L]',
  ];
  const rows = table.breaths.map((b) =>
    [
      fixed(b.timeS, 1),
      fixed(b.vo2MlMin, 0),
      fixed(b.vco2MlMin, 0),
      fixed(b.veLMin, 2),
      fixed(b.hrBpm, 0),
      fixed(b.workW, 0),
      fixed(b.peto2Mmhg, 1),
      fixed(b.petco2Mmhg, 1),
      fixed(b.rrPerMin, 1),
      fixed(b.vtL, 3),
    ]
      .map(quote)
      .join(','),
  );
  return [...lines, '', header.map(quote).join(','), ...rows].join('\r\n') + '\r\n';
}

export function writeQuotedUtf16(table: BreathTable): Uint8Array {
  return utf16LeWithBom(quotedUtf16Text(table));
}
