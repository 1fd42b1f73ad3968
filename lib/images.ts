import "server-only";
import sharp from "sharp";
import { UserFacingError } from "@/lib/errors";

/**
 * Re-encodes an uploaded picture: decoding it proves it is an image, rotating by EXIF then dropping all
 * metadata removes camera and location data, and a fixed output format means we never serve what was sent.
 */
export async function reencodeSquareImage(input: Buffer, edgePixels: number): Promise<Buffer> {
  try {
    return await sharp(input, { limitInputPixels: 40_000_000 })
      .rotate()
      .resize(edgePixels, edgePixels, { fit: "cover", position: "attention" })
      .webp({ quality: 82 })
      .toBuffer();
  } catch {
    throw new UserFacingError("That file could not be read as an image.", 422, { avatar: ["That file could not be read as an image."] });
  }
}
