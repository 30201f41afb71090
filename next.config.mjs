// knex and highs must stay outside the server bundle (STACK.md §3); pdfkit too, in case of a downgrade.
/** @type {import('next').NextConfig} */
const nextConfig = {
  serverExternalPackages: ["knex", "highs", "pdfkit", "exceljs", "smtp-server", "mailparser", "bwip-js"],
  poweredByHeader: false,
  reactStrictMode: true,
  // `npm test` runs `tsc --noEmit` as its own step; the build does not type-check a second time.
  typescript: { ignoreBuildErrors: true },
};
export default nextConfig;
