import { expect, type Page } from "@playwright/test";

/** Open the app on the demo plan (ignoring any autosave) and wait for the full analysis. */
export async function openDemo(page: Page): Promise<void> {
  await page.goto("/?demo");
  await waitForCurrent(page);
}

/** Wait until the results panel shows a full analysis of the current plan revision. */
export async function waitForCurrent(page: Page): Promise<void> {
  await expect(page.getByTestId("analysis-status")).toHaveAttribute("data-state", "current", {
    timeout: 60_000,
  });
}

export async function resonanceText(page: Page): Promise<string> {
  return (await page.getByTestId("resonance").textContent()) ?? "";
}

/** Set an inspector field by its test id: type, then Enter (one committed edit). */
export async function setField(page: Page, testId: string, value: string): Promise<void> {
  const field = page.getByTestId(testId);
  await field.fill(value);
  await field.press("Enter");
}

/** Leave the text field so window shortcuts (Ctrl+Z) reach the editor, not the input. */
export async function blurField(page: Page): Promise<void> {
  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
}
