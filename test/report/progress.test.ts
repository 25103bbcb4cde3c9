import { describe, expect, it } from 'vitest';
import { formatBytes, startProgress } from '../../src/cli-progress.js';

function fakeStream(isTTY: boolean) {
  const written: string[] = [];
  return { written, stream: { isTTY, write: (s: string) => written.push(s) } as unknown as NodeJS.WriteStream };
}

const FILE = 'fixtures/demo/repairs-delivery.csv';

describe('startProgress', () => {
  it('draws a spinner line with size and elapsed time on a terminal, and clears it', async () => {
    const { written, stream } = fakeStream(true);
    const stop = startProgress(FILE, 'auditing', { quiet: false, stream, minBytes: 0, intervalMs: 5 });
    await new Promise((r) => setTimeout(r, 30));
    stop();
    expect(written.length).toBeGreaterThan(2);
    expect(written[0]).toMatch(/^\r\x1b\[2K. auditing fixtures\/demo\/repairs-delivery\.csv \(\d+\.\d KB\) 0:00$/);
    expect(written.at(-1)).toBe('\r\x1b[2K');
  });

  it('stays silent with --quiet, off a terminal, and for small files', () => {
    for (const [tty, quiet, minBytes] of [
      [true, true, 0],
      [false, false, 0],
      [true, false, undefined],
    ] as const) {
      const { written, stream } = fakeStream(tty);
      startProgress(FILE, 'auditing', { quiet, stream, minBytes })();
      expect(written).toEqual([]);
    }
  });

  it('formatBytes', () => {
    expect(formatBytes(512)).toBe('512 B');
    expect(formatBytes(1536)).toBe('1.5 KB');
    expect(formatBytes(60 * 1024 * 1024)).toBe('60.0 MB');
  });
});
