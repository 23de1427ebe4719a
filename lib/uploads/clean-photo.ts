import sharp, { type Metadata } from "sharp";
import type { ContentKind } from "./sniff";

// Photos are decoded and drawn again, never stored as uploaded: the new file carries only
// pixels. sharp writes no EXIF, XMP or IPTC unless asked to (keepExif / withMetadata), so the GPS
// position, the camera's serial number and any comment block stay behind with the original.

/** Longest side of the stored photo; enough for a zoomed listing photo. */
export const PHOTO_MAX_EDGE = 2400;
/** Longest side of the thumbnail used in lists and the uploader's previews. */
export const THUMB_MAX_EDGE = 480;
// Beyond any phone or camera photo in ordinary use; a "pixel bomb" (tiny file, huge canvas)
// is refused before it is decoded into memory.
const MAX_INPUT_PIXELS = 100_000_000;

export type EncodedImage = { bytes: Buffer; contentType: "image/jpeg" | "image/webp"; extension: "jpg" | "webp"; width: number; height: number };
export type CleanedPhoto = { photo: EncodedImage; thumb: EncodedImage };

export class UnreadablePhotoError extends Error {
  constructor(readonly reason: string) {
    super(reason);
    this.name = "UnreadablePhotoError";
  }
}

const TOO_LARGE = `it is larger than ${MAX_INPUT_PIXELS / 1_000_000} megapixels`;

/**
 * Whether the header alone claims more pixels than the limit (the decoder refuses those before
 * reading them, with an error that does not say why). Only the header is read: nothing is decoded.
 */
async function tooLarge(bytes: Uint8Array): Promise<boolean> {
  try {
    const { width = 0, height = 0 } = await sharp(bytes, { limitInputPixels: false, pages: 1 }).metadata();
    return width * height > MAX_INPUT_PIXELS;
  } catch {
    return false;
  }
}

const SHARP_FORMAT: Record<string, ContentKind> = { jpeg: "jpeg", png: "png", webp: "webp" };

function decoder(bytes: Uint8Array) {
  // "error" also refuses truncated data; plain warnings (common in camera files) are let through.
  return sharp(bytes, { failOn: "error", limitInputPixels: MAX_INPUT_PIXELS, pages: 1 });
}

export async function cleanPhoto(bytes: Uint8Array, kind: ContentKind): Promise<CleanedPhoto> {
  let metadata: Metadata;
  try {
    metadata = await decoder(bytes).metadata();
  } catch {
    throw new UnreadablePhotoError(await tooLarge(bytes) ? TOO_LARGE : "it could not be read as an image; it may be damaged or incomplete");
  }
  if (SHARP_FORMAT[metadata.format ?? ""] !== kind) {
    throw new UnreadablePhotoError("its content does not decode as the image type it starts with");
  }
  if ((metadata.width ?? 0) * (metadata.height ?? 0) > MAX_INPUT_PIXELS) throw new UnreadablePhotoError(TOO_LARGE);

  // Transparent images stay transparent as WebP; everything else becomes a JPEG.
  const webp = metadata.hasAlpha === true;
  let photo: EncodedImage;
  try {
    const pipeline = decoder(bytes)
      .autoOrient()
      .resize({ width: PHOTO_MAX_EDGE, height: PHOTO_MAX_EDGE, fit: "inside", withoutEnlargement: true })
      .toColourspace("srgb");
    const { data, info } = await (webp ? pipeline.webp({ quality: 86 }) : pipeline.jpeg({ quality: 86 })).toBuffer({ resolveWithObject: true });
    photo = webp
      ? { bytes: data, contentType: "image/webp", extension: "webp", width: info.width, height: info.height }
      : { bytes: data, contentType: "image/jpeg", extension: "jpg", width: info.width, height: info.height };
  } catch {
    throw new UnreadablePhotoError("it could not be decoded completely; it may be truncated or damaged");
  }

  // The thumbnail is drawn from the cleaned photo, so it cannot inherit anything the photo lost.
  const { data, info } = await sharp(photo.bytes)
    .resize({ width: THUMB_MAX_EDGE, height: THUMB_MAX_EDGE, fit: "inside", withoutEnlargement: true })
    .webp({ quality: 80 })
    .toBuffer({ resolveWithObject: true });
  return { photo, thumb: { bytes: data, contentType: "image/webp", extension: "webp", width: info.width, height: info.height } };
}
