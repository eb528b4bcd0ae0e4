/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // Server-only packages with native parts or Node built-ins stay outside the server bundle.
  serverExternalPackages: ["postgres", "@node-rs/argon2"],
};
export default nextConfig;
