import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const alias = { "@": fileURLToPath(new URL(".", import.meta.url)) };
// tsconfig keeps "jsx": "preserve" for Next; tests that render e-mail templates need vite to compile JSX itself.
const oxc = { jsx: { runtime: "automatic" as const, importSource: "react" } };

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        oxc,
        test: { name: "unit", include: ["tests/unit/**/*.test.ts"], environment: "node", testTimeout: 60_000 },
      },
      {
        resolve: { alias },
        oxc,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          testTimeout: 60_000,
          hookTimeout: 60_000,
          // Integration files share one PostgreSQL cluster; each makes its own database.
          fileParallelism: true,
        },
      },
      {
        resolve: { alias },
        oxc,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          environment: "node",
          testTimeout: 120_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
