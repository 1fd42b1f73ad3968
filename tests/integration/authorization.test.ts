import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { actionAccess, can, pageAccess, roles, routeHandlerAccess, type Role } from "@/lib/authz";
import { idleActionState, type ActionState } from "@/lib/action-state";
import { createAccount } from "../support/factories";
import { actAs } from "../support/session-mock";

vi.mock("@/lib/auth", async () => (await import("../support/session-mock")).authMock);
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn() }));

const appDir = path.join(import.meta.dirname, "../../app");

async function filesNamed(name: string, dir = appDir): Promise<string[]> {
  const entries = await readdir(dir, { withFileTypes: true });
  const nested = await Promise.all(
    entries.map((entry) => {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) return entry.name.startsWith("_") ? [] : filesNamed(name, full);
      return entry.name === name ? [full] : [];
    }),
  );
  return nested.flat();
}

function routePattern(file: string): string {
  const segments = path
    .relative(appDir, path.dirname(file))
    .split(path.sep)
    .filter((segment) => segment !== "" && !/^\(.*\)$/.test(segment));
  return `/${segments.join("/")}`;
}

describe("every entry point is in the role map", () => {
  it("lists each page, and only existing pages", async () => {
    const pages = (await filesNamed("page.tsx")).map(routePattern).sort();
    expect(pages).toEqual(Object.keys(pageAccess).sort());
  });

  it("lists each route handler method, and only existing ones", async () => {
    const found: string[] = [];
    for (const file of await filesNamed("route.ts")) {
      const source = await readFile(file, "utf8");
      const methods = new Set<string>();
      for (const match of source.matchAll(/export (?:async )?function (GET|POST|PUT|PATCH|DELETE)\b/g)) methods.add(match[1]!);
      for (const match of source.matchAll(/export const \{([^}]*)\}/g)) {
        for (const name of match[1]!.split(",").map((part) => part.trim())) if (name) methods.add(name);
      }
      for (const method of methods) found.push(`${method} ${routePattern(file)}`);
    }
    expect(found.sort()).toEqual(Object.keys(routeHandlerAccess).sort());
  });

  it("lists each server action, and every action goes through guardedAction with its own key", async () => {
    const found: string[] = [];
    for (const file of await filesNamed("actions.ts")) {
      const source = await readFile(file, "utf8");
      const relative = path.relative(appDir, file).split(path.sep).join("/");
      const exportCount = [...source.matchAll(/^export /gm)].length;
      const guarded = [...source.matchAll(/^export const (\w+) = guardedAction\(\s*"([^"]+)"/gm)];
      expect(guarded.length, `${relative}: every export must be a guardedAction`).toBe(exportCount);
      for (const [, name, key] of guarded) {
        expect(key, `${relative}#${name} names another action's key`).toBe(`${relative}#${name}`);
        found.push(key!);
      }
    }
    expect(found.sort()).toEqual(Object.keys(actionAccess).sort());
  });
});

describe("server actions refuse every role outside the map", () => {
  const accounts = new Map<Role, { id: string; role: string }>();

  beforeAll(async () => {
    for (const role of roles) accounts.set(role, await createAccount({ role }));
  });
  afterAll(() => actAs(null));

  const cases = Object.entries(actionAccess).flatMap(([key, access]) =>
    [null, ...roles].map((role) => ({ key, access, role })),
  );

  it.each(cases)("$key as $role", async ({ key, access, role }) => {
    const [file, exportName] = key.split("#") as [string, string];
    const actions = (await import(/* @vite-ignore */ path.join(appDir, file))) as Record<
      string,
      (previous: ActionState, formData: FormData) => Promise<ActionState>
    >;
    actAs(role ? accounts.get(role)! : null);
    // An empty form: allowed callers get as far as validation and change nothing.
    const result = await actions[exportName]!(idleActionState, new FormData());
    if (can(role, access)) {
      expect(result.status).not.toBe("forbidden");
      expect(result.status).not.toBe("unauthenticated");
    } else {
      expect(result.status).toBe(role ? "forbidden" : "unauthenticated");
    }
  });
});
