import { markedHtml as e } from './marked.js';

/** One cell: text, or `{ num }` for a right-aligned number already formatted. */
export type Cell = string | { num: string };

/**
 * An accessible data table: a caption, column headers with scope="col" and the first cell of
 * each row as its row header. Every value is escaped here (markers of invisible characters styled).
 */
export function tableHtml(caption: string, head: string[], rows: Cell[][]): string {
  const cell = (c: Cell, i: number) => {
    const tag = i === 0 ? 'th scope="row"' : 'td';
    const close = i === 0 ? 'th' : 'td';
    return typeof c === 'string' ? `<${tag}>${e(c)}</${close}>` : `<${tag} class="num">${e(c.num)}</${close}>`;
  };
  return [
    '<div class="table-scroll"><table>',
    `<caption>${e(caption)}</caption>`,
    `<thead><tr>${head.map((h) => `<th scope="col">${e(h)}</th>`).join('')}</tr></thead>`,
    `<tbody>${rows.map((r) => `<tr>${r.map(cell).join('')}</tr>`).join('')}</tbody>`,
    '</table></div>',
  ].join('');
}
