// The one CSV writer behind every export (segments, work lists, the audit trail,
// rejected import rows, comparisons).
//
// Spreadsheet formula injection (OWASP, "CSV Injection"): a cell that begins with
// =, +, -, @, a tab or a carriage return can be run as a formula when the file is
// opened in a spreadsheet. Such text cells are written with a leading single quote,
// which spreadsheets show as text. Numbers stay numbers: a JavaScript number is never
// prefixed, and neither is text that is only a plain number ("-12.5", "+3"), so
// negative costs and PCI changes still sum in a spreadsheet. The importer removes
// the quote again (unescapeFormula), so an exported file re-imports unchanged.
import Papa from 'papaparse';

const PLAIN_NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;
/** Text that a spreadsheet could read as a formula (and that is not just a number). */
export const FORMULA_LEADING = /^(?![-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$)[=+\-@\t\r]/i;

export type CsvCell = string | number | boolean | null | undefined;

/** RFC 4180 CSV: CRLF line ends, the last line ended too. */
export function toCsv(fields: string[], rows: CsvCell[][]): string {
  const body = Papa.unparse(
    { fields, data: rows.map((r) => r.map((c) => c ?? '')) },
    { escapeFormulae: FORMULA_LEADING, newline: '\r\n' },
  );
  return `${body}\r\n`;
}

/** A cell written by toCsv with the formula guard → the text as it was. */
export function unescapeFormula(s: string): string {
  return s.length > 1 && s[0] === "'" && /^[=+\-@\t\r]/.test(s.slice(1)) && !PLAIN_NUMBER.test(s.slice(1))
    ? s.slice(1)
    : s;
}
