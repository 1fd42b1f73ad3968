import { z } from "zod";

export const emailField = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email({ message: "Enter an e-mail address such as name@example.org." }));

export const newPasswordField = z
  .string()
  .min(10, "Use at least 10 characters.")
  .max(200, "Use at most 200 characters.");

export const signInSchema = z.object({
  email: emailField,
  password: z.string().min(1, "Enter your password.").max(200),
});

export const signUpSchema = z
  .object({
    name: z.string().trim().min(2, "Enter the name readers will see.").max(80, "Use at most 80 characters."),
    email: emailField,
    password: newPasswordField,
    confirmPassword: z.string(),
  })
  .refine((values) => values.password === values.confirmPassword, {
    message: "The two passwords differ.",
    path: ["confirmPassword"],
  });

export const passwordResetRequestSchema = z.object({ email: emailField });

export const passwordResetSchema = z
  .object({
    token: z.string().regex(/^[A-Za-z0-9_-]{43}$/, "This reset link is malformed."),
    password: newPasswordField,
    confirmPassword: z.string(),
  })
  .refine((values) => values.password === values.confirmPassword, {
    message: "The two passwords differ.",
    path: ["confirmPassword"],
  });

export const roleChangeSchema = z.object({
  userId: z.uuid("Unknown account."),
  role: z.enum(["reader", "reviewer", "editor", "admin"], { message: "Choose one of the four roles." }),
});

export const avatarLimits = { maxBytes: 5 * 1024 * 1024, edgePixels: 256 } as const;

/** Typing the address is the confirmation: a stray click cannot delete an account. */
export const accountDeletionSchema = z.object({ confirmEmail: emailField });
