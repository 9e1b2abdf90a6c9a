import { stringify } from 'csv-stringify/sync';

/**
 * A character that makes a spreadsheet treat the rest of a cell as a formula, at the start of the
 * cell or right after a separator a spreadsheet may split on (comma, semicolon, tab, pipe, a line
 * break): OWASP "CSV Injection" lists = + - @ and tab and carriage return as triggers.
 */
const FORMULA_AFTER_SEPARATOR = /(^|[,;\t|\r\n])\s*[=+\-@\t\r]/;

/** A text cell that could run as a formula gets a leading apostrophe, which spreadsheets show as text. */
export function neutraliseFormula(cell: string): string {
  return FORMULA_AFTER_SEPARATOR.test(cell) ? `'${cell}` : cell;
}

export type CsvCell = string | number | null | undefined;

/**
 * CSV for spreadsheets: every text cell is quoted (so a locale that splits on semicolons still sees
 * one cell) and neutralised if it holds a formula trigger anywhere a spreadsheet could split it off.
 * Numbers stay numbers, so -3 is still minus three.
 */
export function toCsv(columns: string[], rows: CsvCell[][], options: { header?: boolean } = {}): string {
  return stringify(
    rows.map((row) => row.map((cell) => (typeof cell === 'string' ? neutraliseFormula(cell) : (cell ?? '')))),
    { header: options.header ?? true, columns, quoted_string: true },
  );
}
