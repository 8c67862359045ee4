import { readFileSync } from "node:fs";
import { expect, test } from "@playwright/test";
import { blurField, openDemo, resonanceText, setField, waitForCurrent } from "./helpers";

test("opens on the demo plan with results, and logs no console errors", async ({ page }) => {
  const errors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(m.text());
  });
  page.on("pageerror", (e) => errors.push(e.message));
  await openDemo(page);
  await expect(page.getByTestId("outline-oak")).toBeVisible();
  // The figures are the worker's: a resonance in MHz, an SWR, a gain, a comparison in dB.
  await expect(page.getByTestId("resonance")).toHaveText(/^\d+\.\d{3} MHz$/);
  await expect(page.getByTestId("swr-min")).toHaveText(/^\d+\.\d\d : 1$/);
  await expect(page.getByTestId("peak-gain")).toHaveText(/dBi$/);
  await expect(page.getByTestId("vs-ideal")).toContainText("dB");
  await expect(page.getByTestId("swr-chart")).toBeVisible();
  // The ground line: the demo's preset, the method the full pass ran, the grounded flag pole's tie.
  const ground = page.getByTestId("ground-report");
  await expect(ground).toHaveAttribute("data-method", "sommerfeld");
  await expect(ground).toContainText("average ground");
  await expect(ground).toContainText("Sommerfeld");
  await expect(ground).toContainText("Aluminium flag pole: bare contact");
  expect(errors).toEqual([]);
});

test("the 3D canvas renders a picture, not a blank", async ({ page }) => {
  await openDemo(page);
  // Screenshot the canvas as the page shows it, decode the PNG in the page, and measure how much the
  // pixels vary (a blank or cleared canvas is one flat colour).
  const png = (await page.locator("canvas").screenshot()).toString("base64");
  const stats = await page.evaluate(async (b64) => {
    const img = new Image();
    img.src = `data:image/png;base64,${b64}`;
    await img.decode();
    const c = document.createElement("canvas");
    c.width = 200;
    c.height = 150;
    const ctx = c.getContext("2d")!;
    ctx.drawImage(img, 0, 0, c.width, c.height);
    const d = ctx.getImageData(0, 0, c.width, c.height).data;
    let sum = 0;
    let sum2 = 0;
    const colours = new Set<number>();
    for (let i = 0; i < d.length; i += 4) {
      const y = 0.299 * d[i] + 0.587 * d[i + 1] + 0.114 * d[i + 2];
      sum += y;
      sum2 += y * y;
      colours.add((d[i] >> 4) * 256 + (d[i + 1] >> 4) * 16 + (d[i + 2] >> 4));
    }
    const n = d.length / 4;
    return { std: Math.sqrt(sum2 / n - (sum / n) ** 2), colours: colours.size, w: img.width, h: img.height };
  }, png);
  expect(stats.w).toBeGreaterThan(300);
  // A blank or single-colour canvas has std ≈ 0 and a handful of colours; the yard has far more.
  expect(stats.std).toBeGreaterThan(8);
  expect(stats.colours).toBeGreaterThan(40);
});

test("a support's height from the inspector changes the resonance; undo brings it back", async ({ page }) => {
  await openDemo(page);
  const before = await resonanceText(page);
  await page.getByTestId("outline-oak").click();
  await expect(page.getByTestId("field-height")).toHaveValue("9.00");
  await setField(page, "field-height", "6.5");
  await expect.poll(() => resonanceText(page), { timeout: 60_000 }).not.toBe(before);
  await waitForCurrent(page);
  const after = await resonanceText(page);
  expect(after).not.toBe(before);

  await blurField(page);
  await page.keyboard.press("Control+z");
  await expect(page.getByTestId("field-height")).toHaveValue("9.00");
  await waitForCurrent(page);
  await expect(page.getByTestId("resonance")).toHaveText(before);

  await page.keyboard.press("Control+Shift+z");
  await waitForCurrent(page);
  await expect(page.getByTestId("resonance")).toHaveText(after);
});

test("a drooped-end edit keeps a resonance in the band", async ({ page }) => {
  // 20 m band edges, ITU Radio Regulations Art. 5 (all regions): 14.000–14.350 MHz.
  const inBand = (text: string) => {
    const mhz = Number.parseFloat(text);
    return mhz >= 14.0 && mhz <= 14.35;
  };
  await openDemo(page);
  const before = await resonanceText(page);
  expect(inBand(before), `demo plan resonance ${before}`).toBe(true);
  await page.getByTestId("outline-droop-east").click();
  const length = Number.parseFloat(await page.getByTestId("field-length").inputValue());
  // Five centimetres more droop: a trim-sized edit, which moves the resonance by tens of kHz.
  await setField(page, "field-length", (length + 0.05).toFixed(2));
  await expect.poll(() => resonanceText(page), { timeout: 60_000 }).not.toBe(before);
  await waitForCurrent(page);
  const after = await resonanceText(page);
  expect(inBand(after), `after the droop edit: ${after}`).toBe(true);
  // More wire hanging down lowers the resonance (common practice, no published source).
  expect(Number.parseFloat(after)).toBeLessThan(Number.parseFloat(before));
  await expect(page.getByTestId("resonance").locator("xpath=..")).toContainText("resonant in the band");
});

test("saving and reopening a plan round-trips; a bad file changes nothing", async ({ page }, info) => {
  await openDemo(page);
  const original = await resonanceText(page);
  const downloadP = page.waitForEvent("download");
  await page.getByTestId("save-plan").click();
  const saved = await downloadP;
  const path = info.outputPath("saved-plan.json");
  await saved.saveAs(path);
  const text = readFileSync(path, "utf8");
  expect(JSON.parse(text).version).toBe(1);

  // Change the plan, then open the saved file: the plan and its figures come back.
  await page.getByTestId("outline-birch").click();
  await setField(page, "field-height", "6");
  await expect.poll(() => resonanceText(page), { timeout: 60_000 }).not.toBe(original);
  await page.getByTestId("open-plan-input").setInputFiles(path);
  await expect(page.getByTestId("notice")).toContainText("Opened");
  await waitForCurrent(page);
  await expect(page.getByTestId("resonance")).toHaveText(original);

  // Saving again gives the same document.
  const againP = page.waitForEvent("download");
  await page.getByTestId("save-plan").click();
  const again = await againP;
  const path2 = info.outputPath("saved-again.json");
  await again.saveAs(path2);
  expect(readFileSync(path2, "utf8")).toBe(text);

  // A broken file is refused with a message and loses nothing.
  await page.getByTestId("open-plan-input").setInputFiles({
    name: "broken.json",
    mimeType: "application/json",
    buffer: Buffer.from(JSON.stringify({ ...JSON.parse(text), supports: [{ type: "tree", id: "x" }] })),
  });
  await expect(page.getByTestId("notice")).toContainText("Could not open");
  await expect(page.getByTestId("notice")).toContainText("supports[0]");
  await expect(page.getByTestId("resonance")).toHaveText(original);
});

test("the plan is autosaved and comes back after a reload", async ({ page }) => {
  await openDemo(page);
  await page.getByTestId("outline-pole").click();
  await setField(page, "field-height", "4.5");
  await waitForCurrent(page);
  await page.waitForTimeout(800); // autosave settles after 400 ms
  await page.goto("/");
  await page.getByTestId("outline-pole").click();
  await expect(page.getByTestId("field-height")).toHaveValue("4.50");
});
