// A PDF written to its file object by object (join.ts): each object goes out as soon as it is
// final and is then forgotten, so a pack of any length is joined in bounded memory; the offsets
// are kept for the cross-reference table that ends the file.
import { closeSync, openSync, writeSync } from 'node:fs';
import { PDFContext, PDFRef } from 'pdf-lib';

export class ObjectWriter {
  private readonly fd: number;
  private written = 0;
  /** byte offset of each object, by object number */
  private readonly offsets: number[] = [];
  private nextObject = 1;

  /** Start the PDF at `path`. */
  constructor(path: string) {
    this.fd = openSync(path, 'w');
    // the binary comment tells a reader the file holds binary data (ISO 32000-1 §7.5.2)
    this.write(Buffer.from('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n\n', 'latin1'));
  }

  /** An object number of its own, for an object written later. */
  reserve(): PDFRef {
    return PDFRef.of(this.nextObject++);
  }

  /** A context whose new objects are numbered after every object so far. */
  context(): PDFContext {
    const ctx = PDFContext.create();
    ctx.largestObjectNumber = this.nextObject - 1;
    return ctx;
  }

  /** Write the context's objects that `now` accepts (and forget them). */
  flush(ctx: PDFContext, now: (ref: PDFRef) => boolean): void {
    for (const [ref, obj] of ctx.enumerateIndirectObjects()) {
      if (!now(ref)) continue;
      const bytes = new Uint8Array(obj.sizeInBytes());
      obj.copyBytesInto(bytes, 0);
      this.offsets[ref.objectNumber] = this.written;
      this.write(Buffer.from(`${ref.objectNumber} 0 obj\n`, 'latin1'));
      this.write(bytes);
      this.write(Buffer.from('\nendobj\n\n', 'latin1'));
      ctx.delete(ref);
    }
    this.nextObject = Math.max(this.nextObject, ctx.largestObjectNumber + 1);
  }

  /** The cross-reference table and trailer (ISO 32000-1 §7.5.4, §7.5.5); closes the file. */
  trailer(root: PDFRef, info: PDFRef | undefined): void {
    const size = this.nextObject;
    const rows = ['xref', `0 ${size}`, '0000000000 65535 f '];
    for (let n = 1; n < size; n++) {
      const at = this.offsets[n];
      rows.push(at === undefined ? '0000000000 00000 f ' : `${String(at).padStart(10, '0')} 00000 n `);
    }
    const start = this.written;
    this.write(Buffer.from(`${rows.join('\n')}\ntrailer\n<<\n/Size ${size}\n/Root ${root.toString()}${info ? `\n/Info ${info.toString()}` : ''}\n>>\n\nstartxref\n${start}\n%%EOF`, 'latin1'));
    closeSync(this.fd);
  }

  private write(bytes: Uint8Array): void {
    writeSync(this.fd, bytes);
    this.written += bytes.length;
  }

  /** Close the file without finishing it. */
  abandon(): void {
    try {
      closeSync(this.fd);
    } catch {
      /* already closed */
    }
  }
}
