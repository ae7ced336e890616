import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  poweredByHeader: false,
  // Lets two builds (say, two test runs) live side by side.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  // Native or server-only packages stay outside the server bundle.
  serverExternalPackages: ["@libsql/client", "libsql", "sharp", "s3rver"],
  experimental: {
    // forbidden() renders app/forbidden.tsx with a real 403 status.
    authInterrupts: true,
  },
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
          { key: "X-Frame-Options", value: "DENY" },
          { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(self)" },
        ],
      },
    ];
  },
};

export default nextConfig;
