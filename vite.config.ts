import { fileURLToPath } from "node:url";
import react from "@vitejs/plugin-react";
import { defineConfig } from "vitest/config";

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));

// One config for the app (vite, rooted in app/ where index.html lives, so the top level stays the
// project's own layout) and the unit tests (vitest, rooted at the project).
export default defineConfig({
  root: here("./app"),
  publicDir: here("./public"),
  build: { outDir: here("./dist"), emptyOutDir: true },
  plugins: [react()],
  worker: { format: "es" },
  // The app imports the solver from ../solver: let the dev server read the whole project.
  server: { port: 5173, strictPort: true, fs: { allow: [here(".")] } },
  test: {
    root: here("."),
    include: ["tests/unit/**/*.test.ts", "tests/unit/**/*.test.tsx"],
    environment: "node",
    // Physics checks fill and factor real matrices: give them room on a 2-core machine.
    testTimeout: 120_000,
    pool: "forks",
  },
});
