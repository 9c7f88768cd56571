// A logo upload turned into the one PNG the shop keeps: the type read from the bytes (file-type), SVG recognised by
// parsing it (file-type does not detect SVG), everything rasterised and bounded by sharp. No I/O here.
import { fileTypeFromBuffer } from 'file-type';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import sharp from 'sharp';
import { LOGO_MAX_HEIGHT_PX, LOGO_MAX_WIDTH_PX } from '@benchwright/contracts';
import { PayloadTooLarge, UnsupportedMediaType } from '../../lib/errors';

const RASTER = new Set(['image/png', 'image/jpeg', 'image/webp']);
/** the most pixels a logo may decode to (a 6000 x 4000 photograph is under it) */
const MAX_PIXELS = 40_000_000;

/**
 * True when the bytes are well-formed UTF-8 XML whose root element is `svg`. Entity declarations are refused (the
 * parser would expand them; a logo never needs them). Scripts are harmless: the SVG is rasterised, never served.
 */
export function isSvg(bytes: Buffer): boolean {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return false;
  }
  if (/<!ENTITY/i.test(text)) return false;
  if (XMLValidator.validate(text) !== true) return false;
  const nodes = new XMLParser({ preserveOrder: true, ignoreAttributes: true, processEntities: false }).parse(
    text,
  ) as Record<string, unknown>[];
  const roots = nodes.flatMap((n) => Object.keys(n)).filter((k) => !k.startsWith('?') && !k.startsWith('#'));
  return roots.length === 1 && (roots[0] === 'svg' || roots[0]!.endsWith(':svg'));
}

/** The logo as a PNG at most LOGO_MAX_WIDTH_PX x LOGO_MAX_HEIGHT_PX; 415 when it is not an image we take. */
export async function logoToPng(bytes: Buffer): Promise<Buffer> {
  const type = await fileTypeFromBuffer(bytes);
  // file-type names an SVG with an XML declaration as XML, and one without it not at all
  const ok = type && type.ext !== 'xml' ? RASTER.has(type.mime) : isSvg(bytes);
  if (!ok) throw new UnsupportedMediaType('The logo must be a PNG, JPEG, WebP or SVG image.');
  try {
    const img = sharp(bytes, { limitInputPixels: false, failOn: 'error' });
    const meta = await img.metadata();
    if ((meta.width ?? 0) * (meta.height ?? 0) > MAX_PIXELS)
      throw new PayloadTooLarge('The logo is too large in pixels; send one under 40 megapixels.');
    return await img
      .rotate()
      .resize({ width: LOGO_MAX_WIDTH_PX, height: LOGO_MAX_HEIGHT_PX, fit: 'inside', withoutEnlargement: true })
      .png()
      .toBuffer();
  } catch (err) {
    if (err instanceof PayloadTooLarge) throw err;
    throw new UnsupportedMediaType('The logo could not be read as an image.');
  }
}
