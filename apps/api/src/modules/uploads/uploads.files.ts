// What is done to an uploaded file before it is stored: its type read from the bytes (file-type), images turned
// upright, re-encoded without their metadata (EXIF location included) and thumbnailed (sharp). No I/O here.
import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { UPLOAD_MIME_TYPES, type UploadKind } from '@benchwright/contracts';
import { Invalid, UnsupportedMediaType } from '../../lib/errors';

export interface ProcessedFile {
  mimeType: (typeof UPLOAD_MIME_TYPES)[number];
  kind: UploadKind;
  ext: string;
  data: Buffer;
  /** a WebP at most THUMB_PX on its longer side; images only */
  thumbnail: Buffer | null;
}

export const THUMB_PX = 320;
/** A decompression bomb is refused before it is decoded (a 15 MB file may claim a huge canvas). */
const MAX_PIXELS = 60_000_000;

const EXT: Record<ProcessedFile['mimeType'], string> = {
  'image/jpeg': '.jpg',
  'image/png': '.png',
  'image/webp': '.webp',
  'application/pdf': '.pdf',
};

/** Reads the type from the bytes (the name and the declared type are ignored) and prepares the file for storing. */
export async function processUpload(bytes: Buffer): Promise<ProcessedFile> {
  const type = await fileTypeFromBuffer(bytes);
  const mimeType = UPLOAD_MIME_TYPES.find((m) => m === type?.mime);
  if (!mimeType)
    throw new UnsupportedMediaType('Attach a photo (JPEG, PNG or WebP) or a PDF; that file is none of these.');
  if (mimeType === 'application/pdf')
    return { mimeType, kind: 'pdf', ext: EXT[mimeType], data: bytes, thumbnail: null };
  try {
    // rotate() with no angle turns the image upright from its EXIF orientation; the output keeps no metadata
    const img = sharp(bytes, { limitInputPixels: MAX_PIXELS, failOn: 'error' }).rotate();
    const encoded =
      mimeType === 'image/jpeg'
        ? img.jpeg({ quality: 85, mozjpeg: true })
        : mimeType === 'image/png'
          ? img.png()
          : img.webp({ quality: 85 });
    const data = await encoded.toBuffer();
    const thumbnail = await sharp(data)
      .resize(THUMB_PX, THUMB_PX, { fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 75 })
      .toBuffer();
    return { mimeType, kind: 'image', ext: EXT[mimeType], data, thumbnail };
  } catch {
    throw new Invalid('That image could not be read; it may be damaged or too large. Try saving it again.', [
      { path: 'file', message: 'the image could not be read' },
    ]);
  }
}

/**
 * The uploaded name as display text: control and direction-override characters removed, any folder dropped,
 * at most 200 characters. It is never used as a path.
 */
export function displayName(raw: string): string {
  const cleaned = raw
    // eslint-disable-next-line no-control-regex -- removing control characters is the point
    .replace(/[\u0000-\u001f\u007f-\u009f\u200b-\u200f\u202a-\u202e\u2066-\u2069]/g, '')
    .split(/[\\/]/)
    .pop()!
    .trim()
    .slice(0, 200);
  return cleaned || 'file';
}
