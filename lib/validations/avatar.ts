import { z } from "zod";
import { avatarLimits } from "@/lib/validations/account";

export const avatarUploadSchema = z.object({
  avatar: z
    .instanceof(File, { message: "Choose an image file." })
    .refine((file) => file.size > 0, "The chosen file is empty.")
    .refine((file) => file.size <= avatarLimits.maxBytes, `Images up to ${avatarLimits.maxBytes / 1024 / 1024} MB.`)
    .refine((file) => /^image\/(png|jpeg|webp|gif|avif)$/.test(file.type), "Use a PNG, JPEG, WebP, GIF or AVIF image."),
});
