import "server-only";
import sharp from "sharp";
import { UserFacingError } from "@/lib/errors";

// A decompression bomb stops here instead of filling memory.
const limitInputPixels = 40_000_000;

/**
 * Re-encodes an uploaded picture: decoding it proves it is an image, rotating by EXIF then dropping all
 * metadata removes camera and location data, and a fixed output format means we never serve what was sent.
 */
export async function reencodeSquareImage(input: Buffer, edgePixels: number): Promise<Buffer> {
  try {
    return await sharp(input, { limitInputPixels })
      .rotate()
      .resize(edgePixels, edgePixels, { fit: "cover", position: "attention" })
      .webp({ quality: 82 })
      .toBuffer();
  } catch {
    throw unreadableImage("avatar");
  }
}

function unreadableImage(field: string): UserFacingError {
  return new UserFacingError("That file could not be read as an image.", 422, { [field]: ["That file could not be read as an image."] });
}

export type WebRendition = { width: number; height: number; data: Buffer };

/**
 * WebP renditions of a photo at each of `widths` that is not wider than the photo itself (never upscaled; a photo
 * narrower than all of them gets one rendition at its own width). Upright by EXIF, with every metadata block dropped.
 */
export async function reencodeWebRenditions(input: Buffer, widths: readonly number[], field: string): Promise<WebRendition[]> {
  let uprightWidth: number;
  try {
    uprightWidth = (await sharp(input, { limitInputPixels }).metadata()).autoOrient.width;
  } catch {
    throw unreadableImage(field);
  }
  const fitting = widths.filter((width) => width <= uprightWidth);
  const targets = fitting.length ? fitting : [uprightWidth];
  try {
    return await Promise.all(
      targets.map(async (width) => {
        const { data, info } = await sharp(input, { limitInputPixels })
          .autoOrient()
          .resize({ width, withoutEnlargement: true })
          .webp({ quality: 80 })
          .toBuffer({ resolveWithObject: true });
        return { width: info.width, height: info.height, data };
      }),
    );
  } catch {
    throw unreadableImage(field);
  }
}
