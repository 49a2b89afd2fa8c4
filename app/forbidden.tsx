import Link from "next/link";

export default function Forbidden() {
  return (
    <main id="main" className="mx-auto max-w-xl px-4 py-16">
      <h1 className="text-2xl font-bold text-tideline-800">Not part of your role</h1>
      <p className="mt-3">This page belongs to another role in your network. If you need it, ask your network organiser.</p>
      <Link href="/" className="btn-primary mt-6">Go to my home</Link>
    </main>
  );
}
