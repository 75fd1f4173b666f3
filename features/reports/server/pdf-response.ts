import 'server-only';

/** A PDF as the browser should take it: never sniffed, never cached by a shared cache. */
export function pdfResponse(pdf: Buffer, filename: string, disposition: 'attachment' | 'inline') {
  return new Response(new Uint8Array(pdf), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `${disposition}; filename="${filename}"`,
      'content-length': String(pdf.byteLength),
      'cache-control': 'private, no-store',
      'x-content-type-options': 'nosniff',
    },
  });
}
