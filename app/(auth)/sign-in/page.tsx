import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { LogoMark } from "@/components/brand/logo-mark";
import { currentActor } from "@/lib/auth/guard";
import { safeReturnPath } from "@/lib/auth/return-path";
import { homeFor } from "@/lib/auth/roles";
import { env } from "@/lib/env";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ from?: string }> }) {
  const actor = await currentActor();
  if (actor) redirect(homeFor(actor.roles));
  const { from } = await searchParams;
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center px-4 py-10">
      <div className="mb-8 flex items-center gap-3">
        <LogoMark size={48} />
        <div>
          <h1 className="text-3xl font-bold text-tideline-800">Turnstone</h1>
          <p className="text-shingle-600">Same routes, every season: see what changed.</p>
        </div>
      </div>
      <div className="card">
        <h2 className="mb-4 text-xl font-bold">Sign in to your network</h2>
        <SignInForm from={safeReturnPath(from, env().APP_URL) ?? undefined} />
      </div>
      <p className="mt-6 text-sm text-shingle-600">
        New here? Your network organiser sends you an invitation by e-mail. Forgotten your password? Ask them to send a new invitation.
      </p>
    </main>
  );
}
