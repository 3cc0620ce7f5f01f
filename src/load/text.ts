// Bytes of a text file → text, loudly: packsmith reads UTF-8 (with or without a BOM). Anything
// else is an error naming the likely cause (a spreadsheet's Windows code page, UTF-16 "Unicode
// text", a workbook saved under a .csv name), never text with silent replacement characters.
import type { LocatedError } from './raw.js';

const utf8 = new TextDecoder('utf-8', { fatal: true });
const cp1252 = new TextDecoder('windows-1252');

const SAVE_AS = 'save it again as "CSV UTF-8" (spreadsheets) or "UTF-8" (text editors)';

/** Line and column (1-based) of a byte offset, counting the UTF-8 text before it. */
function lineColumn(bytes: Uint8Array, offset: number): { row: number; column: number } {
  let row = 1;
  let start = 0;
  for (let i = 0; i < offset; i++) if (bytes[i] === 0x0a) { row += 1; start = i + 1; }
  return { row, column: offset - start + 1 };
}

/** The offset of the first byte that is not valid UTF-8. */
function firstInvalid(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i]!;
    const n = b < 0x80 ? 0 : b >= 0xc2 && b <= 0xdf ? 1 : b >= 0xe0 && b <= 0xef ? 2 : b >= 0xf0 && b <= 0xf4 ? 3 : -1;
    if (n < 0) return i;
    for (let k = 1; k <= n; k++) if (i + k >= bytes.length || (bytes[i + k]! & 0xc0) !== 0x80) return i;
    i += n + 1;
  }
  return 0;
}

export type Decoded = { text: string; error: LocatedError | null };

/**
 * Decode a job file. On failure the error says why and what to do; `text` is then the best
 * reading (Windows-1252) so the rest of the file can still be checked, but the job is refused.
 */
export function decodeText(file: string, bytes: Uint8Array): Decoded {
  if (bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04) {
    return { text: '', error: { file, row: 1, column: 1, message: `this is a spreadsheet workbook (.xlsx/.ods), not text; open it in the spreadsheet and save the sheet as CSV (UTF-8), then run again` } };
  }
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    return { text: '', error: { file, row: 1, column: 1, message: `this file is saved as UTF-16 ("Unicode text"); ${SAVE_AS}` } };
  }
  try {
    const text = utf8.decode(bytes);
    if (text.includes('\0')) {
      const at = lineColumn(bytes, bytes.indexOf(0));
      return { text: text.replace(/\0/g, ''), error: { file, ...at, message: 'this file holds NUL bytes, so it is not plain text; save it as CSV (UTF-8) or plain text' } };
    }
    return { text, error: null };
  } catch {
    const offset = firstInvalid(bytes);
    const at = lineColumn(bytes, offset);
    const text = cp1252.decode(bytes);
    const line = text.split('\n')[at.row - 1] ?? '';
    const i = at.column - 1;
    const before = /[^\s,;\t"]*$/.exec(line.slice(0, i))?.[0] ?? '';
    const after = /^[^\s,;\t"]*/.exec(line.slice(i))?.[0] ?? '';
    const word = `${before}${after}`.slice(0, 40);
    return {
      text,
      error: {
        file, ...at,
        message: `this file is not UTF-8 text (byte 0x${bytes[offset]!.toString(16).toUpperCase().padStart(2, '0')}); it was probably saved in the Windows code page (Windows-1252), where it reads "${word}"; ${SAVE_AS}`,
      },
    };
  }
}
