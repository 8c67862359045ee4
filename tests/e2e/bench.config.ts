import { defineConfig } from "@playwright/test";
import { chromiumLaunch, PORT, webServer } from "./chromium";

// `npm run bench:app`: the drag-to-answer measurement. Prints figures; asserts nothing about speed.
export default defineConfig({
  testDir: ".",
  testMatch: /.*\.bench\.spec\.ts$/,
  timeout: 180_000,
  workers: 1,
  retries: 0,
  reporter: [["list"]],
  outputDir: "../../test-results/bench",
  use: {
    baseURL: `http://127.0.0.1:${PORT}/`,
    viewport: { width: 1440, height: 900 },
    launchOptions: chromiumLaunch,
  },
  webServer,
});
