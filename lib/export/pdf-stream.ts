// Writes a pdf-lib document to a file object by object, with some streams filled
// only as they are written. pdf-lib keeps a whole document in memory and saves it
// as one buffer; a print file's page images are hundreds of MB, so they stay out of
// the document: each is a stream with its dictionary and no contents (a
// placeholder), and its bytes are made when the writer reaches it, written, and let
// go. Everything else (pages, boxes, fonts, text, vector art) is pdf-lib's own
// serialisation, in a classic cross-reference table (ISO 32000-1 §7.5.4).
import { open } from 'node:fs/promises';
import {
  PDFCrossRefSection,
  type PDFDocument,
  PDFHeader,
  PDFName,
  PDFNumber,
  type PDFObject,
  PDFRawStream,
  type PDFRef,
  PDFTrailer,
  PDFTrailerDict,
} from 'pdf-lib';

/** Makes a placeholder's contents when it is written: the encoded bytes, and entries to add to its dictionary. */
export type StreamFiller = () => Promise<{ bytes: Uint8Array; dict?: Record<string, PDFObject> }>;

export class DeferredStreams {
  private fillers = new Map<number, StreamFiller>();
  constructor(private doc: PDFDocument) {}

  /** A stream object with this dictionary whose bytes `fill` makes at writing time. */
  add(dict: Record<string, PDFObject | string | number>, fill: StreamFiller): PDFRef {
    const ref = this.doc.context.register(this.doc.context.stream(new Uint8Array(0), dict));
    this.fillers.set(ref.objectNumber, fill);
    return ref;
  }

  filler(ref: PDFRef): StreamFiller | undefined {
    return ref.generationNumber === 0 ? this.fillers.get(ref.objectNumber) : undefined;
  }

  get size() {
    return this.fillers.size;
  }
}

const ascii = (s: string) => Buffer.from(s, 'latin1');
const bytesOf = (o: { sizeInBytes(): number; copyBytesInto(b: Uint8Array, at: number): number }) => {
  const b = new Uint8Array(o.sizeInBytes());
  o.copyBytesInto(b, 0);
  return b;
};

/**
 * Saves the document to `file`. Memory holds the document's small objects and one
 * filled stream at a time. `onFilled` is told after each filled stream is written.
 */
export async function writePdfFile(
  doc: PDFDocument,
  deferred: DeferredStreams,
  file: string,
  onFilled?: (count: number) => void | Promise<void>,
): Promise<{ bytes: number }> {
  await doc.flush(); // fonts subset and embedded, pages' content written
  const context = doc.context;
  const fh = await open(file, 'w');
  let offset = 0;
  // Small objects are gathered and written in chunks of about 1 MB.
  let pending: Uint8Array[] = [];
  let pendingBytes = 0;
  const flush = async () => {
    if (!pendingBytes) return;
    await fh.write(Buffer.concat(pending, pendingBytes));
    pending = [];
    pendingBytes = 0;
  };
  const put = async (b: Uint8Array) => {
    offset += b.byteLength;
    if (b.byteLength > 1 << 20) {
      await flush();
      await fh.write(b);
      return;
    }
    pending.push(b);
    pendingBytes += b.byteLength;
    if (pendingBytes > 1 << 20) await flush();
  };
  try {
    await put(bytesOf(PDFHeader.forVersion(1, 7)));
    await put(ascii('\n\n'));
    const xref = PDFCrossRefSection.create();
    let filled = 0;
    for (const [ref, object] of context.enumerateIndirectObjects()) {
      xref.addEntry(ref, offset);
      await put(ascii(`${ref.objectNumber} ${ref.generationNumber} obj\n`));
      const fill = deferred.filler(ref);
      if (fill && object instanceof PDFRawStream) {
        const { bytes, dict } = await fill();
        for (const [k, v] of Object.entries(dict ?? {})) object.dict.set(PDFName.of(k), v);
        object.dict.set(PDFName.of('Length'), PDFNumber.of(bytes.byteLength));
        await put(bytesOf(object.dict));
        await put(ascii('\nstream\n'));
        await put(bytes);
        await put(ascii('\nendstream'));
        filled++;
      } else {
        await put(bytesOf(object));
      }
      await put(ascii('\nendobj\n\n'));
      if (fill) {
        await flush();
        await onFilled?.(filled);
      }
    }
    const xrefAt = offset;
    await put(bytesOf(xref));
    await put(ascii('\n'));
    const info = context.trailerInfo;
    await put(bytesOf(PDFTrailerDict.of(context.obj({ Size: context.largestObjectNumber + 1, Root: info.Root, Info: info.Info, ID: info.ID }))));
    await put(ascii('\n\n'));
    await put(bytesOf(PDFTrailer.forLastCrossRefSectionOffset(xrefAt)));
    await flush();
  } finally {
    await fh.close();
  }
  return { bytes: offset };
}
