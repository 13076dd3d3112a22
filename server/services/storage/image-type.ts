/**
 * Recognises the image types we accept by their first bytes (magic numbers), not by the
 * file name or the browser's claimed type. SVG is refused: it can carry scripts.
 * Signatures: PNG (ISO/IEC 15948 §5.2), JPEG SOI marker FF D8 FF, WebP RIFF....WEBP.
 */
export type ImageType = { contentType: 'image/png' | 'image/jpeg' | 'image/webp'; ext: string };

export function detectImageType(bytes: Buffer): ImageType | null {
  const png = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  if (bytes.length >= 8 && png.every((b, i) => bytes[i] === b))
    return { contentType: 'image/png', ext: 'png' };
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff)
    return { contentType: 'image/jpeg', ext: 'jpg' };
  if (
    bytes.length >= 12 &&
    bytes.toString('ascii', 0, 4) === 'RIFF' &&
    bytes.toString('ascii', 8, 12) === 'WEBP'
  )
    return { contentType: 'image/webp', ext: 'webp' };
  return null;
}
