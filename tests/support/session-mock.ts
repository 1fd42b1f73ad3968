import { vi } from "vitest";

/**
 * Stands in for Auth.js in integration tests: the token says who is signed in (and, deliberately, a role
 * that may be stale), while the code under test must read the current role from the database.
 */
export const authMock = {
  auth: vi.fn(async () => null as null | { user: { id: string; role: string } }),
  signIn: vi.fn(async () => undefined),
  signOut: vi.fn(async () => undefined),
};

export function actAs(account: { id: string; role: string } | null) {
  authMock.auth.mockImplementation(async () => (account ? { user: { id: account.id, role: account.role } } : null));
}
