// lz4js ships no types: the two functions used here (LZ4 frame format)
declare module 'lz4js' {
  export function decompress(src: Uint8Array, maxSize?: number): Uint8Array;
  export function compress(src: Uint8Array, maxSize?: number): Uint8Array;
}
