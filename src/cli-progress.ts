import { statSync } from 'node:fs';

/** Files at least this large get a progress line while they are audited. */
export const PROGRESS_MIN_BYTES = 50 * 1024 * 1024;

const FRAMES = ['⠋', '⠙', '⠹', '⠸', '⠼', '⠴', '⠦', '⠧', '⠇', '⠏'];

export interface ProgressOptions {
  quiet: boolean;
  stream?: NodeJS.WriteStream;
  minBytes?: number;
  intervalMs?: number;
}

/**
 * A spinner with the file size and elapsed time on stderr while a large delivery is audited.
 * DuckDB reports no progress we can rely on, so this says only that work goes on. Shown only on
 * a terminal, for files of at least `minBytes`, and never with `--quiet`; stdout (where JSON may
 * go) is never touched. Returns the function that clears it.
 */
export function startProgress(path: string, label: string, options: ProgressOptions): () => void {
  const stream = options.stream ?? process.stderr;
  let size = 0;
  try {
    size = statSync(path).size;
  } catch {
    return () => {};
  }
  if (options.quiet || !stream.isTTY || size < (options.minBytes ?? PROGRESS_MIN_BYTES)) return () => {};
  const started = Date.now();
  let frame = 0;
  const draw = () => {
    const seconds = Math.floor((Date.now() - started) / 1000);
    const elapsed = `${Math.floor(seconds / 60)}:${String(seconds % 60).padStart(2, '0')}`;
    stream.write(`\r\x1b[2K${FRAMES[frame++ % FRAMES.length]} ${label} ${path} (${formatBytes(size)}) ${elapsed}`);
  };
  draw();
  const timer = setInterval(draw, options.intervalMs ?? 120);
  timer.unref();
  return () => {
    clearInterval(timer);
    stream.write('\r\x1b[2K');
  };
}

/** 1536 → "1.5 KB", in powers of 1024. */
export function formatBytes(bytes: number): string {
  const units = ['B', 'KB', 'MB', 'GB', 'TB'];
  let v = bytes;
  let i = 0;
  while (v >= 1024 && i < units.length - 1) {
    v /= 1024;
    i++;
  }
  return `${i === 0 ? v : v.toFixed(1)} ${units[i]}`;
}
