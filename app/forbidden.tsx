import Link from 'next/link';

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-xl px-5 py-16">
      <p className="figure text-stone">403</p>
      <h1 className="mt-1 text-3xl font-bold text-slate">This page is not for your account</h1>
      <p className="mt-3 text-lg">Your role does not give access here. If you think it should, ask your coordinator.</p>
      <p className="mt-6">
        <Link href="/" className="text-lg font-bold">
          Go to your home page
        </Link>
      </p>
    </main>
  );
}
