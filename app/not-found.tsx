import Link from 'next/link';

export default function NotFound() {
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-4 p-4">
      <h1 className="text-2xl font-bold">Not found</h1>
      <p>There is nothing here, or it belongs to another shop.</p>
      <Link href="/board" className="text-work font-semibold underline">
        Back to the board
      </Link>
    </main>
  );
}
