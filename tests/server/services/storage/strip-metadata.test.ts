/**
 * Uploaded images lose their metadata: an EXIF block with a GPS position and camera text in a
 * JPEG, and text/EXIF chunks in a PNG, are gone after stripping, while the image data stays.
 */
import { describe, expect, it } from 'vitest';
import { stripImageMetadata } from '../../../../server/services/storage/strip-metadata';

const SECRET = 'Larkspur GPS 47.2N 8.5E by Camera-X';

/** A JPEG segment: marker, big-endian length (including itself), payload. */
function segment(marker: number, payload: Buffer): Buffer {
  const len = Buffer.alloc(2);
  len.writeUInt16BE(payload.length + 2);
  return Buffer.concat([Buffer.from([0xff, marker]), len, payload]);
}

const jfif = segment(0xe0, Buffer.from('4a46494600010100000100010000', 'hex'));
const exif = segment(
  0xe1,
  Buffer.concat([
    Buffer.from('Exif\0\0', 'binary'),
    Buffer.from('II*\0\x08\0\0\0', 'binary'),
    Buffer.from(SECRET),
  ]),
);
const scan = Buffer.from('ffdb000443000102ffda0008010100003f00aabbccffd9', 'hex');

/** A PNG chunk: length, type, data, CRC (left zero: the stripper does not check it). */
function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  return Buffer.concat([len, Buffer.from(type, 'ascii'), data, Buffer.alloc(4)]);
}
const pngSignature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const ihdr = chunk('IHDR', Buffer.from('0000000100000001080600000000', 'hex').subarray(0, 13));
const idat = chunk('IDAT', Buffer.from('789c6300010000050001', 'hex'));
const iend = chunk('IEND', Buffer.alloc(0));

describe('stripImageMetadata', () => {
  it('removes the EXIF segment of a JPEG and keeps every other byte in order', async () => {
    const jpeg = Buffer.concat([Buffer.from([0xff, 0xd8]), jfif, exif, scan]);
    const out = await stripImageMetadata(jpeg);
    expect(out.includes(Buffer.from(SECRET))).toBe(false);
    expect(out.includes(Buffer.from('Exif\0\0', 'binary'))).toBe(false);
    expect(out).toEqual(Buffer.concat([Buffer.from([0xff, 0xd8]), jfif, scan]));
  });

  it('removes text and EXIF chunks of a PNG and keeps the image chunks', async () => {
    const png = Buffer.concat([
      pngSignature,
      ihdr,
      chunk('tEXt', Buffer.from(`Comment\0${SECRET}`)),
      chunk('eXIf', Buffer.from(`II*\0${SECRET}`)),
      idat,
      iend,
    ]);
    const out = await stripImageMetadata(png);
    expect(out.includes(Buffer.from(SECRET))).toBe(false);
    expect(out).toEqual(Buffer.concat([pngSignature, ihdr, idat, iend]));
  });

  it('leaves an image without metadata as it is', async () => {
    const plain = Buffer.concat([Buffer.from([0xff, 0xd8]), jfif, scan]);
    expect(await stripImageMetadata(plain)).toEqual(plain);
  });
});
