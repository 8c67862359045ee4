import { expect, type Page, test } from "@playwright/test";
import { blurField, openDemo, waitForCurrent } from "./helpers";

/** The yard settings (inspector with nothing selected): the soil, the method, the bands. */

const status = (page: Page) => page.getByTestId("analysis-status");
const planRevision = async (page: Page) => Number(await status(page).getAttribute("data-plan-revision"));
const efficiency = (page: Page) => page.locator("h3", { hasText: /^Efficiency / });

/** Wait for the full pass of a plan newer than `before`, and check the result is for that plan. */
async function waitForNewResult(page: Page, before: number): Promise<void> {
  await expect.poll(() => planRevision(page)).toBeGreaterThan(before);
  await waitForCurrent(page);
  const s = status(page);
  expect(await s.getAttribute("data-result-revision")).toBe(await s.getAttribute("data-plan-revision"));
}

test("changing the soil re-runs the analysis and changes the answer; perfect ground is an image plane", async ({
  page,
}) => {
  await openDemo(page);
  const soil = page.getByTestId("ground-soil");
  const ground = page.getByTestId("ground-report");
  await expect(soil).toHaveValue("preset:average ground");
  await expect(ground).toContainText("average ground");
  const effAverage = await efficiency(page).textContent();

  // Very dry ground (P.527: σ 0.0001 S/m, εr 3) loses more power under a low dipole than average ground.
  let rev = await planRevision(page);
  await soil.selectOption("preset:very dry ground");
  await waitForNewResult(page, rev);
  await expect(ground).toContainText("very dry ground");
  await expect(page.getByTestId("ground-note")).toContainText("σ 0.0001 S/m, εr 3");
  const effDry = await efficiency(page).textContent();
  expect(effDry).not.toBe(effAverage);

  // One undo step brings average ground back, and its answer.
  await blurField(page);
  rev = await planRevision(page);
  await page.keyboard.press("Control+z");
  await expect(soil).toHaveValue("preset:average ground");
  await waitForNewResult(page, rev);
  await expect(efficiency(page)).toHaveText(effAverage ?? "");

  // Perfect ground: no method to choose, and the solver reports the image plane.
  rev = await planRevision(page);
  await soil.selectOption("perfect");
  await expect(page.getByTestId("ground-method")).toHaveCount(0);
  await waitForNewResult(page, rev);
  await expect(ground).toHaveAttribute("data-method", "image");
  await expect(ground).toContainText("perfect image plane");
  expect(await efficiency(page).textContent()).not.toBe(effAverage);
});

test("custom σ and εr: a bad value is refused beside the field and changes nothing", async ({ page }) => {
  await openDemo(page);
  await page.getByTestId("ground-soil").selectOption("custom");
  const sigma = page.getByTestId("ground-conductivity");
  // "Custom…" starts from the soil in force (average ground: σ 0.005 S/m, εr 13, common practice).
  await expect(sigma).toHaveValue("0.005");
  await expect(page.getByTestId("ground-permittivity")).toHaveValue("13");
  await waitForCurrent(page);

  const rev = await planRevision(page);
  await sigma.fill("-1");
  await sigma.press("Enter");
  await expect(page.getByTestId("ground-conductivity-problem")).toContainText("above 0");
  await expect(sigma).toHaveAttribute("aria-invalid", "true");
  const eps = page.getByTestId("ground-permittivity");
  await eps.fill("0.5");
  await eps.press("Enter");
  await expect(page.getByTestId("ground-permittivity-problem")).toContainText("at least 1");
  expect(await planRevision(page)).toBe(rev);

  // Good values commit, and the solver is told them.
  await sigma.fill("0.02");
  await sigma.press("Enter");
  await eps.fill("20");
  await eps.press("Enter");
  await expect(page.getByTestId("ground-conductivity-problem")).toHaveCount(0);
  await expect(page.getByTestId("ground-permittivity-problem")).toHaveCount(0);
  await waitForNewResult(page, rev);
  await expect(page.getByTestId("ground-report")).toContainText("σ 0.02 S/m, εr 20");
});

test("bands: one more band adds a tab; the last band cannot be unchecked", async ({ page }) => {
  await openDemo(page);
  const twenty = page.getByTestId("band-20m");
  await expect(twenty).toBeChecked();
  // The demo has one band: unchecking it is refused with a notice, and the plan is unchanged.
  const rev = await planRevision(page);
  await twenty.click();
  await expect(page.getByTestId("notice")).toContainText("at least one band");
  await expect(twenty).toBeChecked();
  expect(await planRevision(page)).toBe(rev);

  await page.getByTestId("band-17m").check();
  await waitForNewResult(page, rev);
  await expect(page.getByRole("tab", { name: "17 m" })).toBeVisible();
  await expect(page.getByRole("tab", { name: "20 m" })).toBeVisible();
});

test("the yard row in the outline brings the settings back after something was selected", async ({
  page,
}) => {
  await openDemo(page);
  await page.getByTestId("outline-oak").click();
  await expect(page.getByTestId("yard-settings")).toHaveCount(0);
  await page.getByTestId("outline-yard").click();
  await expect(page.getByTestId("yard-settings")).toBeVisible();
  await expect(page.getByTestId("outline-yard")).toHaveAttribute("aria-pressed", "true");
});

test("a grounded mast says how much current it carries against the feed", async ({ page }) => {
  await openDemo(page);
  // The demo's aluminium pole stands on the soil (bare contact) beside the dipole.
  // Its series term as modelled (the hemisphere of a 5 cm pole: hundreds of ohms at 14 MHz).
  await expect(page.getByTestId("ground-tie-ohms-pole")).toContainText(
    /≈ \d+\.\d [−+] j\d+\.\d Ω at 14\.\d{3} MHz/,
  );
  await expect(page.getByTestId("ground-current-pole")).toContainText(
    /\d+ % of the feed current at 14\.\d{3} MHz/,
  );
});
