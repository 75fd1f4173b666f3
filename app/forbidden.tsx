import Link from 'next/link';

export default function Forbidden() {
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-4 p-4">
      <h1 className="text-2xl font-bold">Not for your role</h1>
      <p>This page is for the shop&apos;s leads. Ask a lead if you need something done here.</p>
      <Link href="/board" className="text-work font-semibold underline">
        Back to the board
      </Link>
    </main>
  );
}
