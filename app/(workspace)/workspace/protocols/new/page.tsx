import type { Metadata } from "next";
import Link from "next/link";
import { requirePagePermission } from "@/lib/session";
import { defaultSafetyCautions, defaultStepsMdx } from "@/lib/validations/protocol";
import { ProtocolForm } from "../_components/protocol-form";

export const metadata: Metadata = { title: "New protocol" };

export default async function NewProtocolPage() {
  await requirePagePermission("workspace:use", "/workspace/protocols/new");
  return (
    <section className="max-w-3xl space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/workspace/protocols" className="text-verdigris-deep hover:text-copper">
          ← Test protocols
        </Link>
      </nav>
      <h1 className="font-serif text-3xl">New protocol</h1>
      <ProtocolForm
        defaults={{ safetyCautions: defaultSafetyCautions, stepsMdx: defaultStepsMdx, repeats: "3", ambientC: "23", warmUpMinutes: "5" }}
      />
    </section>
  );
}
