import react from "@vitejs/plugin-react";
import { defineConfig } from "vitest/config";

// One config for the app (vite) and the unit tests (vitest).
export default defineConfig({
  root: ".",
  publicDir: "public",
  plugins: [react()],
  worker: { format: "es" },
  server: { port: 5173, strictPort: true },
  test: {
    include: ["tests/unit/**/*.test.ts", "tests/unit/**/*.test.tsx"],
    environment: "node",
    // Physics checks fill and factor real matrices: give them room on a 2-core machine.
    testTimeout: 120_000,
    pool: "forks",
  },
});
