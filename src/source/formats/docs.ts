import type { FormatOption } from './registry.js';
import { FORMATS } from './registry.js';

const OPTION_FLAGS: Record<FormatOption, string> = { encoding: '`--encoding`', sheet: '`--sheet`' };

/** The README's table of input formats, from the registry (`npm run docs`; test/readme.test.ts checks it). */
export function formatsMarkdown(): string {
  const cell = (s: string) => s.replace(/\|/g, '\\|');
  const lines = [
    '| `--input-format` | format | detected by | read by | options | notes |',
    '|---|---|---|---|---|---|',
    ...FORMATS.map((f, i) => {
      const names = f.extensions.map((e) => `\`.${e}\``).join(' ');
      // the first format is what a text nothing else claims is read as
      const look = i === 0 ? 'any other text' : f.looksLike ? 'a look at the text' : '';
      const detected = [f.magic ? 'magic number' : '', names, look].filter(Boolean).join(', ');
      const notes = f.gzip ? `${f.notes}; may be gzip-compressed (\`.gz\`)` : f.notes;
      const options = f.options.map((o) => OPTION_FLAGS[o]).join(' ');
      return `| \`${f.name}\` | ${f.label} | ${detected} | ${cell(f.readBy)} | ${options} | ${cell(notes)} |`;
    }),
    '| | `-` | the content, as above | standard input, spooled to a temp file deleted afterwards | | any of the above |',
  ];
  return `${lines.join('\n')}\n`;
}
