/**
 * Sets every entry's modification date in a ZIP archive (an .xlsx is one) to one fixed
 * DOS date-time, so the same workbook always gives the same bytes. The dates sit in each
 * local file header (offset 10) and central-directory header (offset 12) and are not
 * covered by the entries' CRC (PKWARE APPNOTE, ZIP file format specification).
 */

const EOCD_SIGNATURE = 0x06054b50;
const CENTRAL_SIGNATURE = 0x02014b50;
const LOCAL_SIGNATURE = 0x04034b50;

/** DOS date and time words: 2026-01-01 00:00:00. */
const DOS_DATE = ((2026 - 1980) << 9) | (1 << 5) | 1;
const DOS_TIME = 0;

export function withFixedZipDates(zip: Uint8Array): Uint8Array {
  const out = Uint8Array.from(zip);
  const view = new DataView(out.buffer);
  let eocd = -1;
  for (let i = out.length - 22; i >= 0; i--) {
    if (view.getUint32(i, true) === EOCD_SIGNATURE) {
      eocd = i;
      break;
    }
  }
  if (eocd < 0) throw new Error('zip: no end-of-central-directory record');
  const entries = view.getUint16(eocd + 10, true);
  let at = view.getUint32(eocd + 16, true);
  for (let e = 0; e < entries; e++) {
    if (view.getUint32(at, true) !== CENTRAL_SIGNATURE) throw new Error(`zip: central-directory entry ${e} is damaged`);
    view.setUint16(at + 12, DOS_TIME, true);
    view.setUint16(at + 14, DOS_DATE, true);
    const local = view.getUint32(at + 42, true);
    if (view.getUint32(local, true) !== LOCAL_SIGNATURE) throw new Error(`zip: local header of entry ${e} is damaged`);
    view.setUint16(local + 10, DOS_TIME, true);
    view.setUint16(local + 12, DOS_DATE, true);
    at += 46 + view.getUint16(at + 28, true) + view.getUint16(at + 30, true) + view.getUint16(at + 32, true);
  }
  return out;
}
