/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // Server-only packages with native parts or Node built-ins stay outside the server bundle.
  serverExternalPackages: ["postgres", "@node-rs/argon2"],
  // forbidden() and app/forbidden.tsx: a signed-in person in another role's area gets a 403 page that says so.
  experimental: { authInterrupts: true },
  // Metadata written into <head> before the page for every browser, not streamed into a hidden <div> at the top
  // of <body>: under load the streamed boundary and React's hydration raced, and the page failed to hydrate
  // (React error #418) now and then, after which a control changed before the client re-render was reset.
  htmlLimitedBots: /.*/,
};
export default nextConfig;
