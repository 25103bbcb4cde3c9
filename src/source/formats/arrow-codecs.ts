import { CompressionType, compressionRegistry } from 'apache-arrow';
import { decompress as zstdDecompress } from 'fzstd';
import { decompress as lz4Decompress } from 'lz4js';

/**
 * apache-arrow views a decoded buffer as it is (a Float64Array over it), so it must start on an
 * 8-byte boundary; fzstd returns a raw block as a view into its input, at any offset.
 */
function aligned(bytes: Uint8Array): Uint8Array {
  return bytes.byteOffset % 8 === 0 ? bytes : bytes.slice();
}

/**
 * The body codecs of compressed Arrow IPC files (LZ4 frame, the default of common Feather
 * writers, and zstd). apache-arrow reads them only through codecs registered with it; both are
 * pure JavaScript, so a page in the browser can read the same files. Decoding only: nestready
 * writes no Arrow.
 */
export function registerArrowCodecs(): void {
  if (!compressionRegistry.get(CompressionType.LZ4_FRAME)) {
    compressionRegistry.set(CompressionType.LZ4_FRAME, { decode: (data) => aligned(lz4Decompress(data)) });
  }
  if (!compressionRegistry.get(CompressionType.ZSTD)) {
    compressionRegistry.set(CompressionType.ZSTD, { decode: (data) => aligned(zstdDecompress(data)) });
  }
}
