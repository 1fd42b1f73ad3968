import { eq } from "drizzle-orm";
import sharp from "sharp";
import { afterAll, describe, expect, it, vi } from "vitest";
import { changeUserRole } from "@/app/(admin)/actions";
import { updateAvatar } from "@/app/(account)/actions";
import { requestPasswordReset, resetPassword, signInWithPassword, signUpReader } from "@/app/(auth)/actions";
import { db } from "@/db";
import { getUserCredentials } from "@/db/queries/users";
import { users } from "@/db/schema";
import { idleActionState } from "@/lib/action-state";
import { getObjectStream, statObject } from "@/lib/object-storage";
import { verifyPassword } from "@/lib/passwords";
import { isSignInThrottled, recordSignInAttempt, signInThrottle } from "@/lib/sign-in-throttle";
import { createAccount } from "../support/factories";
import { waitForMessage } from "../support/mail";
import { actAs, authMock } from "../support/session-mock";
import { form } from "../support/actions";

vi.mock("@/lib/auth", async () => (await import("../support/session-mock")).authMock);
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn() }));


async function expectRedirect(promise: Promise<unknown>, location: string) {
  await expect(promise).rejects.toMatchObject({ digest: expect.stringContaining(location) });
}

afterAll(() => actAs(null));

describe("sign-up", () => {
  it("creates a reader, never another role, and sends a welcome e-mail", async () => {
    actAs(null);
    const email = `new-reader-${Date.now()}@tests.benchplate.test`;
    const result = await signUpReader(
      idleActionState,
      form({ name: "Wren Tallis", email: email.toUpperCase(), password: "a-long-password", confirmPassword: "a-long-password", role: "admin" }),
    );
    expect(result.status).toBe("ok");
    const stored = await getUserCredentials({ email });
    expect(stored?.role).toBe("reader");
    expect(await verifyPassword(stored!.passwordHash, "a-long-password")).toBe(true);
    const welcome = await waitForMessage(email, /Welcome to Benchplate/);
    expect(welcome.text).toContain("Wren Tallis");
  });

  it("names each invalid field and writes nothing", async () => {
    actAs(null);
    const email = `bad-${Date.now()}@tests.benchplate.test`;
    const result = await signUpReader(idleActionState, form({ name: "W", email, password: "short", confirmPassword: "other" }));
    expect(result.status).toBe("error");
    expect(Object.keys(result.fieldErrors ?? {}).sort()).toEqual(["confirmPassword", "name", "password"]);
    expect(await getUserCredentials({ email })).toBeNull();
  });

  it("refuses an address already in use", async () => {
    actAs(null);
    const existing = await createAccount({ role: "reader" });
    const result = await signUpReader(
      idleActionState,
      form({ name: "Someone Else", email: existing.email, password: "a-long-password", confirmPassword: "a-long-password" }),
    );
    expect(result.status).toBe("error");
    expect(result.fieldErrors?.email?.[0]).toMatch(/already exists/);
  });
});

describe("password reset", () => {
  it("mails a single-use link that sets the new password", async () => {
    actAs(null);
    const account = await createAccount({ role: "reader" });
    const requested = await requestPasswordReset(idleActionState, form({ email: account.email }));
    expect(requested.status).toBe("ok");
    const mail = await waitForMessage(account.email, /Reset your Benchplate password/);
    const token = /\/reset-password\/([A-Za-z0-9_-]{43})/.exec(mail.text)?.[1];
    expect(token).toBeDefined();

    await expectRedirect(resetPassword(idleActionState, form({ token: token!, password: "brand-new-password", confirmPassword: "brand-new-password" })), "/sign-in?reset=done");
    const stored = await getUserCredentials({ email: account.email });
    expect(await verifyPassword(stored!.passwordHash, "brand-new-password")).toBe(true);

    const reused = await resetPassword(idleActionState, form({ token: token!, password: "another-password", confirmPassword: "another-password" }));
    expect(reused).toMatchObject({ status: "error", message: expect.stringMatching(/expired or was already used/) });
  });

  it("answers the same for an unknown address and sends nothing", async () => {
    actAs(null);
    const email = `nobody-${Date.now()}@tests.benchplate.test`;
    const result = await requestPasswordReset(idleActionState, form({ email }));
    expect(result).toMatchObject({ status: "ok", message: expect.stringMatching(/If an account uses that address/) });
    await expect(waitForMessage(email, /Reset/, { timeoutMs: 1_000 })).rejects.toThrow();
  });
});

describe("sign-in throttling", () => {
  it("locks an account after repeated failures, whatever the address", async () => {
    const email = `throttled-${Date.now()}@tests.benchplate.test`;
    for (let attempt = 0; attempt < signInThrottle.maxFailuresPerAccount; attempt++) {
      expect(await isSignInThrottled({ email, clientAddress: `198.51.100.${attempt}` })).toBe(false);
      await recordSignInAttempt({ email, clientAddress: `198.51.100.${attempt}`, succeeded: false });
    }
    expect(await isSignInThrottled({ email, clientAddress: "198.51.100.200" })).toBe(true);
  });

  it("locks an address spraying many accounts", async () => {
    const clientAddress = `203.0.113.${Math.floor(Math.random() * 250)}-${Date.now()}`;
    for (let attempt = 0; attempt < signInThrottle.maxFailuresPerAddress; attempt++) {
      await recordSignInAttempt({ email: `spray-${attempt}-${Date.now()}@tests.benchplate.test`, clientAddress, succeeded: false });
    }
    expect(await isSignInThrottled({ email: `fresh-${Date.now()}@tests.benchplate.test`, clientAddress })).toBe(true);
  });

  it("tells the person when they are throttled", async () => {
    actAs(null);
    authMock.signIn.mockRejectedValueOnce(Object.assign(new (await import("next-auth")).CredentialsSignin(), { code: "throttled" }));
    const result = await signInWithPassword(idleActionState, form({ email: "someone@tests.benchplate.test", password: "whatever" }));
    expect(result.message).toMatch(/Too many failed attempts/);
  });
});

describe("roles are read from the database on every request", () => {
  it("a demoted admin is refused on the next call although the token still says admin", async () => {
    const admin = await createAccount({ role: "admin" });
    const target = await createAccount({ role: "reader" });
    actAs({ id: admin.id, role: "admin" });
    expect((await changeUserRole(idleActionState, form({ userId: target.id, role: "reviewer" }))).status).toBe("ok");

    await db.update(users).set({ role: "reader" }).where(eq(users.id, admin.id));
    const refused = await changeUserRole(idleActionState, form({ userId: target.id, role: "editor" }));
    expect(refused.status).toBe("forbidden");
    const [row] = await db.select({ role: users.role }).from(users).where(eq(users.id, target.id));
    expect(row?.role).toBe("reviewer");
  });

  it("keeps at least one admin", async () => {
    const admin = await createAccount({ role: "admin" });
    actAs({ id: admin.id, role: "admin" });
    const otherAdmins = await db.select({ id: users.id }).from(users).where(eq(users.role, "admin"));
    for (const other of otherAdmins) {
      if (other.id !== admin.id) await db.update(users).set({ role: "editor" }).where(eq(users.id, other.id));
    }
    const result = await changeUserRole(idleActionState, form({ userId: admin.id, role: "reader" }));
    expect(result).toMatchObject({ status: "error", message: "Benchplate needs at least one admin." });
    for (const other of otherAdmins) await db.update(users).set({ role: "admin" }).where(eq(users.id, other.id));
  });
});

describe("avatar upload", () => {
  it("re-encodes to a 256 px WebP without metadata and replaces the previous object", async () => {
    const reader = await createAccount({ role: "reader" });
    actAs(reader);
    const photo = await sharp({ create: { width: 640, height: 480, channels: 3, background: "#a5481f" } })
      .jpeg()
      .withMetadata({ exif: { IFD0: { Artist: "Someone Private", Copyright: "secret" } } })
      .toBuffer();
    expect((await sharp(photo).metadata()).exif).toBeDefined();

    const first = await updateAvatar(idleActionState, form({ avatar: new File([photo], "me.jpg", { type: "image/jpeg" }) }));
    expect(first.status).toBe("ok");
    const [afterFirst] = await db.select({ avatarKey: users.avatarKey }).from(users).where(eq(users.id, reader.id));
    const stream = await getObjectStream(afterFirst!.avatarKey!);
    const stored = Buffer.from(await new Response(stream).arrayBuffer());
    const metadata = await sharp(stored).metadata();
    expect(metadata).toMatchObject({ format: "webp", width: 256, height: 256 });
    expect(metadata.exif).toBeUndefined();

    await updateAvatar(idleActionState, form({ avatar: new File([photo], "again.jpg", { type: "image/jpeg" }) }));
    expect(await statObject(afterFirst!.avatarKey!)).toBeNull();
  });

  it("rejects a file that is not an image and stores nothing", async () => {
    const reader = await createAccount({ role: "reader" });
    actAs(reader);
    const result = await updateAvatar(idleActionState, form({ avatar: new File(["not a picture"], "x.png", { type: "image/png" }) }));
    expect(result.fieldErrors?.avatar?.[0]).toMatch(/could not be read as an image/);
    const [row] = await db.select({ avatarKey: users.avatarKey }).from(users).where(eq(users.id, reader.id));
    expect(row?.avatarKey).toBeNull();
  });
});
