import Link from 'next/link';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-5 py-16">
      <p className="figure text-stone">404</p>
      <h1 className="mt-1 text-3xl font-bold text-slate">Nothing here</h1>
      <p className="mt-3 text-lg">The page or record you asked for does not exist, or it was removed.</p>
      <p className="mt-6">
        <Link href="/" className="text-lg font-bold">
          Go to your home page
        </Link>
      </p>
    </main>
  );
}
