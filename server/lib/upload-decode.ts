// Every uploaded picture or PDF is decoded in full before it is kept: a file that does not
// decode is refused at upload, never found later by the traveller PDF. Images go through
// libvips (sharp) and come out as a small flat PNG thumbnail that pdfkit embeds without decoding;
// PDFs are parsed with pdf.js and their first page drawn to a thumbnail when it can be.
import sharp from 'sharp';
import { badInput } from '../errors';
import { sniffProofType, type SniffedType } from './uploads';

/** Thumbnails fit in this square (pixels): 24 mm on a card at about 300 dpi. */
export const THUMB_PX = 300;
/** Pictures larger than this many pixels are refused before decoding (a decompression bomb). */
const MAX_PIXELS = 60_000_000;

export interface DecodedUpload {
  mime: SniffedType;
  /** PNG, no alpha, non-interlaced, at most THUMB_PX square; null for a PDF whose page could not be drawn */
  thumbnail: Buffer | null;
}

const notDecodable = (name: string, kind: string) =>
  badInput(
    `"${name}" could not be read as a ${kind}: the file is damaged or not what it claims to be. Export it again and upload the new file.`,
    undefined,
    'bad_file_content',
  );

/** A flat PNG thumbnail of an image; throws when any part of the image does not decode. */
export async function imageThumbnail(buf: Buffer): Promise<Buffer> {
  // failOn 'warning': a checksum error or a truncated scan is a failure, not a grey patch
  const meta = await sharp(buf, { failOn: 'warning', limitInputPixels: MAX_PIXELS }).metadata();
  if (!meta.width || !meta.height) throw new Error('no size');
  // decode every pixel (a thumbnail alone may read only part of a progressive file)
  await sharp(buf, { failOn: 'warning', limitInputPixels: MAX_PIXELS }).raw().toBuffer();
  return sharp(buf, { failOn: 'warning', limitInputPixels: MAX_PIXELS })
    .rotate()
    .resize(THUMB_PX, THUMB_PX, { fit: 'inside', withoutEnlargement: true })
    .flatten({ background: '#ffffff' })
    .removeAlpha()
    .png({ progressive: false, palette: false })
    .toBuffer();
}

/** Parses a PDF with pdf.js (every object of page 1) and draws page 1; throws when it does not parse. */
export async function pdfThumbnail(buf: Buffer): Promise<Buffer | null> {
  const { getDocument } = await import('pdfjs-dist/legacy/build/pdf.mjs');
  const doc = await getDocument({ data: new Uint8Array(buf), isEvalSupported: false, stopAtErrors: true, verbosity: 0 }).promise;
  try {
    if (doc.numPages < 1) throw new Error('no pages');
    const page = await doc.getPage(1);
    await page.getOperatorList();
    try {
      const { createCanvas } = await import('@napi-rs/canvas');
      const base = page.getViewport({ scale: 1 });
      const viewport = page.getViewport({ scale: THUMB_PX / Math.max(base.width, base.height) });
      const canvas = createCanvas(Math.max(1, Math.ceil(viewport.width)), Math.max(1, Math.ceil(viewport.height)));
      const ctx = canvas.getContext('2d');
      ctx.fillStyle = '#ffffff';
      ctx.fillRect(0, 0, canvas.width, canvas.height);
      await page.render({ canvasContext: ctx as any, viewport }).promise;
      // through the image path too, so what we print is a flat PNG we made ourselves
      return await imageThumbnail(canvas.toBuffer('image/png'));
    } catch {
      // the PDF parsed, but its page could not be drawn here: keep it, print no artwork
      return null;
    }
  } finally {
    await doc.destroy();
  }
}

/**
 * The type of an uploaded proof or photo by its content, decoded in full. `allowed` limits the
 * types; anything else, or anything that does not decode, is refused with a 400.
 */
export async function decodeUpload(buf: Buffer, name: string, allowed: readonly SniffedType[]): Promise<DecodedUpload> {
  if (buf.length === 0) throw badInput('The file is empty.', undefined, 'empty_file');
  const mime = sniffProofType(buf);
  if (!mime || !allowed.includes(mime)) {
    const kinds = allowed.map((m) => (m === 'application/pdf' ? 'PDF' : m === 'image/png' ? 'PNG' : 'JPEG')).join(' or ');
    throw badInput(`"${name}" is not a ${kinds} file (checked by its content, not its name).`, undefined, 'bad_file_type');
  }
  if (mime === 'application/pdf') {
    try {
      return { mime, thumbnail: await pdfThumbnail(buf) };
    } catch {
      throw notDecodable(name, 'PDF');
    }
  }
  try {
    return { mime, thumbnail: await imageThumbnail(buf) };
  } catch {
    throw notDecodable(name, mime === 'image/png' ? 'PNG picture' : 'JPEG picture');
  }
}
