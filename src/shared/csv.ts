import Papa from 'papaparse';

// Every CSV Beadloom reads or writes goes through papaparse (RFC 4180: quoted fields may hold commas,
// quotes as "" and line breaks; a UTF-8 BOM and CRLF or LF line ends are read alike).
//
// Spreadsheet formulae: Excel and LibreOffice run a cell that starts with =, +, -, @, tab or CR as a
// formula (OWASP, "CSV Injection"), so a bead or mapping named `=HYPERLINK(…)` could act when the file is
// opened. papaparse's `escapeFormulae` prefixes such a text cell with ' (shown as text, not run). Number
// primitives are never escaped; our fixed-digit numbers are strings (`-0.550`), so the pattern leaves a
// cell alone when the whole of it is a plain decimal number — a number is not a formula.

/** A text cell a spreadsheet would run as a formula: starts with = + - @ tab or CR and is not just a number. */
export const FORMULA_CELL = /^(?![-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$)[=+\-@\t\r]/;

export type CsvCell = string | number | null | undefined;

interface WriteOptions {
  newline: '\r\n' | '\n';
  /** Quote a text cell that starts with '#', so a reader that skips '#' comment lines keeps the row. */
  quoteLeadingHash?: boolean;
}

/** The rows (header first) as CSV text ending with a line break, formula-like text cells escaped. */
export function writeCsv(rows: readonly (readonly CsvCell[])[], { newline, quoteLeadingHash = false }: WriteOptions): string {
  const text = Papa.unparse(rows as CsvCell[][], {
    newline,
    escapeFormulae: FORMULA_CELL,
    quotes: quoteLeadingHash ? (value: unknown) => typeof value === 'string' && value.startsWith('#') : false,
  });
  return text + newline;
}

/**
 * A '#' comment line for the top of a CSV file. A spreadsheet still splits it at commas, so each
 * piece after a comma that would start a formula (after spaces or a quote) is escaped the same way.
 */
export function csvCommentLine(text: string): string {
  const pieces = text.replace(/[\r\n]+/g, ' ').split(',');
  return `# ${pieces.map((p, i) => (i > 0 && FORMULA_CELL.test(p.replace(/^[\s"]+/, '')) ? `'${p}` : p)).join(',')}`;
}

/** Undoes the export's escape: a cell written as '=… is read back as =…. */
export function unescapeFormulaCell(cell: string): string {
  return cell.startsWith("'") && FORMULA_CELL.test(cell.slice(1)) ? cell.slice(1) : cell;
}

/** The rows of a CSV text as cells; rows with only blank cells are skipped. */
export function readCsv(text: string): { rows: string[][]; error: string | null } {
  const result = Papa.parse<string[]>(text, { delimiter: ',', skipEmptyLines: 'greedy' });
  // A quote left open is the one mistake that would shift every later cell; report it, not a wrong table.
  const fatal = result.errors.find((e) => e.type === 'Quotes');
  const error = fatal ? `${fatal.message}${typeof fatal.row === 'number' ? ` (row ${fatal.row + 1})` : ''}.` : null;
  return { rows: result.data, error };
}
