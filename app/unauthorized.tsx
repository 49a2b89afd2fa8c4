import Link from "next/link";

export default function Unauthorized() {
  return (
    <main id="main" className="mx-auto max-w-xl px-4 py-16">
      <h1 className="text-2xl font-bold text-tideline-800">Please sign in</h1>
      <p className="mt-3">You need to be signed in to see this page.</p>
      <Link href="/sign-in" className="btn-primary mt-6">Sign in</Link>
    </main>
  );
}
