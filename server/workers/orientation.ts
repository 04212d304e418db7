// The EXIF orientation of a JPEG or WebP, read from the bytes without decoding the picture.
//
// EXIF keeps it in a TIFF structure: byte order "II" (little-endian) or "MM" (big-endian), the number 42, the offset
// of the first IFD; the IFD is a 2-byte count of 12-byte entries (tag, type, count, value). Orientation is tag
// 0x0112, type SHORT, one value 1–8 (EXIF 2.32, JEITA CP-3451, 4.6.4 A and 4.6.2).
// - JPEG carries that TIFF structure in an APP1 segment that starts "Exif\0\0" (EXIF 2.32, 4.5.4).
// - WebP carries it in an "EXIF" chunk of its RIFF container (developers.google.com/speed/webp/docs/riff_container,
//   "Extended File Format"); some writers put the JPEG-style "Exif\0\0" prefix in front, which is skipped.
// PNG's eXIf chunk is not read: Jimp never turned PNGs, and photos from phones arrive as JPEG.

export type Orientation = 1 | 2 | 3 | 4 | 5 | 6 | 7 | 8;

const EXIF_HEADER = [0x45, 0x78, 0x69, 0x66, 0x00, 0x00]; // "Exif\0\0"
const ORIENTATION_TAG = 0x0112;
const SHORT = 3;

const startsWith = (buf: Uint8Array, at: number, bytes: number[]) => bytes.every((b, i) => buf[at + i] === b);

/**
 * Where the orientation's value sits in `buf` and what it says, given a TIFF structure at `tiff`..`end`; null when
 * there is no (sensible) orientation entry. Every offset is checked against the segment, so a damaged or hostile
 * header can only mean "no orientation".
 */
function findInTiff(
  buf: Uint8Array,
  tiff: number,
  end: number,
): { at: number; little: boolean; value: number } | null {
  if (tiff + 8 > end) return null;
  const little = buf[tiff] === 0x49 && buf[tiff + 1] === 0x49;
  if (!little && !(buf[tiff] === 0x4d && buf[tiff + 1] === 0x4d)) return null;
  const u16 = (at: number) => (little ? buf[at] | (buf[at + 1] << 8) : (buf[at] << 8) | buf[at + 1]);
  const u32 = (at: number) =>
    little
      ? (buf[at] | (buf[at + 1] << 8) | (buf[at + 2] << 16)) + buf[at + 3] * 0x1000000
      : buf[at] * 0x1000000 + ((buf[at + 1] << 16) | (buf[at + 2] << 8) | buf[at + 3]);
  if (u16(tiff + 2) !== 42) return null;
  const ifd = tiff + u32(tiff + 4);
  if (ifd + 2 > end) return null;
  const count = u16(ifd);
  for (let i = 0; i < count; i += 1) {
    const entry = ifd + 2 + i * 12;
    if (entry + 12 > end) return null;
    if (u16(entry) !== ORIENTATION_TAG) continue;
    if (u16(entry + 2) !== SHORT || u32(entry + 4) !== 1) return null;
    return { at: entry + 8, little, value: u16(entry + 8) };
  }
  return null;
}

/** The TIFF structure inside a JPEG's EXIF APP1 segment, searched among the segments before the first scan. */
function jpegTiff(buf: Uint8Array): { start: number; end: number } | null {
  let i = 2;
  while (i + 4 <= buf.length && buf[i] === 0xff) {
    const marker = buf[i + 1];
    if (marker === 0xff) {
      i += 1; // fill byte
      continue;
    }
    // Start of scan or end of image: no EXIF in the header.
    if (marker === 0xda || marker === 0xd9) return null;
    const length = (buf[i + 2] << 8) | buf[i + 3];
    if (length < 2) return null;
    const end = Math.min(buf.length, i + 2 + length);
    if (marker === 0xe1 && startsWith(buf, i + 4, EXIF_HEADER))
      return { start: i + 4 + EXIF_HEADER.length, end };
    i += 2 + length;
  }
  return null;
}

/** The TIFF structure inside a WebP's EXIF chunk. */
function webpTiff(buf: Uint8Array): { start: number; end: number } | null {
  let i = 12; // "RIFF", size, "WEBP"
  while (i + 8 <= buf.length) {
    const size = (buf[i + 4] | (buf[i + 5] << 8) | (buf[i + 6] << 16)) + buf[i + 7] * 0x1000000;
    const start = i + 8;
    const end = Math.min(buf.length, start + size);
    if (startsWith(buf, i, [0x45, 0x58, 0x49, 0x46])) {
      // "EXIF"
      return startsWith(buf, start, EXIF_HEADER)
        ? { start: start + EXIF_HEADER.length, end }
        : { start, end };
    }
    i = start + size + (size % 2); // chunks are padded to an even length
  }
  return null;
}

const isJpeg = (buf: Uint8Array) => buf.length > 3 && buf[0] === 0xff && buf[1] === 0xd8;
const isWebp = (buf: Uint8Array) =>
  buf.length > 12 &&
  startsWith(buf, 0, [0x52, 0x49, 0x46, 0x46]) &&
  startsWith(buf, 8, [0x57, 0x45, 0x42, 0x50]);

/**
 * The picture's EXIF orientation (1 when it has none, or an unreadable one). With `neutralize`, the tag in `buf`
 * itself is rewritten to 1 (the bytes must be the caller's own copy), so a decoder that turns pictures by EXIF
 * leaves the pixels as stored and the caller can turn them later, once they are small.
 */
export function exifOrientation(buf: Uint8Array, { neutralize = false } = {}): Orientation {
  const tiff = isJpeg(buf) ? jpegTiff(buf) : isWebp(buf) ? webpTiff(buf) : null;
  if (!tiff) return 1;
  const found = findInTiff(buf, tiff.start, tiff.end);
  if (!found || found.value < 1 || found.value > 8) return 1;
  if (neutralize && found.value !== 1) {
    buf[found.at] = found.little ? 1 : 0;
    buf[found.at + 1] = found.little ? 0 : 1;
  }
  return found.value as Orientation;
}
