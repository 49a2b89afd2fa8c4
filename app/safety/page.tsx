import type { Metadata } from "next";
import Link from "next/link";
import { SafetyNotice } from "@/components/safety/safety-notice";

export const metadata: Metadata = { title: "Fieldwork safety" };

export default function SafetyPage() {
  return (
    <main id="main" className="mx-auto max-w-2xl px-4 py-8">
      <h1 className="mb-4 text-2xl font-bold text-tideline-800">Before you walk a route</h1>
      <SafetyNotice />
      <p className="mt-6">
        <Link href="/" className="inline-flex min-h-tap min-w-tap items-center font-bold text-tideline-700">Back to Turnstone</Link>
      </p>
    </main>
  );
}
