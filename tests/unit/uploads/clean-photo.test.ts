import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { cleanPhoto, PHOTO_MAX_EDGE, THUMB_MAX_EDGE, UnreadablePhotoError } from "@/lib/uploads/clean-photo";
import { CAMERA, exifSegment, jpegSegments, jpegWithCameraMetadata, noisePixels, plainPng, readExif } from "../../support/files";

// What a photo carries is read back with our own EXIF reader (CIPA DC-008 Exif 2.32; GPS IFD is
// tag 0x8825) and with sharp's metadata(), so neither alone decides.

describe("cleanPhoto", () => {
  it("drops EXIF (GPS position, camera serial) and XMP/IPTC, after turning the pixels upright", async () => {
    const original = await jpegWithCameraMetadata({ width: 640, height: 480, orientation: 6 });
    const before = readExif(exifSegment(original)!);
    expect(before.gps.get(0x0002)).toBe("52/1 31/1 12/1");
    expect(before.exif.get(0xa431)).toBe(CAMERA.serial);

    const { photo, thumb } = await cleanPhoto(original, "jpeg");
    expect(photo.contentType).toBe("image/jpeg");
    // Orientation 6 (Exif 2.32 Table 4: "0th row is the visual right-hand side") means rotate 90°.
    expect([photo.width, photo.height]).toEqual([480, 640]);
    const meta = await sharp(photo.bytes).metadata();
    expect(meta.exif).toBeUndefined();
    expect(meta.xmp).toBeUndefined();
    expect(meta.iptc).toBeUndefined();
    expect(meta.orientation).toBeUndefined();
    expect(exifSegment(photo.bytes)).toBeUndefined();
    // No APPn segment other than JFIF's APP0 survives, and none of the metadata's bytes do.
    expect(jpegSegments(photo.bytes).filter((s) => s.marker >= 0xe1 && s.marker <= 0xef)).toEqual([]);
    for (const secret of [CAMERA.serial, CAMERA.make, CAMERA.model]) expect(photo.bytes.includes(secret)).toBe(false);

    expect(thumb.contentType).toBe("image/webp");
    expect(Math.max(thumb.width, thumb.height)).toBe(THUMB_MAX_EDGE);
    expect((await sharp(thumb.bytes).metadata()).exif).toBeUndefined();
  });

  it("caps the longest side and never enlarges", async () => {
    const wide = await sharp(noisePixels(3000, 1000), { raw: { width: 3000, height: 1000, channels: 3 } }).jpeg().toBuffer();
    const { photo } = await cleanPhoto(wide, "jpeg");
    expect([photo.width, photo.height]).toEqual([PHOTO_MAX_EDGE, 800]);
    const small = await cleanPhoto(await plainPng({ width: 320, height: 200 }), "png");
    expect([small.photo.width, small.photo.height]).toEqual([320, 200]);
    expect([small.thumb.width, small.thumb.height]).toEqual([320, 200]);
  });

  it("keeps transparency as WebP and turns opaque PNGs into JPEG", async () => {
    expect((await cleanPhoto(await plainPng({ alpha: true }), "png")).photo.contentType).toBe("image/webp");
    expect((await cleanPhoto(await plainPng(), "png")).photo.contentType).toBe("image/jpeg");
  });

  it("refuses a truncated JPEG and a truncated PNG with a reason", async () => {
    const jpeg = await jpegWithCameraMetadata({ width: 800, height: 600 });
    await expect(cleanPhoto(jpeg.subarray(0, Math.floor(jpeg.length * 0.6)), "jpeg")).rejects.toBeInstanceOf(UnreadablePhotoError);
    const png = await plainPng({ width: 400, height: 300 });
    await expect(cleanPhoto(png.subarray(0, Math.floor(png.length * 0.7)), "png")).rejects.toThrow(/truncated|damaged|incomplete/);
  });

  it("refuses content that does not decode as the type its header claims", async () => {
    const png = await plainPng();
    await expect(cleanPhoto(png, "jpeg")).rejects.toBeInstanceOf(UnreadablePhotoError);
  });
});
