import type { ReactNode } from "react";

export default function AuthLayout({ children }: { children: ReactNode }) {
  return <div className="mx-auto max-w-md rounded border border-rule bg-paper-raised p-6 shadow-sm">{children}</div>;
}
