import type { Metadata } from "next";
import { BackLink } from "@/components/back-link";
import { requirePagePermission } from "@/lib/session";
import { defaultSafetyCautions, defaultStepsMdx } from "@/lib/validations/protocol";
import { ProtocolForm } from "../_components/protocol-form";

export const metadata: Metadata = { title: "New protocol" };

export default async function NewProtocolPage() {
  await requirePagePermission("workspace:use", "/workspace/protocols/new");
  return (
    <section className="max-w-3xl space-y-6">
      <BackLink href="/workspace/protocols">Test protocols</BackLink>
      <h1 className="font-serif text-3xl">New protocol</h1>
      <ProtocolForm
        defaults={{ safetyCautions: defaultSafetyCautions, stepsMdx: defaultStepsMdx, repeats: "3", ambientC: "23", warmUpMinutes: "5" }}
      />
    </section>
  );
}
