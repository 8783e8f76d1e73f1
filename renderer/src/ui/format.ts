/** Number formatting for the screens: a value always with its unit, a dash when absent. */
export function fmt(value: number | null | undefined, digits = 0, unit = ''): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = value.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });
  return unit ? `${text} ${unit}` : text;
}

export function signed(value: number | null | undefined, digits = 0, unit = ''): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${value > 0 ? '+' : value < 0 ? '−' : '±'}${fmt(Math.abs(value), digits, unit)}`;
}

/** Seconds as m:ss, with the seconds figure beside it. */
export function clock(timeS: number | null | undefined): string {
  if (timeS === null || timeS === undefined || !Number.isFinite(timeS)) return '—';
  const m = Math.floor(timeS / 60);
  const s = Math.round(timeS - m * 60);
  return `${m}:${String(s).padStart(2, '0')} (${Math.round(timeS)} s)`;
}
