/** Paging of table rows that span several runs (blocks), without copying the data. */

export interface PagedBlock {
  run: string;
  times: readonly number[];
  rows: readonly (readonly number[])[];
}

export interface PageRow {
  key: string;
  run: string;
  t: number;
  values: readonly number[];
}

export interface Page {
  /** Zero-based page actually shown (clamped into range). */
  page: number;
  pages: number;
  total: number;
  /** Zero-based index of the first row shown, and one past the last. */
  first: number;
  last: number;
  rows: PageRow[];
}

/** Rows `page * size` .. `page * size + size - 1` of the blocks laid end to end. */
export function pageOf(blocks: readonly PagedBlock[], page: number, size: number): Page {
  const total = blocks.reduce((n, b) => n + b.times.length, 0);
  const perPage = Math.max(1, Math.floor(size));
  const pages = Math.max(1, Math.ceil(total / perPage));
  const current = Math.min(Math.max(0, Math.floor(page)), pages - 1);
  const first = Math.min(total, current * perPage);
  const last = Math.min(total, first + perPage);
  const rows: PageRow[] = [];
  let offset = 0;
  for (const block of blocks) {
    const n = block.times.length;
    for (let i = Math.max(first - offset, 0); i < n && offset + i < last; i++) {
      rows.push({ key: `${block.run}:${i}`, run: block.run, t: block.times[i] ?? NaN, values: block.rows[i] ?? [] });
    }
    offset += n;
    if (offset >= last) break;
  }
  return { page: current, pages, total, first, last, rows };
}
