import "server-only";
import { countRecentSignInFailures, insertSignInAttempt } from "@/db/queries/users";

// Limits in the spirit of OWASP's authentication guidance: slow guessing on one account, and one address spraying many.
export const signInThrottle = {
  windowMinutes: 15,
  maxFailuresPerAccount: 5,
  maxFailuresPerAddress: 20,
} as const;

export async function isSignInThrottled({ email, clientAddress }: { email: string; clientAddress: string }) {
  const since = new Date(Date.now() - signInThrottle.windowMinutes * 60_000);
  const failures = await countRecentSignInFailures({ email, clientAddress, since });
  return failures.byAccount >= signInThrottle.maxFailuresPerAccount || failures.byAddress >= signInThrottle.maxFailuresPerAddress;
}

export function recordSignInAttempt(attempt: { email: string; clientAddress: string; succeeded: boolean }) {
  return insertSignInAttempt(attempt);
}

export function clientAddressOf(headers: Headers): string {
  const forwarded = headers.get("x-forwarded-for")?.split(",")[0]?.trim();
  return forwarded || headers.get("x-real-ip") || "unknown";
}
