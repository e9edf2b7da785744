/** lz4js ships no types; only its frame compressor is used, to write test recordings. */
declare module 'lz4js' {
  export function compress(data: Uint8Array): Uint8Array | number[];
}
