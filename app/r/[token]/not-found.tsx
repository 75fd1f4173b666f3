/** One plain answer for every token that opens nothing: wrong, expired, revoked or altered alike. */
export default function ReportLinkNotFound() {
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-3 p-4">
      <h1 className="text-2xl font-bold">Report not found</h1>
      <p>This link does not open a report. It may have expired or been withdrawn by the shop.</p>
    </main>
  );
}
