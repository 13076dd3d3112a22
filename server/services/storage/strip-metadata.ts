/**
 * Removes metadata from an uploaded image before it is stored: EXIF (camera, GPS position, time),
 * XMP and, in PNG, text and time chunks — through the maintained exif-be-gone package, which
 * handles the JPEG, PNG and WebP files we accept. Pixels are left as they are.
 */
import { Readable } from 'node:stream';
import { buffer } from 'node:stream/consumers';
import ExifTransformer from 'exif-be-gone';

export async function stripImageMetadata(bytes: Buffer): Promise<Buffer> {
  return buffer(Readable.from([bytes]).pipe(new ExifTransformer()));
}
