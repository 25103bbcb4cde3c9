import type { SourceAuditOptions } from './audit-source.js';
import { auditSource, loadedRoles } from './audit-source.js';
import { loadArquero } from './profile/build.js';
import type { Report } from './report/types.js';
import type { LoadedRoles } from './roles/load.js';
import type { Roles } from './roles/types.js';
import type { DeliveryInput, Encoding, InputFormat, Source } from './source/open.js';
import { openSource } from './source/open.js';
import { TOOL } from './version.js';

/** The audit's options: what the opened source's audit reads (src/audit-source.ts), and how to open the delivery. */
export interface AuditOptions extends Omit<SourceAuditOptions, 'tool'> {
  /** DuckDB memory limit before it spills to disk, e.g. "200MB" */
  memoryLimit?: string;
  threads?: number;
  /** the delivery's format when not detected from its name and content */
  inputFormat?: InputFormat;
  /** text encoding of a CSV/TSV delivery (default UTF-8) */
  encoding?: Encoding;
  /** Excel: the worksheet to read (default the first) */
  sheet?: string;
  /**
   * CSV/TSV: read numbers written with a decimal comma (12,5). Without it they are read so when
   * the fields are not separated by commas and the first records leave no doubt.
   */
  decimalComma?: boolean;
  /** what the report calls a file input (default its path; the CLI passes "-" for a spooled stdin) */
  displayPath?: string;
}

/** A delivery: a file path (`-` for standard input), or a table or query in PostgreSQL. */
export type AuditInput = DeliveryInput;

/** The delivery opened in the engine its kind calls for (src/source/engines/registry.ts). */
export function openInput(input: AuditInput, roles: Roles, options: AuditOptions): Promise<Source> {
  return openSource(input, roles, {
    missing: roles.missing,
    memoryLimit: options.memoryLimit,
    threads: options.threads,
    format: options.inputFormat,
    encoding: options.encoding,
    sheet: options.sheet,
    displayPath: options.displayPath,
    ...(options.decimalComma && { decimalComma: true }),
  });
}

/** Audit one delivery against a role map: open, profile once, run the rules, grade. */
export async function audit(input: AuditInput, roleMap: LoadedRoles | Roles, options: AuditOptions = {}): Promise<Report> {
  const { roles } = loadedRoles(roleMap);
  loadArquero().catch(() => undefined); // compiled while the delivery is opened (awaited by buildProfile)
  const source = await openInput(input, roles, options);
  try {
    return await auditSource(source, roleMap, { ...options, tool: TOOL });
  } finally {
    await source.close();
  }
}
