/**
 * Input files must be UTF-8 (with or without BOM). Bytes are decoded strictly, so a file saved in
 * another encoding is reported with the line of the first bad byte and, where the bytes allow a
 * guess, the encoding to convert from, instead of turning into replacement characters.
 */
import { closeSync, openSync, readSync } from 'node:fs';
import { Transform, type TransformCallback } from 'node:stream';

export class EncodingError extends Error {
  constructor(
    /** Offset of the first bad byte in the file. */
    readonly offset: number,
    readonly guess: string,
  ) {
    super(`the file is not UTF-8 text (first bad byte at offset ${offset})`);
    this.name = 'EncodingError';
  }
}

/** A guess from the start of the file and the first invalid byte. */
export function guessEncoding(head: Uint8Array, badByte: number): string {
  if ((head[0] === 0xff && head[1] === 0xfe) || (head[0] === 0xfe && head[1] === 0xff))
    return 'UTF-16 (it starts with a UTF-16 byte-order mark)';
  if (head.subarray(0, Math.min(head.length, 200)).some((byte, k) => byte === 0 && k % 2 === 1)) return 'UTF-16 (every other byte is zero)';
  if (badByte >= 0x80) return 'Windows-1252 or ISO-8859-1 (a lone byte above 127, typical of Western European spreadsheet exports)';
  return '';
}

/** 1-based line of a byte offset, counted in the file itself: only needed once a file has failed. */
export function lineAtOffset(path: string, offset: number): number {
  const handle = openSync(path, 'r');
  const buffer = Buffer.alloc(1 << 16);
  let line = 1;
  let position = 0;
  try {
    while (position < offset) {
      const read = readSync(handle, buffer, 0, Math.min(buffer.length, offset - position), position);
      if (read <= 0) break;
      for (let k = buffer.indexOf(10); k !== -1 && k < read; k = buffer.indexOf(10, k + 1)) line++;
      position += read;
    }
  } finally {
    closeSync(handle);
  }
  return line;
}

/** Decodes UTF-8 strictly and strips a leading BOM; counts bytes so a failure can name its offset. */
export class StrictUtf8 extends Transform {
  private readonly decoder = new TextDecoder('utf-8', { fatal: true, ignoreBOM: false });
  private bytesBefore = 0;
  private first: Buffer | null = null;

  constructor() {
    super({ decodeStrings: true, readableObjectMode: false, encoding: 'utf8' });
  }

  override _transform(chunk: Buffer, _encoding: BufferEncoding, callback: TransformCallback): void {
    this.first ??= chunk;
    try {
      const text = this.decoder.decode(chunk, { stream: true });
      this.bytesBefore += chunk.length;
      callback(null, text);
    } catch {
      callback(this.failure(chunk));
    }
  }

  override _flush(callback: TransformCallback): void {
    try {
      callback(null, this.decoder.decode());
    } catch {
      callback(new EncodingError(Math.max(0, this.bytesBefore - 1), ''));
    }
  }

  /** Finds the first bad byte of the chunk by the longest prefix that still decodes. */
  private failure(chunk: Buffer): EncodingError {
    let low = 0;
    let high = chunk.length;
    while (low < high) {
      const middle = (low + high + 1) >>> 1;
      try {
        // A prefix cut inside a character is fine in stream mode; only a bad byte throws.
        new TextDecoder('utf-8', { fatal: true }).decode(chunk.subarray(0, middle), { stream: true });
        low = middle;
      } catch {
        high = middle - 1;
      }
    }
    return new EncodingError(this.bytesBefore + low, guessEncoding(this.first ?? chunk, chunk[low] ?? 0));
  }
}
