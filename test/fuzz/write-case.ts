import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { FuzzCase } from './gen/case.js';
import { delimited, jsonText, writeArrow, writeParquet, writeXlsx } from './gen/formats.js';

const EXTENSION = { csv: 'csv', tsv: 'tsv', json: 'json', ndjson: 'ndjson', parquet: 'parquet', arrow: 'arrow', xlsx: 'xlsx' } as const;

/** Where a case was written. */
export interface Written {
  delivery: string;
  roles: string;
  /** the CLI is given the delivery on standard input (`-`) */
  stdin?: boolean;
}

/** Write a case's delivery and role map into `dir`; a pseudo-random pick from `seed` decides line ends. */
export async function writeCase(c: FuzzCase, dir: string, seed: number): Promise<Written> {
  const gz = c.text?.gzip || c.json?.gzip ? '.gz' : '';
  const delivery = join(dir, `delivery.${EXTENSION[c.format]}${gz}`);
  const roles = join(dir, 'roles.yaml');
  writeFileSync(roles, c.roles.yaml);
  const pick = (k: number) => (Math.imul(seed ^ (k + 1), 2654435761) >>> 13) & 0xff;
  if (c.empty) writeFileSync(delivery, '');
  else if (c.text) writeFileSync(delivery, delimited(c.table, c.text, pick));
  else if (c.json) writeFileSync(delivery, jsonText(c.table, c.json, c.format === 'ndjson'));
  else if (c.format === 'parquet') await writeParquet(c.table, dir, delivery);
  else if (c.format === 'arrow') await writeArrow(c.table, delivery);
  else await writeXlsx(c.table, delivery);
  return { delivery, roles, ...(c.stdin && { stdin: true }) };
}
