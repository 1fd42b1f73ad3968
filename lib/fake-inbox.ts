import { z } from "zod";

// Shared by the mail fake (which writes these), lib/mail.ts (the admin inbox page) and the test helpers, so the three
// cannot drift apart. No server-only guard: it holds no secrets and the test helpers import it.
export const fakeMailMessageSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
});

export type FakeMailMessage = z.infer<typeof fakeMailMessageSchema>;

export const fakeMailListSchema = z.array(fakeMailMessageSchema);
