/**
 * CSV serialisation of trajectories (RFC 4180: comma separated, CRLF line ends, fields with a
 * comma, quote or line break enclosed in double quotes with inner quotes doubled).
 */

export type CsvCell = string | number;

/**
 * One field. Numbers print in JavaScript's shortest round-trip form, so the file holds the full
 * precision of the data. Text that a spreadsheet would run as a formula (starting with =, +, -, @,
 * tab or carriage return: the "CSV injection" advice of OWASP) gets a leading apostrophe, because
 * strategy names are user-supplied.
 */
export function csvField(cell: CsvCell): string {
  if (typeof cell === "number") return Number.isFinite(cell) ? String(cell) : "";
  const text = /^[=+\-@\t\r]/.test(cell) ? `'${cell}` : cell;
  return /[",\r\n]/.test(text) || /^\s|\s$/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvLine(cells: readonly CsvCell[]): string {
  return cells.map(csvField).join(",");
}

/** A whole file: the header row, then one line per row, each ended by CRLF. */
export function toCsv(header: readonly string[], rows: Iterable<readonly CsvCell[]>): string {
  const lines = [csvLine(header)];
  for (const row of rows) lines.push(csvLine(row));
  return `${lines.join("\r\n")}\r\n`;
}

export interface CsvBlock {
  /** Run id, written in a leading "run" column when the file holds more than one run. */
  run: string;
  times: readonly number[];
  /** One row of values per time (a bimatrix state already flattened, population 1 first). */
  rows: readonly (readonly number[])[];
}

/**
 * Trajectory file: header `time,<column>...` (with a leading `run` column when `withRun`), then
 * every sample of every block.
 */
export function trajectoryCsv(columns: readonly string[], blocks: readonly CsvBlock[], withRun: boolean): string {
  const header = withRun ? ["run", "time", ...columns] : ["time", ...columns];
  function* rows(): Generator<CsvCell[]> {
    for (const block of blocks) {
      for (let i = 0; i < block.times.length; i++) {
        const values = block.rows[i] ?? [];
        const t = block.times[i] ?? NaN;
        yield withRun ? [block.run, t, ...values] : [t, ...values];
      }
    }
  }
  return toCsv(header, rows());
}
