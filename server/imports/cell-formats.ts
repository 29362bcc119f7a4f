// How a file writes its numbers and dates, decided once per file before any row
// is read: a decimal comma ("0,125") and day/month order in slash dates
// ("06/04/2026") cannot be told from one cell, but usually can from the column.
import type { DateFormat, ImportIssue } from '../../shared/schemas/imports';
import type { RawTable } from './read-file';

const NUMERIC_FIELDS = ['length_mi', 'width_ft', 'lanes', 'adt', 'truck_pct', 'pci', 'last_treatment_year'];
const DATE_FIELDS = ['pci_date', 'survey_date'];

// A comma followed by other than exactly three digits, or after a lone zero, is a
// decimal comma ("0,125", "3,5", "12,75"); "1.234,5" too. "1,250" could be either.
const DECIMAL_COMMA = /^[-+]?(0,\d+|\d+,(\d{1,2}|\d{4,})|\d{1,3}(\.\d{3})+,\d+)$/;
const DOT_DECIMAL = /^[-+]?\d*\.\d+$/;
export const SLASH_DATE = /^(\d{1,2})[/.-](\d{1,2})[/.-](\d{4})$/;

export type CellFormats = {
  decimalComma: boolean;
  /** How slash dates are read; null when the file has none. */
  dateFormat: Exclude<DateFormat, 'auto'> | null;
  warnings: ImportIssue[];
};

function mappedStrings(table: RawTable, mapping: Record<string, string>, fields: string[]) {
  const out: { row: number; column: string; value: string }[] = [];
  for (const f of fields) {
    const column = mapping[f];
    if (!column) continue;
    for (const r of table.rows) {
      const v = r.values[column];
      if (typeof v === 'string') out.push({ row: r.row, column, value: v.trim() });
    }
  }
  return out;
}

export function detectCellFormats(
  table: RawTable,
  mapping: Record<string, string>,
  chosenDateFormat: DateFormat,
): CellFormats {
  const warnings: ImportIssue[] = [];
  const numbers = mappedStrings(table, mapping, NUMERIC_FIELDS);
  // The whole file decides: one decimal comma and no decimal point anywhere in its numbers.
  const comma = numbers.find((c) => DECIMAL_COMMA.test(c.value));
  const decimalComma = !!comma && !numbers.some((c) => DOT_DECIMAL.test(c.value));
  if (comma && decimalComma)
    warnings.push({
      row: comma.row,
      column: comma.column,
      value: comma.value,
      message: `numbers in this file use a decimal comma: "${comma.value}" is read as ${comma.value.replace(/\./g, '').replace(',', '.')}`,
    });

  const slash = mappedStrings(table, mapping, DATE_FIELDS)
    .map((c) => ({ ...c, m: c.value.match(SLASH_DATE) }))
    .filter((c) => c.m);
  let dateFormat: CellFormats['dateFormat'] = null;
  if (slash.length) {
    if (chosenDateFormat !== 'auto') dateFormat = chosenDateFormat;
    else {
      const dayFirst = slash.find((c) => Number(c.m![1]) > 12);
      const monthFirst = slash.find((c) => Number(c.m![2]) > 12);
      dateFormat = dayFirst && !monthFirst ? 'dmy' : 'mdy';
      const sample = slash[0];
      if (!dayFirst && !monthFirst)
        warnings.push({
          row: sample.row,
          column: sample.column,
          value: sample.value,
          message:
            'dates with slashes are read as month/day/year (US); choose day/month/year under "Dates written as" if the file means that',
        });
    }
  }
  return { decimalComma, dateFormat, warnings };
}

/** A number cell as text → its value, with the file's decimal mark; NaN when it is not a plain number. */
export function parseNumber(raw: string, decimalComma: boolean): number {
  let s = raw.trim().replace(/%$/, '');
  s = decimalComma ? s.replace(/\.(?=\d{3}(\D|$))/g, '').replace(',', '.') : s.replace(/,(?=\d{3}(\D|$))/g, '');
  return /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(s) ? Number(s) : Number.NaN;
}
