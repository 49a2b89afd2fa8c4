import Link from "next/link";

export default function NotFound() {
  return (
    <main id="main" className="mx-auto max-w-xl px-4 py-16">
      <h1 className="text-2xl font-bold text-tideline-800">Nothing here</h1>
      <p className="mt-3">That page does not exist, or it has moved.</p>
      <Link href="/" className="btn-primary mt-6">Go to my home</Link>
    </main>
  );
}
