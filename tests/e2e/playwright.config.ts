import { defineConfig } from "@playwright/test";
import { chromiumLaunch, devServer, PORT, webServer } from "./chromium";

// The editor's browser checks. Kept to a couple of minutes: few tests, one browser, two workers at most.
export default defineConfig({
  testDir: ".",
  testMatch: /.*\.spec\.ts$/,
  testIgnore: /.*\.bench\.spec\.ts$/,
  timeout: 90_000,
  expect: { timeout: 30_000 },
  fullyParallel: false,
  workers: 1,
  retries: 0,
  reporter: [["list"]],
  outputDir: "../../test-results/e2e",
  use: {
    baseURL: `http://127.0.0.1:${PORT}/`,
    viewport: { width: 1440, height: 900 },
    launchOptions: chromiumLaunch,
    trace: "off",
    screenshot: "only-on-failure",
  },
  webServer: [webServer, devServer],
});
