// CSV as RFC 4180 defines it (§2): records end in CRLF; a field containing a comma, a double quote, CR or LF is
// enclosed in double quotes, and a double quote inside it is written twice. Spreadsheets also run a cell that
// starts with =, +, -, @, tab or CR as a formula (OWASP, "CSV Injection"), and farmer names are typed by users,
// so such text cells get a leading apostrophe. Numbers are written as numbers and are never prefixed.

export type CsvCell = string | number | null;

const FORMULA_START = /^[=+\-@\t\r]/;

export function csvCell(value: CsvCell): string {
  if (value === null) return "";
  if (typeof value === "number") {
    if (!Number.isFinite(value)) throw new RangeError(`Not a finite number: ${value}`);
    return String(value);
  }
  const text = FORMULA_START.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function toCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  for (const row of rows) {
    if (row.length !== header.length) throw new RangeError(`Each record needs ${header.length} fields, got ${row.length}`);
  }
  return [header, ...rows].map((row) => row.map(csvCell).join(",")).join("\r\n") + "\r\n";
}
