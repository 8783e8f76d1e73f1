/**
 * Cell delimiters: comma, semicolon or tab. `splitCells` splits one line the way a CSV
 * reader would (double quotes group, `""` is a quote); it is used on the few lines above a
 * table, where the delimiter is still being decided. The table itself goes to papaparse.
 *
 * Example: splitCells('a;"b;c";d', ';') → ['a', 'b;c', 'd'].
 */

export type Delimiter = ',' | ';' | '\t';
export const DELIMITERS: readonly Delimiter[] = ['\t', ';', ','];

export function splitCells(line: string, delimiter: Delimiter): string[] {
  if (!line.includes('"')) return line.split(delimiter);
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const c = line[i];
    if (quoted) {
      if (c === '"' && line[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (c === '"') quoted = false;
      else cell += c;
    } else if (c === '"' && cell.trim() === '') {
      quoted = true;
      cell = '';
    } else if (c === delimiter) {
      cells.push(cell);
      cell = '';
    } else cell += c;
  }
  cells.push(cell);
  return cells;
}

export function delimiterName(d: Delimiter | null): string {
  return d === ',' ? 'comma' : d === ';' ? 'semicolon' : d === '\t' ? 'tab' : 'none';
}
