import { fileURLToPath } from "node:url";
import type { LaunchOptions } from "@playwright/test";

/**
 * Debian's Chromium with WebGL through SwiftShader (software), so the 3D canvas renders on a
 * machine without a GPU. We never download a browser: CHROMIUM_PATH overrides the system path.
 */
export const chromiumLaunch: LaunchOptions = {
  executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
  headless: true,
  args: [
    "--no-sandbox",
    "--disable-gpu",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
    "--no-first-run",
    "--use-angle=swiftshader",
    "--enable-unsafe-swiftshader",
  ],
};

/**
 * The production build served by vite preview: what users get, and steadier than the dev server.
 * E2E_PORT picks another port on a shared machine, where someone else's server on 4173 would
 * otherwise be reused (and tested) instead of this checkout's build.
 */
export const PORT = Number(process.env.E2E_PORT ?? 4173);
export const webServer = {
  command: `npx vite build --logLevel warn && npx vite preview --port ${PORT} --strictPort --host 127.0.0.1`,
  url: `http://127.0.0.1:${PORT}/`,
  // Build and serve from the project root, wherever Playwright was started.
  cwd: fileURLToPath(new URL("../..", import.meta.url)),
  reuseExistingServer: !process.env.CI,
  timeout: 180_000,
  stdout: "ignore" as const,
  stderr: "pipe" as const,
};

/**
 * The dev server (`npm start`), for the one check of what developers see: React's development build
 * reports problems (e.g. nested roots unmounted mid-render) that the production build keeps quiet.
 */
export const DEV_PORT = Number(process.env.E2E_DEV_PORT ?? 5174);
export const devServer = {
  command: `npx vite --port ${DEV_PORT} --strictPort --host 127.0.0.1`,
  url: `http://127.0.0.1:${DEV_PORT}/`,
  cwd: webServer.cwd,
  reuseExistingServer: false,
  timeout: 120_000,
  stdout: "ignore" as const,
  stderr: "pipe" as const,
};
