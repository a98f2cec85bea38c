/**
 * Browsers ask for /favicon.ico on their own (before or without reading the page's icon link); send
 * them to the app's icon (`app/icon.svg`) instead of answering 404.
 */
export function GET() {
  return new Response(null, { status: 308, headers: { Location: "/icon.svg", "Cache-Control": "public, max-age=86400" } });
}
