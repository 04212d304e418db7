import imageCompression from 'browser-image-compression';
// Served from our own origin: the library would otherwise fetch its worker script from a CDN, which our
// content policy (and our rule of loading nothing from other hosts) forbids.
import compressionLibUrl from 'browser-image-compression/dist/browser-image-compression.js?url';
import { PHOTO_LIMITS } from '@/schemas/journal';

/** Long side and quality for what leaves the phone: big enough for the server's 1600 px copy, small on mobile data. */
export const SHRINK = { maxSide: 2048, quality: 0.85 } as const;

export type ShrinkResult = { file: Blob; name: string; shrunk: boolean };

const jpegName = (name: string) => (name.replace(/\.[^./\\]+$/, '') || 'photo') + '.jpg';

/**
 * A JPEG copy at most 2048 px on its long side, turned upright and without EXIF (the canvas keeps only
 * pixels). If this browser cannot decode the file, the original goes as it is and the server, which never
 * trusts this step anyway, says what is wrong with it.
 */
export async function shrinkPhoto(file: File, { signal, onProgress }: { signal?: AbortSignal; onProgress?: (fraction: number) => void } = {}): Promise<ShrinkResult> {
  try {
    const out = await imageCompression(file, {
      maxWidthOrHeight: SHRINK.maxSide,
      initialQuality: SHRINK.quality,
      fileType: 'image/jpeg',
      useWebWorker: true,
      libURL: new URL(compressionLibUrl, window.location.href).href,
      preserveExif: false,
      signal,
      onProgress: (p) => onProgress?.(p / 100),
    });
    return { file: out, name: jpegName(file.name), shrunk: true };
  } catch (err) {
    if (signal?.aborted) throw err;
    return { file, name: file.name || 'photo', shrunk: false };
  }
}

const HEIC = /\.(heic|heif)$/i;

/** Refusals we can say before sending anything; the server checks everything again. */
export function refuseLocally(file: File): string | null {
  const name = `“${file.name || 'unnamed file'}”`;
  if (file.size === 0) return `${name} is empty (0 bytes). Choose the photo again.`;
  if (file.type && !file.type.startsWith('image/') && !HEIC.test(file.name)) {
    return `${name} is not a photo. Photos work as JPEG, PNG or WebP.`;
  }
  return null;
}

/** After shrinking, the server's own limit still applies to what we would send. */
export function tooBigToSend(blob: Blob, name: string) {
  return blob.size > PHOTO_LIMITS.maxFileBytes ? `“${name}” is larger than 15 MB even after shrinking. Choose a smaller copy of the photo.` : null;
}
