import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** One measured point from tests/reference/checks/*.csv, with who measured it and the table. */
export interface ReferenceRow {
  T_K: number;
  value: number;
  measuredBy: string;
  table: string;
}

/** Reads a reference CSV (header, then T, value, measured_by, table). Test-only helper. */
export function readReferenceCsv(name: string): ReferenceRow[] {
  const path = fileURLToPath(new URL(`../reference/checks/${name}`, import.meta.url));
  const lines = readFileSync(path, 'utf8').trim().split(/\r?\n/).slice(1);
  return lines.map((line) => {
    const [T, value, measuredBy, table] = line.split(',');
    return { T_K: Number(T), value: Number(value), measuredBy: measuredBy ?? '', table: table ?? '' };
  });
}
