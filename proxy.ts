import { NextResponse, type NextRequest } from "next/server";

// A convenience only: a visitor without a session cookie is sent to sign in and back. Whether
// the cookie's session is real, and whether its role may enter, is the guard's job on the server
// (lib/auth/next-context.ts requireArea), so nothing here touches the database.
const SESSION_COOKIE = "rosinwood_session"; // lib/auth/lucia.ts; kept apart from lucia so this file stays free of the database

export function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  const asked = pathname + search;
  if (!request.cookies.get(SESSION_COOKIE)?.value) {
    // Through a route handler rather than NextResponse.redirect: Next rewrites the host of a
    // proxy redirect to "localhost" when it is 127.x (next/dist/server/web/next-url.js), and a
    // cookie set on one host name is not sent to the other.
    return NextResponse.rewrite(new URL(`/api/auth/to-sign-in?next=${encodeURIComponent(asked)}`, request.url));
  }
  // The area's layout reads this to send an expired session back here after signing in.
  const headers = new Headers(request.headers);
  headers.set("x-rosinwood-path", asked);
  return NextResponse.next({ request: { headers } });
}

export const config = { matcher: ["/learn", "/learn/:path*", "/teach", "/teach/:path*", "/admin", "/admin/:path*"] };
