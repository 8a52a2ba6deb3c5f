import sharp from 'sharp';

/**
 * Re-encodes a photo without its metadata (EXIF with GPS location, camera, XMP, comments) before it is stored:
 * a bruise photo must not carry where the athlete lives. The EXIF orientation is applied to the pixels first,
 * so the picture still stands the right way up once the tag is gone. sharp drops metadata unless asked to keep it.
 */
export async function stripImageMetadata(bytes: Buffer, contentType: string): Promise<Buffer> {
  const image = sharp(bytes, { failOn: 'error' }).rotate();
  switch (contentType) {
    case 'image/jpeg':
      return image.jpeg({ quality: 90, mozjpeg: true }).toBuffer();
    case 'image/png':
      return image.png().toBuffer();
    case 'image/webp':
      return image.webp({ quality: 90 }).toBuffer();
    default:
      throw new Error(`No metadata stripping for ${contentType}`);
  }
}
