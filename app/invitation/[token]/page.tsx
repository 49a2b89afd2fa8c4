import type { Metadata } from "next";
import { LogoMark } from "@/components/brand/logo-mark";
import { roleLabel } from "@/lib/auth/roles";
import { findOpenInvitation } from "@/lib/queries/people";
import { AcceptForm } from "./accept-form";

export const metadata: Metadata = { title: "Accept invitation" };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invite = token.length <= 200 ? await findOpenInvitation(token) : null;
  return (
    <main id="main" className="mx-auto max-w-md px-4 py-10">
      <LogoMark size={48} />
      <div className="card mt-6">
        {invite ? (
          <>
            <h1 className="mb-2 text-xl font-bold">Welcome, {invite.name}</h1>
            <p className="mb-4">You are joining as {roleLabel[invite.role].toLowerCase()} with {invite.email}.</p>
            <AcceptForm token={token} />
          </>
        ) : (
          <>
            <h1 className="mb-2 text-xl font-bold">This invitation cannot be used</h1>
            <p>It has expired or was already used. Ask your network organiser to send a new one.</p>
          </>
        )}
      </div>
    </main>
  );
}
