/**
 * Input files must be UTF-8 (with or without BOM). Bytes are decoded strictly, so a file saved in
 * another encoding is reported with the line of the first bad byte and, where the bytes allow a
 * guess, the encoding to convert from, instead of turning into replacement characters.
 */
import { Transform, type TransformCallback } from 'node:stream';

export class EncodingError extends Error {
  constructor(
    readonly line: number,
    readonly guess: string,
  ) {
    super(`the file is not UTF-8 text (first bad byte on line ${line})`);
    this.name = 'EncodingError';
  }
}

/** A guess from the bytes around the first invalid sequence. */
export function guessEncoding(bytes: Uint8Array, badIndex: number): string {
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) return 'UTF-16 (it starts with a UTF-16 byte-order mark)';
  if (bytes.subarray(0, Math.min(bytes.length, 200)).some((byte, k) => byte === 0 && k % 2 === 1)) return 'UTF-16 (every other byte is zero)';
  const byte = bytes[badIndex] ?? 0;
  if (byte >= 0x80) return 'Windows-1252 or ISO-8859-1 (a lone byte above 127, typical of Western European exports)';
  return '';
}

/** Decodes UTF-8 strictly, strips a leading BOM, and counts lines so errors can name one. */
export class StrictUtf8 extends Transform {
  private readonly decoder = new TextDecoder('utf-8', { fatal: true, ignoreBOM: false });
  private lines = 1;

  constructor() {
    super({ decodeStrings: true, readableObjectMode: false, encoding: 'utf8' });
  }

  override _transform(chunk: Buffer, _encoding: BufferEncoding, callback: TransformCallback): void {
    try {
      const text = this.decoder.decode(chunk, { stream: true });
      this.countLines(text);
      callback(null, text);
    } catch {
      callback(this.failure(chunk));
    }
  }

  override _flush(callback: TransformCallback): void {
    try {
      const text = this.decoder.decode();
      callback(null, text);
    } catch {
      callback(new EncodingError(this.lines, ''));
    }
  }

  private countLines(text: string): void {
    for (let k = text.indexOf('\n'); k !== -1; k = text.indexOf('\n', k + 1)) this.lines++;
  }

  /** Finds the first bad byte of the chunk to report its line. */
  private failure(chunk: Buffer): EncodingError {
    // Binary search for the longest valid prefix (cutting inside a character also fails, so step back 3).
    let low = 0;
    let high = chunk.length;
    while (low < high) {
      const middle = (low + high + 1) >>> 1;
      try {
        new TextDecoder('utf-8', { fatal: true }).decode(chunk.subarray(0, middle), { stream: true });
        low = middle;
      } catch {
        high = middle - 1;
      }
    }
    const good = low;
    for (let k = 0; k < good; k++) if (chunk[k] === 0x0a) this.lines++;
    return new EncodingError(this.lines, guessEncoding(chunk, good));
  }
}
