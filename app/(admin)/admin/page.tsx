import type { Metadata } from "next";
import { listAccounts } from "@/db/queries/users";
import { requirePagePermission } from "@/lib/session";
import { RoleForm } from "./_components/role-form";

export const metadata: Metadata = { title: "Accounts" };

export default async function AdminAccountsPage() {
  await requirePagePermission("users:manage", "/admin");
  const accounts = await listAccounts();
  return (
    <section className="space-y-4">
      <h1 className="font-serif text-3xl">Accounts and roles</h1>
      <p className="max-w-2xl text-sm text-ink-soft">
        A role change takes effect on the account&apos;s very next request. Benchplate keeps at least one admin.
      </p>
      <div className="overflow-x-auto rounded border border-rule bg-paper-raised">
        <table className="w-full min-w-[36rem] text-left text-sm">
          <thead className="bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th scope="col" className="px-3 py-2">Name</th>
              <th scope="col" className="px-3 py-2">Email</th>
              <th scope="col" className="px-3 py-2">Role</th>
            </tr>
          </thead>
          <tbody>
            {accounts.map((account) => (
              <tr key={account.id} className="border-t border-rule">
                <th scope="row" className="px-3 py-2 font-semibold">{account.name}</th>
                <td className="px-3 py-2">{account.email}</td>
                <td className="px-3 py-2">
                  <RoleForm userId={account.id} role={account.role} name={account.name} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
