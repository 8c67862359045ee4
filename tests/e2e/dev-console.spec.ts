import { expect, test } from "@playwright/test";
import { DEV_PORT } from "./chromium";
import { blurField, waitForCurrent } from "./helpers";

type Probe = { __yardProbe: { project: (x: number, y: number, z: number) => number[] } };

// The dev server runs React's development build under StrictMode, which replays effects and reports
// what the production build does not (the other checks use the production build).
test("in the dev server: load, drag a support, undo, toggle the lobe, and no console errors", async ({
  page,
}) => {
  const errors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(m.text());
  });
  page.on("pageerror", (e) => errors.push(e.message));
  await page.goto(`http://127.0.0.1:${DEV_PORT}/?demo`);
  await waitForCurrent(page);
  const status = page.getByTestId("analysis-status");
  const before = await status.getAttribute("data-plan-revision");

  await page.getByLabel("Snap step").selectOption("off");
  await page.getByTestId("view-top").click();
  await page.waitForTimeout(300);
  // The birch of the demo plan, at its canopy (as in the drag bench).
  const [x, y] = await page.evaluate(() => (window as unknown as Probe).__yardProbe.project(5.5, 11.5, 9));
  await page.mouse.move(x, y);
  await page.mouse.down();
  for (let i = 1; i <= 6; i++) {
    await page.mouse.move(x + i * 4, y + (i % 2) * 3);
    await page.waitForTimeout(100);
  }
  await page.mouse.up();
  await expect(status).not.toHaveAttribute("data-plan-revision", before ?? "");
  await waitForCurrent(page);

  await blurField(page);
  await page.keyboard.press("Control+z");
  await waitForCurrent(page);
  await page.getByTestId("toggle-lobe").click();
  await page.waitForTimeout(500);
  await page.getByTestId("toggle-lobe").click();
  await page.waitForTimeout(500);
  expect(errors).toEqual([]);
});
